// Worked cases for each group's care profile (docs/care-rules.md § Stages, § Care profiles,
// § Diets). Every value is common practice with no published source, or from memory, as the
// comment beside the check says; none is taken from a husbandry manual yet.
import { describe, expect, it } from 'vitest';
import { engineAnimal, eventOn } from '../../../tests/fixtures/engine-animal';
import { GROUP_STAGES, stageLabel, stagesOf, type AnimalGroup } from '../animal-facts';
import type { EventKind } from '../event-kinds';
import { projectState, type EngineEvent } from './animal-state';
import { decideAnimal, FEED_HOLD_CODES, type EngineAnimal, type RoundTask } from './build-round';
import { canMolt, DEFAULT_PROFILES, foodOf, GROUP_CARE } from './care-profiles';
import { DEFAULT_RULES, effectiveRules } from './rules';

const ZONE = 'America/Toronto';
const TODAY = '2026-03-20';
const animal = engineAnimal;
const ev = (kind: EventKind, date: string, payload: Record<string, unknown> = {}) =>
  eventOn(kind, date, ZONE, payload);
const decide = (a: EngineAnimal, events: EngineEvent[], date = TODAY, rules = DEFAULT_RULES) =>
  decideAnimal(a, projectState(events, ZONE), rules, date);
const kinds = (tasks: RoundTask[]) => tasks.map((t) => t.kind);
const codes = (d: ReturnType<typeof decide>) => [
  ...d.tasks.flatMap((t) => t.reasons.map((r) => r.code)),
  ...d.notes.map((n) => n.code),
];
const daysBefore = (n: number) => `2026-03-${String(20 - n).padStart(2, '0')}`;

describe('stages by group (§ Stages)', () => {
  it('names each group’s stages in its own words', () => {
    expect(stageLabel('mantis', 'sling')).toBe('Nymph L1–L3'); // common practice: L = larval instar count
    expect(stageLabel('mantis', 'juvenile')).toBe('Nymph L4+');
    expect(stageLabel('scorpion', 'first_instar')).toBe('Scorpling on its mother');
    expect(stageLabel('tarantula', 'first_instar')).toBe('First instar (eggs with legs)');
    expect(stageLabel('true_spider', 'sling')).toBe('Spiderling');
    expect(stagesOf('beetle')).toEqual(['larva', 'pupa', 'adult']);
    expect(stagesOf('centipede')).toEqual(['juvenile', 'subadult', 'adult']);
  });
  it('has a food for every stage of every group, and numbers for every stage that is offered food', () => {
    for (const group of Object.keys(GROUP_STAGES) as AnimalGroup[]) {
      for (const stage of stagesOf(group)) {
        const food = GROUP_CARE[group].food[stage];
        expect(food, `${group} ${stage}`).toBeDefined();
        expect(DEFAULT_PROFILES[group].stages[stage] !== undefined, `${group} ${stage}`).toBe(
          food === 'prey' || food === 'diet',
        );
      }
    }
  });
  it('lists every hold that withdraws food, new ones included (R18 reads this set)', () => {
    for (const code of [
      'settling',
      'not_feeding_yet',
      'on_mother',
      'pupa',
      'leave_alone',
      'post_molt_hold',
      'premolt',
      'possible_premolt',
      'do_not_feed',
    ] as const) {
      expect(FEED_HOLD_CODES.has(code), code).toBe(true);
    }
    expect(FEED_HOLD_CODES.has('no_double_meal')).toBe(false); // settles, does not forbid
  });
});

