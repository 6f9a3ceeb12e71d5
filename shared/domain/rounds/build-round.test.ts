// Worked cases for each rule of the round engine (docs/care-rules.md § R1–R20).
// Sources: where the rules say "common practice", no zoo, lab or university source was found;
// that is written beside the test as "common practice, no published source"; "from memory" marks
// values the team wrote down without a document. Per-group profiles: care-profiles.test.ts.
import { describe, expect, it } from 'vitest';
import { engineAnimal, eventOn } from '../../../tests/fixtures/engine-animal';
import type { EventKind } from '../event-kinds';
import { startOfLocalDate } from '../local-dates';
import { projectState, type EngineEvent } from './animal-state';
import { buildRound, decideAnimal, type EngineAnimal, type RoundTask } from './build-round';
import { DEFAULT_RULES, effectiveRules } from './rules';

const ZONE = 'America/Toronto';
const TODAY = '2026-03-20';

const animal = engineAnimal;
const ev = (kind: EventKind, date: string, payload: Record<string, unknown> = {}, id?: string) =>
  eventOn(kind, date, ZONE, payload, id);

function decide(a: EngineAnimal, events: EngineEvent[], date = TODAY, rules = DEFAULT_RULES) {
  return decideAnimal(a, projectState(events, ZONE), rules, date);
}
const kinds = (tasks: RoundTask[]) => tasks.map((t) => t.kind);

describe('R1 interval by life stage (common practice, no published source; pet-care guidance: slings 2–4, juveniles 4–7, adults 7–14 days)', () => {
  it('feeds an adult 12 days after its last meal, not 11', () => {
    const a = animal();
    expect(kinds(decide(a, [ev('ate', '2026-03-08')]).tasks)).toEqual(['feed']);
    expect(decide(a, [ev('ate', '2026-03-09')]).tasks).toEqual([]);
    const feed = decide(a, [ev('ate', '2026-03-08')]).tasks[0]!;
    expect(feed.reasons[0]!.text).toBe('Due: 12 days since last meal on 8 Mar.');
  });
  it.each([
    ['sling', 3],
    ['juvenile', 6],
    ['subadult', 9],
    ['adult', 12],
  ] as const)('uses %s interval %i days', (stage, days) => {
    const a = animal({ lifeStage: stage, sizeMm: 30 });
    const lastMeal = `2026-03-${String(20 - days).padStart(2, '0')}`;
    expect(decide(a, [ev('ate', lastMeal)]).nextFeed).toBe(TODAY);
  });
  it('uses the group interval for centipedes (7), scorpions (10) and mantids (4), and the animal’s own when set', () => {
    expect(decide(animal({ group: 'centipede' }), [ev('ate', '2026-03-13')]).nextFeed).toBe(
      '2026-03-20',
    );
    expect(decide(animal({ group: 'scorpion' }), [ev('ate', '2026-03-10')]).nextFeed).toBe(
      '2026-03-20',
    );
    expect(decide(animal({ group: 'mantis' }), [ev('ate', '2026-03-16')]).nextFeed).toBe(
      '2026-03-20',
    );
    expect(decide(animal({ intervalDays: 20 }), [ev('ate', '2026-03-10')]).nextFeed).toBe(
      '2026-03-30',
    );
  });
  it('offers food to an animal with no meal recorded', () => {
    expect(decide(animal(), []).tasks[0]!.reasons[0]!.text).toBe('No meal recorded yet.');
  });
  it('honours a collection’s own interval', () => {
    const rules = effectiveRules({
      profiles: { tarantula: { stages: { adult: { feedEveryDays: 7 } } } },
    });
    expect(rules.profiles.tarantula.stages.juvenile!.feedEveryDays).toBe(6); // the rest stays default
    expect(decide(animal(), [ev('ate', '2026-03-13')], TODAY, rules).nextFeed).toBe('2026-03-20');
  });
});

