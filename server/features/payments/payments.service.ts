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
  deletePayment,
  insertPayment,
  invoiceInCollection,
  lastDeclineOf,
  lockInvoice,
  paymentsOf,
  setCheckout,
  setInvoiceMoney,
  settleEvent,
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

  /**
   * A checkout session for what is still owed, reused while it is open and for the same
   * amount. The invoice row stays locked meanwhile, so two taps make one session.
   */
  async function checkout(
    collectionId: string,
    invoiceId: string,
    origin: string,
  ): Promise<{ url: string }> {
    const stripe = cardOn();
    return db.transaction(async (tx) => {
      const invoice = await found(collectionId, invoiceId, tx);
      if (invoice.cancelledAt)
        throw new HttpError(
          409,
          'invoice_cancelled',
          'This invoice is cancelled: it takes no payment.',
        );
      const owed = outstandingMinor(money(invoice));
      if (owed <= 0)
        throw new HttpError(409, 'nothing_owed', 'This invoice is paid: nothing is left to pay.');
      if (invoice.checkoutSessionId) {
        const previous = await service(() =>
          stripe.checkout.sessions.retrieve(invoice.checkoutSessionId!),
        );
        if (previous.status === 'open' && previous.amount_total === owed && previous.url)
          return { url: previous.url };
        // Another amount is owed now (a deposit arrived): the old link must not take money.
        if (previous.status === 'open')
          await service(() => stripe.checkout.sessions.expire(previous.id));
      }
      const metadata = { invoiceId: invoice.id, collectionId };
      const back = (result: string) =>
        `${deps.publicBase ?? origin}/payment/done?result=${result}&invoice=${invoice.id}`;
      const session = await service(() =>
        stripe.checkout.sessions.create({
          mode: 'payment',
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
        }),
      );
      if (!session.url)
        throw new HttpError(
          502,
          'payment_service_unavailable',
          'The payment service gave no link.',
        );
      await setCheckout(tx, invoice.id, { id: session.id, url: session.url }, now());
      return { url: session.url };
    });
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

  /**
   * A refund of at most what was received and not yet given back. A card refund goes through
   * the service against a card payment big enough for it (no lock is held meanwhile: the
   * service's own webhook for it locks the invoice) and is stored by the refund's id, whichever
   * of this answer and the webhook comes first.
   */
  async function refund(collectionId: string, invoiceId: string, body: RefundBody) {
    const invoice = await found(collectionId, invoiceId);
    const left = refundableMinor(money(invoice));
    if (body.amountMinor > left)
      throw new HttpError(
        409,
        'refund_too_large',
        left > 0
          ? `At most ${words(left, invoice.currency)} can be refunded on this invoice.`
          : 'Nothing has been paid on this invoice, so there is nothing to refund.',
      );
    let providerRef: string;
    if (body.method === 'card') {
      const stripe = cardOn();
      const card = (await cardPaymentsOf(db, invoiceId))
        .reverse()
        .find((p) => p.amountMinor >= body.amountMinor);
      if (!card)
        throw new HttpError(
          409,
          'no_card_payment',
          'No card payment on this invoice is large enough for this refund: refund by bank transfer or cash and record it here.',
        );
      const made = await service(() =>
        stripe.refunds.create({
          payment_intent: card.providerRef,
          amount: body.amountMinor,
          metadata: { invoiceId },
        }),
      );
      // A refund the service has not finished is stored when refund.updated says it succeeded.
      if (made.status !== 'succeeded') return;
      providerRef = made.id;
    } else providerRef = manualRef(body.method);
    await db.transaction(async (tx) => {
      const locked = await found(collectionId, invoiceId, tx);
      await insertPayment(tx, {
        invoiceId,
        kind: 'refund',
        amountMinor: body.amountMinor,
        currency: locked.currency,
        providerRef,
        at: now(),
      });
      await recompute(tx, locked);
    });
  }

  /** The invoice an event names, locked, when it is one of ours. */
  async function invoiceNamed(tx: Db, id: unknown) {
    const parsed = uuid.safeParse(id);
    return parsed.success ? lockInvoice(tx, parsed.data) : null;
  }

  async function apply(tx: Db, event: Stripe.Event): Promise<Outcome> {
    switch (event.type) {
      case 'checkout.session.completed': {
        const session = event.data.object;
        const invoice = await invoiceNamed(
          tx,
          session.metadata?.invoiceId ?? session.client_reference_id,
        );
        if (!invoice) return { invoiceId: null, outcome: 'unknown_invoice' };
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
          amountMinor: session.amount_total ?? 0,
          currency: invoice.currency,
          providerRef: pi,
          at: now(),
        });
        if (invoice.checkoutSessionId === session.id)
          await setCheckout(tx, invoice.id, null, now());
        await recompute(tx, invoice);
        return { invoiceId: invoice.id, outcome: 'paid' };
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
        const invoice = await invoiceNamed(tx, r.metadata?.invoiceId);
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
   * For the sales feature when an invoice is cancelled: the buyer's checkout link stops taking
   * money at the service too (Rackside already refuses a new checkout for it).
   */
  async function expireCheckout(collectionId: string, invoiceId: string) {
    const invoice = await found(collectionId, invoiceId);
    if (!invoice.checkoutSessionId) return;
    if (sdk) {
      const session = await service(() =>
        sdk.checkout.sessions.retrieve(invoice.checkoutSessionId!),
      );
      if (session.status === 'open') await service(() => sdk.checkout.sessions.expire(session.id));
    }
    await setCheckout(db, invoiceId, null, now());
  }

  return {
    list,
    checkout,
    recordManual,
    refund,
    webhook,
    expireCheckout,
    cardPayments: sdk !== null,
  };
}

export type PaymentsService = ReturnType<typeof createPaymentsService>;
