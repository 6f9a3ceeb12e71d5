// The sale's edges: an animal that dies or is put back while in a sale, a gift (a zero
// invoice), a refunded hold, a running invoice number that is already taken, a sum too large.
import { and, eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { localDateOf } from '#shared/domain/local-dates';
import { MAX_MINOR } from '#shared/domain/sales/money';
import { invoices, saleAnimals, sales, salesSettings } from '../../server/db/schema/sales';
import { signUp, type SignedUp } from '../factories';
import { createTestContext, type TestContext } from '../setup/test-app';
import { listedClutch, receivePayment } from '../support/sales';

let ctx: TestContext;
let owner: SignedUp;
let c: string;
let buyerId: string;

beforeAll(async () => {
  ctx = await createTestContext();
  owner = await signUp(ctx);
  c = `/api/collections/${owner.collectionId}`;
  buyerId = (await owner.agent.post(`${c}/buyers`).send({ name: 'Edge Buyer' }).expect(201)).body
    .id;
});
afterAll(async () => {
  ctx.setNow(null);
  await ctx.close();
});

const today = () => localDateOf(new Date(), 'UTC');
const reserve = async (animalIds: string[]) =>
  (await owner.agent.post(`${c}/sales`).send({ buyerId, animalIds }).expect(201)).body.id as string;
const retire = (animalId: string, status = 'deceased') =>
  owner.agent
    .post(`${c}/animals/${animalId}/retire`)
    .send({ status, date: today(), note: 'Found at the morning check.' });
const live = async (animalId: string) =>
  ctx.database.db
    .select()
    .from(saleAnimals)
    .where(and(eq(saleAnimals.animalId, animalId)));

describe('an animal whose status changes while it is in a sale', () => {
  it('leaves a reserved sale with no invoice; the sale ends when it was the last', async () => {
    const [a, b] = await listedClutch(ctx.database.db, owner.collectionId, {
      count: 2,
      clutch: 'Edge clutch 1',
    });
    const saleId = await reserve([a!, b!]);
    await retire(a!).expect(200);
    expect((await live(a!))[0]!.releasedAt).not.toBeNull();
    const [still] = await ctx.database.db.select().from(sales).where(eq(sales.id, saleId));
    expect(still!.status).toBe('reserved');
    await retire(b!).expect(200);
    const [ended] = await ctx.database.db.select().from(sales).where(eq(sales.id, saleId));
    expect(ended!.status).toBe('cancelled');
  });

  it('is refused, in words, while it is on a live invoice', async () => {
    const [a] = await listedClutch(ctx.database.db, owner.collectionId, {
      count: 1,
      clutch: 'Edge clutch 2',
    });
    const saleId = await reserve([a!]);
    const invoice = (
      await owner.agent.post(`${c}/sales/${saleId}/invoice`).send({ shippingMinor: 0 }).expect(201)
    ).body;
    const refused = await retire(a!).expect(409);
    expect(refused.body.error.message).toContain(`invoice ${invoice.number} for Edge Buyer`);
    // Cancelled invoice: the change goes through and the animal leaves the sale.
    await owner.agent.post(`${c}/invoices/${invoice.id}/cancel`).expect(200);
    await retire(a!).expect(200);
    expect((await live(a!))[0]!.releasedAt).not.toBeNull();
  });

  it('put back after it was sold, it can be reserved again (the shipped sale keeps it)', async () => {
    const [a] = await listedClutch(ctx.database.db, owner.collectionId, {
      count: 1,
      clutch: 'Edge clutch 3',
    });
    const saleId = await reserve([a!]);
    const s = `${c}/sales/${saleId}`;
    const invoice = (await owner.agent.post(`${s}/invoice`).send({ shippingMinor: 0 }).expect(201))
      .body;
    await receivePayment(ctx.database.db, invoice.id, invoice.totalMinor, 'paid');
    await owner.agent
      .put(`${s}/shipping`)
      .send({ shipOn: today(), shipRoute: 'Across town', forecastLowC: 12, forecastHighC: 20 })
      .expect(200);
    await owner.agent.post(`${s}/shipping/confirm`).send({ shipAnyway: true }).expect(200);
    await owner.agent.post(`${s}/ship`).expect(200);
    await owner.agent.post(`${c}/animals/${a}/reinstate`).send({}).expect(200);
    const again = await reserve([a!]);
    expect(again).not.toBe(saleId);
    const shipped = await owner.agent.get(s).expect(200);
    expect(shipped.body.status).toBe('shipped');
  });
});

describe('money edges', () => {
  it('a zero invoice (a gift) is paid as it stands, so the sale can ship', async () => {
    const [a] = await listedClutch(ctx.database.db, owner.collectionId, {
      count: 1,
      clutch: 'Edge clutch 4',
      priceMinor: 0,
    });
    const saleId = await reserve([a!]);
    const invoice = (
      await owner.agent.post(`${c}/sales/${saleId}/invoice`).send({ shippingMinor: 0 }).expect(201)
    ).body;
    expect(invoice).toMatchObject({ totalMinor: 0, status: 'paid' });
  });

  it('a hold whose money was all refunded expires like an unpaid one', async () => {
    const [a] = await listedClutch(ctx.database.db, owner.collectionId, {
      count: 1,
      clutch: 'Edge clutch 5',
    });
    const saleId = (
      await owner.agent
        .post(`${c}/sales`)
        .send({ buyerId, animalIds: [a], reservedUntil: today() })
        .expect(201)
    ).body.id as string;
    const invoice = (
      await owner.agent.post(`${c}/sales/${saleId}/invoice`).send({ shippingMinor: 0 }).expect(201)
    ).body;
    await ctx.database.db
      .update(invoices)
      .set({ paidMinor: invoice.totalMinor, refundedMinor: invoice.totalMinor, status: 'refunded' })
      .where(eq(invoices.id, invoice.id));
    ctx.setNow(new Date(Date.now() + 3 * 86_400_000));
    try {
      await ctx.services.sales.expireReservations();
    } finally {
      ctx.setNow(null);
    }
    const [row] = await ctx.database.db.select().from(sales).where(eq(sales.id, saleId));
    expect(row!.status).toBe('expired');
  });

  it('takes the next invoice number when the running one is already used (a restored backup)', async () => {
    const [a, b] = await listedClutch(ctx.database.db, owner.collectionId, {
      count: 2,
      clutch: 'Edge clutch 6',
    });
    const first = (
      await owner.agent
        .post(`${c}/sales/${await reserve([a!])}/invoice`)
        .send({ shippingMinor: 0 })
        .expect(201)
    ).body;
    const taken = Number(first.number.slice(5));
    // The counter falls behind, as after restoring invoices with a stale counter.
    await ctx.database.db
      .update(salesSettings)
      .set({ nextInvoiceNumber: taken })
      .where(eq(salesSettings.collectionId, owner.collectionId));
    const second = (
      await owner.agent
        .post(`${c}/sales/${await reserve([b!])}/invoice`)
        .send({ shippingMinor: 0 })
        .expect(201)
    ).body;
    expect(Number(second.number.slice(5))).toBe(taken + 1);
  });

  it('refuses, in words, an invoice whose sum is beyond any amount kept', async () => {
    const [a] = await listedClutch(ctx.database.db, owner.collectionId, {
      count: 1,
      clutch: 'Edge clutch 7',
    });
    const saleId = await reserve([a!]);
    const line = { description: 'Enclosures', quantity: 1000, unitMinor: MAX_MINOR };
    const res = await owner.agent
      .post(`${c}/sales/${saleId}/invoice`)
      .send({ shippingMinor: 0, extraLines: [line, line] })
      .expect(422);
    expect(res.body.error.message).toMatch(/larger than any amount/);
  });
});
