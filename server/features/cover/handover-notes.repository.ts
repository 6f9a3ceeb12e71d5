import { and, eq, gte } from 'drizzle-orm';
import type { LocalDate } from '#shared/domain/local-dates';
import type { Db } from '../../db/client';
import { animals, handoverNotes } from '../../db/schema/animals';
import { collections } from '../../db/schema/collections';

/** Notes still in force on `from` or later, soonest to end first, with their animal's name. */
export async function listHandoverNotes(db: Db, collectionId: string, from: LocalDate) {
  return db
    .select({ n: handoverNotes, animalName: animals.name })
    .from(handoverNotes)
    .innerJoin(animals, eq(animals.id, handoverNotes.animalId))
    .where(and(eq(handoverNotes.collectionId, collectionId), gte(handoverNotes.until, from)))
    .orderBy(handoverNotes.until);
}

export async function animalInCollection(db: Db, collectionId: string, animalId: string) {
  const [row] = await db
    .select({ id: animals.id })
    .from(animals)
    .where(and(eq(animals.id, animalId), eq(animals.collectionId, collectionId)));
  return !!row;
}

export async function insertHandoverNote(
  db: Db,
  values: {
    collectionId: string;
    animalId: string;
    text: string;
    until: LocalDate;
    doNotFeed: boolean;
    createdBy: string;
  },
) {
  const [row] = await db.insert(handoverNotes).values(values).returning({ id: handoverNotes.id });
  return row!.id;
}

/** Deletes a note; the animal it was about, or null when there was no such note. */
export async function deleteHandoverNote(db: Db, collectionId: string, noteId: string) {
  const deleted = await db
    .delete(handoverNotes)
    .where(and(eq(handoverNotes.id, noteId), eq(handoverNotes.collectionId, collectionId)))
    .returning({ animalId: handoverNotes.animalId });
  return deleted[0]?.animalId ?? null;
}

export async function setGeneralNote(db: Db, collectionId: string, text: string | null) {
  await db.update(collections).set({ handoverNote: text }).where(eq(collections.id, collectionId));
}

export async function generalNoteOf(db: Db, collectionId: string) {
  const [row] = await db
    .select({ note: collections.handoverNote })
    .from(collections)
    .where(eq(collections.id, collectionId));
  return row?.note ?? null;
}
