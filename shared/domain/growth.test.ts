import { describe, expect, it } from 'vitest';
import {
  acceptanceRate,
  growthSeries,
  mealIntervals,
  moltsInLastYear,
  sexFromMolts,
} from './growth';
import { daysBetween } from './local-dates';

describe('growth and intervals (worked by hand)', () => {
  it('counts calendar days, leap day included', () => {
    // 2024 is a leap year (Gregorian rule: divisible by 4, not by 100 unless by 400).
    expect(daysBetween('2024-02-28', '2024-03-01')).toBe(2);
    expect(daysBetween('2026-02-28', '2026-03-01')).toBe(1);
    expect(daysBetween('2026-03-07', '2026-03-09')).toBe(2); // across Toronto's DST change: dates, not hours
  });

  it('gives each molt its interval and growth', () => {
    // 12 mm → 15 mm is +25 %; 15 → 19.5 is +30 %; a molt without a size keeps the last size for the next %.
    const series = growthSeries([
      { date: '2026-05-01', sizeMm: 15 },
      { date: '2026-01-01', sizeMm: 12 },
      { date: '2026-08-09', sizeMm: null },
      { date: '2026-11-07', sizeMm: 19.5 },
    ]);
    expect(series).toEqual([
      { date: '2026-01-01', sizeMm: 12, daysSincePrevious: null, growthPct: null },
      { date: '2026-05-01', sizeMm: 15, daysSincePrevious: 120, growthPct: 25 },
      { date: '2026-08-09', sizeMm: null, daysSincePrevious: 100, growthPct: null },
      { date: '2026-11-07', sizeMm: 19.5, daysSincePrevious: 90, growthPct: 30 },
    ]);
    expect(moltsInLastYear(series, '2026-12-31')).toBe(4);
    expect(moltsInLastYear(series, '2027-01-01')).toBe(3); // 2026-01-01 is 365 days back: outside
  });

  it('reads sex from molts: exuviae sexing, and a maturing molt makes a mature male', () => {
    expect(sexFromMolts('unknown', [{ date: '2026-01-01', sexFromExuviae: 'unknown' }])).toBe(
      'unknown',
    );
    expect(sexFromMolts('unknown', [{ date: '2026-01-01', sexFromExuviae: 'female' }])).toBe(
      'female',
    );
    expect(
      sexFromMolts('female', [
        { date: '2026-01-01', sexFromExuviae: 'female' },
        { date: '2026-06-01', sexFromExuviae: 'male' },
      ]),
    ).toBe('male');
    expect(sexFromMolts('male', [{ date: '2026-06-01', maturing: true }])).toBe('mature_male');
    expect(sexFromMolts('unknown', [])).toBe('unknown');
  });

  it('rates acceptance over the last offers and finds the median meal interval', () => {
    const offers = [
      { date: '2026-10-01', kind: 'ate' as const },
      { date: '2026-10-08', kind: 'refused' as const },
      { date: '2026-10-10', kind: 'ate' as const },
      { date: '2026-10-20', kind: 'ate' as const },
      { date: '2026-10-30', kind: 'refused' as const },
    ];
    expect(acceptanceRate(offers, 4)).toEqual({ ate: 2, offered: 4, rate: 50 });
    expect(acceptanceRate(offers, 10)).toEqual({ ate: 3, offered: 5, rate: 60 });
    expect(acceptanceRate([], 5).rate).toBeNull();
    // Meals on 1, 10 and 20 Oct and 2 Nov: gaps 9, 10, 13 → median 10; with one more at 8 Nov (6): (9 + 10) / 2.
    expect(mealIntervals(['2026-10-01', '2026-10-10', '2026-10-20', '2026-11-02'])).toEqual({
      gaps: [9, 10, 13],
      median: 10,
    });
    expect(
      mealIntervals(['2026-10-01', '2026-10-10', '2026-10-20', '2026-11-02', '2026-11-08']).median,
    ).toBe(9.5);
  });
});
