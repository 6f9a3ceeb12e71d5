import type { AnimalGroup, LifeStage, Sex } from './animal-facts';
import type { EventKind } from './event-kinds';
import type { LocalDate } from './local-dates';

/**
 * How each group breeds, and so what Rackside records for a female and how the round treats
 * her. Values are the care-profile table's "breeding" column of the husbandry rules; common
 * practice, no published source unless a field says otherwise.
 */
export const BREEDING_MODES = [
  'egg_sac',
  'egg_case',
  'brood',
  'brooded_eggs',
  'substrate_eggs',
  'none',
] as const;
export type BreedingModeId = (typeof BREEDING_MODES)[number];

/** What the breeding page records: one row of `egg_sacs` each, told apart by this kind. */
export const BREEDING_RECORDS = ['egg_sac', 'egg_case', 'brood'] as const;
export type BreedingRecordKind = (typeof BREEDING_RECORDS)[number];

export interface BreedingMode {
  mode: BreedingModeId;
  /** The record a female of the group gets, or null when there is nothing to record. */
  record: BreedingRecordKind | null;
  /** The female guards it and is left alone while it lasts (R11, amended: water continues). */
  guarded: boolean;
  /** The usual window from laying (or birth) to hatching (or dispersal), in days. */
  window: { minDays: number; maxDays: number } | null;
  words: {
    /** "Egg sac", "Egg case", "Brood". */
    record: string;
    /** Lower case, inside sentences. */
    recordLower: string;
    /** Label of the date it began. */
    startedOn: string;
    /** What is counted when it is recorded ("Eggs", "Scorplings"), or null: nothing to count yet. */
    count: string | null;
    /** Her young, potted up one per pot ("slings", "nymphs", "scorplings"). */
    young: string;
  };
  /** Why nothing is recorded for this group (a sentence), when `record` is null. */
  noRecord: string | null;
}

const SAC_WORDS = {
  record: 'Egg sac',
  recordLower: 'egg sac',
  startedOn: 'Laid on',
  count: 'Eggs',
  young: 'slings',
};

const MODES: Record<AnimalGroup, BreedingMode> = {
  // Egg sac, guarded by the female until pulled or hatched. The window is the collection's own
  // (default 42–56 days, decision 009); null here means "use the collection's".
  tarantula: {
    mode: 'egg_sac',
    record: 'egg_sac',
    guarded: true,
    window: null,
    words: SAC_WORDS,
    noRecord: null,
  },
  true_spider: {
    mode: 'egg_sac',
    record: 'egg_sac',
    guarded: true,
    window: null,
    words: SAC_WORDS,
    noRecord: null,
  },
  // An ootheca: the female leaves it, it is incubated apart, ~4–8 weeks to a mass hatch.
  mantis: {
    mode: 'egg_case',
    record: 'egg_case',
    guarded: false,
    window: { minDays: 28, maxDays: 56 },
    words: {
      record: 'Egg case',
      recordLower: 'egg case',
      startedOn: 'Laid on',
      count: null,
      young: 'nymphs',
    },
    noRecord: null,
  },
  // Live birth: the scorplings ride on her back until their first molt, then disperse (about
  // 1–3 weeks, from memory).
  scorpion: {
    mode: 'brood',
    record: 'brood',
    guarded: true,
    window: { minDays: 7, maxDays: 21 },
    words: {
      record: 'Brood',
      recordLower: 'brood',
      startedOn: 'Born on',
      count: 'Scorplings',
      young: 'scorplings',
    },
    noRecord: null,
  },
  // She curls round her eggs, then the hatchlings, until they disperse (several weeks, from memory).
  centipede: {
    mode: 'brooded_eggs',
    record: 'brood',
    guarded: true,
    window: { minDays: 28, maxDays: 56 },
    words: {
      record: 'Brood',
      recordLower: 'brood',
      startedOn: 'Eggs laid on',
      count: 'Eggs',
      young: 'young',
    },
    noRecord: null,
  },
  beetle: {
    mode: 'substrate_eggs',
    record: null,
    guarded: false,
    window: null,
    words: {
      record: 'Eggs in substrate',
      recordLower: 'eggs in substrate',
      startedOn: 'Laid on',
      count: null,
      young: 'larvae',
    },
    noRecord:
      'Beetles lay their eggs in the substrate: there is no egg sac, egg case or brood to record.',
  },
  other: {
    mode: 'none',
    record: null,
    guarded: false,
    window: null,
    words: {
      record: 'None',
      recordLower: 'none',
      startedOn: 'Laid on',
      count: null,
      young: 'young',
    },
    noRecord:
      'Breeding records are kept for tarantulas, true spiders, scorpions, centipedes and mantids.',
  },
};

/** How a group breeds (pure). */
export function breedingModeOf(group: AnimalGroup): BreedingMode {
  return MODES[group];
}

