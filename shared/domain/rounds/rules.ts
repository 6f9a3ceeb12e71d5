import type { AnimalGroup, Diet, LifeStage } from '../animal-facts';
import {
  DEFAULT_PROFILES,
  foodOf,
  type CareAnimal,
  type CareProfile,
  type Offer,
  type StageCare,
} from './care-profiles';
import { DEFAULT_FEEDERS, type Feeder } from './feeders';

export type { Offer } from './care-profiles';

/**
 * The round engine's rules: husbandry rules R1–R20 and the care profiles by group and stage.
 * Every number is a default a collection can change; each is defined, with its source, in
 * docs/care-rules.md (the section is named beside it).
 */
export interface RoundRules {
  /** § Care profiles: intervals, refusals, holds, offers and hydration by group and stage. */
  profiles: Record<AnimalGroup, CareProfile>;
  /** R3: while a possible premolt is flagged, a "check" task every N days. */
  premoltCheckDays: number;
  /** R7: water dishes topped up every N days. */
  waterEveryDays: number;
  /** R8: a female rebuilding after a sac or conditioned for pairing: interval × factor … */
  rebuildFactor: number;
  /** R8: … for this many days. */
  rebuildDays: number;
  /** R16: no food for this many days after arrival, a rehouse or potting up. */
  settlingDays: number;
  /** R20: prey allowed to stay in gets a "check or remove" task this many days later. */
  preyStayCheckDays: number;
  /** § Diets: fruit or jelly, plant food and leaf litter are replaced this often. */
  dietEveryDays: Record<Exclude<Diet, 'live_prey'>, number>;
  /** § Care profiles (beetle): a larva's food substrate is checked and topped up this often. */
  substrateCheckDays: number;
  /** R19: a spider's body length is about this share of its diagonal leg span. */
  spanToBody: number;
  /** R13: tarantula slings smaller than this (mm leg span) get the tiniest prey type. */
  tinySlingMm: number;
  /** R19: the feeders the collection keeps, with their typical body lengths. */
  feeders: Feeder[];
  /** R21: a bolus is picked out this many days after a meal of live prey (0: no bolus task). */
  bolusAfterDays: number;
  /** R22: after a molt, rehouse when the floor's shorter side is under this many × its size… */
  rehouseFloorSpans: number;
  /** R22: … or, for an arboreal set-up (a height recorded), the height under this many × it. */
  rehouseHeightSpans: number;
}

export const DEFAULT_RULES: RoundRules = {
  profiles: DEFAULT_PROFILES,
  premoltCheckDays: 7,
  waterEveryDays: 3,
  rebuildFactor: 0.5,
  rebuildDays: 56,
  settlingDays: 3,
  preyStayCheckDays: 2,
  dietEveryDays: { fruit_jelly: 3, plant: 3, detritus: 7 },
  substrateCheckDays: 28,
  spanToBody: 0.33,
  tinySlingMm: 15,
  feeders: DEFAULT_FEEDERS,
  bolusAfterDays: 1,
  rehouseFloorSpans: 2,
  rehouseHeightSpans: 3,
};

/** The tiniest slings get fruit-fly larvae: prey no larger than the animal's body (R13). */
export const TINY_SLING_OFFER: Offer = {
  preyType: 'fruit-fly larvae',
  preySize: 'tiny',
  countMin: 1,
  countMax: 1,
};

/** Every key optional, all the way down; lists (the feeder catalogue) are replaced whole. */
export type DeepPartial<T> = T extends readonly unknown[]
  ? T
  : T extends object
    ? { [K in keyof T]?: DeepPartial<T[K]> }
    : T;

/**
 * Keys of overrides saved before care profiles existed: stage tables that meant tarantulas
 * (and every group without an interval of its own), and one interval per group.
 */
type StageTable<T> = Partial<Record<LifeStage, T>>;
interface LegacyOverride {
  intervalDays?: StageTable<number>;
  refusalRetryDays?: StageTable<number>;
  refusalStreak?: StageTable<number>;
  postMoltHoldDays?: StageTable<number>;
  offers?: StageTable<Offer>;
  groupIntervalDays?: Partial<Record<AnimalGroup, number>>;
}

