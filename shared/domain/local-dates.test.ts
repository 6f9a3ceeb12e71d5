// Local calendar dates in America/Toronto across its 2026 daylight-saving changes
// (IANA tz database: DST starts 8 Mar 2026 02:00 EST → 03:00 EDT; ends 1 Nov 2026 02:00 EDT →
// 01:00 EST), cross-checked against luxon, a second, independent time-zone library.
import fc from 'fast-check';
import { DateTime } from 'luxon';
import { describe, expect, it } from 'vitest';
import {
  addDays,
  clockTime,
  daysBetween,
  describeInstant,
  describeLocalDate,
  instantOfKeeperDate,
  localDateOf,
  startOfLocalDate,
} from './local-dates';

const ZONE = 'America/Toronto';

describe('Toronto in 2026', () => {
  it('starts 8 March (a 23-hour day) and 1 November (a 25-hour day) where the tz database says', () => {
    expect(startOfLocalDate('2026-03-08', ZONE).toISOString()).toBe('2026-03-08T05:00:00.000Z'); // EST, UTC−5
    expect(startOfLocalDate('2026-03-09', ZONE).toISOString()).toBe('2026-03-09T04:00:00.000Z'); // EDT, UTC−4
    expect(startOfLocalDate('2026-11-01', ZONE).toISOString()).toBe('2026-11-01T04:00:00.000Z');
    expect(startOfLocalDate('2026-11-02', ZONE).toISOString()).toBe('2026-11-02T05:00:00.000Z');
    const hours = (d: string) =>
      (startOfLocalDate(addDays(d, 1), ZONE).getTime() - startOfLocalDate(d, ZONE).getTime()) /
      3_600_000;
    expect(hours('2026-03-08')).toBe(23);
    expect(hours('2026-11-01')).toBe(25);
    expect(hours('2026-06-15')).toBe(24);
  });

  it('puts a meal at 23:30 and one at 00:10 on different days, also across both changes', () => {
    for (const [evening, morning] of [
      ['2026-03-07T23:30', '2026-03-08T00:10'],
      ['2026-03-08T23:30', '2026-03-09T00:10'],
      ['2026-10-31T23:30', '2026-11-01T00:10'],
      ['2026-11-01T23:30', '2026-11-02T00:10'],
    ] as const) {
      const a = DateTime.fromISO(evening, { zone: ZONE }).toJSDate();
      const b = DateTime.fromISO(morning, { zone: ZONE }).toJSDate();
      expect(daysBetween(localDateOf(a, ZONE), localDateOf(b, ZONE))).toBe(1);
      expect(b.getTime() - a.getTime()).toBe(40 * 60_000);
    }
  });

  it('calls "tomorrow" the next calendar date, not now + 24 h', () => {
    // 23:30 EST on 7 Mar + 24 h is 00:30 EDT on 9 Mar: two dates later, not one.
    const lateEvening = DateTime.fromISO('2026-03-07T23:30', { zone: ZONE }).toJSDate();
    expect(localDateOf(new Date(lateEvening.getTime() + 24 * 3_600_000), ZONE)).toBe('2026-03-09');
    expect(addDays(localDateOf(lateEvening, ZONE), 1)).toBe('2026-03-08');
  });

  it('agrees with luxon on the local date of any instant in 2025–2027', () => {
    fc.assert(
      fc.property(fc.integer({ min: Date.UTC(2025, 0, 1), max: Date.UTC(2027, 11, 31) }), (ms) => {
        const instant = new Date(ms);
        expect(localDateOf(instant, ZONE)).toBe(
          DateTime.fromMillis(ms, { zone: ZONE }).toISODate(),
        );
      }),
      { numRuns: 2000 },
    );
  });

  it('agrees with luxon on where every local date of 2026 begins, in several zones', () => {
    for (const zone of [ZONE, 'Europe/London', 'Australia/Sydney', 'Asia/Kolkata', 'UTC']) {
      for (let d = '2026-01-01'; d <= '2026-12-31'; d = addDays(d, 1)) {
        expect(startOfLocalDate(d, zone).getTime(), `${zone} ${d}`).toBe(
          DateTime.fromISO(d, { zone }).startOf('day').toMillis(),
        );
      }
    }
  });
});

