import type { Caution } from '#shared/domain/animal-facts';
import { writeCsv } from '#shared/domain/csv/csv-file';
import { eventDetails } from '#shared/domain/event-details';
import { EVENT_WORDS, type EventKind } from '#shared/domain/event-kinds';
import { clockTime, localDateOf } from '#shared/domain/local-dates';
import type { RoundRules } from '#shared/domain/rounds/rules';
import { instarOf } from '#shared/domain/sales/availability';
import { careSheetContent, type CareSheet } from '#shared/domain/sales/care-sheet';
import type { MemberCollection } from '../../access/memberships';
import type { Db } from '../../db/client';
import { HttpError } from '../../middleware/errors';
import type { ListingsService } from '../listings/listings.service';
import { animalEvents, sheetAnimal } from './care-sheets.repository';

type LoggedEvent = Awaited<ReturnType<typeof animalEvents>>[number];

/** The log without undone events and without the undo records themselves. */
function standing(log: readonly LoggedEvent[]): LoggedEvent[] {
  const undone = new Set(
    log.filter((e) => e.kind === 'void').map((e) => (e.payload as { targetId?: string }).targetId),
  );
  return log.filter((e) => e.kind !== 'void' && !undone.has(e.id));
}

/** A payload without the keeper's free-text note: the keeper's own words stay theirs. */
const withoutNote = (payload: unknown): Record<string, unknown> => {
  const { note: _note, ...rest } = (payload ?? {}) as Record<string, unknown>;
  return rest;
};

export const HISTORY_COLUMNS = ['date', 'time', 'what', 'details'] as const;

/**
 * Care sheets and history for a buyer (sales part L). What it eats and how often come from the
 * collection's current round rules, through the round engine's own functions
 * (shared/domain/sales/care-sheet.ts); the sales part attaches these PDFs when it ships.
 */
export function createCareSheetsService(
  db: Db,
  deps: {
    now: () => Date;
    rules: (collectionId: string) => Promise<RoundRules>;
    listings: Pick<ListingsService, 'descriptionOf'>;
  },
) {
  async function load(c: MemberCollection, animalId: string) {
    const animal = await sheetAnimal(db, c.collectionId, animalId);
    if (!animal) throw new HttpError(404, 'not_found', 'We could not find that animal.');
    return { animal, log: standing(await animalEvents(db, c.collectionId, animalId)) };
  }

  const service = {
    async content(c: MemberCollection, animalId: string): Promise<CareSheet> {
      const { animal, log } = await load(c, animalId);
      const [rules, description] = await Promise.all([
        deps.rules(c.collectionId),
        deps.listings.descriptionOf(c.collectionId, animalId),
      ]);
      const molts = log.filter((e) => e.kind === 'molted');
      const day = (e: LoggedEvent) => localDateOf(e.effectiveAt, c.timeZone);
      const { fromOwnSac, ...facts } = animal;
      return careSheetContent({
        collectionName: c.collectionName,
        animal: {
          ...facts,
          cautions: facts.cautions as Caution[],
          instar: instarOf(fromOwnSac, molts.length),
        },
        rules,
        lastMolt: molts.length ? day(molts.at(-1)!) : null,
        meals: log
          .filter((e) => e.kind === 'ate')
          .map((e) => ({ date: day(e), what: eventDetails('ate', withoutNote(e.payload)) })),
        breederNotes: description,
        issuedOn: localDateOf(deps.now(), c.timeZone),
      });
    },

    /** The care sheet as a PDF, for the buyer (and for the ship e-mail). */
    async pdf(c: MemberCollection, animalId: string): Promise<Buffer> {
      const sheet = await service.content(c, animalId);
      // pdfkit loads on the first PDF, not with the server.
      const { renderCareSheetPdf } = await import('./care-sheet.pdf');
      return renderCareSheetPdf(sheet);
    },

    /**
     * The animal's history for its new keeper (RFC 4180 CSV): each standing event's local date
     * and time, what it was and its details in words — no places, no people, no free-text notes.
     */
    async historyCsv(c: MemberCollection, animalId: string): Promise<string> {
      const { log } = await load(c, animalId);
      const rows = log
        .filter((e) => e.kind !== 'note')
        .map((e) => ({
          date: localDateOf(e.effectiveAt, c.timeZone),
          time: clockTime(e.effectiveAt.toISOString(), c.timeZone),
          what: EVENT_WORDS[e.kind as EventKind] ?? e.kind,
          details: eventDetails(e.kind as EventKind, withoutNote(e.payload)),
        }));
      return writeCsv(HISTORY_COLUMNS, rows);
    },
  };
  return service;
}
export type CareSheetsService = ReturnType<typeof createCareSheetsService>;
