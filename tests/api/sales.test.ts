import { execFileSync } from 'node:child_process';
import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { animals, events } from '../../server/db/schema/animals';
import { buyers, saleListings, salesSettings } from '../../server/db/schema/sales';
import { demoCollectionId, seedDemo } from '../../server/seed/demo';
import { addMember, createAnimal, signUp, type SignedUp } from '../factories';
import { createTestContext, type TestContext } from '../setup/test-app';
import { listedClutch, receivePayment } from '../support/sales';

let ctx: TestContext;
let owner: SignedUp;
let c: string;

beforeAll(async () => {
  ctx = await createTestContext();
  owner = await signUp(ctx);
  c = `/api/collections/${owner.collectionId}`;
});
afterAll(async () => {
  ctx.setNow(null);
  await ctx.close();
});

const settings = {
  currency: 'CAD',
  taxRateBp: 1300,
  taxRounding: 'per_invoice',
  sellerDetails: 'Test Inverts\n1 Queen St, Toronto',
  holdDays: 5,
  safeMinC: 7,
  safeMaxC: 28,
};

async function newBuyer(overrides: Record<string, unknown> = {}) {
  const res = await owner.agent
    .post(`${c}/buyers`)
    .send({ name: 'Robin Ashgrove', email: 'robin@example.test', ...overrides })
    .expect(201);
  return res.body.id as string;
}

describe('sales settings', () => {
  it('starts from the defaults and keeps what the keeper saves', async () => {
    const first = await owner.agent.get(`${c}/sales-settings`).expect(200);
    expect(first.body).toMatchObject({ currency: 'EUR', taxRateBp: 0, holdDays: 7, safeMinC: 5 });
    const saved = await owner.agent.put(`${c}/sales-settings`).send(settings).expect(200);
    expect(saved.body).toEqual(settings);
    expect((await owner.agent.get(`${c}/sales-settings`).expect(200)).body).toEqual(settings);
  });

  it('refuses an unknown currency, a rate over 100 % and an upside-down range, in words', async () => {
    for (const bad of [
      { currency: 'XYZ' },
      { taxRateBp: 10_001 },
      { safeMinC: 30, safeMaxC: 10 },
      { holdDays: 0 },
    ]) {
      const res = await owner.agent
        .put(`${c}/sales-settings`)
        .send({ ...settings, ...bad })
        .expect(422);
      expect(res.body.error.message.length).toBeGreaterThan(10);
    }
  });
});

describe('buyers', () => {
  it('are added, listed, edited and deleted; one with sales stays (409)', async () => {
    const id = await newBuyer({ phone: '416 555 0101', address: '2 King St' });
    await owner.agent
      .patch(`${c}/buyers/${id}`)
      .send({ name: 'Robin A.', email: '', notes: 'Prefers Tuesday shipping' })
      .expect(200)
      .expect((r) =>
        expect(r.body).toMatchObject({
          name: 'Robin A.',
          email: null, // an empty string clears it
          phone: '416 555 0101', // not sent: kept
          notes: 'Prefers Tuesday shipping',
          saleCount: 0,
        }),
      );
    const list = await owner.agent.get(`${c}/buyers`).expect(200);
    expect(list.body.buyers.map((b: { id: string }) => b.id)).toContain(id);
    await owner.agent.delete(`${c}/buyers/${id}`).expect(204);
    await owner.agent.get(`${c}/buyers/${id}`).expect(404);

    const kept = await newBuyer();
    const [animalId] = await listedClutch(ctx.database.db, owner.collectionId, { count: 1 });
    await owner.agent
      .post(`${c}/sales`)
      .send({ buyerId: kept, animalIds: [animalId] })
      .expect(201);
    expect((await owner.agent.get(`${c}/buyers/${kept}`).expect(200)).body.saleCount).toBe(1);
    const listed = (await owner.agent.get(`${c}/buyers`).expect(200)).body.buyers;
    expect(listed.find((b: { id: string }) => b.id === kept).saleCount).toBe(1);
    const refused = await owner.agent.delete(`${c}/buyers/${kept}`).expect(409);
    expect(refused.body.error.message).toMatch(/has 1 sale\(s\) on record/);
  });

  it('refuses a bad e-mail address with words', async () => {
    const res = await owner.agent
      .post(`${c}/buyers`)
      .send({ name: 'X', email: 'not-an-address' })
      .expect(422);
    expect(res.body.error.message).toMatch(/e-mail/i);
  });
});

