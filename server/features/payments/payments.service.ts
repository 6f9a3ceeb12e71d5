import { randomUUID } from 'node:crypto';
import Stripe from 'stripe';
import {
  invoiceStatus,
  outstandingMinor,
  refundableMinor,
} from '#shared/domain/sales/invoice-state';
import { formatMoney, isCurrencyCode } from '#shared/domain/sales/money';
import { uuid } from '#shared/schemas/common';
import type {
  InvoicePayments,
  ManualPaymentBody,
  PaymentMethod,
  RefundBody,
} from '#shared/schemas/payments';
import type { Db } from '../../db/client';
import type { Logger } from '../../logger';
import { HttpError } from '../../middleware/errors';
import { sdkOptions, type PaymentConfig } from './payment-config';
import {
  cardPaymentsOf,
  deleteHold,
  deletePayment,
  insertPayment,
  invoiceInCollection,
  invoiceOfCardPayment,
  lastDeclineOf,
  lockInvoice,
  paymentsOf,
  setCheckout,
  setInvoiceMoney,
  settleEvent,
  deleteEvent,
  sumsOf,
  takeEvent,
  type InvoiceRow,
} from './payments.repository';

interface Deps {
  now: () => Date;
  /** Card payment is off without it: manual payments still work. */
  config?: PaymentConfig;
  /** PUBLIC_URL (or the LAN address) when set; else the buyer returns to the request's origin. */
  publicBase?: string;
  logger?: Logger;
}

/** The service's signature tolerance: older (replayed) deliveries are refused. */
export const WEBHOOK_TOLERANCE_S = 300;

/**
 * A payment row's `providerRef`: the service's own id for card money (`pi_…` for a payment,
 * `re_…` for a refund), or `manual:<method>:<uuid>` for money the keeper recorded by hand.
 */
const manualRef = (method: string) => `manual:${method}:${randomUUID()}`;
export function methodOf(providerRef: string): PaymentMethod {
  const manual = /^manual:(bank_transfer|cash):/.exec(providerRef);
  return manual ? (manual[1] as PaymentMethod) : 'card';
}

/** The service's decline codes in words (its "Decline codes" reference, from memory). */
const DECLINES: Record<string, string> = {
  generic_decline: 'The card was declined.',
  card_declined: 'The card was declined.',
  insufficient_funds: 'The card was declined: not enough funds.',
  expired_card: 'The card was declined: it has expired.',
  incorrect_cvc: 'The card was declined: the security code was wrong.',
  // Ours: checkout.session.async_payment_failed carries no code.
  async_payment_failed: 'The payment did not go through: the buyer’s bank refused it.',
};
export const declineWords = (code: string) =>
  DECLINES[code] ?? 'The card was declined by the buyer’s bank.';

type Outcome = { invoiceId: string | null; outcome: string };