describe('R2 refusal retry (common practice, no published source)', () => {
  it('offers an adult food again 7 days after a refusal', () => {
    const d = decide(animal(), [ev('ate', '2026-02-20'), ev('refused', '2026-03-13')]);
    expect(kinds(d.tasks)).toEqual(['feed']);
    expect(d.tasks[0]!.reasons[0]!.text).toBe('Refused on 13 Mar: offer again after 7 days.');
    expect(decide(animal(), [ev('ate', '2026-02-20'), ev('refused', '2026-03-14')]).tasks).toEqual(
      [],
    );
  });
  it('retries a sling after 2 days', () => {
    expect(
      decide(animal({ lifeStage: 'sling', sizeMm: 20 }), [
        ev('ate', '2026-03-10'),
        ev('refused', '2026-03-18'),
      ]).nextFeed,
    ).toBe('2026-03-20');
  });
});

describe('R3 refusal streak → possible premolt (common practice, no published source: premolt animals refuse food, darken, spin a molt mat)', () => {
  it('stops offering food to an adult after 3 refusals and puts a check on the round every 7 days', () => {
    const events = [
      ev('ate', '2026-02-01'),
      ev('refused', '2026-02-20'),
      ev('refused', '2026-02-27'),
      ev('refused', '2026-03-06'),
    ];
    const flagged = decide(animal(), events, '2026-03-12');
    expect(flagged.tasks).toEqual([]);
    expect(flagged.notes.map((n) => n.code)).toContain('possible_premolt');
    const check = decide(animal(), events, '2026-03-13');
    expect(kinds(check.tasks)).toEqual(['check']);
    expect(check.tasks[0]!.reasons[0]!.text).toMatch(/^Possible premolt since 6 Mar/);
    // After a look on the 13th the next check is due on the 20th.
    expect(
      decide(animal(), [...events, ev('note', '2026-03-13', { text: 'still dark' })], '2026-03-19')
        .tasks,
    ).toEqual([]);
    expect(
      kinds(decide(animal(), [...events, ev('note', '2026-03-13')], '2026-03-20').tasks),
    ).toEqual(['check']);
  });
  it('flags a juvenile after 2 refusals; a meal, a molt or the keeper clears it', () => {
    const juvenile = animal({ lifeStage: 'juvenile', sizeMm: 40 });
    const events = [
      ev('ate', '2026-03-01'),
      ev('refused', '2026-03-10'),
      ev('refused', '2026-03-13'),
    ];
    expect(decide(juvenile, events).notes.map((n) => n.code)).toContain('possible_premolt');
    expect(
      decide(juvenile, [...events, ev('premolt_cleared', '2026-03-14')]).notes.map((n) => n.code),
    ).not.toContain('possible_premolt');
    expect(
      decide(juvenile, [...events, ev('ate', '2026-03-14')]).notes.map((n) => n.code),
    ).not.toContain('possible_premolt');
  });
  it('follows a collection that flags adults after 2 refusals', () => {
    const rules = effectiveRules({
      profiles: { tarantula: { stages: { adult: { refusalStreak: 2 } } } },
    });
    const d = decide(
      animal(),
      [ev('ate', '2026-02-20'), ev('refused', '2026-03-06'), ev('refused', '2026-03-13')],
      TODAY,
      rules,
    );
    expect(d.notes[0]!.text).toBe(
      '2 refusals in a row (last on 13 Mar): possible premolt, so no food is offered.',
    );
  });
});

describe('R4 premolt: no food, water continues, prey removed first (common practice, no published source: live prey can injure a molting spider)', () => {
  it('gives a premolt animal with a dish water but no food, and removes the prey first', () => {
    const a = animal({ hasWaterDish: true });
    const d = decide(a, [
      ev('ate', '2026-02-01'),
      ev('prey_left_in', '2026-03-18', { preyType: 'roach' }),
      ev('premolt_seen', '2026-03-18'),
    ]);
    expect(kinds(d.tasks)).toEqual(['remove_prey', 'water']);
    expect(d.tasks[0]!.reasons[0]!.text).toBe(
      'Prey left in on 18 Mar: remove it (premolt: live prey can injure a molting animal).',
    );
    expect(d.notes[0]!.text).toBe(
      'Premolt seen on 18 Mar: no food until it molts; water continues.',
    );
    expect(d.nextFeed).toBeNull();
  });
});

