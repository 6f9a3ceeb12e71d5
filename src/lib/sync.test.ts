import 'fake-indexeddb/auto';
import { randomUUID } from 'node:crypto';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import type { EventBatchBody, EventResult, RecordedEvent } from '#shared/schemas/events';
import { openRacksideDb, type RacksideDb } from './db';
import { attentionOf, discardAttention, recordTap, resendAttention, waitingTaps } from './outbox';
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

describe('status before the first count', () => {
  it('says nothing is known until the outbox is read, then counts what waits', async () => {
    await queue(2);
    const engine = engineWith(acceptAll);
    expect(engine.status().phase).toBe('starting');
    await engine.refresh();
    expect(engine.status()).toMatchObject({ phase: 'idle', waiting: 2 });
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

/**
 * A server that stores each event id once (as the real one does, ON CONFLICT DO NOTHING) and,
 * in front of it, whatever a proxy or the CSRF check answers on a bad day.
 */
function fakeServer() {
  /** How many requests carried each id to the store (a second one is answered duplicate). */
  const stored = new Map<string, number>();
  const store = (body: EventBatchBody) =>
    answer(
      body.events.map((raw) => {
        const id = (raw as RecordedEvent).id;
        const copies = stored.get(id) ?? 0;
        stored.set(id, copies + 1);
        return { id, status: copies ? ('duplicate' as const) : ('accepted' as const) };
      }),
    );
  return { store, stored };
}

const CSRF_403 = {
  status: 403,
  body: { error: { code: 'csrf', message: 'This request came from another site.' } },
};
// A reverse proxy's page while the app restarts: HTML, not our JSON (the transport reads null).
const PROXY_404 = { status: 404, body: '<html><body><h1>404 Not Found</h1></body></html>' };

describe('answers without a verdict on each tap', () => {
  it('keep every tap through a CSRF 403 and a proxy’s HTML 404, then send each exactly once', async () => {
    const ids = await queue(5);
    const server = fakeServer();
    const answers: ({ status: number; body: unknown } | 'store')[] = [
      CSRF_403,
      PROXY_404,
      { status: 502, body: null },
      'store',
    ];
    const sent: string[][] = [];
    const engine = engineWith(async (_c, body) => {
      sent.push(body.events.map((e) => (e as RecordedEvent).id));
      const next = answers.shift() ?? 'store';
      return next === 'store' ? server.store(body) : next;
    }, 2);

    expect((await engine.flush()).ok).toBe(false);
    expect(engine.status()).toMatchObject({
      phase: 'failing',
      waiting: 5,
      attention: 0,
      failures: 1,
    });
    expect(engine.status().reason).toBe(
      'The server did not take the taps (error 403): This request came from another site.',
    );
    expect((await engine.flush()).ok).toBe(false);
    expect(engine.status()).toMatchObject({
      phase: 'failing',
      waiting: 5,
      attention: 0,
      failures: 2,
      reason: 'The server did not take the taps (error 404).',
    });
    expect((await engine.flush()).ok).toBe(false);
    expect(engine.status()).toMatchObject({
      waiting: 5,
      failures: 3,
      reason: 'Rackside’s server had a problem (error 502).',
    });
    // Nothing was ever moved aside, and the same taps were offered each time.
    expect(await attentionOf(db, USER)).toEqual([]);
    expect((await waitingTaps(db, USER)).map((w) => w.event.id)).toEqual(ids);

    expect(await engine.flush()).toEqual({ ok: true, acknowledged: 5, refused: 0 });
    expect(engine.status()).toMatchObject({
      phase: 'idle',
      waiting: 0,
      attention: 0,
      failures: 0,
      reason: null,
    });
    expect(await waitingTaps(db, USER)).toEqual([]);
    // Every tap reached the store, in exactly one request: none lost, none sent twice.
    expect([...server.stored.keys()].sort()).toEqual([...ids].sort());
    expect([...server.stored.values()]).toEqual([1, 1, 1, 1, 1]);
    expect(sent.slice(0, 3)).toEqual([ids.slice(0, 2), ids.slice(0, 2), ids.slice(0, 2)]);
  });

  it('keeps a batch whose verdicts were lost after the server stored it; the next try reads duplicates', async () => {
    const ids = await queue(3);
    const server = fakeServer();
    let first = true;
    const engine = engineWith(async (_c, body) => {
      const verdicts = server.store(body);
      if (first) {
        first = false;
        return PROXY_404; // stored, but the proxy lost the answer
      }
      return verdicts;
    });
    await engine.flush();
    expect((await waitingTaps(db, USER)).map((w) => w.event.id)).toEqual(ids);
    expect(await engine.flush()).toEqual({ ok: true, acknowledged: 3, refused: 0 });
    // Delivered twice, so the second answer was three duplicates: still acknowledged, not refused.
    expect([...server.stored.values()]).toEqual([2, 2, 2]);
    expect(await attentionOf(db, USER)).toEqual([]);
  });

  it('keeps taps on a 200 whose body is not a verdict list (a proxy’s page)', async () => {
    await queue(2);
    const engine = engineWith(async () => ({
      status: 200,
      body: '<html>Welcome to nginx!</html>',
    }));
    expect((await engine.flush()).ok).toBe(false);
    expect(engine.status()).toMatchObject({
      phase: 'failing',
      waiting: 2,
      attention: 0,
      reason: 'The server’s answer could not be read.',
    });
  });
});

describe('needs attention', () => {
  async function refuseOne() {
    const [id] = await queue(1);
    await engineWith(async () =>
      answer([
        {
          id: id!,
          status: 'rejected',
          reason: 'unknown_animal',
          message: 'This animal is not in this collection.',
        },
      ]),
    ).flush();
    expect((await attentionOf(db, USER)).map((a) => a.id)).toEqual([id]);
    return id!;
  }

  it('"Send again" puts the refused tap back in the outbox with the same id; the server then stores it once', async () => {
    const id = await refuseOne();
    expect(await resendAttention(db, id)).toBe(true);
    expect(await attentionOf(db, USER)).toEqual([]);
    const [back] = await waitingTaps(db, USER);
    expect(back).toMatchObject({
      userId: USER,
      collectionId: 'c1',
      animalName: 'Bramble',
      byName: 'Robin',
    });
    expect(back!.event.id).toBe(id);
    const server = fakeServer();
    const engine = engineWith(async (_c, body) => server.store(body));
    expect(engine.status().attention).toBe(0);
    expect(await engine.flush()).toEqual({ ok: true, acknowledged: 1, refused: 0 });
    expect([...server.stored.entries()]).toEqual([[id, 1]]);
    expect(await waitingTaps(db, USER)).toEqual([]);
    // Sending again what is already gone (another tab did it) changes nothing.
    expect(await resendAttention(db, id)).toBe(false);
    expect(await waitingTaps(db, USER)).toEqual([]);
  });

  it('"Send again" of a tap refused again lands it back in needs-attention, never lost', async () => {
    const id = await refuseOne();
    await resendAttention(db, id);
    await engineWith(async () =>
      answer([{ id, status: 'rejected', reason: 'unknown_animal', message: 'Still not here.' }]),
    ).flush();
    expect((await attentionOf(db, USER)).map((a) => [a.id, a.message])).toEqual([
      [id, 'Still not here.'],
    ]);
    expect(await waitingTaps(db, USER)).toEqual([]);
  });

  it('"Discard" drops the refused tap from the phone, and nothing sends it', async () => {
    const id = await refuseOne();
    await discardAttention(db, id);
    expect(await attentionOf(db, USER)).toEqual([]);
    expect(await waitingTaps(db, USER)).toEqual([]);
    let calls = 0;
    await engineWith(async (c, body) => {
      calls += 1;
      return acceptAll(c, body);
    }).flush();
    expect(calls).toBe(0);
  });
});