describe('tarantula (§ Care profiles › Tarantula; common practice, no published source)', () => {
  it('does not feed a first instar (eggs with legs): no task at all, a note says why', () => {
    const d = decide(animal({ lifeStage: 'first_instar', sizeMm: 5 }), []);
    expect(d.tasks).toEqual([]); // no moistening either: it sits in its cup or sac
    expect(d.notes).toEqual([
      {
        code: 'not_feeding_yet',
        text: 'First instar: it lives on its yolk and does not eat until its next molt — no food yet.',
        dates: [],
      },
    ]);
    expect(d.nextFeed).toBeNull();
  });
  it('lets female adults molt but not mature males (R17)', () => {
    expect(canMolt({ group: 'tarantula', lifeStage: 'adult', sex: 'female' })).toBe(true);
    expect(canMolt({ group: 'tarantula', lifeStage: 'adult', sex: 'mature_male' })).toBe(false);
  });
});

describe('true spider (§ Care profiles › True spider; common practice: spiderling 2–3, juvenile 3–4, adult 5–7 days; hold 2–5 days; from memory)', () => {
  it.each([
    ['sling', 2],
    ['juvenile', 4],
    ['adult', 6],
  ] as const)('feeds a %s every %i days', (stage, days) => {
    expect(
      decide(animal({ group: 'true_spider', lifeStage: stage, sizeMm: 20 }), [
        ev('ate', daysBefore(days)),
      ]).tasks.some((t) => t.kind === 'feed'),
    ).toBe(true);
    expect(
      decide(animal({ group: 'true_spider', lifeStage: stage, sizeMm: 20 }), [
        ev('ate', daysBefore(days - 1)),
      ]).tasks.some((t) => t.kind === 'feed'),
    ).toBe(false);
  });
  it('holds a spiderling 2 days after a molt and an adult 5', () => {
    expect(
      decide(animal({ group: 'true_spider', lifeStage: 'sling', sizeMm: 8 }), [
        ev('molted', '2026-03-19'),
      ]).nextFeed,
    ).toBe('2026-03-21');
    expect(
      decide(animal({ group: 'true_spider', lifeStage: 'adult', sizeMm: 40 }), [
        ev('molted', '2026-03-19'),
      ]).nextFeed,
    ).toBe('2026-03-24');
  });
  it('mists a spider without a dish every 2 days (small and jumping spiders drink droplets)', () => {
    const d = decide(animal({ group: 'true_spider', lifeStage: 'juvenile', sizeMm: 15 }), [
      ev('ate', '2026-03-19'),
      ev('watered', '2026-03-18'),
    ]);
    expect(d.tasks[0]!.reasons[0]).toMatchObject({
      code: 'mist_due',
      text: 'No dish: mist lightly every 2 days — it drinks the droplets (last on 18 Mar).',
    });
  });
  it('never reads an adult’s refusals as premolt: adults no longer molt (R17)', () => {
    const d = decide(animal({ group: 'true_spider', lifeStage: 'adult', sizeMm: 40 }), [
      ev('refused', '2026-03-10'),
      ev('refused', '2026-03-13'),
      ev('refused', '2026-03-16'),
    ]);
    expect(codes(d)).not.toContain('possible_premolt');
    expect(d.notes.map((n) => n.text)).toContain(
      'Adult spider: adults do not molt, so refusals do not mean premolt.',
    );
  });
});

