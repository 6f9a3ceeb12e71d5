// S1 (docs/benchmarks.md, Budgets): the real client outbox and sync engine (on fake-indexeddb) against
// the real server and PostgreSQL, with faults injected between them — a CSRF 403 after a proxy
// changed the Host and a proxy's HTML 404 among them. Whatever happens on the wire, the
// database must end with exactly the events tapped (none lost, none doubled) and no tap is
// left in needs-attention, since no event was ever refused.
import 'fake-indexeddb/auto';
import { randomUUID } from 'node:crypto';
import type { AddressInfo } from 'node:net';
import { eq } from 'drizzle-orm';
import fc from 'fast-check';
import { afterAll, beforeAll, expect, it } from 'vitest';
import type { RecordedEvent } from '#shared/schemas/events';
import { roundResponse, type RoundResponse } from '#shared/schemas/rounds';
import { events } from '../../server/db/schema/animals';
import { rounds } from '../../server/db/schema/rounds';
import { openRacksideDb } from '../../src/lib/db';
import { attentionOf, recordTap, waitingTaps } from '../../src/lib/outbox';
import { cachedRound, storeServerRound } from '../../src/lib/round-cache';
import { createSyncEngine, type SyncTransport } from '../../src/lib/sync';
import { createAnimal, PASSWORD, signUp } from '../factories';
import { createTestContext, type TestContext } from '../setup/test-app';

const RUNS = 1000;
const FAULTS = [
  'none',
  'drop_request',
  'drop_response',
  'server_error',
  'timeout',
  'duplicate',
  'reorder',
  'csrf_403',
  'proxy_404',
  'proxy_404_after_commit',
] as const;
type Fault = (typeof FAULTS)[number];

let ctx: TestContext;
let server: ReturnType<TestContext['app']['listen']>;
let base: string;
let cookie: string;
let userId: string;
let collectionId: string;

async function post(path: string, body: unknown, extraHeaders: Record<string, string> = {}) {
  const res = await fetch(`${base}${path}`, {
    method: 'POST',
    headers: {
      'Content-Type': 'application/json',
      'X-Rackside-Client': '1',
      ...(cookie ? { Cookie: cookie } : {}),
      ...extraHeaders,
    },
    body: JSON.stringify(body),
  });
  return res;
}

beforeAll(async () => {
  ctx = await createTestContext();
  server = ctx.app.listen(0, '127.0.0.1');
  await new Promise((resolve) => server.once('listening', resolve));
  base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
  const keeper = await signUp(ctx);
  const res = await post('/api/auth/sign-in', { email: keeper.email, password: PASSWORD });
  cookie = res.headers.getSetCookie()[0]!.split(';')[0]!;
  userId = keeper.userId;
  collectionId = keeper.collectionId;
});
afterAll(async () => {
  await new Promise((resolve) => server.close(resolve));
  await ctx.close();
});

/**
 * A transport that misbehaves as the run says. Requests it lets go on "in the background"
 * (timeouts, reordered copies) are kept so the check can wait for them to land.
 */
function faultyTransport(faults: Fault[], background: Promise<unknown>[]): SyncTransport {
  let n = 0;
  const deliver = async (collection: string, body: unknown) => {
    const res = await post(`/api/collections/${collection}/events`, body);
    return { status: res.status, body: await res.json().catch(() => null) };
  };
  return async (collection, body) => {
    const fault = faults[n++ % faults.length]!;
    switch (fault) {
      case 'drop_request':
        throw new TypeError('Failed to fetch');
      case 'drop_response':
        await deliver(collection, body); // committed on the server, answer lost on the way back
        throw new TypeError('Failed to fetch');
      case 'server_error':
        return {
          status: 500,
          body: { error: { code: 'internal', message: 'Something went wrong on our side.' } },
        };
      case 'timeout':
        background.push(deliver(collection, body)); // still on its way when the phone gives up
        throw new DOMException('The operation timed out.', 'TimeoutError');
      case 'duplicate':
        await deliver(collection, body);
        return deliver(collection, body);
      case 'csrf_403': {
        // A proxy that rewrote the Host: the page's Origin no longer matches and the real
        // CSRF check answers 403 with no verdicts.
        const res = await post(`/api/collections/${collection}/events`, body, {
          Origin: 'https://rackside.example',
        });
        expect(res.status).toBe(403);
        return { status: res.status, body: await res.json().catch(() => null) };
      }
      case 'proxy_404_after_commit':
        await deliver(collection, body);
        return { status: 404, body: null }; // the proxy's HTML page, unreadable as JSON
      case 'proxy_404':
        return { status: 404, body: null };
      case 'reorder':
        // This copy arrives late, after requests sent after it; the phone saw no answer.
        background.push(
          new Promise((r) => setTimeout(r, 15)).then(() => deliver(collection, body)),
        );
        throw new TypeError('Failed to fetch');
      default:
        return deliver(collection, body);
    }
  };
}

