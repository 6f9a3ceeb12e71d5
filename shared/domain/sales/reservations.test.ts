import { describe, expect, it } from 'vitest';
import { defaultReservedUntil, holdDateProblem, reservationExpired } from './reservations';

describe('a hold’s last day', () => {
  // Calendar facts: 2026-10-28 + 7 days is 2026-11-04 (across the end of DST in North America,
  // which calendar dates do not see); 2026-12-28 + 7 is 2027-01-04; 2028-02-25 + 5 is 2028-03-01
  // (2028 is a leap year).
  it.each([
    ['2026-10-28', 7, '2026-11-04'],
    ['2026-12-28', 7, '2027-01-04'],
    ['2028-02-25', 5, '2028-03-01'],
  ])('from %s, %d days ends %s', (today, days, end) => {
    expect(defaultReservedUntil(today, days)).toBe(end);
  });

  it('refuses a past day and a hold over a year, in words', () => {
    expect(holdDateProblem('2026-12-02', '2026-12-03')).toMatch(/before today/);
    expect(holdDateProblem('2026-12-03', '2026-12-03')).toBeNull();
    expect(holdDateProblem('2027-12-03', '2026-12-03')).toBeNull(); // 365 days
    expect(holdDateProblem('2027-12-04', '2026-12-03')).toMatch(/365 days/);
  });
});

describe('when a hold runs out', () => {
  const sale = { status: 'reserved' as const, reservedUntil: '2026-11-01', paidMinor: 0 };
  it('holds through its last day and expires the day after', () => {
    expect(reservationExpired(sale, '2026-10-31')).toBe(false);
    expect(reservationExpired(sale, '2026-11-01')).toBe(false);
    expect(reservationExpired(sale, '2026-11-02')).toBe(true);
  });
  it('never expires a sale with money received, or one that has ended', () => {
    expect(reservationExpired({ ...sale, paidMinor: 500 }, '2026-12-01')).toBe(false);
    expect(reservationExpired({ ...sale, status: 'shipped' }, '2026-12-01')).toBe(false);
    expect(reservationExpired({ ...sale, status: 'cancelled' }, '2026-12-01')).toBe(false);
  });
});
