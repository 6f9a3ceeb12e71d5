import { z } from 'zod';
import {
  ANIMAL_GROUPS,
  ANIMAL_STATUSES,
  CAUTIONS,
  DIETS,
  LIFE_STAGES,
  SEXES,
} from '../domain/animal-facts';
import { EVENT_KINDS } from '../domain/event-kinds';
import type { AnimalState } from '../domain/rounds/animal-state';
import { TASK_KINDS, type EngineAnimal } from '../domain/rounds/build-round';
import type { RulesOverride } from '../domain/rounds/rules';
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

/** An animal as the round engine reads it (docs/care-rules.md): no notes, photos or history. */
export const engineAnimal = roundAnimal.extend({
  sizeMm: z.number().nullable(),
  status: z.enum(ANIMAL_STATUSES),
  hasWaterDish: z.boolean(),
  intervalDays: z.number().nullable(),
  preyType: z.string().nullable(),
  preySize: z.string().nullable(),
  preyCount: z.number().nullable(),
  diet: z.enum(DIETS).nullable().optional(),
  doNotFeedUntil: z.string().nullable(),
  doNotFeedBy: z.enum(['keeper', 'handover']).optional(),
  addedOn: z.string().nullable(),
  mistEveryDays: z.number().nullable().optional(),
  moistenEveryDays: z.number().nullable().optional(),
  spotCleanEveryDays: z.number().nullable().optional(),
  enclosureLengthMm: z.number().nullable().optional(),
  enclosureWidthMm: z.number().nullable().optional(),
  enclosureHeightMm: z.number().nullable().optional(),
}) satisfies z.ZodType<EngineAnimal>;

/** Only the fields the engine reads, so the phone's copy stays small (issue 22's budget). */
export function engineAnimalOf(a: EngineAnimal): EngineAnimal {
  const { id, labelCode, name, scientificName, group, lifeStage, sex, sizeMm, status } = a;
  const { cautions, location, hasWaterDish, intervalDays, preyType, preySize, preyCount } = a;
  const { diet, doNotFeedUntil, doNotFeedBy, addedOn } = a;
  const { mistEveryDays, moistenEveryDays, spotCleanEveryDays } = a;
  const { enclosureLengthMm, enclosureWidthMm, enclosureHeightMm } = a;
  return {
    id,
    labelCode,
    name,
    scientificName,
    group,
    lifeStage,
    sex,
    sizeMm,
    status,
    cautions,
    location: location ?? null,
    hasWaterDish,
    intervalDays,
    preyType,
    preySize,
    preyCount,
    diet: diet ?? null,
    doNotFeedUntil,
    ...(doNotFeedBy ? { doNotFeedBy } : {}),
    addedOn,
    mistEveryDays: mistEveryDays ?? null,
    moistenEveryDays: moistenEveryDays ?? null,
    spotCleanEveryDays: spotCleanEveryDays ?? null,
    enclosureLengthMm: enclosureLengthMm ?? null,
    enclosureWidthMm: enclosureWidthMm ?? null,
    enclosureHeightMm: enclosureHeightMm ?? null,
  };
}

const localDay = z.string().nullable();
/** The engine's per-animal state, as the server projects it (animal-state.ts). */
export const animalState = z.object({
  lastMeal: localDay,
  refusalStreak: z.number().int(),
  lastRefusal: localDay,
  lastMolt: localDay,
  premoltSince: localDay,
  leaveAlone: z
    .object({
      reason: z.enum(['molting', 'guarding_sac', 'guarding_brood']),
      since: z.string(),
    })
    .nullable(),
  preyLeftIn: z.object({ since: z.string(), preyType: z.string().nullable() }).nullable(),
  lastWatered: localDay,
  rebuildSince: localDay,
  rebuildReason: z
    .enum(['sac_pulled', 'sac_hatched', 'brood_dispersed', 'paired', 'keeper'])
    .nullable(),
  lastObserved: localDay,
  lastSkipped: localDay,
  // Projections stored before this field existed lack it (animal-state.ts).
  rehousedOn: localDay.default(null),
  lastMisted: localDay.optional(),
  lastMoistened: localDay.optional(),
  lastSpotCleaned: localDay.optional(),
  lastRehoused: localDay.optional(),
  lastEventAt: z.string().nullable(),
  lastEventId: z.string().nullable(),
}) satisfies z.ZodType<AnimalState, unknown>;

/**
 * What a phone keeps to build a day's round itself with no signal: every active animal with
 * its state as of `asOf`, the collection's zone, and its rules as stored (merged with the
 * defaults on the phone by the same `effectiveRules` the server uses).
 */
export const engineInputResponse = z.object({
  collectionId: z.string(),
  timeZone: z.string(),
  /** The collection's local date when the server answered. */
  date: z.string(),
  asOf: z.string(),
  rules: z.custom<RulesOverride>((v) => typeof v === 'object' && v !== null && !Array.isArray(v)),
  animals: z.array(z.object({ animal: engineAnimal, state: animalState })),
});
export type EngineInputResponse = z.infer<typeof engineInputResponse>;
