/*
 * A local stand-in for the card payment service, on 127.0.0.1 (a random port): the subset of
 * its REST API the official SDK calls for Rackside, in the same wire format — form-encoded
 * requests, JSON answers, `Authorization: Bearer sk_test_…` checked, errors as
 * `{ error: { type, message, code?, param? } }` so the SDK throws its own classes
 * (generateV1Error in the SDK's Error.js picks the class by status) — plus a checkout page and
 * signed webhooks. Dev, demo and tests only: production never loads this file (server/index.ts).
 *
 * Events sent, as the real service sends them (its "Types of events" reference, from memory):
 * paying: `payment_intent.succeeded` then `checkout.session.completed` (payment_status paid,
 * amount_total); a declined card: `payment_intent.payment_failed` (last_payment_error, the
 * session stays open for another try); a refund: `refund.created` then `charge.refunded`;
 * expiring a session: `checkout.session.expired`.
 *
 * `Idempotency-Key` is honoured for creating sessions and refunds, as the service does (its
 * "Idempotent requests" reference, from memory): the same key with the same parameters answers
 * the first object again (header `Idempotent-Replayed: true`, even when a request with that key
 * is still in flight: it waits for it), other parameters are an `idempotency_error`.
 */
import { randomBytes } from 'node:crypto';
import http from 'node:http';
import Stripe from 'stripe';
import { amountText, checkoutPage } from './checkout-page';
import { parseFormBody, type FormValue } from './form-body';

/**
 * The service's public test card numbers ("Testing" in its documentation, from memory):
 * 4242 4242 4242 4242 succeeds, 4000 0000 0000 0002 is declined with `card_declined` /
 * `generic_decline`. Any other number is refused as not a test card.
 */
export const TEST_CARDS = { success: '4242424242424242', declined: '4000000000000002' } as const;

type Json = Record<string, unknown>;

interface Session {
  id: string;
  object: 'checkout.session';
  mode: 'payment';
  status: 'open' | 'complete' | 'expired';
  payment_status: 'unpaid' | 'paid';
  allowed_payment_method_types: string[];
  payment_method_types: string[];
  amount_subtotal: number;
  amount_total: number;
  currency: string;
  client_reference_id: string | null;
  metadata: Record<string, string>;
  success_url: string;
  cancel_url: string | null;
  url: string | null;
  payment_intent: string | null;
  created: number;
  expires_at: number;
  livemode: false;
  /** Not part of the service's object: the page's heading, from the first line item's name. */
  _description: string;
  _paymentIntentMetadata: Record<string, string>;
}

interface PaymentIntent {
  id: string;
  object: 'payment_intent';
  amount: number;
  amount_received: number;
  currency: string;
  status: 'requires_payment_method' | 'succeeded';
  metadata: Record<string, string>;
  latest_charge: string | null;
  last_payment_error: Json | null;
  created: number;
  livemode: false;
}

export interface Delivery {
  eventId: string;
  type: string;
  status: number;
}

export interface PaymentFake {
  /** The API's base URL, e.g. http://127.0.0.1:43121 (give it to the SDK as host/port). */
  url: string;
  secretKey: string;
  webhookSecret: string;
  /** Where webhooks go: the app's POST /api/payments/webhook. */
  setWebhookTarget(url: string): void;
  /** Every webhook delivery, oldest first. */
  deliveries: Delivery[];
  /** Sends an event again with a fresh signature, as the service's retries do. */
  redeliver(eventId: string): Promise<number>;
  /** The last event of a type (for tests that forge or replay one). */
  lastEvent(type: string): { id: string; payload: string } | undefined;
  /** Every checkout session made, oldest first (tests count them). */
  checkoutSessions(): { id: string; status: string; metadata: Record<string, string> }[];
  /**
   * Holds the next API request to `path` (e.g. `POST /v1/checkout/sessions`) until `release`:
   * `arrived` settles once it is held, so a test can look at the database meanwhile.
   */
  holdNext(request: string): { arrived: Promise<void>; release(): void };
  stop(): Promise<void>;
}

const id = (prefix: string) => `${prefix}_${randomBytes(12).toString('hex')}`;
const seconds = (ms: number) => Math.floor(ms / 1000);

class FakeError extends Error {
  constructor(
    readonly status: number,
    message: string,
    readonly code?: string,
    readonly param?: string,
  ) {
    super(message);
  }
}

