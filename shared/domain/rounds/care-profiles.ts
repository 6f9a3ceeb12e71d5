import type { AnimalGroup, Caution, Diet, LifeStage, Sex } from '../animal-facts';

/**
 * Care profiles by group and stage: what each kind of animal eats at each stage, how often,
 * how it drinks, and what it is never offered. Every value and its source is in
 * docs/care-rules.md § Care profiles; the section of each value is named beside it.
 *
 * Two parts: GROUP_CARE holds the biology (fixed: what a stage eats, whether adults molt),
 * DEFAULT_PROFILES holds the numbers a collection may change through its rules.
 */

/** What to offer: prey type, size name, how many. */
export interface Offer {
  preyType: string;
  preySize: string;
  countMin: number;
  countMax: number;
}

/**
 * What a stage eats. `prey`: live prey on a feeding interval (R1–R5, R13). `diet`: by the
 * animal's diet setting. `substrate`: beetle larvae eat their substrate, checked and topped up.
 * `none`: not fed at this stage (first instars, scorplings on the mother, pupae).
 */
export type StageFood = 'prey' | 'diet' | 'substrate' | 'none';

/** How an animal without a water dish is kept hydrated (R7). */
export const HYDRATIONS = ['moisten', 'mist', 'none'] as const;
export type Hydration = (typeof HYDRATIONS)[number];

export interface GroupCare {
  /** The food of each of the group's stages (docs/care-rules.md § Stages). */
  food: Partial<Record<LifeStage, StageFood>>;
  /** Whether adults still molt: if not, an adult's refusals never mean premolt (R17). */
  adultsMolt: boolean;
  /** The diet of a `diet` stage when the animal has none of its own. */
  defaultDiet: Diet;
  /** Cautions ticked for a new animal of the group (the keeper may untick them). */
  newAnimalCautions: readonly Caution[];
  /** Whether a new animal of the group starts with a water dish. */
  newAnimalHasDish: boolean;
  /** A dish is not enough: part of the substrate is kept damp too (centipedes). */
  dampSubstrate: boolean;
}

/** docs/care-rules.md § Care profiles — the fixed part. */
export const GROUP_CARE: Record<AnimalGroup, GroupCare> = {
  tarantula: {
    food: {
      first_instar: 'none',
      sling: 'prey',
      juvenile: 'prey',
      subadult: 'prey',
      adult: 'prey',
    },
    adultsMolt: true, // females molt for life; mature males do not (R17)
    defaultDiet: 'live_prey',
    newAnimalCautions: [],
    newAnimalHasDish: false,
    dampSubstrate: false,
  },
  true_spider: {
    food: { sling: 'prey', juvenile: 'prey', adult: 'prey' },
    adultsMolt: false,
    defaultDiet: 'live_prey',
    newAnimalCautions: [],
    newAnimalHasDish: false,
    dampSubstrate: false,
  },
  centipede: {
    food: { juvenile: 'prey', subadult: 'prey', adult: 'prey' },
    adultsMolt: true,
    defaultDiet: 'live_prey',
    newAnimalCautions: ['potent_venom', 'fast_defensive', 'escape_risk'],
    newAnimalHasDish: true,
    dampSubstrate: true,
  },
  scorpion: {
    food: { first_instar: 'none', juvenile: 'prey', subadult: 'prey', adult: 'prey' },
    adultsMolt: false,
    defaultDiet: 'live_prey',
    newAnimalCautions: ['sting'],
    newAnimalHasDish: false,
    dampSubstrate: false,
  },
  mantis: {
    food: { sling: 'prey', juvenile: 'prey', subadult: 'prey', adult: 'prey' },
    adultsMolt: false,
    defaultDiet: 'live_prey',
    newAnimalCautions: [],
    newAnimalHasDish: false,
    dampSubstrate: false,
  },
  beetle: {
    food: { larva: 'substrate', pupa: 'none', adult: 'diet' },
    adultsMolt: false,
    defaultDiet: 'fruit_jelly',
    newAnimalCautions: [],
    newAnimalHasDish: false,
    dampSubstrate: false,
  },
  other: {
    food: {
      first_instar: 'none',
      sling: 'diet',
      larva: 'diet',
      juvenile: 'diet',
      subadult: 'diet',
      pupa: 'none',
      adult: 'diet',
    },
    adultsMolt: true,
    defaultDiet: 'live_prey',
    newAnimalCautions: [],
    newAnimalHasDish: false,
    dampSubstrate: false,
  },
};

/** The numbers for one stage that is offered food (R1, R2, R3, R5, R13). */
export interface StageCare {
  /** R1: feed again this many days after the last meal (live prey). */
  feedEveryDays: number;
  /** R2: after a refusal, offer again after this many days. */
  refusalRetryDays: number;
  /** R3: this many refusals in a row flag a possible premolt. */
  refusalStreak: number;
  /** R5: no food for this many days after a molt. */
  postMoltHoldDays: number;
  /** R13: what to offer when the animal has no setting of its own. */
  offer: Offer;
}

/** The numbers of one group a collection may change. */
export interface CareProfile {
  /** Only the stages that are offered food (`prey` or `diet`). */
  stages: Partial<Record<LifeStage, StageCare>>;
  /** R7: without a dish, the substrate is moistened or the enclosure misted… */
  hydration: Hydration;
  /** … this often … */
  hydrateEveryDays: number;
  /** … for animals smaller than this (mm), or all sizes when null. */
  hydrateBelowMm: number | null;
  /** § Enclosure care: a spot-clean every N days (null: none on a schedule). */
  spotCleanEveryDays: number | null;
}

