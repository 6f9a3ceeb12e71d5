import { randomUUID } from 'node:crypto';
import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { ListingsResponse } from '#shared/schemas/listings';
import { DEMO_PASSWORD } from '../../server/access/demo-people';
import { animals, eggSacs, events } from '../../server/db/schema/animals';
import { buyers, saleAnimals, sales } from '../../server/db/schema/sales';
import { demoCollectionId, seedDemo } from '../../server/seed/demo';
import { createAnimal, signUp, type SignedUp } from '../factories';
import { createTestContext, type TestContext } from '../setup/test-app';

let ctx: TestContext;
let owner: SignedUp;
let base: string;
let slings: { id: string; name: string }[];
let mother: string;

const CLUTCH = 'T. test sac 1';
const price = {
  priceMinor: 2500,
  currency: 'CAD',
  description: 'Eating well, potted on coco fibre.',
};
const list = async () =>
  (await owner.agent.get(`${base}/listings`).expect(200)).body as ListingsResponse;

/** A live sale holding the animal, as the sales part writes it. */
async function reserve(animalId: string) {
  const db = ctx.database.db;
  const [buyer] = await db
    .insert(buyers)
    .values({ collectionId: owner.collectionId, name: 'A. Buyer' })
    .returning();
  const [sale] = await db
    .insert(sales)
    .values({ collectionId: owner.collectionId, buyerId: buyer!.id, reservedUntil: '2026-12-31' })
    .returning();
  await db
    .insert(saleAnimals)
    .values({ saleId: sale!.id, animalId, priceMinor: 2500, currency: 'CAD' });
  return sale!.id;
}

async function molt(animalId: string, voided = false) {
  const db = ctx.database.db;
  const at = new Date('2026-11-20T15:00:00Z');
  const id = randomUUID();
  const row = { collectionId: owner.collectionId, animalId, clientRecordedAt: at, effectiveAt: at };
  await db.insert(events).values({ id, kind: 'molted', payload: {}, ...row });
  if (voided)
    await db
      .insert(events)
      .values({ id: randomUUID(), kind: 'void', payload: { targetId: id }, ...row });
}

beforeAll(async () => {
  ctx = await createTestContext();
  owner = await signUp(ctx);
  base = `/api/collections/${owner.collectionId}`;
  const db = ctx.database.db;
  const female = await createAnimal(db, owner.collectionId, {
    name: 'Mother',
    scientificName: 'Hapalopus formosus',
    sex: 'female',
  });
  mother = female.id;
  await db.insert(eggSacs).values({
    collectionId: owner.collectionId,
    femaleId: female.id,
    clutch: CLUTCH,
    laidOn: '2026-06-01',
    incubationMinDays: 40,
    incubationMaxDays: 60,
  });
  slings = [];
  for (let i = 1; i <= 6; i++) {
    const a = await createAnimal(db, owner.collectionId, {
      name: `Sling ${i}`,
      scientificName: 'Hapalopus formosus',
      commonName: 'Colombian pumpkin patch',
      lifeStage: 'sling',
      sex: i === 1 ? 'female' : 'unknown',
      sizeMm: 9 + i,
      clutch: CLUTCH,
    });
    slings.push({ id: a.id, name: a.name });
  }
  // Sling 5 died; sling 6 is already held for a buyer.
  await db.update(animals).set({ status: 'deceased' }).where(eq(animals.id, slings[4]!.id));
  await reserve(slings[5]!.id);
  // Sling 1 molted twice (one of them undone): instar 2.
  await molt(slings[0]!.id);
  await molt(slings[0]!.id, true);
});
afterAll(async () => {
  await ctx.close();
});

