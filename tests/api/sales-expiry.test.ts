import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { signUp, type SignedUp } from '../factories';
import { createTestContext, type TestContext } from '../setup/test-app';
import { listedClutch, receivePayment } from '../support/sales';

// America/Toronto: EDT (UTC−4) until 2026-11-01 02:00 local, then EST (UTC−5) — the IANA tz
// database's rule for Canada/US since 2007 (first Sunday in November), from memory. Local
// midnight is 04:00 UTC before the change and 05:00 UTC after it; 2026-11-01 lasts 25 hours.
let ctx: TestContext;
let owner: SignedUp;
let c: string;

beforeAll(async () => {
  ctx = await createTestContext();
  owner = await signUp(ctx, { timeZone: 'America/Toronto' });
  c = `/api/collections/${owner.collectionId}`;
});
afterAll(async () => {
  ctx.setNow(null);
  await ctx.close();
});

async function reserve(reservedUntil: string, count = 2) {
  const buyer = await owner.agent.post(`${c}/buyers`).send({ name: 'Dale Fenwick' }).expect(201);
  const ids = await listedClutch(ctx.database.db, owner.collectionId, { count });
  const sale = await owner.agent
    .post(`${c}/sales`)
    .send({ buyerId: buyer.body.id, animalIds: ids, reservedUntil })
    .expect(201);
  return { id: sale.body.id as string, ids };
}

const statusOf = async (saleId: string) =>
  (await owner.agent.get(`${c}/sales/${saleId}`).expect(200)).body.status as string;

async function runAt(iso: string) {
  ctx.setNow(new Date(iso));
  return ctx.services.sales.expireReservations();
}

describe('reservations expire by themselves', () => {
  it('day by day across the end of daylight time: held through the last day, expired after', async () => {
    ctx.setNow(new Date('2026-10-28T16:00:00Z'));
    const sat = await reserve('2026-10-31');
    const sun = await reserve('2026-11-01'); // the 25-hour day
    const invoice = await owner.agent
      .post(`${c}/sales/${sun.id}/invoice`)
      .send({ shippingMinor: 0 })
      .expect(201);

    // Local noon each day (16:00 UTC in EDT, 17:00 UTC in EST).
    const seen: Record<string, [string, string]> = {};
    for (const noon of [
      '2026-10-29T16:00:00Z',
      '2026-10-30T16:00:00Z',
      '2026-10-31T16:00:00Z',
      '2026-11-01T17:00:00Z',
      '2026-11-02T17:00:00Z',
      '2026-11-03T17:00:00Z',
    ]) {
      await runAt(noon);
      seen[noon.slice(0, 10)] = [await statusOf(sat.id), await statusOf(sun.id)];
    }
    expect(seen).toEqual({
      '2026-10-29': ['reserved', 'reserved'],
      '2026-10-30': ['reserved', 'reserved'],
      '2026-10-31': ['reserved', 'reserved'],
      '2026-11-01': ['expired', 'reserved'],
      '2026-11-02': ['expired', 'expired'],
      '2026-11-03': ['expired', 'expired'],
    });

    // The expired sale's animals are back on offer and its open invoice is cancelled.
    const available = (await owner.agent.get(`${c}/sales/available`).expect(200)).body.animals.map(
      (a: { id: string }) => a.id,
    );
    expect(available).toEqual(expect.arrayContaining([...sat.ids, ...sun.ids]));
    const cancelled = await owner.agent.get(`${c}/invoices/${invoice.body.id}`).expect(200);
    expect(cancelled.body.status).toBe('cancelled');
  });

  it('turns exactly at local midnight, an hour later in UTC once daylight time has ended', async () => {
    ctx.setNow(new Date('2026-10-28T16:00:00Z'));
    const sat = await reserve('2026-10-31', 1);
    const sun = await reserve('2026-11-01', 1);
    // 23:59 EDT on the Saturday, then 00:00 EDT on Sunday (04:00 UTC).
    expect(await runAt('2026-11-01T03:59:00Z')).toBe(0);
    expect(await statusOf(sat.id)).toBe('reserved');
    expect(await runAt('2026-11-01T04:00:00Z')).toBe(1);
    expect(await statusOf(sat.id)).toBe('expired');
    // Sunday is 25 hours long: 23:59 EST is 04:59 UTC on Monday, midnight is 05:00 UTC.
    expect(await runAt('2026-11-02T04:59:00Z')).toBe(0);
    expect(await statusOf(sun.id)).toBe('reserved');
    expect(await runAt('2026-11-02T05:00:00Z')).toBe(1);
    expect(await statusOf(sun.id)).toBe('expired');
  });

  it('never expires a part-paid sale, and running again changes nothing', async () => {
    ctx.setNow(new Date('2026-12-01T16:00:00Z'));
    const paid = await reserve('2026-12-02');
    const unpaid = await reserve('2026-12-02');
    const invoice = (
      await owner.agent.post(`${c}/sales/${paid.id}/invoice`).send({ shippingMinor: 0 }).expect(201)
    ).body;
    await receivePayment(ctx.database.db, invoice.id, 1000, 'part_paid');

    expect(await runAt('2026-12-05T16:00:00Z')).toBe(1);
    expect(await statusOf(paid.id)).toBe('reserved');
    expect(await statusOf(unpaid.id)).toBe('expired');
    const before = (await owner.agent.get(`${c}/sales`).expect(200)).body;
    expect(await runAt('2026-12-05T16:15:00Z')).toBe(0);
    expect(await runAt('2026-12-06T16:00:00Z')).toBe(0);
    expect((await owner.agent.get(`${c}/sales`).expect(200)).body).toEqual(before);
    // A new reservation of the released animals is possible; the part-paid one's are still held.
    const buyer = (await owner.agent.post(`${c}/buyers`).send({ name: 'Next buyer' })).body.id;
    await owner.agent
      .post(`${c}/sales`)
      .send({ buyerId: buyer, animalIds: unpaid.ids })
      .expect(201);
    await owner.agent.post(`${c}/sales`).send({ buyerId: buyer, animalIds: paid.ids }).expect(409);
  });
});

describe('the expire-reservations job', () => {
  it('runs through pg-boss and expires a hold that has run out', async () => {
    const { startJobs, EXPIRE_RESERVATIONS } = await import('../../server/jobs/jobs');
    const { createLogger } = await import('../../server/logger');
    ctx.setNow(new Date('2026-12-10T16:00:00Z'));
    const sale = await reserve('2026-12-11', 1);
    ctx.setNow(new Date('2026-12-13T16:00:00Z'));
    const jobs = await startJobs({
      databaseUrl: ctx.databaseUrl,
      rounds: ctx.services.rounds,
      coverReports: ctx.services.coverReports,
      sales: ctx.services.sales,
      logger: createLogger({ NODE_ENV: 'test' }),
    });
    try {
      await jobs.boss.send(EXPIRE_RESERVATIONS, {});
      await expect.poll(() => statusOf(sale.id), { timeout: 20_000 }).toBe('expired');
    } finally {
      await jobs.stop();
    }
  }, 40_000);
});