export function createPaymentsService(db: Db, deps: Deps) {
  const { now, config } = deps;
  const sdk = config ? new Stripe(config.secretKey, sdkOptions(config)) : null;

  function cardOn(): Stripe {
    if (!sdk)
      throw new HttpError(
        409,
        'card_payments_off',
        'Card payment is not set up on this server: record a bank transfer or cash payment instead.',
      );
    return sdk;
  }

  /** Calls the service; its refusals become readable 409/502 answers, never a 500. */
  async function service<T>(call: () => Promise<T>): Promise<T> {
    try {
      return await call();
    } catch (err) {
      if (!(err instanceof Stripe.errors.StripeError)) throw err;
      deps.logger?.warn({ type: err.type, code: err.code }, 'Payment service refused a request');
      if (err instanceof Stripe.errors.StripeInvalidRequestError)
        throw new HttpError(
          409,
          'payment_service_refused',
          `The payment service said: ${err.message}`,
        );
      if (err instanceof Stripe.errors.StripeIdempotencyError)
        throw new HttpError(
          409,
          'payment_service_refused',
          'The payment service saw this request before with other details. Reload and try again.',
        );
      if (err instanceof Stripe.errors.StripeAuthenticationError)
        throw new HttpError(
          502,
          'payment_service_key',
          'The payment service refused this server’s key: check PAYMENT_SECRET_KEY.',
        );
      throw new HttpError(
        502,
        'payment_service_unavailable',
        'The payment service did not answer. Nothing was charged; try again in a minute.',
      );
    }
  }

  async function found(collectionId: string, invoiceId: string, lockDb?: Db) {
    const invoice = await invoiceInCollection(lockDb ?? db, collectionId, invoiceId, !!lockDb);
    if (!invoice) throw new HttpError(404, 'not_found', 'We could not find that invoice.');
    return invoice;
  }

  const money = (i: NonNullable<InvoiceRow>) => ({
    totalMinor: i.totalMinor,
    paidMinor: i.paidMinor,
    refundedMinor: i.refundedMinor,
    cancelled: i.cancelledAt !== null,
  });

  const words = (minor: number, currency: string) =>
    isCurrencyCode(currency) ? formatMoney(minor, currency, 'en-CA') : `${minor} ${currency}`;

  /** Sums the invoice's payment rows again and stores paid, refunded and the status. */
  async function recompute(tx: Db, invoice: NonNullable<InvoiceRow>) {
    const sums = await sumsOf(tx, invoice.id);
    const status = invoiceStatus({ ...money(invoice), ...sums });
    await setInvoiceMoney(tx, invoice.id, { ...sums, status }, now());
  }

  async function list(collectionId: string, invoiceId: string): Promise<InvoicePayments> {
    const invoice = await found(collectionId, invoiceId);
    const rows = await paymentsOf(db, invoiceId);
    const decline = await lastDeclineOf(db, invoiceId);
    const lastPaid = rows.filter((r) => r.kind === 'payment').at(-1)?.at;
    return {
      invoice: {
        id: invoice.id,
        status: invoice.status,
        currency: invoice.currency,
        totalMinor: invoice.totalMinor,
        paidMinor: invoice.paidMinor,
        refundedMinor: invoice.refundedMinor,
        checkoutUrl: invoice.checkoutUrl,
      },
      payments: rows.map((r) => ({
        id: r.id,
        kind: r.kind,
        method: methodOf(r.providerRef),
        amountMinor: r.amountMinor,
        currency: r.currency,
        at: r.at.toISOString(),
      })),
      lastDecline:
        decline && (!lastPaid || decline.at > lastPaid)
          ? {
              at: decline.at.toISOString(),
              message: declineWords(decline.outcome.split(':')[1] ?? ''),
            }
          : null,
      cardPayments: sdk !== null,
    };
  }

  /** The buyer paid on the link and its webhook has not been taken yet. */
  const checkoutCompleted = () =>
    new HttpError(
      409,
      'checkout_completed',
      'The buyer has just paid by card. Wait for the payment to show here, then refund it before cancelling.',
    );

  /** What a checkout may ask for now: refused when cancelled or when nothing is owed. */
  function owedOn(invoice: NonNullable<InvoiceRow>) {
    if (invoice.cancelledAt)
      throw new HttpError(
        409,
        'invoice_cancelled',
        'This invoice is cancelled: it takes no payment.',
      );
    const owed = outstandingMinor(money(invoice));
    if (owed <= 0)
      throw new HttpError(409, 'nothing_owed', 'This invoice is paid: nothing is left to pay.');
    return owed;
  }

  /** Closes a link that must take no money; one that is closed already is fine. */
  async function expireQuietly(stripe: Stripe, sessionId: string) {
    try {
      await stripe.checkout.sessions.expire(sessionId);
    } catch (err) {
      if (!(err instanceof Stripe.errors.StripeInvalidRequestError))
        await service(() => Promise.reject(err));
    }
  }

  /**
   * A checkout session for what is still owed, reused while it is open and for the same
   * amount. No transaction is open while the service is called (a slow service must not hold
   * the invoice's row): the invoice is read, the service asked, and the session stored in a
   * short locked transaction only if the invoice is still as it was read. Two taps at once
   * make one session: both ask with the same idempotency key, built from the invoice, the
   * amount and the session it replaces, so the service answers both with the same session.
   */
  async function checkoutLink(
    collectionId: string,
    invoiceId: string,
    base: string,
  ): Promise<{ url: string }> {
    const stripe = cardOn();
    for (let attempt = 0; attempt < 3; attempt++) {
      const invoice = await found(collectionId, invoiceId);
      const owed = owedOn(invoice);
      const previousId = invoice.checkoutSessionId;
      if (previousId) {
        const previous = await service(() => stripe.checkout.sessions.retrieve(previousId));
        if (previous.status === 'open' && previous.amount_total === owed && previous.url)
          return { url: previous.url };
        if (previous.status === 'complete')
          throw new HttpError(
            409,
            'checkout_completed',
            'The buyer has just paid by card: wait a moment for the payment to show here.',
          );
        // Another amount is owed now (a deposit arrived): the old link must not take money.
        if (previous.status === 'open') await expireQuietly(stripe, previousId);
      }
      const metadata = { invoiceId: invoice.id, collectionId };
      const back = (result: string) =>
        `${base}/payment/done?result=${result}&invoice=${invoice.id}`;
      const create = (idempotencyKey: string) =>
        service(() =>
          stripe.checkout.sessions.create(
            {
              mode: 'payment',
              // Cards only: the page offers nothing that pays later or elsewhere. This SDK's API
              // version names the list `allowed_payment_method_types` (it dropped
              // `payment_method_types` here: the SDK's CHANGELOG.md).
              allowed_payment_method_types: ['card'],
              line_items: [
                {
                  quantity: 1,
                  price_data: {
                    currency: invoice.currency.toLowerCase(),
                    unit_amount: owed,
                    product_data: { name: `Invoice ${invoice.number}` },
                  },
                },
              ],
              client_reference_id: invoice.id,
              metadata,
              // The payment intent carries the invoice too, so a declined attempt finds it.
              payment_intent_data: { metadata },
              success_url: back('paid'),
              cancel_url: back('cancelled'),
            },
            { idempotencyKey },
          ),
        );
      const key = `checkout-${invoice.id}-${owed}-${previousId ?? 'first'}`;
      let session = await create(key);
      if (session.lastResponse?.headers?.['idempotent-replayed'] === 'true') {
        // The same state came back (a link closed and nothing else changed): the session the
        // key made earlier may be closed by now.
        const current = await service(() => stripe.checkout.sessions.retrieve(session.id));
        if (current.status !== 'open') session = await create(`${key}-after-${session.id}`);
      }
      const url = session.url;
      if (!url)
        throw new HttpError(
          502,
          'payment_service_unavailable',
          'The payment service gave no link.',
        );
      const stored = await db.transaction(async (tx) => {
        const latest = await found(collectionId, invoiceId, tx);
        if (latest.cancelledAt || outstandingMinor(money(latest)) !== owed) return false;
        if (latest.checkoutSessionId === session.id) return true;
        if (latest.checkoutSessionId !== previousId) return false;
        await setCheckout(tx, invoice.id, { id: session.id, url }, now());
        return true;
      });
      if (stored) return { url };
      // The invoice changed meanwhile (a payment, a cancel, another link): this link must
      // take no money; look again.
      await expireQuietly(stripe, session.id);
    }
    throw new HttpError(
      409,
      'invoice_changed',
      'The invoice changed while its payment link was being made. Try again.',
    );
  }

  async function checkout(collectionId: string, invoiceId: string, origin: string) {
    return checkoutLink(collectionId, invoiceId, deps.publicBase ?? origin);
  }

  /**
   * For the invoice e-mail: the card checkout link for what is still owed (made, or the open
   * one reused), or null when card payment is off, nothing is owed or the invoice is cancelled.
   * `origin` is where the buyer returns when no PUBLIC_URL is set (this server's own address).
   */
  async function paymentLink(
    collectionId: string,
    invoiceId: string,
    origin?: string,
  ): Promise<string | null> {
    if (!sdk) return null;
    const invoice = await found(collectionId, invoiceId);
    if (invoice.cancelledAt || outstandingMinor(money(invoice)) <= 0) return null;
    const base = deps.publicBase ?? origin ?? 'http://localhost';
    return (await checkoutLink(collectionId, invoiceId, base)).url;
  }

  /** A bank transfer or cash: how a deposit (part payment) is usually recorded. */
  async function recordManual(collectionId: string, invoiceId: string, body: ManualPaymentBody) {
    return db.transaction(async (tx) => {
      const invoice = await found(collectionId, invoiceId, tx);
      if (invoice.cancelledAt)
        throw new HttpError(
          409,
          'invoice_cancelled',
          'This invoice is cancelled: it takes no payment.',
        );
      await insertPayment(tx, {
        invoiceId,
        kind: 'payment',
        amountMinor: body.amountMinor,
        currency: invoice.currency,
        providerRef: manualRef(body.method),
        at: now(),
      });
      await recompute(tx, invoice);
    });
  }

  const refundSent = () =>
    new HttpError(
      409,
      'refund_in_progress',
      'This refund was sent already: wait a moment for it to show here.',
    );

  /** Refuses a refund larger than what was received and not given back (or reserved). */
  function mustBeRefundable(invoice: NonNullable<InvoiceRow>, amountMinor: number) {
    const left = refundableMinor(money(invoice));
    if (amountMinor > left)
      throw new HttpError(
        409,
        'refund_too_large',
        left > 0
          ? `At most ${words(left, invoice.currency)} can be refunded on this invoice.`
          : 'Nothing has been paid on this invoice, so there is nothing to refund.',
      );
  }

  /**
   * A refund of at most what was received and not yet given back, checked with the invoice's
   * row locked. A card refund first reserves its amount (a `hold:<nonce>` refund row, in a
   * short locked transaction), so a second tap sees it and no lock is held while the service
   * works; the service is asked with an idempotency key from the nonce, and the reservation is
   * replaced by the refund's own row (`re_…`) — or by the service's `refund.created` webhook,
   * whichever comes first — or taken off again when the service refuses.
   */
  async function refund(collectionId: string, invoiceId: string, body: RefundBody) {
    if (body.method !== 'card') {
      await db.transaction(async (tx) => {
        const invoice = await found(collectionId, invoiceId, tx);
        mustBeRefundable(invoice, body.amountMinor);
        await insertPayment(tx, {
          invoiceId,
          kind: 'refund',
          amountMinor: body.amountMinor,
          currency: invoice.currency,
          providerRef: manualRef(body.method),
          at: now(),
        });
        await recompute(tx, invoice);
      });
      return;
    }
    const stripe = cardOn();
    const holdRef = `hold:${body.nonce ?? randomUUID()}`;
    const card = await db.transaction(async (tx) => {
      const invoice = await found(collectionId, invoiceId, tx);
      mustBeRefundable(invoice, body.amountMinor);
      const payment = (await cardPaymentsOf(tx, invoiceId))
        .reverse()
        .find((p) => p.amountMinor >= body.amountMinor);
      if (!payment)
        throw new HttpError(
          409,
          'no_card_payment',
          'No card payment on this invoice is large enough for this refund: refund by bank transfer or cash and record it here.',
        );
      // The tap's nonce is taken once, like a webhook event's id: the same tap again (a double
      // tap, a retry) is refused in words, however quickly or late it comes.
      if (
        body.nonce &&
        !(await takeEvent(tx, `refund-request:${body.nonce}`, 'refund.request', now()))
      )
        throw refundSent();
      const held = await insertPayment(tx, {
        invoiceId,
        kind: 'refund',
        amountMinor: body.amountMinor,
        currency: invoice.currency,
        providerRef: holdRef,
        at: now(),
      });
      if (!held) throw refundSent();
      await recompute(tx, invoice);
      if (body.nonce)
        await settleEvent(tx, `refund-request:${body.nonce}`, invoiceId, 'refund_sent');
      return payment;
    });
    /** Takes the reservation off; stores the refund's own row when it succeeded. */
    const settle = (made: Stripe.Refund | null) =>
      db.transaction(async (tx) => {
        const invoice = await found(collectionId, invoiceId, tx);
        // A refund the service has not finished is stored when refund.updated says it succeeded.
        if (made?.status === 'succeeded')
          await insertPayment(tx, {
            invoiceId,
            kind: 'refund',
            amountMinor: made.amount,
            currency: invoice.currency,
            providerRef: made.id,
            at: now(),
          });
        await deleteHold(tx, invoiceId, holdRef);
        await recompute(tx, invoice);
      });
    let made: Stripe.Refund;
    try {
      made = await service(() =>
        stripe.refunds.create(
          {
            payment_intent: card.providerRef,
            amount: body.amountMinor,
            metadata: { invoiceId, hold: holdRef },
          },
          { idempotencyKey: `refund-${invoiceId}-${holdRef}` },
        ),
      );
    } catch (err) {
      await settle(null);
      // Refused: the same tap may be tried again.
      if (body.nonce) await deleteEvent(db, `refund-request:${body.nonce}`);
      throw err;
    }
    await settle(made);
  }

  /** The invoice an event names, locked, when it is one of ours. */
  async function invoiceNamed(tx: Db, id: unknown) {
    const parsed = uuid.safeParse(id);
    return parsed.success ? lockInvoice(tx, parsed.data) : null;
  }

  async function apply(tx: Db, event: Stripe.Event): Promise<Outcome> {
    switch (event.type) {
      // An account that still offers delayed methods sends the outcome later as an async
      // event; it is taken like a paid or a declined checkout (decision 022).
      case 'checkout.session.completed':
      case 'checkout.session.async_payment_succeeded': {
        const session = event.data.object;
        const invoice = await invoiceNamed(
          tx,
          session.metadata?.invoiceId ?? session.client_reference_id,
        );
        if (!invoice) return { invoiceId: null, outcome: 'unknown_invoice' };
        // Nothing to store (a payment row holds more than zero): kept as an event, answered 200.
        if (!session.amount_total || session.amount_total <= 0)
          return { invoiceId: invoice.id, outcome: 'ignored_zero_amount' };
        if (session.payment_status !== 'paid') return { invoiceId: invoice.id, outcome: 'unpaid' };
        if ((session.currency ?? '').toUpperCase() !== invoice.currency)
          return { invoiceId: invoice.id, outcome: 'currency_mismatch' };
        const pi =
          typeof session.payment_intent === 'string'
            ? session.payment_intent
            : (session.payment_intent?.id ?? session.id);
        await insertPayment(tx, {
          invoiceId: invoice.id,
          kind: 'payment',
          amountMinor: session.amount_total,
          currency: invoice.currency,
          providerRef: pi,
          at: now(),
        });
        if (invoice.checkoutSessionId === session.id)
          await setCheckout(tx, invoice.id, null, now());
        await recompute(tx, invoice);
        // Money is money: a buyer who paid on a link as the invoice was cancelled has paid,
        // and this outcome finds them for the refund (the status shows the money held).
        return {
          invoiceId: invoice.id,
          outcome: invoice.cancelledAt ? 'paid_after_cancel' : 'paid',
        };
      }
      case 'checkout.session.async_payment_failed': {
        const session = event.data.object;
        const invoice = await invoiceNamed(
          tx,
          session.metadata?.invoiceId ?? session.client_reference_id,
        );
        if (!invoice) return { invoiceId: null, outcome: 'unknown_invoice' };
        return { invoiceId: invoice.id, outcome: 'declined:async_payment_failed' };
      }
      case 'payment_intent.payment_failed': {
        const pi = event.data.object;
        const invoice = await invoiceNamed(tx, pi.metadata?.invoiceId);
        if (!invoice) return { invoiceId: null, outcome: 'unknown_invoice' };
        const e = pi.last_payment_error;
        return { invoiceId: invoice.id, outcome: `declined:${e?.decline_code ?? e?.code ?? ''}` };
      }
      case 'refund.created':
      case 'refund.updated': {
        const r = event.data.object;
        // Ours name the invoice; one made at the service's dashboard has no metadata, and is
        // found by the card payment (payment intent) it gives money back on.
        const pi = typeof r.payment_intent === 'string' ? r.payment_intent : r.payment_intent?.id;
        const invoice =
          (await invoiceNamed(tx, r.metadata?.invoiceId)) ??
          (pi ? await invoiceNamed(tx, await invoiceOfCardPayment(tx, pi)) : null);
        if (!invoice) return { invoiceId: null, outcome: 'unknown_invoice' };
        // A pending refund is stored when its update says it succeeded; one that failed or was
        // cancelled after it was stored gives its money back to the invoice.
        if (r.status === 'failed' || r.status === 'canceled') {
          await deletePayment(tx, 'refund', r.id);
          await recompute(tx, invoice);
          return { invoiceId: invoice.id, outcome: `refund_${r.status}` };
        }
        if (r.status !== 'succeeded')
          return { invoiceId: invoice.id, outcome: `refund_${r.status}` };
        await insertPayment(tx, {
          invoiceId: invoice.id,
          kind: 'refund',
          amountMinor: r.amount,
          currency: invoice.currency,
          providerRef: r.id,
          at: now(),
        });
        // This refund's reservation (made by `refund`, named in the metadata) is now its row.
        const hold = r.metadata?.hold;
        if (hold?.startsWith('hold:')) await deleteHold(tx, invoice.id, hold);
        await recompute(tx, invoice);
        return { invoiceId: invoice.id, outcome: 'refunded' };
      }
      default:
        // charge.refunded repeats refund.created as a running total; the rest is not ours.
        return { invoiceId: null, outcome: 'ignored' };
    }
  }

  /**
   * A webhook delivery: signature checked by the SDK, then the event taken once by its id in
   * the same transaction as its payment row, so a retried delivery changes nothing.
   */
  async function webhook(raw: Buffer, signature: string | undefined) {
    if (!sdk || !config)
      throw new HttpError(
        400,
        'card_payments_off',
        'Card payment is not set up on this server: this webhook was not taken.',
      );
    let event: Stripe.Event;
    try {
      event = sdk.webhooks.constructEvent(
        raw,
        signature ?? '',
        config.webhookSecret,
        WEBHOOK_TOLERANCE_S,
        undefined,
        now().getTime(),
      );
    } catch (err) {
      deps.logger?.warn({ err: (err as Error).message }, 'Webhook refused');
      throw new HttpError(
        400,
        'bad_signature',
        'This webhook’s signature is not valid or too old.',
      );
    }
    return db.transaction(async (tx) => {
      if (!(await takeEvent(tx, event.id, event.type, now())))
        return { received: true, outcome: 'duplicate' };
      const { invoiceId, outcome } = await apply(tx, event);
      await settleEvent(tx, event.id, invoiceId, outcome);
      return { received: true, outcome };
    });
  }

  /**
   * For the sales feature, before it cancels an invoice (or a sale, or expires a hold): the
   * buyer's checkout link stops taking money at the service. A link the buyer has just paid on
   * (its webhook not taken yet) stops the cancel with a 409 and changes nothing: the money is
   * on its way and must be refunded first.
   */
  async function expireCheckout(collectionId: string, invoiceId: string) {
    const invoice = await found(collectionId, invoiceId);
    const sessionId = invoice.checkoutSessionId;
    if (!sessionId) return;
    if (sdk) {
      let session = await service(() => sdk.checkout.sessions.retrieve(sessionId));
      if (session.status === 'open') {
        try {
          await sdk.checkout.sessions.expire(sessionId);
        } catch (err) {
          if (!(err instanceof Stripe.errors.StripeInvalidRequestError)) throw err;
          // No longer open: paid (or closed) between the two calls. Ask again which.
          session = await service(() => sdk.checkout.sessions.retrieve(sessionId));
        }
      }
      if (session.status === 'complete') throw checkoutCompleted();
    }
    await db.transaction(async (tx) => {
      const latest = await found(collectionId, invoiceId, tx);
      if (latest.checkoutSessionId === sessionId) await setCheckout(tx, invoiceId, null, now());
    });
  }

  return {
    list,
    checkout,
    paymentLink,
    recordManual,
    refund,
    webhook,
    expireCheckout,
    cardPayments: sdk !== null,
  };
}

export type PaymentsService = ReturnType<typeof createPaymentsService>;
