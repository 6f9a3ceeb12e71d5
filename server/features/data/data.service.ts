import type { Readable } from 'node:stream';
import { ANIMAL_COLUMNS, animalToRow } from '#shared/domain/csv/animal-columns';
import { writeCsv, writeCsvRecords } from '#shared/domain/csv/csv-file';
import { eventDetails } from '#shared/domain/event-details';
import type { EventKind } from '#shared/domain/event-kinds';
import { clockTime } from '#shared/domain/local-dates';
import type { AnimalImportValues } from '#shared/schemas/import';
import type { MemberCollection } from '../../access/memberships';
import type { Database } from '../../db/client';
import type { AnimalsService } from '../animals/animals.service';
import { findOrCreatePlaces } from '../locations/find-or-create-places';
import type { PhotosService } from '../photos/photos.service';
import { writeBackup, type BackupSink } from './backup-writer';
import { eventsWithNamesPage, payloadNames } from './data.repository';
import { restoreBackup } from './restore';
import { createWorkSlots } from './work-slots';

export const EVENT_COLUMNS = [
  'event_id',
  'when_utc',
  'local_date',
  'local_time',
  'animal_code',
  'animal_name',
  'what',
  'details',
  'recorded_by',
  'flags',
] as const;

/** Events per page of the events CSV. */
const CSV_PAGE = 2000;
/** Backups and restores running at once in one process (each holds a database connection). */
const HEAVY_WORK_SLOTS = 2;

export function createDataService(
  db: Database['db'],
  deps: {
    animals: AnimalsService;
    photos: PhotosService;
    now?: () => Date;
    maxRestoreBytes?: number;
  },
) {
  const now = deps.now ?? (() => new Date());
  const inSlot = createWorkSlots(HEAVY_WORK_SLOTS);

  return {
    async animalsCsv(collectionId: string): Promise<string> {
      return writeCsv(ANIMAL_COLUMNS, (await deps.animals.list(collectionId)).map(animalToRow));
    },

    /**
     * Every event, oldest first, with local date and time in the collection's zone: written a
     * page at a time, as the backup is, so a long history never sits in memory whole.
     */
    async eventsCsv(c: MemberCollection, sink: BackupSink): Promise<void> {
      const { collectionId } = c;
      const local = new Intl.DateTimeFormat('en-CA', {
        timeZone: c.timeZone,
        year: 'numeric',
        month: '2-digit',
        day: '2-digit',
      });
      // Details in words: the male's name and code, places as written on the rack (not ids).
      const names = await payloadNames(db, collectionId);
      const detailNames = {
        animal: (id: string) => names.animals.get(id),
        place: (id: string) => names.places.get(id),
      };
      // The header alone ends in CRLF; records follow it one CRLF apart, as writeCsv joins them.
      const header = writeCsv(EVENT_COLUMNS, []);
      await sink.write(header.slice(0, -2));
      let any = false;
      for (let after: { at: string; id: string } | null = null; ;) {
        const page = await eventsWithNamesPage(db, collectionId, after, CSV_PAGE);
        if (page.length) {
          const rows = page.map(({ e, code, name, by }) => ({
            event_id: e.id,
            when_utc: e.effectiveAt.toISOString(),
            local_date: local.format(e.effectiveAt),
            local_time: clockTime(e.effectiveAt.toISOString(), c.timeZone),
            animal_code: code,
            animal_name: name,
            what: e.kind,
            details: eventDetails(
              e.kind as EventKind,
              e.payload as Record<string, unknown>,
              detailNames,
            ),
            recorded_by: by ?? '',
            flags: e.flags.join(';'),
          }));
          await sink.write(`\r\n${writeCsvRecords(EVENT_COLUMNS, rows)}`);
          any = true;
        }
        if (page.length < CSV_PAGE) return any ? undefined : sink.write('\r\n');
        const last = page.at(-1)!;
        after = { at: last.cursor, id: last.e.id };
      }
    },

    /** Rows already checked by the import screen and again by the API schema; all or nothing. */
    async importAnimals(c: MemberCollection, rows: AnimalImportValues[]): Promise<number> {
      return db.transaction(async (tx) => {
        const places = await findOrCreatePlaces(
          tx,
          c.collectionId,
          rows.flatMap((r) => (r.place ? [r.place] : [])),
        );
        return deps.animals.createMany(
          c,
          rows.map(({ place, ...r }) => ({ ...r, locationId: place ? places.idOf(place) : null })),
          tx,
        );
      });
    },

    /** The collection as a backup, written to the sink piece by piece (backup-writer.ts). */
    backup(c: MemberCollection, sink: BackupSink): Promise<void> {
      return inSlot(() => writeBackup(db, deps.photos, c, now(), sink));
    },

    /** A backup read from a stream into this empty collection, all or nothing (restore.ts). */
    restore(
      c: MemberCollection,
      source: Readable,
      declaredBytes?: number,
    ): Promise<{ animals: number; events: number }> {
      return inSlot(() =>
        restoreBackup(
          db,
          { photos: deps.photos, now, maxBytes: deps.maxRestoreBytes },
          c,
          source,
          declaredBytes,
        ),
      );
    },
  };
}
export type DataService = ReturnType<typeof createDataService>;
