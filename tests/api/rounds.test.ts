import { randomUUID } from 'node:crypto';
import { eq } from 'drizzle-orm';
import supertest from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { addDays, localDateOf, startOfLocalDate } from '#shared/domain/local-dates';
import { projectState } from '#shared/domain/rounds/animal-state';
import { DEMO_PASSWORD } from '../../server/access/demo-people';
import { animals, events } from '../../server/db/schema/animals';
import { animalStates, rounds as roundsTable } from '../../server/db/schema/rounds';
import { users } from '../../server/db/schema/users';
import { demoCollectionId, seedDemo } from '../../server/seed/demo';
import { createAnimal, signUp } from '../factories';
import { createTestContext, type TestContext } from '../setup/test-app';

let ctx: TestContext;
let demoId: string;
const ZONE = 'America/Toronto';

async function signIn(email: string) {
  const agent = ctx.agent();
  await agent.post('/api/auth/sign-in').send({ email, password: DEMO_PASSWORD }).expect(200);
  return agent;
}

beforeAll(async () => {
  ctx = await createTestContext();
  await seedDemo(ctx.database.db, { bcryptCost: 10 });
  demoId = (await demoCollectionId(ctx.database.db))!;
});
afterAll(async () => {
  await ctx.close();
});

describe("the demo's today round", () => {
  it('shows every state of the demo scenario with its reason, in walk order', async () => {
    const owner = await signIn('owner@northlight.test');
    const res = await owner.get(`/api/collections/${demoId}/rounds/today`).expect(200);
    const round = res.body;
    expect(round.date).toBe(localDateOf(new Date(), ZONE));
    const byName = new Map<
      string,
      {
        tasks: { kind: string; reasons: { code: string; text: string }[] }[];
        notes: { code: string }[];
        carriedOverDays: number;
      }
    >(round.items.map((i: { animal: { name: string } }) => [i.animal.name, i]));
    const codes = (name: string) =>
      byName
        .get(name)!
        .tasks.flatMap((t) => t.reasons.map((r) => r.code))
        .concat(byName.get(name)!.notes.map((n) => n.code));

    expect(codes('Bramble')).toEqual(expect.arrayContaining(['check_premolt', 'possible_premolt'])); // two refusals, adult streak 2 in this collection
    expect(codes('Verdi')).toEqual(expect.arrayContaining(['water_due', 'premolt'])); // premolt: water only
    expect(byName.get('Verdi')!.tasks.map((t) => t.kind)).toEqual(['water']);
    expect(codes('Goliath Jr')).toEqual(expect.arrayContaining(['post_molt_hold'])); // molted 5 days ago
    expect(codes('Juniper')).toEqual(expect.arrayContaining(['due_interval', 'rebuild'])); // sac 3 weeks ago
    expect(codes('Indigo')).toEqual(expect.arrayContaining(['rebuild'])); // paired 10 days ago
    expect(byName.get('Formosus 04')!.tasks[0]!.kind).toBe('remove_prey'); // prey left in yesterday
    const carried = round.items
      .filter((i: { carriedOverDays: number }) => i.carriedOverDays > 0)
      .map((i: { animal: { name: string } }) => i.animal.name);
    expect(carried).toEqual(expect.arrayContaining(['Dusty', 'Ember', 'Tiger']));
    // Walk order: rack A before B before C.
    const racks = round.items.map(
      (i: { animal: { location: { rack: string } } }) => i.animal.location.rack,
    );
    expect([...racks].sort()).toEqual(racks);
    expect(round.prepList.length).toBeGreaterThan(0);
    expect(round.progress.total).toBeGreaterThan(10);
    expect(round.progress.done).toBe(0);
  });

  it('builds the round once and keeps it stable through its day', async () => {
    const owner = await signIn('owner@northlight.test');
    const first = await owner.get(`/api/collections/${demoId}/rounds/today`).expect(200);
    const second = await owner.get(`/api/collections/${demoId}/rounds/today`).expect(200);
    expect(second.body.builtAt).toBe(first.body.builtAt);
    expect(second.body.items.length).toBe(first.body.items.length);
    const built = await ctx.database.db
      .select()
      .from(roundsTable)
      .where(eq(roundsTable.collectionId, demoId));
    expect(built).toHaveLength(1);
  });

  it('marks tasks done by the day’s outcomes and adds an urgent removal during the day', async () => {
    const owner = await signIn('owner@northlight.test');
    const [ownerRow] = await ctx.database.db
      .select()
      .from(users)
      .where(eq(users.email, 'owner@northlight.test'));
    const today = await owner.get(`/api/collections/${demoId}/rounds/today`).expect(200);
    const juniper = today.body.items.find(
      (i: { animal: { name: string } }) => i.animal.name === 'Juniper',
    );
    const now = new Date();
    const event = (
      animalId: string,
      kind: 'ate' | 'prey_left_in' | 'molting_now',
      payload = {},
    ) => ({
      id: randomUUID(),
      animalId,
      kind,
      payload,
      recordedBy: ownerRow!.id,
      deviceId: 'test',
      clientRecordedAt: now,
      clientSentAt: now,
      effectiveAt: now,
    });
    await ctx.services.events.ingest(demoId, ZONE, [
      event(juniper.animal.id, 'ate', { preyType: 'cricket' }),
    ]);
    const after = await owner.get(`/api/collections/${demoId}/rounds/today`).expect(200);
    const feed = after.body.items
      .find((i: { animal: { name: string } }) => i.animal.name === 'Juniper')
      .tasks.find((t: { kind: string }) => t.kind === 'feed');
    expect(feed.done).toMatchObject({ kind: 'ate', by: 'Robin (owner)' });
    expect(after.body.progress.done).toBe(1);

    // An animal not on today's round: prey left in and then "molting now" make a removal urgent.
    const onRound = new Set(
      after.body.items.map((i: { animal: { name: string } }) => i.animal.name),
    );
    const pepper = (
      await ctx.database.db.select().from(animals).where(eq(animals.collectionId, demoId))
    ).find((a) => a.group === 'tarantula' && !onRound.has(a.name));
    expect(pepper).toBeDefined();
    await ctx.services.events.ingest(demoId, ZONE, [
      event(pepper!.id, 'prey_left_in', { preyType: 'cricket' }),
    ]);
    await ctx.services.events.ingest(demoId, ZONE, [
      { ...event(pepper!.id, 'molting_now'), effectiveAt: new Date(now.getTime() + 1000) },
    ]);
    const urgent = await owner.get(`/api/collections/${demoId}/rounds/today`).expect(200);
    const item = urgent.body.items.find(
      (i: { animal: { name: string } }) => i.animal.name === pepper!.name,
    );
    expect(item.addedDuringDay).toBe(true);
    expect(item.tasks[0].kind).toBe('remove_prey');
    expect(item.tasks[0].reasons.map((r: { text: string }) => r.text).join(' ')).toMatch(
      /molting: live prey can injure/,
    );
  });

  it('keeps the stored projection equal to a fold of the whole log (both paths agree)', async () => {
    const stored = await ctx.database.db
      .select()
      .from(animalStates)
      .where(eq(animalStates.collectionId, demoId));
    const log = await ctx.database.db.select().from(events).where(eq(events.collectionId, demoId));
    for (const row of stored) {
      const mine = log
        .filter((e) => e.animalId === row.animalId)
        .map((e) => ({
          id: e.id,
          kind: e.kind as 'ate',
          effectiveAt: e.effectiveAt.toISOString(),
          payload: e.payload as Record<string, unknown>,
        }));
      expect(row.state).toEqual(projectState(mine, ZONE));
    }
    expect(stored.length).toBe(43);
  });

  it('previews tomorrow with its prep list, and explains why an animal is or is not on the round', async () => {
    const partner = await signIn('partner@northlight.test');
    const tomorrow = await partner.get(`/api/collections/${demoId}/rounds/tomorrow`).expect(200);
    expect(tomorrow.body.date).toBe(addDays(localDateOf(new Date(), ZONE), 1));
    expect(tomorrow.body.builtAt).toBeNull();
    const [goliath] = await ctx.database.db
      .select()
      .from(animals)
      .where(eq(animals.name, 'Goliath Jr'));
    const schedule = await partner
      .get(`/api/collections/${demoId}/animals/${goliath!.id}/schedule`)
      .expect(200);
    expect(schedule.body.notes[0].text).toMatch(/^Post-molt hold until/);
    expect(schedule.body.nextFeed).toBe(addDays(localDateOf(new Date(), ZONE), 5));
    const prep = await partner
      .get(`/api/collections/${demoId}/prep-list`)
      .query({ date: tomorrow.body.date })
      .expect(200);
    expect(prep.body.prepList).toEqual(tomorrow.body.prepList);
    const bad = await partner
      .get(`/api/collections/${demoId}/prep-list`)
      .query({ date: '2026-02-30' });
    expect(bad.status).toBe(422);
    expect(bad.body.error.message).toBe('This date does not exist.');
  });
});

