import { z } from 'zod';
import {
  ANIMAL_GROUPS,
  DIETS,
  LIFE_STAGES,
  stageLabel,
  type AnimalGroup,
  type LifeStage,
} from '../domain/animal-facts';
import { DEFAULT_PROFILES, HYDRATIONS } from '../domain/rounds/care-profiles';
import type { RoundRules, RulesOverride } from '../domain/rounds/rules';
import { localDate } from './common';

const days = (min: number, max: number, what: string) =>
  z
    .number({ message: `${what} must be a number of days.` })
    .int({ message: `${what} must be a whole number of days.` })
    .min(min, { message: `${what} must be at least ${min} day${min === 1 ? '' : 's'}.` })
    .max(max, { message: `${what} can be at most ${max} days.` });

const GROUP_WORD: Record<AnimalGroup, string> = {
  tarantula: 'tarantula',
  true_spider: 'true spider',
  centipede: 'centipede',
  scorpion: 'scorpion',
  mantis: 'mantis',
  beetle: 'beetle',
  other: 'other',
};

export const offerSchema = z
  .object({
    preyType: z
      .string()
      .trim()
      .min(1, { message: 'Name the prey.' })
      .max(40, { message: 'Keep the prey name under 40 characters.' }),
    preySize: z
      .string()
      .trim()
      .min(1, { message: 'Give a prey size.' })
      .max(20, { message: 'Keep the size under 20 characters.' }),
    countMin: z
      .number({ message: 'Give a number.' })
      .int({ message: 'Give a whole number.' })
      .min(1, { message: 'Offer at least one.' })
      .max(20, { message: 'At most 20 at a time.' }),
    countMax: z
      .number({ message: 'Give a number.' })
      .int({ message: 'Give a whole number.' })
      .min(1, { message: 'Offer at least one.' })
      .max(20, { message: 'At most 20 at a time.' }),
  })
  .refine((o) => o.countMin <= o.countMax, {
    message: 'The smallest count cannot be larger than the largest.',
    path: ['countMax'],
  });

/** The numbers of one fed stage of one group (docs/care-rules.md § Care profiles). */
function stageOverride(group: AnimalGroup, stage: LifeStage) {
  const label = stageLabel(group, stage);
  const name = `The ${GROUP_WORD[group]} ${label.charAt(0).toLowerCase()}${label.slice(1)}`;
  return z
    .object({
      feedEveryDays: days(1, 90, `${name} interval`),
      refusalRetryDays: days(1, 60, `${name} retry wait`),
      refusalStreak: z
        .number({ message: `${name} refusal streak must be a number.` })
        .int({ message: `${name} refusal streak must be a whole number.` })
        .min(1, { message: `${name} refusal streak must be at least 1.` })
        .max(10, { message: `${name} refusal streak can be at most 10.` }),
      postMoltHoldDays: days(0, 60, `${name} post-molt hold`),
      offer: offerSchema,
    })
    .partial()
    .strict();
}

/** One group's profile: only the stages that group feeds can be changed. */
function profileOverride(group: AnimalGroup) {
  const stages = Object.keys(DEFAULT_PROFILES[group].stages) as LifeStage[];
  const word = GROUP_WORD[group];
  return z
    .object({
      stages: z
        .object(Object.fromEntries(stages.map((s) => [s, stageOverride(group, s).optional()])))
        .strict(),
      hydration: z.enum(HYDRATIONS, { message: 'Choose moisten, mist or none.' }),
      hydrateEveryDays: days(1, 30, `Watering ${word}s without a dish`),
      hydrateBelowMm: z
        .number({ message: 'Give the size in mm, or leave it empty for every size.' })
        .min(1, { message: 'The size must be at least 1 mm.' })
        .max(400, { message: 'The size can be at most 400 mm.' })
        .nullable(),
      spotCleanEveryDays: days(1, 90, `Spot-cleaning ${word}s`).nullable(),
    })
    .partial()
    .strict();
}

