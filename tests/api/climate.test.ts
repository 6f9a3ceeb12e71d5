// Room climate end to end on the real database: targets per room, the typed daily reading
// (a room chore, stored once per client id, a covering helper may send it), a logger file's rows across the
// autumn change, what is out of range on Today, the owners' morning e-mail in each owner's
// unit (once per owner and day), a renamed room keeping its climate, and an animal's days.
import { randomUUID } from 'node:crypto';
import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { planLoggerImport } from '#shared/domain/climate/logger-import';
import { readCsv } from '#shared/domain/csv/csv-file';
import { climateReadings } from '../../server/db/schema/climate';
import { collections, locations, memberships } from '../../server/db/schema/collections';
import { users } from '../../server/db/schema/users';
import { addMember, createAnimal, signUp, type SignedUp } from '../factories';
import { createTestContext, type TestContext } from '../setup/test-app';

let ctx: TestContext;
let owner: SignedUp;
let coOwner: SignedUp;
let helper: SignedUp;
let keeper: SignedUp;
let animalId: string;
const ZONE = 'Europe/Amsterdam';
const DAY = 86_400_000;
const base = () => `/api/collections/${owner.collectionId}/climate`;
const targets = { minCelsius: 24, maxCelsius: 28, minHumidity: 60, maxHumidity: 80 };

/** The typed reading as the phone sends it: a room chore (decision 020), made now. */
async function sendReading(
  who: SignedUp,
  id: string,
  room: string,
  values: { minCelsius: number | null; maxCelsius: number | null; humidity: number | null },
) {
  // Sent as made: the server files it at its own time (effectiveTime in shared/domain/clock.ts).
  const at = new Date().toISOString();
  const res = await who.agent
    .post(`/api/collections/${owner.collectionId}/chores`)
    .send({
      clientSentAt: at,
      chores: [
        {
          id,
          subjectKind: 'room',
          subjectId: room,
          kind: 'reading',
          clientRecordedAt: at,
          payload: values,
        },
      ],
    })
    .expect(200);
  return res.body.results[0] as { status: string; reason?: string; message?: string };
}

beforeAll(async () => {
  ctx = await createTestContext();
  owner = await signUp(ctx);
  coOwner = await signUp(ctx);
  helper = await signUp(ctx);
  keeper = await signUp(ctx);
  const db = ctx.database.db;
  await db
    .update(collections)
    .set({ timeZone: ZONE })
    .where(eq(collections.id, owner.collectionId));
  await addMember(db, {
    collectionId: owner.collectionId,
    userId: helper.userId,
    role: 'helper',
    startsAt: new Date(Date.now() - DAY),
    endsAt: new Date(Date.now() + 3 * DAY),
  });
  await addMember(db, { collectionId: owner.collectionId, userId: keeper.userId, role: 'keeper' });
  // The second owner joins as a keeper and is moved up; reads °F.
  await addMember(db, { collectionId: owner.collectionId, userId: coOwner.userId, role: 'keeper' });
  await db.update(memberships).set({ role: 'owner' }).where(eq(memberships.userId, coOwner.userId));
  await db.update(users).set({ temperatureUnit: 'F' }).where(eq(users.id, coOwner.userId));
  const [spot] = await db
    .insert(locations)
    .values([
      {
        collectionId: owner.collectionId,
        room: 'Spare room',
        rack: 'A',
        shelf: '1',
        position: '01',
      },
      { collectionId: owner.collectionId, room: 'Hall', rack: 'B', shelf: '1', position: '01' },
    ])
    .returning();
  animalId = (await createAnimal(db, owner.collectionId, { name: 'Pepper', locationId: spot!.id }))
    .id;
});
afterAll(async () => {
  await ctx.close();
});