describe('rules and care settings', () => {
  it('lets a keeper change a rule and the engine honours it; absurd values are refused with a message', async () => {
    const partner = await signIn('partner@northlight.test');
    const base = `/api/collections/${demoId}`;
    const rules = await partner.get(`${base}/rules`).expect(200);
    // The demo stores its change in the shape used before care profiles: read as the tarantula's.
    expect(rules.body.rules.profiles.tarantula.stages.adult.refusalStreak).toBe(2);
    expect(rules.body.defaults.profiles.tarantula.stages.adult.refusalStreak).toBe(3);
    const interval = (days: number) => ({
      profiles: { tarantula: { stages: { adult: { feedEveryDays: days } } } },
    });
    const bad = await partner.put(`${base}/rules`).send(interval(-3));
    expect(bad.status).toBe(422);
    expect(bad.body.error.message).toBe('The tarantula adult interval must be at least 1 day.');
    expect((await partner.put(`${base}/rules`).send(interval(400))).body.error.message).toBe(
      'The tarantula adult interval can be at most 90 days.',
    );
    const [goliath] = await ctx.database.db
      .select()
      .from(animals)
      .where(eq(animals.name, 'Goliath Jr'));
    const streak = { adult: { refusalStreak: 2 } };
    await partner
      .put(`${base}/rules`)
      .send({
        profiles: { tarantula: { stages: { ...streak, subadult: { postMoltHoldDays: 3 } } } },
      })
      .expect(200);
    const schedule = await partner.get(`${base}/animals/${goliath!.id}/schedule`).expect(200);
    expect(schedule.body.notes.map((n: { code: string }) => n.code)).not.toContain(
      'post_molt_hold',
    );
    await partner
      .put(`${base}/rules`)
      .send({ profiles: { tarantula: { stages: streak } } })
      .expect(200);
  });

  it('honours an animal’s own "do not feed until" date and interval', async () => {
    const partner = await signIn('partner@northlight.test');
    const [juniper] = await ctx.database.db
      .select()
      .from(animals)
      .where(eq(animals.name, 'Juniper'));
    const until = addDays(localDateOf(new Date(), ZONE), 4);
    const res = await partner
      .patch(`/api/collections/${demoId}/animals/${juniper!.id}/care`)
      .send({ doNotFeedUntil: until })
      .expect(200);
    expect(res.body.notes.map((n: { text: string }) => n.text)).toContain(
      `Do not feed until ${Number(until.slice(8))} ${['Jan', 'Feb', 'Mar', 'Apr', 'May', 'Jun', 'Jul', 'Aug', 'Sep', 'Oct', 'Nov', 'Dec'][Number(until.slice(5, 7)) - 1]} (keeper's setting).`,
    );
    const refused = await partner
      .patch(`/api/collections/${demoId}/animals/${juniper!.id}/care`)
      .send({ intervalDays: 0 });
    expect(refused.status).toBe(422);
    await partner
      .patch(`/api/collections/${demoId}/animals/${juniper!.id}/care`)
      .send({ doNotFeedUntil: null })
      .expect(200);
  });
});

