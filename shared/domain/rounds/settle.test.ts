import { describe, expect, it } from 'vitest';
import type { RoundResponse } from '../../schemas/rounds';
import {
  doubleMealWarning,
  liveOutcomes,
  settlingOutcome,
  withOutcome,
  type DayOutcome,
} from './settle';

const o = (
  eventId: string,
  kind: DayOutcome['kind'],
  at: string,
  by = 'Robin',
  voids: string | null = null,
): DayOutcome => ({ eventId, kind, at, by, voids });

describe('settling tasks with the day’s outcomes', () => {
  it('settles a feed task with ate, refused, prey left in or a skip, and water only with watering or a skip', () => {
    for (const kind of ['ate', 'refused', 'prey_left_in', 'skipped'] as const) {
      expect(settlingOutcome('feed', [o('1', kind, '2026-03-20T13:00:00Z')])?.kind).toBe(kind);
    }
    expect(settlingOutcome('water', [o('1', 'ate', '2026-03-20T13:00:00Z')])).toBeNull();
    expect(settlingOutcome('leave_alone', [o('1', 'note', '2026-03-20T13:00:00Z')])).toBeNull();
  });
  it('ignores a voided outcome and the void itself', () => {
    const live = liveOutcomes([
      o('1', 'ate', '2026-03-20T13:00:00Z'),
      o('2', 'void', '2026-03-20T13:01:00Z', 'Robin', '1'),
    ]);
    expect(live).toEqual([]);
  });
  it('warns about two meals on one day, naming who and when', () => {
    const time = (iso: string) => iso.slice(11, 16);
    expect(
      doubleMealWarning(
        [
          o('1', 'ate', '2026-03-20T08:12:00Z', 'Robin'),
          o('2', 'ate', '2026-03-20T08:40:00Z', 'Alex'),
        ],
        time,
      ),
    ).toBe('Fed twice today: 08:12 Robin, 08:40 Alex.');
    expect(doubleMealWarning([o('1', 'ate', '2026-03-20T08:12:00Z')], time)).toBeNull();
  });
});

describe('withOutcome (a tap shown before it is sent)', () => {
  const round: RoundResponse = {
    date: '2026-03-20',
    timeZone: 'Europe/London',
    builtAt: '2026-03-20T00:00:00Z',
    prepList: [],
    progress: { done: 0, total: 3 },
    items: [
      {
        animal: {
          id: 'a1',
          labelCode: 'B7K2',
          name: 'Bramble',
          scientificName: 'Grammostola pulchra',
          group: 'tarantula',
          lifeStage: 'adult',
          sex: 'female',
          cautions: [],
          location: null,
        },
        tasks: [
          { kind: 'feed', reasons: [], carriedOverDays: 0, done: null },
          { kind: 'water', reasons: [], carriedOverDays: 0, done: null },
          { kind: 'leave_alone', reasons: [], carriedOverDays: 0, done: null },
        ],
        notes: [],
        carriedOverDays: 0,
        addedDuringDay: false,
        outcomes: [],
        warnings: [],
      },
      {
        animal: {
          id: 'a2',
          labelCode: 'C3M9',
          name: 'Dusty',
          scientificName: 'Tliltocatl albopilosus',
          group: 'tarantula',
          lifeStage: 'juvenile',
          sex: 'unknown',
          cautions: [],
          location: null,
        },
        tasks: [{ kind: 'feed', reasons: [], carriedOverDays: 0, done: null }],
        notes: [],
        carriedOverDays: 0,
        addedDuringDay: false,
        outcomes: [],
        warnings: [],
      },
    ],
  };

  it('settles the task, counts progress and leaves other items alone', () => {
    const next = withOutcome(round, 'a1', o('e1', 'ate', '2026-03-20T09:00:00Z'));
    expect(next.items[0]!.tasks.map((t) => t.done?.eventId ?? null)).toEqual(['e1', null, null]);
    expect(next.progress).toEqual({ done: 1, total: 3 });
    expect(next.items[1]).toBe(round.items[1]);
    expect(round.progress.done).toBe(0); // the cached round is not changed in place
  });

  it('a void undoes the tap and the progress', () => {
    const fed = withOutcome(round, 'a1', o('e1', 'ate', '2026-03-20T09:00:00Z'));
    const undone = withOutcome(fed, 'a1', o('e2', 'void', '2026-03-20T09:00:05Z', 'Robin', 'e1'));
    expect(undone.items[0]!.tasks[0]!.done).toBeNull();
    expect(undone.items[0]!.outcomes).toEqual([]);
    expect(undone.progress.done).toBe(0);
  });

  it('shows the two-meals warning in the collection’s local time', () => {
    // Europe/London is UTC+0 on 20 March 2026 (BST starts 29 March; IANA tz database).
    const once = withOutcome(round, 'a1', o('e1', 'ate', '2026-03-20T08:12:00Z', 'Robin'));
    const twice = withOutcome(once, 'a1', o('e2', 'ate', '2026-03-20T08:40:00Z', 'Alex'));
    expect(twice.items[0]!.warnings).toEqual(['Fed twice today: 08:12 Robin, 08:40 Alex.']);
    expect(twice.progress.done).toBe(1);
  });

  it('ignores a tap for an animal not on the round', () => {
    expect(withOutcome(round, 'nobody', o('e1', 'ate', '2026-03-20T09:00:00Z'))).toBe(round);
  });
});
