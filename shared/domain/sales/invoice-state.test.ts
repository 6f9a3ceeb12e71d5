import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
  invoiceStatus,
  outstandingMinor,
  refundableMinor,
  type InvoiceMoney,
} from './invoice-state';

const money = (m: Partial<InvoiceMoney>): InvoiceMoney => ({
  totalMinor: 8475,
  paidMinor: 0,
  refundedMinor: 0,
  cancelled: false,
  ...m,
});

describe('invoiceStatus', () => {
  // Worked case: three slings at CAD 25.00, CAD 15.00 shipping, 13 % HST on 90.00 = 11.70
  // (Government of Canada, GST/HST rates, from memory): 101.70 in all.
  const total = 10170;

  it('is open until money arrives', () => {
    expect(invoiceStatus(money({ totalMinor: total }))).toBe('open');
  });

  it('is part paid after a deposit', () => {
    expect(invoiceStatus(money({ totalMinor: total, paidMinor: 3000 }))).toBe('part_paid');
  });

  it('is paid when exactly the total or more arrived (an overpayment is paid)', () => {
    expect(invoiceStatus(money({ totalMinor: total, paidMinor: total }))).toBe('paid');
    expect(invoiceStatus(money({ totalMinor: total, paidMinor: total + 1 }))).toBe('paid');
    expect(invoiceStatus(money({ totalMinor: total, paidMinor: total - 1 }))).toBe('part_paid');
  });

  it('stays paid after a partial refund, and is refunded after a full one', () => {
    expect(invoiceStatus(money({ totalMinor: total, paidMinor: total, refundedMinor: 2500 }))).toBe(
      'paid',
    );
    expect(
      invoiceStatus(money({ totalMinor: total, paidMinor: total, refundedMinor: total })),
    ).toBe('refunded');
  });

  it('is refunded when a deposit went back in full', () => {
    expect(invoiceStatus(money({ totalMinor: total, paidMinor: 3000, refundedMinor: 3000 }))).toBe(
      'refunded',
    );
  });

  it('is cancelled with nothing received, but shows money a cancelled invoice still holds', () => {
    expect(invoiceStatus(money({ cancelled: true }))).toBe('cancelled');
    expect(invoiceStatus(money({ totalMinor: total, paidMinor: total, cancelled: true }))).toBe(
      'paid',
    );
    expect(
      invoiceStatus(
        money({ totalMinor: total, paidMinor: total, refundedMinor: total, cancelled: true }),
      ),
    ).toBe('refunded');
  });

  it('has nothing to collect on a zero invoice', () => {
    expect(invoiceStatus(money({ totalMinor: 0 }))).toBe('paid');
  });

  // Property: the status never contradicts the money, whatever the amounts.
  it('always agrees with outstanding and refundable amounts', () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 0, max: 1e7 }),
        fc.integer({ min: 0, max: 1e7 }),
        fc.integer({ min: 0, max: 1e7 }),
        fc.boolean(),
        (totalMinor, paidMinor, r, cancelled) => {
          const m = { totalMinor, paidMinor, refundedMinor: Math.min(r, paidMinor), cancelled };
          const s = invoiceStatus(m);
          if (s === 'open' || s === 'part_paid') expect(outstandingMinor(m)).toBeGreaterThan(0);
          if (s === 'paid') expect(refundableMinor(m) > 0 || totalMinor === 0).toBe(true);
          if (s === 'refunded') expect(refundableMinor(m)).toBe(0);
          if (s === 'cancelled') expect(m.paidMinor).toBe(0);
        },
      ),
    );
  });
});

describe('outstandingMinor and refundableMinor', () => {
  it('collect what is owed and refund what is held', () => {
    const m = money({ totalMinor: 10170, paidMinor: 3000, refundedMinor: 1000 });
    expect(outstandingMinor(m)).toBe(7170);
    expect(refundableMinor(m)).toBe(2000);
    expect(outstandingMinor(money({ totalMinor: 100, paidMinor: 150 }))).toBe(0);
  });
});
