import { z } from 'zod';
import { LIFE_STAGES } from '../domain/animal-facts';
import { localDate } from './common';

const days = (min: number, max: number, what: string) =>
  z
    .number({ message: `${what} must be a number of days.` })
    .int({ message: `${what} must be a whole number of days.` })
    .min(min, { message: `${what} must be at least ${min} day${min === 1 ? '' : 's'}.` })
    .max(max, { message: `${what} can be at most ${max} days.` });

const byStage = (schema: (stage: string) => z.ZodType<number>) =>
  z.object(Object.fromEntries(LIFE_STAGES.map((s) => [s, schema(s).optional()]))).strict();

const offer = z
  .object({
    preyType: z.string().trim().min(1, { message: 'Name the prey.' }).max(40),
    preySize: z.string().trim().min(1, { message: 'Give a prey size.' }).max(20),
    countMin: z.number().int().min(1, { message: 'Offer at least one.' }).max(20),
    countMax: z.number().int().min(1).max(20, { message: 'At most 20 at a time.' }),
  })
  .refine((o) => o.countMin <= o.countMax, { message: 'The smallest count cannot be larger than the largest.', path: ['countMax'] });

/** A collection's changes to the default rules; every key optional, every value bounded. */
export const rulesOverride = z
  .object({
    intervalDays: byStage((s) => days(1, 90, `The ${s} interval`)),
    groupIntervalDays: z
      .object({
        centipede: days(1, 90, 'The centipede interval').optional(),
        scorpion: days(1, 90, 'The scorpion interval').optional(),
        mantis: days(1, 90, 'The mantis interval').optional(),
        true_spider: days(1, 90, 'The true spider interval').optional(),
        beetle: days(1, 90, 'The beetle interval').optional(),
        other: days(1, 90, 'The interval').optional(),
      })
      .strict(),
    refusalRetryDays: byStage((s) => days(1, 60, `The ${s} retry wait`)),
    refusalStreak: byStage((s) =>
      z.number().int().min(1, { message: `The ${s} refusal streak must be at least 1.` }).max(10, { message: `The ${s} refusal streak can be at most 10.` }),
    ),
    premoltCheckDays: days(1, 30, 'The premolt check'),
    postMoltHoldDays: byStage((s) => days(0, 60, `The ${s} post-molt hold`)),
    waterEveryDays: days(1, 30, 'Watering'),
    rebuildFactor: z.number().min(0.1, { message: 'The rebuild factor must be at least 0.1.' }).max(1, { message: 'The rebuild factor can be at most 1 (no change).' }),
    rebuildDays: days(0, 365, 'The rebuild period'),
    offers: z.object(Object.fromEntries(LIFE_STAGES.map((s) => [s, offer.optional()]))).strict(),
    tinySlingMm: z.number().min(1).max(100),
  })
  .partial()
  .strict();
export type RulesOverrideBody = z.infer<typeof rulesOverride>;

/** Per-animal care settings the engine honours; null clears a setting. */
export const careSettingsBody = z
  .object({
    intervalDays: days(1, 90, 'The interval').nullable(),
    preyType: z.string().trim().min(1).max(40).nullable(),
    preySize: z.string().trim().min(1).max(20).nullable(),
    preyCount: z.number().int().min(1, { message: 'Offer at least one.' }).max(20, { message: 'At most 20 at a time.' }).nullable(),
    hasWaterDish: z.boolean(),
    doNotFeedUntil: localDate.nullable(),
  })
  .partial()
  .strict();
export type CareSettingsBody = z.infer<typeof careSettingsBody>;
