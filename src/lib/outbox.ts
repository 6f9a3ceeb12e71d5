import { itemWithOutcome, progressOf, withOutcome, type DayOutcome } from '#shared/domain/rounds/settle';
import type { EventResult, RecordedEvent } from '#shared/schemas/events';
import type { RoundResponse } from '#shared/schemas/rounds';
import {
  roundKey,
  type AttentionEntry,
  type CachedRound,
  type OutboxEntry,
  type RacksideDb,
  type RoundDay,
} from './db';

export interface Tap {
  userId: string;
  /** The display name shown beside the outcome ("done by Robin"). */
  byName: string;
  collectionId: string;
  animalName: string;
  event: RecordedEvent;
}

/**
 * A transaction's completion promise, marked as handled: when one request fails first, the
 * abort that follows must not surface again as an unhandled rejection.
 */
function completion(tx: { done: Promise<void> }): Promise<void> {
  const done = tx.done;
  done.catch(() => undefined);
  return done;
}

function outcomeOf(event: RecordedEvent, by: string): DayOutcome {
  const targetId = event.kind === 'void' ? (event.payload.targetId as string) : null;
  return { eventId: event.id, kind: event.kind, at: event.clientRecordedAt, by, voids: targetId };
}

/** What a tap changed on today's round: one item, and how many more tasks are done. */
export interface TapEffect {
  animalId: string;
  item: RoundResponse['items'][number];
  doneDelta: number;
  /** A hold that began with this tap withdraws tasks: fewer left to do (R18). */
  totalDelta: number;
}

/**
 * Records a tap: the event joins the outbox and today's cached round item shows its effect, in
 * ONE IndexedDB transaction, so the two can never disagree. Nothing here waits on the network.
 * Only the tapped item is read and written (progress is counted from the items when a round
 * is read), which keeps a tap close to a bare put (P1).
 * Returns the change (null when the animal is not on a cached round, e.g. a tap from a scan).
 */
export async function recordTap(db: RacksideDb, tap: Tap): Promise<TapEffect | null> {
  const tx = db.transaction(['outbox', 'roundItems'], 'readwrite');
  const done = completion(tx);
  const key = roundKey(tap.userId, tap.collectionId, 'today');
  const [stored] = await Promise.all([
    tx.objectStore('roundItems').get([key, tap.event.animalId]),
    tx.objectStore('outbox').add({ userId: tap.userId, collectionId: tap.collectionId, animalName: tap.animalName, byName: tap.byName, event: tap.event }),
  ]);
  let effect: TapEffect | null = null;
  if (stored) {
    const { item, doneDelta, totalDelta } = itemWithOutcome(stored.item, outcomeOf(tap.event, tap.byName), stored.timeZone);
    void tx.objectStore('roundItems').put({ ...stored, item });
    effect = { animalId: tap.event.animalId, item, doneDelta, totalDelta };
  }
  await done;
  return effect;
}

/**
 * Several taps at once (a tray of slings: "all ate except …"): every event joins the outbox and
 * every item shows its outcome in ONE transaction, so the tray is recorded whole or not at all.
 */
export async function recordTaps(db: RacksideDb, taps: readonly Tap[]): Promise<TapEffect[]> {
  const tx = db.transaction(['outbox', 'roundItems'], 'readwrite');
  const done = completion(tx);
  const items = tx.objectStore('roundItems');
  const effects = new Map<string, TapEffect>();
  for (const tap of taps) {
    const key = roundKey(tap.userId, tap.collectionId, 'today');
    const [stored] = await Promise.all([
      items.get([key, tap.event.animalId]),
      tx.objectStore('outbox').add({ userId: tap.userId, collectionId: tap.collectionId, animalName: tap.animalName, byName: tap.byName, event: tap.event }),
    ]);
    if (!stored) continue;
    const { item, doneDelta, totalDelta } = itemWithOutcome(stored.item, outcomeOf(tap.event, tap.byName), stored.timeZone);
    await items.put({ ...stored, item });
    const before = effects.get(tap.event.animalId);
    effects.set(tap.event.animalId, {
      animalId: tap.event.animalId,
      item,
      doneDelta: (before?.doneDelta ?? 0) + doneDelta,
      totalDelta: (before?.totalDelta ?? 0) + totalDelta,
    });
  }
  await done;
  return [...effects.values()];
}

/** A cached round with one tap's effect applied (the screen's copy, no storage involved). */
export function applyTapEffect(cached: CachedRound, effect: TapEffect): CachedRound {
  const items = cached.round.items.map((i) => (i.animal.id === effect.animalId ? effect.item : i));
  const progress = { done: cached.round.progress.done + effect.doneDelta, total: cached.round.progress.total + effect.totalDelta };
  return { ...cached, round: { ...cached.round, items, progress } };
}

/** The signed-in person's waiting taps, oldest first. Other people's taps on this phone stay put. */
export async function waitingTaps(db: RacksideDb, userId: string): Promise<OutboxEntry[]> {
  const all = await db.getAllFromIndex('outbox', 'byUser', userId);
  return all.sort((a, b) => a.seq! - b.seq!);
}

/**
 * The next batch to send: the oldest taps (an index keeps equal keys in primary-key order, so
 * these are the first `size` by seq), all of one collection (one request per collection).
 */