describe('centipede (§ Care profiles › Centipede; common practice: juvenile 5, adult 7–10 days, ~5 days after surfacing from the molt chamber)', () => {
  it('feeds a juvenile every 5 days and an adult every 7; holds 5 days after a molt', () => {
    expect(
      decide(animal({ group: 'centipede', lifeStage: 'juvenile' }), [ev('ate', daysBefore(5))])
        .nextFeed,
    ).toBe(TODAY);
    expect(decide(animal({ group: 'centipede' }), [ev('ate', daysBefore(7))]).nextFeed).toBe(TODAY);
    expect(
      decide(animal({ group: 'centipede' }), [ev('ate', '2026-03-01'), ev('molted', '2026-03-18')])
        .nextFeed,
    ).toBe('2026-03-23');
  });
  it('keeps a dish and part of the substrate damp; without a dish, moistens the substrate every 3 days', () => {
    const dish = decide(animal({ group: 'centipede', hasWaterDish: true }), [
      ev('ate', '2026-03-19'),
      ev('watered', '2026-03-17'),
    ]);
    expect(dish.tasks[0]!.reasons[0]!.text).toBe(
      'Water every 3 days: last topped up on 17 Mar. Keep part of the substrate damp too.',
    );
    const none = decide(animal({ group: 'centipede' }), [
      ev('ate', '2026-03-19'),
      ev('watered', '2026-03-17'),
    ]);
    expect(none.tasks[0]!.reasons[0]).toMatchObject({
      code: 'moisten_substrate',
      text: 'No dish: moisten part of the substrate every 3 days (last on 17 Mar).',
    });
  });
  it('leaves a brooding female alone, in her own words (R11)', () => {
    const d = decide(animal({ group: 'centipede', hasWaterDish: true }), [
      ev('sac_laid', '2026-03-10'),
    ]);
    // R11 amended (docs/care-rules.md): a brooding female's dish is still topped up quietly.
    expect(kinds(d.tasks)).toEqual(['leave_alone', 'water']);
    expect(d.tasks[0]!.reasons[0]!.text).toBe(
      'Brooding her eggs since 10 Mar: leave alone — no food, no disturbance.',
    );
  });
  it('starts a new centipede with venom, fast and escape cautions and a water dish ticked', () => {
    expect(GROUP_CARE.centipede.newAnimalCautions).toEqual([
      'potent_venom',
      'fast_defensive',
      'escape_risk',
    ]);
    expect(GROUP_CARE.centipede.newAnimalHasDish).toBe(true);
  });
});

describe('scorpion (§ Care profiles › Scorpion; common practice: juvenile 5–7, adult 10–14 days; hold 5–10 days)', () => {
  it('does not feed scorplings on the mother’s back until their first molt and dispersal', () => {
    const d = decide(animal({ group: 'scorpion', lifeStage: 'first_instar', sizeMm: 10 }), []);
    expect(d.tasks).toEqual([]);
    expect(d.notes[0]).toMatchObject({
      code: 'on_mother',
      text: 'Scorpling on its mother’s back: not fed until its first molt and it leaves her.',
    });
  });
  it('feeds a juvenile every 6 days and an adult every 10; holds an adult 10 days after its final molt', () => {
    expect(
      decide(animal({ group: 'scorpion', lifeStage: 'juvenile', sizeMm: 30 }), [
        ev('ate', daysBefore(6)),
      ]).nextFeed,
    ).toBe(TODAY);
    expect(decide(animal({ group: 'scorpion' }), [ev('ate', daysBefore(10))]).nextFeed).toBe(TODAY);
    expect(decide(animal({ group: 'scorpion' }), [ev('molted', '2026-03-12')]).nextFeed).toBe(
      '2026-03-22',
    );
  });
  it('mists a scorpion without a dish every 4 days; adults do not molt again (R17); a new one gets the sting caution', () => {
    expect(
      decide(animal({ group: 'scorpion' }), [ev('ate', '2026-03-19'), ev('watered', '2026-03-16')])
        .tasks[0]!.reasons[0]!.code,
    ).toBe('mist_due');
    expect(
      codes(
        decide(animal({ group: 'scorpion' }), [
          ev('refused', '2026-03-01'),
          ev('refused', '2026-03-08'),
          ev('refused', '2026-03-15'),
        ]),
      ),
    ).not.toContain('possible_premolt');
    expect(GROUP_CARE.scorpion.newAnimalCautions).toEqual(['sting']);
  });
  it('says a female carries her brood when she is left alone (R11)', () => {
    expect(
      decide(animal({ group: 'scorpion' }), [ev('sac_laid', '2026-03-10')]).tasks[0]!.reasons[0]!
        .text,
    ).toMatch(/^Carrying her brood since 10 Mar/);
  });
});