describe('R5 post-molt hold (common practice, no published source: about a week, longer for large spiders)', () => {
  it('holds an adult 14 days after a molt, then feeds it', () => {
    const events = [ev('ate', '2026-02-01'), ev('molted', '2026-03-07')];
    const held = decide(animal(), events, '2026-03-20');
    expect(held.tasks).toEqual([]);
    expect(held.notes[0]!.text).toBe(
      'Post-molt hold until 21 Mar (molted on 7 Mar): no food while the fangs harden.',
    );
    const fed = decide(animal(), events, '2026-03-21');
    expect(fed.tasks[0]!.reasons[0]!.text).toBe(
      'Post-molt hold ended on 21 Mar (molted on 7 Mar): food can be offered again.',
    );
  });
  it.each([
    ['sling', 4],
    ['juvenile', 7],
    ['subadult', 10],
  ] as const)('holds a %s for %i days', (stage, days) => {
    const d = decide(animal({ lifeStage: stage, sizeMm: 30 }), [ev('molted', '2026-03-10')]);
    expect(d.nextFeed).toBe(`2026-03-${10 + days}`);
  });
});

describe('R6 prey left in (common practice, no published source)', () => {
  it('removes a cricket from anyone, but lets an adult outside the molt cycle keep a roach (note, no task)', () => {
    const cricket = decide(animal(), [
      ev('ate', '2026-03-01'),
      ev('prey_left_in', '2026-03-19', { preyType: 'cricket' }),
    ]);
    expect(kinds(cricket.tasks)).toEqual(['remove_prey']);
    const roach = decide(animal(), [
      ev('ate', '2026-03-01'),
      ev('prey_left_in', '2026-03-19', { preyType: 'roach nymph' }),
    ]);
    expect(roach.tasks).toEqual([]);
    expect(roach.notes.map((n) => n.code)).toEqual(['prey_may_stay', 'prey_inside']);
  });
  it('removes prey from a sling first thing, and a removed prey counts as a refusal', () => {
    const sling = animal({ lifeStage: 'sling', sizeMm: 12 });
    const d = decide(sling, [
      ev('ate', '2026-03-15'),
      ev('prey_left_in', '2026-03-19', { preyType: 'fruit-fly larvae' }),
    ]);
    // R7: a sling without a dish also has its substrate moistened (§ Enclosure care).
    expect(kinds(d.tasks)).toEqual(['remove_prey', 'moisten']);
    expect(d.tasks[0]!.reasons[0]!.text).toMatch(/slings are not left with live prey/);
    const after = decide(
      sling,
      [ev('ate', '2026-03-15'), ev('prey_left_in', '2026-03-19'), ev('prey_removed', '2026-03-20')],
      '2026-03-22',
    );
    expect(after.tasks[0]!.reasons[0]!.code).toBe('due_refusal_retry');
  });
  it('removes prey from an animal in a post-molt hold', () => {
    const d = decide(animal(), [
      ev('prey_left_in', '2026-03-12', { preyType: 'roach' }),
      ev('molted', '2026-03-15'),
    ]);
    expect(d.tasks[0]!.reasons[0]!.text).toMatch(/post-molt hold/);
  });
});

describe('R7 water (common practice, no published source; a dish from about 7.5 cm leg span and the 4-day moistening are from memory)', () => {
  it('tops up a dish every 3 days', () => {
    const withDish = animal({ hasWaterDish: true });
    expect(
      kinds(decide(withDish, [ev('ate', '2026-03-19'), ev('watered', '2026-03-17')]).tasks),
    ).toEqual(['water']);
    expect(decide(withDish, [ev('ate', '2026-03-19'), ev('watered', '2026-03-18')]).tasks).toEqual(
      [],
    );
    expect(
      decide(withDish, [ev('ate', '2026-03-19'), ev('watered', '2026-03-17')]).tasks[0]!.reasons[0]!
        .text,
    ).toBe('Water every 3 days: last topped up on 17 Mar.');
  });
  // Without a dish, moistening and misting are enclosure care: enclosure-care.test.ts.
});