/**
 * Why this animal cannot have a pairing or a sac, case or brood recorded — or null when she
 * can: only females (never a juvenile whose sex is not known yet) of groups that have one.
 */
export function breedingRefusal(animal: {
  name: string;
  sex: Sex;
  group: AnimalGroup;
}): string | null {
  const mode = breedingModeOf(animal.group);
  if (!mode.record) return mode.noRecord;
  if (animal.sex === 'male' || animal.sex === 'mature_male')
    return `${animal.name} is recorded as a male. Change the sex on the animal's page if that is wrong.`;
  if (animal.sex !== 'female')
    return `${animal.name}'s sex is not known yet. Record her as a female on the animal's page first.`;
  return null;
}

/** Whether she can have breeding records: the pickers list only these. */
export const canBreed = (animal: { name: string; sex: Sex; group: AnimalGroup }) =>
  breedingRefusal(animal) === null;

/**
 * Whether a pairing makes sense to offer: an adult female of a group that breeds. A sexed
 * juvenile or subadult female is not mature yet (she can be paired once she is recorded as adult).
 */
export const canPair = (animal: {
  name: string;
  sex: Sex;
  group: AnimalGroup;
  lifeStage: LifeStage;
}) => animal.lifeStage === 'adult' && canBreed(animal);

/** The short word in a default clutch name ("Juniper sac 2026-10-01"). */
export const RECORD_SHORT: Record<BreedingRecordKind, string> = {
  egg_sac: 'sac',
  egg_case: 'case',
  brood: 'brood',
};

export interface BreedingDates {
  kind: BreedingRecordKind;
  laidOn: LocalDate;
  pulledOn: LocalDate | null;
  hatchedOn: LocalDate | null;
  dispersedOn: LocalDate | null;
}

/**
 * The facts on the female's history that a record's dates stand for, each on the keeper's
 * date. A sac: laid, then pulled — or hatched with her when it was never pulled (either ends
 * her guarding and starts her rebuild, R8). An egg case: laid (she does not guard it). A
 * brood: begun, then dispersed.
 */
export function breedingFacts(record: BreedingDates): { kind: EventKind; date: LocalDate }[] {
  switch (record.kind) {
    case 'egg_sac':
      return [
        { kind: 'sac_laid', date: record.laidOn },
        ...(record.pulledOn
          ? [{ kind: 'sac_pulled' as const, date: record.pulledOn }]
          : record.hatchedOn
            ? [{ kind: 'sac_hatched' as const, date: record.hatchedOn }]
            : []),
      ];
    case 'egg_case':
      return [{ kind: 'case_laid', date: record.laidOn }];
    case 'brood':
      return [
        { kind: 'brood_started', date: record.laidOn },
        ...(record.dispersedOn
          ? [{ kind: 'brood_dispersed' as const, date: record.dispersedOn }]
          : []),
      ];
  }
}

/** Every kind `breedingFacts` can return. */
export const BREEDING_FACT_KINDS: readonly EventKind[] = [
  'sac_laid',
  'sac_pulled',
  'sac_hatched',
  'case_laid',
  'brood_started',
  'brood_dispersed',
];

/**
 * What is wrong with a record's dates, as a sentence, or null. Dates run laid → pulled,
 * hatched or dispersed, none after today; each kind has only its own end dates.
 */
export function breedingDatesProblem(
  record: BreedingDates,
  today: LocalDate,
  words: BreedingMode['words'],
): string | null {
  if (record.laidOn > today) return `${words.startedOn}: the date cannot be after today.`;
  if (record.kind !== 'egg_sac' && record.pulledOn)
    return `${words.record === 'Brood' ? 'A brood' : 'An egg case'} is not pulled: record when it ${record.kind === 'brood' ? 'dispersed' : 'hatched'}.`;
  if (record.kind !== 'brood' && record.dispersedOn)
    return `Only a brood disperses: record when the ${words.recordLower} ${record.kind === 'egg_sac' ? 'was pulled or ' : ''}hatched.`;
  for (const [what, date] of [
    ['Pulled', record.pulledOn],
    ['Hatched', record.hatchedOn],
    ['Dispersed', record.dispersedOn],
  ] as const) {
    if (!date) continue;
    if (date > today) return `${what} on: the date cannot be after today.`;
    if (date < record.laidOn)
      return `${what} on: the date cannot be before it was ${record.kind === 'brood' && words.startedOn === 'Born on' ? 'born' : 'laid'} (${record.laidOn}).`;
  }
  return null;
}

/** Still running: a sac not yet pulled or hatched, a case not hatched, a brood not dispersed. */
export function isOpenRecord(record: BreedingDates): boolean {
  if (record.kind === 'egg_sac') return !record.pulledOn && !record.hatchedOn;
  if (record.kind === 'egg_case') return !record.hatchedOn;
  return !record.dispersedOn;
}
