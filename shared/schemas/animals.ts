import { z } from 'zod';
import {
  ANIMAL_GROUPS,
  ANIMAL_STATUSES,
  CAUTIONS,
  DIETS,
  GROUP_LABEL,
  LIFE_STAGES,
  SEXES,
  stageFitsGroup,
  stageLabel,
  stagesOf,
  type AnimalGroup,
  type LifeStage,
} from '../domain/animal-facts';
import { isLabelCode, LABEL_ALPHABET, normaliseLabelCode } from '../domain/label-codes';
import { checkScientificName } from '../domain/scientific-name';
import { localDate } from './common';
import { careSettingsBody, dietSetting, enclosureCareDefaults } from './rules';

export const locationSummary = z.object({
  id: z.string(),
  room: z.string(),
  rack: z.string(),
  shelf: z.string(),
  position: z.string(),
  walkOrder: z.number().int(),
});
export type LocationSummary = z.infer<typeof locationSummary>;

/** A stored location row as the API shows it. */
export function toLocationSummary(l: LocationSummary | null): LocationSummary | null {
  return l
    ? {
        id: l.id,
        room: l.room,
        rack: l.rack,
        shelf: l.shelf,
        position: l.position,
        walkOrder: l.walkOrder,
      }
    : null;
}

export const animalSummary = z.object({
  id: z.string(),
  labelCode: z.string(),
  name: z.string(),
  scientificName: z.string(),
  commonName: z.string().nullable(),
  group: z.enum(ANIMAL_GROUPS),
  lifeStage: z.enum(LIFE_STAGES),
  sex: z.enum(SEXES),
  sizeMm: z.number().nullable(),
  status: z.enum(ANIMAL_STATUSES),
  cautions: z.array(z.enum(CAUTIONS)),
  location: locationSummary.nullable(),
  hasWaterDish: z.boolean(),
  intervalDays: z.number().nullable(),
  mistEveryDays: z.number().nullable(),
  moistenEveryDays: z.number().nullable(),
  spotCleanEveryDays: z.number().nullable(),
  enclosureLengthMm: z.number().nullable(),
  enclosureWidthMm: z.number().nullable(),
  enclosureHeightMm: z.number().nullable(),
  preyType: z.string().nullable(),
  preySize: z.string().nullable(),
  preyCount: z.number().nullable(),
  diet: z.enum(DIETS).nullable(),
  doNotFeedUntil: z.string().nullable(),
  statusDate: z.string().nullable(),
  acquiredOn: z.string().nullable(),
  source: z.string().nullable(),
  cautionNote: z.string().nullable(),
  notes: z.string().nullable(),
  clutch: z.string().nullable(),
  /** Changes whenever the photo does (ISO), so its URL does too; null without a photo. */
  photoVersion: z.string().nullable(),
  /** When the animal was added to the collection (ISO). */
  addedAt: z.string(),
});
export type AnimalSummary = z.infer<typeof animalSummary>;

/** The cautions' custom text, e.g. "Bolts upward when the lid opens". */
export const CAUTION_NOTE_MAX = 200;

const optionalText = (max: number, what: string) =>
  z
    .string()
    .trim()
    .max(max, { message: `${what} can be at most ${max} characters.` })
    .transform((s) => (s === '' ? null : s))
    .nullable();

export const scientificName = z
  .string()
  .trim()
  .max(120, { message: 'The scientific name can be at most 120 characters.' })
  .superRefine((name, ctx) => {
    const check = checkScientificName(name);
    if (!check.ok) {
      ctx.addIssue({
        code: 'custom',
        message: check.suggestion
          ? `${check.problems[0]} Did you mean “${check.suggestion}”?`
          : check.problems[0]!,
      });
    }
  });

/**
 * "A mantis has no larva stage: choose Nymph L1–L3, …" — or null when the stage fits the group
 * (docs/care-rules.md § Stages).
 */
export function stageProblem(group: AnimalGroup, stage: LifeStage): string | null {
  if (stageFitsGroup(group, stage)) return null;
  const choices = stagesOf(group).map((s) => stageLabel(group, s));
  return `${GROUP_LABEL[group]}: there is no “${stageLabel(group, stage)}” stage. Choose ${choices.slice(0, -1).join(', ')} or ${choices.at(-1)}.`;
}

