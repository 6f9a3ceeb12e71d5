// Card payment through the official SDK against the local fake of the service, over real HTTP:
// the app listens on an ephemeral port so the fake can deliver its signed webhooks, and every
// payment lands in the real database. Invoices are inserted as rows (the invoice API is another
// part of issue 21).
import { randomUUID } from 'node:crypto';
import http from 'node:http';
import { and, count, eq } from 'drizzle-orm';
import Stripe from 'stripe';
import supertest from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { checkoutAnswer } from '#shared/schemas/payments';
import { buyers, invoices, paymentEvents, payments, sales } from '../../server/db/schema/sales';
import { startPaymentFake, type PaymentFake } from '../../server/payment-fake/payment-fake';
import { PASSWORD, signUp, type SignedUp } from '../factories';
import { createTestContext, type TestContext } from '../setup/test-app';
import { startServerProcess } from '../support/server-process';

let fake: PaymentFake;
let ctx: TestContext;
let server: http.Server;
let owner: SignedUp;
let other: SignedUp;
let c: string;

beforeAll(async () => {
  fake = await startPaymentFake();
  ctx = await createTestContext({
    payments: { secretKey: fake.secretKey, webhookSecret: fake.webhookSecret, apiUrl: fake.url },
  });
  server = http.createServer(ctx.app);
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  const { port } = server.address() as { port: number };
  fake.setWebhookTarget(`http://127.0.0.1:${port}/api/payments/webhook`);
  owner = await signUp(ctx);
  other = await signUp(ctx);
  c = `/api/collections/${owner.collectionId}`;
});
afterAll(async () => {
  server.closeAllConnections();
  await new Promise((resolve) => server.close(resolve));
  await ctx.close();
  await fake.stop();
});

// Worked case: three slings at CAD 25.00 and CAD 15.00 shipping, with 13 % HST (Ontario;
// Government of Canada, GST/HST rates, from memory) on 90.00: 11.70 tax, 101.70 in all.
const TOTAL = 10170;

async function newInvoice(collectionId = owner.collectionId, totalMinor = TOTAL) {
  const db = ctx.database.db;
  const [buyer] = await db.insert(buyers).values({ collectionId, name: 'Ada Buyer' }).returning();
  const [sale] = await db
    .insert(sales)
    .values({ collectionId, buyerId: buyer!.id, reservedUntil: '2026-12-31' })
    .returning();
  const [invoice] = await db
    .insert(invoices)
    .values({
      collectionId,
      saleId: sale!.id,
      number: `2026-${randomUUID().slice(0, 6)}`,
      currency: 'CAD',
      taxRateBp: 1300,
      taxRounding: 'per_invoice',
      shippingMinor: 1500,
      subtotalMinor: 9000,
      taxMinor: 1170,
      totalMinor,
      issuedOn: '2026-12-03',
    })
    .returning();
  return invoice!.id;
}

const state = async (id: string) =>
  (await owner.agent.get(`${c}/invoices/${id}/payments`).expect(200)).body;

async function checkoutUrl(id: string): Promise<string> {
  const res = await owner.agent.post(`${c}/invoices/${id}/checkout`);
  expect(res.status, JSON.stringify(res.body)).toBe(200);
  return checkoutAnswer.parse(res.body).url;
}

/** The buyer's side: the fake's checkout form, sent as a browser would send it. */
async function payOnPage(url: string, card: string) {
  return fetch(url, {
    method: 'POST',
    redirect: 'manual',
    headers: { 'content-type': 'application/x-www-form-urlencoded' },
    body: new URLSearchParams({ card, action: 'pay' }).toString(),
  });
}

const paymentRows = async (invoiceId: string, kind: 'payment' | 'refund') =>
  (
    await ctx.database.db
      .select({ n: count() })
      .from(payments)
      .where(and(eq(payments.invoiceId, invoiceId), eq(payments.kind, kind)))
  )[0]!.n;

const rawWebhook = () => supertest(ctx.app).post('/api/payments/webhook');

