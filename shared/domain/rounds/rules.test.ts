// How a collection's changes are laid over the defaults (docs/care-rules.md, introduction), and
// how overrides saved before care profiles are read. No husbandry source is involved here.
import { describe, expect, it } from 'vitest';
import { DEFAULT_PROFILES } from './care-profiles';
import {
  DEFAULT_RULES,
  effectiveRules,
  feedingInterval,
  postMoltHoldDays,
  stageCare,
  upgradeOverride,
} from './rules';

describe('effectiveRules', () => {
  it('is the defaults when nothing is changed, and never changes the defaults themselves', () => {
    expect(effectiveRules(null)).toEqual(DEFAULT_RULES);
    const changed = effectiveRules({
      profiles: { mantis: { stages: { adult: { feedEveryDays: 5 } } } },
    });
    expect(changed.profiles.mantis.stages.adult!.feedEveryDays).toBe(5);
    expect(changed.profiles.mantis.stages.adult!.postMoltHoldDays).toBe(2); // the rest of the stage stays
    expect(changed.profiles.mantis.hydration).toBe('mist');
    expect(DEFAULT_PROFILES.mantis.stages.adult!.feedEveryDays).toBe(4);
  });
  it('replaces the feeder catalogue whole, and changes single values', () => {
    const rules = effectiveRules({
      feeders: [{ preyType: 'roach', preySize: 'adult', lengthMm: 40 }],
      settlingDays: 5,
      dietEveryDays: { plant: 2 },
    });
    expect(rules.feeders).toEqual([{ preyType: 'roach', preySize: 'adult', lengthMm: 40 }]);
    expect(rules.settlingDays).toBe(5);
    expect(rules.dietEveryDays).toEqual({ fruit_jelly: 3, plant: 2, detritus: 7 });
  });
});

describe('overrides saved before care profiles', () => {
  it('reads the old stage tables as the tarantula profile', () => {
    const rules = effectiveRules({
      refusalStreak: { adult: 2 },
      intervalDays: { sling: 4 },
      offers: { adult: { preyType: 'roach', preySize: 'adult', countMin: 1, countMax: 1 } },
    });
    expect(rules.profiles.tarantula.stages.adult!.refusalStreak).toBe(2);
    expect(rules.profiles.tarantula.stages.sling!.feedEveryDays).toBe(4);
    expect(rules.profiles.tarantula.stages.adult!.offer.preyType).toBe('roach');
    expect(rules.profiles.true_spider).toEqual(DEFAULT_PROFILES.true_spider);
    expect(Object.keys(rules)).not.toContain('refusalStreak');
  });
  it('reads an old group interval as every fed stage of that group', () => {
    const rules = effectiveRules({ groupIntervalDays: { mantis: 5 }, waterEveryDays: 4 });
    expect(Object.values(rules.profiles.mantis.stages).map((s) => s.feedEveryDays)).toEqual([
      5, 5, 5, 5,
    ]);
    expect(rules.waterEveryDays).toBe(4);
  });
  it('lets today’s keys win over old ones in one override', () => {
    expect(
      upgradeOverride({
        intervalDays: { adult: 20 },
        profiles: { tarantula: { stages: { adult: { feedEveryDays: 15 } } } },
      }).profiles?.tarantula?.stages?.adult?.feedEveryDays,
    ).toBe(15);
  });
});

describe('per-animal lookups', () => {
  it('uses the group’s adult numbers for a stage the group does not have (records made before stages were checked)', () => {
    expect(stageCare(DEFAULT_RULES, { group: 'true_spider', lifeStage: 'subadult' })).toBe(
      DEFAULT_RULES.profiles.true_spider.stages.adult,
    );
    expect(postMoltHoldDays(DEFAULT_RULES, { group: 'centipede', lifeStage: 'sling' })).toBe(5);
  });
  it('gives the interval of the animal’s food: own setting, prey, diet or substrate', () => {
    expect(
      feedingInterval(DEFAULT_RULES, {
        group: 'tarantula',
        lifeStage: 'juvenile',
        intervalDays: 9,
      }),
    ).toBe(9);
    expect(feedingInterval(DEFAULT_RULES, { group: 'tarantula', lifeStage: 'juvenile' })).toBe(6);
    expect(feedingInterval(DEFAULT_RULES, { group: 'beetle', lifeStage: 'adult' })).toBe(3);
    expect(
      feedingInterval(DEFAULT_RULES, { group: 'beetle', lifeStage: 'adult', diet: 'live_prey' }),
    ).toBe(4);
    expect(feedingInterval(DEFAULT_RULES, { group: 'beetle', lifeStage: 'larva' })).toBe(28);
  });
});
