import http from 'node:http';
import Stripe from 'stripe';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { parseFormBody } from './form-body';
import { startPaymentFake, type PaymentFake } from './payment-fake';

let fake: PaymentFake;
let stripe: Stripe;
let hook: http.Server;
const received: { header: string; body: string }[] = [];

beforeAll(async () => {
  fake = await startPaymentFake();
  const url = new URL(fake.url);
  stripe = new Stripe(fake.secretKey, {
    host: url.hostname,
    port: Number(url.port),
    protocol: 'http',
    maxNetworkRetries: 0,
    telemetry: false,
  });
  hook = http.createServer((req, res) => {
    const chunks: Buffer[] = [];
    req.on('data', (c: Buffer) => chunks.push(c));
    req.on('end', () => {
      received.push({
        header: String(req.headers['stripe-signature']),
        body: Buffer.concat(chunks).toString('utf8'),
      });
      res.end('ok');
    });
  });
  await new Promise<void>((resolve) => hook.listen(0, '127.0.0.1', resolve));
  const a = hook.address() as { port: number };
  fake.setWebhookTarget(`http://127.0.0.1:${a.port}/hook`);
});
afterAll(async () => {
  await fake.stop();
  await new Promise((resolve) => hook.close(resolve));
});

async function newSession(amount = 10170, options?: Stripe.RequestOptions) {
  return stripe.checkout.sessions.create(
    {
      mode: 'payment',
      allowed_payment_method_types: ['card'],
      line_items: [
        {
          quantity: 1,
          price_data: { currency: 'cad', unit_amount: amount, product_data: { name: 'Invoice 7' } },
        },
      ],
      success_url: 'http://app.test/done',
      cancel_url: 'http://app.test/cancelled',
      client_reference_id: 'inv-1',
      metadata: { invoiceId: 'inv-1' },
      payment_intent_data: { metadata: { invoiceId: 'inv-1' } },
    },
    options,
  );
}

async function payOnPage(url: string, card: string) {
  return fetch(url, {
    method: 'POST',
    redirect: 'manual',
    headers: { 'content-type': 'application/x-www-form-urlencoded' },
    body: new URLSearchParams({ card, action: 'pay' }).toString(),
  });
}

describe('the form body reader', () => {
  it('reads the bracket keys the SDK writes into objects and arrays', () => {
    expect(
      parseFormBody(
        'mode=payment&line_items[0][quantity]=1&line_items[0][price_data][currency]=cad&metadata[a]=b%20c',
      ),
    ).toEqual({
      mode: 'payment',
      line_items: [{ quantity: '1', price_data: { currency: 'cad' } }],
      metadata: { a: 'b c' },
    });
  });
});