describe('targets', () => {
  it('are set per room by a keeper and refused for a room that is not among the places', async () => {
    const set = await keeper.agent
      .put(`${base()}/targets`)
      .send({ room: 'Spare room', ...targets })
      .expect(200);
    expect(set.body).toEqual({ room: 'Spare room', ...targets });
    await keeper.agent
      .put(`${base()}/targets`)
      .send({ room: 'Attic', ...targets })
      .expect(404);
    const swapped = await keeper.agent
      .put(`${base()}/targets`)
      .send({ room: 'Hall', ...targets, minCelsius: 30 })
      .expect(422);
    expect(JSON.stringify(swapped.body)).toMatch(/Swap them/);
    const rooms = await owner.agent.get(`${base()}/rooms`).expect(200);
    expect(rooms.body.rooms.map((r: { room: string }) => r.room)).toEqual(['Hall', 'Spare room']);
    await helper.agent
      .put(`${base()}/targets`)
      .send({ room: 'Hall', ...targets })
      .expect(403);
  });
});

describe('the typed daily reading', () => {
  const id = randomUUID();
  it('is due on Today, stored once per id, and shows what is out of range', async () => {
    const before = (await helper.agent.get(`${base()}/today`).expect(200)).body;
    expect(before.rooms).toEqual([{ room: 'Spare room', targets, due: true }]);
    const values = { minCelsius: 22.5, maxCelsius: 27, humidity: 70 };
    expect(await sendReading(helper, id, 'Spare room', values)).toEqual({ id, status: 'accepted' });
    // Sent again (a phone that lost the answer): a duplicate, the reading stored once.
    expect(await sendReading(helper, id, 'Spare room', values)).toEqual({
      id,
      status: 'duplicate',
    });
    const rows = await ctx.database.db
      .select()
      .from(climateReadings)
      .where(eq(climateReadings.id, id));
    expect(rows).toEqual([
      expect.objectContaining({ room: 'Spare room', source: 'typed', ...values }),
    ]);
    const after = (await owner.agent.get(`${base()}/today`).expect(200)).body;
    expect(after.rooms[0].due).toBe(false);
    expect(after.alerts).toEqual([
      {
        room: 'Spare room',
        targets,
        breaches: [
          {
            measure: 'temperature',
            side: 'low',
            value: 22.5,
            limit: 24,
            takenAt: expect.any(String),
          },
        ],
      },
    ]);
  });

  it('refuses bad values with a sentence, and a helper sees no history', async () => {
    const bad = await sendReading(helper, randomUUID(), 'Spare room', {
      minCelsius: null,
      maxCelsius: null,
      humidity: 120,
    });
    expect(bad).toMatchObject({ status: 'rejected', reason: 'invalid' });
    expect(bad.message).toMatch(/0 to 100/);
    await helper.agent.get(`${base()}/history?room=Spare%20room`).expect(403);
    await helper.agent.post(`${base()}/import`).send({ room: 'Spare room', rows: [] }).expect(403);
  });
});

describe('a logger file', () => {
  it('is imported across the autumn change, each instant once, and summed up per day', async () => {
    // Europe/Amsterdam, 2026-10-25: 03:00 CEST becomes 02:00 CET (IANA tz database, Rule EU).
    const csv = [
      'Date/time,Temp °C,Humidity %',
      '2026-10-25 01:30,25.0,70',
      '2026-10-25 02:30,25.5,70',
      '2026-10-25 02:30,29.5,70',
      '2026-10-25 03:30,26.0,71',
    ].join('\n');
    const table = readCsv(csv);
    const plan = planLoggerImport(table, {
      time: 0,
      temperature: 1,
      humidity: 2,
      unit: 'C',
      zone: ZONE,
    });
    expect(plan.problems).toEqual([]);
    const rows = plan.rows.map(({ takenAt, celsius, humidity }) => ({
      takenAt,
      celsius,
      humidity,
    }));
    const first = await keeper.agent
      .post(`${base()}/import`)
      .send({ room: 'Hall', rows })
      .expect(200);
    expect(first.body).toEqual({ added: 4, alreadyThere: 0 });
    const second = await keeper.agent
      .post(`${base()}/import`)
      .send({ room: 'Hall', rows })
      .expect(200);
    expect(second.body).toEqual({ added: 0, alreadyThere: 4 });
    const stored = await ctx.database.db
      .select({ takenAt: climateReadings.takenAt })
      .from(climateReadings)
      .where(eq(climateReadings.room, 'Hall'));
    expect(stored.map((r) => r.takenAt.toISOString()).sort()).toEqual([
      '2026-10-24T23:30:00.000Z',
      '2026-10-25T00:30:00.000Z',
      '2026-10-25T01:30:00.000Z',
      '2026-10-25T02:30:00.000Z',
    ]);
    ctx.setNow(new Date('2026-10-26T12:00:00Z'));
    try {
      const history = await keeper.agent.get(`${base()}/history?room=Hall&days=5`).expect(200);
      expect(history.body.days).toEqual([
        {
          date: '2026-10-25',
          lowCelsius: 25,
          highCelsius: 29.5,
          lowHumidity: 70,
          highHumidity: 71,
          readings: 4,
        },
      ]);
    } finally {
      ctx.setNow(null);
    }
  });
});

