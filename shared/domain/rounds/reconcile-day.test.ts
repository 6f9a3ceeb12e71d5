// R18 on the server (docs/care-rules.md, "Same-day holds"): the stored item follows a new
// decision without being rebuilt. The holds are common practice, no published source.
import { describe, expect, it } from 'vitest';
import { startOfLocalDate } from '../local-dates';
import { projectState, type EngineEvent } from './animal-state';
import { decideAnimal, type EngineAnimal, type RoundTask } from './build-round';
import { reconcileTasks } from './reconcile-day';
import { DEFAULT_RULES } from './rules';
import type { DayOutcome } from './settle';

const ZONE = 'America/Toronto';
const DAY = '2026-12-02';
const animal: EngineAnimal = {
  id: 'a1',
  labelCode: 'NL-1',
  name: 'Ember',
  scientificName: 'Tliltocatl vagans',
  group: 'tarantula',
  lifeStage: 'juvenile',
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
  spotCleanEveryDays: 0, // spot-cleaning has its own cases (enclosure-care.test.ts)
};
const at = (date: string, hour: number) =>
  new Date(startOfLocalDate(date, ZONE).getTime() + hour * 3_600_000).toISOString();
const event = (id: string, kind: EngineEvent['kind'], date: string, hour: number): EngineEvent => ({
  id,
  kind,
  effectiveAt: at(date, hour),
});
const outcome = (e: EngineEvent): DayOutcome => ({
  eventId: e.id,
  kind: e.kind,
  at: e.effectiveAt,
  by: 'Robin',
});

// Fed and watered ten days ago: today's round has a feed and a water task.
const history = [event('h1', 'ate', '2026-11-22', 19), event('h2', 'watered', '2026-11-22', 19)];
const decide = (events: EngineEvent[]) => {
  const state = projectState(events, ZONE);
  return { d: decideAnimal(animal, state, DEFAULT_RULES, DAY), state };
};
const planned = decide(history).d.tasks;
/** The reason a task was withdrawn with, null when it stands (untouched tasks have none). */
const withdrawn = (tasks: RoundTask[], kind: RoundTask['kind']) =>
  tasks.find((t) => t.kind === kind)!.serverWithdrawn ?? null;

describe('reconcileTasks', () => {
  it('withdraws the open feed task when premolt is seen during the day; water stays (R4)', () => {
    const premolt = event('t1', 'premolt_seen', DAY, 9);
    const { d, state } = decide([...history, premolt]);
    const r = reconcileTasks(planned, d, state, [outcome(premolt)], DAY);
    expect(r.changed).toBe(true);
    expect(r.urgent).toBe(false);
    expect(withdrawn(r.tasks, 'feed')?.code).toBe('premolt');
    expect(withdrawn(r.tasks, 'water')).toBeNull();
  });

  it('gives the task back when an undo lifts the hold, and changes nothing when nothing changed', () => {
    const premolt = event('t1', 'premolt_seen', DAY, 9);
    const held = reconcileTasks(
      planned,
      decide([...history, premolt]).d,
      decide([...history, premolt]).state,
      [outcome(premolt)],
      DAY,
    ).tasks;
    const { d, state } = decide(history);
    const lifted = reconcileTasks(held, d, state, [], DAY);
    expect(lifted.changed).toBe(true);
    expect(withdrawn(lifted.tasks, 'feed')).toBeNull();
    expect(reconcileTasks(lifted.tasks, d, state, [], DAY).changed).toBe(false);
  });

  it('leaves a feed task the day already settled: the meal happened before the hold (R18)', () => {
    const meal = event('t1', 'ate', DAY, 8);
    const premolt = event('t2', 'premolt_seen', DAY, 9);
    const { d, state } = decide([...history, meal, premolt]);
    const r = reconcileTasks(planned, d, state, [outcome(meal), outcome(premolt)], DAY);
    expect(withdrawn(r.tasks, 'feed')).toBeNull();
    expect(r.changed).toBe(false);
  });

  it('molting now after prey was left in: the prey becomes an urgent removal at the top, water is withdrawn (R4, R11)', () => {
    const prey = event('t1', 'prey_left_in', DAY, 8);
    const molting = event('t2', 'molting_now', DAY, 9);
    const { d, state } = decide([...history, prey, molting]);
    const r = reconcileTasks(planned, d, state, [outcome(prey), outcome(molting)], DAY);
    expect(r.urgent).toBe(true);
    // The prey left in answered the feed task (it was offered), so only the water is withheld.
    expect(r.tasks.map((t) => [t.kind, t.serverWithdrawn?.code ?? null])).toEqual([
      ['remove_prey', null],
      ['feed', null],
      ['water', 'leave_alone'],
    ]);
    expect(r.tasks[0]!.reasons.at(-1)).toEqual({
      code: 'remove_prey',
      text: 'Added during the day: remove it now.',
      dates: [DAY],
    });
  });

  it('withdraws a feed task a late meal from an earlier day makes not due, with the next date; water stays', () => {
    // Issue 22: a phone's taps from days without signal arrive after today's round was built.
    const lateMeal = event('late', 'ate', '2026-12-01', 19);
    const { d, state } = decide([...history, lateMeal]);
    const asBuilt = decideAnimal(
      animal,
      projectState([...history, lateMeal], ZONE, DAY),
      DEFAULT_RULES,
      DAY,
    );
    const r = reconcileTasks(planned, d, state, [], DAY, asBuilt);
    expect(r.changed).toBe(true);
    const feed = withdrawn(r.tasks, 'feed')!;
    expect(feed.code).toBe('not_due');
    expect(asBuilt.nextFeed! > DAY).toBe(true);
    expect(feed.dates).toEqual([asBuilt.nextFeed]);
    expect(feed.text).toMatch(
      /^Not due any more: records from an earlier day arrived after this round was made \(next meal on \d+ \w{3}\)\.$/,
    );
    expect(withdrawn(r.tasks, 'water')).toBeNull();
    // Fed today as well: the task is settled by today's meal, not withdrawn.
    const today = event('t1', 'ate', DAY, 9);
    const settled = reconcileTasks(planned, d, state, [outcome(today)], DAY, asBuilt);
    expect(withdrawn(settled.tasks, 'feed')).toBeNull();
  });
});
