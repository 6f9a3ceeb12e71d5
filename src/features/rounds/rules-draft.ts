import { ANIMAL_GROUPS, type AnimalGroup, type LifeStage } from '#shared/domain/animal-facts';
import type { Offer, StageCare } from '#shared/domain/rounds/care-profiles';
import type { Feeder } from '#shared/domain/rounds/feeders';
import type { RoundRules, RulesOverride } from '#shared/domain/rounds/rules';

/**
 * The rules form as typed: one text per field, keyed by the rule's path (the same path zod
 * reports an error on, so each message lands beside its field).
 */
export type Draft = Record<string, string>;

export type StageNumberKey = Exclude<keyof StageCare, 'offer'>;
export const STAGE_NUMBER_KEYS: readonly StageNumberKey[] = [
  'feedEveryDays',
  'refusalRetryDays',
  'refusalStreak',
  'postMoltHoldDays',
];
const OFFER_KEYS: readonly (keyof Offer)[] = ['preyType', 'preySize', 'countMin', 'countMax'];
const TEXT_OFFER_KEYS: ReadonlySet<string> = new Set(['preyType', 'preySize']);

export type SingleKey =
  | 'premoltCheckDays'
  | 'waterEveryDays'
  | 'rebuildFactor'
  | 'rebuildDays'
  | 'settlingDays'
  | 'preyStayCheckDays'
  | 'substrateCheckDays'
  | 'spanToBody'
  | 'tinySlingMm'
  | 'bolusAfterDays'
  | 'rehouseFloorSpans'
  | 'rehouseHeightSpans';
export const SINGLE_KEYS: readonly SingleKey[] = [
  'settlingDays',
  'preyStayCheckDays',
  'premoltCheckDays',
  'waterEveryDays',
  'rebuildFactor',
  'rebuildDays',
  'substrateCheckDays',
  'spanToBody',
  'tinySlingMm',
  'bolusAfterDays',
  'rehouseFloorSpans',
  'rehouseHeightSpans',
];
export const DIET_KEYS = ['fruit_jelly', 'plant', 'detritus'] as const;

/** The stages of a group that have numbers (the ones offered food). */
export const fedStages = (rules: RoundRules, group: AnimalGroup) =>
  Object.keys(rules.profiles[group].stages) as LifeStage[];

export const stagePath = (group: AnimalGroup, stage: LifeStage, key: string) =>
  `profiles.${group}.stages.${stage}.${key}`;
export const offerPath = (group: AnimalGroup, stage: LifeStage, key: keyof Offer) =>
  `profiles.${group}.stages.${stage}.offer.${key}`;
export const profilePath = (
  group: AnimalGroup,
  key: 'hydration' | 'hydrateEveryDays' | 'hydrateBelowMm' | 'spotCleanEveryDays',
) => `profiles.${group}.${key}`;

export function toDraft(r: RoundRules): Draft {
  const d: Draft = {};
  for (const g of ANIMAL_GROUPS) {
    const profile = r.profiles[g];
    for (const s of fedStages(r, g)) {
      const care = profile.stages[s]!;
      for (const k of STAGE_NUMBER_KEYS) d[stagePath(g, s, k)] = String(care[k]);
      for (const k of OFFER_KEYS) d[offerPath(g, s, k)] = String(care.offer[k]);
    }
    d[profilePath(g, 'hydration')] = profile.hydration;
    d[profilePath(g, 'hydrateEveryDays')] = String(profile.hydrateEveryDays);
    d[profilePath(g, 'hydrateBelowMm')] =
      profile.hydrateBelowMm === null ? '' : String(profile.hydrateBelowMm);
    d[profilePath(g, 'spotCleanEveryDays')] =
      profile.spotCleanEveryDays === null ? '' : String(profile.spotCleanEveryDays);
  }
  for (const k of SINGLE_KEYS) d[k] = String(r[k]);
  for (const k of DIET_KEYS) d[`dietEveryDays.${k}`] = String(r.dietEveryDays[k]);
  r.feeders.forEach((f, i) => {
    d[`feeders.${i}.preyType`] = f.preyType;
    d[`feeders.${i}.preySize`] = f.preySize;
    d[`feeders.${i}.lengthMm`] = String(f.lengthMm);
  });
  return d;
}

/** How many catalogue rows the draft holds. */
export function feederRows(d: Draft): number {
  let n = 0;
  while (`feeders.${n}.preyType` in d) n += 1;
  return n;
}

/**
 * The draft as the form holds it: nested by its paths (`feeders.0.preyType` is the first row of
 * the `feeders` list), the shape react-hook-form keeps field values in.
 */
