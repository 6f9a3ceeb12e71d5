// Days without signal, against the real server (decision 015): what a keeper's phone is sent
// to build the next days itself, who may have it, and that the round the phone builds from it
// is the round the server gives for the same day once the phone's taps have arrived.
import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import { addDays, startOfLocalDate } from '#shared/domain/local-dates';
import { phoneRound, type QueuedTap } from '#shared/domain/rounds/phone-round';
import { engineInputResponse, roundResponse } from '#shared/schemas/rounds';
import { addMember, createAnimal, signUp, type SignedUp } from '../factories';
import { createTestContext, type TestContext } from '../setup/test-app';

const ZONE = 'America/Toronto';
const DAY = '2026-12-02';
const at = (hours: number, date = DAY) =>
  new Date(startOfLocalDate(date, ZONE).getTime() + hours * 3600_000);

let ctx: TestContext;
let owner: SignedUp;
const base = () => `/api/collections/${owner.collectionId}`;

beforeAll(async () => {
  ctx = await createTestContext();
});
afterAll(async () => {
  await ctx.close();
});
beforeEach(async () => {
  ctx.setNow(at(10));
  owner = await signUp(ctx);
});

async function engineInput() {
  const res = await owner.agent.get(`${base()}/rounds/engine-input`).expect(200);
  return { input: engineInputResponse.parse(res.body), etag: res.headers.etag as string };
}

async function sendTaps(taps: QueuedTap[], sentAt: Date) {
  const res = await owner.agent
    .post(`${base()}/events`)
    .send({
      deviceId: 'phone',
      clientSentAt: sentAt.toISOString(),
      events: taps.map((t) => t.event),
    })
    .expect(200);
  expect(res.body.results.map((r: { status: string }) => r.status)).toEqual(
    taps.map(() => 'accepted'),
  );
}

/** A small collection: adults and slings fed at different times, one with prey left in. */
async function smallCollection() {
  const db = ctx.database.db;
  const made = [];
  for (const [name, lifeStage, fedDaysAgo] of [
    ['Juniper', 'adult', 13],
    ['Pepper', 'adult', 6],
    ['Biscuit', 'sling', 5],
    ['Rosie', 'juvenile', 9],
  ] as const) {
    const animal = await createAnimal(db, owner.collectionId, {
      name,
      lifeStage,
      hasWaterDish: lifeStage !== 'sling',
      createdAt: at(0, addDays(DAY, -90)),
    });
    made.push(animal);
    await sendTaps(
      [
        {
          event: {
            id: randomUUID(),
            animalId: animal.id,
            kind: 'ate',
            payload: {},
            clientRecordedAt: at(9, addDays(DAY, -fedDaysAgo)).toISOString(),
          },
          byName: 'Test Keeper',
        },
      ],
      at(10),
    );
  }
  return made;
}

describe('the engine input a keeper’s phone keeps', () => {
  it('is answered 304 while nothing changes, and anew after a record', async () => {
    const [animal] = await smallCollection();
    const { input, etag } = await engineInput();
    expect(input.date).toBe(DAY);
    expect(input.timeZone).toBe(ZONE);
    expect(input.animals).toHaveLength(4);
    expect(input.animals.find((a) => a.animal.id === animal!.id)?.state.lastMeal).toBe(
      addDays(DAY, -13),
    );
    // Only what the engine reads: no free-text notes or photos travel to the phone.
    expect(Object.keys(input.animals[0]!.animal)).not.toContain('notes');
    await owner.agent.get(`${base()}/rounds/engine-input`).set('If-None-Match', etag).expect(304);
    await sendTaps(
      [
        {
          event: {
            id: randomUUID(),
            animalId: animal!.id,
            kind: 'watered',
            payload: {},
            clientRecordedAt: at(10).toISOString(),
          },
          byName: 'Test Keeper',
        },
      ],
      at(10),
    );
    const again = await owner.agent
      .get(`${base()}/rounds/engine-input`)
      .set('If-None-Match', etag)
      .expect(200);
    expect(again.headers.etag).not.toBe(etag);
  });

  it('is not sent to a helper, even during a cover, nor to someone outside the collection', async () => {
    const helper = await signUp(ctx);
    await addMember(ctx.database.db, {
      collectionId: owner.collectionId,
      userId: helper.userId,
      role: 'helper',
      startsAt: at(-24),
      endsAt: at(48),
    });
    const res = await helper.agent.get(`${base()}/rounds/engine-input`).expect(403);
    expect(res.body.error.message).toMatch(/role in this collection does not allow/);
    const stranger = await signUp(ctx);
    await stranger.agent.get(`${base()}/rounds/engine-input`).expect(404);
    await ctx.agent().get(`${base()}/rounds/engine-input`).expect(401);
  });

  it('leaves out animals no longer in the collection', async () => {
    const [gone] = await smallCollection();
    await owner.agent
      .post(`${base()}/animals/${gone!.id}/retire`)
      .send({ status: 'rehomed', date: DAY, note: 'Went to a friend’s collection.' })
      .expect(200);
    const { input } = await engineInput();
    expect(input.animals.map((a) => a.animal.id)).not.toContain(gone!.id);
  });
});

