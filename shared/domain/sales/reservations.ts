import { addDays, daysBetween, type LocalDate } from '../local-dates';

/**
 * Reservations (decision 022): a sale holds its animals for a buyer until the last day of the
 * hold, a calendar date in the collection's zone. It expires the day after that date unless
 * money has come in (a part-paid buyer is talked to, never dropped by a timer).
 */

/** The longest hold a keeper may give: a season, and the settings' `holdDays` limit. */
export const MAX_HOLD_DAYS = 365;

/** The hold's last day when the keeper does not choose one: today plus the settings' days. */
export function defaultReservedUntil(today: LocalDate, holdDays: number): LocalDate {
  return addDays(today, holdDays);
}

/** Why a hold's last day cannot be used, in words; null when it can. */
export function holdDateProblem(reservedUntil: LocalDate, today: LocalDate): string | null {
  const days = daysBetween(today, reservedUntil);
  if (days < 0) return 'The hold cannot end before today. Choose today or a later day.';
  if (days > MAX_HOLD_DAYS) return `Hold animals for ${MAX_HOLD_DAYS} days at most.`;
  return null;
}

export interface HeldSale {
  status: 'reserved' | 'shipped' | 'expired' | 'cancelled';
  reservedUntil: LocalDate;
  /** Money kept on the sale's live invoice: received minus refunded (0 without an invoice). */
  paidMinor: number;
}

/**
 * Whether a sale's hold has run out on `today` (the collection's local date): still reserved,
 * its last day before today, and nothing paid. The last day itself is still held.
 */
export function reservationExpired(sale: HeldSale, today: LocalDate): boolean {
  return sale.status === 'reserved' && sale.reservedUntil < today && sale.paidMinor === 0;
}
