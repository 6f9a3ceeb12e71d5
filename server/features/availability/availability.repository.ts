import { and, eq, sql } from 'drizzle-orm';
import type { Db } from '../../db/client';
import { collections } from '../../db/schema/collections';
import { salesSettings } from '../../db/schema/sales';

const fields = {
  on: salesSettings.availabilityOn,
  token: salesSettings.availabilityToken,
  columns: salesSettings.availabilityColumns,
  note: salesSettings.availabilityNote,
};

/** The list's settings; null when the collection has no sales settings yet (all defaults). */
export async function availabilityOf(db: Db, collectionId: string) {
  const [row] = await db
    .select(fields)
    .from(salesSettings)
    .where(eq(salesSettings.collectionId, collectionId));
  return row ?? null;
}

/**
 * Writes only the list's own columns: the rest of the sales settings (money, tax, shipping)
 * belong to the sales part and keep their values or defaults.
 */
export async function saveAvailability(
  db: Db,
  collectionId: string,
  values: Partial<{ on: boolean; token: string; columns: string[]; note: string }>,
  at: Date,
) {
  const set = {
    ...(values.on !== undefined && { availabilityOn: values.on }),
    ...(values.token !== undefined && { availabilityToken: values.token }),
    ...(values.columns !== undefined && { availabilityColumns: values.columns }),
    ...(values.note !== undefined && { availabilityNote: values.note }),
    updatedAt: at,
  };
  const [row] = await db
    .insert(salesSettings)
    .values({ collectionId, ...set })
    .onConflictDoUpdate({ target: salesSettings.collectionId, set })
    .returning(fields);
  return row!;
}

/** The collection behind a public link, only while its list is on. */
export async function publishedBy(db: Db, token: string) {
  const [row] = await db
    .select({ collectionId: salesSettings.collectionId, name: collections.name, ...fields })
    .from(salesSettings)
    .innerJoin(collections, eq(collections.id, salesSettings.collectionId))
    .where(and(eq(salesSettings.availabilityToken, token), sql`${salesSettings.availabilityOn}`));
  return row ?? null;
}