describe('the owners’ morning e-mail', () => {
  it('names the room out of range in each owner’s unit, once per owner and day', async () => {
    const room = 'Spare room';
    // A reading of 31 °C at 15:00 on 3 June; the e-mail goes out from 07:00 on 4 June.
    ctx.setNow(new Date('2026-06-03T13:00:00Z'));
    expect(
      await sendReading(owner, randomUUID(), room, {
        minCelsius: 25,
        maxCelsius: 31,
        humidity: 65,
      }),
    ).toMatchObject({ status: 'accepted' });
    try {
      ctx.setNow(new Date('2026-06-04T04:50:00Z')); // 06:50 in Amsterdam: not yet morning
      expect(await ctx.services.dailyMail.runDue()).toBe(0);
      ctx.setNow(new Date('2026-06-04T05:05:00Z')); // 07:05
      expect(await ctx.services.dailyMail.runDue()).toBe(2);
      expect(await ctx.services.dailyMail.runDue()).toBe(0);
      const toOwner = await ctx.mailbox.waitFor(
        (m) => m.to.includes(owner.email) && /out of range/.test(m.subject),
      );
      expect(toOwner.subject).toMatch(/a room was out of range/);
      // 31 °C = 87.8 °F and 24–28 °C = 75.2–82.4 °F (t/°F = 1.8 · t/°C + 32, NIST SP 811, 2008).
      expect(toOwner.text).toContain('Spare room: up to 31.0 °C, above the range 24.0–28.0 °C.');
      const toCoOwner = await ctx.mailbox.waitFor(
        (m) => m.to.includes(coOwner.email) && /out of range/.test(m.subject),
      );
      expect(toCoOwner.text).toContain('Spare room: up to 87.8 °F, above the range 75.2–82.4 °F.');
      expect(
        ctx.mailbox.messages.filter(
          (m) => m.to.includes(keeper.email) && /out of range/.test(m.subject),
        ),
      ).toEqual([]);
      // The next morning has nothing new to say: no mail.
      ctx.setNow(new Date('2026-06-05T05:05:00Z'));
      expect(await ctx.services.dailyMail.runDue()).toBe(0);
    } finally {
      ctx.setNow(null);
    }
  });
});

describe('the person’s unit and a renamed room', () => {
  it('keeps the unit on the server for every device', async () => {
    const me = await helper.agent.patch('/api/auth/me').send({ temperatureUnit: 'F' }).expect(200);
    expect(me.body.user.temperatureUnit).toBe('F');
    expect((await helper.agent.get('/api/auth/me').expect(200)).body.user.temperatureUnit).toBe(
      'F',
    );
    await helper.agent.patch('/api/auth/me').send({ temperatureUnit: 'K' }).expect(422);
  });

  it('moves targets and readings with the room, and shows them on its animals', async () => {
    await owner.agent
      .post(`/api/collections/${owner.collectionId}/locations/rename`)
      .send({ level: 'room', room: 'Spare room', to: 'Reptile room' })
      .expect(200);
    const rooms = (await owner.agent.get(`${base()}/rooms`).expect(200)).body.rooms;
    const renamed = rooms.find((r: { room: string }) => r.room === 'Reptile room');
    expect(renamed.targets).toEqual(targets);
    expect(renamed.latest).not.toBeNull();
    const animal = await keeper.agent.get(`${base()}/animals/${animalId}`).expect(200);
    expect(animal.body.room).toBe('Reptile room');
    expect(animal.body.days.length).toBeGreaterThan(0);
    await helper.agent.get(`${base()}/animals/${animalId}`).expect(403);
    await keeper.agent.get(`${base()}/animals/${randomUUID()}`).expect(404);
  });
});