describe('mantis (§ Care profiles › Mantis; common practice: L1–L3 every 1–2 days, L4+ 2–3, adult 3–4; hold 1–2 days)', () => {
  const nymph = (over: Partial<EngineAnimal> = {}) =>
    animal({ group: 'mantis', lifeStage: 'sling', sizeMm: 10, ...over });
  it.each([
    ['sling', 2],
    ['juvenile', 3],
    ['subadult', 3],
    ['adult', 4],
  ] as const)('feeds a %s every %i days', (stage, days) => {
    expect(
      decide(animal({ group: 'mantis', lifeStage: stage, sizeMm: 30 }), [
        ev('ate', daysBefore(days)),
      ]).nextFeed,
    ).toBe(TODAY);
  });
  it('holds an L1–L3 nymph 1 day after a molt and an L4+ nymph 2', () => {
    expect(decide(nymph(), [ev('molted', '2026-03-19')]).nextFeed).toBe(TODAY);
    expect(
      decide(nymph({ lifeStage: 'juvenile', sizeMm: 25 }), [ev('molted', '2026-03-19')]).nextFeed,
    ).toBe('2026-03-21');
  });
  it('reads two refusals of a nymph as a molt coming (it stops eating shortly before), but not an adult’s', () => {
    expect(
      codes(decide(nymph(), [ev('refused', '2026-03-17'), ev('refused', '2026-03-18')])),
    ).toContain('possible_premolt');
    expect(
      codes(
        decide(animal({ group: 'mantis' }), [
          ev('refused', '2026-03-10'),
          ev('refused', '2026-03-13'),
          ev('refused', '2026-03-16'),
        ]),
      ),
    ).not.toContain('possible_premolt');
  });
  it('mists every 2 days with no dish, and notes hanging room to molt until adult', () => {
    const d = decide(nymph(), [ev('ate', '2026-03-19'), ev('watered', '2026-03-18')]);
    expect(d.tasks[0]!.reasons[0]!.code).toBe('mist_due');
    expect(d.notes.map((n) => n.code)).toContain('hanging_room');
    expect(decide(animal({ group: 'mantis' }), []).notes.map((n) => n.code)).not.toContain(
      'hanging_room',
    );
  });
  it('offers flightless fruit flies to the smallest nymphs', () => {
    expect(decide(nymph(), []).tasks[0]!.offer).toEqual({
      preyType: 'fruit flies',
      preySize: 'flightless',
      countMin: 3,
      countMax: 6,
    });
  });
});

