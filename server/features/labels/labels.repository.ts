import { and, eq, inArray } from 'drizzle-orm';
import type { Db } from '../../db/client';
import { animals } from '../../db/schema/animals';

/** Of these animals, the ones in this collection (whole rows: a label may show any field). */
export async function animalsByIds(db: Db, collectionId: string, animalIds: string[]) {
  return db
    .select()
    .from(animals)
    .where(and(eq(animals.collectionId, collectionId), inArray(animals.id, animalIds)));
}

/** The animal's label code, or null when it is not in this collection. */
export async function labelCodeOf(db: Db, collectionId: string, animalId: string) {
  const [row] = await db
    .select({ labelCode: animals.labelCode })
    .from(animals)
    .where(and(eq(animals.collectionId, collectionId), eq(animals.id, animalId)));
  return row?.labelCode ?? null;
}

export async function codesInCollection(db: Db, collectionId: string) {
  return (
    await db
      .select({ c: animals.labelCode })
      .from(animals)
      .where(eq(animals.collectionId, collectionId))
  ).map((r) => r.c);
}

export async function setLabelCode(db: Db, animalId: string, labelCode: string, at: Date) {
  await db.update(animals).set({ labelCode, updatedAt: at }).where(eq(animals.id, animalId));
}
