// Card payment's hard cases, through the official SDK against the local fake over real HTTP and
// the real database: a cancel racing a buyer who has just paid, card-only sessions and the
// async checkout events, refunds made at the service's dashboard, two refund taps at once, a
// payment of nothing, a slow service holding no invoice row, and the invoice e-mail's link.
import { randomUUID } from 'node:crypto';
import http from 'node:http';
import { and, count, eq, sql } from 'drizzle-orm';
import Stripe from 'stripe';
import supertest from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { checkoutAnswer } from '#shared/schemas/payments';
import { buyers, invoices, paymentEvents, payments, sales } from '../../server/db/schema/sales';
import { createPaymentsService } from '../../server/features/payments/payments.service';
import { startPaymentFake, type PaymentFake } from '../../server/payment-fake/payment-fake';
import { signUp, type SignedUp } from '../factories';
import { createTestContext, type TestContext } from '../setup/test-app';

let fake: PaymentFake;
let stripe: Stripe;
let ctx: TestContext;
let server: http.Server;
let hookUrl: string;
let owner: SignedUp;
let c: string;

beforeAll(async () => {
  fake = await startPaymentFake();
  const api = new URL(fake.url);
  // The test's own client of the fake: what the service's dashboard would do by hand.
  stripe = new Stripe(fake.secretKey, {
    host: api.hostname,
    port: Number(api.port),
    protocol: 'http',
    maxNetworkRetries: 0,
    telemetry: false,
  });
  ctx = await createTestContext({
    payments: { secretKey: fake.secretKey, webhookSecret: fake.webhookSecret, apiUrl: fake.url },
  });
  server = http.createServer(ctx.app);
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  hookUrl = `http://127.0.0.1:${(server.address() as { port: number }).port}/api/payments/webhook`;
  fake.setWebhookTarget(hookUrl);
  owner = await signUp(ctx);
  c = `/api/collections/${owner.collectionId}`;
});
afterAll(async () => {
  server.closeAllConnections();
  await new Promise((resolve) => server.close(resolve));
  await ctx.close();
  await fake.stop();
});

const db = () => ctx.database.db;

async function newInvoice(totalMinor = 10000) {
  const collectionId = owner.collectionId;
  const [buyer] = await db().insert(buyers).values({ collectionId, name: 'Ada Buyer' }).returning();
  const [sale] = await db()
    .insert(sales)
    .values({ collectionId, buyerId: buyer!.id, reservedUntil: '2026-12-31' })
    .returning();
  const [invoice] = await db()
    .insert(invoices)
    .values({
      collectionId,
      saleId: sale!.id,
      number: `2026-${randomUUID().slice(0, 6)}`,
      currency: 'CAD',
      taxRateBp: 0,
      taxRounding: 'per_invoice',
      shippingMinor: 0,
      subtotalMinor: totalMinor,
      taxMinor: 0,
      totalMinor,
      issuedOn: '2026-12-03',
    })
    .returning();
  return invoice!.id;
}

const state = async (id: string) =>
  (await owner.agent.get(`${c}/invoices/${id}/payments`).expect(200)).body;
const checkout = (id: string) => owner.agent.post(`${c}/invoices/${id}/checkout`);
async function checkoutUrl(id: string) {
  const res = await checkout(id);
  expect(res.status, JSON.stringify(res.body)).toBe(200);
  return checkoutAnswer.parse(res.body).url;
}
const payOnPage = (url: string, card = '4242424242424242') =>
  fetch(url, {
    method: 'POST',
    redirect: 'manual',
    headers: { 'content-type': 'application/x-www-form-urlencoded' },
    body: new URLSearchParams({ card, action: 'pay' }).toString(),
  });
async function paid(totalMinor = 10000) {
  const id = await newInvoice(totalMinor);
  expect((await payOnPage(await checkoutUrl(id))).status).toBe(303);
  return id;
}
const rows = async (invoiceId: string, kind: 'payment' | 'refund') =>
  (
    await db()
      .select({ n: count() })
      .from(payments)
      .where(and(eq(payments.invoiceId, invoiceId), eq(payments.kind, kind)))
  )[0]!.n;
const invoiceRow = async (id: string) =>
  (await db().select().from(invoices).where(eq(invoices.id, id)))[0]!;
const sessionsOf = (invoiceId: string) =>
  fake.checkoutSessions().filter((s) => s.metadata.invoiceId === invoiceId);