describe('card checkout on the fake service', () => {
  it('pays an invoice: checkout → the test card on the checkout page → webhook → paid', async () => {
    const id = await newInvoice();
    const url = await checkoutUrl(id);
    expect(url.startsWith(`${fake.url}/pay/cs_test_`)).toBe(true);
    // The same open session while the amount owed is the same: one link per invoice.
    expect(await checkoutUrl(id)).toBe(url);
    const page = await fetch(url);
    expect(await page.text()).toContain('$101.70');
    const res = await payOnPage(url, '4242 4242 4242 4242');
    expect(res.status).toBe(303);
    expect(res.headers.get('location')).toBe(
      `http://rackside.test/payment/done?result=paid&invoice=${id}`,
    );
    const body = await state(id);
    expect(body.invoice).toMatchObject({
      status: 'paid',
      paidMinor: TOTAL,
      refundedMinor: 0,
      checkoutUrl: null,
    });
    expect(body.payments).toMatchObject([
      { kind: 'payment', method: 'card', amountMinor: TOTAL, currency: 'CAD' },
    ]);
    expect(body.lastDecline).toBeNull();
    expect(body.cardPayments).toBe(true);
    const [event] = await ctx.database.db
      .select()
      .from(paymentEvents)
      .where(
        and(eq(paymentEvents.invoiceId, id), eq(paymentEvents.type, 'checkout.session.completed')),
      );
    expect(event?.outcome).toBe('paid');
    // Nothing is left to collect.
    const again = await owner.agent.post(`${c}/invoices/${id}/checkout`);
    expect(again.status).toBe(409);
    expect(again.body.error.code).toBe('nothing_owed');
  });

  it('keeps a declined card’s invoice open, with the decline shown, until a card pays', async () => {
    const id = await newInvoice();
    const url = await checkoutUrl(id);
    const declined = await payOnPage(url, '4000 0000 0000 0002');
    expect(await declined.text()).toContain('Your card was declined.');
    let body = await state(id);
    expect(body.invoice).toMatchObject({ status: 'open', paidMinor: 0 });
    expect(body.payments).toEqual([]);
    expect(body.lastDecline).toMatchObject({ message: 'The card was declined.' });
    expect((await payOnPage(url, '4242424242424242')).status).toBe(303);
    body = await state(id);
    expect(body.invoice.status).toBe('paid');
    expect(body.lastDecline).toBeNull();
  });

  it('takes the same event once, however often and however close together it arrives', async () => {
    const id = await newInvoice();
    expect((await payOnPage(await checkoutUrl(id), '4242424242424242')).status).toBe(303);
    const event = fake.lastEvent('checkout.session.completed')!;
    expect(JSON.parse(event.payload).data.object.metadata.invoiceId).toBe(id);
    const statuses = await Promise.all([fake.redeliver(event.id), fake.redeliver(event.id)]);
    expect(statuses).toEqual([200, 200]);
    expect(await fake.redeliver(event.id)).toBe(200);
    // Sent once more by hand with a fresh signature: the event id says it was taken already.
    const again = await rawWebhook()
      .set('content-type', 'application/json')
      .set(
        'stripe-signature',
        Stripe.webhooks.generateTestHeaderString({
          payload: event.payload,
          secret: fake.webhookSecret,
        }),
      )
      .send(event.payload);
    expect(again.body).toEqual({ received: true, outcome: 'duplicate' });
    expect(await paymentRows(id, 'payment')).toBe(1);
    expect((await state(id)).invoice).toMatchObject({ status: 'paid', paidMinor: TOTAL });
  });

  it('refuses forged, replayed and unsigned webhooks; records an unknown invoice and answers 200', async () => {
    const id = await newInvoice();
    const payload = JSON.stringify({
      id: `evt_${randomUUID().replace(/-/g, '')}`,
      object: 'event',
      type: 'checkout.session.completed',
      data: {
        object: {
          id: 'cs_test_forged',
          object: 'checkout.session',
          payment_status: 'paid',
          amount_total: TOTAL,
          currency: 'cad',
          payment_intent: 'pi_forged',
          client_reference_id: id,
          metadata: { invoiceId: id },
        },
      },
    });
    const forged = Stripe.webhooks.generateTestHeaderString({
      payload,
      secret: 'whsec_somebody_else',
    });
    const send = (header?: string) => {
      const req = rawWebhook().set('content-type', 'application/json');
      return (header ? req.set('stripe-signature', header) : req).send(payload);
    };
    const refusedForged = await send(forged);
    expect(refusedForged.status).toBe(400);
    expect(refusedForged.body.error.code).toBe('bad_signature');
    // Signed with the right secret, but 301 s old: outside the 300 s tolerance.
    const old = Stripe.webhooks.generateTestHeaderString({
      payload,
      secret: fake.webhookSecret,
      timestamp: Math.floor(Date.now() / 1000) - 301,
    });
    expect((await send(old)).status).toBe(400);
    expect((await send()).status).toBe(400);
    expect((await state(id)).invoice.status).toBe('open');
    expect(await paymentRows(id, 'payment')).toBe(0);

    // Properly signed, for an invoice this server does not have: kept, and 200 so the service
    // stops retrying.
    const stranger = payload.replaceAll(id, randomUUID());
    const res = await rawWebhook()
      .set('content-type', 'application/json')
      .set(
        'stripe-signature',
        Stripe.webhooks.generateTestHeaderString({ payload: stranger, secret: fake.webhookSecret }),
      )
      .send(stranger);
    expect(res.status).toBe(200);
    expect(res.body.outcome).toBe('unknown_invoice');
    const [kept] = await ctx.database.db
      .select()
      .from(paymentEvents)
      .where(eq(paymentEvents.eventId, JSON.parse(payload).id));
    expect(kept).toMatchObject({ outcome: 'unknown_invoice', invoiceId: null });
  });

  it('refunds part and then the rest through the service: paid, then refunded', async () => {
    const id = await newInvoice();
    await payOnPage(await checkoutUrl(id), '4242424242424242');
    let res = await owner.agent.post(`${c}/invoices/${id}/refund`).send({ amountMinor: 2500 });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    expect(res.body.invoice).toMatchObject({ status: 'paid', refundedMinor: 2500 });
    res = await owner.agent.post(`${c}/invoices/${id}/refund`).send({ amountMinor: 8000 });
    expect(res.status).toBe(409);
    expect(res.body.error.message).toBe('At most $76.70 can be refunded on this invoice.');
    res = await owner.agent.post(`${c}/invoices/${id}/refund`).send({ amountMinor: 7670 });
    expect(res.body.invoice).toMatchObject({
      status: 'refunded',
      paidMinor: TOTAL,
      refundedMinor: TOTAL,
    });
    // The service's refund.created webhook and this answer name the same refund: stored once.
    expect(await paymentRows(id, 'refund')).toBe(2);
    expect(res.body.payments.map((p: { kind: string; method: string }) => p.kind)).toEqual([
      'payment',
      'refund',
      'refund',
    ]);

    // The service later reports the last refund failed (refund.updated): its money is back.
    const last = JSON.parse(fake.lastEvent('refund.created')!.payload).data.object;
    const failed = JSON.stringify({
      id: `evt_${randomUUID().replace(/-/g, '')}`,
      object: 'event',
      type: 'refund.updated',
      data: { object: { ...last, status: 'failed' } },
    });
    const answer = await rawWebhook()
      .set('content-type', 'application/json')
      .set(
        'stripe-signature',
        Stripe.webhooks.generateTestHeaderString({ payload: failed, secret: fake.webhookSecret }),
      )
      .send(failed);
    expect(answer.body.outcome).toBe('refund_failed');
    expect((await state(id)).invoice).toMatchObject({ status: 'paid', refundedMinor: 2500 });
  });
});