describe('who may see rounds', () => {
  it('lets a helper read today’s round only inside the cover window; an outsider gets 404', async () => {
    const helper = await signIn('helper@northlight.test');
    const [membership] = await ctx.database.db
      .execute<{ starts_at: Date; ends_at: Date }>(
        `select m.starts_at, m.ends_at from memberships m join users u on u.id = m.user_id where u.email = 'helper@northlight.test'`,
      )
      .then((r) => r.rows);
    expect((await helper.get(`/api/collections/${demoId}/rounds/today`)).status).toBe(403);
    ctx.setNow(new Date(new Date(membership!.starts_at).getTime() + 3600_000));
    try {
      const during = await helper.get(`/api/collections/${demoId}/rounds/today`);
      expect(during.status).toBe(200);
      expect(during.body.date).toBe(localDateOf(new Date(membership!.starts_at), ZONE));
      expect((await helper.get(`/api/collections/${demoId}/rounds/tomorrow`)).status).toBe(403);
      expect((await helper.get(`/api/collections/${demoId}/rules`)).status).toBe(403);
    } finally {
      ctx.setNow(null);
    }
    const outsider = await signUp(ctx);
    expect((await outsider.agent.get(`/api/collections/${demoId}/rounds/today`)).status).toBe(404);
    expect((await supertest(ctx.app).get(`/api/collections/${demoId}/rounds/today`)).status).toBe(
      401,
    );
  });
});

