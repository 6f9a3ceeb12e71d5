import { and, asc, eq, inArray } from 'drizzle-orm';
import type { Db } from '../../db/client';
import { animals } from '../../db/schema/animals';
import { collections, locations } from '../../db/schema/collections';

export async function listAnimals(db: Db, collectionId: string, animalIds?: string[]) {
  return db
    .select({ animal: animals, location: locations })
    .from(animals)
    .leftJoin(locations, eq(locations.id, animals.locationId))
    .where(and(eq(animals.collectionId, collectionId), animalIds ? inArray(animals.id, animalIds) : undefined))
    .orderBy(asc(locations.walkOrder), asc(animals.labelCode));
}

export async function updateAnimalCare(
  db: Db,
  collectionId: string,
  animalId: string,
  values: Partial<typeof animals.$inferInsert>,
) {
  const [row] = await db
    .update(animals)
    .set({ ...values, updatedAt: new Date() })
    .where(and(eq(animals.collectionId, collectionId), eq(animals.id, animalId)))
    .returning({ id: animals.id });
  return !!row;
}

export async function codesInCollection(db: Db, collectionId: string): Promise<string[]> {
  return (await db.select({ code: animals.labelCode }).from(animals).where(eq(animals.collectionId, collectionId))).map((r) => r.code);
}

export async function collectionName(db: Db, collectionId: string): Promise<string> {
  const [row] = await db.select({ name: collections.name }).from(collections).where(eq(collections.id, collectionId));
  return row?.name ?? '';
}

/** True when the place exists in this collection (ids from another collection are refused). */
export async function locationInCollection(db: Db, collectionId: string, locationId: string): Promise<boolean> {
  const [row] = await db.select({ id: locations.id }).from(locations).where(and(eq(locations.id, locationId), eq(locations.collectionId, collectionId)));
  return !!row;
}
