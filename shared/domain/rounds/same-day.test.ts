// R18 same-day holds (docs/care-rules.md, "Same-day holds"). The holds themselves are common
// practice, no published source: live prey can injure a molting or freshly molted spider, and
// the fangs stay soft for days after a molt.
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import type { RoundResponse } from '../../schemas/rounds';
import { LIFE_STAGES } from '../animal-facts';
import type { EventKind } from '../event-kinds';
import { addDays, startOfLocalDate } from '../local-dates';
import { projectState, type EngineEvent } from './animal-state';
import { decideAnimal, FEED_HOLD_CODES, type EngineAnimal } from './build-round';
import { feedHoldOf, isOverdue, isPossiblePremolt } from './item-status';
import { DEFAULT_RULES, postMoltHoldDays } from './rules';
import { itemWithOutcome, progressOf, settleItem, type DayOutcome } from './settle';

const ZONE = 'America/Toronto';
const DAY = '2026-12-02';
const at = (hhmm: string) =>
  new Date(
    startOfLocalDate(DAY, ZONE).getTime() +
      (Number(hhmm.slice(0, 2)) * 60 + Number(hhmm.slice(3))) * 60_000,
  ).toISOString();
const o = (
  eventId: string,
  kind: EventKind,
  hhmm: string,
  voids: string | null = null,
): DayOutcome => ({ eventId, kind, at: at(hhmm), by: 'Robin', voids });

type Item = RoundResponse['items'][number];
const task = (kind: Item['tasks'][number]['kind'], carriedOverDays = 0): Item['tasks'][number] => ({
  kind,
  reasons: [{ code: 'due_interval', text: 'Due.', dates: [] }],
  carriedOverDays,
  done: null,
});
function item(tasks: Item['tasks'], extra: Partial<Item> = {}): Item {
  return {
    animal: {
      id: 'a1',
      labelCode: 'NL-7',
      name: 'Ember',
      scientificName: 'Tliltocatl vagans',
      group: 'tarantula',
      lifeStage: 'juvenile',
      sex: 'female',
      cautions: [],
      location: null,
    },
    tasks,
    notes: [],
    carriedOverDays: 0,
    addedDuringDay: false,
    outcomes: [],
    warnings: [],
    postMoltHoldDays: 7,
    ...extra,
  };
}
const tap = (i: Item, outcome: DayOutcome) => itemWithOutcome(i, outcome, ZONE);

describe('a hold that begins during the day withdraws the open feed task at once (R18)', () => {
  it('Molted on the card: the feed task is withdrawn with the hold’s end date, water stays', () => {
    const {
      item: after,
      doneDelta,
      totalDelta,
    } = tap(item([task('feed'), task('water')]), o('m', 'molted', '09:15'));
    const feed = after.tasks.find((t) => t.kind === 'feed')!;
    // Juvenile post-molt hold 7 days (R5): 2 Dec + 7 = 9 Dec.
    expect(feed.withdrawn?.text).toBe('Molted today (09:15): no food until 9 Dec.');
    expect(feed.done).toBeNull();
    expect(after.tasks.find((t) => t.kind === 'water')!.withdrawn).toBeNull();
    expect([doneDelta, totalDelta]).toEqual([0, -1]);
    expect(feedHoldOf(after)?.code).toBe('post_molt_hold');
  });

  it('Molting now withdraws food and water, never the removal of prey; it answers the check (R4, R11)', () => {
    const { item: after } = tap(
      item([task('remove_prey'), task('feed'), task('water'), task('check')]),
      o('m', 'molting_now', '07:05'),
    );
    expect(after.tasks.map((t) => [t.kind, !!t.withdrawn])).toEqual([
      ['remove_prey', false],
      ['feed', true],
      ['water', true],
      ['check', false],
    ]);
    expect(after.tasks.find((t) => t.kind === 'check')!.done?.kind).toBe('molting_now');
    expect(progressOf([after])).toEqual({ done: 1, total: 2 });
  });

  it('premolt seen and an egg sac laid withdraw food only', () => {
    for (const kind of ['premolt_seen', 'sac_laid'] as const) {
      const { item: after } = tap(item([task('feed'), task('water')]), o('x', kind, '10:00'));
      expect(after.tasks.map((t) => !!t.withdrawn)).toEqual([true, false]);
    }
  });

  it('a meal recorded before the hold stays done; one after it is shown as fed while held', () => {
    const before = settleItem(
      [task('feed')],
      [o('a', 'ate', '08:00'), o('m', 'molted', '09:00')],
      ZONE,
      7,
    );
    expect(before.tasks[0]!.withdrawn).toBeNull();
    expect(before.tasks[0]!.done?.kind).toBe('ate');
    const after = settleItem(
      [task('feed')],
      [o('m', 'molted', '08:00'), o('a', 'ate', '09:00')],
      ZONE,
      7,
    );
    expect(after.tasks[0]!.withdrawn?.code).toBe('post_molt_hold');
    expect(after.warnings[0]).toMatch(/^Fed while held — Molted today \(08:00\)/);
    expect(after.total).toBe(0);
  });

  it('undoing the molt gives the feed task back', () => {
    const molted = tap(item([task('feed')]), o('m', 'molted', '09:00')).item;
    const undone = tap(molted, o('v', 'void', '09:01', 'm'));
    expect(undone.item.tasks[0]!.withdrawn).toBeNull();
    expect(undone.totalDelta).toBe(1);
  });

  it('keeps a withdrawal the server made (a do-not-feed note) and counts the task out of progress', () => {
    const held = {
      code: 'do_not_feed',
      text: 'Handover note: do not feed through 6 Dec.',
      dates: ['2026-12-07'],
    };
    const settled = settleItem([{ ...task('feed'), serverWithdrawn: held }], [], ZONE);
    expect(settled.tasks[0]!.withdrawn).toEqual(held);
    expect(settled.total).toBe(0);
  });
});

