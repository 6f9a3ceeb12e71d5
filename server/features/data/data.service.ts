import { randomUUID } from 'node:crypto';
import fs from 'node:fs/promises';
import { asc, count, eq, inArray } from 'drizzle-orm';
import type { NodePgDatabase } from 'drizzle-orm/node-postgres';
import { ANIMAL_COLUMNS, animalToRow } from '../../../shared/domain/csv/animal-columns';
import { writeCsv } from '../../../shared/domain/csv/csv-file';
import { clockTime } from '../../../shared/domain/local-dates';
import { BACKUP_FORMAT, BACKUP_VERSION, type BackupFile } from '../../../shared/schemas/backup';
import type { AnimalImportValues } from '../../../shared/schemas/import';
import type { Db } from '../../db/client';
import { animals, eggSacs, eventPhotos, events } from '../../db/schema/animals';
import { collections, locations } from '../../db/schema/collections';
import { users } from '../../db/schema/users';
import { HttpError } from '../../middleware/errors';
import type { AnimalsService } from '../animals/animals.service';
import { imageTypeOf } from '../photos/image-type';
import type { PhotosService } from '../photos/photos.service';
import type { RoundsService } from '../rounds/rounds.service';

const placeKey = (p: { room: string; rack: string; shelf: string; position: string }) => [p.room, p.rack, p.shelf, p.position].join('\u0000');

export const EVENT_COLUMNS = ['event_id', 'when_utc', 'local_date', 'local_time', 'animal_code', 'animal_name', 'what', 'details', 'recorded_by', 'flags'] as const;

/** Locations by place, created where the file names a place the collection does not have yet. */
async function placesFor(tx: Db, collectionId: string, wanted: { room: string; rack: string; shelf: string; position: string }[]): Promise<Map<string, string>> {
  const unique = new Map(wanted.map((p) => [placeKey(p), p]));
  const known = await tx.select().from(locations).where(eq(locations.collectionId, collectionId));
  const ids = new Map(known.map((l) => [placeKey(l), l.id]));
  const missing = [...unique.entries()].filter(([k]) => !ids.has(k)).map(([, p]) => p);
  if (missing.length) {
    const last = known.reduce((m, l) => Math.max(m, l.walkOrder), 0);
    const created = await tx.insert(locations).values(missing.map((p, i) => ({ collectionId, ...p, walkOrder: last + i + 1 }))).returning();
    for (const l of created) ids.set(placeKey(l), l.id);
  }
  return ids;
}