/** R19: one size of one feeder the collection keeps. */
export const feederSchema = z
  .object({
    preyType: z
      .string()
      .trim()
      .min(1, { message: 'Name the prey.' })
      .max(40, { message: 'Keep the prey name under 40 characters.' }),
    preySize: z
      .string()
      .trim()
      .min(1, { message: 'Give a size name.' })
      .max(20, { message: 'Keep the size under 20 characters.' }),
    lengthMm: z
      .number({ message: 'Give the length in mm.' })
      .positive({ message: 'The length must be more than 0 mm.' })
      .max(200, { message: 'The length can be at most 200 mm.' }),
  })
  .strict();

const feeders = z
  .array(feederSchema)
  .max(60, { message: 'Keep the catalogue to 60 sizes at most.' })
  .superRefine((list, ctx) => {
    const seen = new Set<string>();
    list.forEach((f, i) => {
      const key = `${f.preyType.toLowerCase()}|${f.preySize.toLowerCase()}`;
      if (seen.has(key))
        ctx.addIssue({
          code: 'custom',
          message: `“${f.preySize} ${f.preyType}” is in the catalogue twice.`,
          path: [i, 'preySize'],
        });
      seen.add(key);
    });
  });

/** R22: how many times the animal's size an enclosure's floor or height must be. */
const spans = (what: string) =>
  z
    .number({ message: `The ${what} rule must be a number (times the animal's size).` })
    .min(1, { message: `The ${what} rule must be at least 1× the animal's size.` })
    .max(6, { message: `The ${what} rule can be at most 6× the animal's size.` });

/** A collection's changes to the default rules; every key optional, every value bounded. */
export const rulesOverride = z
  .object({
    profiles: z
      .object(Object.fromEntries(ANIMAL_GROUPS.map((g) => [g, profileOverride(g).optional()])))
      .strict(),
    premoltCheckDays: days(1, 30, 'The premolt check'),
    waterEveryDays: days(1, 30, 'Watering'),
    rebuildFactor: z
      .number({ message: 'The rebuild factor must be a number.' })
      .min(0.1, { message: 'The rebuild factor must be at least 0.1.' })
      .max(1, { message: 'The rebuild factor can be at most 1 (no change).' }),
    rebuildDays: days(0, 365, 'The rebuild period'),
    settlingDays: days(0, 30, 'The settling period'),
    preyStayCheckDays: days(1, 14, 'The check on prey left in'),
    dietEveryDays: z
      .object({
        fruit_jelly: days(1, 30, 'Replacing fruit or jelly').optional(),
        plant: days(1, 30, 'Replacing plant food').optional(),
        detritus: days(1, 60, 'Adding leaf litter').optional(),
      })
      .strict(),
    substrateCheckDays: days(1, 120, 'The larva substrate check'),
    spanToBody: z
      .number({ message: 'The body share of the leg span must be a number.' })
      .min(0.2, { message: 'The body share of the leg span must be at least 0.2.' })
      .max(0.6, { message: 'The body share of the leg span can be at most 0.6.' }),
    tinySlingMm: z
      .number({ message: 'The tiny sling size must be a number.' })
      .min(1, { message: 'The tiny sling size must be at least 1 mm.' })
      .max(100, { message: 'The tiny sling size can be at most 100 mm.' }),
    feeders,
    bolusAfterDays: days(0, 7, 'Picking out a bolus after a meal'),
    rehouseFloorSpans: spans('floor'),
    rehouseHeightSpans: spans('height'),
  })
  .partial()
  .strict();
export type RulesOverrideBody = z.infer<typeof rulesOverride>;

/** What an animal fed "by diet" eats (beetle adults, other invertebrates); null: its group's usual. */
export const dietSetting = z
  .enum(DIETS, { message: 'Choose live prey, fruit or jelly, plant food or leaf litter.' })
  .nullable();

/** § Enclosure care: an animal's own "every N days"; 0 turns the task off, null follows the profile. */
const ownEvery = (what: string) =>
  z
    .number({ message: `${what}: give a number of days, 0 for never, or leave it empty.` })
    .int({ message: `${what}: give whole days.` })
    .min(0, { message: `${what}: 0 (never) at least.` })
    .max(90, { message: `${what}: every 90 days at most.` })
    .nullable();