export type RulesOverride = DeepPartial<RoundRules> & LegacyOverride;

const LEGACY_STAGE_KEYS = {
  intervalDays: 'feedEveryDays',
  refusalRetryDays: 'refusalRetryDays',
  refusalStreak: 'refusalStreak',
  postMoltHoldDays: 'postMoltHoldDays',
  offers: 'offer',
} as const satisfies Record<string, keyof StageCare>;

/** An override saved before care profiles, in today's shape: its stage tables are the tarantula's. */
export function upgradeOverride(override: RulesOverride): DeepPartial<RoundRules> {
  const {
    intervalDays,
    refusalRetryDays,
    refusalStreak,
    postMoltHoldDays,
    offers,
    groupIntervalDays,
    ...rest
  } = override;
  const legacy = { intervalDays, refusalRetryDays, refusalStreak, postMoltHoldDays, offers };
  if (Object.values(legacy).every((v) => v === undefined) && !groupIntervalDays) return rest;
  const profiles: Record<string, { stages: Record<string, Record<string, unknown>> }> = {};
  const stageOf = (group: string, s: string) => {
    const p = (profiles[group] ??= { stages: {} });
    return (p.stages[s] ??= {});
  };
  for (const [key, field] of Object.entries(LEGACY_STAGE_KEYS)) {
    for (const [s, value] of Object.entries(legacy[key as keyof typeof legacy] ?? {}))
      stageOf('tarantula', s)[field] = value;
  }
  for (const [group, days] of Object.entries(groupIntervalDays ?? {})) {
    for (const s of Object.keys(DEFAULT_PROFILES[group as AnimalGroup]?.stages ?? {}))
      stageOf(group, s).feedEveryDays = days;
  }
  return mergeDeep({ profiles } as DeepPartial<RoundRules>, rest);
}

function isPlainObject(v: unknown): v is Record<string, unknown> {
  return typeof v === 'object' && v !== null && !Array.isArray(v);
}

/** `over` laid on `base`, object by object; lists and numbers are replaced. */
function mergeDeep<T>(base: T, over: unknown): T {
  if (!isPlainObject(base) || !isPlainObject(over)) return (over === undefined ? base : over) as T;
  const out: Record<string, unknown> = { ...base };
  for (const [key, value] of Object.entries(over)) {
    if (value === undefined) continue;
    out[key] = key in out ? mergeDeep(out[key], value) : value;
  }
  return out as T;
}

/** A collection's stored overrides laid over the defaults, key by key, at every depth. */
export function effectiveRules(override: RulesOverride | null | undefined): RoundRules {
  return mergeDeep(structuredClone(DEFAULT_RULES), upgradeOverride(override ?? {}));
}

/**
 * The numbers for an animal's stage. A stage the group does not have (records made before
 * stages were checked against the group) uses the group's adult numbers.
 */
export function stageCare(
  rules: RoundRules,
  animal: { group: AnimalGroup; lifeStage: LifeStage },
): StageCare {
  const stages = rules.profiles[animal.group].stages;
  return (
    stages[animal.lifeStage] ??
    stages.adult ??
    Object.values(stages)[0] ??
    rules.profiles.tarantula.stages.adult!
  );
}

/**
 * R1 interval for one animal: its own setting, else its profile's for its stage and food
 * (live prey, a diet's replacement interval, or a larva's substrate check).
 */
export function feedingInterval(
  rules: RoundRules,
  animal: CareAnimal & { intervalDays?: number | null },
): number {
  if (animal.intervalDays) return animal.intervalDays;
  const food = foodOf(animal);
  if (food === 'substrate') return rules.substrateCheckDays;
  if (food === 'fruit_jelly' || food === 'plant' || food === 'detritus')
    return rules.dietEveryDays[food];
  return stageCare(rules, animal).feedEveryDays;
}

/** R5: the post-molt hold of an animal's stage, in days. */
export function postMoltHoldDays(
  rules: RoundRules,
  animal: { group: AnimalGroup; lifeStage: LifeStage },
): number {
  return stageCare(rules, animal).postMoltHoldDays;
}
