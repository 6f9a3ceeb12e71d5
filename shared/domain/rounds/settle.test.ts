import { describe, expect, it } from 'vitest';
import { doubleMealWarning, liveOutcomes, settlingOutcome, type DayOutcome } from './settle';

const o = (eventId: string, kind: DayOutcome['kind'], at: string, by = 'Robin', voids: string | null = null): DayOutcome => ({ eventId, kind, at, by, voids });

describe('settling tasks with the day’s outcomes', () => {
  it('settles a feed task with ate, refused, prey left in or a skip, and water only with watering or a skip', () => {
    for (const kind of ['ate', 'refused', 'prey_left_in', 'skipped'] as const) {
      expect(settlingOutcome('feed', [o('1', kind, '2026-03-20T13:00:00Z')])?.kind).toBe(kind);
    }
    expect(settlingOutcome('water', [o('1', 'ate', '2026-03-20T13:00:00Z')])).toBeNull();
    expect(settlingOutcome('leave_alone', [o('1', 'note', '2026-03-20T13:00:00Z')])).toBeNull();
  });
  it('ignores a voided outcome and the void itself', () => {
    const live = liveOutcomes([o('1', 'ate', '2026-03-20T13:00:00Z'), o('2', 'void', '2026-03-20T13:01:00Z', 'Robin', '1')]);
    expect(live).toEqual([]);
  });
  it('warns about two meals on one day, naming who and when', () => {
    const time = (iso: string) => iso.slice(11, 16);
    expect(doubleMealWarning([o('1', 'ate', '2026-03-20T08:12:00Z', 'Robin'), o('2', 'ate', '2026-03-20T08:40:00Z', 'Alex')], time)).toBe(
      'Fed twice today: 08:12 Robin, 08:40 Alex.',
    );
    expect(doubleMealWarning([o('1', 'ate', '2026-03-20T08:12:00Z')], time)).toBeNull();
  });
});
