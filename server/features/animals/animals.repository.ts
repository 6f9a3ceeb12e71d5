import { and, asc, eq, inArray } from 'drizzle-orm';
import type { Db } from '../../db/client';
import { animals } from '../../db/schema/animals';
import { locations } from '../../db/schema/collections';

export type AnimalRow = typeof animals.$inferSelect;
export type NewAnimal = typeof animals.$inferInsert;
export type LocationRow = typeof locations.$inferSelect;

export async function listAnimals(db: Db, collectionId: string, animalIds?: string[]) {
  return db
    .select({ animal: animals, location: locations })
    .from(animals)
    .leftJoin(locations, eq(locations.id, animals.locationId))
    .where(
      and(
        eq(animals.collectionId, collectionId),
        animalIds ? inArray(animals.id, animalIds) : undefined,
      ),
    )
    .orderBy(asc(locations.walkOrder), asc(animals.labelCode));
}

/** An animal's place and status, or null when it is not in this collection. */
export async function findPlaceAndStatus(db: Db, collectionId: string, animalId: string) {
  const [row] = await db
    .select({ locationId: animals.locationId, status: animals.status })
    .from(animals)
    .where(and(eq(animals.collectionId, collectionId), eq(animals.id, animalId)));
  return row ?? null;
}

/** Of these animals, the ones in this collection, with their place. */
export async function placesOfAnimals(db: Db, collectionId: string, animalIds: string[]) {
  return db
    .select({ id: animals.id, locationId: animals.locationId })
    .from(animals)
    .where(and(eq(animals.collectionId, collectionId), inArray(animals.id, animalIds)));
}

export async function insertAnimal(db: Db, values: NewAnimal) {
  const [row] = await db.insert(animals).values(values).returning({ id: animals.id });
  return row!.id;
}

/** Many animals, 500 rows a statement. */
export async function insertAnimals(db: Db, values: NewAnimal[]) {
  for (let i = 0; i < values.length; i += 500)
    await db.insert(animals).values(values.slice(i, i + 500));
}

/** Changes an animal already known to be in the collection (the caller checked). */
export async function updateAnimal(db: Db, animalId: string, values: Partial<NewAnimal>) {
  await db.update(animals).set(values).where(eq(animals.id, animalId));
}

export async function moveAnimals(db: Db, animalIds: string[], locationId: string, at: Date) {
  await db.update(animals).set({ locationId, updatedAt: at }).where(inArray(animals.id, animalIds));
}

export async function updateAnimalCare(
  db: Db,
  collectionId: string,
  animalId: string,
  values: Partial<NewAnimal>,
) {
  const [row] = await db
    .update(animals)
    .set({ ...values, updatedAt: new Date() })
    .where(and(eq(animals.collectionId, collectionId), eq(animals.id, animalId)))
    .returning({ id: animals.id });
  return !!row;
}

export async function codesInCollection(db: Db, collectionId: string): Promise<string[]> {
  return (
    await db
      .select({ code: animals.labelCode })
      .from(animals)
      .where(eq(animals.collectionId, collectionId))
  ).map((r) => r.code);
}

/** True when the place exists in this collection (ids from another collection are refused). */
export async function locationInCollection(
  db: Db,
  collectionId: string,
  locationId: string,
): Promise<boolean> {
  const [row] = await db
    .select({ id: locations.id })
    .from(locations)
    .where(and(eq(locations.id, locationId), eq(locations.collectionId, collectionId)));
  return !!row;
}
