import { hash, randomBytes } from 'node:crypto';
import fs from 'node:fs';
import type { Readable } from 'node:stream';
import type { z } from 'zod';
import {
  MAX_BACKUP_PHOTO_CHARS,
  MAX_BACKUP_PLACES,
  MAX_RESTORE_BYTES,
} from '#shared/domain/backup-limits';
import {
  backupAnimal,
  backupBuyer,
  backupChore,
  backupCollection,
  backupColony,
  backupEggSac,
  backupEvent,
  backupHeader,
  backupInvoice,
  backupListing,
  backupPayment,
  backupPlace,
  backupReading,
  backupRoomTargets,
  backupSale,
  backupSalesSettings,
  backupStockChange,
} from '#shared/schemas/backup';
import { fieldLabel, isGenericMessage } from '#shared/schemas/messages';
import type { RulesOverrideBody } from '#shared/schemas/rules';
import type { MemberCollection } from '../../access/memberships';
import type { Db } from '../../db/client';
import { HttpError } from '../../middleware/errors';
import { refoldStates } from '../events/projection';
import { recordEvents } from '../events/record-events';
import type { PhotosService, RestoreWorkspace } from '../photos/photos.service';
import { BACKUP_LISTS, readBackup, type BackupList, type BackupRecord } from './backup-reader';
import * as repo from './data.repository';
import { createJsonGuard, tooLarge } from './json-guard';

/** The longest history one animal may bring: its projection is folded with all of it in memory. */
export const MAX_EVENTS_PER_ANIMAL = 20_000;
/** Events folded into the projection at once after a restore (a few MB of heap). */
const REFOLD_EVENTS = 20_000;
const BATCH: Record<BackupList, number> = {
  locations: 500,
  animals: 200,
  eggSacs: 200,
  events: 1000,
  colonies: 100,
  colonyStockChanges: 1000,
  chores: 1000,
  roomTargets: 500,
  climateReadings: 1000,
  salesSettings: 1,
  buyers: 500,
  saleListings: 500,
  sales: 200,
  invoices: 200,
  payments: 500,
};
/** Problems reported at once; a file with more is surely not worth reading further. */
const MAX_PROBLEMS = 5;
const WHAT: Record<BackupList, string> = {
  locations: 'Place',
  animals: 'Animal',
  eggSacs: 'Egg sac, case or brood',
  events: 'History entry',
  colonies: 'Feeder colony',
  colonyStockChanges: 'Stock change',
  chores: 'Chore',
  roomTargets: 'Room target',
  climateReadings: 'Climate reading',
  salesSettings: 'Sales settings',
  buyers: 'Buyer',
  saleListings: 'Listing',
  sales: 'Sale',
  invoices: 'Invoice',
  payments: 'Payment',
};

type Problem = { path: string; message: string };

export interface RestoreOptions {
  photos: PhotosService;
  now: () => Date;
  /** MAX_RESTORE_BYTES unless a test wants a smaller file to be too large. */
  maxBytes?: number;
}

/**
 * Restores a backup into an empty collection, all or nothing. The upload is spooled to disk
 * (so a slow phone never holds a database transaction open), then read record by record in
 * one transaction: every record checked with the API's own schemas, photos written aside,
 * rows inserted in batches. Only after the commit do the photos move into place; on any
 * failure the transaction rolls back and the workspace, photos included, is removed.
 */
export async function restoreBackup(
  db: Db,
  options: RestoreOptions,
  c: MemberCollection,
  source: Readable,
  declaredBytes?: number,
) {
  const { collectionId } = c;
  const maxBytes = options.maxBytes ?? MAX_RESTORE_BYTES;
  const guard = createJsonGuard({ maxBytes, maxString: MAX_BACKUP_PHOTO_CHARS + 16, maxDepth: 12 });
  // A declared length over the limit is refused before a byte is read.
  if (declaredBytes !== undefined && declaredBytes > maxBytes) throw tooLarge(maxBytes);
  await refuseUnlessEmpty(db, collectionId);
  const workspace = await options.photos.openRestoreWorkspace();
  try {
    await spool(source, workspace.uploadFile, guard);
    const counts = await db.transaction(async (tx) => {
      await repo.lockCollection(tx, collectionId);
      await refuseUnlessEmpty(tx, collectionId);
      const loader = createLoader(tx, c, workspace, options.now());
      try {
        for await (const record of readBackup(workspace.uploadFile)) await loader.take(record);
        return await loader.finish();
      } catch (err) {
        // Nothing may still be writing when the transaction rolls back and the workspace goes.
        await loader.settle();
        throw err;
      }
    });
    await workspace.commit(collectionId);
    return counts;
  } finally {
    await workspace.discard();
  }
}

