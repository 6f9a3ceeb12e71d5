import { z } from 'zod';
import { ANIMAL_GROUPS } from '../domain/animal-facts';
import { BREEDING_RECORDS } from '../domain/breeding';
import { localDate, uuid } from './common';
import { placePart } from './locations';

const days = z
  .number()
  .int()
  .min(7, { message: 'At least 7 days.' })
  .max(400, { message: 'At most 400 days.' });
const count = (what: string) =>
  z
    .number()
    .int()
    .min(0, { message: `${what} cannot be negative.` })
    .max(5000, { message: `${what}: 5,000 at most.` })
    .nullable();
const notes = z
  .string()
  .trim()
  .max(2000, { message: 'Keep notes under 2,000 characters.' })
  .nullable();

export const incubationBody = z
  .object({ minDays: days, maxDays: days })
  .refine((d) => d.maxDays >= d.minDays, {
    message: 'The longest wait cannot be shorter than the shortest.',
    path: ['maxDays'],
  });

/**
 * A sac, egg case or brood: which one follows the female's group (`breedingModeOf`). `laidOn`
 * is the day it was laid, or a scorpion's brood was born; a brood's young count as slings.
 */
export const eggSacBody = z.object({
  femaleId: uuid,
  laidOn: localDate,
  clutch: z
    .string()
    .trim()
    .max(80, { message: 'Keep the clutch name under 80 characters.' })
    .optional(),
  incubation: incubationBody.optional(),
  eggCount: count('Eggs').optional(),
  slingCount: count('Young').optional(),
  notes: notes.optional(),
});
export type EggSacBody = z.input<typeof eggSacBody>;

export const eggSacChange = z.object({
  laidOn: localDate.optional(),
  pulledOn: localDate.nullable().optional(),
  hatchedOn: localDate.nullable().optional(),
  dispersedOn: localDate.nullable().optional(),
  eggCount: count('Eggs').optional(),
  eggsWithLegs: count('Eggs with legs').optional(),
  slingCount: count('Slings').optional(),
  incubation: incubationBody.optional(),
  notes: notes.optional(),
});
export type EggSacChange = z.input<typeof eggSacChange>;

export const MAX_SLINGS_AT_ONCE = 500;
export const slingsBody = z.object({
  count: z
    .number()
    .int()
    .min(1, { message: 'Create at least one sling.' })
    .max(MAX_SLINGS_AT_ONCE, { message: `At most ${MAX_SLINGS_AT_ONCE} at once.` }),
  namePrefix: z
    .string()
    .trim()
    .min(1, { message: 'Give the slings a name to number, e.g. “Formosus”.' })
    .max(60),
  room: placePart('room'),
  rack: placePart('rack'),
  shelf: placePart('shelf'),
  firstPosition: z.number().int().min(1, { message: 'Positions start at 1.' }).max(10_000),
});
export type SlingsBody = z.input<typeof slingsBody>;

export const eggSacView = z.object({
  id: z.string(),
  /** Egg sac, egg case or brood: after the female's group. */
  kind: z.enum(BREEDING_RECORDS),
  femaleId: z.string(),
  femaleName: z.string(),
  femaleGroup: z.enum(ANIMAL_GROUPS),
  clutch: z.string(),
  laidOn: z.string(),
  pulledOn: z.string().nullable(),
  hatchedOn: z.string().nullable(),
  dispersedOn: z.string().nullable(),
  eggCount: z.number().nullable(),
  eggsWithLegs: z.number().nullable(),
  slingCount: z.number().nullable(),
  incubationMinDays: z.number(),
  incubationMaxDays: z.number(),
  /** When to expect to pull it, see it hatch or the brood disperse: laid + the window. */
  expectedFrom: z.string(),
  expectedTo: z.string(),
  notes: z.string().nullable(),
  slingsCreated: z.number(),
});
export type EggSacView = z.infer<typeof eggSacView>;
export const eggSacListResponse = z.object({ sacs: z.array(eggSacView) });
export const slingsCreatedResponse = z.object({ animalIds: z.array(z.string()) });