const step = fc.oneof(
  fc.record({
    type: fc.constant('tap' as const),
    kind: fc.constantFrom(
      'ate',
      'refused',
      'prey_left_in',
      'prey_removed',
      'watered',
      // Enclosure care (§ Enclosure care) goes through the same outbox.
      'misted',
      'substrate_moistened',
      'spot_cleaned',
      'rehoused',
    ),
  }),
  fc.record({ type: fc.constant('undo' as const) }),
  fc.record({ type: fc.constant('sync' as const) }),
);

let run = 0;
it(`S1: exactly once under dropped, failed, timed-out, duplicated and reordered requests (${RUNS} runs)`, async () => {
  await fc.assert(
    fc.asyncProperty(
      fc.array(step, { minLength: 1, maxLength: 12 }),
      fc.array(fc.constantFrom(...FAULTS), { minLength: 1, maxLength: 8 }),
      fc.integer({ min: 1, max: 4 }),
      async (steps, faults, batchSize) => {
        run += 1;
        const animal = await createAnimal(ctx.database.db, collectionId, {
          labelCode: `S1-${run}`,
        });
        const db = await openRacksideDb(`s1-${randomUUID()}`);
        const background: Promise<unknown>[] = [];
        const engine = createSyncEngine({
          db: async () => db,
          userId,
          send: faultyTransport(faults, background),
          batchSize,
        });
        const tapped: string[] = [];
        const tap = async (kind: RecordedEvent['kind'], payload: Record<string, unknown> = {}) => {
          const event: RecordedEvent = {
            id: randomUUID(),
            animalId: animal.id,
            kind,
            payload,
            clientRecordedAt: new Date().toISOString(),
          };
          await recordTap(db, {
            userId,
            byName: 'Robin',
            collectionId,
            animalName: animal.name,
            event,
          });
          tapped.push(event.id);
          return event;
        };
        const meals: string[] = [];
        for (const s of steps) {
          if (s.type === 'tap') meals.push((await tap(s.kind)).id);
          else if (s.type === 'undo' && meals.length) await tap('void', { targetId: meals.pop()! });
          else if (s.type === 'sync') await engine.flush();
        }
        // The signal comes back for good: the page keeps syncing until the queue is empty.
        const healthy = createSyncEngine({
          db: async () => db,
          userId,
          send: faultyTransport(['none'], background),
          batchSize,
        });
        await healthy.flush();
        await Promise.all(background);

        const stored = await ctx.database.db
          .select({ id: events.id })
          .from(events)
          .where(eq(events.animalId, animal.id));
        expect(stored.map((r) => r.id).sort()).toEqual([...tapped].sort());
        expect(await waitingTaps(db, userId)).toEqual([]);
        expect(await attentionOf(db, userId)).toEqual([]);
        db.close();
      },
    ),
    { numRuns: RUNS },
  );
}, 600_000);

const CARE_TAPS = {
  mist: 'misted',
  spot_clean: 'spot_cleaned',
  rehouse: 'rehoused',
} as const;
type CareKind = keyof typeof CARE_TAPS;

const careStep = fc.oneof(
  fc.record({
    type: fc.constant('tap' as const),
    task: fc.constantFrom<CareKind>('mist', 'spot_clean', 'rehouse'),
  }),
  fc.record({ type: fc.constant('undo' as const) }),
  fc.record({ type: fc.constant('reload' as const) }),
  fc.record({ type: fc.constant('sync' as const) }),
);

async function todayRound(): Promise<RoundResponse> {
  const res = await fetch(`${base}/api/collections/${collectionId}/rounds/today`, {
    headers: { Cookie: cookie, 'X-Rackside-Client': '1' },
  });
  expect(res.status).toBe(200);
  return roundResponse.parse(await res.json());
}