/** The inside of its enclosure in mm (R22). */
const enclosureSide = (what: string) =>
  z
    .number({ message: `The enclosure ${what} must be a number of mm.` })
    .int({ message: `Give the enclosure ${what} in whole mm.` })
    .min(10, { message: `The enclosure ${what} must be at least 10 mm.` })
    .max(3000, { message: `The enclosure ${what} must be under 3,000 mm.` })
    .nullable();

/** Enclosure care settings: each optional in a body, null (the profile's, or not measured) when absent. */
export const enclosureCareSettings = {
  mistEveryDays: ownEvery('Misting'),
  moistenEveryDays: ownEvery('Moistening the substrate'),
  spotCleanEveryDays: ownEvery('Spot-cleaning'),
  enclosureLengthMm: enclosureSide('length'),
  enclosureWidthMm: enclosureSide('width'),
  enclosureHeightMm: enclosureSide('height'),
};

/** Per-animal care settings the engine honours; null clears a setting. */
export const careSettingsBody = z
  .object({
    intervalDays: days(1, 90, 'The interval').nullable(),
    preyType: z.string().trim().min(1).max(40).nullable(),
    preySize: z.string().trim().min(1).max(20).nullable(),
    preyCount: z
      .number()
      .int()
      .min(1, { message: 'Offer at least one.' })
      .max(20, { message: 'At most 20 at a time.' })
      .nullable(),
    diet: dietSetting,
    hasWaterDish: z.boolean(),
    doNotFeedUntil: localDate.nullable(),
    ...enclosureCareSettings,
  })
  .partial()
  .strict();
export type CareSettingsBody = z.infer<typeof careSettingsBody>;

/** The enclosure care settings with null when absent (records and files made before them). */
export const enclosureCareDefaults = Object.fromEntries(
  Object.entries(enclosureCareSettings).map(([k, v]) => [k, v.default(null)]),
) as { [K in keyof typeof enclosureCareSettings]: z.ZodDefault<(typeof enclosureCareSettings)[K]> };

/** A collection's rules in full, as the server works them out (the answer, not a body: no bounds). */
const offerShown = z.object({
  preyType: z.string(),
  preySize: z.string(),
  countMin: z.number(),
  countMax: z.number(),
});
const roundRules: z.ZodType<RoundRules> = z.object({
  profiles: z.record(
    z.enum(ANIMAL_GROUPS),
    z.object({
      stages: z.partialRecord(
        z.enum(LIFE_STAGES),
        z.object({
          feedEveryDays: z.number(),
          refusalRetryDays: z.number(),
          refusalStreak: z.number(),
          postMoltHoldDays: z.number(),
          offer: offerShown,
        }),
      ),
      hydration: z.enum(HYDRATIONS),
      hydrateEveryDays: z.number(),
      hydrateBelowMm: z.number().nullable(),
      spotCleanEveryDays: z.number().nullable(),
    }),
  ),
  premoltCheckDays: z.number(),
  waterEveryDays: z.number(),
  rebuildFactor: z.number(),
  rebuildDays: z.number(),
  settlingDays: z.number(),
  preyStayCheckDays: z.number(),
  dietEveryDays: z.object({ fruit_jelly: z.number(), plant: z.number(), detritus: z.number() }),
  substrateCheckDays: z.number(),
  spanToBody: z.number(),
  tinySlingMm: z.number(),
  feeders: z.array(z.object({ preyType: z.string(), preySize: z.string(), lengthMm: z.number() })),
  bolusAfterDays: z.number(),
  rehouseFloorSpans: z.number(),
  rehouseHeightSpans: z.number(),
});

export const rulesResponse = z.object({
  rules: roundRules,
  defaults: roundRules,
  /** As stored: overrides saved before care profiles keep their older keys (`upgradeOverride`). */
  overrides: z.custom<RulesOverride>(
    (v) => typeof v === 'object' && v !== null && !Array.isArray(v),
  ),
});
export type RulesResponse = z.infer<typeof rulesResponse>;
