// Breeding follows the group: the care-profile table's "breeding" column of the husbandry rules.
import { describe, expect, it } from 'vitest';
import { ANIMAL_GROUPS } from './animal-facts';
import {
  breedingDatesProblem,
  breedingFacts,
  breedingModeOf,
  breedingRefusal,
  canBreed,
  canPair,
  isOpenRecord,
  type BreedingDates,
} from './breeding';

describe('breedingModeOf', () => {
  it('gives tarantulas and true spiders a guarded egg sac on the collection’s own window (common practice, no published source)', () => {
    for (const group of ['tarantula', 'true_spider'] as const) {
      expect(breedingModeOf(group)).toMatchObject({
        mode: 'egg_sac',
        record: 'egg_sac',
        guarded: true,
        window: null,
        words: { record: 'Egg sac' },
      });
    }
  });
  it('gives a mantis an egg case (ootheca) she does not guard, incubated about 4–8 weeks (common practice, no published source)', () => {
    expect(breedingModeOf('mantis')).toMatchObject({
      mode: 'egg_case',
      record: 'egg_case',
      guarded: false,
      window: { minDays: 28, maxDays: 56 },
      words: { record: 'Egg case' },
    });
  });
  it('gives a scorpion a live-born brood carried on her back, left alone until it disperses (from memory: about 1–3 weeks)', () => {
    expect(breedingModeOf('scorpion')).toMatchObject({
      mode: 'brood',
      record: 'brood',
      guarded: true,
      window: { minDays: 7, maxDays: 21 },
      words: { record: 'Brood', startedOn: 'Born on', count: 'Scorplings' },
    });
  });
  it('gives a centipede eggs she broods herself, left alone (from memory: several weeks)', () => {
    expect(breedingModeOf('centipede')).toMatchObject({
      mode: 'brooded_eggs',
      record: 'brood',
      guarded: true,
      words: { record: 'Brood', startedOn: 'Eggs laid on', count: 'Eggs' },
    });
  });
  it('records nothing for beetles (eggs in the substrate) and other invertebrates (common practice, no published source)', () => {
    expect(breedingModeOf('beetle')).toMatchObject({
      mode: 'substrate_eggs',
      record: null,
      guarded: false,
    });
    expect(breedingModeOf('other')).toMatchObject({ mode: 'none', record: null });
  });
  it('has a mode for every group, and a sentence for each group without a record', () => {
    for (const group of ANIMAL_GROUPS) {
      const m = breedingModeOf(group);
      expect(m.record === null).toBe(m.noRecord !== null);
      // A guarded record is the only kind that leaves her alone; only sacs, broods are guarded.
      if (m.guarded) expect(['egg_sac', 'brood']).toContain(m.record);
    }
  });
});

describe('who may have a pairing or a sac, case or brood', () => {
  const she = { name: 'Juniper', sex: 'female' as const, group: 'tarantula' as const };
  it('allows a female of a group that has a breeding record', () => {
    expect(breedingRefusal(she)).toBeNull();
    expect(canBreed({ ...she, group: 'scorpion' })).toBe(true);
    expect(canBreed({ ...she, group: 'mantis' })).toBe(true);
  });
  it('refuses males, mature males and animals whose sex is not known yet, with a sentence', () => {
    expect(breedingRefusal({ ...she, sex: 'male' })).toBe(
      "Juniper is recorded as a male. Change the sex on the animal's page if that is wrong.",
    );
    expect(breedingRefusal({ ...she, sex: 'mature_male' })).toMatch(/recorded as a male/);
    expect(breedingRefusal({ ...she, sex: 'unknown' })).toBe(
      "Juniper's sex is not known yet. Record her as a female on the animal's page first.",
    );
  });
  it('offers a pairing only to an adult female of a group that breeds', () => {
    expect(canPair({ ...she, lifeStage: 'adult' })).toBe(true);
    expect(canPair({ ...she, lifeStage: 'subadult' })).toBe(false);
    expect(canPair({ ...she, lifeStage: 'juvenile', sex: 'unknown' })).toBe(false);
    expect(canPair({ ...she, lifeStage: 'adult', sex: 'unknown' })).toBe(false);
    expect(canPair({ ...she, lifeStage: 'adult', group: 'beetle' })).toBe(false);
  });
  it('refuses a beetle and an "other" animal, whatever the sex', () => {
    expect(breedingRefusal({ ...she, group: 'beetle' })).toMatch(/eggs in the substrate/);
    expect(breedingRefusal({ ...she, group: 'other' })).toMatch(
      /tarantulas, true spiders, scorpions, centipedes and mantids/,
    );
  });
});

