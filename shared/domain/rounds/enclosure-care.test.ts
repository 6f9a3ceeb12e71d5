// Worked cases for § Enclosure care (docs/care-rules.md: R7 without a dish, R21 spot-clean, R22
// rehouse) and the holds each obeys. Sources are named beside each block; where the rules say
// "common practice, no published source", no zoo, lab or university source was found.
import { describe, expect, it } from 'vitest';
import { engineAnimal, eventOn } from '../../../tests/fixtures/engine-animal';
import type { EventKind } from '../event-kinds';
import { startOfLocalDate } from '../local-dates';
import { projectState, type EngineEvent } from './animal-state';
import { decideAnimal, type EngineAnimal, type RoundTask } from './build-round';
import { outgrown } from './enclosure-care';
import { DEFAULT_RULES, effectiveRules } from './rules';
import { settleItem, type DayOutcome } from './settle';

const ZONE = 'America/Toronto';
const TODAY = '2026-03-20';

// Spot-cleaning on, as a collection has it (the shared fixture turns it off for other rules).
const animal = (o: Partial<EngineAnimal> = {}) => engineAnimal({ spotCleanEveryDays: null, ...o });
const ev = (kind: EventKind, date: string, payload: Record<string, unknown> = {}) =>
  eventOn(kind, date, ZONE, payload);
const decide = (a: EngineAnimal, events: EngineEvent[], date = TODAY, rules = DEFAULT_RULES) =>
  decideAnimal(a, projectState(events, ZONE), rules, date);
const kinds = (tasks: RoundTask[]) => tasks.map((t) => t.kind);
const noClean = { spotCleanEveryDays: 0 };

describe('R7 without a dish: moisten or mist, its own task (common practice, no published source; a dish from about 7.5 cm leg span and the 4-day moistening are from memory)', () => {
  it('moistens a tarantula sling’s substrate every 4 days (a dish is a drowning risk), settled by "Substrate moistened"', () => {
    const sling = animal({ lifeStage: 'sling', sizeMm: 12, ...noClean });
    const d = decide(sling, [ev('ate', '2026-03-19'), ev('substrate_moistened', '2026-03-16')]);
    expect(kinds(d.tasks)).toEqual(['moisten']);
    expect(d.tasks[0]!.reasons[0]).toMatchObject({
      code: 'moisten_substrate',
      text: 'No dish at this size: moisten part of the substrate every 4 days (last on 16 Mar).',
    });
    expect(
      decide(sling, [ev('ate', '2026-03-19'), ev('substrate_moistened', '2026-03-17')]).tasks,
    ).toEqual([]);
    // Due on the 19th, not done: carried over a day, sorted first on its shelf.
    const late = decide(sling, [ev('ate', '2026-03-19'), ev('substrate_moistened', '2026-03-15')]);
    expect(late.tasks[0]!.carriedOverDays).toBe(1);
  });
  it('counts a "Watered" from before moistening had its own outcome, until the first new one', () => {
    const sling = animal({ lifeStage: 'sling', sizeMm: 12, ...noClean });
    expect(decide(sling, [ev('ate', '2026-03-19'), ev('watered', '2026-03-17')]).tasks).toEqual([]);
    expect(
      kinds(
        decide(sling, [
          ev('watered', '2026-03-19'),
          ev('ate', '2026-03-19'),
          ev('substrate_moistened', '2026-03-16'),
        ]).tasks,
      ),
    ).toEqual(['moisten']);
  });
  it('leaves a tarantula of 7.5 cm or more without a dish alone (an arid keeper’s choice)', () => {
    expect(decide(animal({ sizeMm: 75, ...noClean }), [ev('ate', '2026-03-19')]).tasks).toEqual([]);
    expect(
      kinds(decide(animal({ sizeMm: 74, ...noClean }), [ev('ate', '2026-03-19')]).tasks),
    ).toEqual(['moisten']);
  });
  it('mists a true spider without a dish every 2 days, settled by "Misted" (small spiders drink droplets)', () => {
    const spider = animal({ group: 'true_spider', lifeStage: 'adult', sizeMm: 20, ...noClean });
    const d = decide(spider, [ev('ate', '2026-03-19'), ev('misted', '2026-03-18')]);
    expect(kinds(d.tasks)).toEqual(['mist']);
    expect(d.tasks[0]!.reasons[0]!.text).toBe(
      'No dish: mist lightly every 2 days — it drinks the droplets (last on 18 Mar).',
    );
    expect(decide(spider, [ev('ate', '2026-03-19'), ev('misted', '2026-03-19')]).tasks).toEqual([]);
  });
  it('follows the animal’s own "every N days": misting a dish-kept climber, or 0 for never', () => {
    const climber = animal({ hasWaterDish: true, mistEveryDays: 5, ...noClean });
    const d = decide(climber, [
      ev('ate', '2026-03-19'),
      ev('watered', '2026-03-19'),
      ev('misted', '2026-03-15'),
    ]);
    expect(kinds(d.tasks)).toEqual(['mist']);
    expect(d.tasks[0]!.reasons[0]!.text).toBe(
      'Its own setting: mist lightly every 5 days (last on 15 Mar).',
    );
    const never = animal({ lifeStage: 'sling', sizeMm: 12, moistenEveryDays: 0, ...noClean });
    expect(decide(never, [ev('ate', '2026-03-19')]).tasks).toEqual([]);
  });
  it('follows the collection’s profile: misting tarantula slings every 3 days instead', () => {
    const rules = effectiveRules({
      profiles: { tarantula: { hydration: 'mist', hydrateEveryDays: 3 } },
    });
    const sling = animal({ lifeStage: 'sling', sizeMm: 12, ...noClean });
    const d = decide(sling, [ev('ate', '2026-03-19'), ev('misted', '2026-03-17')], TODAY, rules);
    expect(kinds(d.tasks)).toEqual(['mist']);
  });
});