let careRun = 0;
it('S1 for enclosure care: misting, spot-clean and rehouse taps on the cached round, reloaded, synced exactly once (30 runs)', async () => {
  await fc.assert(
    fc.asyncProperty(
      fc.array(careStep, { minLength: 1, maxLength: 10 }),
      fc.array(fc.constantFrom(...FAULTS), { minLength: 1, maxLength: 6 }),
      fc.integer({ min: 1, max: 3 }),
      async (steps, faults, batchSize) => {
        careRun += 1;
        // A juvenile of 60 mm that molted 20 days ago in a 100 × 100 mm tub (R22: rehouse),
        // misted every 2 days by its own setting, and fed yesterday (R21: the bolus).
        const animal = await createAnimal(ctx.database.db, collectionId, {
          labelCode: `S1C-${careRun}`,
          lifeStage: 'juvenile',
          sizeMm: 60,
          hasWaterDish: true,
          mistEveryDays: 2,
          spotCleanEveryDays: null,
          enclosureLengthMm: 100,
          enclosureWidthMm: 100,
        });
        const day = 86_400_000;
        const history = (kind: string, daysAgo: number, payload = {}) => ({
          id: randomUUID(),
          animalId: animal.id,
          kind,
          payload,
          clientRecordedAt: new Date(Date.now() - daysAgo * day).toISOString(),
        });
        const sent = await post(`/api/collections/${collectionId}/events`, {
          deviceId: 'history',
          clientSentAt: new Date().toISOString(),
          events: [history('molted', 20, { sizeMm: 60 }), history('watered', 1), history('ate', 1)],
        });
        expect(sent.status).toBe(200);
        // Today's round built afresh with this run's animal on it (a stored round keeps its
        // items through the day).
        await ctx.database.db.delete(rounds).where(eq(rounds.collectionId, collectionId));
        const item = (await todayRound()).items.find((i) => i.animal.id === animal.id)!;
        expect(item.tasks.map((t) => t.kind)).toEqual(['mist', 'spot_clean', 'rehouse']);

        const name = `s1c-${randomUUID()}`;
        let db = await openRacksideDb(name);
        await storeServerRound(db, userId, collectionId, 'today', await todayRound(), new Date());
        const background: Promise<unknown>[] = [];
        const engine = () =>
          createSyncEngine({
            db: async () => db,
            userId,
            send: faultyTransport(faults, background),
            batchSize,
          });
        const tapped: string[] = [];
        const live: { id: string; task: CareKind }[] = [];
        const tap = async (kind: RecordedEvent['kind'], payload: Record<string, unknown> = {}) => {
          const event: RecordedEvent = {
            id: randomUUID(),
            animalId: animal.id,
            kind,
            payload,
            clientRecordedAt: new Date().toISOString(),
          };
          await recordTap(db, {
            userId,
            byName: 'Robin',
            collectionId,
            animalName: animal.name,
            event,
          });
          tapped.push(event.id);
          return event;
        };
        for (const s of steps) {
          if (s.type === 'tap') {
            const payload = s.task === 'rehouse' ? { lengthMm: 200, widthMm: 150 } : {};
            live.push({ id: (await tap(CARE_TAPS[s.task], payload)).id, task: s.task });
          } else if (s.type === 'undo' && live.length)
            await tap('void', { targetId: live.pop()!.id });
          else if (s.type === 'reload') {
            // The page reloads: the copy on the phone is all there is until the next answer.
            db.close();
            db = await openRacksideDb(name);
          } else if (s.type === 'sync') await engine().flush();
        }
        // What the cached item shows, after a last reload, before anything more is sent: each
        // task done by the first live tap that settles it (a rehouse settles the spot-clean).
        db.close();
        db = await openRacksideDb(name);
        const expected = (task: CareKind) =>
          live.find((l) => l.task === task || (task === 'spot_clean' && l.task === 'rehouse'))
            ?.id ?? null;
        const shown = (round: RoundResponse | undefined) =>
          round!.items
            .find((i) => i.animal.id === animal.id)!
            .tasks.map((t) => [t.kind, t.done?.eventId ?? null]);
        const want = (['mist', 'spot_clean', 'rehouse'] as const).map((k) => [k, expected(k)]);
        expect(shown((await cachedRound(db, userId, collectionId, 'today'))!.round)).toEqual(want);

        await createSyncEngine({
          db: async () => db,
          userId,
          send: faultyTransport(['none'], background),
          batchSize,
        }).flush();
        await Promise.all(background);
        const stored = await ctx.database.db
          .select({ id: events.id })
          .from(events)
          .where(eq(events.animalId, animal.id));
        const historyIds = 3;
        expect(stored.length).toBe(tapped.length + historyIds);
        expect(stored.map((r) => r.id)).toEqual(expect.arrayContaining(tapped));
        expect(await waitingTaps(db, userId)).toEqual([]);
        expect(await attentionOf(db, userId)).toEqual([]);
        // The server's round, once everything is in, agrees with the phone's: the same tasks
        // done, each by one of the live taps that settle it (taps of one instant may be ordered
        // differently once the server corrects the phone's clock).
        const settles = (task: CareKind) =>
          live
            .filter((l) => l.task === task || (task === 'spot_clean' && l.task === 'rehouse'))
            .map((l) => l.id);
        for (const [kind, doneBy] of shown(await todayRound())) {
          if (expected(kind as CareKind) === null) expect(doneBy).toBeNull();
          else expect(settles(kind as CareKind)).toContain(doneBy);
        }
        db.close();
      },
    ),
    { numRuns: 30 },
  );
}, 600_000);
