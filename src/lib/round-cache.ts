import type { IDBPObjectStore, IDBPTransaction, StoreNames } from 'idb';
import { localDateOf } from '#shared/domain/local-dates';
import { itemWithOutcome, progressOf, withOutcome } from '#shared/domain/rounds/settle';
import { tapOutcome } from '#shared/domain/rounds/tap-outcome';
import type { RecordedEvent } from '#shared/schemas/events';
import type { RoundResponse } from '#shared/schemas/rounds';
import {
  transactionDone,
  type CachedRound,
  type RacksideDb,
  type RacksideSchema,
  type RoundDay,
  type UnsettledTap,
} from './db';

/** A round's key in `rounds`, and the first half of each of its items' keys in `roundItems`. */
export const roundKey = (userId: string, collectionId: string, day: RoundDay) =>
  `${userId}|${collectionId}|${day}`;

const itemsOf = (key: string) => IDBKeyRange.bound([key, ''], [key, '\uffff']);

/** A tap as the cached round sees it: whose round, which animal, what happened. */
interface TapOnRound {
  userId: string;
  collectionId: string;
  /** The display name shown beside the outcome ("done by Robin"). */
  byName: string;
  event: RecordedEvent;
}

/** What a tap changed on today's round: one item, and how many more tasks are done. */
export interface TapEffect {
  animalId: string;
  item: RoundResponse['items'][number];
  doneDelta: number;
  /** A hold that began with this tap withdraws tasks: fewer left to do (R18). */
  totalDelta: number;
}

export const outcomeOf = (event: RecordedEvent, by: string) => tapOutcome(event, by);

/** The items store inside a caller's read-write transaction (which may span other stores). */
type ItemStore = IDBPObjectStore<
  RacksideSchema,
  ArrayLike<StoreNames<RacksideSchema>>,
  'roundItems',
  'readwrite'
>;

/**
 * Writes a tap's effect on today's cached item through the caller's transaction — the tap's
 * own, which adds it to the outbox too, so the two commit together or not at all. Only the
 * tapped item is read and written (progress is counted from the items when a round is read),
 * which keeps a tap close to a bare put (P1). Null when the animal is not on a cached round
 * (e.g. a tap from a scan).
 */
export async function applyTapToCachedItem(
  items: ItemStore,
  tap: TapOnRound,
): Promise<TapEffect | null> {
  const stored = await items.get([
    roundKey(tap.userId, tap.collectionId, 'today'),
    tap.event.animalId,
  ]);
  if (!stored) return null;
  const { item, doneDelta, totalDelta } = itemWithOutcome(
    stored.item,
    outcomeOf(tap.event, tap.byName),
    stored.timeZone,
  );
  // Not awaited: requests run in order, and the caller waits for the transaction's end, which
  // also reports a failed put (or this put aborted by the outbox write failing).
  items.put({ ...stored, item }).catch(() => undefined);
  return { animalId: tap.event.animalId, item, doneDelta, totalDelta };
}

/** A cached round with one tap's effect applied (the screen's copy, no storage involved). */
export function applyTapEffect(cached: CachedRound, effect: TapEffect): CachedRound {
  const items = cached.round.items.map((i) => (i.animal.id === effect.animalId ? effect.item : i));
  const progress = {
    done: cached.round.progress.done + effect.doneDelta,
    total: cached.round.progress.total + effect.totalDelta,
  };
  return { ...cached, round: { ...cached.round, items, progress } };
}

type RoundTx = IDBPTransaction<RacksideSchema, ('outbox' | 'rounds' | 'roundItems')[], 'readwrite'>;

/** Replaces a stored round (header and items) inside the caller's transaction. */
function writeRound(tx: RoundTx, cached: CachedRound): Promise<unknown>[] {
  const { items, progress: _counted, ...header } = cached.round;
  const itemStore = tx.objectStore('roundItems');
  const writes: Promise<unknown>[] = [itemStore.delete(itemsOf(cached.key))];
  for (const item of items)
    writes.push(
      itemStore.put({
        roundKey: cached.key,
        animalId: item.animal.id,
        timeZone: header.timeZone,
        item,
      }),
    );
  writes.push(
    tx.objectStore('rounds').put({
      key: cached.key,
      userId: cached.userId,
      collectionId: cached.collectionId,
      day: cached.day,
      header,
      order: items.map((i) => i.animal.id),
      fetchedAt: cached.fetchedAt,
      ...(cached.builtOnPhone ? { builtOnPhone: true } : {}),
      ...(cached.unsettled?.length ? { unsettled: cached.unsettled } : {}),
    }),
  );
  return writes;
}

/**
 * Taps the phone showed on its own copy of a day that the server's round for the same day does
 * not hold (an animal the server has no card for, a tap it refused): kept and shown, never
 * silently dropped (issue 22, point 3).
 */