/** A properly signed event, as the service would send it. */
async function sendEvent(type: string, object: Record<string, unknown>) {
  const payload = JSON.stringify({
    id: `evt_${randomUUID().replace(/-/g, '')}`,
    object: 'event',
    type,
    data: { object },
  });
  return supertest(ctx.app)
    .post('/api/payments/webhook')
    .set('content-type', 'application/json')
    .set(
      'stripe-signature',
      Stripe.webhooks.generateTestHeaderString({ payload, secret: fake.webhookSecret }),
    )
    .send(payload);
}
const sessionObject = (invoiceId: string, extra: Record<string, unknown>) => ({
  id: `cs_test_${randomUUID().replace(/-/g, '')}`,
  object: 'checkout.session',
  payment_status: 'paid',
  amount_total: 10000,
  currency: 'cad',
  payment_intent: `pi_${randomUUID().replace(/-/g, '')}`,
  client_reference_id: invoiceId,
  metadata: { invoiceId },
  ...extra,
});
const outcomeOf = async (invoiceId: string, type: string) =>
  (
    await db()
      .select({ outcome: paymentEvents.outcome })
      .from(paymentEvents)
      .where(and(eq(paymentEvents.invoiceId, invoiceId), eq(paymentEvents.type, type)))
  ).map((e) => e.outcome);

describe('a cancel after the buyer has paid', () => {
  it('stops with 409 while the payment’s webhook is on its way, and changes nothing', async () => {
    const id = await newInvoice();
    const url = await checkoutUrl(id);
    const before = await invoiceRow(id);
    // The buyer pays; the service's webhook has not reached us yet.
    fake.setWebhookTarget('http://127.0.0.1:9/nowhere');
    try {
      expect((await payOnPage(url)).status).toBe(303);
    } finally {
      fake.setWebhookTarget(hookUrl);
    }
    await expect(
      ctx.services.payments.expireCheckout(owner.collectionId, id),
    ).rejects.toMatchObject({
      status: 409,
      code: 'checkout_completed',
      message:
        'The buyer has just paid by card. Wait for the payment to show here, then refund it before cancelling.',
    });
    expect(await invoiceRow(id)).toMatchObject({
      checkoutSessionId: before.checkoutSessionId,
      checkoutUrl: url,
      status: 'open',
    });
    // Nor does the keeper's checkout button make a second link meanwhile.
    const again = await checkout(id);
    expect(again.status).toBe(409);
    expect(again.body.error.code).toBe('checkout_completed');
    // The webhook arrives after all: the payment shows.
    expect(await fake.redeliver(fake.lastEvent('checkout.session.completed')!.id)).toBe(200);
    expect((await state(id)).invoice).toMatchObject({ status: 'paid', paidMinor: 10000 });
  });

  it('expires an open link, and only clears one the service has expired already', async () => {
    const open = await newInvoice();
    const openUrl = await checkoutUrl(open);
    await ctx.services.payments.expireCheckout(owner.collectionId, open);
    expect(sessionsOf(open).map((s) => s.status)).toEqual(['expired']);
    expect(await (await fetch(openUrl)).text()).toContain('This checkout is closed');
    expect((await invoiceRow(open)).checkoutSessionId).toBeNull();

    const gone = await newInvoice();
    await checkoutUrl(gone);
    await stripe.checkout.sessions.expire((await invoiceRow(gone)).checkoutSessionId!);
    await ctx.services.payments.expireCheckout(owner.collectionId, gone);
    expect((await invoiceRow(gone)).checkoutSessionId).toBeNull();
  });

  it('records money paid on a cancelled invoice’s link, findable as paid_after_cancel', async () => {
    const id = await newInvoice();
    const url = await checkoutUrl(id);
    await db()
      .update(invoices)
      .set({ status: 'cancelled', cancelledAt: new Date() })
      .where(eq(invoices.id, id));
    expect((await payOnPage(url)).status).toBe(303);
    expect(await outcomeOf(id, 'checkout.session.completed')).toEqual(['paid_after_cancel']);
    expect(await rows(id, 'payment')).toBe(1);
    // The status shows the money held, so someone sends it back.
    expect((await state(id)).invoice).toMatchObject({ status: 'paid', paidMinor: 10000 });
  });
});

