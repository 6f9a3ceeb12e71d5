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

export const LIFE_STAGES = ['sling', 'juvenile', 'subadult', 'adult'] as const;
export type LifeStage = (typeof LIFE_STAGES)[number];

export const SEXES = ['unknown', 'female', 'male', 'mature_male'] as const;
export type Sex = (typeof SEXES)[number];

export const ANIMAL_STATUSES = ['active', 'sold', 'deceased', 'rehomed', 'on_loan'] as const;
export type AnimalStatus = (typeof ANIMAL_STATUSES)[number];

export const CAUTIONS = ['potent_venom', 'urticating_hairs', 'fast_defensive', 'escape_risk'] as const;
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

export const STAGE_LABEL: Record<LifeStage, string> = {
  sling: 'Sling',
  juvenile: 'Juvenile',
  subadult: 'Subadult',
  adult: 'Adult',
};

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
};