describe('manual payments', () => {
  it('a bank transfer deposit makes the invoice part paid, and card checkout collects the rest', async () => {
    const id = await newInvoice();
    const res = await owner.agent
      .post(`${c}/invoices/${id}/payments`)
      .send({ method: 'bank_transfer', amountMinor: 3000 });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect(res.body.invoice).toMatchObject({ status: 'part_paid', paidMinor: 3000 });
    expect(res.body.payments).toMatchObject([{ method: 'bank_transfer', amountMinor: 3000 }]);
    const url = await checkoutUrl(id);
    expect(await (await fetch(url)).text()).toContain('$71.70');
    await payOnPage(url, '4242424242424242');
    expect((await state(id)).invoice).toMatchObject({ status: 'paid', paidMinor: TOTAL });
  });

  it('a deposit made after a checkout link replaces the link with one for the new amount', async () => {
    const id = await newInvoice();
    const first = await checkoutUrl(id);
    await owner.agent
      .post(`${c}/invoices/${id}/payments`)
      .send({ method: 'cash', amountMinor: 1000 })
      .expect(201);
    const second = await checkoutUrl(id);
    expect(second).not.toBe(first);
    // The old link takes no money any more.
    expect(await (await fetch(first)).text()).toContain('This checkout is closed');
  });

  it('a cancelled invoice’s checkout link is expired at the service too', async () => {
    const id = await newInvoice();
    const url = await checkoutUrl(id);
    await ctx.services.payments.expireCheckout(owner.collectionId, id);
    expect(await (await fetch(url)).text()).toContain('This checkout is closed');
    expect((await state(id)).invoice.checkoutUrl).toBeNull();
    // Another collection's invoice is not found, and its link lives on.
    const theirs = await newInvoice(other.collectionId);
    await expect(ctx.services.payments.expireCheckout(owner.collectionId, theirs)).rejects.toThrow(
      'We could not find that invoice.',
    );
  });

  it('refunds by hand, refuses nonsense, and a cancelled invoice takes no payment', async () => {
    const id = await newInvoice();
    let res = await owner.agent.post(`${c}/invoices/${id}/refund`).send({ amountMinor: 100 });
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe('refund_too_large');
    res = await owner.agent
      .post(`${c}/invoices/${id}/payments`)
      .send({ method: 'cheque', amountMinor: -5 });
    expect(res.status).toBe(422);
    expect(res.body.error.message).toMatch(/bank transfer or cash/);
    await owner.agent
      .post(`${c}/invoices/${id}/payments`)
      .send({ method: 'cash', amountMinor: 2000 })
      .expect(201);
    // Cash came in, so no card payment can be refunded: the keeper says how it went back.
    res = await owner.agent.post(`${c}/invoices/${id}/refund`).send({ amountMinor: 2000 });
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe('no_card_payment');
    res = await owner.agent
      .post(`${c}/invoices/${id}/refund`)
      .send({ amountMinor: 2000, method: 'cash' });
    expect(res.body.invoice.status).toBe('refunded');

    const cancelled = await newInvoice();
    await ctx.database.db
      .update(invoices)
      .set({ status: 'cancelled', cancelledAt: new Date() })
      .where(eq(invoices.id, cancelled));
    res = await owner.agent.post(`${c}/invoices/${cancelled}/checkout`);
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe('invoice_cancelled');
    res = await owner.agent
      .post(`${c}/invoices/${cancelled}/payments`)
      .send({ method: 'cash', amountMinor: 100 });
    expect(res.status).toBe(409);
  });

  it('does not find another collection’s invoice on any route, and changes nothing of it', async () => {
    const theirs = await newInvoice(other.collectionId);
    for (const [method, path, body] of [
      ['post', 'checkout', undefined],
      ['get', 'payments', undefined],
      ['post', 'payments', { method: 'cash', amountMinor: 100 }],
      ['post', 'refund', { amountMinor: 100, method: 'cash' }],
    ] as const) {
      const req = owner.agent[method](`${c}/invoices/${theirs}/${path}`);
      const res = await (body ? req.send(body) : req);
      expect(res.status, `${method} ${path}`).toBe(404);
    }
    expect(await paymentRows(theirs, 'payment')).toBe(0);
    const [row] = await ctx.database.db.select().from(invoices).where(eq(invoices.id, theirs));
    expect(row).toMatchObject({ checkoutSessionId: null, status: 'open' });
  });
});