describe('the local payment fake, driven by the official SDK', () => {
  it('creates, reads and expires checkout sessions in the wire format the SDK reads', async () => {
    const s = await newSession();
    expect(s).toMatchObject({
      object: 'checkout.session',
      status: 'open',
      payment_status: 'unpaid',
      amount_total: 10170,
      currency: 'cad',
      client_reference_id: 'inv-1',
      metadata: { invoiceId: 'inv-1' },
    });
    expect(s.url).toBe(`${fake.url}/pay/${s.id}`);
    expect((await stripe.checkout.sessions.retrieve(s.id)).status).toBe('open');
    expect((await stripe.checkout.sessions.expire(s.id)).status).toBe('expired');
    // Expiring twice is the service's invalid-request error, thrown as the SDK's own class.
    await expect(stripe.checkout.sessions.expire(s.id)).rejects.toBeInstanceOf(
      Stripe.errors.StripeInvalidRequestError,
    );
  });

  it('refuses a wrong key with the SDK’s authentication error, and unknown ids as not found', async () => {
    const url = new URL(fake.url);
    const wrong = new Stripe('sk_test_wrong', {
      host: url.hostname,
      port: Number(url.port),
      protocol: 'http',
      maxNetworkRetries: 0,
    });
    await expect(wrong.checkout.sessions.retrieve('cs_test_x')).rejects.toBeInstanceOf(
      Stripe.errors.StripeAuthenticationError,
    );
    await expect(stripe.checkout.sessions.retrieve('cs_test_nope')).rejects.toMatchObject({
      type: 'StripeInvalidRequestError',
      statusCode: 404,
      code: 'resource_missing',
    });
  });

  it('signs webhooks so the SDK’s constructEvent accepts them, and refuses a forged one', async () => {
    const s = await newSession();
    received.length = 0;
    const res = await payOnPage(s.url!, '4242 4242 4242 4242');
    expect(res.status).toBe(303);
    expect(res.headers.get('location')).toBe('http://app.test/done');
    const types = received.map((r) => JSON.parse(r.body).type);
    expect(types).toEqual(['payment_intent.succeeded', 'checkout.session.completed']);
    const completed = received[1]!;
    // Independent check of the scheme (the service's "Verify signatures manually" steps, from
    // memory): v1 = hex HMAC-SHA256 of "<t>.<raw body>" with the endpoint's secret.
    const { createHmac } = await import('node:crypto');
    const t = /t=(\d+)/.exec(completed.header)![1]!;
    const v1 = /v1=([0-9a-f]+)/.exec(completed.header)![1]!;
    expect(v1).toBe(
      createHmac('sha256', fake.webhookSecret).update(`${t}.${completed.body}`).digest('hex'),
    );
    const event = stripe.webhooks.constructEvent(
      completed.body,
      completed.header,
      fake.webhookSecret,
      300,
    );
    expect(event.type).toBe('checkout.session.completed');
    const session = event.data.object as Stripe.Checkout.Session;
    expect(session).toMatchObject({ payment_status: 'paid', amount_total: 10170 });
    expect(session.payment_intent).toMatch(/^pi_/);
    // A changed body, a signature with another secret, an old timestamp: all refused.
    expect(() =>
      stripe.webhooks.constructEvent(
        completed.body.replace('10170', '1'),
        completed.header,
        fake.webhookSecret,
      ),
    ).toThrow(Stripe.errors.StripeSignatureVerificationError);
    const forged = stripe.webhooks.generateTestHeaderString({
      payload: completed.body,
      secret: 'whsec_not_the_one',
    });
    expect(() =>
      stripe.webhooks.constructEvent(completed.body, forged, fake.webhookSecret),
    ).toThrow(Stripe.errors.StripeSignatureVerificationError);
    const old = stripe.webhooks.generateTestHeaderString({
      payload: completed.body,
      secret: fake.webhookSecret,
      timestamp: Math.floor(Date.now() / 1000) - 301,
    });
    expect(() =>
      stripe.webhooks.constructEvent(completed.body, old, fake.webhookSecret, 300),
    ).toThrow(/tolerance/i);
  });

  it('declines the declined test card, refuses other numbers, and refunds up to the charge', async () => {
    const s = await newSession(5000);
    received.length = 0;
    const declined = await payOnPage(s.url!, '4000 0000 0000 0002');
    expect(declined.status).toBe(200);
    expect(await declined.text()).toContain('Your card was declined');
    expect(JSON.parse(received[0]!.body)).toMatchObject({
      type: 'payment_intent.payment_failed',
      data: { object: { last_payment_error: { code: 'card_declined' } } },
    });
    const other = await payOnPage(s.url!, '5555 5555 5555 4444');
    expect(await other.text()).toContain('takes only the test cards');
    expect((await payOnPage(s.url!, '4242424242424242')).status).toBe(303);
    const pi = (await stripe.checkout.sessions.retrieve(s.id)).payment_intent as string;
    const part = await stripe.refunds.create({ payment_intent: pi, amount: 2000 });
    expect(part).toMatchObject({ object: 'refund', amount: 2000, status: 'succeeded' });
    await expect(stripe.refunds.create({ payment_intent: pi, amount: 3001 })).rejects.toMatchObject(
      { type: 'StripeInvalidRequestError', code: 'amount_too_large' },
    );
    expect((await stripe.refunds.create({ payment_intent: pi })).amount).toBe(3000);
    expect(received.slice(-2).map((r) => JSON.parse(r.body).type)).toEqual([
      'refund.created',
      'charge.refunded',
    ]);
  });

  it('takes cards only: a session for other payment methods, or none named, is refused', async () => {
    const base = {
      mode: 'payment' as const,
      line_items: [
        {
          quantity: 1,
          price_data: { currency: 'cad', unit_amount: 100, product_data: { name: 'x' } },
        },
      ],
      success_url: 'http://app.test/done',
    };
    for (const allowed_payment_method_types of [undefined, ['card', 'link'], ['link']] as const)
      await expect(
        stripe.checkout.sessions.create({
          ...base,
          ...(allowed_payment_method_types
            ? { allowed_payment_method_types: [...allowed_payment_method_types] }
            : {}),
        }),
      ).rejects.toMatchObject({
        type: 'StripeInvalidRequestError',
        param: 'allowed_payment_method_types',
      });
    // The name this API version dropped is an unknown parameter, as the service answers it.
    await expect(
      stripe.checkout.sessions.create({
        ...base,
        allowed_payment_method_types: ['card'],
        ...{ payment_method_types: ['card'] },
      } as Stripe.Checkout.SessionCreateParams),
    ).rejects.toMatchObject({ param: 'payment_method_types', code: 'parameter_unknown' });
    const card = await stripe.checkout.sessions.create({
      ...base,
      allowed_payment_method_types: ['card'],
    });
    expect(card.allowed_payment_method_types).toEqual(['card']);
  });

  it('answers the same Idempotency-Key with the same object, even while the first is in flight', async () => {
    const key = { idempotencyKey: `k-${Date.now()}` };
    const [a, b] = await Promise.all([newSession(700, key), newSession(700, key)]);
    expect(b.id).toBe(a.id);
    expect(
      b.lastResponse.headers['idempotent-replayed'] ??
        a.lastResponse.headers['idempotent-replayed'],
    ).toBe('true');
    expect(fake.checkoutSessions().filter((s) => s.id === a.id)).toHaveLength(1);
    // The same key with other parameters is the service's idempotency error.
    await expect(newSession(800, key)).rejects.toBeInstanceOf(Stripe.errors.StripeIdempotencyError);

    const s = await newSession(900);
    await payOnPage(s.url!, '4242424242424242');
    const pi = (await stripe.checkout.sessions.retrieve(s.id)).payment_intent as string;
    const refundKey = { idempotencyKey: `r-${Date.now()}` };
    const [r1, r2] = await Promise.all([
      stripe.refunds.create({ payment_intent: pi, amount: 500 }, refundKey),
      stripe.refunds.create({ payment_intent: pi, amount: 500 }, refundKey),
    ]);
    expect(r2.id).toBe(r1.id);
    // Refunded once: 400 is still left on the charge.
    expect((await stripe.refunds.create({ payment_intent: pi })).amount).toBe(400);
  });
});