async function refuseUnlessEmpty(db: Db, collectionId: string) {
  const n = await repo.recordCounts(db, collectionId);
  if (n.animals > 0 || n.places > 0)
    throw new HttpError(
      409,
      'not_empty',
      'Restore into an empty collection: this one already has animals or places.',
    );
  if (n.colonies > 0 || n.targets > 0 || n.readings > 0)
    throw new HttpError(
      409,
      'not_empty',
      'Restore into an empty collection: this one already has feeder colonies or room climate.',
    );
  if (n.sales > 0)
    throw new HttpError(
      409,
      'not_empty',
      'Restore into an empty collection: this one already has sales settings or buyers.',
    );
}

/**
 * Copies the upload to a file through the guard. When the guard refuses it, the rest of the
 * upload is read and dropped rather than the connection cut, so the client gets our answer.
 */
function spool(source: Readable, file: string, guard: (chunk: Uint8Array) => void): Promise<void> {
  return new Promise((resolve, reject) => {
    const out = fs.createWriteStream(file);
    let settled = false;
    let ended = false;
    const fail = (err: unknown) => {
      if (settled) return;
      settled = true;
      source.off('data', onData);
      source.resume();
      out.destroy();
      reject(err);
    };
    const onData = (chunk: Buffer) => {
      try {
        guard(chunk);
      } catch (err) {
        return fail(err);
      }
      if (!out.write(chunk)) {
        source.pause();
        out.once('drain', () => source.resume());
      }
    };
    const interrupted = () =>
      fail(
        new HttpError(
          400,
          'aborted',
          'The upload stopped before the end of the file, so nothing was restored.',
        ),
      );
    out.on('error', fail);
    source.on('data', onData);
    source.on('error', interrupted);
    source.on('close', () => {
      if (!ended) interrupted();
    });
    source.on('end', () => {
      ended = true;
      out.end(() => {
        if (settled) return;
        settled = true;
        resolve();
      });
    });
  });
}

/**
 * New ids for a restored copy, derived from the old ones and a salt of this restore's own: the
 * same old id always gives the same new one, so no table of them is kept in memory.
 */
function idMapper() {
  const salt = randomBytes(16).toString('hex');
  return (old: string) => {
    const h = hash('sha256', salt + old.toLowerCase(), 'buffer');
    // RFC 9562 layout (version 4, variant 10): the bits of a random UUID.
    h[6] = (h[6]! & 0x0f) | 0x40;
    h[8] = (h[8]! & 0x3f) | 0x80;
    const x = h.subarray(0, 16).toString('hex');
    return `${x.slice(0, 8)}-${x.slice(8, 12)}-${x.slice(12, 16)}-${x.slice(16, 20)}-${x.slice(20)}`;
  };
}

function problemsOf(where: string, prefix: string, error: z.ZodError): Problem[] {
  return error.issues.map((issue) => {
    const path = [prefix, ...issue.path.map(String)].join('.');
    const field =
      issue.path.length && isGenericMessage(issue.message)
        ? `${fieldLabel(issue.path.map(String).join('.'))}: `
        : '';
    return { path, message: `${where}: ${field}${issue.message}` };
  });
}

function refusal(problems: Problem[]): HttpError {
  const first = problems[0]!.message;
  return new HttpError(
    422,
    'invalid',
    problems.length === 1 ? first : `${first} (and ${problems.length - 1} more)`,
    problems,
  );
}

