// A room's daily reading rides the chores outbox (decisions 019 and 020): the real client chore
// outbox and sync engine (on fake-indexeddb) against the real server and PostgreSQL, with
// faults between them and reloads. Every reading typed ends up once as a chore and once as the
// room's typed climate reading (same id, taken at the chore's time), whatever was re-sent; a
// room that is not among the places is refused by name; a covering helper may record a room's
// reading but never a colony's care.
import 'fake-indexeddb/auto';
import { randomUUID } from 'node:crypto';
import type { AddressInfo } from 'node:net';
import { eq, inArray } from 'drizzle-orm';
import fc from 'fast-check';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { localDateOf } from '#shared/domain/local-dates';
import { climateReadings } from '../../server/db/schema/climate';
import { locations } from '../../server/db/schema/collections';
import { chores } from '../../server/db/schema/colonies';
import { choresOn, recordChore, waitingChoreCount } from '../../src/lib/chores';
import { openRacksideDb, type RacksideDb } from '../../src/lib/db';
import { createSyncEngine, type ChoreTransport, type SyncTransport } from '../../src/lib/sync';
import { addMember, PASSWORD, signUp, type SignedUp } from '../factories';
import { createTestContext, type TestContext } from '../setup/test-app';
import { CHORE_FAULTS, faultyChores } from '../support/faulty-chores';

const RUNS = 30;
const DAY = 86_400_000;
const ROOM = 'Spare room';

let ctx: TestContext;
let server: ReturnType<TestContext['app']['listen']>;
let base: string;
let cookie: string;
let keeper: SignedUp;
let helper: SignedUp;

async function post(path: string, body: unknown) {
  return fetch(`${base}${path}`, {
    method: 'POST',
    headers: { 'Content-Type': 'application/json', 'X-Rackside-Client': '1', Cookie: cookie },
    body: JSON.stringify(body),
  });
}

beforeAll(async () => {
  ctx = await createTestContext();
  server = ctx.app.listen(0, '127.0.0.1');
  await new Promise((resolve) => server.once('listening', resolve));
  base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
  keeper = await signUp(ctx);
  helper = await signUp(ctx);
  await addMember(ctx.database.db, {
    collectionId: keeper.collectionId,
    userId: helper.userId,
    role: 'helper',
    startsAt: new Date(Date.now() - DAY),
    endsAt: new Date(Date.now() + 3 * DAY),
  });
  await ctx.database.db.insert(locations).values({
    collectionId: keeper.collectionId,
    room: ROOM,
    rack: 'A',
    shelf: '1',
    position: '01',
  });
  const res = await post('/api/auth/sign-in', { email: keeper.email, password: PASSWORD });
  cookie = res.headers.getSetCookie()[0]!.split(';')[0]!;
});
afterAll(async () => {
  await new Promise((resolve) => server.close(resolve));
  await ctx.close();
});

const readingChore = (id: string, room = ROOM, maxCelsius = 26) => ({
  id,
  subjectKind: 'room' as const,
  subjectId: room,
  kind: 'reading',
  clientRecordedAt: new Date().toISOString(),
  payload: { minCelsius: 22, maxCelsius, humidity: 65 },
});
const batch = (...list: unknown[]) => ({ clientSentAt: new Date().toISOString(), chores: list });
const readingsWith = (ids: string[]) =>
  ctx.database.db.select().from(climateReadings).where(inArray(climateReadings.id, ids));

