import { randomInt } from 'node:crypto';
import { generateLabelTag } from '#shared/domain/labels/label-payload';
import type { Db } from '../db/client';
import { collections } from '../db/schema/collections';

const randomUnit = () => randomInt(2 ** 32) / 2 ** 32;

/**
 * A new collection with a label tag no other collection has (a clash just draws again). Made
 * at sign-up and by the demo seed, each of which then gives it its owner.
 */
export async function insertCollection(
  db: Db,
  values: { name: string; timeZone: string; rules?: unknown },
) {
  for (;;) {
    const [row] = await db
      .insert(collections)
      .values({ ...values, labelTag: generateLabelTag(randomUnit) })
      .onConflictDoNothing({ target: collections.labelTag })
      .returning({ id: collections.id });
    if (row) return row.id;
  }
}