async function unsettledTaps(
  tx: RoundTx,
  key: string,
  round: RoundResponse,
  waiting: ReadonlySet<string>,
): Promise<UnsettledTap[]> {
  const before = await tx.objectStore('rounds').get(key);
  if (!before || before.header.date !== round.date) return [];
  const known = new Set(round.items.flatMap((i) => i.outcomes.map((o) => o.eventId)));
  const lost: UnsettledTap[] = (before.unsettled ?? []).filter((t) => !known.has(t.eventId));
  for (const { item } of await tx.objectStore('roundItems').getAll(itemsOf(key)))
    for (const o of item.outcomes)
      if (!known.has(o.eventId) && !waiting.has(o.eventId))
        lost.push({
          eventId: o.eventId,
          animalName: item.animal.name,
          labelCode: item.animal.labelCode,
          kind: o.kind,
          at: o.at,
        });
  return lost;
}

/**
 * Keeps the server's copy of a round, with this person's unsent taps of that day applied on
 * top so the screen never loses a tap that is still on its way.
 */
export async function storeServerRound(
  db: RacksideDb,
  userId: string,
  collectionId: string,
  day: RoundDay,
  round: RoundResponse,
  fetchedAt: Date,
  /**
   * Called with the round as it will be stored, before its write commits: the screen can show it
   * a write earlier (P3). A tap made meanwhile queues behind this transaction, so it lands on the
   * stored copy as on the shown one.
   */
  onMerged?: (cached: CachedRound) => void,
): Promise<CachedRound> {
  const tx = db.transaction(['outbox', 'rounds', 'roundItems'], 'readwrite');
  const done = transactionDone(tx);
  const key = roundKey(userId, collectionId, day);
  // A tap belongs to the day it was made on: yesterday's taps still waiting for a signal
  // never count on today's round.
  const waiting = (await tx.objectStore('outbox').index('byUser').getAll(userId))
    .filter(
      (e) =>
        e.collectionId === collectionId &&
        localDateOf(new Date(e.event.clientRecordedAt), round.timeZone) === round.date,
    )
    .sort((a, b) => a.seq! - b.seq!);
  let merged = round;
  let unsettled: UnsettledTap[] = [];
  if (day === 'today') {
    const known = new Set(round.items.flatMap((i) => i.outcomes.map((o) => o.eventId)));
    for (const e of waiting)
      if (!known.has(e.event.id))
        merged = withOutcome(merged, e.event.animalId, outcomeOf(e.event, e.byName));
    unsettled = await unsettledTaps(tx, key, round, new Set(waiting.map((e) => e.event.id)));
  }
  const cached: CachedRound = {
    key,
    userId,
    collectionId,
    day,
    round: merged,
    fetchedAt: fetchedAt.toISOString(),
    ...(unsettled.length ? { unsettled } : {}),
  };
  const writes = writeRound(tx, cached);
  onMerged?.(cached);
  await Promise.all([...writes, done]);
  return cached;
}

/**
 * Keeps a round the phone built itself (day-on-phone.ts): its taps are already in it, and
 * `dataAsOf` is when the state it was built from left the server.
 */
export async function storePhoneRound(
  db: RacksideDb,
  userId: string,
  collectionId: string,
  day: RoundDay,
  round: RoundResponse,
  dataAsOf: string,
): Promise<CachedRound> {
  const tx = db.transaction(['outbox', 'rounds', 'roundItems'], 'readwrite');
  const done = transactionDone(tx);
  const key = roundKey(userId, collectionId, day);
  const cached: CachedRound = {
    key,
    userId,
    collectionId,
    day,
    round,
    fetchedAt: dataAsOf,
    builtOnPhone: true,
  };
  await Promise.all([...writeRound(tx, cached), done]);
  return cached;
}

/** The phone's copy of a round, put back together in walk order. */
export async function cachedRound(
  db: RacksideDb,
  userId: string,
  collectionId: string,
  day: RoundDay,
): Promise<CachedRound | undefined> {
  const key = roundKey(userId, collectionId, day);
  const tx = db.transaction(['rounds', 'roundItems']);
  const [stored, rows] = await Promise.all([
    tx.objectStore('rounds').get(key),
    tx.objectStore('roundItems').getAll(itemsOf(key)),
  ]);
  if (!stored) return undefined;
  const byAnimal = new Map(rows.map((r) => [r.animalId, r.item]));
  const items = stored.order.map((id) => byAnimal.get(id)).filter((i) => i !== undefined);
  return {
    key,
    userId,
    collectionId,
    day,
    round: { ...stored.header, items, progress: progressOf(items) },
    fetchedAt: stored.fetchedAt,
    ...(stored.builtOnPhone ? { builtOnPhone: true } : {}),
    ...(stored.unsettled ? { unsettled: stored.unsettled } : {}),
  };
}
