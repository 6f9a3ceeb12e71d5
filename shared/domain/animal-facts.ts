export const ANIMAL_GROUPS = [
  'tarantula',
  'true_spider',
  'centipede',
  'scorpion',
  'mantis',
  'beetle',
  'other',
] as const;
export type AnimalGroup = (typeof ANIMAL_GROUPS)[number];

/**
 * Life stages in growth order. Each group uses some of them, under its own names (see
 * GROUP_STAGES): a mantis "sling" is a nymph L1–L3, a scorpion "first instar" rides on its
 * mother. docs/care-rules.md § Stages.
 */
export const LIFE_STAGES = [
  'first_instar',
  'sling',
  'larva',
  'juvenile',
  'subadult',
  'pupa',
  'adult',
] as const;
export type LifeStage = (typeof LIFE_STAGES)[number];

export const SEXES = ['unknown', 'female', 'male', 'mature_male'] as const;
export type Sex = (typeof SEXES)[number];

export const ANIMAL_STATUSES = ['active', 'sold', 'deceased', 'rehomed', 'on_loan'] as const;
export type AnimalStatus = (typeof ANIMAL_STATUSES)[number];

export const CAUTIONS = [
  'potent_venom',
  'urticating_hairs',
  'fast_defensive',
  'escape_risk',
  'sting',
] as const;
export type Caution = (typeof CAUTIONS)[number];

export const GROUP_LABEL: Record<AnimalGroup, string> = {
  tarantula: 'Tarantula',
  true_spider: 'True spider',
  centipede: 'Centipede',
  scorpion: 'Scorpion',
  mantis: 'Mantis',
  beetle: 'Beetle',
  other: 'Other',
};

/** Stage names where the group is not known (counts across groups, old records). */
export const STAGE_LABEL: Record<LifeStage, string> = {
  first_instar: 'First instar',
  sling: 'Sling',
  larva: 'Larva',
  juvenile: 'Juvenile',
  subadult: 'Subadult',
  pupa: 'Pupa',
  adult: 'Adult',
};

/**
 * The stages each group has, in growth order, with the group's own name for each
 * (docs/care-rules.md § Stages). A stage missing here does not fit the group.
 */
export const GROUP_STAGES: Record<AnimalGroup, Partial<Record<LifeStage, string>>> = {
  tarantula: {
    first_instar: 'First instar (eggs with legs)',
    sling: 'Sling',
    juvenile: 'Juvenile',
    subadult: 'Subadult',
    adult: 'Adult',
  },
  true_spider: { sling: 'Spiderling', juvenile: 'Juvenile', adult: 'Adult' },
  centipede: { juvenile: 'Juvenile', subadult: 'Subadult', adult: 'Adult' },
  scorpion: {
    first_instar: 'Scorpling on its mother',
    juvenile: 'Juvenile',
    subadult: 'Subadult',
    adult: 'Adult',
  },
  mantis: { sling: 'Nymph L1–L3', juvenile: 'Nymph L4+', subadult: 'Subadult', adult: 'Adult' },
  beetle: { larva: 'Larva', pupa: 'Pupa', adult: 'Adult' },
  other: {
    first_instar: 'First stage (not feeding)',
    sling: 'Young',
    larva: 'Larva',
    juvenile: 'Juvenile',
    subadult: 'Subadult',
    pupa: 'Pupa',
    adult: 'Adult',
  },
};

/** The stages a group has, in growth order. */
export function stagesOf(group: AnimalGroup): LifeStage[] {
  return LIFE_STAGES.filter((s) => GROUP_STAGES[group][s] !== undefined);
}

export function stageFitsGroup(group: AnimalGroup, stage: LifeStage): boolean {
  return GROUP_STAGES[group][stage] !== undefined;
}

/** "Nymph L1–L3" for a mantis sling; the generic name when the stage does not fit the group. */
export function stageLabel(group: AnimalGroup, stage: LifeStage): string {
  return GROUP_STAGES[group][stage] ?? STAGE_LABEL[stage];
}

export const STATUS_LABEL: Record<AnimalStatus, string> = {
  active: 'Kept',
  sold: 'Sold',
  deceased: 'Deceased',
  rehomed: 'Rehomed',
  on_loan: 'On loan',
};

export const SEX_LABEL: Record<Sex, string> = {
  unknown: 'Sex unknown',
  female: 'Female',
  male: 'Male',
  mature_male: 'Mature male',
};

export const CAUTION_LABEL: Record<Caution, string> = {
  potent_venom: 'Potent venom',
  urticating_hairs: 'Urticating hairs',
  fast_defensive: 'Fast or defensive',
  escape_risk: 'Escape risk',
  sting: 'Sting',
};

/**
 * What an animal eats when its stage is fed "by diet" (beetle adults, other invertebrates):
 * it decides the food task. docs/care-rules.md § Diets.
 */
export const DIETS = ['live_prey', 'fruit_jelly', 'plant', 'detritus'] as const;
export type Diet = (typeof DIETS)[number];

export const DIET_LABEL: Record<Diet, string> = {
  live_prey: 'Live prey',
  fruit_jelly: 'Fruit or beetle jelly',
  plant: 'Fresh plant food',
  detritus: 'Leaf litter and rotting wood',
};
