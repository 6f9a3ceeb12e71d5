// Breeding follows the group: the care-profile table's "breeding" column of the husbandry rules.
import { describe, expect, it } from 'vitest';
import { ANIMAL_GROUPS } from './animal-facts';
import { breedingModeOf, breedingRefusal, canBreed } from './breeding';

describe('breedingModeOf', () => {
  it('gives tarantulas and true spiders a guarded egg sac on the collection’s own window (common practice, no published source)', () => {
    for (const group of ['tarantula', 'true_spider'] as const) {
      expect(breedingModeOf(group)).toMatchObject({ mode: 'egg_sac', record: 'egg_sac', guarded: true, window: null, words: { record: 'Egg sac' } });
    }
  });
  it('gives a mantis an egg case (ootheca) she does not guard, incubated about 4–8 weeks (common practice, no published source)', () => {
    expect(breedingModeOf('mantis')).toMatchObject({ mode: 'egg_case', record: 'egg_case', guarded: false, window: { minDays: 28, maxDays: 56 }, words: { record: 'Egg case' } });
  });
  it('gives a scorpion a live-born brood carried on her back, left alone until it disperses (from memory: about 1–3 weeks)', () => {
    expect(breedingModeOf('scorpion')).toMatchObject({ mode: 'brood', record: 'brood', guarded: true, window: { minDays: 7, maxDays: 21 }, words: { record: 'Brood', startedOn: 'Born on', count: 'Scorplings' } });
  });
  it('gives a centipede eggs she broods herself, left alone (from memory: several weeks)', () => {
    expect(breedingModeOf('centipede')).toMatchObject({ mode: 'brooded_eggs', record: 'brood', guarded: true, words: { record: 'Brood', startedOn: 'Eggs laid on', count: 'Eggs' } });
  });
  it('records nothing for beetles (eggs in the substrate) and other invertebrates (common practice, no published source)', () => {
    expect(breedingModeOf('beetle')).toMatchObject({ mode: 'substrate_eggs', record: null, guarded: false });
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
    expect(breedingRefusal({ ...she, sex: 'male' })).toBe("Juniper is recorded as a male. Change the sex on the animal's page if that is wrong.");
    expect(breedingRefusal({ ...she, sex: 'mature_male' })).toMatch(/recorded as a male/);
    expect(breedingRefusal({ ...she, sex: 'unknown' })).toBe("Juniper's sex is not known yet. Record her as a female on the animal's page first.");
  });
  it('refuses a beetle and an "other" animal, whatever the sex', () => {
    expect(breedingRefusal({ ...she, group: 'beetle' })).toMatch(/eggs in the substrate/);
    expect(breedingRefusal({ ...she, group: 'other' })).toMatch(/tarantulas, true spiders, scorpions, centipedes and mantids/);
  });
});
