import type { IDBPObjectStore, StoreNames } from 'idb';
import {
  itemWithOutcome,
  progressOf,
  withOutcome,
  type DayOutcome,
} from '#shared/domain/rounds/settle';
import type { RecordedEvent } from '#shared/schemas/events';
import type { RoundResponse } from '#shared/schemas/rounds';
import {
  transactionDone,
  type CachedRound,
  type RacksideDb,
  type RacksideSchema,
  type RoundDay,
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

export function outcomeOf(event: RecordedEvent, by: string): DayOutcome {
  const targetId = event.kind === 'void' ? (event.payload.targetId as string) : null;
  return { eventId: event.id, kind: event.kind, at: event.clientRecordedAt, by, voids: targetId };
}

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

/**
 * Keeps the server's copy of a round, with this person's unsent taps applied on top so the
 * screen never loses a tap that is still on its way.
 */
export async function storeServerRound(
  db: RacksideDb,
  userId: string,
  collectionId: string,
  day: RoundDay,
  round: RoundResponse,
  fetchedAt: Date,
): Promise<CachedRound> {
  const tx = db.transaction(['outbox', 'rounds', 'roundItems'], 'readwrite');
  const done = transactionDone(tx);
  const waiting = (await tx.objectStore('outbox').index('byUser').getAll(userId))
    .filter((e) => e.collectionId === collectionId)
    .sort((a, b) => a.seq! - b.seq!);
  let merged = round;
  if (day === 'today') {
    const known = new Set(round.items.flatMap((i) => i.outcomes.map((o) => o.eventId)));
    for (const e of waiting)
      if (!known.has(e.event.id))
        merged = withOutcome(merged, e.event.animalId, outcomeOf(e.event, e.byName));
  }
  const key = roundKey(userId, collectionId, day);
  const { items, progress: _counted, ...header } = merged;
  const itemStore = tx.objectStore('roundItems');
  const writes: Promise<unknown>[] = [itemStore.delete(itemsOf(key))];
  for (const item of items)
    writes.push(
      itemStore.put({ roundKey: key, animalId: item.animal.id, timeZone: merged.timeZone, item }),
    );
  writes.push(
    tx.objectStore('rounds').put({
      key,
      userId,
      collectionId,
      day,
      header,
      order: items.map((i) => i.animal.id),
      fetchedAt: fetchedAt.toISOString(),
    }),
  );
  await Promise.all([...writes, done]);
  return { key, userId, collectionId, day, round: merged, fetchedAt: fetchedAt.toISOString() };
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
  };
}
