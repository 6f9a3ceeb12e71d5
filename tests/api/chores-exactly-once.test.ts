// Chores (decision 020) ride the S1 rule of the round's taps: the real client chore outbox and
// sync engine (on fake-indexeddb) against the real server and PostgreSQL, with faults between
// them — dropped requests and answers, errors, a batch delivered twice, the page reloaded
// (the database opened again) between tries. The server must end with exactly the chores
// done, each once, and the phone with none waiting.
import 'fake-indexeddb/auto';
import { randomUUID } from 'node:crypto';
import type { AddressInfo } from 'node:net';
import { eq } from 'drizzle-orm';
import fc from 'fast-check';
import { afterAll, beforeAll, expect, it } from 'vitest';
import { COLONY_CARE_KINDS } from '#shared/domain/colonies/care';
import { localDateOf } from '#shared/domain/local-dates';
import { chores } from '../../server/db/schema/colonies';
import { choresOn, recordChore, waitingChoreCount } from '../../src/lib/chores';
import { openRacksideDb, type RacksideDb } from '../../src/lib/db';
import { createSyncEngine, type ChoreTransport, type SyncTransport } from '../../src/lib/sync';
import { PASSWORD, signUp } from '../factories';
import { createTestContext, type TestContext } from '../setup/test-app';
import { CHORE_FAULTS, faultyChores } from '../support/faulty-chores';

const RUNS = 60;

let ctx: TestContext;
let server: ReturnType<TestContext['app']['listen']>;
let base: string;
let cookie: string;
let userId: string;
let collectionId: string;

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

/** No round taps in these runs: the event transport is never called. */
const noTaps: SyncTransport = () => Promise.reject(new Error('no taps were made'));

async function newColony(name: string) {
  const res = await post(`/api/collections/${collectionId}/colonies`, {
    name,
    species: '',
    preyType: 'roach',
    sizes: ['adult'],
    intervals: { feed: 3, water_gel: 3, clean: 14, split: 60 },
  });
  expect(res.status).toBe(201);
  return ((await res.json()) as { id: string }).id;
}

const step = fc.oneof(
  fc.record({ type: fc.constant('chore' as const), kind: fc.constantFrom(...COLONY_CARE_KINDS) }),
  fc.record({ type: fc.constant('sync' as const) }),
  fc.record({ type: fc.constant('reload' as const) }),
);

let run = 0;
it(`colony chores are stored exactly once under dropped, failed, doubled requests and reloads (${RUNS} runs)`, async () => {
  await fc.assert(
    fc.asyncProperty(
      fc.array(step, { minLength: 1, maxLength: 10 }),
      fc.array(fc.constantFrom(...CHORE_FAULTS), { minLength: 1, maxLength: 6 }),
      fc.integer({ min: 1, max: 3 }),
      async (steps, faults, batchSize) => {
        run += 1;
        const colonyId = await newColony(`Run ${run}`);
        const name = `chores-${randomUUID()}`;
        let db: RacksideDb = await openRacksideDb(name);
        const engineOn = (send: ChoreTransport) =>
          createSyncEngine({
            db: async () => db,
            userId,
            send: noTaps,
            sendChores: send,
            batchSize,
          });
        const transport = faultyChores(post, faults);
        let engine = engineOn(transport);
        const done: string[] = [];
        const today = localDateOf(new Date(), 'UTC');
        for (const s of steps) {
          if (s.type === 'chore') {
            const id = randomUUID();
            await recordChore(db, {
              id,
              userId,
              collectionId,
              localDate: today,
              chore: {
                id,
                subjectKind: 'colony',
                subjectId: colonyId,
                kind: s.kind,
                clientRecordedAt: new Date().toISOString(),
                payload: {},
              },
            });
            done.push(id);
          } else if (s.type === 'sync') await engine.flush();
          else {
            // The page is reloaded: the same storage, opened again, with a new engine.
            db.close();
            db = await openRacksideDb(name);
            engine = engineOn(transport);
          }
        }
        // Still shown as done on the phone, whatever was sent so far.
        expect((await choresOn(db, collectionId, today)).map((e) => e.id).sort()).toEqual(
          [...done].sort(),
        );
        await engineOn(faultyChores(post, ['none'])).flush();

        const stored = await ctx.database.db
          .select({ id: chores.id })
          .from(chores)
          .where(eq(chores.subjectId, colonyId));
        expect(stored.map((r) => r.id).sort()).toEqual([...done].sort());
        expect(await waitingChoreCount(db, userId)).toBe(0);
        expect((await choresOn(db, collectionId, today)).filter((e) => e.state !== 'sent')).toEqual(
          [],
        );
        db.close();
      },
    ),
    { numRuns: RUNS },
  );
}, 300_000);
