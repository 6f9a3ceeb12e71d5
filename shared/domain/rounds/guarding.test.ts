// Worked cases for a female with a sac or a brood: R11 as amended (left alone, water topped up
// quietly), and R8's rebuild starting when guarding ends — pulled, hatched with her, dispersed.
// Source for every value: the project's husbandry rules (R7, R8, R11 amended); common practice,
// no published source.
import { describe, expect, it } from 'vitest';
import type { EventKind } from '../event-kinds';
import { startOfLocalDate } from '../local-dates';
import { projectState, type EngineEvent } from './animal-state';
import { decideAnimal, type EngineAnimal, type RoundTask } from './build-round';
import { DEFAULT_RULES } from './rules';

const ZONE = 'America/Toronto';
const TODAY = '2026-03-20';

let seq = 0;
function female(overrides: Partial<EngineAnimal> = {}): EngineAnimal {
  seq += 1;
  return {
    id: `female-${seq}`,
    labelCode: `NL-G${seq}`,
    name: `Female ${seq}`,
    scientificName: 'Hapalopus formosus',
    group: 'tarantula',
    lifeStage: 'adult',
    sex: 'female',
    sizeMm: 120,
    status: 'active',
    cautions: [],
    location: null,
    hasWaterDish: true,
    intervalDays: null,
    preyType: null,
    preySize: null,
    preyCount: null,
    doNotFeedUntil: null,
    addedOn: null,
    ...overrides,
  };
}

/** An event at noon local time on `date` (breeding facts are dated at noon of the keeper's day). */
function ev(kind: EventKind, date: string): EngineEvent {
  return {
    id: `${kind}-${date}-${seq++}`,
    kind,
    effectiveAt: new Date(startOfLocalDate(date, ZONE).getTime() + 12 * 3600_000).toISOString(),
  };
}
const decide = (a: EngineAnimal, events: EngineEvent[], date = TODAY) =>
  decideAnimal(a, projectState(events, ZONE), DEFAULT_RULES, date);
const kinds = (tasks: RoundTask[]) => tasks.map((t) => t.kind);

describe('R11 amended: a female guarding a sac or brood is left alone, but her dish is topped up quietly', () => {
  it('gives a guarding female with a dish only a quiet water task when water is due (R7: every 3 days)', () => {
    const d = decide(female(), [
      ev('ate', '2026-02-20'),
      ev('watered', '2026-03-17'),
      ev('sac_laid', '2026-03-01'),
    ]);
    expect(kinds(d.tasks)).toEqual(['leave_alone', 'water']);
    expect(d.tasks[0]!.reasons[0]!.text).toBe(
      'Guarding an egg sac since 1 Mar: leave alone — no food, no disturbance.',
    );
    expect(d.tasks[1]!.reasons[0]!.text).toBe(
      'Water (last topped up on 17 Mar): top up quietly, do not disturb her.',
    );
    expect(d.nextWater).toBe('2026-03-20');
  });
  it('gives no water task before it is due, and none to a female without a dish', () => {
    const watered = decide(female(), [ev('sac_laid', '2026-03-01'), ev('watered', '2026-03-18')]);
    expect(kinds(watered.tasks)).toEqual(['leave_alone']);
    expect(watered.nextWater).toBe('2026-03-21');
    expect(
      kinds(decide(female({ hasWaterDish: false }), [ev('sac_laid', '2026-03-01')]).tasks),
    ).toEqual(['leave_alone']);
  });
  it('keeps her guarding after the water is topped up (watering is not an outcome that ends R11)', () => {
    const d = decide(female(), [ev('sac_laid', '2026-03-01'), ev('watered', '2026-03-15')]);
    expect(kinds(d.tasks)).toEqual(['leave_alone', 'water']);
    expect(d.tasks[1]!.carriedOverDays).toBe(2); // due 18 Mar
  });
  it('still gives a molting animal no water at all (R11 unchanged for molts)', () => {
    expect(kinds(decide(female(), [ev('molting_now', '2026-03-19')]).tasks)).toEqual([
      'leave_alone',
    ]);
  });
  it('leaves a scorpion carrying her brood alone, with the same quiet water', () => {
    const d = decide(female({ group: 'scorpion', scientificName: 'Heterometrus spinifer' }), [
      ev('brood_started', '2026-03-10'),
    ]);
    expect(kinds(d.tasks)).toEqual(['leave_alone', 'water']);
    expect(d.tasks[0]!.reasons[0]!.text).toBe(
      'Carrying her brood since 10 Mar: leave alone — no food, no disturbance.',
    );
  });
  it('does not leave a mantis alone for her egg case: mantids do not guard an ootheca', () => {
    const d = decide(
      female({ group: 'mantis', scientificName: 'Hierodula membranacea', hasWaterDish: false }),
      [ev('ate', '2026-03-10'), ev('case_laid', '2026-03-12')],
    );
    // Fed as usual (and misted: a mantis has no dish, § Care profiles › Mantis); never left alone.
    expect(kinds(d.tasks)).toContain('feed');
    expect(kinds(d.tasks)).not.toContain('leave_alone');
  });
});

describe('R8: the rebuild starts when guarding ends, dated by the keeper', () => {
  it('a sac that hatched with her (no pull) ends guarding and starts the rebuild from the hatch date', () => {
    const events = [
      ev('ate', '2026-01-20'),
      ev('sac_laid', '2026-01-25'),
      ev('sac_hatched', '2026-03-14'),
    ];
    const state = projectState(events, ZONE);
    expect(state).toMatchObject({
      leaveAlone: null,
      rebuildSince: '2026-03-14',
      rebuildReason: 'sac_hatched',
    });
    const d = decide(female(), events);
    expect(kinds(d.tasks)).toContain('feed');
    // Interval 12 × 0.5 = 6 days, for 56 days from 14 Mar: until 9 May.
    expect(d.tasks.find((t) => t.kind === 'feed')!.reasons.map((r) => r.text)).toContain(
      'Rebuilding after the egg sac hatched on 14 Mar: fed every 6 days instead of 12 until 9 May.',
    );
  });
  it('a brood that dispersed ends guarding and starts the rebuild from the dispersal date', () => {
    const events = [
      ev('brood_started', '2026-02-20'),
      ev('brood_dispersed', '2026-03-12'),
      ev('ate', '2026-03-13'),
    ];
    const d = decide(female({ group: 'scorpion' }), events, '2026-03-18');
    expect(projectState(events, ZONE)).toMatchObject({
      leaveAlone: null,
      rebuildReason: 'brood_dispersed',
      rebuildSince: '2026-03-12',
    });
    // Scorpion interval 10 × 0.5 = 5 days after the meal on 13 Mar: due 18 Mar.
    expect(d.nextFeed).toBe('2026-03-18');
    expect(d.tasks.find((t) => t.kind === 'feed')!.reasons[1]!.text).toBe(
      'Rebuilding after her brood dispersed on 12 Mar: fed every 5 days instead of 10 until 7 May.',
    );
  });
  it('folds a pull dated in the past by its date, whatever order the facts arrived in', () => {
    const laid = ev('sac_laid', '2026-01-25');
    const pulled = ev('sac_pulled', '2026-03-01');
    const fed = ev('ate', '2026-03-02');
    expect(projectState([fed, pulled, laid], ZONE)).toEqual(
      projectState([laid, pulled, fed], ZONE),
    );
    expect(projectState([fed, pulled, laid], ZONE)).toMatchObject({
      rebuildSince: '2026-03-01',
      leaveAlone: null,
    });
  });
});
