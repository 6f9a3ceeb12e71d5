import type { ChoreResult, RecordedChore } from '#shared/schemas/chores';
import { transactionDone, type ChoreEntry, type RacksideDb } from './db';

// The chores outbox (decision 020): care of things that are not animals, kept on the phone
// and sent by the same sync engine as the round's taps (sync.ts), with the same rule — a chore
// leaves "waiting" only with the server's verdict on that very chore.

/** How long a sent chore is kept to show it done (the next fetch of its subject has it). */
const KEEP_SENT_MS = 3 * 86_400_000;

/** Records a chore; nothing here waits on the network. */
export async function recordChore(
  db: RacksideDb,
  entry: Omit<ChoreEntry, 'state'> & { chore: RecordedChore },
): Promise<void> {
  await db.add('chores', { ...entry, state: 'waiting' });
}

export const waitingChoreCount = (db: RacksideDb, userId: string) =>
  db.countFromIndex('chores', 'byUserState', [userId, 'waiting']);

/** The oldest waiting chores of one collection, in the order they were done. */
export async function nextChoreBatch(
  db: RacksideDb,
  userId: string,
  size: number,
): Promise<ChoreEntry[]> {
  const waiting = (await db.getAllFromIndex('chores', 'byUserState', [userId, 'waiting'])).sort(
    (a, b) => a.chore.clientRecordedAt.localeCompare(b.chore.clientRecordedAt),
  );
  const first = waiting[0];
  return first ? waiting.filter((e) => e.collectionId === first.collectionId).slice(0, size) : [];
}

/**
 * Applies the server's verdicts: accepted and duplicate chores are sent; refused ones keep the
 * server's words. A chore without a verdict stays waiting. Sent chores past their keeping
 * time go in the same transaction.
 */
export async function settleChores(
  db: RacksideDb,
  sent: ChoreEntry[],
  results: ChoreResult[],
  now: Date,
) {
  const byId = new Map(sent.map((e) => [e.id, e]));
  const tx = db.transaction('chores', 'readwrite');
  const done = transactionDone(tx);
  const store = tx.objectStore('chores');
  const work: Promise<unknown>[] = [];
  let acknowledged = 0;
  let refused = 0;
  for (const r of results) {
    const entry = byId.get(r.id);
    if (!entry) continue;
    byId.delete(r.id);
    const settledAt = now.toISOString();
    if (r.status === 'rejected') {
      refused += 1;
      work.push(
        store.put({ ...entry, state: 'refused', message: r.message ?? 'Not saved.', settledAt }),
      );
    } else {
      acknowledged += 1;
      work.push(store.put({ ...entry, state: 'sent', settledAt }));
    }
  }
  const old = new Date(now.getTime() - KEEP_SENT_MS).toISOString();
  for (const e of await store.index('byUserState').getAll([sent[0]?.userId ?? '', 'sent']))
    if ((e.settledAt ?? '') < old) work.push(store.delete(e.id));
  await Promise.all([...work, done]);
  return { acknowledged, refused };
}

/** A collection's chores done on a local date on this phone, whatever their state. */
export const choresOn = (db: RacksideDb, collectionId: string, localDate: string) =>
  db.getAllFromIndex('chores', 'byCollectionDate', [collectionId, localDate]);

export const discardChore = (db: RacksideDb, id: string) => db.delete('chores', id);