describe('cards only, and the async checkout events', () => {
  it('makes card-only sessions', async () => {
    const id = await newInvoice();
    await checkoutUrl(id);
    const session = await stripe.checkout.sessions.retrieve(
      (await invoiceRow(id)).checkoutSessionId!,
    );
    expect(session.allowed_payment_method_types).toEqual(['card']);
  });

  it('takes async_payment_succeeded as a paid checkout and async_payment_failed as a decline', async () => {
    const failedOn = await newInvoice();
    let res = await sendEvent('checkout.session.async_payment_failed', sessionObject(failedOn, {}));
    expect(res.body).toEqual({ received: true, outcome: 'declined:async_payment_failed' });
    let body = await state(failedOn);
    expect(body.invoice.status).toBe('open');
    expect(body.lastDecline).toMatchObject({
      message: 'The payment did not go through: the buyer’s bank refused it.',
    });

    const paidOn = await newInvoice();
    res = await sendEvent('checkout.session.async_payment_succeeded', sessionObject(paidOn, {}));
    expect(res.body).toEqual({ received: true, outcome: 'paid' });
    body = await state(paidOn);
    expect(body.invoice).toMatchObject({ status: 'paid', paidMinor: 10000 });
    expect(body.payments).toMatchObject([{ kind: 'payment', method: 'card', amountMinor: 10000 }]);
  });

  it('records a completed session for nothing as an event, answered 200, never a payment', async () => {
    const id = await newInvoice();
    for (const extra of [
      { amount_total: 0 },
      { amount_total: null },
      { amount_total: undefined },
    ]) {
      const res = await sendEvent('checkout.session.completed', sessionObject(id, extra));
      expect(res.status, JSON.stringify(res.body)).toBe(200);
      expect(res.body.outcome).toBe('ignored_zero_amount');
    }
    expect(await outcomeOf(id, 'checkout.session.completed')).toEqual([
      'ignored_zero_amount',
      'ignored_zero_amount',
      'ignored_zero_amount',
    ]);
    expect(await rows(id, 'payment')).toBe(0);
    expect((await state(id)).invoice.status).toBe('open');
  });
});

describe('refunds', () => {
  it('records a refund made at the service’s dashboard once, found by its card payment', async () => {
    const id = await paid();
    const pi = (await db().select().from(payments).where(eq(payments.invoiceId, id)))[0]!
      .providerRef;
    // No metadata: made by hand at the service, not through Rackside.
    await stripe.refunds.create({ payment_intent: pi, amount: 3000 });
    const event = fake.lastEvent('refund.created')!;
    expect(await outcomeOf(id, 'refund.created')).toEqual(['refunded']);
    expect(await fake.redeliver(event.id)).toBe(200);
    expect(await rows(id, 'refund')).toBe(1);
    expect((await state(id)).invoice).toMatchObject({ status: 'paid', refundedMinor: 3000 });
  });

  it('two taps of the same refund at once: one refund, the other tap 409', async () => {
    const id = await paid();
    const nonce = randomUUID();
    const tap = () =>
      owner.agent.post(`${c}/invoices/${id}/refund`).send({ amountMinor: 5000, nonce });
    const answers = await Promise.all([tap(), tap()]);
    expect(answers.map((r) => r.status).sort()).toEqual([200, 409]);
    expect(answers.find((r) => r.status === 409)!.body.error.code).toBe('refund_in_progress');
    expect(await rows(id, 'refund')).toBe(1);
    expect((await state(id)).invoice).toMatchObject({ status: 'paid', refundedMinor: 5000 });
    // The same tap sent again later (a retry) is refused in words too: still one refund.
    const late = await tap();
    expect(late.status).toBe(409);
    expect(late.body.error.message).toBe(
      'This refund was sent already: wait a moment for it to show here.',
    );
    expect(await rows(id, 'refund')).toBe(1);
    // The service gave back 5000 once: 5000 is left on the charge.
    const res = await owner.agent.post(`${c}/invoices/${id}/refund`).send({ amountMinor: 5000 });
    expect(res.body.invoice).toMatchObject({ status: 'refunded', refundedMinor: 10000 });
  });

  const refundTap = (id: string, method: 'card' | 'cash') =>
    owner.agent
      .post(`${c}/invoices/${id}/refund`)
      .send({ amountMinor: 6000, method })
      .then((r) => r);
  const tooLarge = {
    code: 'refund_too_large',
    message: 'At most $40.00 can be refunded on this invoice.',
  };

  it('a second card refund while the first is at the service sees it: 409, nothing sent', async () => {
    const id = await paid();
    const held = fake.holdNext('POST /v1/refunds');
    const first = refundTap(id, 'card');
    await held.arrived;
    const second = await refundTap(id, 'card');
    held.release();
    expect(second.status).toBe(409);
    expect(second.body.error).toMatchObject(tooLarge);
    expect((await first).status).toBe(200);
    expect((await state(id)).invoice).toMatchObject({ status: 'paid', refundedMinor: 6000 });
    expect(await rows(id, 'refund')).toBe(1);
  });

  it('two cash refunds at once that together exceed the payment: one goes, one 409', async () => {
    const id = await newInvoice();
    await owner.agent
      .post(`${c}/invoices/${id}/payments`)
      .send({ method: 'cash', amountMinor: 10000 })
      .expect(201);
    // Both taps arrive while something else holds the invoice (a webhook, say); they must be
    // checked one after the other once it lets go.
    const answers = await db().transaction(async (tx) => {
      await tx.execute(sql`select id from invoices where id = ${id} for update`);
      const taps = [refundTap(id, 'cash'), refundTap(id, 'cash')];
      for (let waited = 0; ; waited += 20) {
        const [row] = (
          await db().execute(
            sql`select count(*)::int as n from pg_stat_activity where wait_event_type = 'Lock' and query ilike '%invoices%'`,
          )
        ).rows as { n: number }[];
        if (row!.n >= 1 || waited > 5000) break;
        await new Promise((resolve) => setTimeout(resolve, 20));
      }
      await new Promise((resolve) => setTimeout(resolve, 200));
      return taps;
    });
    const settled = await Promise.all(answers);
    expect(settled.map((r) => r.status).sort()).toEqual([200, 409]);
    expect(settled.find((r) => r.status === 409)!.body.error).toMatchObject(tooLarge);
    expect((await state(id)).invoice).toMatchObject({ refundedMinor: 6000 });
  });
});

