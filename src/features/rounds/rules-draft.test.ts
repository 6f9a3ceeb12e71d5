import { describe, expect, it } from 'vitest';
import { DEFAULT_RULES, effectiveRules } from '#shared/domain/rounds/rules';
import { rulesOverride } from '#shared/schemas/rules';
import { feederRows, toDraft, toOverrides, withoutFeeder } from './rules-draft';

describe('the rules form draft', () => {
  it('stores nothing when nothing differs from the defaults', () => {
    expect(toOverrides(toDraft(DEFAULT_RULES), DEFAULT_RULES)).toEqual({});
  });
  it('stores only the changed values, which read back as the same rules', () => {
    const draft = { ...toDraft(DEFAULT_RULES), 'profiles.mantis.stages.sling.feedEveryDays': '1', 'profiles.tarantula.hydrateBelowMm': '', settlingDays: '5', 'dietEveryDays.plant': '2' };
    const overrides = toOverrides(draft, DEFAULT_RULES);
    expect(overrides).toEqual({
      profiles: { mantis: { stages: { sling: { feedEveryDays: 1 } } }, tarantula: { hydrateBelowMm: null } },
      settlingDays: 5,
      dietEveryDays: { plant: 2 },
    });
    expect(rulesOverride.safeParse(overrides).success).toBe(true);
    expect(toDraft(effectiveRules(overrides))).toEqual({ ...draft, 'profiles.tarantula.hydrateBelowMm': '' });
  });
  it('keeps the catalogue whole when one row changes, and removes a row by moving the rest up', () => {
    const draft = withoutFeeder(toDraft(DEFAULT_RULES), 0);
    expect(feederRows(draft)).toBe(DEFAULT_RULES.feeders.length - 1);
    expect(draft['feeders.0.preySize']).toBe('small');
    expect(toOverrides(draft, DEFAULT_RULES).feeders).toEqual(DEFAULT_RULES.feeders.slice(1));
  });
  it('leaves a number that does not parse for the schema to name', () => {
    const overrides = toOverrides({ ...toDraft(DEFAULT_RULES), 'profiles.tarantula.stages.adult.feedEveryDays': 'soon' }, DEFAULT_RULES);
    const parsed = rulesOverride.safeParse(overrides);
    expect(parsed.success).toBe(false);
    expect(parsed.error!.issues[0]!.path.join('.')).toBe('profiles.tarantula.stages.adult.feedEveryDays');
  });
});
