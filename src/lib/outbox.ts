import { withOutcome, type DayOutcome } from '#shared/domain/rounds/settle';
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

/**
 * Records a tap: the event joins the outbox and today's cached round shows its effect, in ONE
 * IndexedDB transaction, so the two can never disagree. Nothing here waits on the network.
 * Returns the updated round (null when no round is cached, e.g. a tap from a scan).
 */
export async function recordTap(db: RacksideDb, tap: Tap): Promise<RoundResponse | null> {
  const tx = db.transaction(['outbox', 'rounds'], 'readwrite');
  const done = completion(tx);
  const rounds = tx.objectStore('rounds');
  const key = roundKey(tap.userId, tap.collectionId, 'today');
  const [cached] = await Promise.all([
    rounds.get(key),
    tx
      .objectStore('outbox')
      .add({
        userId: tap.userId,
        collectionId: tap.collectionId,
        animalName: tap.animalName,
        byName: tap.byName,
        event: tap.event,
      }),
  ]);
  let round: RoundResponse | null = null;
  if (cached) {
    round = withOutcome(cached.round, tap.event.animalId, outcomeOf(tap.event, tap.byName));
    void rounds.put({ ...cached, round });
  }
  await done;
  return round;
}

/** The signed-in person's waiting taps, oldest first. Other people's taps on this phone stay put. */
export async function waitingTaps(db: RacksideDb, userId: string): Promise<OutboxEntry[]> {
  const all = await db.getAllFromIndex('outbox', 'byUser', userId);
  return all.sort((a, b) => a.seq! - b.seq!);
}

/** The next batch to send: the oldest taps, all of one collection (one request per collection). */
export async function nextBatch(
  db: RacksideDb,
  userId: string,
  size: number,
): Promise<OutboxEntry[]> {
  const waiting = await waitingTaps(db, userId);
  const first = waiting[0];
  if (!first) return [];
  return waiting.filter((e) => e.collectionId === first.collectionId).slice(0, size);
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
  reasonOverride?: AttentionEntry['reason'],
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
        event: entry.event,
        reason: reasonOverride ?? r.reason ?? 'invalid',
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
export const dismissAttention = (db: RacksideDb, eventId: string) =>
  db.delete('attention', eventId);

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
) {
  const tx = db.transaction(['outbox', 'rounds'], 'readwrite');
  const done = completion(tx);
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
  const cached: CachedRound = {
    key: roundKey(userId, collectionId, day),
    userId,
    collectionId,
    day,
    round: merged,
    fetchedAt: fetchedAt.toISOString(),
  };
  await Promise.all([tx.objectStore('rounds').put(cached), done]);
  return cached;
}

export const cachedRound = (db: RacksideDb, userId: string, collectionId: string, day: RoundDay) =>
  db.get('rounds', roundKey(userId, collectionId, day));