describe('room readings through the chores outbox', () => {
  it('stores a re-sent batch and a repeated id once, and refuses an unknown room by name', async () => {
    const [a, b, c] = [randomUUID(), randomUUID(), randomUUID()];
    const body = batch(readingChore(a), readingChore(a), readingChore(b, 'Loft'), readingChore(c));
    const first = await keeper.agent
      .post(`/api/collections/${keeper.collectionId}/chores`)
      .send(body)
      .expect(200);
    expect(first.body.results).toEqual([
      { id: a, status: 'accepted' },
      { id: a, status: 'duplicate' },
      {
        id: b,
        status: 'rejected',
        reason: 'unknown_subject',
        message: 'There is no room called “Loft” among your places.',
      },
      { id: c, status: 'accepted' },
    ]);
    // The phone lost the answer and sends the batch again.
    const again = await keeper.agent
      .post(`/api/collections/${keeper.collectionId}/chores`)
      .send(body)
      .expect(200);
    expect(again.body.results.map((r: { status: string }) => r.status)).toEqual([
      'duplicate',
      'duplicate',
      'rejected',
      'duplicate',
    ]);
    const stored = await readingsWith([a, b, c]);
    expect(stored.map((r) => r.id).sort()).toEqual([a, c].sort());
    const [choreA] = await ctx.database.db.select().from(chores).where(eq(chores.id, a));
    const readingA = stored.find((r) => r.id === a)!;
    expect(readingA).toMatchObject({
      room: ROOM,
      source: 'typed',
      minCelsius: 22,
      maxCelsius: 26,
      humidity: 65,
      currentCelsius: null,
      recordedBy: keeper.userId,
    });
    expect(readingA.takenAt).toEqual(choreA!.effectiveAt);
  });

  it('lets a covering helper record the room’s reading, never a colony’s care', async () => {
    const colony = await keeper.agent
      .post(`/api/collections/${keeper.collectionId}/colonies`)
      .send({
        name: 'Roach bin',
        species: '',
        preyType: 'roach',
        sizes: ['adult'],
        intervals: { feed: 3, water_gel: 3, clean: 14, split: 60 },
      })
      .expect(201);
    const [reading, feed] = [randomUUID(), randomUUID()];
    const res = await helper.agent
      .post(`/api/collections/${keeper.collectionId}/chores`)
      .send(
        batch(readingChore(reading, ROOM, 31), {
          id: feed,
          subjectKind: 'colony',
          subjectId: colony.body.id,
          kind: 'feed',
          clientRecordedAt: new Date().toISOString(),
        }),
      )
      .expect(200);
    expect(res.body.results).toEqual([
      { id: reading, status: 'accepted' },
      {
        id: feed,
        status: 'rejected',
        reason: 'not_for_helpers',
        message: 'Helpers do not record colony care; ask a keeper to record this.',
      },
    ]);
    expect((await readingsWith([reading])).map((r) => r.recordedBy)).toEqual([helper.userId]);
    expect(await ctx.database.db.select().from(chores).where(eq(chores.id, feed))).toEqual([]);
    // The helper's Today has the room done, and the alert of what they typed (31 °C, no range
    // set: nothing is out of range).
    const today = await helper.agent
      .get(`/api/collections/${keeper.collectionId}/climate/today`)
      .expect(200);
    expect(today.body.rooms).toEqual([
      {
        room: ROOM,
        targets: { minCelsius: null, maxCelsius: null, minHumidity: null, maxHumidity: null },
        due: false,
      },
    ]);
    expect(today.body.alerts).toEqual([]);
  });
});

/** No round taps in these runs: the event transport is never called. */
const noTaps: SyncTransport = () => Promise.reject(new Error('no taps were made'));

const step = fc.oneof(
  fc.record({ type: fc.constant('reading' as const), max: fc.integer({ min: 22, max: 35 }) }),
  fc.record({ type: fc.constant('sync' as const) }),
  fc.record({ type: fc.constant('reload' as const) }),
);

it(`room readings are stored exactly once under dropped, failed, doubled requests and reloads (${RUNS} runs)`, async () => {
  await fc.assert(
    fc.asyncProperty(
      fc.array(step, { minLength: 1, maxLength: 8 }),
      fc.array(fc.constantFrom(...CHORE_FAULTS), { minLength: 1, maxLength: 6 }),
      fc.integer({ min: 1, max: 3 }),
      async (steps, faults, batchSize) => {
        const name = `readings-${randomUUID()}`;
        let db: RacksideDb = await openRacksideDb(name);
        const engineOn = (send: ChoreTransport) =>
          createSyncEngine({
            db: async () => db,
            userId: keeper.userId,
            send: noTaps,
            sendChores: send,
            batchSize,
          });
        const transport = faultyChores(post, faults);
        let engine = engineOn(transport);
        const typed = new Map<string, number>();
        const today = localDateOf(new Date(), 'UTC');
        for (const s of steps) {
          if (s.type === 'reading') {
            const id = randomUUID();
            await recordChore(db, {
              id,
              userId: keeper.userId,
              collectionId: keeper.collectionId,
              localDate: today,
              chore: readingChore(id, ROOM, s.max),
            });
            typed.set(id, s.max);
          } else if (s.type === 'sync') await engine.flush();
          else {
            // The page is reloaded: the same storage, opened again, with a new engine.
            db.close();
            db = await openRacksideDb(name);
            engine = engineOn(transport);
          }
        }
        expect((await choresOn(db, keeper.collectionId, today)).length).toBe(typed.size);
        await engineOn(faultyChores(post, ['none'])).flush();

        const ids = [...typed.keys()];
        const stored = await readingsWith(ids);
        expect(new Map(stored.map((r) => [r.id, r.maxCelsius]))).toEqual(typed);
        expect(await waitingChoreCount(db, keeper.userId)).toBe(0);
        db.close();
      },
    ),
    { numRuns: RUNS },
  );
}, 300_000);
