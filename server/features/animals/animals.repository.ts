import { and, asc, eq } from 'drizzle-orm';
import type { Db } from '../../db/client';
import { animals } from '../../db/schema/animals';
import { locations } from '../../db/schema/collections';

export async function listAnimals(db: Db, collectionId: string) {
  return db
    .select({ animal: animals, location: locations })
    .from(animals)
    .leftJoin(locations, eq(locations.id, animals.locationId))
    .where(eq(animals.collectionId, collectionId))
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
