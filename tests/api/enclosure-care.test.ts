// § Enclosure care through the API on the real server and PostgreSQL: the round's new tasks, a
// rehouse that measures the new enclosure onto the record, what a covering helper may record,
// and payloads checked at the edge.
import { randomUUID } from 'node:crypto';
import { eq } from 'drizzle-orm';
import { afterAll, afterEach, beforeAll, describe, expect, it } from 'vitest';
import { animals } from '../../server/db/schema/animals';
import { addMember, animalBody, createAnimal, signUp, type SignedUp } from '../factories';
import { createTestContext, type TestContext } from '../setup/test-app';

let ctx: TestContext;
let owner: SignedUp;

const NOW = new Date('2026-11-20T15:00:00Z');
const day = 86_400_000;
const tap = (animalId: string, kind: string, at: Date, payload: Record<string, unknown> = {}) => ({
  id: randomUUID(),
  animalId,
  kind,
  payload,
  clientRecordedAt: at.toISOString(),
});
const batch = (list: unknown[], sentAt = NOW) => ({
  deviceId: 'test-device',
  clientSentAt: sentAt.toISOString(),
  events: list,
});
const base = () => `/api/collections/${owner.collectionId}`;
type Item = {
  animal: { id: string };
  tasks: { kind: string; reasons: { text: string }[]; done: { kind: string } | null }[];
};
const itemOf = async (id: string) =>
  ((await owner.agent.get(`${base()}/rounds/today`).expect(200)).body.items as Item[]).find(
    (i) => i.animal.id === id,
  );

beforeAll(async () => {
  ctx = await createTestContext();
  owner = await signUp(ctx);
});
afterEach(() => ctx.setNow(null));
afterAll(async () => {
  await ctx.close();
});

describe('enclosure care on today’s round', () => {
  it('gives an outgrown juvenile after its molt a rehouse, a bolus pick-out and its own misting; a rehouse with sizes updates the record', async () => {
    ctx.setNow(NOW);
    const { id } = await createAnimal(ctx.database.db, owner.collectionId, {
      lifeStage: 'juvenile',
      sizeMm: 50,
      hasWaterDish: true,
      mistEveryDays: 3,
      spotCleanEveryDays: null,
      enclosureLengthMm: 120,
      enclosureWidthMm: 100,
    });
    // Molted 20 days ago at 60 mm (the record follows the molt), fed and watered yesterday.
    await owner.agent
      .post(`${base()}/events`)
      .send(
        batch([
          tap(id, 'molted', new Date(NOW.getTime() - 20 * day), { sizeMm: 60 }),
          tap(id, 'ate', new Date(NOW.getTime() - day)),
          tap(id, 'watered', new Date(NOW.getTime() - day)),
        ]),
      )
      .expect(200);
    const item = (await itemOf(id))!;
    expect(item.tasks.map((t) => t.kind)).toEqual(['mist', 'spot_clean', 'rehouse']);
    // 2 × 60 mm = 120 mm of floor at least; 100 mm is short (R22).
    expect(item.tasks[2]!.reasons[0]!.text).toMatch(/60 mm leg span in a 120 × 100 mm floor/);

    const res = await owner.agent
      .post(`${base()}/events`)
      .send(batch([tap(id, 'rehoused', NOW, { lengthMm: 200, widthMm: 150 })]))
      .expect(200);
    expect(res.body.results[0].status).toBe('accepted');
    const [row] = await ctx.database.db.select().from(animals).where(eq(animals.id, id));
    expect([row!.enclosureLengthMm, row!.enclosureWidthMm]).toEqual([200, 150]);
    const after = (await itemOf(id))!;
    // The rehouse settles itself and the spot-clean (a clean enclosure).
    expect(after.tasks.map((t) => [t.kind, t.done?.kind ?? null])).toEqual([
      ['mist', null],
      ['spot_clean', 'rehoused'],
      ['rehouse', 'rehoused'],
    ]);
    const schedule = await owner.agent.get(`${base()}/animals/${id}/schedule`).expect(200);
    expect(schedule.body.notes.map((n: { code: string }) => n.code)).toContain('settling');
  });

  it('refuses a rehouse with a size no enclosure has, in words a person can read', async () => {
    const { id } = await createAnimal(ctx.database.db, owner.collectionId);
    const res = await owner.agent
      .post(`${base()}/events`)
      .send(batch([tap(id, 'rehoused', new Date(), { lengthMm: 5 })], new Date()))
      .expect(200);
    expect(res.body.results[0]).toMatchObject({ status: 'rejected', reason: 'invalid' });
    expect(res.body.results[0].message).toMatch(/length must be at least 10 mm/);
  });

  it('saves the enclosure and the animal’s own intervals from the animal form, and refuses bad ones', async () => {
    const created = await owner.agent
      .post(`${base()}/animals`)
      .send(
        animalBody({
          care: {
            ...animalBody().care,
            mistEveryDays: 0,
            spotCleanEveryDays: 10,
            enclosureLengthMm: 300,
            enclosureWidthMm: 200,
            enclosureHeightMm: 400,
          },
        }),
      )
      .expect(201);
    expect(created.body).toMatchObject({
      mistEveryDays: 0,
      moistenEveryDays: null,
      spotCleanEveryDays: 10,
      enclosureLengthMm: 300,
      enclosureWidthMm: 200,
      enclosureHeightMm: 400,
    });
    const bad = await owner.agent
      .post(`${base()}/animals`)
      .send(animalBody({ care: { ...animalBody().care, mistEveryDays: -1 } }))
      .expect(422);
    expect(JSON.stringify(bad.body)).toMatch(/Misting: 0 \(never\) at least\./);
  });
});

describe('a helper covering', () => {
  it('may record misting, moistening and a spot-clean, but not a rehouse (keepers only)', async () => {
    ctx.setNow(NOW);
    const helper = await signUp(ctx);
    await addMember(ctx.database.db, {
      collectionId: owner.collectionId,
      userId: helper.userId,
      role: 'helper',
      startsAt: new Date(NOW.getTime() - day),
      endsAt: new Date(NOW.getTime() + day),
    });
    const { id } = await createAnimal(ctx.database.db, owner.collectionId);
    const at = new Date(NOW.getTime() - 60_000);
    const res = await helper.agent
      .post(`${base()}/events`)
      .send(
        batch([
          tap(id, 'misted', at),
          tap(id, 'substrate_moistened', at),
          tap(id, 'spot_cleaned', at),
          tap(id, 'rehoused', at),
        ]),
      )
      .expect(200);
    expect(
      res.body.results.map((r: { status: string; reason?: string }) => r.reason ?? r.status),
    ).toEqual(['accepted', 'accepted', 'accepted', 'not_for_helpers']);
  });
});
