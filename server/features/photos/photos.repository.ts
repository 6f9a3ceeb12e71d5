import { and, eq, inArray } from 'drizzle-orm';
import type { Db } from '../../db/client';
import { animals, eventPhotos, events } from '../../db/schema/animals';

/** The animal's photo key: undefined when the animal is not in this collection, null when it has no photo. */
export async function animalPhotoKey(
  db: Db,
  collectionId: string,
  animalId: string,
): Promise<string | null | undefined> {
  const [row] = await db
    .select({ key: animals.photoKey })
    .from(animals)
    .where(and(eq(animals.collectionId, collectionId), eq(animals.id, animalId)));
  return row ? row.key : undefined;
}

/** Sets (or, with null, clears) the photo of an animal already known to be in the collection. */
export async function setAnimalPhoto(
  db: Db,
  animalId: string,
  key: string | null,
  at: Date | null,
) {
  await db
    .update(animals)
    .set({ photoKey: key, photoUpdatedAt: at })
    .where(eq(animals.id, animalId));
}

/** A molt of this animal in this collection, with its photo's key if it has one. */
export const findMolt = (db: Db, collectionId: string, animalId: string, eventId: string) =>
  findEventWithPhoto(db, collectionId, animalId, eventId, ['molted']);

/** An event of this animal in this collection, of one of `kinds`, with its photo's key if any. */
export async function findEventWithPhoto(
  db: Db,
  collectionId: string,
  animalId: string,
  eventId: string,
  kinds: readonly string[],
) {
  const [row] = await db
    .select({ id: events.id, key: eventPhotos.photoKey })
    .from(events)
    .leftJoin(eventPhotos, eq(eventPhotos.eventId, events.id))
    .where(
      and(
        eq(events.id, eventId),
        eq(events.animalId, animalId),
        eq(events.collectionId, collectionId),
        inArray(events.kind, [...kinds]),
      ),
    );
  return row ?? null;
}

export async function setEventPhoto(
  db: Db,
  collectionId: string,
  eventId: string,
  key: string,
  at: Date,
) {
  await db
    .insert(eventPhotos)
    .values({ eventId, collectionId, photoKey: key })
    .onConflictDoUpdate({ target: eventPhotos.eventId, set: { photoKey: key, createdAt: at } });
}