export function nestDraft(d: Draft): Record<string, unknown> {
  const root: Record<string, unknown> = {};
  for (const [path, value] of Object.entries(d)) {
    const keys = path.split('.');
    let node = root;
    keys.forEach((key, i) => {
      if (i === keys.length - 1) node[key] = value;
      else node = (node[key] ??= /^\d+$/.test(keys[i + 1]!) ? [] : {}) as Record<string, unknown>;
    });
  }
  return root;
}

/** The form's nested values back as one text per rule path. */
export function flattenDraft(values: Record<string, unknown>, prefix = ''): Draft {
  const d: Draft = {};
  for (const [key, value] of Object.entries(values)) {
    const path = prefix ? `${prefix}.${key}` : key;
    if (value !== null && typeof value === 'object')
      Object.assign(d, flattenDraft(value as Record<string, unknown>, path));
    else d[path] = String(value ?? '');
  }
  return d;
}

const num = (v: string | undefined) =>
  v === undefined || v.trim() === '' ? NaN : Number(v.replace(',', '.'));

/**
 * Only what differs from the defaults is stored, so a later change of a default still reaches
 * the collection. Numbers that do not parse stay NaN for the schema to name.
 */
export function toOverrides(d: Draft, defaults: RoundRules): RulesOverride {
  const out: Record<string, unknown> = {};
  const profiles: Record<string, Record<string, unknown>> = {};
  for (const g of ANIMAL_GROUPS) {
    const base = defaults.profiles[g];
    const profile: Record<string, unknown> = {};
    const stages: Record<string, Record<string, unknown>> = {};
    for (const s of fedStages(defaults, g)) {
      const care = base.stages[s]!;
      const changed: Record<string, unknown> = {};
      for (const k of STAGE_NUMBER_KEYS)
        if (num(d[stagePath(g, s, k)]) !== care[k]) changed[k] = num(d[stagePath(g, s, k)]);
      const offer = Object.fromEntries(
        OFFER_KEYS.map((k) => [
          k,
          TEXT_OFFER_KEYS.has(k)
            ? (d[offerPath(g, s, k)] ?? '').trim()
            : num(d[offerPath(g, s, k)]),
        ]),
      );
      if (JSON.stringify(offer) !== JSON.stringify(care.offer)) changed.offer = offer;
      if (Object.keys(changed).length) stages[s] = changed;
    }
    if (Object.keys(stages).length) profile.stages = stages;
    if (d[profilePath(g, 'hydration')] !== base.hydration)
      profile.hydration = d[profilePath(g, 'hydration')];
    if (num(d[profilePath(g, 'hydrateEveryDays')]) !== base.hydrateEveryDays)
      profile.hydrateEveryDays = num(d[profilePath(g, 'hydrateEveryDays')]);
    const below =
      (d[profilePath(g, 'hydrateBelowMm')] ?? '').trim() === ''
        ? null
        : num(d[profilePath(g, 'hydrateBelowMm')]);
    if (below !== base.hydrateBelowMm) profile.hydrateBelowMm = below;
    const clean =
      (d[profilePath(g, 'spotCleanEveryDays')] ?? '').trim() === ''
        ? null
        : num(d[profilePath(g, 'spotCleanEveryDays')]);
    if (clean !== base.spotCleanEveryDays) profile.spotCleanEveryDays = clean;
    if (Object.keys(profile).length) profiles[g] = profile;
  }
  if (Object.keys(profiles).length) out.profiles = profiles;
  for (const k of SINGLE_KEYS) if (num(d[k]) !== defaults[k]) out[k] = num(d[k]);
  const diets = Object.fromEntries(
    DIET_KEYS.filter((k) => num(d[`dietEveryDays.${k}`]) !== defaults.dietEveryDays[k]).map((k) => [
      k,
      num(d[`dietEveryDays.${k}`]),
    ]),
  );
  if (Object.keys(diets).length) out.dietEveryDays = diets;
  const feeders: Feeder[] = Array.from({ length: feederRows(d) }, (_, i) => ({
    preyType: d[`feeders.${i}.preyType`]!.trim(),
    preySize: d[`feeders.${i}.preySize`]!.trim(),
    lengthMm: num(d[`feeders.${i}.lengthMm`]),
  }));
  if (JSON.stringify(feeders) !== JSON.stringify(defaults.feeders)) out.feeders = feeders;
  return out as RulesOverride;
}

/** Whether a draft field holds text (a name), so "Enter a number." never lands on it. */
export const isTextField = (path: string) => /\.(preyType|preySize|hydration)$/.test(path);

/** The group a field belongs to, to show that group when its field needs attention. */
export function groupOfPath(path: string): AnimalGroup | null {
  const m = /^profiles\.([a-z_]+)\./.exec(path);
  return m && (ANIMAL_GROUPS as readonly string[]).includes(m[1]!) ? (m[1] as AnimalGroup) : null;
}
