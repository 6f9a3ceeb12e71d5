import { z } from 'zod';
import { ANIMAL_GROUPS, CAUTIONS, LIFE_STAGES, SEXES } from '../domain/animal-facts';
import { EVENT_KINDS } from '../domain/event-kinds';
import { TASK_KINDS } from '../domain/rounds/build-round';
import { locationSummary } from './animals';

export const reason = z.object({ code: z.string(), text: z.string(), dates: z.array(z.string()) });
export const offer = z.object({
  preyType: z.string(),
  preySize: z.string(),
  countMin: z.number(),
  countMax: z.number(),
});

export const outcome = z.object({
  eventId: z.string(),
  kind: z.enum(EVENT_KINDS),
  at: z.string(),
  by: z.string().nullable(),
});
export type Outcome = z.infer<typeof outcome>;

export const roundTask = z.object({
  kind: z.enum(TASK_KINDS),
  reasons: z.array(reason),
  offer: offer.optional(),
  carriedOverDays: z.number(),
  /** The outcome that settled this task today, if any. */
  done: outcome.nullable(),
  /** Withdrawn by a hold that began during the day (R18): the reason shown in its place. */
  withdrawn: reason.nullable().optional(),
  /** The server's own withdrawal (a handover note, a keeper's hold, a late fact). */
  serverWithdrawn: reason.nullable().optional(),
});
export type RoundTaskView = z.infer<typeof roundTask>;

export const roundAnimal = z.object({
  id: z.string(),
  labelCode: z.string(),
  name: z.string(),
  scientificName: z.string(),
  group: z.enum(ANIMAL_GROUPS),
  lifeStage: z.enum(LIFE_STAGES),
  sex: z.enum(SEXES),
  cautions: z.array(z.enum(CAUTIONS)),
  location: locationSummary.nullable(),
});

export const roundItem = z.object({
  animal: roundAnimal,
  tasks: z.array(roundTask),
  notes: z.array(reason),
  carriedOverDays: z.number(),
  addedDuringDay: z.boolean(),
  outcomes: z.array(outcome),
  /** Plain-language warnings, e.g. two meals recorded on the same day by two people. */
  warnings: z.array(z.string()),
  /** Days of post-molt hold for this animal, so a molt tapped offline shows its end date. */
  postMoltHoldDays: z.number().int().optional(),
});
export type RoundItemView = z.infer<typeof roundItem>;

export const prepLine = z.object({
  preyType: z.string(),
  preySize: z.string(),
  countMin: z.number(),
  countMax: z.number(),
  animals: z.number(),
});
export type PrepLineView = z.infer<typeof prepLine>;

export const roundResponse = z.object({
  date: z.string(),
  timeZone: z.string(),
  /** null for a preview that is not built yet. */
  builtAt: z.string().nullable(),
  items: z.array(roundItem),
  prepList: z.array(prepLine),
  progress: z.object({ done: z.number(), total: z.number() }),
});
export type RoundResponse = z.infer<typeof roundResponse>;

export const scheduleResponse = z.object({
  date: z.string(),
  onRound: z.boolean(),
  tasks: z.array(roundTask.omit({ done: true, withdrawn: true, serverWithdrawn: true })),
  notes: z.array(reason),
  nextFeed: z.string().nullable(),
  nextWater: z.string().nullable(),
});
export type ScheduleResponse = z.infer<typeof scheduleResponse>;