describe('R21 spot-clean (common practice, no published source: a bolus is dropped within a day of a meal and moulds or draws mites if left; spot-clean every week or two)', () => {
  it('asks for the bolus the day after a meal of live prey, not the same day', () => {
    const a = animal();
    const events = [ev('spot_cleaned', '2026-03-10'), ev('ate', '2026-03-19')];
    expect(kinds(decide(a, events).tasks)).toEqual(['spot_clean']);
    expect(decide(a, events).tasks[0]!.reasons[0]).toMatchObject({
      code: 'bolus',
      text: 'Ate on 19 Mar: pick out the bolus and any prey remains before they mould.',
    });
    expect(decide(a, events, '2026-03-19').tasks).toEqual([]);
    // Picked out: nothing until the next meal or the 14 days are up (24 Mar + 14 = 3 Apr).
    const cleaned = [...events, ev('spot_cleaned', '2026-03-20')];
    expect(decide(a, cleaned, '2026-04-02').tasks.filter((t) => t.kind === 'spot_clean')).toEqual(
      [],
    );
    expect(kinds(decide(a, cleaned, '2026-04-03').tasks)).toContain('spot_clean');
  });
  it('spot-cleans every 14 days with no meal (a tarantula’s profile), and names the last time', () => {
    const a = animal();
    const d = decide(a, [ev('ate', '2026-03-01'), ev('spot_cleaned', '2026-03-06')]);
    expect(d.tasks.find((t) => t.kind === 'spot_clean')!.reasons[0]).toMatchObject({
      code: 'spot_clean_due',
      text: 'Spot-clean every 14 days: waste, remains and old molts out (last on 6 Mar).',
    });
    expect(
      decide(a, [ev('ate', '2026-03-01'), ev('spot_cleaned', '2026-03-07')]).tasks.some(
        (t) => t.kind === 'spot_clean',
      ),
    ).toBe(false);
  });
  it('gives no spot-clean to an animal with none recorded until it eats (no first-day flood)', () => {
    expect(decide(animal(), []).tasks.some((t) => t.kind === 'spot_clean')).toBe(false);
    expect(kinds(decide(animal(), [ev('ate', '2026-03-18')]).tasks)).toContain('spot_clean');
  });
  it('follows the animal’s own interval, and 0 turns it off, bolus included', () => {
    const own = animal({ spotCleanEveryDays: 3 });
    expect(
      kinds(decide(own, [ev('ate', '2026-03-10'), ev('spot_cleaned', '2026-03-17')]).tasks),
    ).toContain('spot_clean');
    const off = animal({ spotCleanEveryDays: 0 });
    expect(decide(off, [ev('ate', '2026-03-19')]).tasks).toEqual([]);
  });
  it('does not clean in premolt (its web or burrow is left whole), but does in the post-molt hold', () => {
    const a = animal();
    const premolt = decide(a, [ev('ate', '2026-03-18'), ev('premolt_seen', '2026-03-19')]);
    expect(kinds(premolt.tasks)).not.toContain('spot_clean');
    const hold = decide(a, [ev('ate', '2026-03-01'), ev('molted', '2026-03-15')]);
    expect(kinds(hold.tasks)).toContain('spot_clean');
  });
  it('counts a rehouse as a clean enclosure', () => {
    const a = animal();
    expect(
      kinds(decide(a, [ev('ate', '2026-03-18'), ev('rehoused', '2026-03-19')]).tasks),
    ).not.toContain('spot_clean');
  });
  it('has no bolus for a fruit or jelly diet (nothing is caught and balled up)', () => {
    const beetle = animal({ group: 'beetle', lifeStage: 'adult', diet: 'fruit_jelly' });
    const d = decide(beetle, [ev('ate', '2026-03-19'), ev('spot_cleaned', '2026-03-18')]);
    expect(kinds(d.tasks)).not.toContain('spot_clean');
  });
});

