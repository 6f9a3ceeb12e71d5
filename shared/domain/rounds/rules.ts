import type { AnimalGroup, LifeStage } from '../animal-facts';

/**
 * The round engine's rules (husbandry rules R1–R15). Every number here is a default a
 * collection can change; sources are in ../shared husbandry-rules and in rules.test.ts.
 */
export interface Offer {
  preyType: string;
  preySize: string;
  countMin: number;
  countMax: number;
}

export type ByStage<T> = Record<LifeStage, T>;

export interface RoundRules {
  /** R1: feed again N days after the last meal, by life stage. */
  intervalDays: ByStage<number>;
  /** R1: groups that are not spiders have their own interval (adults and young alike). */
  groupIntervalDays: Partial<Record<AnimalGroup, number>>;
  /** R2: after a refusal, offer again after this many days. */
  refusalRetryDays: ByStage<number>;
  /** R3: this many refusals in a row flag a possible premolt. */
  refusalStreak: ByStage<number>;
  /** R3: while flagged, a "check" task every N days. */
  premoltCheckDays: number;
  /** R5: no food for this many days after a molt. */
  postMoltHoldDays: ByStage<number>;
  /** R7: water dishes topped up every N days. */
  waterEveryDays: number;
  /** R8: a female rebuilding after a sac or conditioned for pairing: interval × factor … */
  rebuildFactor: number;
  /** R8: … for this many days. */
  rebuildDays: number;
  /** R13: what to offer when the animal has no setting of its own. */
  offers: ByStage<Offer>;
  /** R13: slings smaller than this (mm leg span) get the tiniest prey. */
  tinySlingMm: number;
}

export const DEFAULT_RULES: RoundRules = {
  intervalDays: { sling: 3, juvenile: 6, subadult: 9, adult: 12 },
  groupIntervalDays: { centipede: 7, scorpion: 10, mantis: 4 },
  refusalRetryDays: { sling: 2, juvenile: 3, subadult: 4, adult: 7 },
  refusalStreak: { sling: 2, juvenile: 2, subadult: 3, adult: 3 },
  premoltCheckDays: 7,
  postMoltHoldDays: { sling: 4, juvenile: 7, subadult: 10, adult: 14 },
  waterEveryDays: 3,
  rebuildFactor: 0.5,
  rebuildDays: 56,
  offers: {
    sling: { preyType: 'cricket', preySize: 'pinhead', countMin: 1, countMax: 1 },
    juvenile: { preyType: 'cricket', preySize: 'small', countMin: 1, countMax: 2 },
    subadult: { preyType: 'cricket', preySize: 'medium', countMin: 1, countMax: 2 },
    adult: { preyType: 'cricket', preySize: 'large', countMin: 1, countMax: 3 },
  },
  tinySlingMm: 15,
};

/** The tiniest slings get fruit-fly larvae: prey no larger than the animal's body (R13). */
export const TINY_SLING_OFFER: Offer = { preyType: 'fruit-fly larvae', preySize: 'tiny', countMin: 1, countMax: 1 };

export type RulesOverride = {
  [K in keyof RoundRules]?: RoundRules[K] extends Record<string, unknown> ? Partial<RoundRules[K]> : RoundRules[K];
};

/** A collection's stored overrides laid over the defaults, key by key. */
export function effectiveRules(override: RulesOverride | null | undefined): RoundRules {
  const rules = structuredClone(DEFAULT_RULES) as unknown as Record<string, unknown>;
  for (const [key, value] of Object.entries(override ?? {})) {
    if (value === undefined) continue;
    const base = rules[key];
    rules[key] = base && typeof base === 'object' && typeof value === 'object' ? { ...base, ...value } : value;
  }
  return rules as unknown as RoundRules;
}

/** R1 interval for one animal: its own setting, else its group's, else its stage's. */
export function feedingInterval(
  rules: RoundRules,
  animal: { group: AnimalGroup; lifeStage: LifeStage; intervalDays?: number | null },
): number {
  return animal.intervalDays ?? rules.groupIntervalDays[animal.group] ?? rules.intervalDays[animal.lifeStage];
}
