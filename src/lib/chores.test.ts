import 'fake-indexeddb/auto';
import { randomUUID } from 'node:crypto';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { choresOn, nextChoreBatch, recordChore, settleChores, waitingChoreCount } from './chores';
import { openRacksideDb, type RacksideDb } from './db';
import { createSyncEngine } from './sync';

const USER = 'user-1';
let db: RacksideDb;

async function chore(
  kind: string,
  at: string,
  { collectionId = 'c1', localDate = '2026-12-03' } = {},
) {
  const id = randomUUID();
  await recordChore(db, {
    id,
    userId: USER,
    collectionId,
    localDate,
    chore: {
      id,
      subjectKind: 'colony',
      subjectId: 'colony-1',
      kind,
      clientRecordedAt: at,
      payload: {},
    },
  });
  return id;
}

beforeEach(async () => {
  db = await openRacksideDb(`chores-${randomUUID()}`);
});
afterEach(() => db.close());

describe('the chores outbox', () => {
  it('sends the oldest chores of one collection at a time, in the order they were done', async () => {
    const second = await chore('clean', '2026-12-03T10:00:00.000Z');
    const first = await chore('feed', '2026-12-03T09:00:00.000Z');
    await chore('feed', '2026-12-03T08:00:00.000Z', { collectionId: 'c2' });
    const batch = await nextChoreBatch(db, USER, 10);
    expect(batch.map((e) => e.collectionId)).toEqual(['c2']);
    await settleChores(db, batch, [{ id: batch[0]!.id, status: 'accepted' }], new Date());
    expect((await nextChoreBatch(db, USER, 10)).map((e) => e.id)).toEqual([first, second]);
    expect(await waitingChoreCount(db, USER)).toBe(2);
  });

  it('settles only chores with a verdict: sent, refused with its words, or still waiting', async () => {
    const ok = await chore('feed', '2026-12-03T09:00:00.000Z');
    const again = await chore('water_gel', '2026-12-03T09:01:00.000Z');
    const bad = await chore('clean', '2026-12-03T09:02:00.000Z');
    const silent = await chore('split', '2026-12-03T09:03:00.000Z');
    const batch = await nextChoreBatch(db, USER, 10);
    const settled = await settleChores(
      db,
      batch,
      [
        { id: ok, status: 'accepted' },
        { id: again, status: 'duplicate' },
        {
          id: bad,
          status: 'rejected',
          reason: 'unknown_subject',
          message: 'That colony is not in this collection any more.',
        },
        { id: 'not-sent', status: 'accepted' },
      ],
      new Date('2026-12-03T09:05:00.000Z'),
    );
    expect(settled).toEqual({ acknowledged: 2, refused: 1 });
    const byId = new Map((await choresOn(db, 'c1', '2026-12-03')).map((e) => [e.id, e]));
    expect(byId.get(ok)!.state).toBe('sent');
    expect(byId.get(again)!.state).toBe('sent');
    expect(byId.get(bad)).toMatchObject({
      state: 'refused',
      message: 'That colony is not in this collection any more.',
    });
    expect(byId.get(silent)!.state).toBe('waiting');
  });

  it('forgets sent chores after three days, never waiting ones', async () => {
    const old = await chore('feed', '2026-11-28T09:00:00.000Z', { localDate: '2026-11-28' });
    await settleChores(
      db,
      await nextChoreBatch(db, USER, 10),
      [{ id: old, status: 'accepted' }],
      new Date('2026-11-28T10:00:00.000Z'),
    );
    const waiting = await chore('feed', '2026-12-03T09:00:00.000Z');
    await settleChores(
      db,
      await nextChoreBatch(db, USER, 10),
      [],
      new Date('2026-12-03T10:00:00.000Z'),
    );
    expect(await choresOn(db, 'c1', '2026-11-28')).toEqual([]);
    expect((await choresOn(db, 'c1', '2026-12-03')).map((e) => e.id)).toEqual([waiting]);
  });

  it('rides the sync engine: counted as waiting, kept on an answer without verdicts', async () => {
    await chore('feed', '2026-12-03T09:00:00.000Z');
    const statuses: number[] = [];
    const engine = createSyncEngine({
      db: async () => db,
      userId: USER,
      send: () => Promise.reject(new Error('no taps')),
      sendChores: async () => {
        statuses.push(502);
        return { status: 502, body: '<html>Bad gateway</html>' };
      },
    });
    const result = await engine.flush();
    expect(result.ok).toBe(false);
    expect(engine.status()).toMatchObject({ phase: 'failing', waiting: 1 });
    expect(statuses).toEqual([502]);
    expect(await waitingChoreCount(db, USER)).toBe(1);
  });
});