describe('R8 rebuild after an egg sac or for pairing (common practice, no published source)', () => {
  it('feeds a female every 6 days instead of 12 for 8 weeks after the sac is pulled', () => {
    const events = [
      ev('sac_laid', '2026-02-20'),
      ev('sac_pulled', '2026-02-25'),
      ev('ate', '2026-03-14'),
    ];
    const d = decide(animal(), events);
    expect(kinds(d.tasks)).toEqual(['feed']);
    expect(d.tasks[0]!.reasons[1]!.text).toBe(
      'Rebuilding after the egg sac was pulled on 25 Feb: fed every 6 days instead of 12 until 22 Apr.',
    );
    expect(decide(animal(), [...events, ev('ate', '2026-04-25')], '2026-05-01').tasks).toEqual([]); // rebuild over: back to 12
  });
  it('conditions a female after pairing and after the keeper sets the flag', () => {
    expect(decide(animal(), [ev('paired', '2026-03-10'), ev('ate', '2026-03-14')]).nextFeed).toBe(
      '2026-03-20',
    );
    expect(
      decide(animal(), [
        ev('rebuild_started', '2026-03-10'),
        ev('ate', '2026-03-14'),
        ev('rebuild_ended', '2026-03-15'),
      ]).nextFeed,
    ).toBe('2026-03-26');
  });
});

describe('R9 carry-over', () => {
  it('marks a feed due two days ago as carried over 2 days, and sorts it first on its shelf', () => {
    const late = animal({
      location: {
        id: 'l9',
        room: 'Spare room',
        rack: 'B',
        shelf: '1',
        position: '5',
        walkOrder: 0,
      },
    });
    const onTime = animal({
      location: {
        id: 'l8',
        room: 'Spare room',
        rack: 'B',
        shelf: '1',
        position: '1',
        walkOrder: 0,
      },
    });
    const round = buildRound(
      [
        { animal: onTime, state: projectState([ev('ate', '2026-03-08')], ZONE) },
        { animal: late, state: projectState([ev('ate', '2026-03-06')], ZONE) },
      ],
      DEFAULT_RULES,
      TODAY,
    );
    expect(round.items.map((i) => i.animal.id)).toEqual([late.id, onTime.id]);
    expect(round.items[0]!.tasks[0]!.reasons.at(-1)!.text).toBe(
      'Carried over 2 days: due on 18 Mar.',
    );
  });
  it('does not carry over past a deliberate skip', () => {
    expect(decide(animal(), [ev('ate', '2026-03-06')]).tasks[0]!.carriedOverDays).toBe(2);
    expect(
      decide(animal(), [ev('ate', '2026-03-06'), ev('skipped', '2026-03-18')]).tasks[0]!
        .carriedOverDays,
    ).toBe(1);
  });
});

describe('R10 no double meal', () => {
  it('never schedules food for an animal that ate within min(interval, 2) days, even after an off-schedule meal', () => {
    // A collection that retries slings the next day; a helper fed in the morning, the owner's
    // offer in the evening was refused: the retry would fall tomorrow, R10 holds it back.
    const rules = effectiveRules({
      profiles: { tarantula: { stages: { sling: { refusalRetryDays: 1 } } } },
    });
    const sling = animal({ lifeStage: 'sling', sizeMm: 10 });
    const morning = {
      ...ev('ate', '2026-03-19'),
      effectiveAt: new Date(
        startOfLocalDate('2026-03-19', ZONE).getTime() + 8 * 3600_000,
      ).toISOString(),
    };
    const d = decide(sling, [morning, ev('refused', '2026-03-19')], TODAY, rules);
    expect(kinds(d.tasks)).toEqual(['moisten']); // moisten the substrate (R7), no food
    expect(d.notes.map((n) => n.code)).toContain('no_double_meal');
    expect(d.notes.map((n) => n.text)).toContain('Ate on 19 Mar: never two meals within 2 days.');
    expect(
      kinds(decide(sling, [morning, ev('refused', '2026-03-19')], '2026-03-21', rules).tasks),
    ).toEqual(['feed', 'moisten']);
  });
});

