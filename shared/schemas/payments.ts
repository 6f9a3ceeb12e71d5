import { z } from 'zod';
import { MAX_MINOR } from '../domain/sales/money';
import { collectionParams, uuid } from './common';

export const invoiceParams = collectionParams.extend({ invoiceId: uuid });

const amountMinor = z
  .number({ message: 'Give the amount.' })
  .int({ message: 'Give the amount in whole minor units (cents).' })
  .positive({ message: 'The amount must be more than zero.' })
  .max(MAX_MINOR, { message: 'This amount is far too large.' });

/** How money that did not go through card checkout arrived: recorded by the keeper. */
export const MANUAL_METHODS = ['bank_transfer', 'cash'] as const;
export const PAYMENT_METHODS = ['card', ...MANUAL_METHODS] as const;
export type PaymentMethod = (typeof PAYMENT_METHODS)[number];

export const manualPaymentBody = z.strictObject({
  method: z.enum(MANUAL_METHODS, { message: 'Choose bank transfer or cash.' }),
  amountMinor,
});
export type ManualPaymentBody = z.infer<typeof manualPaymentBody>;

/**
 * A refund: `card` goes back through the payment service against the card payment; a bank
 * transfer or cash refund is money the keeper returned by hand and records here.
 */
export const refundBody = z.strictObject({
  amountMinor,
  method: z
    .enum(PAYMENT_METHODS, { message: 'Choose card, bank transfer or cash.' })
    .default('card'),
  /**
   * Made once per tap by the client and sent again with a retry: the same nonce is the same
   * refund (a second one while the first is on its way is refused, a later one answers it).
   */
  nonce: uuid.optional(),
});
export type RefundBody = z.infer<typeof refundBody>;

export const checkoutAnswer = z.object({ url: z.string().url() });

const INVOICE_STATUS = z.enum(['open', 'part_paid', 'paid', 'refunded', 'cancelled']);

export const paymentView = z.object({
  id: z.string(),
  kind: z.enum(['payment', 'refund']),
  method: z.enum(PAYMENT_METHODS),
  amountMinor: z.number().int(),
  currency: z.string(),
  at: z.string(),
});
export type PaymentView = z.infer<typeof paymentView>;

/** The invoice's money as it stands, with every payment and refund, newest last. */
export const invoicePayments = z.object({
  invoice: z.object({
    id: z.string(),
    status: INVOICE_STATUS,
    currency: z.string(),
    totalMinor: z.number().int(),
    paidMinor: z.number().int(),
    refundedMinor: z.number().int(),
    checkoutUrl: z.string().nullable(),
  }),
  payments: z.array(paymentView),
  /** The last declined card attempt, if one came after the last payment. */
  lastDecline: z.object({ at: z.string(), message: z.string() }).nullable(),
  /** False when this server has no payment service keys: manual payments only. */
  cardPayments: z.boolean(),
});
export type InvoicePayments = z.infer<typeof invoicePayments>;
