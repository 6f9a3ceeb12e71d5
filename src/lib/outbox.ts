import type { EventResult, RecordedEvent } from '#shared/schemas/events';
import { transactionDone, type AttentionEntry, type OutboxEntry, type RacksideDb } from './db';
import { applyTapToCachedItem, type TapEffect } from './round-cache';

export interface Tap {
  userId: string;
  /** The display name shown beside the outcome ("done by Robin"). */
  byName: string;
  collectionId: string;
  animalName: string;
  event: RecordedEvent;
}

const entryOf = (tap: Tap): OutboxEntry => ({
  userId: tap.userId,
  collectionId: tap.collectionId,
  animalName: tap.animalName,
  byName: tap.byName,
  event: tap.event,
});

/**
 * Records a tap: the event joins the outbox and today's cached round item shows its effect
 * (`round-cache.ts`), in ONE IndexedDB transaction, so the two can never disagree. Nothing here
 * waits on the network. Returns the change (null when the animal is not on a cached round).
 */
export async function recordTap(db: RacksideDb, tap: Tap): Promise<TapEffect | null> {
  const tx = db.transaction(['outbox', 'roundItems'], 'readwrite');
  const done = transactionDone(tx);
  const [effect] = await Promise.all([
    applyTapToCachedItem(tx.objectStore('roundItems'), tap),
    tx.objectStore('outbox').add(entryOf(tap)),
  ]);
  await done;
  return effect;
}

/**
 * Several taps at once (a tray of slings: "all ate except …"): every event joins the outbox and
 * every item shows its outcome in ONE transaction, so the tray is recorded whole or not at all.
 */
export async function recordTaps(db: RacksideDb, taps: readonly Tap[]): Promise<TapEffect[]> {
  const tx = db.transaction(['outbox', 'roundItems'], 'readwrite');
  const done = transactionDone(tx);
  const effects = new Map<string, TapEffect>();
  for (const tap of taps) {
    const [effect] = await Promise.all([
      applyTapToCachedItem(tx.objectStore('roundItems'), tap),
      tx.objectStore('outbox').add(entryOf(tap)),
    ]);
    if (!effect) continue;
    const before = effects.get(effect.animalId);
    effects.set(effect.animalId, {
      ...effect,
      doneDelta: (before?.doneDelta ?? 0) + effect.doneDelta,
      totalDelta: (before?.totalDelta ?? 0) + effect.totalDelta,
    });
  }
  await done;
  return [...effects.values()];
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
export async function nextBatch(
  db: RacksideDb,
  userId: string,
  size: number,
): Promise<OutboxEntry[]> {
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
  const done = transactionDone(tx);
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
  const done = transactionDone(tx);
  const attention = tx.objectStore('attention');
  const outbox = tx.objectStore('outbox');
  const [entry, queued] = await Promise.all([
    attention.get(eventId),
    outbox.index('byEventId').getKey(eventId),
  ]);
  if (entry) {
    if (queued === undefined) {
      void outbox.add({
        userId: entry.userId,
        collectionId: entry.collectionId,
        animalName: entry.animalName,
        byName: entry.byName ?? '',
        event: entry.event,
      });
    }
    void attention.delete(eventId);
  }
  await done;
  return !!entry;
}

/** "Discard" (after the person confirmed): the refused tap is dropped for good. */
export const discardAttention = (db: RacksideDb, eventId: string) =>
  db.delete('attention', eventId);