describe('the job that builds rounds at local midnight', () => {
  it('builds each collection’s round at its own local midnight, across a DST change', async () => {
    const own = await createTestContext();
    try {
      const toronto = await signUp(own, { timeZone: 'America/Toronto' });
      const tokyo = await signUp(own, { timeZone: 'Asia/Tokyo' });
      await createAnimal(own.database.db, toronto.collectionId);
      await createAnimal(own.database.db, tokyo.collectionId);
      const rounds = own.services.rounds;
      const datesOf = async (id: string) =>
        (
          await own.database.db
            .select({ d: roundsTable.localDate })
            .from(roundsTable)
            .where(eq(roundsTable.collectionId, id))
        )
          .map((r) => r.d)
          .sort();

      // 31 Oct 2026 23:59 in Toronto (EDT) = 03:59Z on 1 Nov; Tokyo is already at 12:59 on 1 Nov.
      own.setNow(new Date('2026-11-01T03:59:00Z'));
      expect((await rounds.buildDueRounds()).sort()).toEqual(
        [toronto.collectionId, tokyo.collectionId].sort(),
      );
      expect(await datesOf(toronto.collectionId)).toEqual(['2026-10-31']);
      expect(await datesOf(tokyo.collectionId)).toEqual(['2026-11-01']);
      // A minute later it is 1 Nov in Toronto too (midnight EDT = 04:00Z): only Toronto is due.
      own.setNow(new Date('2026-11-01T04:00:30Z'));
      expect(await rounds.buildDueRounds()).toEqual([toronto.collectionId]);
      // Running again builds nothing (idempotent).
      expect(await rounds.buildDueRounds()).toEqual([]);
      // Midnight of 2 Nov in Toronto is 05:00Z (EST after the change), not 04:00Z; Tokyo
      // (no DST, UTC+9) began 2 Nov at 15:00Z on 1 Nov.
      own.setNow(new Date('2026-11-02T04:30:00Z'));
      expect(await rounds.buildDueRounds()).toEqual([tokyo.collectionId]);
      own.setNow(new Date('2026-11-02T05:00:30Z'));
      expect(await rounds.buildDueRounds()).toEqual([toronto.collectionId]);
      expect(await datesOf(toronto.collectionId)).toEqual([
        '2026-10-31',
        '2026-11-01',
        '2026-11-02',
      ]);
      expect(startOfLocalDate('2026-11-02', ZONE).toISOString()).toBe('2026-11-02T05:00:00.000Z');
    } finally {
      await own.close();
    }
  });

  it('never builds the same round twice when builders race', async () => {
    const own = await createTestContext();
    try {
      const keeper = await signUp(own);
      for (let i = 0; i < 5; i++) await createAnimal(own.database.db, keeper.collectionId);
      const date = localDateOf(new Date(), ZONE);
      const results = await Promise.all(
        Array.from({ length: 8 }, () => own.services.rounds.build(keeper.collectionId, date)),
      );
      expect(results.filter((r) => r.created)).toHaveLength(1);
      const [{ n }] = (
        await own.database.db.execute<{ n: number }>(`select count(*)::int as n from round_items`)
      ).rows as [{ n: number }];
      expect(n).toBe(5);
    } finally {
      await own.close();
    }
  });

  it('runs through pg-boss: the scheduled job builds the rounds', async () => {
    const own = await createTestContext();
    const { startJobs, BUILD_DUE_ROUNDS } = await import('../../server/jobs/jobs');
    const { createLogger } = await import('../../server/logger');
    const jobs = await startJobs({
      databaseUrl: own.databaseUrl,
      rounds: own.services.rounds,
      coverReports: own.services.coverReports,
      logger: createLogger({ NODE_ENV: 'test' }),
    });
    try {
      const keeper = await signUp(own);
      await createAnimal(own.database.db, keeper.collectionId);
      await jobs.boss.send(BUILD_DUE_ROUNDS, {});
      const deadline = Date.now() + 20_000;
      let found = 0;
      while (Date.now() < deadline && !found) {
        found = (
          await own.database.db
            .select()
            .from(roundsTable)
            .where(eq(roundsTable.collectionId, keeper.collectionId))
        ).length;
        if (!found) await new Promise((r) => setTimeout(r, 250));
      }
      expect(found).toBe(1);
    } finally {
      await jobs.stop();
      await own.close();
    }
  });
});