describe('calendar arithmetic', () => {
  it('crosses months, years and leap days (2028 is a leap year, Gregorian calendar)', () => {
    expect(addDays('2026-12-31', 1)).toBe('2027-01-01');
    expect(addDays('2028-02-28', 1)).toBe('2028-02-29');
    expect(addDays('2027-02-28', 1)).toBe('2027-03-01');
    expect(daysBetween('2026-01-01', '2027-01-01')).toBe(365);
    expect(daysBetween('2028-01-01', '2029-01-01')).toBe(366);
  });
  it('describes dates for sentences', () => {
    expect(describeLocalDate('2026-12-11')).toBe('Fri 11 Dec');
    expect(describeLocalDate('2026-03-08', true)).toBe('Sun 8 Mar 2026');
  });
});

describe('describeInstant', () => {
  it('shows an instant in the collection’s zone', () => {
    // 2026-12-01T13:40Z is 08:40 in Toronto (EST, UTC−5, IANA tz database).
    expect(describeInstant('2026-12-01T13:40:00Z', 'America/Toronto')).toBe('Tue 1 Dec, 08:40');
    expect(clockTime('2026-12-01T13:40:00Z', 'America/Toronto')).toBe('08:40');
  });
});

describe('instantOfKeeperDate', () => {
  const now = new Date('2026-11-02T15:30:00Z'); // 10:30 EST on 2 Nov in Toronto
  it('is the moment of typing when the date is today there', () => {
    expect(instantOfKeeperDate('2026-11-02', ZONE, now)).toBe(now);
  });
  it('is noon local on an earlier date, on either side of the DST change (cross-checked with luxon)', () => {
    for (const date of ['2026-11-01', '2026-10-31', '2026-03-08', '2026-03-07']) {
      const expected = DateTime.fromISO(`${date}T12:00`, { zone: ZONE })
        .toUTC()
        .toISO({ suppressMilliseconds: false });
      expect(instantOfKeeperDate(date, ZONE, now).toISOString()).toBe(expected);
      expect(localDateOf(instantOfKeeperDate(date, ZONE, now), ZONE)).toBe(date);
    }
    expect(instantOfKeeperDate('2026-11-01', ZONE, now).toISOString()).toBe(
      '2026-11-01T17:00:00.000Z',
    ); // EST, UTC−5 by noon
  });
});

describe('an instant’s date, remembered by quarter hour', () => {
  // Zones with half- and quarter-hour offsets, DST that moves by 30 minutes, a fall-back at
  // midnight, and the odd local-mean-time offsets of the 19th century.
  const zones = [
    'America/Toronto',
    'Asia/Kathmandu',
    'Pacific/Chatham',
    'Australia/Lord_Howe',
    'America/Asuncion',
    'America/Santiago',
    'Asia/Kolkata',
    'Europe/Dublin',
    'Pacific/Kiritimati',
    'Pacific/Pago_Pago',
    'UTC',
  ];
  const luxonDate = (ms: number, zone: string) =>
    DateTime.fromMillis(ms, { zone }).toISODate() as string;

  it('agrees with luxon for any instant from 1850 to 2100, asked once or again', () => {
    fc.assert(
      fc.property(
        fc.constantFrom(...zones),
        fc.integer({ min: Date.UTC(1850, 0, 1), max: Date.UTC(2100, 0, 1) }),
        (zone, ms) => {
          expect(localDateOf(new Date(ms), zone)).toBe(luxonDate(ms, zone));
          expect(localDateOf(new Date(ms), zone)).toBe(luxonDate(ms, zone));
        },
      ),
      { numRuns: 3000 },
    );
  });

  it('agrees with luxon minute by minute around midnights and clock changes', () => {
    const around = [
      '2026-03-08T06:00:00Z', // Toronto springs forward
      '2026-11-01T05:30:00Z', // Toronto falls back
      '2026-03-22T02:45:00Z', // Asuncion's last fall-back at midnight
      '2026-04-04T14:00:00Z', // Lord Howe's half-hour change
      '2026-06-01T18:15:00Z', // Kathmandu midnight (UTC+5:45)
      '2026-06-01T11:15:00Z', // Chatham midnight (UTC+12:45)
      '1880-06-01T00:00:00Z', // local mean times
    ];
    for (const zone of zones)
      for (const at of around)
        for (let m = -12 * 60; m <= 12 * 60; m += 7) {
          const ms = Date.parse(at) + m * 60_000 + ((m * 7919) % 60_000);
          expect(localDateOf(new Date(ms), zone), `${zone} ${new Date(ms).toISOString()}`).toBe(
            luxonDate(ms, zone),
          );
        }
  });
});