describe('what a card, the animal page and the insights read (one state)', () => {
  it('a possible premolt is no longer flagged once the animal molted or ate today', () => {
    const flagged = item([task('check')], {
      notes: [
        { code: 'possible_premolt', text: '3 refusals in a row: possible premolt.', dates: [] },
      ],
    });
    expect(isPossiblePremolt(flagged)).toBe(true);
    expect(isPossiblePremolt(tap(flagged, o('m', 'molted', '11:00')).item)).toBe(false);
  });
  it('an item carried over is overdue until it is done or withdrawn', () => {
    const carried = item([task('feed', 2)]);
    expect(isOverdue(carried)).toBe(true);
    expect(isOverdue(tap(carried, o('a', 'ate', '08:00')).item)).toBe(false);
    expect(isOverdue(tap(carried, o('p', 'premolt_seen', '08:00')).item)).toBe(false);
  });
});

// Property: for any history and any day's taps, once the engine (folding every fact up to the
// end of the day) withholds food, the phone's settled copy of the round has no open feed task.
const KINDS: EventKind[] = [
  'ate',
  'refused',
  'prey_left_in',
  'prey_removed',
  'watered',
  'molted',
  'premolt_seen',
  'premolt_cleared',
  'molting_now',
  'sac_laid',
  'sac_pulled',
  'skipped',
  'note',
];
const animal = (lifeStage: EngineAnimal['lifeStage']): EngineAnimal => ({
  id: 'a1',
  labelCode: 'NL-1',
  name: 'Ember',
  scientificName: 'Tliltocatl vagans',
  group: 'tarantula',
  lifeStage,
  sex: 'female',
  sizeMm: 60,
  status: 'active',
  cautions: [],
  location: null,
  hasWaterDish: true,
  intervalDays: null,
  preyType: null,
  preySize: null,
  preyCount: null,
  doNotFeedUntil: null,
  addedOn: '2026-09-01',
});
const eventsArb = (daysBack: number, count: number) =>
  fc.array(
    fc.record({
      kind: fc.constantFrom(...KINDS),
      day: fc.integer({ min: 0, max: daysBack }),
      minute: fc.integer({ min: 0, max: 1439 }),
    }),
    { maxLength: count },
  );

describe('same-day holds, property', () => {
  it('no open feed task while the engine withholds food, after any taps on the day', () => {
    fc.assert(
      fc.property(
        fc.constantFrom(...LIFE_STAGES),
        eventsArb(40, 20),
        eventsArb(0, 6),
        (stage, history, today) => {
          const toEvent = (
            e: { kind: EventKind; day: number; minute: number },
            j: number,
            prefix: string,
          ): EngineEvent => ({
            id: `${prefix}${String(j).padStart(3, '0')}`,
            kind: e.kind,
            effectiveAt: new Date(
              startOfLocalDate(addDays(DAY, -e.day), ZONE).getTime() + (e.minute * 60 + j) * 1000,
            ).toISOString(),
          });
          const past = history.map((e, j) => toEvent({ ...e, day: e.day + 1 }, j, 'h'));
          const todays = today.map((e, j) => toEvent(e, j, 't'));
          const a = animal(stage);
          // The round as built at midnight: from the facts before the day.
          const planned = decideAnimal(a, projectState(past, ZONE, DAY), DEFAULT_RULES, DAY);
          const settled = settleItem(
            planned.tasks,
            todays.map((e) => ({ eventId: e.id, kind: e.kind, at: e.effectiveAt, by: null })),
            ZONE,
            postMoltHoldDays(DEFAULT_RULES, a),
          );
          // What the engine says now, with the day's facts folded in.
          const now = decideAnimal(a, projectState([...past, ...todays], ZONE), DEFAULT_RULES, DAY);
          const held =
            now.tasks.some((t) => t.kind === 'leave_alone') ||
            now.notes.some((n) => FEED_HOLD_CODES.has(n.code));
          const openFeed = settled.tasks.some((t) => t.kind === 'feed' && !t.done && !t.withdrawn);
          return !(held && openFeed);
        },
      ),
      { numRuns: 2000 },
    );
  });
});