/** Checks that the life stage is one the group has; added to every schema built from the fields. */
export function checkStageFitsGroup(
  value: { group: AnimalGroup; lifeStage: LifeStage },
  ctx: z.RefinementCtx,
) {
  const problem = stageProblem(value.group, value.lifeStage);
  if (problem) ctx.addIssue({ code: 'custom', message: problem, path: ['lifeStage'] });
}

/**
 * An animal's fields without the cross-field checks, for schemas built from them (the CSV row);
 * add `checkStageFitsGroup` to any schema made from it.
 */
export const animalFields = z.object({
  labelCode: z
    .string()
    .trim()
    .transform((s) => normaliseLabelCode(s))
    .refine((s) => s === '' || isLabelCode(s), {
      message: `Label codes look like NL-7K3: 2–4 characters, a dash, 3–5 characters, from ${LABEL_ALPHABET}.`,
    })
    .optional(),
  name: z
    .string()
    .trim()
    .min(1, { message: 'Give the animal a name or a short tag.' })
    .max(80, { message: 'Keep the name under 80 characters.' }),
  scientificName,
  commonName: optionalText(80, 'The common name'),
  group: z.enum(ANIMAL_GROUPS, { message: 'Choose a group.' }),
  lifeStage: z.enum(LIFE_STAGES, { message: 'Choose a life stage.' }),
  sex: z.enum(SEXES, { message: 'Choose a sex (or unknown).' }),
  sizeMm: z
    .number({ message: 'Give the size as a number.' })
    .positive({ message: 'The size must be above 0.' })
    .max(400, { message: 'That is larger than any invertebrate we know (400 mm at most).' })
    .nullable(),
  acquiredOn: localDate.nullable(),
  source: optionalText(200, 'The source'),
  locationId: z.uuid({ message: 'Choose a place from the list.' }).nullable(),
  cautions: z
    .array(z.enum(CAUTIONS))
    .max(CAUTIONS.length)
    .refine((c) => new Set(c).size === c.length, { message: 'Each caution once.' }),
  cautionNote: optionalText(CAUTION_NOTE_MAX, 'The caution note'),
  notes: optionalText(4000, 'Notes'),
  clutch: optionalText(80, 'The clutch name'),
  care: careSettingsBody
    .required()
    .extend({ diet: dietSetting.default(null), ...enclosureCareDefaults }),
});

/** What a keeper enters for an animal; the label code is drawn when left empty. */
export const animalInput = animalFields.superRefine(checkStageFitsGroup);
export type AnimalInput = z.input<typeof animalInput>;
export type AnimalValues = z.output<typeof animalInput>;

export const RETIRED_STATUSES = ANIMAL_STATUSES.filter((s) => s !== 'active');
export const retireBody = z.object({
  status: z.enum(RETIRED_STATUSES as ['sold', 'deceased', 'rehomed', 'on_loan'], {
    message: 'Choose sold, deceased, rehomed or on loan.',
  }),
  date: localDate,
  note: optionalText(500, 'The note'),
});
export type RetireBody = z.input<typeof retireBody>;

export const moveBody = z.object({
  animalIds: z
    .array(z.uuid({ message: 'This id is not valid.' }))
    .min(1, { message: 'Choose at least one animal.' })
    .max(5000),
  locationId: z.uuid({ message: 'Choose a place from the list.' }),
  /** Into a new enclosure (not just a new place on the rack): starts a settling period (R16). */
  rehoused: z.boolean({ message: 'Say yes or no: a new enclosure?' }).optional(),
});
export type MoveBody = z.infer<typeof moveBody>;

export const animalListResponse = z.object({ animals: z.array(animalSummary) });
export type AnimalListResponse = z.infer<typeof animalListResponse>;
export const moveResponse = z.object({ moved: z.number().int() });
/** A new photo's version, which its URL carries. */
export const photoSavedResponse = z.object({ photoVersion: z.string() });
