import { z } from 'zod';
import { ANIMAL_GROUPS, ANIMAL_STATUSES, DIETS, LIFE_STAGES, SEXES } from '../domain/animal-facts';
import { BREEDING_RECORDS } from '../domain/breeding';
import { EVENT_KINDS } from '../domain/event-kinds';
import './messages';

export const BACKUP_FORMAT = 'rackside-backup';
export const BACKUP_VERSION = 1;

const id = z.uuid();
const instant = z.iso.datetime({ offset: true });
const date = z.string().regex(/^\d{4}-\d{2}-\d{2}$/).nullable();

/**
 * A whole collection in one JSON file: its places, animals (photos inline, base64 WebP) and
 * every event, ids as they were. Accounts are not in it: people belong to a server.
 */
export const backupFile = z.object({
  format: z.literal(BACKUP_FORMAT, { message: 'This is not a Rackside backup file.' }),
  version: z.literal(BACKUP_VERSION, { message: `This backup was made by another version of Rackside (this one reads version ${BACKUP_VERSION}).` }),
  exportedAt: instant,
  collection: z.object({ name: z.string(), timeZone: z.string(), rules: z.record(z.string(), z.unknown()) }),
  locations: z.array(z.object({ id, room: z.string(), rack: z.string(), shelf: z.string(), position: z.string(), walkOrder: z.number().int() })),
  animals: z.array(
    z.object({
      id,
      labelCode: z.string(),
      name: z.string(),
      scientificName: z.string(),
      commonName: z.string().nullable(),
      group: z.enum(ANIMAL_GROUPS),
      lifeStage: z.enum(LIFE_STAGES),
      sex: z.enum(SEXES),
      sizeMm: z.number().nullable(),
      locationId: id.nullable(),
      hasWaterDish: z.boolean(),
      preyType: z.string().nullable(),
      preySize: z.string().nullable(),
      preyCount: z.number().int().nullable(),
      // Added with care profiles: backups made before it have no diet (the group's usual).
      diet: z.enum(DIETS).nullable().default(null),
      intervalDays: z.number().int().nullable(),
      doNotFeedUntil: date,
      cautions: z.array(z.string()),
      cautionNote: z.string().nullable(),
      status: z.enum(ANIMAL_STATUSES),
      statusDate: date,
      acquiredOn: date,
      source: z.string().nullable(),
      clutch: z.string().nullable(),
      notes: z.string().nullable(),
      settings: z.record(z.string(), z.unknown()),
      createdAt: instant,
      updatedAt: instant,
      photo: z.string().nullable(),
    }),
  ),
  /** Egg sacs, egg cases and broods (files made before they were kept have none). */
  eggSacs: z
    .array(
      z.object({
        id,
        femaleId: id,
        kind: z.enum(BREEDING_RECORDS),
        clutch: z.string(),
        laidOn: date.unwrap(),
        pulledOn: date,
        hatchedOn: date,
        dispersedOn: date,
        eggCount: z.number().int().nullable(),
        eggsWithLegs: z.number().int().nullable(),
        slingCount: z.number().int().nullable(),
        incubationMinDays: z.number().int(),
        incubationMaxDays: z.number().int(),
        notes: z.string().nullable(),
        createdAt: instant,
      }),
    )
    .default([]),
  events: z.array(
    z.object({
      id,
      animalId: id,
      kind: z.enum(EVENT_KINDS),
      payload: z.record(z.string(), z.unknown()),
      recordedBy: id.nullable(),
      deviceId: z.string().nullable(),
      clientRecordedAt: instant,
      clientSentAt: instant.nullable(),
      serverReceivedAt: instant,
      effectiveAt: instant,
      flags: z.array(z.string()),
      /** A molt's photo, base64 WebP, when there is one. */
      photo: z.string().nullable().optional(),
    }),
  ),
});
export type BackupFile = z.infer<typeof backupFile>;