describe('R22 rehouse after a molt (common practice, no published source: a terrestrial tarantula’s floor at least 2–3× its leg span each way; a climber’s or mantis’s height about 3× its size — from memory)', () => {
  // A juvenile of 60 mm leg span: 2 × 60 = 120 mm of floor at least; post-molt hold 7 days.
  const juvenile = (o: Partial<EngineAnimal> = {}) =>
    animal({
      lifeStage: 'juvenile',
      sizeMm: 60,
      enclosureLengthMm: 150,
      enclosureWidthMm: 100,
      hasWaterDish: true,
      ...noClean,
      ...o,
    });
  const molted = [ev('ate', '2026-03-01'), ev('watered', '2026-03-19'), ev('molted', '2026-03-10')];

  it('works out the rule on the numbers: floor under 2× the size, height under 3× when recorded', () => {
    expect(outgrown(juvenile(), DEFAULT_RULES)).toEqual({ floor: true, height: false });
    expect(outgrown(juvenile({ enclosureWidthMm: 120 }), DEFAULT_RULES)).toBeNull();
    expect(
      outgrown(
        juvenile({ enclosureWidthMm: 200, enclosureLengthMm: 200, enclosureHeightMm: 150 }),
        DEFAULT_RULES,
      ),
    ).toEqual({ floor: false, height: true });
    expect(outgrown(juvenile({ enclosureWidthMm: null }), DEFAULT_RULES)).toBeNull();
    expect(outgrown(juvenile({ sizeMm: null }), DEFAULT_RULES)).toBeNull();
  });
  it('asks for a rehouse once the post-molt hold is over, until a rehouse is recorded', () => {
    const d = decide(juvenile(), molted);
    expect(kinds(d.tasks)).toContain('rehouse');
    expect(d.tasks.find((t) => t.kind === 'rehouse')!.reasons[0]!.text).toBe(
      'Outgrown its enclosure since the molt on 10 Mar: 60 mm leg span in a 150 × 100 mm floor (the shorter side should be at least 2× its size). Move it to a bigger one.',
    );
    expect(
      kinds(decide(juvenile(), [...molted, ev('rehoused', '2026-03-19')]).tasks),
    ).not.toContain('rehouse');
  });
  it('waits, with a note, while the fangs harden (post-molt hold), in premolt or while settling in', () => {
    const hold = decide(juvenile(), molted, '2026-03-16');
    expect(kinds(hold.tasks)).not.toContain('rehouse');
    expect(hold.notes.find((n) => n.code === 'rehouse_due')!.text).toMatch(
      /Rehouse after 17 Mar, not before\.$/,
    );
    const premolt = decide(juvenile(), [...molted, ev('premolt_seen', '2026-03-19')]);
    expect(kinds(premolt.tasks)).not.toContain('rehouse');
    expect(premolt.notes.map((n) => n.code)).toContain('rehouse_due');
  });
  it('never asks before a molt, nor for an enclosure that fits', () => {
    expect(kinds(decide(juvenile(), [ev('ate', '2026-03-15')]).tasks)).not.toContain('rehouse');
    expect(kinds(decide(juvenile({ enclosureWidthMm: 130 }), molted).tasks)).not.toContain(
      'rehouse',
    );
  });
  it('measures a mantis by body length and a tall enclosure by its height', () => {
    const mantis = animal({
      group: 'mantis',
      lifeStage: 'subadult',
      sizeMm: 50,
      enclosureLengthMm: 120,
      enclosureWidthMm: 120,
      enclosureHeightMm: 140,
      ...noClean,
      mistEveryDays: 0,
    });
    const d = decide(mantis, [ev('ate', '2026-03-18'), ev('molted', '2026-03-10')]);
    expect(d.tasks.find((t) => t.kind === 'rehouse')!.reasons[0]!.text).toMatch(
      /50 mm body length in an enclosure 140 mm high \(at least 3× its size for a climber\)/,
    );
  });
});

