import { describe, expect, it } from 'vitest';
import { morningOf } from './daily-mail';

// America/Toronto follows the US rule in the IANA tz database (tzdata "northamerica", Rule US):
// clocks go forward at 02:00 on the second Sunday of March (2026-03-08) and back at 02:00 on
// the first Sunday of November (2026-11-01). 07:00 local is EST (−05:00) or EDT (−04:00).
describe('morningOf', () => {
  it('is 07:00 local on either side of both changes', () => {
    expect(morningOf('2026-03-07', 'America/Toronto').toISOString()).toBe(
      '2026-03-07T12:00:00.000Z',
    );
    expect(morningOf('2026-03-08', 'America/Toronto').toISOString()).toBe(
      '2026-03-08T11:00:00.000Z',
    );
    expect(morningOf('2026-11-01', 'America/Toronto').toISOString()).toBe(
      '2026-11-01T12:00:00.000Z',
    );
    expect(morningOf('2026-10-31', 'America/Toronto').toISOString()).toBe(
      '2026-10-31T11:00:00.000Z',
    );
  });
});