describe('the server process (server/index.ts)', () => {
  async function signedIn(url: string) {
    const agent = supertest.agent(url).set('X-Rackside-Client', '1');
    await agent
      .post('/api/auth/sign-in')
      .send({ email: owner.email, password: PASSWORD })
      .expect(200);
    return agent;
  }

  it('in production without the service’s keys: card payment off, manual payment on', async () => {
    const proc = await startServerProcess({ databaseUrl: ctx.databaseUrl, quiet: true });
    try {
      const agent = await signedIn(proc.url);
      const id = await newInvoice();
      const list = await agent.get(`${c}/invoices/${id}/payments`).expect(200);
      expect(list.body.cardPayments).toBe(false);
      const refused = await agent.post(`${c}/invoices/${id}/checkout`);
      expect(refused.status).toBe(409);
      expect(refused.body.error.code).toBe('card_payments_off');
      await agent
        .post(`${c}/invoices/${id}/payments`)
        .send({ method: 'bank_transfer', amountMinor: TOTAL })
        .expect(201);
    } finally {
      await proc.kill();
    }
  }, 60_000);

  it('in development: the local fake starts, and its webhooks reach this process', async () => {
    const proc = await startServerProcess({
      databaseUrl: ctx.databaseUrl,
      quiet: true,
      env: { NODE_ENV: 'development' },
    });
    try {
      const agent = await signedIn(proc.url);
      const id = await newInvoice();
      const { url } = (await agent.post(`${c}/invoices/${id}/checkout`).expect(200)).body;
      expect(url).toMatch(/^http:\/\/127\.0\.0\.1:\d+\/pay\/cs_test_/);
      const res = await payOnPage(url, '4242424242424242');
      expect(res.headers.get('location')).toBe(
        `${proc.url}/payment/done?result=paid&invoice=${id}`,
      );
      const after = await agent.get(`${c}/invoices/${id}/payments`).expect(200);
      expect(after.body.invoice).toMatchObject({ status: 'paid', paidMinor: TOTAL });
    } finally {
      await proc.kill();
    }
  }, 60_000);
});