describe('holds (R11 amended, R18): enclosure care left undone while the animal must not be disturbed', () => {
  const sling = () => animal({ lifeStage: 'sling', sizeMm: 12 });
  it('gives a molting animal nothing but "leave alone" — no misting, moistening or cleaning', () => {
    const d = decide(sling(), [ev('ate', '2026-03-10'), ev('molting_now', '2026-03-19')]);
    expect(kinds(d.tasks)).toEqual(['leave_alone']);
  });
  it('moistens a guarding female’s substrate quietly, and neither mists, cleans nor rehouses', () => {
    const female = animal({
      lifeStage: 'adult',
      sizeMm: 60,
      hasWaterDish: false,
      enclosureLengthMm: 100,
      enclosureWidthMm: 100,
      mistEveryDays: 2,
    });
    const d = decide(female, [
      ev('molted', '2025-12-01'),
      ev('ate', '2026-02-01'),
      ev('sac_laid', '2026-03-01'),
    ]);
    expect(kinds(d.tasks)).toEqual(['leave_alone', 'moisten']);
    expect(d.tasks[1]!.reasons[0]!.text).toMatch(/quietly, do not disturb her\.$/);
  });

  const at = (hour: number) =>
    new Date(startOfLocalDate(TODAY, ZONE).getTime() + hour * 3_600_000).toISOString();
  const tap = (kind: EventKind, hour: number, id = kind): DayOutcome => ({
    eventId: id,
    kind,
    at: at(hour),
    by: 'Robin',
  });
  const open = (...ks: RoundTask['kind'][]) =>
    ks.map((kind) => ({ kind, reasons: [], carriedOverDays: 0 }));

  it('withdraws misting, cleaning and a rehouse at once when "molting now" is tapped', () => {
    const s = settleItem(open('mist', 'spot_clean', 'rehouse'), [tap('molting_now', 9)], ZONE);
    expect(s.tasks.map((t) => t.withdrawn?.code)).toEqual([
      'leave_alone',
      'leave_alone',
      'leave_alone',
    ]);
    expect(s.total).toBe(0);
  });
  it('premolt seen: cleaning and a rehouse withdrawn with their own words; misting goes on', () => {
    const s = settleItem(open('mist', 'spot_clean', 'rehouse'), [tap('premolt_seen', 9)], ZONE);
    expect(s.tasks[0]!.withdrawn).toBeNull();
    expect(s.tasks[1]!.withdrawn!.text).toBe(
      'Premolt seen today (09:00): no cleaning or rehouse until it molts — leave its web and burrow whole.',
    );
    expect(s.tasks[2]!.withdrawn!.code).toBe('premolt');
  });
  it('an egg sac laid: misting withdrawn, moistening stays (done quietly)', () => {
    const s = settleItem(open('mist', 'moisten'), [tap('sac_laid', 9)], ZONE);
    expect(s.tasks.map((t) => !!t.withdrawn)).toEqual([true, false]);
  });
  it('a task done before the hold began stays done', () => {
    const s = settleItem(
      open('spot_clean'),
      [tap('spot_cleaned', 8), tap('premolt_seen', 9)],
      ZONE,
    );
    expect(s.tasks[0]!.withdrawn).toBeNull();
    expect(s.tasks[0]!.done!.kind).toBe('spot_cleaned');
    expect(s.done).toBe(1);
  });
  it('each outcome settles its own task; a rehouse settles the spot-clean too', () => {
    const s = settleItem(
      open('mist', 'moisten', 'spot_clean', 'rehouse'),
      [tap('misted', 8), tap('substrate_moistened', 8.1), tap('rehoused', 8.2)],
      ZONE,
    );
    expect(s.tasks.map((t) => t.done?.kind)).toEqual([
      'misted',
      'substrate_moistened',
      'rehoused',
      'rehoused',
    ]);
    expect([s.done, s.total]).toEqual([4, 4]);
  });
});