describe('checkout and the invoice’s row', () => {
  it('holds no lock on the invoice while the service makes the session', async () => {
    const id = await newInvoice();
    const held = fake.holdNext('POST /v1/checkout/sessions');
    const pending = checkout(id).then((r) => r);
    await held.arrived;
    try {
      // The service is slow; a webhook or a deposit must be able to lock the invoice meanwhile.
      const locked = await db().transaction((tx) =>
        tx.execute(sql`select id from invoices where id = ${id} for update nowait`),
      );
      expect(locked.rows).toHaveLength(1);
    } finally {
      held.release();
    }
    expect((await pending).status).toBe(200);
  });

  it('two taps at once make one session', async () => {
    const id = await newInvoice();
    const [a, b] = await Promise.all([checkout(id), checkout(id)]);
    expect([a.status, b.status]).toEqual([200, 200]);
    expect(a.body.url).toBe(b.body.url);
    expect(sessionsOf(id)).toHaveLength(1);
    expect((await invoiceRow(id)).checkoutUrl).toBe(a.body.url);
  });

  it('a deposit recorded while the session is made: the link asks for what is left', async () => {
    const id = await newInvoice();
    const held = fake.holdNext('POST /v1/checkout/sessions');
    const pending = checkout(id).then((r) => r);
    await held.arrived;
    await owner.agent
      .post(`${c}/invoices/${id}/payments`)
      .send({ method: 'bank_transfer', amountMinor: 4000 })
      .expect(201);
    held.release();
    const res = await pending;
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    expect(await (await fetch(res.body.url)).text()).toContain('$60.00');
    // The session made for the whole amount was closed, so it can take no money.
    expect(sessionsOf(id).map((s) => s.status)).toEqual(['expired', 'open']);
  });
});

describe('the invoice e-mail’s payment link', () => {
  it('is the checkout link for what is owed, or null when nothing can be paid by card', async () => {
    const { paymentLink } = ctx.services.payments;
    const id = await newInvoice();
    const link = await paymentLink(owner.collectionId, id);
    expect(link).toMatch(new RegExp(`^${fake.url}/pay/cs_test_`));
    // The same open link as the keeper's checkout button.
    expect(await checkoutUrl(id)).toBe(link);
    expect(await paymentLink(owner.collectionId, await paid())).toBeNull();

    const cancelled = await newInvoice();
    await db()
      .update(invoices)
      .set({ status: 'cancelled', cancelledAt: new Date() })
      .where(eq(invoices.id, cancelled));
    expect(await paymentLink(owner.collectionId, cancelled)).toBeNull();

    const cardOff = createPaymentsService(db(), { now: () => new Date() });
    expect(await cardOff.paymentLink(owner.collectionId, await newInvoice())).toBeNull();
    await expect(paymentLink(owner.collectionId, randomUUID())).rejects.toMatchObject({
      status: 404,
    });
  });
});
