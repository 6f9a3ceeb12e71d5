import { describe, expect, it } from 'vitest';
import {
  applyRate,
  CURRENCY_CODES,
  CURRENCY_EXPONENTS,
  formatMoney,
  minorToDecimal,
  parseAmount,
} from './money';

describe('ISO 4217 minor units', () => {
  // ISO 4217, list one ("Minor unit" column), from memory: JPY 0, ISK 0, EUR 2, USD 2.
  it('gives the exponents the standard gives', () => {
    expect(CURRENCY_EXPONENTS.JPY).toBe(0);
    expect(CURRENCY_EXPONENTS.ISK).toBe(0);
    expect(CURRENCY_EXPONENTS.EUR).toBe(2);
    expect(CURRENCY_EXPONENTS.USD).toBe(2);
  });

  // An outside reference: CLDR's currency data, as Node's ICU (Intl) carries it.
  it.each(CURRENCY_CODES)('%s agrees with CLDR (Intl.NumberFormat)', (code) => {
    const cldr = new Intl.NumberFormat('en', { style: 'currency', currency: code });
    expect(cldr.resolvedOptions().maximumFractionDigits).toBe(CURRENCY_EXPONENTS[code]);
  });
});

describe('amounts typed by a keeper', () => {
  it.each([
    ['12.5', 'EUR', 1250],
    ['12,50', 'EUR', 1250],
    ['0.05', 'USD', 5],
    ['1200', 'JPY', 1200],
    ['  7 ', 'GBP', 700],
  ] as const)('%s %s is %d minor units', (text, currency, minor) => {
    expect(parseAmount(text, currency)).toBe(minor);
  });

  it.each([
    ['12.505', 'EUR'], // more decimals than a cent: refused, not rounded
    ['1200.5', 'JPY'], // yen have no minor unit
    ['-3', 'EUR'],
    ['1e3', 'EUR'],
    ['', 'EUR'],
    ['12.', 'EUR'],
    ['9999999999999', 'EUR'], // over MAX_MINOR
  ] as const)('refuses %j in %s', (text, currency) => {
    expect(parseAmount(text, currency)).toBeNull();
  });

  it('writes minor units back as they were typed', () => {
    expect(minorToDecimal(1250, 'EUR')).toBe('12.50');
    expect(minorToDecimal(5, 'USD')).toBe('0.05');
    expect(minorToDecimal(-5, 'USD')).toBe('-0.05');
    expect(minorToDecimal(1200, 'JPY')).toBe('1200');
    for (const minor of [0, 1, 99, 100, 123456]) {
      expect(parseAmount(minorToDecimal(minor, 'SEK'), 'SEK')).toBe(minor);
    }
  });

  it('formats with the currency’s own decimals', () => {
    expect(formatMoney(1250, 'EUR', 'en-GB')).toBe('€12.50');
    expect(formatMoney(1200, 'JPY', 'en-US')).toBe('¥1,200');
    expect(formatMoney(1250, 'EUR', 'nl-NL')).toBe('€\u00a012,50'); // CLDR puts a no-break space there
  });
});

describe('a rate applied to an amount', () => {
  // Worked by hand: 3 750 × 21 % = 787.5 → 788 (half away from zero); 1 005 × 8 % = 80.4 → 80;
  // 250 × 21 % = 52.5 → 53, and a credit of −250 → −53.
  it.each([
    [3750, 2100, 788],
    [1005, 800, 80],
    [250, 2100, 53],
    [-250, 2100, -53],
    [249, 2100, 52], // 52.29
    [0, 2100, 0],
    [1999, 0, 0],
  ])('%d at %d basis points is %d', (amount, rate, expected) => {
    expect(applyRate(amount, rate)).toBe(expected);
  });
});
