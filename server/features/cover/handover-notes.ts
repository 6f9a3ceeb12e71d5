import { localDateOf, type LocalDate } from '#shared/domain/local-dates';
import type { HandoverNote } from '#shared/schemas/cover';
import type { MemberCollection } from '../../access/memberships';
import type { Db } from '../../db/client';
import { HttpError } from '../../middleware/errors';
import {
  animalInCollection,
  deleteHandoverNote,
  generalNoteOf,
  insertHandoverNote,
  listHandoverNotes,
  setGeneralNote,
} from './handover-notes.repository';

/** What keepers leave for whoever covers: a general note and notes on single animals until a date. */
export function createHandoverNotes(db: Db, now: () => Date) {
  async function notes(collectionId: string, from: LocalDate): Promise<HandoverNote[]> {
    const rows = await listHandoverNotes(db, collectionId, from);
    return rows.map(({ n, animalName }) => ({
      id: n.id,
      animalId: n.animalId,
      animalName,
      text: n.text,
      until: n.until,
      doNotFeed: n.doNotFeed,
    }));
  }

  return {
    notes,

    /** The general note and the notes still in force today, in the collection's own time. */
    async current(c: MemberCollection) {
      return {
        generalNote: await generalNoteOf(db, c.collectionId),
        notes: await notes(c.collectionId, localDateOf(now(), c.timeZone)),
      };
    },

    generalNote: (collectionId: string) => generalNoteOf(db, collectionId),

    async setGeneralNote(collectionId: string, text: string) {
      await setGeneralNote(db, collectionId, text || null);
    },

    async add(
      collectionId: string,
      userId: string,
      body: { animalId: string; text: string; until: LocalDate; doNotFeed: boolean },
    ) {
      if (!(await animalInCollection(db, collectionId, body.animalId)))
        throw new HttpError(404, 'not_found', 'We could not find that animal.');
      return { id: await insertHandoverNote(db, { collectionId, ...body, createdBy: userId }) };
    },

    /** Removes a note; returns the animal it was about (its round may change). */
    async remove(collectionId: string, noteId: string) {
      const animalId = await deleteHandoverNote(db, collectionId, noteId);
      if (!animalId) throw new HttpError(404, 'not_found', 'We could not find that note.');
      return animalId;
    },
  };
}
export type HandoverNotes = ReturnType<typeof createHandoverNotes>;