/** A database refusal of the backup's own data, in words; null for anything else. */
function dataProblem(err: unknown): HttpError | null {
  const e = ((err as { cause?: unknown }).cause ?? err) as {
    code?: string;
    constraint?: string;
    detail?: string;
  };
  const values = /\)=\((.*)\)/.exec(e.detail ?? '')?.[1] ?? '';
  const refuse = (message: string) => new HttpError(422, 'invalid', message);
  if (e.code === '23505') {
    if (e.constraint === 'animals_collection_label')
      return refuse(
        `Two animals in this backup have the label code ${values.split(', ').pop()}: each animal needs its own.`,
      );
    if (e.constraint === 'locations_place')
      return refuse(
        `Two places in this backup are the same room, rack, shelf and position (${values.split(', ').slice(1).join(' · ')}): each may be listed once.`,
      );
    if (e.constraint === 'animals_pkey') return refuse('This backup lists the same animal twice.');
    if (e.constraint === 'locations_pkey') return refuse('This backup lists the same place twice.');
    if (e.constraint === 'events_pkey')
      return refuse('This backup lists the same history entry twice.');
    if (e.constraint === 'colonies_collection_name')
      return refuse(
        `Two feeder colonies in this backup are called ${values.split(', ').slice(1).join(', ')}: each needs its own name.`,
      );
    if (e.constraint === 'colonies_pkey') return refuse('This backup lists the same colony twice.');
    if (e.constraint === 'colony_stock_colony_id_prey_size_pk')
      return refuse(
        `A feeder colony in this backup lists the size ${values.split(', ').slice(1).join(', ')} twice.`,
      );
    if (
      e.constraint === 'colony_stock_changes_pkey' ||
      e.constraint === 'colony_stock_changes_once'
    )
      return refuse('This backup lists the same stock change twice.');
    if (e.constraint === 'chores_pkey') return refuse('This backup lists the same chore twice.');
    if (e.constraint === 'room_targets_collection_id_room_pk')
      return refuse(
        `This backup gives the targets of the room ${values.split(', ').slice(1).join(', ')} twice.`,
      );
    if (e.constraint === 'climate_readings_pkey')
      return refuse('This backup lists the same climate reading twice.');
    if (e.constraint === 'climate_readings_logger_instant')
      return refuse(
        `This backup has two logger readings of the room ${values.split(', ').slice(1, -1).join(', ')} at the same time.`,
      );
    // Sales — S.
    if (e.constraint === 'sale_animals_one_live_sale')
      return refuse('This backup holds one animal in two sales at once.');
    if (e.constraint === 'invoices_collection_number')
      return refuse(`Two invoices in this backup have the number ${values.split(', ').pop()}.`);
    if (e.constraint === 'invoices_one_live_per_sale')
      return refuse('This backup gives one sale two invoices that are not cancelled.');
    return refuse('This backup lists something twice.');
  }
  // A rule of a table the schemas do not repeat (a check constraint).
  if (e.code === '23514') return refuse('This backup holds a value Rackside cannot store.');
  if (e.code === '23503') {
    if (e.constraint === 'events_animal_id_animals_id_fk')
      return refuse('This backup has history for an animal it does not contain.');
    if (e.constraint === 'colony_stock_changes_colony_id_colonies_id_fk')
      return refuse('This backup has stock history for a feeder colony it does not contain.');
    if (e.constraint?.startsWith('sale') || e.constraint?.startsWith('invoice'))
      return refuse(
        'This backup has a sale, listing or invoice for something it does not contain.',
      );
    return refuse('This backup refers to something it does not contain.');
  }
  // Invalid text, a number out of range, a string too long for its column.
  if (e.code && /^22/.test(e.code))
    return refuse('This backup holds a value Rackside cannot store.');
  return null;
}

async function asDataProblem<T>(work: () => Promise<T>): Promise<T> {
  try {
    return await work();
  } catch (err) {
    throw dataProblem(err) ?? err;
  }
}