const stage = (
  feedEveryDays: number,
  refusalRetryDays: number,
  refusalStreak: number,
  postMoltHoldDays: number,
  offer: [preyType: string, preySize: string, countMin: number, countMax: number],
): StageCare => ({
  feedEveryDays,
  refusalRetryDays,
  refusalStreak,
  postMoltHoldDays,
  offer: { preyType: offer[0], preySize: offer[1], countMin: offer[2], countMax: offer[3] },
});

/** docs/care-rules.md § Care profiles — the numbers, each with its source there. */
export const DEFAULT_PROFILES: Record<AnimalGroup, CareProfile> = {
  tarantula: {
    stages: {
      sling: stage(3, 2, 2, 4, ['cricket', 'pinhead', 1, 1]),
      juvenile: stage(6, 3, 2, 7, ['cricket', 'small', 1, 2]),
      subadult: stage(9, 4, 3, 10, ['cricket', 'medium', 1, 2]),
      adult: stage(12, 7, 3, 14, ['cricket', 'large', 1, 3]),
    },
    hydration: 'moisten',
    hydrateEveryDays: 4,
    hydrateBelowMm: 75,
    spotCleanEveryDays: 14,
  },
  true_spider: {
    stages: {
      sling: stage(2, 1, 2, 2, ['fruit flies', 'flightless', 2, 4]),
      juvenile: stage(4, 2, 2, 3, ['cricket', 'small', 1, 2]),
      adult: stage(6, 3, 3, 5, ['cricket', 'medium', 1, 2]),
    },
    hydration: 'mist',
    hydrateEveryDays: 2,
    hydrateBelowMm: null,
    spotCleanEveryDays: 14,
  },
  centipede: {
    stages: {
      juvenile: stage(5, 3, 2, 5, ['cricket', 'small', 1, 2]),
      subadult: stage(6, 3, 3, 5, ['cricket', 'medium', 1, 2]),
      adult: stage(7, 4, 3, 5, ['roach', 'medium nymph', 1, 3]),
    },
    hydration: 'moisten',
    hydrateEveryDays: 3,
    hydrateBelowMm: null,
    spotCleanEveryDays: 10,
  },
  scorpion: {
    stages: {
      juvenile: stage(6, 3, 2, 5, ['cricket', 'small', 1, 2]),
      subadult: stage(9, 4, 3, 7, ['cricket', 'medium', 1, 2]),
      adult: stage(10, 7, 3, 10, ['cricket', 'large', 1, 3]),
    },
    hydration: 'mist',
    hydrateEveryDays: 4,
    hydrateBelowMm: null,
    spotCleanEveryDays: 14,
  },
  mantis: {
    stages: {
      sling: stage(2, 1, 2, 1, ['fruit flies', 'flightless', 3, 6]),
      juvenile: stage(3, 1, 2, 2, ['cricket', 'small', 1, 3]),
      subadult: stage(3, 2, 2, 2, ['cricket', 'medium', 1, 3]),
      adult: stage(4, 2, 3, 2, ['cricket', 'large', 1, 3]),
    },
    hydration: 'mist',
    hydrateEveryDays: 2,
    hydrateBelowMm: null,
    spotCleanEveryDays: 7,
  },
  beetle: {
    stages: {
      adult: stage(4, 3, 3, 0, ['cricket', 'small', 1, 2]),
    },
    hydration: 'mist',
    hydrateEveryDays: 3,
    hydrateBelowMm: null,
    spotCleanEveryDays: 14,
  },
  other: {
    stages: {
      sling: stage(4, 2, 2, 3, ['fruit flies', 'flightless', 2, 4]),
      larva: stage(7, 3, 3, 3, ['cricket', 'small', 1, 2]),
      juvenile: stage(7, 3, 3, 3, ['cricket', 'small', 1, 2]),
      subadult: stage(7, 4, 3, 3, ['cricket', 'medium', 1, 2]),
      adult: stage(7, 4, 3, 3, ['cricket', 'medium', 1, 3]),
    },
    hydration: 'none',
    hydrateEveryDays: 3,
    hydrateBelowMm: null,
    spotCleanEveryDays: 14,
  },
};

/** What a `diet` stage is given when the diet is not live prey (docs/care-rules.md § Diets). */
export const DIET_FOOD: Record<Exclude<Diet, 'live_prey'>, Offer> = {
  fruit_jelly: { preyType: 'fruit or jelly', preySize: 'fresh', countMin: 1, countMax: 1 },
  plant: { preyType: 'plant food', preySize: 'fresh', countMin: 1, countMax: 1 },
  detritus: { preyType: 'leaf litter', preySize: 'handful', countMin: 1, countMax: 1 },
};

/** What an animal eats today, resolved from its group, stage and diet. */
export type Food = 'prey' | Exclude<Diet, 'live_prey'> | 'substrate' | 'none';

export interface CareAnimal {
  group: AnimalGroup;
  lifeStage: LifeStage;
  sex?: Sex;
  diet?: Diet | null;
}

/** The food of an animal's stage; a stage that does not fit the group is fed as live prey. */
export function foodOf(animal: CareAnimal): Food {
  const care = GROUP_CARE[animal.group];
  const food = care.food[animal.lifeStage] ?? 'prey';
  if (food !== 'diet') return food;
  const diet = animal.diet ?? care.defaultDiet;
  return diet === 'live_prey' ? 'prey' : diet;
}

/**
 * R3 and R17: whether this animal's refusals can mean a molt is coming. A mature male never
 * molts again; adults of groups whose adults do not molt neither.
 */
export function canMolt(animal: CareAnimal): boolean {
  if (animal.sex === 'mature_male') return false;
  return animal.lifeStage !== 'adult' || GROUP_CARE[animal.group].adultsMolt;
}
