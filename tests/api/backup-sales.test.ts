// Sales — S: a backup carries the collection's sales (settings, buyers, listings, sales with
// their animals, invoices with their lines, payments) and a restore brings them back with new
// ids, every reference following: a sale's buyer and animals, an invoice's sale, a payment's
// invoice, and the sale named in a sold animal's history. A file that names a buyer it does not
// hold is refused in words, with nothing written.
import { randomUUID } from 'node:crypto';
import { eq, sql } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { payments } from '../../server/db/schema/sales';
import { signUp, type SignedUp } from '../factories';
import { createTestContext, type TestContext } from '../setup/test-app';
import { listedClutch, receivePayment } from '../support/sales';

type Row = Record<string, unknown> & { id: string };
interface Backup {
  animals: (Row & { labelCode: string })[];
  events: (Row & { animalId: string; kind: string; payload: Record<string, unknown> })[];
  salesSettings: Record<string, unknown>[];
  buyers: Row[];
  saleListings: (Record<string, unknown> & { animalId: string })[];
  sales: (Row & { buyerId: string; animals: { animalId: string }[] })[];
  invoices: (Row & { saleId: string; lines: { animalId: string | null }[] })[];
  payments: (Row & { invoiceId: string })[];
  [key: string]: unknown;
}

let ctx: TestContext;
let source: SignedUp;
let backup: Backup;
const base = (who: SignedUp) => `/api/collections/${who.collectionId}`;

beforeAll(async () => {
  ctx = await createTestContext();
  source = await signUp(ctx);
  ctx.setNow(new Date('2026-12-07T15:00:00Z')); // a Monday in Toronto
  const c = base(source);
  const db = ctx.database.db;
  await source.agent
    .put(`${c}/sales-settings`)
    .send({
      currency: 'CAD',
      taxRateBp: 1300,
      taxRounding: 'per_line',
      sellerDetails: 'Backup Inverts',
      holdDays: 5,
      safeMinC: 6,
      safeMaxC: 29,
    })
    .expect(200);
  const ids = await listedClutch(db, source.collectionId, { count: 6 });
  const buyer = (
    await source.agent
      .post(`${c}/buyers`)
      .send({ name: 'Ines Varga', email: 'ines@example.test', address: '9 Elm St' })
      .expect(201)
  ).body.id;
  const other = (await source.agent.post(`${c}/buyers`).send({ name: 'Otto Pike' }).expect(201))
    .body.id;
  // Sales made a minute apart: a backup lists them in the order they were made.
  let minute = 0;
  const tick = () => ctx.setNow(new Date(Date.parse('2026-12-07T15:00:00Z') + ++minute * 60_000));
  // A shipped sale: invoiced, paid (a payment row as the payments part writes it), shipped.
  tick();
  const shipped = (
    await source.agent
      .post(`${c}/sales`)
      .send({ buyerId: buyer, animalIds: ids.slice(0, 3) })
      .expect(201)
  ).body.id;
  const invoice = (
    await source.agent
      .post(`${c}/sales/${shipped}/invoice`)
      .send({ shippingMinor: 2500 })
      .expect(201)
  ).body;
  await db.insert(payments).values({
    invoiceId: invoice.id,
    kind: 'payment',
    amountMinor: invoice.totalMinor,
    currency: 'CAD',
    providerRef: `pi_${randomUUID()}`,
  });
  await receivePayment(db, invoice.id, invoice.totalMinor, 'paid');
  await source.agent
    .put(`${c}/sales/${shipped}/shipping`)
    .send({
      shipOn: '2026-12-08',
      shipRoute: 'Toronto to Kingston',
      forecastLowC: 8,
      forecastHighC: 14,
      packing: { container: true, padding: true },
      carrier: 'Courier',
      tracking: 'TRK1',
    })
    .expect(200);
  await source.agent.post(`${c}/sales/${shipped}/shipping/confirm`).send({}).expect(200);
  await source.agent.post(`${c}/sales/${shipped}/ship`).expect(200);
  // A cancelled sale (its invoice cancelled, animals released) and one still reserved.
  tick();
  const dropped = (
    await source.agent
      .post(`${c}/sales`)
      .send({ buyerId: other, animalIds: [ids[3]] })
      .expect(201)
  ).body.id;
  await source.agent.post(`${c}/sales/${dropped}/invoice`).send({}).expect(201);
  await source.agent.post(`${c}/sales/${dropped}/cancel`).expect(200);
  tick();
  await source.agent
    .post(`${c}/sales`)
    .send({ buyerId: other, animalIds: [ids[3], ids[4]] })
    .expect(201);
  backup = (await source.agent.get(`${c}/backup`).expect(200)).body;
});
afterAll(async () => {
  ctx.setNow(null);
  await ctx.close();
});