type PlaceRow = repo.NewPlace;
type AnimalRow = repo.NewAnimal;
type EventRow = repo.NewEvent;
type SacRow = repo.NewEggSac;
type EventPhotoRow = repo.NewEventPhoto;
type ColonyRow = repo.NewColony;
type ColonyStockRow = repo.NewColonyStock;
type StockChangeRow = repo.NewStockChange;
type ChoreRow = repo.NewChore;
type TargetsRow = repo.NewRoomTargets;
type ReadingRow = repo.NewReading;
/** A photo being written aside while reading goes on: its key once it is on disk. */
type Staging = { key: Promise<string> };
/** Photos decoded and written at once, beside the reading (each holds its image in memory). */
const PHOTOS_IN_FLIGHT = 2;

function createLoader(tx: Db, c: MemberCollection, workspace: RestoreWorkspace, now: Date) {
  const { collectionId } = c;
  const newId = idMapper();
  const places = new Set<string>();
  const singles = new Map<string, unknown>();
  const counts: Record<BackupList, number> = {
    locations: 0,
    animals: 0,
    eggSacs: 0,
    events: 0,
    colonies: 0,
    colonyStockChanges: 0,
    chores: 0,
    roomTargets: 0,
    climateReadings: 0,
    salesSettings: 0,
    buyers: 0,
    saleListings: 0,
    sales: 0,
    invoices: 0,
    payments: 0,
  };
  const problems: Problem[] = [];
  let stage = -1;
  let rules: RulesOverrideBody = {};
  const emptyBatch = () => ({
    places: [] as PlaceRow[],
    animals: [] as { row: AnimalRow; photo: Staging | null }[],
    sacs: [] as SacRow[],
    events: [] as EventRow[],
    photos: [] as { row: EventPhotoRow; photo: Staging }[],
    colonies: [] as ColonyRow[],
    stock: [] as ColonyStockRow[],
    stockChanges: [] as StockChangeRow[],
    chores: [] as ChoreRow[],
    targets: [] as TargetsRow[],
    readings: [] as ReadingRow[],
    sales: {
      settings: [] as repo.NewSalesSettings[],
      buyers: [] as repo.NewBuyer[],
      listings: [] as repo.NewListing[],
      sales: [] as repo.NewSale[],
      saleAnimals: [] as repo.NewSaleAnimal[],
      invoices: [] as repo.NewInvoice[],
      lines: [] as repo.NewInvoiceLine[],
      payments: [] as repo.NewPayment[],
    },
  });
  let pending = emptyBatch();
  // One batch is written while the next is read: PostgreSQL and the parser work side by side.
  // Failures surface when the write is next waited for; until then they are marked handled.
  let writing: Promise<void> = Promise.resolve();
  const staging = new Set<Promise<unknown>>();

  const problem = (found: Problem[]) => {
    problems.push(...found);
    if (problems.length >= MAX_PROBLEMS) throw refusal(problems.slice(0, MAX_PROBLEMS));
  };

  async function stagePhoto(base64: string, where: string): Promise<string> {
    try {
      return await workspace.stagePhoto(Buffer.from(base64, 'base64'));
    } catch (err) {
      if (err instanceof HttpError)
        throw new HttpError(err.status, err.code, `${where}: ${err.message}`);
      // The disk refused (full, read-only…): nothing is kept, and the same file can be tried again.
      throw new HttpError(
        503,
        'storage_failed',
        'The server could not store the photos of this backup, so nothing was restored. Try again later.',
      );
    }
  }

  /** Starts writing a photo aside, once fewer than PHOTOS_IN_FLIGHT are being written. */
  async function startPhoto(base64: string, where: string): Promise<Staging> {
    while (staging.size >= PHOTOS_IN_FLIGHT) await Promise.race(staging);
    const key = stagePhoto(base64, where);
    const done: Promise<boolean> = key.then(
      () => staging.delete(done),
      () => staging.delete(done),
    );
    staging.add(done);
    key.catch(() => undefined);
    return { key };
  }

  /** A place the file lists (by its old id): moves and animals point at it. */
  const mapPlace = (old: string | null | undefined) =>
    old && places.has(old.toLowerCase()) ? newId(old) : null;

  function remapPayload(payload: Record<string, unknown>) {
    const out = { ...payload };
    for (const key of ['targetId', 'maleId', 'sacId', 'saleId'])
      if (typeof out[key] === 'string') out[key] = newId(out[key]);
    // A move to a place deleted since keeps the id it had, as the original does.
    for (const key of ['fromLocationId', 'toLocationId'])
      if (typeof out[key] === 'string') out[key] = mapPlace(out[key]) ?? out[key];
    return out;
  }

  /** Hands the pending rows to the writer, once the batch before them is written. */
  async function flush() {
    const batch = pending;
    pending = emptyBatch();
    await writing;
    writing = write(batch);
    writing.catch(() => undefined);
  }

  async function write(batch: ReturnType<typeof emptyBatch>) {
    for (const a of batch.animals) if (a.photo) a.row.photoKey = await a.photo.key;
    for (const p of batch.photos) p.row.photoKey = await p.photo.key;
    await asDataProblem(async () => {
      await repo.insertPlaces(tx, batch.places);
      await repo.insertAnimals(
        tx,
        batch.animals.map((a) => a.row),
      );
      await repo.insertSacs(tx, batch.sacs);
      // People belong to a server: someone this server does not know is recorded as nobody.
      const byWhom = [...batch.events, ...batch.chores, ...batch.readings];
      if (byWhom.length) {
        const known = await repo.existingUserIds(tx, [
          ...new Set(byWhom.flatMap((r) => (r.recordedBy ? [r.recordedBy] : []))),
        ]);
        for (const r of byWhom) if (r.recordedBy && !known.has(r.recordedBy)) r.recordedBy = null;
      }
      if (batch.events.length)
        await recordEvents(tx, { collectionId }, batch.events, { from: 'history' });
      await repo.insertEventPhotos(
        tx,
        batch.photos.map((p) => p.row),
      );
      await repo.insertColonies(tx, batch.colonies, batch.stock);
      await repo.insertStockChanges(tx, batch.stockChanges);
      await repo.insertChores(tx, batch.chores);
      await repo.insertRoomTargets(tx, batch.targets);
      await repo.insertReadings(tx, batch.readings);
      // A payment's ref is the payment service's and unique on this server: a copy restored
      // beside its original keeps it marked as a copy, so webhooks still find the original.
      const taken = await repo.takenProviderRefs(tx, batch.sales.payments);
      for (const p of batch.sales.payments)
        if (taken.has(`${p.kind}|${p.providerRef}`))
          p.providerRef = `${p.providerRef}#copy-${p.id}`;
      await repo.insertSalesRows(tx, batch.sales);
    });
  }

  async function takeSingle(key: string, value: unknown) {
    singles.set(key, value);
    if (key === 'format' || key === 'version') {
      const result = backupHeader[key].safeParse(value);
      // Not a backup of ours at all: there is nothing more worth saying.
      if (!result.success) throw new HttpError(422, 'invalid', result.error.issues[0]!.message);
    } else if (key === 'exportedAt') {
      const result = backupHeader.exportedAt.safeParse(value);
      if (!result.success) problem(problemsOf('The backup’s date', 'exportedAt', result.error));
    } else if (key === 'collection') {
      const result = backupCollection.safeParse(value);
      if (result.success) rules = result.data.rules;
      else problem(problemsOf('The collection', 'collection', result.error));
    }
  }

  async function takeItem(list: BackupList, index: number, value: unknown) {
    const order = BACKUP_LISTS.indexOf(list);
    if (order < stage)
      throw new HttpError(
        422,
        'invalid',
        'This backup lists its records out of order (places come first, then animals, then history; feeder colonies before their stock history).',
      );
    if (order > stage) {
      if (!problems.length) await flush();
      stage = order;
    }
    counts[list]++;
    // An animal is named by its label code, a colony by its name, a room's records by the room.
    const named = value as { labelCode?: unknown; name?: unknown; room?: unknown } | null;
    const labelCode =
      list === 'animals'
        ? named?.labelCode
        : list === 'colonies'
          ? named?.name
          : list === 'roomTargets' || list === 'climateReadings'
            ? named?.room
            : list === 'buyers'
              ? named?.name
              : list === 'invoices'
                ? (value as { number?: unknown } | null)?.number
                : undefined;
    const where = `${WHAT[list]} ${index + 1}${typeof labelCode === 'string' ? ` (${labelCode.slice(0, 20)})` : ''}`;
    const prefix = `${list}.${index}`;

    if (list === 'locations') {
      const result = backupPlace.safeParse(value);
      if (!result.success) return problem(problemsOf(where, prefix, result.error));
      if (places.size >= MAX_BACKUP_PLACES)
        throw new HttpError(
          422,
          'invalid',
          `This backup has more than ${MAX_BACKUP_PLACES.toLocaleString('en')} places, more than a collection can have.`,
        );
      const { id, ...place } = result.data;
      places.add(id.toLowerCase());
      if (!problems.length) pending.places.push({ ...place, id: newId(id), collectionId });
    } else if (list === 'animals') {
      const result = backupAnimal.safeParse(value);
      if (!result.success) return problem(problemsOf(where, prefix, result.error));
      if (problems.length) return;
      const { id, locationId, photo, createdAt, updatedAt, ...fields } = result.data;
      const row = {
        ...fields,
        id: newId(id),
        collectionId,
        locationId: mapPlace(locationId),
        photoKey: null,
        photoUpdatedAt: photo ? now : null,
        createdAt: new Date(createdAt),
        updatedAt: new Date(updatedAt),
      };
      pending.animals.push({ row, photo: photo ? await startPhoto(photo, where) : null });
    } else if (list === 'eggSacs') {
      const result = backupEggSac.safeParse(value);
      if (!result.success) return problem(problemsOf(where, prefix, result.error));
      if (problems.length) return;
      const { id, femaleId, createdAt, ...fields } = result.data;
      pending.sacs.push({
        ...fields,
        id: newId(id),
        femaleId: newId(femaleId),
        collectionId,
        createdAt: new Date(createdAt),
      });
    } else if (list === 'colonies') {
      const result = backupColony.safeParse(value);
      if (!result.success) return problem(problemsOf(where, prefix, result.error));
      if (problems.length) return;
      const { id, intervals, stock, createdAt, updatedAt, ...fields } = result.data;
      const colonyId = newId(id);
      pending.colonies.push({
        ...fields,
        id: colonyId,
        collectionId,
        feedEvery: intervals.feed,
        waterGelEvery: intervals.water_gel,
        cleanEvery: intervals.clean,
        splitEvery: intervals.split,
        createdAt: new Date(createdAt),
        updatedAt: new Date(updatedAt),
      });
      for (const s of stock) pending.stock.push({ ...s, colonyId });
    } else if (list === 'colonyStockChanges') {
      const result = backupStockChange.safeParse(value);
      if (!result.success) return problem(problemsOf(where, prefix, result.error));
      if (problems.length) return;
      const { id, colonyId, sourceEventId, at, ...fields } = result.data;
      pending.stockChanges.push({
        ...fields,
        id: newId(id),
        colonyId: newId(colonyId),
        // The round's event that took the stock: its restored copy has the id derived the same way.
        sourceEventId: sourceEventId ? newId(sourceEventId) : null,
        at: new Date(at),
      });
    } else if (list === 'chores') {
      const result = backupChore.safeParse(value);
      if (!result.success) return problem(problemsOf(where, prefix, result.error));
      if (problems.length) return;
      const { id, subjectId, clientRecordedAt, serverReceivedAt, effectiveAt, ...fields } =
        result.data;
      pending.chores.push({
        ...fields,
        id: newId(id),
        collectionId,
        // A colony follows its restored copy; a room is named by its name, which stays.
        subjectId: fields.subjectKind === 'colony' ? newId(subjectId) : subjectId,
        clientRecordedAt: new Date(clientRecordedAt),
        serverReceivedAt: new Date(serverReceivedAt),
        effectiveAt: new Date(effectiveAt),
      });
    } else if (list === 'roomTargets') {
      const result = backupRoomTargets.safeParse(value);
      if (!result.success) return problem(problemsOf(where, prefix, result.error));
      if (problems.length) return;
      const { updatedAt, ...fields } = result.data;
      pending.targets.push({ ...fields, collectionId, updatedAt: new Date(updatedAt) });
    } else if (list === 'climateReadings') {
      const result = backupReading.safeParse(value);
      if (!result.success) return problem(problemsOf(where, prefix, result.error));
      if (problems.length) return;
      const { id, takenAt, createdAt, ...fields } = result.data;
      pending.readings.push({
        ...fields,
        id: newId(id),
        collectionId,
        takenAt: new Date(takenAt),
        createdAt: new Date(createdAt),
      });
    } else if (list === 'salesSettings') {
      const result = backupSalesSettings.safeParse(value);
      if (!result.success) return problem(problemsOf(where, prefix, result.error));
      if (problems.length) return;
      if (counts.salesSettings > 1)
        return problem([{ path: prefix, message: 'A backup has one set of sales settings.' }]);
      // The public list's link belongs to the original: a restored list starts off, linkless.
      const { updatedAt, ...fields } = result.data;
      pending.sales.settings.push({
        ...fields,
        collectionId,
        availabilityOn: false,
        availabilityToken: null,
        updatedAt: new Date(updatedAt),
      });
    } else if (list === 'buyers') {
      const result = backupBuyer.safeParse(value);
      if (!result.success) return problem(problemsOf(where, prefix, result.error));
      if (problems.length) return;
      const { id, createdAt, updatedAt, ...fields } = result.data;
      pending.sales.buyers.push({
        ...fields,
        id: newId(id),
        collectionId,
        createdAt: new Date(createdAt),
        updatedAt: new Date(updatedAt),
      });
    } else if (list === 'saleListings') {
      const result = backupListing.safeParse(value);
      if (!result.success) return problem(problemsOf(where, prefix, result.error));
      if (problems.length) return;
      const { animalId, listedAt, updatedAt, ...fields } = result.data;
      pending.sales.listings.push({
        ...fields,
        animalId: newId(animalId),
        collectionId,
        listedAt: new Date(listedAt),
        updatedAt: new Date(updatedAt),
      });
    } else if (list === 'sales') {
      const result = backupSale.safeParse(value);
      if (!result.success) return problem(problemsOf(where, prefix, result.error));
      if (problems.length) return;
      const { id, buyerId, animals: held, ...f } = result.data;
      const saleId = newId(id);
      const at = (x: string | null) => (x ? new Date(x) : null);
      pending.sales.sales.push({
        ...f,
        id: saleId,
        collectionId,
        buyerId: newId(buyerId),
        shipCheckConfirmedAt: at(f.shipCheckConfirmedAt),
        shippedAt: at(f.shippedAt),
        endedAt: at(f.endedAt),
        createdAt: new Date(f.createdAt),
        updatedAt: new Date(f.updatedAt),
      });
      for (const h of held)
        pending.sales.saleAnimals.push({
          ...h,
          saleId,
          animalId: newId(h.animalId),
          releasedAt: at(h.releasedAt),
        });
    } else if (list === 'invoices') {
      const result = backupInvoice.safeParse(value);
      if (!result.success) return problem(problemsOf(where, prefix, result.error));
      if (problems.length) return;
      const { id, saleId, lines, ...f } = result.data;
      const invoiceId = newId(id);
      const at = (x: string | null) => (x ? new Date(x) : null);
      // The payment service's checkout session belongs to the original invoice: not kept.
      pending.sales.invoices.push({
        ...f,
        id: invoiceId,
        collectionId,
        saleId: newId(saleId),
        emailedAt: at(f.emailedAt),
        cancelledAt: at(f.cancelledAt),
        createdAt: new Date(f.createdAt),
        updatedAt: new Date(f.updatedAt),
      });
      for (const l of lines)
        pending.sales.lines.push({
          ...l,
          invoiceId,
          animalId: l.animalId ? newId(l.animalId) : null,
        });
    } else if (list === 'payments') {
      const result = backupPayment.safeParse(value);
      if (!result.success) return problem(problemsOf(where, prefix, result.error));
      if (problems.length) return;
      const { id, invoiceId, at, ...fields } = result.data;
      pending.sales.payments.push({
        ...fields,
        id: newId(id),
        invoiceId: newId(invoiceId),
        at: new Date(at),
      });
    } else {
      const result = backupEvent.safeParse(value);
      if (!result.success) return problem(problemsOf(where, prefix, result.error));
      if (problems.length) return;
      const {
        id,
        animalId,
        payload,
        photo,
        clientRecordedAt,
        clientSentAt,
        serverReceivedAt,
        effectiveAt,
        ...fields
      } = result.data;
      const eventId = newId(id);
      if (photo)
        pending.photos.push({
          row: { eventId, collectionId, photoKey: '' },
          photo: await startPhoto(photo, where),
        });
      pending.events.push({
        ...fields,
        id: eventId,
        collectionId,
        animalId: newId(animalId),
        payload: remapPayload(payload),
        clientRecordedAt: new Date(clientRecordedAt),
        clientSentAt: clientSentAt ? new Date(clientSentAt) : null,
        serverReceivedAt: new Date(serverReceivedAt),
        effectiveAt: new Date(effectiveAt),
      });
    }
    const size = {
      locations: pending.places.length,
      animals: pending.animals.length,
      eggSacs: pending.sacs.length,
      events: pending.events.length,
      colonies: pending.colonies.length,
      colonyStockChanges: pending.stockChanges.length,
      chores: pending.chores.length,
      roomTargets: pending.targets.length,
      climateReadings: pending.readings.length,
      salesSettings: pending.sales.settings.length,
      buyers: pending.sales.buyers.length,
      saleListings: pending.sales.listings.length,
      sales: pending.sales.sales.length,
      invoices: pending.sales.invoices.length,
      payments: pending.sales.payments.length,
    }[list];
    if (size >= BATCH[list]) await flush();
  }

  /** The projection the round is built from, folded a bounded number of events at a time. */
  async function refold() {
    let after: string | null = null;
    for (;;) {
      const page = await repo.animalEventCounts(tx, collectionId, after, 500);
      if (!page.length) return;
      let ids: string[] = [];
      let n = 0;
      for (const a of page) {
        if (ids.length && n + a.events > REFOLD_EVENTS) {
          await refoldStates(tx, collectionId, c.timeZone, ids);
          ids = [];
          n = 0;
        }
        ids.push(a.id);
        n += a.events;
      }
      await refoldStates(tx, collectionId, c.timeZone, ids);
      after = page.at(-1)!.id;
    }
  }

  return {
    async take(record: BackupRecord) {
      if (record.kind === 'single') await takeSingle(record.key, record.value);
      else await takeItem(record.list, record.index, record.value);
    },

    /** Waits for whatever is still being written, failed or not. */
    async settle() {
      await Promise.allSettled([writing, ...staging]);
    },

    async finish() {
      if (!singles.has('format'))
        throw new HttpError(422, 'invalid', 'This is not a Rackside backup file.');
      for (const key of ['version', 'exportedAt', 'collection'] as const) {
        if (!singles.has(key))
          problems.push({
            path: key,
            message: `The backup has no “${key}”: it is incomplete or damaged.`,
          });
      }
      if (problems.length) throw refusal(problems.slice(0, MAX_PROBLEMS));
      await flush();
      await writing;
      const stray = await repo.findStrayUndo(tx, collectionId);
      if (stray)
        throw new HttpError(
          422,
          'invalid',
          `An undo in the history of ${stray.code} refers to an entry this backup does not contain.`,
        );
      const longest = await repo.findAnimalWithMoreEvents(tx, collectionId, MAX_EVENTS_PER_ANIMAL);
      if (longest)
        throw new HttpError(
          422,
          'invalid',
          `${longest.code} has ${longest.events.toLocaleString('en')} history entries in this backup; Rackside keeps at most ${MAX_EVENTS_PER_ANIMAL.toLocaleString('en')} per animal.`,
        );
      await repo.setCollectionRules(tx, collectionId, rules);
      await refold();
      return { animals: counts.animals, events: counts.events };
    },
  };
}
