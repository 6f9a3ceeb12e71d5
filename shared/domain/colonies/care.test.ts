import { describe, expect, it } from 'vitest';
import { dueCare } from './care';

// Worked cases for docs/care-rules.md § Feeder colonies (intervals: common practice, no
// published source). Dates counted by hand on a calendar.
describe('colony care due', () => {
  const every = { feed: 3, water_gel: 2, clean: 14, split: null };

  it('is due on the last time plus the interval, and counts the days past it', () => {
    // Fed Dec 1 + 3 = Dec 4; gel Dec 2 + 2 = Dec 4; cleaned Nov 25 + 14 = Dec 9.
    const last = { feed: '2026-12-01', water_gel: '2026-12-02', clean: '2026-11-25' };
    expect(dueCare(every, last, '2026-12-03')).toEqual([]);
    expect(dueCare(every, last, '2026-12-04')).toEqual([
      { kind: 'feed', dueSince: '2026-12-04', overdueDays: 0 },
      { kind: 'water_gel', dueSince: '2026-12-04', overdueDays: 0 },
    ]);
    expect(dueCare(every, last, '2026-12-10').map((d) => [d.kind, d.overdueDays])).toEqual([
      ['feed', 6],
      ['water_gel', 6],
      ['clean', 1],
    ]);
  });

  it('is due at once when never done, and never without an interval', () => {
    expect(dueCare(every, {}, '2026-12-03').map((d) => d.kind)).toEqual([
      'feed',
      'water_gel',
      'clean',
    ]);
    expect(dueCare({}, {}, '2026-12-03')).toEqual([]);
  });
});