describe('reservations', () => {
  it('reserve listed animals until today + hold days in the collection’s zone', async () => {
    // 2026-12-03 at 03:30 UTC is still 2026-12-02 in Toronto (UTC−5): the hold counts from there.
    ctx.setNow(new Date('2026-12-03T03:30:00Z'));
    const buyerId = await newBuyer();
    const ids = await listedClutch(ctx.database.db, owner.collectionId, { count: 3 });
    const res = await owner.agent.post(`${c}/sales`).send({ buyerId, animalIds: ids }).expect(201);
    expect(res.body).toMatchObject({
      status: 'reserved',
      reservedUntil: '2026-12-07',
      animalCount: 3,
      priceMinor: 7500,
      currency: 'CAD',
      invoice: null,
    });
    const available = await owner.agent.get(`${c}/sales/available`).expect(200);
    expect(available.body.animals.map((a: { id: string }) => a.id)).not.toEqual(
      expect.arrayContaining([ids[0]]),
    );
    // A second reservation of a held animal: refused in words.
    const again = await owner.agent
      .post(`${c}/sales`)
      .send({ buyerId, animalIds: [ids[0]] })
      .expect(409);
    expect(again.body.error.message).toMatch(/already reserved/);
    ctx.setNow(null);
  });

  it('lets exactly one of two reservations at once take the same animal', async () => {
    const buyerId = await newBuyer();
    const [shared, other] = await listedClutch(ctx.database.db, owner.collectionId, { count: 2 });
    const [a, b] = await Promise.all([
      owner.agent.post(`${c}/sales`).send({ buyerId, animalIds: [shared] }),
      owner.agent.post(`${c}/sales`).send({ buyerId, animalIds: [other, shared] }),
    ]);
    expect([a.status, b.status].sort()).toEqual([201, 409]);
    const loser = a.status === 409 ? a : b;
    expect(loser.body.error.message).toMatch(/already reserved/);
    // Nothing of the losing sale is left: `other` is still available.
    const available = await owner.agent.get(`${c}/sales/available`).expect(200);
    const left = available.body.animals.map((x: { id: string }) => x.id);
    expect(left.includes(other)).toBe(a.status === 201);
  });

  it('refuses unlisted animals, a past hold and a hold over a year, with words', async () => {
    const buyerId = await newBuyer();
    const unlisted = await createAnimal(ctx.database.db, owner.collectionId);
    const r1 = await owner.agent
      .post(`${c}/sales`)
      .send({ buyerId, animalIds: [unlisted.id] })
      .expect(409);
    expect(r1.body.error.message).toMatch(/not listed/);
    const [id] = await listedClutch(ctx.database.db, owner.collectionId, { count: 1 });
    for (const reservedUntil of ['2020-01-01', '2099-01-01'])
      await owner.agent
        .post(`${c}/sales`)
        .send({ buyerId, animalIds: [id], reservedUntil })
        .expect(422);
  });

  it('extends a hold and cancels a sale, which releases its animals', async () => {
    const buyerId = await newBuyer();
    const ids = await listedClutch(ctx.database.db, owner.collectionId, { count: 2 });
    const sale = (
      await owner.agent.post(`${c}/sales`).send({ buyerId, animalIds: ids }).expect(201)
    ).body;
    const until = sale.reservedUntil.replace(/-\d\d$/, '-28');
    await owner.agent
      .patch(`${c}/sales/${sale.id}`)
      .send({ reservedUntil: until, note: 'Buyer pays Friday' })
      .expect(200)
      .expect((r) =>
        expect(r.body).toMatchObject({ reservedUntil: until, note: 'Buyer pays Friday' }),
      );
    const cancelled = await owner.agent.post(`${c}/sales/${sale.id}/cancel`).expect(200);
    expect(cancelled.body.status).toBe('cancelled');
    expect(cancelled.body.animals.every((a: { released: boolean }) => a.released)).toBe(true);
    const available = await owner.agent.get(`${c}/sales/available`).expect(200);
    expect(available.body.animals.map((a: { id: string }) => a.id)).toEqual(
      expect.arrayContaining(ids),
    );
    await owner.agent.post(`${c}/sales/${sale.id}/cancel`).expect(409);
    const list = await owner.agent.get(`${c}/sales`).expect(200);
    expect(list.body.counts.cancelled).toBeGreaterThanOrEqual(1);
  });
});

