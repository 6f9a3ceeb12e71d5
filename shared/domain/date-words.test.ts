import { describe, expect, it } from 'vitest';
import { formatDateRange, formatInstant, formatLocalDate } from './date-words';

// Expected strings are what the CLDR data in ICU 78 (Node 20's full ICU) gives for these locales;
// CLDR's en-GB pattern puts a comma after the weekday when the year is shown.
describe('calendar dates in the person’s locale', () => {
  it('writes a date the British way and the American way', () => {
    expect(formatLocalDate('2026-12-02', 'en-GB', { year: 'always' })).toBe('Wed, 2 Dec 2026');
    expect(formatLocalDate('2026-12-02', 'en-US', { year: 'always' })).toBe('Wed, Dec 2, 2026');
    expect(formatLocalDate('2026-12-02', 'de-DE', { year: 'always' })).toBe('Mi., 2. Dez. 2026');
  });

  it('leaves the year out for this year only (auto)', () => {
    expect(formatLocalDate('2026-12-02', 'en-GB', { today: '2026-12-03' })).toBe('Wed 2 Dec');
    expect(formatLocalDate('2025-12-02', 'en-GB', { today: '2026-12-03' })).toBe('Tue, 2 Dec 2025');
    expect(formatLocalDate('2026-12-02', 'en-GB', { weekday: false, year: 'never' })).toBe('2 Dec');
  });

  it('never moves a calendar date to another day, whatever the runtime’s zone', () => {
    // Noon UTC in UTC: 1 January stays 1 January (a midnight instant in a western zone would not).
    expect(formatLocalDate('2027-01-01', 'en-GB', { year: 'always' })).toBe('Fri, 1 Jan 2027');
    expect(formatLocalDate('2026-03-08', 'en-GB', { year: 'always' })).toBe('Sun, 8 Mar 2026');
  });

  it('writes a span with the year once, or on both ends across New Year', () => {
    expect(formatDateRange('2026-12-02', '2026-12-10', 'en-GB')).toBe(
      'from Wed 2 Dec to Thu, 10 Dec 2026',
    );
    expect(formatDateRange('2026-12-02', '2026-12-10', 'en-US')).toBe(
      'from Wed, Dec 2 to Thu, Dec 10, 2026',
    );
    expect(formatDateRange('2026-12-28', '2027-01-04', 'en-GB')).toBe(
      'from Mon, 28 Dec 2026 to Mon, 4 Jan 2027',
    );
  });

  it('writes an instant in the collection’s zone', () => {
    // 14:30 UTC is 9:30 in Toronto (EST, UTC−5, in December).
    expect(formatInstant('2026-12-02T14:30:00Z', 'America/Toronto', 'en-GB')).toBe(
      'Wed, 2 Dec 2026, 9:30',
    );
  });
});
