import { formatMoney, isCurrencyCode } from '#shared/domain/sales/money';
import type { ShippingConcern } from '#shared/domain/sales/shipping-check';
import { formatTemperature, type TemperatureUnit } from '#shared/domain/temperature';
import type { SaleStatus } from '#shared/schemas/sales';

export const SALE_STATUS_WORDS: Record<SaleStatus, string> = {
  reserved: 'Reserved',
  shipped: 'Shipped',
  expired: 'Hold ran out',
  cancelled: 'Cancelled',
};

export const INVOICE_STATUS_WORDS = {
  open: 'Open',
  part_paid: 'Part paid',
  paid: 'Paid',
  refunded: 'Refunded',
  cancelled: 'Cancelled',
} as const;

/** Minor units in the reader's way of writing money; an unknown code shows as digits. */
export function money(minor: number, currency: string): string {
  return isCurrencyCode(currency) ? formatMoney(minor, currency) : `${minor} ${currency}`;
}

const WEEKDAYS = ['', 'Monday', 'Tuesday', 'Wednesday', 'Thursday', 'Friday', 'Saturday', 'Sunday'];

/** A concern of the shipping check in words, temperatures in the person's unit. */
export function concernText(concern: ShippingConcern, unit: TemperatureUnit): string {
  switch (concern.kind) {
    case 'too_cold':
      return `The forecast low (${formatTemperature(concern.lowC, unit)}) is below your safe minimum of ${formatTemperature(concern.minC, unit)}.`;
    case 'too_hot':
      return `The forecast high (${formatTemperature(concern.highC, unit)}) is above your safe maximum of ${formatTemperature(concern.maxC, unit)}.`;
    case 'weekend_risk':
      return `${WEEKDAYS[concern.weekday]} is late in the week: a parcel delayed a day may sit in a depot over the weekend.`;
  }
}