describe('today’s round served from the cache', () => {
  it('answers 304 while unchanged, and a new round after a tap or a change made by another process', async () => {
    const owner = await signIn('owner@northlight.test');
    const url = `/api/collections/${demoId}/rounds/today`;
    const first = await owner.get(url).expect(200);
    const etag = first.headers.etag as string;
    expect(first.headers['cache-control']).toBe('private, no-cache');
    // RFC 9110 §13.1.2: a matching If-None-Match on a GET is answered 304 Not Modified.
    await owner.get(url).set('If-None-Match', etag).expect(304);

    const item = first.body.items.find(
      (i: { animal: { name: string } }) => i.animal.name === 'Verdi',
    );
    await owner
      .post(`/api/collections/${demoId}/events`)
      .send({
        deviceId: 'cache',
        clientSentAt: new Date().toISOString(),
        events: [
          {
            id: randomUUID(),
            animalId: item.animal.id,
            kind: 'watered',
            payload: {},
            clientRecordedAt: new Date().toISOString(),
          },
        ],
      })
      .expect(200);
    const afterTap = await owner.get(url).set('If-None-Match', etag).expect(200);
    expect(afterTap.headers.etag).not.toBe(etag);
    const verdi = afterTap.body.items.find(
      (i: { animal: { id: string } }) => i.animal.id === item.animal.id,
    );
    expect(verdi.outcomes.map((o: { kind: string }) => o.kind)).toContain('watered');

    // Another server process renames the animal straight in the database: the triggers move the
    // counters, so this process's cached round is not served again.
    await ctx.database.db
      .update(animals)
      .set({ name: 'Verdi the Second' })
      .where(eq(animals.id, item.animal.id));
    const afterRename = await owner
      .get(url)
      .set('If-None-Match', afterTap.headers.etag as string)
      .expect(200);
    expect(
      afterRename.body.items.some(
        (i: { animal: { name: string } }) => i.animal.name === 'Verdi the Second',
      ),
    ).toBe(true);
    await ctx.database.db
      .update(animals)
      .set({ name: 'Verdi' })
      .where(eq(animals.id, item.animal.id));
  });

  it('sends the same round gzipped to a client that accepts it', async () => {
    const owner = await signIn('owner@northlight.test');
    const url = `/api/collections/${demoId}/rounds/today`;
    const plain = await owner.get(url).set('Accept-Encoding', 'identity').expect(200);
    expect(plain.headers['content-encoding']).toBeUndefined();
    // supertest inflates gzip itself: the header says what came over the wire.
    const zipped = await owner.get(url).set('Accept-Encoding', 'gzip').expect(200);
    expect(zipped.headers['content-encoding']).toBe('gzip');
    expect(zipped.headers.vary).toMatch(/Accept-Encoding/);
    expect(zipped.body).toEqual(plain.body);
  });
});

describe('the cached round’s JSON', () => {
  it('is exactly the round the service builds, after taps settle some items and not others', async () => {
    const owner = await signIn('owner@northlight.test');
    const url = `/api/collections/${demoId}/rounds/today`;
    const before = await owner.get(url).expect(200);
    const [a, b] = before.body.items as { animal: { id: string } }[];
    await owner
      .post(`/api/collections/${demoId}/events`)
      .send({
        deviceId: 'json',
        clientSentAt: new Date().toISOString(),
        events: [
          {
            id: randomUUID(),
            animalId: a!.animal.id,
            kind: 'refused',
            payload: {},
            clientRecordedAt: new Date().toISOString(),
          },
          {
            id: randomUUID(),
            animalId: b!.animal.id,
            kind: 'watered',
            payload: {},
            clientRecordedAt: new Date().toISOString(),
          },
        ],
      })
      .expect(200);
    const served = await owner.get(url).expect(200);
    expect(served.body).toEqual(
      JSON.parse(JSON.stringify(await ctx.services.rounds.todayRound(demoId))),
    );
  });
});