describe('shipping and the hand-over', () => {
  it('checks the forecast against the keeper’s range, needs "ship anyway" over concerns, and ships only when paid', async () => {
    await owner.agent.put(`${c}/sales-settings`).send(settings).expect(200);
    const buyerId = await newBuyer();
    const ids = await listedClutch(ctx.database.db, owner.collectionId, { count: 2 });
    const sale = (
      await owner.agent.post(`${c}/sales`).send({ buyerId, animalIds: ids }).expect(201)
    ).body;
    const s = `${c}/sales/${sale.id}`;
    await owner.agent.post(`${s}/shipping/confirm`).send({}).expect(409);
    // 2026-12-08 is a Tuesday; a 3 °C night is below the keeper's 7 °C.
    const shipping = {
      shipOn: '2026-12-08',
      shipRoute: 'Toronto to Ottawa',
      forecastLowC: 3,
      forecastHighC: 12,
      packing: { container: true },
      carrier: 'Overnight courier',
      tracking: null,
    };
    const put = await owner.agent.put(`${s}/shipping`).send(shipping).expect(200);
    expect(put.body.shipping.concerns).toEqual([{ kind: 'too_cold', lowC: 3, minC: 7 }]);
    expect(
      put.body.shipping.packing.find((p: { key: string }) => p.key === 'heat_pack').needed,
    ).toBe(true);
    expect(put.body.shipping.caution).toMatch(/permits/);
    const refused = await owner.agent.post(`${s}/shipping/confirm`).send({}).expect(409);
    expect(refused.body.error.message).toMatch(/below your safe minimum of 7 °C/);
    const confirmed = await owner.agent
      .post(`${s}/shipping/confirm`)
      .send({ shipAnyway: true })
      .expect(200);
    expect(confirmed.body.shipping.confirmedOver).toEqual([{ kind: 'too_cold', lowC: 3, minC: 7 }]);

    // Not invoiced, then not paid: refused with words.
    expect((await owner.agent.post(`${s}/ship`).expect(409)).body.error.message).toMatch(
      /invoice/i,
    );
    const invoice = (
      await owner.agent.post(`${s}/invoice`).send({ shippingMinor: 3000 }).expect(201)
    ).body;
    expect((await owner.agent.post(`${s}/ship`).expect(409)).body.error.message).toMatch(/paid/);

    // A new forecast undoes the confirmation.
    await owner.agent
      .put(`${s}/shipping`)
      .send({ ...shipping, forecastLowC: 9 })
      .expect(200)
      .expect((r) => expect(r.body.shipping.confirmedAt).toBeNull());
    await owner.agent.post(`${s}/shipping/confirm`).send({}).expect(200);

    await receivePayment(ctx.database.db, invoice.id, invoice.totalMinor, 'paid');
    // The invoice can no longer be cancelled: money came in.
    await owner.agent.post(`${c}/invoices/${invoice.id}/cancel`).expect(409);
    const shipped = await owner.agent.post(`${s}/ship`).expect(200);
    expect(shipped.body.status).toBe('shipped');

    const db = ctx.database.db;
    for (const id of ids) {
      const [row] = await db.select().from(animals).where(eq(animals.id, id));
      expect(row!.status).toBe('sold');
      const history = await db.select().from(events).where(eq(events.animalId, id));
      const change = history.find((e) => e.kind === 'status_changed')!;
      expect(change.payload).toEqual({ from: 'active', to: 'sold', saleId: sale.id });
      expect(JSON.stringify(change.payload)).not.toMatch(/Robin/);
    }
    // Off the stock for sale (an animal no longer kept), but its listing stays with the sale's
    // record, so its care sheet keeps the breeder's words after it left.
    const stock = (await owner.agent.get(`${c}/listings`).expect(200)).body;
    expect(stock.rows.map((r: { animalId: string }) => r.animalId)).not.toContain(ids[0]);
    expect(
      await db.select().from(saleListings).where(eq(saleListings.animalId, ids[0]!)),
    ).toHaveLength(1);
    const sheet = await owner.agent
      .get(`${c}/animals/${ids[0]}/care-sheet.pdf`)
      .buffer(true)
      .parse((res, done) => {
        const chunks: Buffer[] = [];
        res.on('data', (b: Buffer) => chunks.push(b));
        res.on('end', () => done(null, Buffer.concat(chunks)));
      })
      .expect(200);
    // poppler's pdftotext, an independent reader of the PDF.
    const words = execFileSync('pdftotext', ['-layout', '-', '-'], { input: sheet.body as Buffer })
      .toString('utf8')
      .replace(/\s+/g, ' ');
    expect(words).toContain('Hand-raised from our own sac.');
    const record = await owner.agent.get(`${c}/animals/${ids[0]}/sale`).expect(200);
    expect(record.body.sale).toMatchObject({ saleId: sale.id, buyerName: 'Robin Ashgrove' });
    await owner.agent.post(`${s}/ship`).expect(409);
    const note = await ctx.mailbox.waitFor((m) => m.subject.includes('on their way'));
    expect(note.to).toEqual(['robin@example.test']);
    expect(note.text).toMatch(/Hapalopus formosus/);
    expect(note.attachments?.map((a) => a.contentType)).toEqual(ids.map(() => 'application/pdf'));
  });

  it('shows a helper nothing of sales: 403 on every sales route', async () => {
    const helper = await signUp(ctx);
    await addMember(ctx.database.db, {
      collectionId: owner.collectionId,
      userId: helper.userId,
      role: 'helper',
      startsAt: new Date(Date.now() - 86_400_000),
      endsAt: new Date(Date.now() + 86_400_000),
    });
    for (const path of ['/sales', '/buyers', '/sales-settings', '/sales/available'])
      await helper.agent.get(`${c}${path}`).expect(403);
  });
});

describe('the demo', () => {
  it('sells in Canadian dollars with 13 % HST and has one buyer on file', async () => {
    const db = ctx.database.db;
    await seedDemo(db, { bcryptCost: 4 });
    const collectionId = (await demoCollectionId(db))!;
    const [row] = await db
      .select()
      .from(salesSettings)
      .where(eq(salesSettings.collectionId, collectionId));
    expect(row).toMatchObject({ currency: 'CAD', taxRateBp: 1300, taxRounding: 'per_invoice' });
    expect(row!.sellerDetails).toMatch(/^Northlight Inverts/);
    const onFile = await db.select().from(buyers).where(eq(buyers.collectionId, collectionId));
    expect(onFile).toHaveLength(1);
  });
});
