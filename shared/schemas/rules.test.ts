// The rules and care settings as the API takes them: bounds with sentences a keeper can act on.
import { describe, expect, it } from 'vitest';
import { careSettingsBody, rulesOverride } from './rules';

const firstMessage = (input: unknown) => {
  const r = rulesOverride.safeParse(input);
  return r.success ? null : r.error.issues[0]!.message;
};

describe('rulesOverride', () => {
  it('accepts a change to any group’s fed stage, its water and the catalogue', () => {
    expect(
      rulesOverride.safeParse({
        profiles: {
          mantis: {
            stages: {
              sling: {
                feedEveryDays: 1,
                offer: {
                  preyType: 'fruit flies',
                  preySize: 'flightless',
                  countMin: 2,
                  countMax: 8,
                },
              },
            },
            hydrateEveryDays: 1,
          },
        },
        feeders: [{ preyType: 'cricket', preySize: 'small', lengthMm: 8 }],
        settlingDays: 0,
      }).success,
    ).toBe(true);
  });
  it('names the group and stage in its messages', () => {
    expect(
      firstMessage({ profiles: { tarantula: { stages: { adult: { feedEveryDays: -3 } } } } }),
    ).toBe('The tarantula adult interval must be at least 1 day.');
    expect(
      firstMessage({ profiles: { mantis: { stages: { sling: { postMoltHoldDays: 90 } } } } }),
    ).toBe('The mantis nymph L1–L3 post-molt hold can be at most 60 days.');
    expect(firstMessage({ settlingDays: 40 })).toBe('The settling period can be at most 30 days.');
  });
  it('refuses a stage the group does not feed, and old keys', () => {
    expect(
      rulesOverride.safeParse({ profiles: { beetle: { stages: { larva: { feedEveryDays: 3 } } } } })
        .success,
    ).toBe(false);
    expect(
      rulesOverride.safeParse({
        profiles: { tarantula: { stages: { first_instar: { feedEveryDays: 3 } } } },
      }).success,
    ).toBe(false);
    expect(rulesOverride.safeParse({ intervalDays: { adult: 7 } }).success).toBe(false);
  });
  it('refuses a size twice in the catalogue, and lengths out of bounds', () => {
    expect(
      firstMessage({
        feeders: [
          { preyType: 'cricket', preySize: 'small', lengthMm: 8 },
          { preyType: 'Cricket', preySize: 'Small', lengthMm: 9 },
        ],
      }),
    ).toBe('“Small Cricket” is in the catalogue twice.');
    expect(
      firstMessage({ feeders: [{ preyType: 'cricket', preySize: 'small', lengthMm: 0 }] }),
    ).toBe('The length must be more than 0 mm.');
  });
});

describe('careSettingsBody', () => {
  it('takes a diet or clears it', () => {
    expect(careSettingsBody.parse({ diet: 'fruit_jelly' })).toEqual({ diet: 'fruit_jelly' });
    expect(careSettingsBody.parse({ diet: null })).toEqual({ diet: null });
    expect(careSettingsBody.safeParse({ diet: 'meat' }).error!.issues[0]!.message).toBe(
      'Choose live prey, fruit or jelly, plant food or leaf litter.',
    );
  });
});