const str = (v: FormValue | undefined): string | undefined =>
  typeof v === 'string' ? v : undefined;
const obj = (v: FormValue | undefined): Record<string, FormValue> =>
  v && typeof v === 'object' && !Array.isArray(v) ? v : {};
const strings = (v: FormValue | undefined): Record<string, string> =>
  Object.fromEntries(
    Object.entries(obj(v)).filter((e): e is [string, string] => typeof e[1] === 'string'),
  );
function int(v: FormValue | undefined, param: string): number {
  const s = str(v);
  if (s === undefined || !/^\d+$/.test(s))
    throw new FakeError(400, `Invalid integer: ${s ?? ''}`, 'parameter_invalid_integer', param);
  return Number(s);
}

export interface PaymentFakeOptions {
  /** Keys to accept and sign with; generated when not given. */
  secretKey?: string;
  webhookSecret?: string;
  /** The clock for `created` and signatures (tests move it). */
  now?: () => Date;
}

export async function startPaymentFake(options: PaymentFakeOptions = {}): Promise<PaymentFake> {
  const secretKey = options.secretKey ?? `sk_test_${randomBytes(24).toString('hex')}`;
  const webhookSecret = options.webhookSecret ?? `whsec_${randomBytes(24).toString('hex')}`;
  const now = options.now ?? (() => new Date());
  const sessions = new Map<string, Session>();
  const intents = new Map<string, PaymentIntent>();
  const charges = new Map<string, Json & { amount: number; amount_refunded: number }>();
  const events = new Map<string, { id: string; type: string; payload: string }>();
  const deliveries: Delivery[] = [];
  let webhookTarget: string | undefined;
  let base = '';

  async function deliver(eventId: string): Promise<number> {
    const event = events.get(eventId)!;
    if (!webhookTarget) return 0;
    // Signed exactly as the service signs: t=<unix seconds>,v1=HMAC-SHA256(secret, "t.payload").
    const header = Stripe.webhooks.generateTestHeaderString({
      payload: event.payload,
      secret: webhookSecret,
      timestamp: seconds(now().getTime()),
    });
    let status = 0;
    try {
      const res = await fetch(webhookTarget, {
        method: 'POST',
        headers: { 'content-type': 'application/json', 'stripe-signature': header },
        body: event.payload,
      });
      status = res.status;
      await res.arrayBuffer();
    } catch {
      status = 0;
    }
    deliveries.push({ eventId, type: event.type, status });
    return status;
  }

  /** Makes an event and delivers it before the caller goes on (the real service is later). */
  async function emit(type: string, object: unknown) {
    const eventId = id('evt');
    const payload = JSON.stringify(
      {
        id: eventId,
        object: 'event',
        api_version: Stripe.API_VERSION,
        created: seconds(now().getTime()),
        type,
        data: { object },
        livemode: false,
        pending_webhooks: 1,
        request: { id: null, idempotency_key: null },
      },
      null,
      2,
    );
    events.set(eventId, { id: eventId, type, payload });
    await deliver(eventId);
  }

  const publicSession = (s: Session) => {
    const { _description: _d, _paymentIntentMetadata: _m, ...rest } = s;
    return rest;
  };

  function createSession(body: Record<string, FormValue>): Session {
    // Cards only. The SDK's API version takes the list as `allowed_payment_method_types`; it
    // dropped `payment_method_types` on session create (the SDK's CHANGELOG.md, the release
    // that added `allowed_payment_method_types`), so the old name is refused as unknown here.
    if (body.payment_method_types !== undefined)
      throw new FakeError(
        400,
        'Received unknown parameter: payment_method_types',
        'parameter_unknown',
        'payment_method_types',
      );
    const types = Array.isArray(body.allowed_payment_method_types)
      ? body.allowed_payment_method_types
      : [];
    if (types.length !== 1 || types[0] !== 'card')
      throw new FakeError(
        400,
        'This fake takes cards only: send allowed_payment_method_types[]=card.',
        'parameter_invalid',
        'allowed_payment_method_types',
      );
    if (str(body.mode) !== 'payment')
      throw new FakeError(
        400,
        'This fake supports mode=payment only.',
        'parameter_invalid',
        'mode',
      );
    const successUrl = str(body.success_url);
    if (!successUrl)
      throw new FakeError(
        400,
        'Missing required param: success_url.',
        'parameter_missing',
        'success_url',
      );
    const items = Array.isArray(body.line_items) ? body.line_items : [];
    if (!items.length)
      throw new FakeError(
        400,
        'Missing required param: line_items.',
        'parameter_missing',
        'line_items',
      );
    let total = 0;
    let currency = '';
    let description = '';
    items.forEach((raw, i) => {
      const item = obj(raw);
      const price = obj(item.price_data);
      const c = str(price.currency);
      if (!c)
        throw new FakeError(
          400,
          'Missing required param: currency.',
          'parameter_missing',
          `line_items[${i}][price_data][currency]`,
        );
      if (currency && c !== currency)
        throw new FakeError(400, 'All line items must use the same currency.');
      currency = c;
      const quantity =
        item.quantity === undefined ? 1 : int(item.quantity, `line_items[${i}][quantity]`);
      total += int(price.unit_amount, `line_items[${i}][price_data][unit_amount]`) * quantity;
      description ||= str(obj(price.product_data).name) ?? '';
    });
    const created = seconds(now().getTime());
    const sessionId = id('cs_test');
    const session: Session = {
      id: sessionId,
      object: 'checkout.session',
      mode: 'payment',
      status: 'open',
      payment_status: 'unpaid',
      allowed_payment_method_types: ['card'],
      payment_method_types: ['card'],
      amount_subtotal: total,
      amount_total: total,
      currency,
      client_reference_id: str(body.client_reference_id) ?? null,
      metadata: strings(body.metadata),
      success_url: successUrl,
      cancel_url: str(body.cancel_url) ?? null,
      url: `${base}/pay/${sessionId}`,
      payment_intent: null,
      created,
      // The service's default: a session stays open for 24 hours.
      expires_at: body.expires_at ? int(body.expires_at, 'expires_at') : created + 86_400,
      livemode: false,
      _description: description,
      _paymentIntentMetadata: strings(obj(body.payment_intent_data).metadata),
    };
    sessions.set(sessionId, session);
    return session;
  }

  function sessionOf(sessionId: string): Session {
    const s = sessions.get(sessionId);
    if (!s)
      throw new FakeError(
        404,
        `No such checkout.session: '${sessionId}'`,
        'resource_missing',
        'session',
      );
    if (s.status === 'open' && seconds(now().getTime()) >= s.expires_at) s.status = 'expired';
    return s;
  }

  async function expireSession(sessionId: string) {
    const s = sessionOf(sessionId);
    if (s.status !== 'open')
      throw new FakeError(
        400,
        `Only Checkout Sessions with a status of 'open' can be expired. This session has a status of '${s.status}'.`,
      );
    s.status = 'expired';
    s.url = null;
    await emit('checkout.session.expired', publicSession(s));
    return s;
  }

  /** The payment intent a session pays with: made on the first attempt, as the service does. */
  function intentFor(s: Session): PaymentIntent {
    if (s.payment_intent) return intents.get(s.payment_intent)!;
    const pi: PaymentIntent = {
      id: id('pi'),
      object: 'payment_intent',
      amount: s.amount_total,
      amount_received: 0,
      currency: s.currency,
      status: 'requires_payment_method',
      metadata: s._paymentIntentMetadata,
      latest_charge: null,
      last_payment_error: null,
      created: seconds(now().getTime()),
      livemode: false,
    };
    intents.set(pi.id, pi);
    s.payment_intent = pi.id;
    return pi;
  }

  async function pay(
    s: Session,
    card: string,
  ): Promise<{ ok: true } | { ok: false; problem: string }> {
    const number = card.replace(/[\s-]/g, '');
    if (number !== TEST_CARDS.success && number !== TEST_CARDS.declined)
      return {
        ok: false,
        problem:
          'This test checkout takes only the test cards 4242 4242 4242 4242 (pays) and 4000 0000 0000 0002 (declined).',
      };
    const pi = intentFor(s);
    if (number === TEST_CARDS.declined) {
      pi.last_payment_error = {
        type: 'card_error',
        code: 'card_declined',
        decline_code: 'generic_decline',
        message: 'Your card was declined.',
      };
      await emit('payment_intent.payment_failed', { ...pi });
      return { ok: false, problem: 'Your card was declined. Try another card.' };
    }
    const charge = {
      id: id('ch'),
      object: 'charge',
      amount: pi.amount,
      amount_captured: pi.amount,
      amount_refunded: 0,
      currency: pi.currency,
      payment_intent: pi.id,
      paid: true,
      refunded: false,
      status: 'succeeded',
      metadata: pi.metadata,
      created: seconds(now().getTime()),
      livemode: false,
    };
    charges.set(charge.id, charge);
    Object.assign(pi, {
      status: 'succeeded',
      amount_received: pi.amount,
      latest_charge: charge.id,
      last_payment_error: null,
    });
    s.status = 'complete';
    s.payment_status = 'paid';
    s.url = null;
    await emit('payment_intent.succeeded', { ...pi });
    await emit('checkout.session.completed', publicSession(s));
    return { ok: true };
  }

  async function refund(body: Record<string, FormValue>) {
    const piId = str(body.payment_intent);
    if (!piId)
      throw new FakeError(
        400,
        'Missing required param: payment_intent.',
        'parameter_missing',
        'payment_intent',
      );
    const pi = intents.get(piId);
    if (!pi)
      throw new FakeError(
        404,
        `No such payment_intent: '${piId}'`,
        'resource_missing',
        'payment_intent',
      );
    if (pi.status !== 'succeeded' || !pi.latest_charge)
      throw new FakeError(
        400,
        `This PaymentIntent (${piId}) does not have a successful charge to refund.`,
        'charge_not_refundable',
      );
    const charge = charges.get(pi.latest_charge)!;
    const left = charge.amount - charge.amount_refunded;
    const amount = body.amount === undefined ? left : int(body.amount, 'amount');
    if (amount <= 0 || amount > left)
      throw new FakeError(
        400,
        `Refund amount (${amountText(amount, pi.currency)}) is greater than unrefunded amount on charge (${amountText(left, pi.currency)})`,
        'amount_too_large',
        'amount',
      );
    charge.amount_refunded += amount;
    charge.refunded = charge.amount_refunded === charge.amount;
    const created = {
      id: id('re'),
      object: 'refund',
      amount,
      currency: pi.currency,
      payment_intent: pi.id,
      charge: charge.id,
      status: 'succeeded',
      metadata: strings(body.metadata),
      created: seconds(now().getTime()),
    };
    await emit('refund.created', created);
    await emit('charge.refunded', { ...charge });
    return created;
  }

  const idempotent = new Map<string, { request: string; answer: Promise<[number, unknown]> }>();
  const holds = new Map<string, { arrived: () => void; released: Promise<void> }>();

  /** The same key and parameters: the first answer again; other parameters: refused. */
  async function once(
    req: http.IncomingMessage,
    path: string,
    text: string,
    replayed: () => void,
  ): Promise<[number, unknown]> {
    const key = req.headers['idempotency-key'];
    if (req.method !== 'POST' || typeof key !== 'string') return api(req, path, text);
    const request = `${path}?${text}`;
    const first = idempotent.get(key);
    if (first) {
      if (first.request !== request)
        throw new FakeError(
          400,
          `Keys for idempotent requests can only be used with the same parameters they were first used with. Try using a key other than '${key}' if you meant to execute a different request.`,
          'idempotency_key_in_use',
        );
      replayed();
      return first.answer;
    }
    const answer = api(req, path, text);
    idempotent.set(key, { request, answer });
    // A request that failed before it was carried out may be tried again with its key.
    answer.catch(() => idempotent.delete(key));
    return answer;
  }

  async function api(
    req: http.IncomingMessage,
    path: string,
    text: string,
  ): Promise<[number, unknown]> {
    if (req.headers.authorization !== `Bearer ${secretKey}`)
      throw new FakeError(401, 'Invalid API Key provided.');
    const hold = holds.get(`${req.method} ${path}`);
    if (hold) {
      holds.delete(`${req.method} ${path}`);
      hold.arrived();
      await hold.released;
    }
    const body = req.method === 'POST' ? parseFormBody(text) : {};
    let m: RegExpExecArray | null;
    if (req.method === 'POST' && path === '/v1/checkout/sessions')
      return [200, publicSession(createSession(body))];
    if (req.method === 'GET' && (m = /^\/v1\/checkout\/sessions\/([\w]+)$/.exec(path)))
      return [200, publicSession(sessionOf(m[1]!))];
    if (req.method === 'POST' && (m = /^\/v1\/checkout\/sessions\/([\w]+)\/expire$/.exec(path)))
      return [200, publicSession(await expireSession(m[1]!))];
    if (req.method === 'POST' && path === '/v1/refunds') return [200, await refund(body)];
    throw new FakeError(404, `Unrecognized request URL (${req.method}: ${path}).`);
  }

  async function page(
    req: http.IncomingMessage,
    res: http.ServerResponse,
    sessionId: string,
    text: string,
  ) {
    const s = sessions.get(sessionId);
    const html = (status: number, problem?: string, card?: string) => {
      res.writeHead(status, { 'content-type': 'text/html; charset=utf-8' });
      res.end(
        checkoutPage({
          id: s!.id,
          amount_total: s!.amount_total,
          currency: s!.currency,
          status: s!.status,
          description: s!._description,
          problem,
          card,
        }),
      );
    };
    if (!s) {
      res.writeHead(404, { 'content-type': 'text/plain; charset=utf-8' });
      res.end('No such checkout.');
      return;
    }
    sessionOf(sessionId);
    if (req.method === 'GET') return html(200);
    const form = new URLSearchParams(text);
    if (s.status !== 'open') return html(409);
    if (form.get('action') === 'cancel') {
      res.writeHead(303, { location: s.cancel_url ?? s.success_url });
      res.end();
      return;
    }
    const card = form.get('card') ?? '';
    const outcome = await pay(s, card);
    // The page again with the problem in an alert, as a checkout page shows it (200: a page).
    if (!outcome.ok) return html(200, outcome.problem, card);
    res.writeHead(303, { location: s.success_url.replace('{CHECKOUT_SESSION_ID}', s.id) });
    res.end();
  }

  const server = http.createServer((req, res) => {
    const chunks: Buffer[] = [];
    req.on('data', (c: Buffer) => chunks.push(c));
    req.on('end', () => {
      const text = Buffer.concat(chunks).toString('utf8');
      const path = new URL(req.url ?? '/', 'http://fake').pathname;
      const pageMatch = /^\/pay\/([\w]+)$/.exec(path);
      let replay = false;
      const work = pageMatch
        ? page(req, res, pageMatch[1]!, text)
        : once(req, path, text, () => (replay = true)).then(([status, json]) => {
            res.writeHead(status, {
              'content-type': 'application/json',
              'request-id': id('req'),
              ...(replay ? { 'idempotent-replayed': 'true' } : {}),
            });
            res.end(JSON.stringify(json));
          });
      work.catch((err: unknown) => {
        const e = err instanceof FakeError ? err : new FakeError(500, String(err));
        res.writeHead(e.status, { 'content-type': 'application/json', 'request-id': id('req') });
        res.end(
          JSON.stringify({
            error: {
              type:
                e.status >= 500
                  ? 'api_error'
                  : e.code === 'idempotency_key_in_use'
                    ? 'idempotency_error'
                    : 'invalid_request_error',
              message: e.message,
              ...(e.code ? { code: e.code } : {}),
              ...(e.param ? { param: e.param } : {}),
            },
          }),
        );
      });
    });
  });
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  const address = server.address();
  base = `http://127.0.0.1:${typeof address === 'object' && address ? address.port : 0}`;

  return {
    url: base,
    secretKey,
    webhookSecret,
    setWebhookTarget: (url) => {
      webhookTarget = url;
    },
    deliveries,
    redeliver: (eventId) => deliver(eventId),
    lastEvent: (type) => [...events.values()].reverse().find((e) => e.type === type),
    checkoutSessions: () =>
      [...sessions.values()].map((s) => ({ id: s.id, status: s.status, metadata: s.metadata })),
    holdNext: (request) => {
      let arrived!: () => void;
      let release!: () => void;
      const seen = new Promise<void>((resolve) => (arrived = resolve));
      const released = new Promise<void>((resolve) => (release = resolve));
      holds.set(request, { arrived, released });
      return { arrived: seen, release };
    },
    stop: () =>
      new Promise<void>((resolve) => {
        server.close(() => resolve());
        server.closeAllConnections();
      }),
  };
}