describe('R11 leave alone (common practice, no published source)', () => {
  it('shows a molting animal only as "leave alone" — no food, no water — until the next outcome', () => {
    const a = animal({ hasWaterDish: true });
    const d = decide(a, [ev('ate', '2026-03-01'), ev('molting_now', '2026-03-19')]);
    expect(kinds(d.tasks)).toEqual(['leave_alone']);
    expect(d.tasks[0]!.reasons[0]!.text).toBe(
      'Molting since 19 Mar: leave alone — no food, no disturbance.',
    );
    expect(
      kinds(
        decide(a, [
          ev('ate', '2026-03-01'),
          ev('molting_now', '2026-03-15'),
          ev('molted', '2026-03-16'),
        ]).tasks,
      ),
    ).toEqual(['water']);
  });
  it('still takes live prey out of a molting animal', () => {
    const d = decide(animal(), [
      ev('prey_left_in', '2026-03-18', { preyType: 'cricket' }),
      ev('molting_now', '2026-03-19'),
    ]);
    expect(kinds(d.tasks)).toEqual(['remove_prey', 'leave_alone']);
  });
  it('leaves a female guarding a sac alone until the sac is pulled', () => {
    expect(kinds(decide(animal(), [ev('sac_laid', '2026-03-01')]).tasks)).toEqual(['leave_alone']);
  });
});

describe('R12 inactive animals', () => {
  it.each(['sold', 'deceased', 'rehomed', 'on_loan'] as const)(
    'never puts a %s animal on the round',
    (status) => {
      expect(decide(animal({ status }), []).tasks).toEqual([]);
    },
  );
});

describe('R13 offer (common practice, no published source)', () => {
  it('offers the stage default, tiny prey for the smallest slings, and the animal’s own setting first', () => {
    expect(decide(animal(), []).tasks[0]!.offer).toEqual({
      preyType: 'cricket',
      preySize: 'large',
      countMin: 1,
      countMax: 3,
    });
    expect(decide(animal({ lifeStage: 'sling', sizeMm: 10 }), []).tasks[0]!.offer).toEqual({
      preyType: 'fruit-fly larvae',
      preySize: 'tiny',
      countMin: 1,
      countMax: 1,
    });
    expect(decide(animal({ lifeStage: 'sling', sizeMm: 20 }), []).tasks[0]!.offer!.preySize).toBe(
      'pinhead',
    );
    expect(
      decide(animal({ preyType: 'roach', preySize: 'adult', preyCount: 2 }), []).tasks[0]!.offer,
    ).toEqual({ preyType: 'roach', preySize: 'adult', countMin: 2, countMax: 2 });
  });
});

describe('R14 walk order', () => {
  it('sorts room → rack → shelf → position naturally (2 before 10), and within an animal remove prey, feed, water, check', () => {
    const place = (rack: string, shelf: string, position: string) => ({
      id: `${rack}${shelf}${position}`,
      room: 'Spare room',
      rack,
      shelf,
      position,
      walkOrder: 0,
    });
    const list = [
      place('B', '1', '1'),
      place('A', '10', '1'),
      place('A', '2', '10'),
      place('A', '2', '2'),
    ].map((l) => ({
      animal: animal({ location: l }),
      state: projectState([], ZONE),
    }));
    const round = buildRound(list, DEFAULT_RULES, TODAY);
    expect(round.items.map((i) => i.animal.location!.id)).toEqual(['A22', 'A210', 'A101', 'B11']);
  });
  it('follows the keeper’s own walk order before the natural order', () => {
    const first = animal({
      location: {
        id: 'x',
        room: 'Spare room',
        rack: 'Z',
        shelf: '9',
        position: '9',
        walkOrder: -1,
      },
    });
    const round = buildRound(
      [
        { animal: animal(), state: projectState([], ZONE) },
        { animal: first, state: projectState([], ZONE) },
      ],
      DEFAULT_RULES,
      TODAY,
    );
    expect(round.items[0]!.animal.id).toBe(first.id);
  });
});