export async function nextBatch(db: RacksideDb, userId: string, size: number): Promise<OutboxEntry[]> {
  const oldest = await db.getAllFromIndex('outbox', 'byUser', userId, size);
  const first = oldest[0];
  return first ? oldest.filter((e) => e.collectionId === first.collectionId) : [];
}

/**
 * Applies the server's verdicts: accepted and duplicate taps leave the outbox; refused ones
 * move to "needs attention" in the same transaction. A tap with no verdict stays queued.
 */
export async function settleBatch(
  db: RacksideDb,
  sent: OutboxEntry[],
  results: EventResult[],
  now: Date,
) {
  const byId = new Map(sent.map((e) => [e.event.id, e]));
  const tx = db.transaction(['outbox', 'attention'], 'readwrite');
  const done = completion(tx);
  const outbox = tx.objectStore('outbox');
  const attention = tx.objectStore('attention');
  const work: Promise<unknown>[] = [];
  let acknowledged = 0;
  let refused = 0;
  for (const r of results) {
    const entry = byId.get(r.id);
    if (!entry) continue;
    byId.delete(r.id);
    work.push(outbox.delete(entry.seq!));
    if (r.status === 'rejected') {
      refused += 1;
      const row: AttentionEntry = {
        id: entry.event.id,
        userId: entry.userId,
        collectionId: entry.collectionId,
        animalName: entry.animalName,
        byName: entry.byName,
        event: entry.event,
        reason: r.reason ?? 'invalid',
        message: r.message ?? 'The server refused this tap.',
        refusedAt: now.toISOString(),
      };
      work.push(attention.put(row));
    } else acknowledged += 1;
  }
  await Promise.all([...work, done]);
  return { acknowledged, refused };
}

export const attentionOf = (db: RacksideDb, userId: string) =>
  db.getAllFromIndex('attention', 'byUser', userId);

/**
 * "Send again": the refused tap goes back to the outbox with the same event id, so the server
 * still stores it at most once, and leaves the attention list in the same transaction.
 * Returns false when it was no longer there (sent again or discarded on another tab).
 */
export async function resendAttention(db: RacksideDb, eventId: string): Promise<boolean> {
  const tx = db.transaction(['attention', 'outbox'], 'readwrite');
  const done = completion(tx);
  const attention = tx.objectStore('attention');
  const outbox = tx.objectStore('outbox');
  const [entry, queued] = await Promise.all([attention.get(eventId), outbox.index('byEventId').getKey(eventId)]);
  if (entry) {
    if (queued === undefined) {
      void outbox.add({ userId: entry.userId, collectionId: entry.collectionId, animalName: entry.animalName, byName: entry.byName ?? '', event: entry.event });
    }
    void attention.delete(eventId);
  }
  await done;
  return !!entry;
}

/** "Discard" (after the person confirmed): the refused tap is dropped for good. */
export const discardAttention = (db: RacksideDb, eventId: string) =>
  db.delete('attention', eventId);

const itemsOf = (key: string) => IDBKeyRange.bound([key, ''], [key, '\uffff']);

/**
 * Keeps the server's copy of a round, with this person's unsent taps applied on top so the
 * screen never loses a tap that is still on its way.
 */
export async function storeServerRound(db: RacksideDb, userId: string, collectionId: string, day: RoundDay, round: RoundResponse, fetchedAt: Date): Promise<CachedRound> {
  const tx = db.transaction(['outbox', 'rounds', 'roundItems'], 'readwrite');
  const done = completion(tx);
  const waiting = (await tx.objectStore('outbox').index('byUser').getAll(userId)).filter((e) => e.collectionId === collectionId).sort((a, b) => a.seq! - b.seq!);
  let merged = round;
  if (day === 'today') {
    const known = new Set(round.items.flatMap((i) => i.outcomes.map((o) => o.eventId)));
    for (const e of waiting) if (!known.has(e.event.id)) merged = withOutcome(merged, e.event.animalId, outcomeOf(e.event, e.byName));
  }
  const key = roundKey(userId, collectionId, day);
  const { items, progress: _counted, ...header } = merged;
  const itemStore = tx.objectStore('roundItems');
  const writes: Promise<unknown>[] = [itemStore.delete(itemsOf(key))];
  for (const item of items) writes.push(itemStore.put({ roundKey: key, animalId: item.animal.id, timeZone: merged.timeZone, item }));
  writes.push(tx.objectStore('rounds').put({ key, userId, collectionId, day, header, order: items.map((i) => i.animal.id), fetchedAt: fetchedAt.toISOString() }));
  await Promise.all([...writes, done]);
  return { key, userId, collectionId, day, round: merged, fetchedAt: fetchedAt.toISOString() };
}

/** The phone's copy of a round, put back together in walk order. */
export async function cachedRound(db: RacksideDb, userId: string, collectionId: string, day: RoundDay): Promise<CachedRound | undefined> {
  const key = roundKey(userId, collectionId, day);
  const tx = db.transaction(['rounds', 'roundItems']);
  const [stored, rows] = await Promise.all([tx.objectStore('rounds').get(key), tx.objectStore('roundItems').getAll(itemsOf(key))]);
  if (!stored) return undefined;
  const byAnimal = new Map(rows.map((r) => [r.animalId, r.item]));
  const items = stored.order.map((id) => byAnimal.get(id)).filter((i) => i !== undefined);
  return { key, userId, collectionId, day, round: { ...stored.header, items, progress: progressOf(items) }, fetchedAt: stored.fetchedAt };
}
