import 'fake-indexeddb/auto';
import { randomUUID } from 'node:crypto';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import type { EventBatchBody, EventResult, RecordedEvent } from '#shared/schemas/events';
import { openRacksideDb, type RacksideDb } from './db';
import { attentionOf, recordTap, waitingTaps } from './outbox';
import { backoffDelay, createSyncEngine, type SyncTransport } from './sync';

const USER = 'user-1';
let db: RacksideDb;

async function queue(n: number, collectionId = 'c1') {
  const ids: string[] = [];
  for (let i = 0; i < n; i++) {
    const event: RecordedEvent = {
      id: randomUUID(),
      animalId: randomUUID(),
      kind: 'watered',
      payload: {},
      clientRecordedAt: new Date().toISOString(),
    };
    ids.push(event.id);
    await recordTap(db, {
      userId: USER,
      byName: 'Robin',
      collectionId,
      animalName: 'Bramble',
      event,
    });
  }
  return ids;
}

const answer = (results: EventResult[]) => ({
  status: 200,
  body: { serverReceivedAt: new Date().toISOString(), offsetMs: 0, results },
});
const acceptAll: SyncTransport = async (_c, body) =>
  answer(body.events.map((e) => ({ id: (e as RecordedEvent).id, status: 'accepted' as const })));
const engineWith = (send: SyncTransport, batchSize?: number) =>
  createSyncEngine({ db: async () => db, userId: USER, send, batchSize });

beforeEach(async () => {
  db = await openRacksideDb(`test-${randomUUID()}`);
});
afterEach(() => db.close());

describe('backoff', () => {
  it('grows exponentially with full jitter, is capped, and is zero after success', () => {
    const top = () => 0.999_999;
    const delays = [1, 2, 3, 4, 5].map((n) => backoffDelay(n, top));
    expect(delays).toEqual([1999, 3999, 7999, 15999, 31999]);
    expect(backoffDelay(30, top)).toBe(299_999); // capped at 5 minutes
    expect(backoffDelay(3, () => 0)).toBe(0); // full jitter: anywhere from zero
    expect(backoffDelay(0, top)).toBe(0);
  });

  it('counts failures while the server is unreachable and resets them once a flush succeeds', async () => {
    await queue(2);
    let reachable = false;
    const engine = engineWith(async (c, body) => {
      if (!reachable) throw new TypeError('Failed to fetch');
      return acceptAll(c, body);
    });
    await engine.flush();
    await engine.flush();
    expect(engine.status()).toMatchObject({ phase: 'offline', failures: 2, waiting: 2 });
    reachable = true;
    expect(await engine.flush()).toEqual({ ok: true, acknowledged: 2, refused: 0 });
    expect(engine.status()).toMatchObject({ phase: 'idle', failures: 0, waiting: 0 });
    expect(engine.status().lastSavedAt).not.toBeNull();
  });
});

describe('flush', () => {
  it('sends in batches, oldest first, and empties the outbox', async () => {
    const ids = await queue(5);
    const seen: string[][] = [];
    const engine = engineWith(async (c, body) => {
      seen.push(body.events.map((e) => (e as RecordedEvent).id));
      return acceptAll(c, body);
    }, 2);
    await engine.flush();
    expect(seen).toEqual([ids.slice(0, 2), ids.slice(2, 4), ids.slice(4)]);
    expect(await waitingTaps(db, USER)).toEqual([]);
  });

  it('sends one collection per request', async () => {
    await queue(2, 'c1');
    await queue(1, 'c2');
    const collections: string[] = [];
    await engineWith(async (c, body) => {
      collections.push(c);
      return acceptAll(c, body);
    }).flush();
    expect(collections).toEqual(['c1', 'c2']);
  });

  it('keeps unacknowledged taps when the answer is lost or the server fails', async () => {
    const ids = await queue(3);
    const engine = engineWith(async () => ({
      status: 500,
      body: { error: { code: 'internal', message: 'x' } },
    }));
    expect((await engine.flush()).ok).toBe(false);
    expect(engine.status().phase).toBe('failing');
    expect((await waitingTaps(db, USER)).map((w) => w.event.id)).toEqual(ids);
  });

  it('moves refused taps to needs-attention and never drops them', async () => {
    const [a, b] = await queue(2);
    await engineWith(async () =>
      answer([
        { id: a!, status: 'accepted' },
        {
          id: b!,
          status: 'rejected',
          reason: 'unknown_animal',
          message: 'This animal is not in this collection.',
        },
      ]),
    ).flush();
    expect(await waitingTaps(db, USER)).toEqual([]);
    expect((await attentionOf(db, USER)).map((x) => [x.id, x.reason])).toEqual([
      [b, 'unknown_animal'],
    ]);
  });

  it('keeps the queue and stops on 401 until the person signs in again', async () => {
    await queue(2);
    let calls = 0;
    const engine = engineWith(async () => {
      calls += 1;
      return { status: 401, body: { error: { code: 'signed_out', message: 'Please sign in.' } } };
    });
    expect((await engine.flush()).ok).toBe(false);
    expect(calls).toBe(1);
    expect(engine.status()).toMatchObject({ phase: 'signed_out', waiting: 2 });
  });

  it('halves the batch after a 413', async () => {
    await queue(4);
    const sizes: number[] = [];
    await engineWith(async (c, body: EventBatchBody) => {
      sizes.push(body.events.length);
      return body.events.length > 1 ? { status: 413, body: null } : acceptAll(c, body);
    }, 4).flush();
    expect(sizes).toEqual([4, 2, 1, 1, 1, 1]);
    expect(await waitingTaps(db, USER)).toEqual([]);
  });

  it('shows a collection that refuses the person (cover over) as needs-attention', async () => {
    await queue(2);
    await engineWith(async () => ({
      status: 403,
      body: { error: { code: 'cover_not_running', message: 'Your cover ended.' } },
    })).flush();
    expect((await attentionOf(db, USER)).map((x) => [x.reason, x.message])).toEqual([
      ['collection_refused', 'Your cover ended.'],
      ['collection_refused', 'Your cover ended.'],
    ]);
  });

  it('joins a running flush instead of sending twice', async () => {
    await queue(1);
    let calls = 0;
    const engine = engineWith(async (c, body) => {
      calls += 1;
      await new Promise((r) => setTimeout(r, 10));
      return acceptAll(c, body);
    });
    await Promise.all([engine.flush(), engine.flush()]);
    expect(calls).toBe(1);
  });
});