/** The sales lists with every id replaced by what it names (label codes, names, numbers). */
function described(b: Backup) {
  const code = new Map(b.animals.map((a) => [a.id, a.labelCode]));
  const buyer = new Map(b.buyers.map((x) => [x.id, x.name]));
  const sale = new Map(b.sales.map((x, i) => [x.id, `sale ${i}`]));
  const invoice = new Map(b.invoices.map((x) => [x.id, x.number]));
  const strip = <T extends Record<string, unknown>>({ id: _id, ...rest }: T) => rest;
  return {
    salesSettings: b.salesSettings.map(({ updatedAt: _u, ...s }) => s),
    buyers: b.buyers.map(strip),
    saleListings: b.saleListings.map((l) => ({ ...l, animalId: code.get(l.animalId) })),
    sales: b.sales.map((s) => ({
      ...strip(s),
      buyerId: buyer.get(s.buyerId),
      // A sale's animals have no order of their own: by label code.
      animals: s.animals
        .map((a) => ({ ...a, animalId: code.get(a.animalId) }))
        .sort((x, y) => String(x.animalId).localeCompare(String(y.animalId))),
    })),
    invoices: b.invoices.map((x) => ({
      ...strip(x),
      saleId: sale.get(x.saleId),
      lines: x.lines.map((l) => ({ ...l, animalId: l.animalId && code.get(l.animalId) })),
    })),
    // A copy restored beside its original marks the payment service's ref (unique per server).
    payments: b.payments.map((p) => ({
      ...strip(p),
      invoiceId: invoice.get(p.invoiceId),
      providerRef: String(p.providerRef).replace(/#copy-[0-9a-f-]+$/, ''),
    })),
    soldWith: b.events
      .filter((e) => e.kind === 'status_changed')
      .map((e) => `${code.get(e.animalId)} ${sale.get(e.payload.saleId as string)}`)
      .sort(),
  };
}

describe('a backup with sales', () => {
  it('holds them, and a restore brings every one back with its references', async () => {
    const d = described(backup);
    expect(d.buyers).toHaveLength(2);
    expect(d.sales.map((s) => (s as Record<string, unknown>).status)).toEqual([
      'shipped',
      'cancelled',
      'reserved',
    ]);
    expect(d.invoices.map((i) => (i as Record<string, unknown>).status)).toEqual([
      'paid',
      'cancelled',
    ]);
    expect(d.payments).toHaveLength(1);
    // The three shipped ones keep their listings (their care sheets keep the words).
    expect(d.saleListings).toHaveLength(6);
    expect(d.soldWith).toHaveLength(3);
    expect(d.soldWith.every((s) => s.endsWith('sale 0'))).toBe(true);

    const into = await signUp(ctx);
    const restored = await into.agent.post(`${base(into)}/restore`).send(backup);
    expect(restored.status, JSON.stringify(restored.body)).toBe(201);
    const copy: Backup = (await into.agent.get(`${base(into)}/backup`).expect(200)).body;
    expect(described(copy)).toEqual(d);
    expect(copy.sales[0]!.id).not.toBe(backup.sales[0]!.id);
    expect(copy.payments[0]!.providerRef).toBe(
      `${backup.payments[0]!.providerRef}#copy-${copy.payments[0]!.id}`,
    );

    // The restored collection works: its sales, and who bought a sold animal.
    const list = (await into.agent.get(`${base(into)}/sales`).expect(200)).body;
    expect(list.counts).toEqual({ reserved: 1, shipped: 1, expired: 0, cancelled: 1 });
    const sold = copy.animals.find((a) => a.labelCode === d.sales[0]!.animals[0]!.animalId)!;
    const record = await into.agent.get(`${base(into)}/animals/${sold.id}/sale`).expect(200);
    expect(record.body.sale).toMatchObject({ buyerName: 'Ines Varga', saleId: copy.sales[0]!.id });
    // The next invoice carries on from the original's numbering.
    const reserved = copy.sales[2]!.id;
    const next = await into.agent
      .post(`${base(into)}/sales/${reserved}/invoice`)
      .send({})
      .expect(201);
    expect(next.body.number).toBe('2026-0003');
  });

  it('refuses a sale for a buyer the file does not hold, writing nothing', async () => {
    const bad = structuredClone(backup);
    bad.sales[0]!.buyerId = randomUUID();
    const into = await signUp(ctx);
    const res = await into.agent
      .post(`${base(into)}/restore`)
      .send(bad)
      .expect(422);
    expect(res.body.error.message).toMatch(/does not contain/);
    const n = await ctx.database.db.execute<{ n: string }>(
      sql`select (select count(*) from buyers where collection_id = ${into.collectionId}) + (select count(*) from animals where collection_id = ${into.collectionId}) as n`,
    );
    expect(Number(n.rows[0]!.n)).toBe(0);
  });

  it('restores only into a collection without sales of its own', async () => {
    const into = await signUp(ctx);
    await into.agent
      .post(`${base(into)}/buyers`)
      .send({ name: 'Already here' })
      .expect(201);
    const res = await into.agent
      .post(`${base(into)}/restore`)
      .send(backup)
      .expect(409);
    expect(res.body.error.message).toMatch(/sales settings or buyers/);
    expect(
      await ctx.database.db.select().from(payments).where(eq(payments.currency, 'XXX')),
    ).toEqual([]);
  });
});