describe('beetle (§ Care profiles › Beetle; common practice: larva substrate every ~4 weeks, pupa left alone, adult fruit 2–3 days or live prey 3–5)', () => {
  it('gives a larva no live prey: a check-and-top-up task on its food substrate every 28 days, no water', () => {
    const larva = animal({ group: 'beetle', lifeStage: 'larva', sizeMm: 60 });
    const d = decide(larva, [ev('note', '2026-02-20', { text: 'topped up' })]);
    expect(kinds(d.tasks)).toEqual(['check']);
    expect(d.tasks[0]!.reasons[0]).toMatchObject({
      code: 'check_substrate',
      text: 'Larva: check its food substrate and top it up — every 28 days, last on 20 Feb.',
    });
    expect(decide(larva, [ev('note', '2026-02-21', { text: 'topped up' })]).tasks).toEqual([]);
    expect(
      codes(decide(larva, [ev('refused', '2026-03-01'), ev('refused', '2026-03-05')])),
    ).not.toContain('possible_premolt');
    // A new larva is first checked 28 days after it joined.
    expect(
      decide(animal({ group: 'beetle', lifeStage: 'larva', addedOn: '2026-03-01' }), []).nextFeed,
    ).toBe('2026-03-29');
  });
  it('leaves a pupa alone: no food, no water, no digging', () => {
    const d = decide(animal({ group: 'beetle', lifeStage: 'pupa', hasWaterDish: true }), []);
    expect(kinds(d.tasks)).toEqual(['leave_alone']);
    expect(d.tasks[0]!.reasons[0]!.code).toBe('pupa');
  });
  it('replaces an adult’s fruit or jelly every 3 days by default, or feeds live prey every 4 by its diet', () => {
    const fruit = decide(animal({ group: 'beetle', sizeMm: 30 }), [ev('ate', '2026-03-17')]);
    expect(fruit.tasks[0]!.offer).toEqual({
      preyType: 'fruit or jelly',
      preySize: 'fresh',
      countMin: 1,
      countMax: 1,
    });
    expect(fruit.tasks[0]!.reasons[0]!.text).toBe(
      'Due: fresh fruit or jelly every 3 days (last on 17 Mar).',
    );
    const hunter = animal({ group: 'beetle', sizeMm: 30, diet: 'live_prey' });
    expect(decide(hunter, [ev('ate', '2026-03-17')]).tasks.some((t) => t.kind === 'feed')).toBe(
      false,
    );
    expect(decide(hunter, [ev('ate', '2026-03-16')]).tasks[0]!.offer!.preyType).toBe('cricket');
  });
  it('counts untouched fruit as food put in, and never flags premolt', () => {
    const d = decide(animal({ group: 'beetle' }), [
      ev('ate', '2026-03-10'),
      ev('refused', '2026-03-18'),
      ev('refused', '2026-03-19'),
    ]);
    expect(d.nextFeed).toBe('2026-03-22'); // 3 days after the jelly put in on the 19th
    expect(codes(d)).not.toContain('possible_premolt');
  });
});

describe('other (§ Care profiles › Other, § Diets; common practice, from memory)', () => {
  it('decides the food task by the diet setting: live prey every 7 days, plant food every 3, leaf litter every 7', () => {
    expect(foodOf({ group: 'other', lifeStage: 'adult' })).toBe('prey');
    expect(
      decide(animal({ group: 'other' }), [ev('ate', daysBefore(7))]).tasks[0]!.offer!.preyType,
    ).toBe('cricket');
    const plant = decide(animal({ group: 'other', diet: 'plant' }), [ev('ate', daysBefore(3))]);
    expect(plant.tasks[0]!.offer!.preyType).toBe('plant food');
    const litter = decide(animal({ group: 'other', diet: 'detritus' }), [ev('ate', daysBefore(6))]);
    expect(litter.tasks).toEqual([]);
    expect(litter.nextFeed).toBe('2026-03-21');
    expect(
      decide(animal({ group: 'other', diet: 'detritus' }), [ev('ate', daysBefore(7))]).tasks[0]!
        .offer,
    ).toMatchObject({ preyType: 'leaf litter', preySize: 'handful' });
  });
  it('gets no water task without a dish unless the collection sets one, and leaves a pupa alone', () => {
    expect(decide(animal({ group: 'other' }), [ev('ate', '2026-03-19')]).tasks).toEqual([]);
    const misted = effectiveRules({
      profiles: { other: { hydration: 'mist', hydrateEveryDays: 5 } },
    });
    expect(
      decide(
        animal({ group: 'other' }),
        [ev('ate', '2026-03-19'), ev('watered', '2026-03-15')],
        TODAY,
        misted,
      ).tasks[0]!.reasons[0]!.code,
    ).toBe('mist_due');
    expect(kinds(decide(animal({ group: 'other', lifeStage: 'pupa' }), []).tasks)).toEqual([
      'leave_alone',
    ]);
  });
  it('follows an animal’s own interval for any food', () => {
    expect(
      decide(animal({ group: 'other', diet: 'plant', intervalDays: 5 }), [ev('ate', daysBefore(4))])
        .tasks,
    ).toEqual([]);
    expect(
      decide(animal({ group: 'beetle', lifeStage: 'larva', intervalDays: 14 }), [
        ev('note', daysBefore(14), { text: 'ok' }),
      ]).tasks[0]!.kind,
    ).toBe('check');
  });
});