describe('R15 prep list', () => {
  it('sums the feed tasks by prey type and size', () => {
    const list = [
      animal({ lifeStage: 'sling', sizeMm: 10 }),
      animal({ lifeStage: 'sling', sizeMm: 11 }),
      animal({ lifeStage: 'juvenile', sizeMm: 40 }),
      animal(),
      animal(),
    ].map((a) => ({ animal: a, state: projectState([], ZONE) }));
    expect(buildRound(list, DEFAULT_RULES, TODAY).prepList).toEqual([
      { preyType: 'cricket', preySize: 'small', countMin: 1, countMax: 2, animals: 1 },
      { preyType: 'cricket', preySize: 'large', countMin: 2, countMax: 6, animals: 2 },
      { preyType: 'fruit-fly larvae', preySize: 'tiny', countMin: 2, countMax: 2, animals: 2 },
    ]);
  });
});

describe('R16 settling (common practice, no published source; 3 days from memory)', () => {
  it('holds food for 3 days after an animal joins the collection, then its first meal is due', () => {
    const arrival = animal({ addedOn: '2026-03-18', hasWaterDish: true });
    const d = decide(arrival, []);
    expect(kinds(d.tasks)).toEqual(['water']); // water continues while settling
    expect(d.notes[0]).toMatchObject({
      code: 'settling',
      text: 'Settling in since it joined the collection on 18 Mar: no food until 21 Mar.',
    });
    expect(d.nextFeed).toBe('2026-03-21');
    const due = decide(arrival, [], '2026-03-21');
    expect(due.tasks[0]).toMatchObject({ kind: 'feed', carriedOverDays: 0 }); // counted from the end of settling
    expect(due.tasks[0]!.reasons[0]!.text).toBe('No meal recorded yet.');
  });
  it('settles slings potted up today the same way (they are added on the day they are potted)', () => {
    const potted = animal({ lifeStage: 'sling', sizeMm: 12, addedOn: TODAY });
    expect(decide(potted, []).notes.map((n) => n.code)).toContain('settling');
    expect(decide(potted, []).tasks.some((t) => t.kind === 'feed')).toBe(false);
  });
  it('starts settling after a rehouse into a new enclosure, not after a move on the rack', () => {
    const a = animal();
    const history = [ev('ate', '2026-02-20')];
    const rehoused = decide(a, [
      ...history,
      ev('moved', '2026-03-19', { toLocationId: 'x', rehoused: true }),
    ]);
    expect(rehoused.tasks).toEqual([]);
    expect(rehoused.notes[0]!.text).toBe(
      'Settling in after a move to a new enclosure on 19 Mar: no food until 22 Mar.',
    );
    expect(
      decide(a, [...history, ev('moved', '2026-03-19', { toLocationId: 'x' })]).tasks[0]!.kind,
    ).toBe('feed');
    // Over on the third day: the overdue meal is due again, counted from then.
    const after = decide(
      a,
      [...history, ev('moved', '2026-03-19', { toLocationId: 'x', rehoused: true })],
      '2026-03-23',
    );
    expect(after.tasks[0]).toMatchObject({ kind: 'feed', carriedOverDays: 1 });
  });
  it('ends when the animal eats, and follows a collection’s own period (0 turns it off)', () => {
    expect(
      decide(animal({ addedOn: '2026-03-19' }), [ev('ate', '2026-03-19')], TODAY).notes.map(
        (n) => n.code,
      ),
    ).not.toContain('settling');
    expect(
      kinds(
        decide(animal({ addedOn: '2026-03-19' }), [], TODAY, effectiveRules({ settlingDays: 0 }))
          .tasks,
      ),
    ).toEqual(['feed']);
    expect(
      decide(animal({ addedOn: '2026-03-15' }), [], TODAY, effectiveRules({ settlingDays: 7 }))
        .notes[0]!.code,
    ).toBe('settling');
  });
});

