import { z } from 'zod';
import { ANIMAL_STATUSES } from '../domain/animal-facts';
import { MAX_BACKUP_PHOTO_CHARS } from '../domain/backup-limits';
import { BREEDING_RECORDS } from '../domain/breeding';
import { upgradeOverride, type RulesOverride } from '../domain/rounds/rules';
import { animalInput } from './animals';
import { accountDetails } from './auth';
import { localDate, timeZone, uuid } from './common';
import { EVENT_PAYLOADS, eventBatchBody, eventKind } from './events';
import { locationInput } from './locations';
import { careSettingsBody, dietSetting, enclosureCareDefaults, rulesOverride } from './rules';
import './messages';

export const BACKUP_FORMAT = 'rackside-backup';
export const BACKUP_VERSION = 1;

const instant = z.iso.datetime({
  offset: true,
  message: 'Give a date and time such as 2026-12-02T09:30:00Z.',
});

const photo = z
  .string()
  .max(MAX_BACKUP_PHOTO_CHARS, { message: 'This photo is larger than any Rackside keeps (10 MB).' })
  .regex(/^[A-Za-z0-9+/]*={0,2}$/, { message: 'This photo is not written as base64 text.' })
  .nullable();

/*
 * A backup is one JSON object whose members come in this order: format, version, exportedAt,
 * collection, locations, animals, eggSacs, events (the order the server writes them; a restore
 * reads places before the animals in them, animals before their sacs and their history). Every record is
 * checked with the schemas the API uses for the same thing, so a restore can store nothing
 * the app itself would refuse.
 */

export const backupHeader = {
  format: z.literal(BACKUP_FORMAT, { message: 'This is not a Rackside backup file.' }),
  version: z.literal(BACKUP_VERSION, {
    message: `This backup was made by another version of Rackside (this one reads version ${BACKUP_VERSION}).`,
  }),
  exportedAt: instant,
};

export const backupCollection = z.object({
  name: accountDetails.shape.collectionName,
  timeZone,
  // A backup made before care profiles holds rules in the older shape: read as the app reads them.
  rules: z.preprocess(
    (rules) =>
      rules && typeof rules === 'object' ? upgradeOverride(rules as RulesOverride) : rules,
    rulesOverride,
  ),
});

export const backupPlace = locationInput.extend({
  id: uuid,
  walkOrder: z
    .number()
    .int()
    .min(0, { message: 'The walk order cannot be below 0.' })
    .max(1_000_000_000),
});
export type BackupPlace = z.input<typeof backupPlace>;

const { labelCode, care: _care, ...entered } = animalInput.shape;
const care = careSettingsBody.required().shape;

export const backupAnimal = z.object({
  id: uuid,
  labelCode: labelCode
    .unwrap()
    .refine((code) => code !== '', { message: 'Every animal in a backup needs its label code.' }),
  ...entered,
  ...care,
  // Added with care profiles: backups made before it have no diet (the group's usual).
  diet: dietSetting.default(null),
  // Added with enclosure care: older backups have none (the profile's, not measured).
  ...enclosureCareDefaults,
  status: z.enum(ANIMAL_STATUSES, { message: 'Choose kept, sold, deceased, rehomed or on loan.' }),
  statusDate: localDate.nullable(),
  // Per-animal rule overrides: the same shape as a collection's.
  settings: rulesOverride,
  createdAt: instant,
  updatedAt: instant,
  photo,
});
export type BackupAnimal = z.input<typeof backupAnimal>;

/** An egg sac, egg case or brood (files made before they were kept have none). */
export const backupEggSac = z.object({
  id: uuid,
  femaleId: uuid,
  kind: z.enum(BREEDING_RECORDS, { message: 'Choose an egg sac, an egg case or a brood.' }),
  clutch: z
    .string()
    .trim()
    .min(1, { message: 'Every record needs its clutch name.' })
    .max(80, { message: 'Keep the clutch name under 80 characters.' }),
  laidOn: localDate,
  pulledOn: localDate.nullable(),
  hatchedOn: localDate.nullable(),
  dispersedOn: localDate.nullable(),
  eggCount: z.number().int().min(0).max(5000).nullable(),
  eggsWithLegs: z.number().int().min(0).max(5000).nullable(),
  slingCount: z.number().int().min(0).max(5000).nullable(),
  incubationMinDays: z.number().int().min(1).max(365),
  incubationMaxDays: z.number().int().min(1).max(365),
  notes: z.string().max(2000).nullable(),
  createdAt: instant,
});
export type BackupEggSac = z.input<typeof backupEggSac>;

export const backupEvent = z
  .object({
    id: uuid,
    animalId: uuid,
    kind: eventKind,
    payload: z.record(z.string(), z.unknown()),
    recordedBy: uuid.nullable(),
    deviceId: eventBatchBody.shape.deviceId.nullable(),
    clientRecordedAt: instant,
    clientSentAt: instant.nullable(),
    serverReceivedAt: instant,
    effectiveAt: instant,
    // Marks the server adds (clock corrections and the like): short words, stored as a list.
    flags: z
      .array(
        z
          .string()
          .regex(/^[a-z_]{1,40}$/, { message: 'A flag is a short word such as clock_corrected.' }),
      )
      .max(10),
    /** A molt's photo, base64 WebP, when there is one. */
    photo: photo.optional(),
  })
  .superRefine((event, ctx) => {
    // The payload as the API checks it for the same kind (server-made moves and status
    // changes included: a backup holds those too).
    const result = EVENT_PAYLOADS[event.kind].safeParse(event.payload);
    if (!result.success) {
      for (const issue of result.error.issues)
        ctx.addIssue({
          code: 'custom',
          path: ['payload', ...issue.path.map(String)],
          message: issue.message,
        });
    }
    if (event.photo && event.kind !== 'molted')
      ctx.addIssue({ code: 'custom', path: ['photo'], message: 'Only a molt can have a photo.' });
  });
export type BackupEvent = z.input<typeof backupEvent>;