describe('the facts a record’s dates stand for (R8, R11 as amended)', () => {
  const sac: BreedingDates = {
    kind: 'egg_sac',
    laidOn: '2026-10-01',
    pulledOn: null,
    hatchedOn: null,
    dispersedOn: null,
  };
  it('a sac: laid, then pulled — or hatched with her when never pulled', () => {
    expect(breedingFacts(sac)).toEqual([{ kind: 'sac_laid', date: '2026-10-01' }]);
    expect(breedingFacts({ ...sac, hatchedOn: '2026-11-20' })).toEqual([
      { kind: 'sac_laid', date: '2026-10-01' },
      { kind: 'sac_hatched', date: '2026-11-20' },
    ]);
    // Pulled and later hatched in the incubator: the pull is what ended her guarding.
    expect(breedingFacts({ ...sac, pulledOn: '2026-11-12', hatchedOn: '2026-11-20' })).toEqual([
      { kind: 'sac_laid', date: '2026-10-01' },
      { kind: 'sac_pulled', date: '2026-11-12' },
    ]);
  });
  it('an egg case: laid only (she does not guard it); a brood: begun, then dispersed', () => {
    expect(breedingFacts({ ...sac, kind: 'egg_case', hatchedOn: '2026-11-20' })).toEqual([
      { kind: 'case_laid', date: '2026-10-01' },
    ]);
    expect(breedingFacts({ ...sac, kind: 'brood', dispersedOn: '2026-10-15' })).toEqual([
      { kind: 'brood_started', date: '2026-10-01' },
      { kind: 'brood_dispersed', date: '2026-10-15' },
    ]);
  });
  it('is open until pulled or hatched (sac), hatched (case), dispersed (brood)', () => {
    expect(isOpenRecord(sac)).toBe(true);
    expect(isOpenRecord({ ...sac, hatchedOn: '2026-11-20' })).toBe(false);
    expect(isOpenRecord({ ...sac, kind: 'egg_case', pulledOn: '2026-11-20' })).toBe(true);
    expect(isOpenRecord({ ...sac, kind: 'brood', hatchedOn: '2026-10-20' })).toBe(true);
    expect(isOpenRecord({ ...sac, kind: 'brood', dispersedOn: '2026-10-20' })).toBe(false);
  });
  it('refuses dates after today, before the laying, and end dates the kind does not have', () => {
    const words = breedingModeOf('tarantula').words;
    const today = '2026-11-20';
    expect(breedingDatesProblem(sac, today, words)).toBeNull();
    expect(breedingDatesProblem({ ...sac, laidOn: '2026-11-21' }, today, words)).toBe(
      'Laid on: the date cannot be after today.',
    );
    expect(breedingDatesProblem({ ...sac, pulledOn: '2026-09-30' }, today, words)).toBe(
      'Pulled on: the date cannot be before it was laid (2026-10-01).',
    );
    expect(breedingDatesProblem({ ...sac, dispersedOn: '2026-10-30' }, today, words)).toBe(
      'Only a brood disperses: record when the egg sac was pulled or hatched.',
    );
    const brood = breedingModeOf('scorpion').words;
    expect(
      breedingDatesProblem({ ...sac, kind: 'brood', pulledOn: '2026-10-30' }, today, brood),
    ).toBe('A brood is not pulled: record when it dispersed.');
    expect(
      breedingDatesProblem({ ...sac, kind: 'brood', dispersedOn: '2026-09-30' }, today, brood),
    ).toBe('Dispersed on: the date cannot be before it was born (2026-10-01).');
    expect(
      breedingDatesProblem(
        { ...sac, kind: 'egg_case', pulledOn: '2026-10-30' },
        today,
        breedingModeOf('mantis').words,
      ),
    ).toBe('An egg case is not pulled: record when it hatched.');
  });
});