describe('a day built on the phone, then synced', () => {
  it('equals the server’s preview for tomorrow, and the server’s round for each of the next two days once the taps arrive', async () => {
    const animals = await smallCollection();
    const { input } = await engineInput();
    const tomorrow = await owner.agent.get(`${base()}/rounds/tomorrow`).expect(200);
    expect(phoneRound(input, [], addDays(DAY, 1), false)).toEqual(
      roundResponse.parse(tomorrow.body),
    );

    // Two days with no signal: a meal and a refusal on the first, water on the second.
    const tap = (i: number, kind: 'ate' | 'refused' | 'watered', when: Date): QueuedTap => ({
      event: {
        id: randomUUID(),
        animalId: animals[i]!.id,
        kind,
        payload: {},
        clientRecordedAt: when.toISOString(),
      },
      byName: 'Test Keeper',
    });
    const day1 = addDays(DAY, 1);
    const day2 = addDays(DAY, 2);
    const taps = [
      tap(0, 'ate', at(8, day1)),
      tap(3, 'refused', at(8.2, day1)),
      tap(1, 'watered', at(9, day2)),
    ];
    const onPhone1 = phoneRound(input, taps, day1, true);
    const onPhone2 = phoneRound(input, taps, day2, true);
    expect(onPhone1.progress.done).toBeGreaterThan(0);

    // The signal comes back on the second day: the taps arrive, then each day's round is read.
    ctx.setNow(at(12, day2));
    await sendTaps(taps, at(12, day2));
    const server2 = roundResponse.parse(
      (await owner.agent.get(`${base()}/rounds/today`).expect(200)).body,
    );
    const server1 = await ctx.services.rounds.round(owner.collectionId, day1);
    const strip = (r: ReturnType<typeof roundResponse.parse>) => ({ ...r, builtAt: null });
    expect(strip(server2)).toEqual(roundResponse.parse(onPhone2));
    // The first day's round was never built on the server: it is built now, from the log as
    // it stood before that day, and shows the phone's taps as done.
    expect(strip(roundResponse.parse(server1))).toEqual(roundResponse.parse(onPhone1));
  });

  it('withdraws today’s feed task when a meal from a day without signal arrives after the round was built', async () => {
    const [juniper] = await smallCollection();
    const day1 = addDays(DAY, 1);
    const day2 = addDays(DAY, 2);
    // The server builds the second day's round at its midnight, before the phone is back.
    ctx.setNow(at(0.1, day2));
    const before = (await owner.agent.get(`${base()}/rounds/today`).expect(200)).body;
    const feedOf = (round: typeof before) =>
      round.items
        .find((i: { animal: { id: string } }) => i.animal.id === juniper!.id)
        ?.tasks.find((t: { kind: string }) => t.kind === 'feed');
    expect(feedOf(before)?.withdrawn ?? null).toBeNull();
    ctx.setNow(at(12, day2));
    await sendTaps(
      [
        {
          event: {
            id: randomUUID(),
            animalId: juniper!.id,
            kind: 'ate',
            payload: {},
            clientRecordedAt: at(8, day1).toISOString(),
          },
          byName: 'Test Keeper',
        },
      ],
      at(12, day2),
    );
    const after = (await owner.agent.get(`${base()}/rounds/today`).expect(200)).body;
    expect(feedOf(after)?.withdrawn?.text).toMatch(/^Not due any more/);
    expect(after.progress.total).toBe(before.progress.total - 1);
  });
});