describe('listings', () => {
  it('offers a clutch in bulk: its kept slings in no sale, one price', async () => {
    const before = await list();
    expect(before.clutches).toEqual([{ clutch: CLUTCH, animals: 4 }]);
    const res = await owner.agent
      .post(`${base}/listings/bulk`)
      .send({ clutch: CLUTCH, ...price })
      .expect(200);
    expect(res.body).toEqual({ listed: 4, skipped: 2 });
    const { rows, groups } = await list();
    expect(rows.map((r) => [r.name, r.priceMinor, r.currency, r.state])).toEqual([
      ['Sling 1', 2500, 'CAD', 'available'],
      ['Sling 2', 2500, 'CAD', 'available'],
      ['Sling 3', 2500, 'CAD', 'available'],
      ['Sling 4', 2500, 'CAD', 'available'],
    ]);
    expect(rows[0]!.instar).toBe(2);
    expect(rows[1]!.instar).toBe(1);
    expect(groups).toEqual([
      {
        scientificName: 'Hapalopus formosus',
        commonName: 'Colombian pumpkin patch',
        group: 'tarantula',
        lifeStage: 'sling',
        available: 4,
        reserved: 0,
        sexes: { female: 1, male: 0, unknown: 3 },
        sizeMm: { min: 10, max: 13 },
        instar: { min: 1, max: 2 },
        price: { currency: 'CAD', min: 2500, max: 2500 },
      },
    ]);
  });

  it('counts a listed animal in a live sale as reserved, not available', async () => {
    await owner.agent
      .put(`${base}/listings/${slings[5]!.id}`)
      .send({ ...price, priceMinor: 3000 })
      .expect(200);
    const [group] = (await list()).groups;
    expect([group!.available, group!.reserved]).toEqual([4, 1]);
    // The reserved sling's price describes nothing on offer.
    expect(group!.price).toEqual({ currency: 'CAD', min: 2500, max: 2500 });
  });

  it('changes one listing, and refuses an animal that is no longer kept with words', async () => {
    const changed = await owner.agent
      .put(`${base}/listings/${slings[1]!.id}`)
      .send({
        priceMinor: 4000,
        currency: 'CAD',
        description: 'The big one',
        listedPublicly: false,
      })
      .expect(200);
    expect(changed.body).toMatchObject({
      animalId: slings[1]!.id,
      priceMinor: 4000,
      description: 'The big one',
      listedPublicly: false,
    });
    const gone = await owner.agent.put(`${base}/listings/${slings[4]!.id}`).send(price).expect(409);
    expect(gone.body.error.message).toBe(
      'Sling 5 is no longer in the collection (sold, deceased, rehomed or on loan): only animals you keep can be offered.',
    );
    await owner.agent.put(`${base}/listings/${randomUUID()}`).send(price).expect(404);
  });

  it('takes prices only as whole minor units in a known currency', async () => {
    const id = slings[2]!.id;
    const half = await owner.agent
      .put(`${base}/listings/${id}`)
      .send({ ...price, priceMinor: 25.5 })
      .expect(422);
    expect(half.body.error.message).toMatch(/whole number/);
    await owner.agent
      .put(`${base}/listings/${id}`)
      .send({ ...price, currency: 'XXX' })
      .expect(422);
    await owner.agent
      .put(`${base}/listings/${id}`)
      .send({ ...price, priceMinor: -1 })
      .expect(422);
    await owner.agent
      .post(`${base}/listings/bulk`)
      .send({ clutch: CLUTCH, animalIds: [id], ...price })
      .expect(422);
  });

  it('lists chosen animals all or none, and removes a listing', async () => {
    const refused = await owner.agent
      .post(`${base}/listings/bulk`)
      .send({ animalIds: [mother, slings[4]!.id], ...price })
      .expect(409);
    expect(refused.body.error.message).toMatch(/^Sling 5 is no longer/);
    expect((await list()).rows.some((r) => r.animalId === mother)).toBe(false);
    await owner.agent
      .post(`${base}/listings/bulk`)
      .send({ animalIds: [mother], ...price, priceMinor: 15000 })
      .expect(200);
    expect((await list()).groups.map((g) => [g.lifeStage, g.available])).toEqual([
      ['sling', 4],
      ['adult', 1],
    ]);
    await owner.agent.delete(`${base}/listings/${mother}`).expect(204);
    await owner.agent.delete(`${base}/listings/${mother}`).expect(404);
    await owner.agent
      .post(`${base}/listings/bulk`)
      .send({ clutch: 'No such clutch', ...price })
      .expect(404);
  });
});

describe('the demo', () => {
  it('offers 12 of its Hapalopus formosus clutch at CAD 25.00, with the public list off', async () => {
    await seedDemo(ctx.database.db, { bcryptCost: 10 });
    const demoId = (await demoCollectionId(ctx.database.db))!;
    const keeper = ctx.agent();
    await keeper
      .post('/api/auth/sign-in')
      .send({ email: 'owner@northlight.test', password: DEMO_PASSWORD })
      .expect(200);
    const { rows, groups, clutches } = (
      await keeper.get(`/api/collections/${demoId}/listings`).expect(200)
    ).body as ListingsResponse;
    expect(rows).toHaveLength(12);
    expect(new Set(rows.map((r) => `${r.clutch} ${r.priceMinor} ${r.currency}`))).toEqual(
      new Set(['H. formosus sac 1 2500 CAD']),
    );
    expect(groups.map((g) => [g.scientificName, g.lifeStage, g.available, g.reserved])).toEqual([
      ['Hapalopus formosus', 'sling', 12, 0],
    ]);
    // The whole clutch can be offered, or re-priced, at once.
    expect(clutches).toContainEqual({ clutch: 'H. formosus sac 1', animals: 24 });
    const list = (await keeper.get(`/api/collections/${demoId}/availability`).expect(200)).body;
    expect([list.on, list.path]).toEqual([false, null]);
  }, 30_000);
});
