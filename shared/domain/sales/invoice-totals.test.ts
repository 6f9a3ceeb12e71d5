import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { invoiceTotals, type InvoiceLineInput } from './invoice-totals';

// Example rates only, not tax advice: what applies to live animals and to shipping is the
// keeper's to set.
const line = (unitPrice: number, quantity: number, taxBasisPoints: number): InvoiceLineInput => ({
  unitPrice,
  quantity,
  taxBasisPoints,
});

describe('invoice totals', () => {
  it('three slings at €12.50 with 21 % tax (worked by hand: 37.50 + 7.875 → 7.88)', () => {
    const totals = invoiceTotals([line(1250, 3, 2100)], 'per_invoice');
    expect(totals).toMatchObject({ net: 3750, tax: 788, gross: 4538 });
  });

  it('rounds once per rate, or once per line, as chosen', () => {
    // Three lines of €2.50 at 21 %: each line's tax is 0.525 → 0.53, so per line 1.59; the
    // invoice's 7.50 × 21 % = 1.575 → 1.58 per invoice. The two rules differ by a cent.
    const lines = [line(250, 1, 2100), line(250, 1, 2100), line(250, 1, 2100)];
    expect(invoiceTotals(lines, 'per_line')).toMatchObject({ net: 750, tax: 159, gross: 909 });
    expect(invoiceTotals(lines, 'per_invoice')).toMatchObject({ net: 750, tax: 158, gross: 908 });
  });

  it('keeps each rate’s tax apart, shipping at its own rate', () => {
    // Slings 2 × €15.00 at 9 % (2.70) and shipping €24.95 at 21 % (5.2395 → 5.24).
    const totals = invoiceTotals([line(1500, 2, 900), line(2495, 1, 2100)], 'per_invoice');
    expect(totals.taxByRate).toEqual([
      { basisPoints: 900, net: 3000, tax: 270 },
      { basisPoints: 2100, net: 2495, tax: 524 },
    ]);
    expect(totals).toMatchObject({ net: 5495, tax: 794, gross: 6289 });
  });

  it('works in yen, which have no minor unit (¥1 005 at 8 % = 80.4 → ¥80)', () => {
    expect(invoiceTotals([line(1005, 1, 800)], 'per_line')).toMatchObject({ tax: 80, gross: 1085 });
  });

  // Arithmetic, not a source: rounding once per rate is within half a minor unit of the exact
  // tax; rounding per line is within half a unit per line.
  it('stays within half a minor unit of the exact tax (per rate, or per line)', () => {
    const lines = fc.array(
      fc.record({
        unitPrice: fc.integer({ min: 0, max: 1_000_000 }),
        quantity: fc.integer({ min: 1, max: 200 }),
        taxBasisPoints: fc.constantFrom(0, 700, 900, 1900, 2100, 2500),
      }),
      { minLength: 1, maxLength: 30 },
    );
    fc.assert(
      fc.property(lines, (inputs) => {
        const exact = inputs.reduce(
          (sum, l) => sum + (l.unitPrice * l.quantity * l.taxBasisPoints) / 10_000,
          0,
        );
        const perInvoice = invoiceTotals(inputs, 'per_invoice');
        const perLine = invoiceTotals(inputs, 'per_line');
        const rates = perInvoice.taxByRate.length;
        expect(Math.abs(perInvoice.tax - exact)).toBeLessThanOrEqual(rates / 2 + 1e-6);
        expect(Math.abs(perLine.tax - exact)).toBeLessThanOrEqual(inputs.length / 2 + 1e-6);
        expect(perInvoice.gross).toBe(perInvoice.net + perInvoice.tax);
      }),
    );
  });
});
