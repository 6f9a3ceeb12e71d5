import { describe, expect, it } from 'vitest';
import { DEFAULT_RULES, effectiveRules } from '#shared/domain/rounds/rules';
import { rulesOverride } from '#shared/schemas/rules';
import { feederRows, flattenDraft, nestDraft, toDraft, toOverrides } from './rules-draft';

describe('the rules form draft', () => {
  it('stores nothing when nothing differs from the defaults', () => {
    expect(toOverrides(toDraft(DEFAULT_RULES), DEFAULT_RULES)).toEqual({});
  });
  it('stores only the changed values, which read back as the same rules', () => {
    const draft = {
      ...toDraft(DEFAULT_RULES),
      'profiles.mantis.stages.sling.feedEveryDays': '1',
      'profiles.tarantula.hydrateBelowMm': '',
      settlingDays: '5',
      'dietEveryDays.plant': '2',
    };
    const overrides = toOverrides(draft, DEFAULT_RULES);
    expect(overrides).toEqual({
      profiles: {
        mantis: { stages: { sling: { feedEveryDays: 1 } } },
        tarantula: { hydrateBelowMm: null },
      },
      settlingDays: 5,
      dietEveryDays: { plant: 2 },
    });
    expect(rulesOverride.safeParse(overrides).success).toBe(true);
    expect(toDraft(effectiveRules(overrides))).toEqual({
      ...draft,
      'profiles.tarantula.hydrateBelowMm': '',
    });
  });
  it('keeps the catalogue whole when one row changes or a row goes', () => {
    const draft = toDraft(DEFAULT_RULES);
    expect(toOverrides({ ...draft, 'feeders.0.lengthMm': '4' }, DEFAULT_RULES).feeders).toEqual([
      { ...DEFAULT_RULES.feeders[0]!, lengthMm: 4 },
      ...DEFAULT_RULES.feeders.slice(1),
    ]);
    const withoutFirst = toDraft({ ...DEFAULT_RULES, feeders: DEFAULT_RULES.feeders.slice(1) });
    expect(feederRows(withoutFirst)).toBe(DEFAULT_RULES.feeders.length - 1);
    expect(toOverrides(withoutFirst, DEFAULT_RULES).feeders).toEqual(
      DEFAULT_RULES.feeders.slice(1),
    );
  });
  it('reads back the same draft from the form’s nested values, the catalogue as a list', () => {
    const draft = toDraft(DEFAULT_RULES);
    const nested = nestDraft(draft);
    expect(Array.isArray(nested.feeders)).toBe(true);
    expect((nested.feeders as unknown[]).length).toBe(DEFAULT_RULES.feeders.length);
    expect(flattenDraft(nested)).toEqual(draft);
  });
  it('leaves a number that does not parse for the schema to name', () => {
    const overrides = toOverrides(
      { ...toDraft(DEFAULT_RULES), 'profiles.tarantula.stages.adult.feedEveryDays': 'soon' },
      DEFAULT_RULES,
    );
    const parsed = rulesOverride.safeParse(overrides);
    expect(parsed.success).toBe(false);
    expect(parsed.error!.issues[0]!.path.join('.')).toBe(
      'profiles.tarantula.stages.adult.feedEveryDays',
    );
  });
});