describe('R17 mature males and adults that no longer molt (common practice; which adults molt: arthropod biology, from memory)', () => {
  it('never flags a mature male’s refusals as premolt, and says refusing is normal', () => {
    const male = animal({ sex: 'mature_male' });
    const refusals = [
      ev('ate', '2026-02-01'),
      ev('refused', '2026-02-20'),
      ev('refused', '2026-02-27'),
      ev('refused', '2026-03-06'),
      ev('refused', '2026-03-13'),
    ];
    const d = decide(male, refusals);
    expect(d.notes.map((n) => n.code)).not.toContain('possible_premolt');
    expect(d.notes.map((n) => n.text)).toContain(
      'Mature male: refusing food is normal, and he will not molt again.',
    );
    expect(d.tasks[0]!.reasons[0]!.code).toBe('due_refusal_retry'); // offered again 7 days on, as R2 says
    expect(d.tasks.some((t) => t.kind === 'check')).toBe(false); // no premolt check either
    // A female with the same history is flagged (R3), so the difference is the sex.
    expect(decide(animal(), refusals).notes.map((n) => n.code)).toContain('possible_premolt');
  });
  it('honours a premolt the keeper marks by hand even on a mature male (R4)', () => {
    expect(
      decide(animal({ sex: 'mature_male' }), [ev('premolt_seen', '2026-03-18')]).notes.map(
        (n) => n.code,
      ),
    ).toContain('premolt');
  });
});

describe('R20 prey allowed to stay (common practice, no published source; 2 days from memory)', () => {
  it('lets an adult keep a roach for 2 days, then puts a "check or remove" task on the round', () => {
    const events = [
      ev('ate', '2026-03-01'),
      ev('prey_left_in', '2026-03-18', { preyType: 'roach' }),
    ];
    const note = decide(animal(), events, '2026-03-19');
    expect(note.tasks).toEqual([]);
    expect(note.notes[0]!.text).toBe(
      'A roach left in on 18 Mar may stay with an adult outside the molt cycle: check on it on 20 Mar.',
    );
    const check = decide(animal(), events, '2026-03-20');
    expect(check.tasks).toHaveLength(1);
    expect(check.tasks[0]).toMatchObject({ kind: 'remove_prey', carriedOverDays: 0 });
    expect(check.tasks[0]!.reasons[0]).toMatchObject({
      code: 'check_prey',
      dates: ['2026-03-18', '2026-03-20'],
    });
    expect(decide(animal(), events, '2026-03-22').tasks[0]!.carriedOverDays).toBe(2); // stays until done (R9)
    expect(decide(animal(), [...events, ev('ate', '2026-03-20')], '2026-03-21').tasks).toEqual([]); // found eaten
  });
  it('follows a collection’s own check-by period', () => {
    const events = [
      ev('ate', '2026-03-01'),
      ev('prey_left_in', '2026-03-18', { preyType: 'roach' }),
    ];
    expect(
      decide(animal(), events, '2026-03-20', effectiveRules({ preyStayCheckDays: 4 })).tasks,
    ).toEqual([]);
  });
});

describe('void events', () => {
  it('forgets a meal that was voided, as if it had never been recorded', () => {
    const meal = ev('ate', '2026-03-19');
    expect(decide(animal(), [ev('ate', '2026-03-01'), meal]).tasks).toEqual([]);
    expect(
      kinds(
        decide(animal(), [
          ev('ate', '2026-03-01'),
          meal,
          ev('void', '2026-03-19', { targetId: meal.id }),
        ]).tasks,
      ),
    ).toEqual(['feed']);
  });
});
