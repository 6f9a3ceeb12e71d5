import { describe, expect, it } from 'vitest';
import { instantsOfWallTime, parseLoggerTime, resolveLoggerTime } from './logger-times';

// Europe/Amsterdam follows the EU rule in the IANA tz database (tzdata, file "europe", Rule EU):
// clocks go forward from 02:00 CET to 03:00 CEST at 01:00 UTC on the last Sunday of March
// (2026-03-29) and back from 03:00 CEST to 02:00 CET at 01:00 UTC on the last Sunday of
// October (2026-10-25).
const ZONE = 'Europe/Amsterdam';
const wall = (s: string) => {
  const p = parseLoggerTime(s);
  if (p.kind !== 'wall') throw new Error(s);
  return p.wall;
};

describe('instantsOfWallTime', () => {
  it('finds one instant on an ordinary day', () => {
    expect(instantsOfWallTime(wall('2026-07-01 12:00'), ZONE).map((d) => d.toISOString())).toEqual([
      '2026-07-01T10:00:00.000Z',
    ]);
  });
  it('finds two instants in the repeated autumn hour', () => {
    expect(instantsOfWallTime(wall('2026-10-25 02:30'), ZONE).map((d) => d.toISOString())).toEqual([
      '2026-10-25T00:30:00.000Z',
      '2026-10-25T01:30:00.000Z',
    ]);
  });
  it('finds none in the skipped spring hour', () => {
    expect(instantsOfWallTime(wall('2026-03-29 02:30'), ZONE)).toEqual([]);
    expect(instantsOfWallTime(wall('2026-03-29 03:00'), ZONE).map((d) => d.toISOString())).toEqual([
      '2026-03-29T01:00:00.000Z',
    ]);
  });
  it('works west of Greenwich too (America/New_York, 2026-11-01 01:30 twice)', () => {
    // US rule in tzdata ("northamerica", Rule US): back at 02:00 EDT on the first Sunday of November.
    expect(
      instantsOfWallTime(wall('2026-11-01 01:30'), 'America/New_York').map((d) => d.toISOString()),
    ).toEqual(['2026-11-01T05:30:00.000Z', '2026-11-01T06:30:00.000Z']);
  });
});

describe('resolveLoggerTime', () => {
  it('takes the first pass of the repeated hour, then the second once the rows go back', () => {
    const a = resolveLoggerTime('2026-10-25 02:45', ZONE, new Date('2026-10-25T00:15:00Z'));
    expect(a).toEqual({ ok: true, ambiguous: true, instant: new Date('2026-10-25T00:45:00Z') });
    const b = resolveLoggerTime('2026-10-25 02:15', ZONE, new Date('2026-10-25T00:45:00Z'));
    expect(b).toEqual({ ok: true, ambiguous: true, instant: new Date('2026-10-25T01:15:00Z') });
  });
  it('refuses a time the clocks skipped', () => {
    expect(resolveLoggerTime('2026-03-29 02:00', ZONE, null)).toEqual({
      ok: false,
      reason: 'nonexistent',
    });
  });
  it('takes a written offset as it is, and refuses what is not a time', () => {
    expect(resolveLoggerTime('2026-10-25T02:30:00+01:00', ZONE, null)).toEqual({
      ok: true,
      ambiguous: false,
      instant: new Date('2026-10-25T01:30:00Z'),
    });
    expect(resolveLoggerTime('25.10.2026 14:00', ZONE, null)).toMatchObject({
      instant: new Date('2026-10-25T13:00:00Z'),
    });
    expect(resolveLoggerTime('2026-02-30 10:00', ZONE, null)).toEqual({
      ok: false,
      reason: 'invalid',
    });
    expect(resolveLoggerTime('yesterday', ZONE, null)).toEqual({ ok: false, reason: 'invalid' });
  });
});
