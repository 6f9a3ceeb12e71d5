/**
 * An invoice's status, worked out from its money (decision 022, card payment part).
 *
 * The rules, in order:
 * 1. Money back: once something was refunded and nothing received is still held
 *    (refunded ≥ paid > 0), the invoice is `refunded` — cancelled or not.
 * 2. Cancelled: with nothing received it is `cancelled`. A cancelled invoice that still holds
 *    money (a buyer paid on an old link) shows that money as 4–5 below, so nobody forgets to
 *    send it back.
 * 3. Nothing owed (total 0) and nothing received: `paid` (a gift has nothing to collect).
 * 4. Received at least the total: `paid`. An overpayment is paid; a partial refund of a paid
 *    invoice is still paid, with `refundedMinor` shown beside it (the buyer keeps the animals;
 *    a refund never reopens the invoice for payment).
 * 5. Received something, less than the total: `part_paid` (a deposit, a short transfer).
 * 6. Otherwise: `open`.
 * Gross paid decides 4–5, not paid − refunded, for the same reason as in 4.
 */
export type InvoiceStatus = 'open' | 'part_paid' | 'paid' | 'refunded' | 'cancelled';

export interface InvoiceMoney {
  totalMinor: number;
  paidMinor: number;
  refundedMinor: number;
  cancelled: boolean;
}

export function invoiceStatus({
  totalMinor,
  paidMinor,
  refundedMinor,
  cancelled,
}: InvoiceMoney): InvoiceStatus {
  if (paidMinor > 0 && refundedMinor >= paidMinor) return 'refunded';
  if (cancelled && paidMinor <= 0) return 'cancelled';
  if (paidMinor >= totalMinor) return 'paid';
  if (paidMinor > 0) return 'part_paid';
  return 'open';
}

/** What a card checkout collects: the total less what was received (refunds do not reopen it). */
export function outstandingMinor({ totalMinor, paidMinor }: InvoiceMoney): number {
  return Math.max(0, totalMinor - paidMinor);
}

/** The most that may still be refunded: what was received and not yet given back. */
export function refundableMinor({ paidMinor, refundedMinor }: InvoiceMoney): number {
  return Math.max(0, paidMinor - refundedMinor);
}
