import { describe, expect, it } from 'vitest';
import { dayOfWeek } from '../local-dates';
import { DEFAULT_SAFE_RANGE, shippingConcerns } from './shipping-check';

describe('ISO weekdays', () => {
  // Calendar facts: 2026-12-07 is a Monday, 2026-12-13 a Sunday; 1970-01-01 was a Thursday;
  // 2024-02-29 was a Thursday.
  it.each([
    ['2026-12-07', 1],
    ['2026-12-09', 3],
    ['2026-12-13', 7],
    ['1970-01-01', 4],
    ['1969-12-29', 1],
    ['2024-02-29', 4],
  ])('%s is weekday %d', (date, weekday) => {
    expect(dayOfWeek(date)).toBe(weekday);
  });
});

describe('a day to ship', () => {
  // Common practice, no published source: about 5 °C to 30 °C along the route.
  it('starts from 5–30 °C', () => {
    expect(DEFAULT_SAFE_RANGE).toEqual({ minC: 5, maxC: 30 });
  });

  it('finds nothing against a mild Monday, ends of the range included', () => {
    expect(shippingConcerns('2026-12-07', { lowC: 5, highC: 30 })).toEqual([]);
  });

  it('holds back a frosty night and a hot day', () => {
    expect(shippingConcerns('2026-12-08', { lowC: -2, highC: 31 })).toEqual([
      { kind: 'too_cold', lowC: -2, minC: 5 },
      { kind: 'too_hot', highC: 31, maxC: 30 },
    ]);
  });

  it('uses the keeper’s own range', () => {
    expect(shippingConcerns('2026-12-08', { lowC: 8, highC: 20 }, { minC: 10, maxC: 26 })).toEqual([
      { kind: 'too_cold', lowC: 8, minC: 10 },
    ]);
  });

  it('warns from Thursday that a late parcel meets the weekend', () => {
    expect(shippingConcerns('2026-12-09', { lowC: 10, highC: 20 })).toEqual([]);
    expect(shippingConcerns('2026-12-10', { lowC: 10, highC: 20 })).toEqual([
      { kind: 'weekend_risk', weekday: 4 },
    ]);
    expect(shippingConcerns('2026-12-13', { lowC: 10, highC: 20 })).toEqual([
      { kind: 'weekend_risk', weekday: 7 },
    ]);
  });
});