export function createDataService(db: NodePgDatabase, deps: { animals: AnimalsService; rounds: RoundsService; photos: PhotosService }) {
  async function collectionOf(collectionId: string) {
    const [c] = await db.select().from(collections).where(eq(collections.id, collectionId));
    return c!;
  }

  return {
    async animalsCsv(collectionId: string): Promise<string> {
      return writeCsv(ANIMAL_COLUMNS, (await deps.animals.list(collectionId)).map(animalToRow));
    },

    /** Every event, oldest first, with local date and time in the collection's zone. */
    async eventsCsv(collectionId: string): Promise<string> {
      const c = await collectionOf(collectionId);
      const rows = await db
        .select({ e: events, code: animals.labelCode, name: animals.name, by: users.displayName })
        .from(events)
        .innerJoin(animals, eq(animals.id, events.animalId))
        .leftJoin(users, eq(users.id, events.recordedBy))
        .where(eq(events.collectionId, collectionId))
        .orderBy(asc(events.effectiveAt), asc(events.id));
      const local = new Intl.DateTimeFormat('en-CA', { timeZone: c.timeZone, year: 'numeric', month: '2-digit', day: '2-digit' });
      return writeCsv(
        EVENT_COLUMNS,
        rows.map(({ e, code, name, by }) => ({
          event_id: e.id,
          when_utc: e.effectiveAt.toISOString(),
          local_date: local.format(e.effectiveAt),
          local_time: clockTime(e.effectiveAt.toISOString(), c.timeZone),
          animal_code: code,
          animal_name: name,
          what: e.kind,
          details: Object.keys(e.payload as object).length ? JSON.stringify(e.payload) : '',
          recorded_by: by ?? '',
          flags: e.flags.join(';'),
        })),
      );
    },

    /** Rows already checked by the import screen and again by the API schema; all or nothing. */
    async importAnimals(collectionId: string, rows: AnimalImportValues[]): Promise<number> {
      return db.transaction(async (tx) => {
        const places = await placesFor(tx, collectionId, rows.flatMap((r) => (r.place ? [r.place] : [])));
        return deps.animals.createMany(collectionId, rows.map(({ place, ...r }) => ({ ...r, locationId: place ? places.get(placeKey(place))! : null })), tx);
      });
    },

    async backup(collectionId: string): Promise<BackupFile> {
      const c = await collectionOf(collectionId);
      const places = await db.select().from(locations).where(eq(locations.collectionId, collectionId)).orderBy(asc(locations.walkOrder));
      const kept = await db.select().from(animals).where(eq(animals.collectionId, collectionId)).orderBy(asc(animals.labelCode));
      const history = await db.select().from(events).where(eq(events.collectionId, collectionId)).orderBy(asc(events.effectiveAt), asc(events.id));
      const sacs = await db.select().from(eggSacs).where(eq(eggSacs.collectionId, collectionId)).orderBy(asc(eggSacs.laidOn), asc(eggSacs.createdAt), asc(eggSacs.clutch));
      const moltPhotos = new Set((await db.select({ id: eventPhotos.eventId }).from(eventPhotos).where(eq(eventPhotos.collectionId, collectionId))).map((r) => r.id));
      const moltPhotoOf = async (e: (typeof history)[number]) =>
        moltPhotos.has(e.id) ? ((await fs.readFile(await deps.photos.moltFile(collectionId, e.animalId, e.id, 'full')).catch(() => null))?.toString('base64') ?? null) : null;
      const photoOf = async (a: (typeof kept)[number]) => (a.photoKey ? (await fs.readFile(await deps.photos.file(collectionId, a.id, 'full')).catch(() => null))?.toString('base64') ?? null : null);
      return {
        format: BACKUP_FORMAT,
        version: BACKUP_VERSION,
        exportedAt: new Date().toISOString(),
        collection: { name: c.name, timeZone: c.timeZone, rules: c.rules as Record<string, unknown> },
        locations: places.map(({ id, room, rack, shelf, position, walkOrder }) => ({ id, room, rack, shelf, position, walkOrder })),
        animals: await Promise.all(
          kept.map(async (a) => ({
            id: a.id,
            labelCode: a.labelCode,
            name: a.name,
            scientificName: a.scientificName,
            commonName: a.commonName,
            group: a.group,
            lifeStage: a.lifeStage,
            sex: a.sex,
            sizeMm: a.sizeMm,
            locationId: a.locationId,
            hasWaterDish: a.hasWaterDish,
            preyType: a.preyType,
            preySize: a.preySize,
            preyCount: a.preyCount,
            diet: a.diet,
            intervalDays: a.intervalDays,
            doNotFeedUntil: a.doNotFeedUntil,
            cautions: a.cautions,
            cautionNote: a.cautionNote,
            status: a.status,
            statusDate: a.statusDate,
            acquiredOn: a.acquiredOn,
            source: a.source,
            clutch: a.clutch,
            notes: a.notes,
            settings: a.settings as Record<string, unknown>,
            createdAt: a.createdAt.toISOString(),
            updatedAt: a.updatedAt.toISOString(),
            photo: await photoOf(a),
          })),
        ),
        eggSacs: sacs.map(({ collectionId: _c, createdAt, ...sac }) => ({ ...sac, createdAt: createdAt.toISOString() })),
        events: await Promise.all(history.map(async (e) => ({
          id: e.id,
          animalId: e.animalId,
          kind: e.kind as BackupFile['events'][number]['kind'],
          payload: e.payload as Record<string, unknown>,
          recordedBy: e.recordedBy,
          deviceId: e.deviceId,
          clientRecordedAt: e.clientRecordedAt.toISOString(),
          clientSentAt: e.clientSentAt?.toISOString() ?? null,
          serverReceivedAt: e.serverReceivedAt.toISOString(),
          effectiveAt: e.effectiveAt.toISOString(),
          flags: e.flags,
          photo: await moltPhotoOf(e),
        }))),
      };
    },

    /**
     * A backup into an empty collection. Every id is new (a backup may be restored beside its
     * original), and ids inside events (undo targets, places, partners) follow.
     */
    async restore(collectionId: string, file: BackupFile): Promise<{ animals: number; events: number }> {
      for (const { photo, what } of [...file.animals.map((a) => ({ photo: a.photo, what: a.name })), ...file.events.map((e) => ({ photo: e.photo ?? null, what: 'a molt' }))]) {
        if (photo !== null && imageTypeOf(Buffer.from(photo.slice(0, 24), 'base64')) !== 'webp') {
          throw new HttpError(422, 'invalid', `The photo of ${what} in this backup is not a WebP image.`);
        }
      }
      const result = await db.transaction(async (tx) => {
        const [{ n } = { n: 0 }] = await tx.select({ n: count() }).from(animals).where(eq(animals.collectionId, collectionId));
        const [{ n: places } = { n: 0 }] = await tx.select({ n: count() }).from(locations).where(eq(locations.collectionId, collectionId));
        if (n > 0 || places > 0) throw new HttpError(409, 'not_empty', 'Restore into an empty collection: this one already has animals or places.');
        const ids = new Map<string, string>();
        const fresh = (old: string) => {
          if (!ids.has(old)) ids.set(old, randomUUID());
          return ids.get(old)!;
        };
        const mapped = (old: unknown) => (typeof old === 'string' && ids.has(old) ? ids.get(old)! : old);
        if (file.locations.length) await tx.insert(locations).values(file.locations.map((l) => ({ ...l, id: fresh(l.id), collectionId })));
        const rows = file.animals.map(({ photo: _photo, createdAt, updatedAt, ...a }) => ({
          ...a,
          id: fresh(a.id),
          collectionId,
          locationId: a.locationId ? (ids.get(a.locationId) ?? null) : null,
          createdAt: new Date(createdAt),
          updatedAt: new Date(updatedAt),
        }));
        for (let i = 0; i < rows.length; i += 500) await tx.insert(animals).values(rows.slice(i, i + 500));
        if (file.eggSacs.some((sac) => !ids.has(sac.femaleId))) throw new HttpError(422, 'invalid', 'The backup has egg sacs for animals it does not contain.');
        if (file.eggSacs.length) await tx.insert(eggSacs).values(file.eggSacs.map((sac) => ({ ...sac, id: fresh(sac.id), collectionId, femaleId: ids.get(sac.femaleId)!, createdAt: new Date(sac.createdAt) })));
        for (const e of file.events) fresh(e.id);
        const known = new Set((await tx.select({ id: users.id }).from(users).where(inArray(users.id, [...new Set(file.events.flatMap((e) => (e.recordedBy ? [e.recordedBy] : [])))]))).map((u) => u.id));
        const history = file.events.map(({ photo: _photo, ...e }) => ({
          ...e,
          id: ids.get(e.id)!,
          collectionId,
          animalId: ids.get(e.animalId) ?? '',
          payload: Object.fromEntries(Object.entries(e.payload).map(([k, v]) => [k, mapped(v)])),
          recordedBy: e.recordedBy && known.has(e.recordedBy) ? e.recordedBy : null,
          clientRecordedAt: new Date(e.clientRecordedAt),
          clientSentAt: e.clientSentAt ? new Date(e.clientSentAt) : null,
          serverReceivedAt: new Date(e.serverReceivedAt),
          effectiveAt: new Date(e.effectiveAt),
        }));
        if (history.some((e) => !e.animalId)) throw new HttpError(422, 'invalid', 'The backup has events for animals it does not contain.');
        for (let i = 0; i < history.length; i += 1000) await tx.insert(events).values(history.slice(i, i + 1000));
        await tx.update(collections).set({ rules: file.collection.rules }).where(eq(collections.id, collectionId));
        return { animals: rows.length, events: history.length, ids };
      });
      for (const a of file.animals) {
        if (a.photo) await deps.photos.restore(collectionId, result.ids.get(a.id)!, Buffer.from(a.photo, 'base64'));
      }
      for (const e of file.events) {
        if (e.photo) await deps.photos.restoreMolt(collectionId, result.ids.get(e.id)!, Buffer.from(e.photo, 'base64'));
      }
      await deps.rounds.rebuildProjection(collectionId);
      return { animals: result.animals, events: result.events };
    },
  };
}
export type DataService = ReturnType<typeof createDataService>;
