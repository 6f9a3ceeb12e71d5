/**
 * Money for sales: amounts are whole minor units (cents, öre; yen have none), as the payment
 * SDK expects them, never floating-point major units.
 */

/**
 * The currencies a collection may sell in, with their ISO 4217 minor-unit exponent (ISO 4217,
 * list one, "Minor unit" column; from memory — `money.test.ts` checks each against CLDR's
 * currency data in Intl). HUF is left out on purpose: ISO 4217 gives it 2 while CLDR and most
 * card processors treat it as having none in practice.
 */
export const CURRENCY_EXPONENTS = {
  AUD: 2,
  CAD: 2,
  CHF: 2,
  CZK: 2,
  DKK: 2,
  EUR: 2,
  GBP: 2,
  ISK: 0,
  JPY: 0,
  NOK: 2,
  NZD: 2,
  PLN: 2,
  SEK: 2,
  USD: 2,
} as const;
export type CurrencyCode = keyof typeof CURRENCY_EXPONENTS;
export const CURRENCY_CODES = Object.keys(CURRENCY_EXPONENTS) as CurrencyCode[];

export const isCurrencyCode = (code: string): code is CurrencyCode =>
  Object.prototype.hasOwnProperty.call(CURRENCY_EXPONENTS, code);

/** The largest amount we accept, in minor units: far above any sale, far below 2^53. */
export const MAX_MINOR = 10 ** 12;

/**
 * "12.5" or "12,50" typed by a keeper → minor units (1250 for EUR). Null when the text is not
 * a plain non-negative amount or has more decimals than the currency has (no silent rounding
 * of a price).
 */
export function parseAmount(text: string, currency: CurrencyCode): number | null {
  const exponent = CURRENCY_EXPONENTS[currency];
  const match = /^\s*(\d{1,12})(?:[.,](\d+))?\s*$/.exec(text);
  if (!match) return null;
  const [, whole, fraction = ''] = match;
  if (fraction.length > exponent) return null;
  const minor = Number(whole) * 10 ** exponent + Number(fraction.padEnd(exponent, '0') || '0');
  return minor <= MAX_MINOR ? minor : null;
}

/** Minor units → "12.50" (no symbol, no grouping): for inputs and CSV. */
export function minorToDecimal(minor: number, currency: CurrencyCode): string {
  const exponent = CURRENCY_EXPONENTS[currency];
  const sign = minor < 0 ? '-' : '';
  const abs = Math.abs(minor);
  if (exponent === 0) return `${sign}${abs}`;
  const unit = 10 ** exponent;
  return `${sign}${Math.floor(abs / unit)}.${String(abs % unit).padStart(exponent, '0')}`;
}

/** Minor units → the reader's way of writing money ("€12.50", "¥1,200"). */
export function formatMoney(minor: number, currency: CurrencyCode, locale?: string): string {
  const exponent = CURRENCY_EXPONENTS[currency];
  return new Intl.NumberFormat(locale, {
    style: 'currency',
    currency,
    minimumFractionDigits: exponent,
    maximumFractionDigits: exponent,
  }).format(minor / 10 ** exponent);
}

/**
 * `amount × basisPoints / 10 000`, rounded half away from zero to a whole minor unit, in
 * integers only (a tax rate of 21 % is 2100 basis points; 7.7 % is 770).
 */
export function applyRate(amount: number, basisPoints: number): number {
  const product = Math.abs(amount) * basisPoints;
  const rounded = Math.floor((product + 5000) / 10000);
  return amount < 0 ? -rounded : rounded;
}
