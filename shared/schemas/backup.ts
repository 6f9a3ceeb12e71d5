import { z } from 'zod';
import { ANIMAL_STATUSES } from '../domain/animal-facts';
import { MAX_BACKUP_PHOTO_CHARS } from '../domain/backup-limits';
import { BREEDING_RECORDS } from '../domain/breeding';
import { targetsProblem } from '../domain/climate/ranges';
import { upgradeOverride, type RulesOverride } from '../domain/rounds/rules';
import { animalInput } from './animals';
import { accountDetails } from './auth';
import { checkChoreCare, CHORE_SUBJECT_KINDS, type ChoreSubjectKind } from './chores';
import { roomTargets, roomTargetsBody } from './climate';
import { colonyInput, colonyIntervals, STOCK_REASONS } from './colonies';
import { localDate, timeZone, uuid } from './common';
import { EVENT_PAYLOADS, eventBatchBody, eventKind } from './events';
import { locationInput } from './locations';
import { celsius, relativeHumidity } from './measures';
import { careSettingsBody, dietSetting, enclosureCareDefaults, rulesOverride } from './rules';
import {
  buyerBody,
  currencyCode,
  INVOICE_STATUSES,
  SALE_STATUSES,
  salesSettingsBody,
  shippingConcernView,
  TAX_ROUNDINGS,
} from './sales';
import './messages';

export const BACKUP_FORMAT = 'rackside-backup';
/**
 * Version 2 added feeder colonies, their stock history, chores, room targets and climate
 * readings. A version-1 file (without them) still restores; the version went up so that a server
 * that reads only version 1 refuses a newer file rather than silently dropping those lists.
 * Version 3 added sales (sales settings, buyers, listings, sales with their animals, invoices
 * with their lines, payments): older files restore with none.
 */
export const BACKUP_VERSION = 3;
export const READABLE_BACKUP_VERSIONS = [1, 2, 3] as const;

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
 * collection, locations, animals, eggSacs, events, colonies, colonyStockChanges, chores,
 * roomTargets, climateReadings, salesSettings, buyers, saleListings, sales, invoices, payments
 * (the order the server writes them; a restore reads places before
 * the animals in them, animals before their sacs and their history, colonies before their stock
 * history). Every record is
 * checked with the schemas the API uses for the same thing, so a restore can store nothing
 * the app itself would refuse.
 */

export const backupHeader = {
  format: z.literal(BACKUP_FORMAT, { message: 'This is not a Rackside backup file.' }),
  version: z.literal(READABLE_BACKUP_VERSIONS, {
    message: `This backup was made by another version of Rackside (this one reads versions ${READABLE_BACKUP_VERSIONS.join(' to ')}).`,
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

// --- Version 2: feeder colonies, their stock history and chores; room targets and readings.
// Each list may be missing (a version-1 file): a restore then has none of them to add.

/** A count as stored: rounds put prey back on an undo, so it may pass what a count update allows. */
const storedCount = z
  .number()
  .int({ message: 'Give the count as a whole number.' })
  .min(0, { message: 'A count cannot be below zero.' })
  .max(10_000_000, { message: 'This count is larger than any colony holds.' });
const sizeName = colonyInput.shape.sizes.element;

/** A feeder colony with its stock (the sizes it holds, in the keeper's order). */
export const backupColony = z.object({
  id: uuid,
  name: colonyInput.shape.name,
  species: colonyInput.shape.species,
  preyType: colonyInput.shape.preyType,
  intervals: colonyIntervals,
  stock: z
    .array(
      z.object({
        preySize: sizeName,
        count: storedCount,
        position: z.number().int().min(0).max(1000),
      }),
    )
    .max(100, { message: 'A colony holds at most 100 sizes.' }),
  createdAt: instant,
  updatedAt: instant,
});
export type BackupColony = z.input<typeof backupColony>;

/** One change of a colony's stock; `sourceEventId` names the round's event that caused it. */
export const backupStockChange = z.object({
  id: uuid,
  colonyId: uuid,
  preySize: sizeName,
  delta: z.number().int().min(-10_000_000).max(10_000_000),
  after: storedCount,
  reason: z.enum(STOCK_REASONS, { message: 'Choose count, round, split or correction.' }),
  sourceEventId: uuid.nullable(),
  note: z.string().max(300, { message: 'Keep the note under 300 characters.' }).nullable(),
  at: instant,
});
export type BackupStockChange = z.input<typeof backupStockChange>;

/**
 * A chore. Its subject id is text: a colony's is the colony's uuid (remapped with the colony on
 * restore); another kind's (a room's name) is kept as it is.
 */
export const backupChore = z
  .object({
    id: uuid,
    subjectKind: z.enum(CHORE_SUBJECT_KINDS as [ChoreSubjectKind, ...ChoreSubjectKind[]], {
      message: `A chore is for one of: ${CHORE_SUBJECT_KINDS.join(', ')}.`,
    }),
    subjectId: z
      .string()
      .min(1, { message: 'Every chore names what it was done for.' })
      .max(100, { message: 'Keep what a chore was done for under 100 characters.' }),
    kind: z.string().min(1).max(40),
    payload: z.record(z.string(), z.unknown()),
    recordedBy: uuid.nullable(),
    deviceId: z.string().max(100).nullable(),
    clientRecordedAt: instant,
    serverReceivedAt: instant,
    effectiveAt: instant,
  })
  .superRefine((chore, ctx) => {
    // The care kind and payload as the chores API checks them for the same subject kind.
    if (chore.subjectKind === 'colony' && !uuid.safeParse(chore.subjectId).success)
      ctx.addIssue({
        code: 'custom',
        path: ['subjectId'],
        message: 'A colony’s chore names the colony by its id.',
      });
    checkChoreCare(chore, ctx);
  });
export type BackupChore = z.input<typeof backupChore>;

/** A room's target range, checked as the targets screen checks it. */
export const backupRoomTargets = z
  .object({ room: roomTargetsBody.shape.room, ...roomTargets.shape, updatedAt: instant })
  .superRefine((t, ctx) => {
    const problem = targetsProblem(t);
    if (problem) ctx.addIssue({ code: 'custom', message: problem });
  });
export type BackupRoomTargets = z.input<typeof backupRoomTargets>;

/** A reading typed on the round or imported from a logger's file. */
export const backupReading = z
  .object({
    id: uuid,
    room: roomTargetsBody.shape.room,
    takenAt: instant,
    currentCelsius: celsius.nullable(),
    minCelsius: celsius.nullable(),
    maxCelsius: celsius.nullable(),
    humidity: relativeHumidity.nullable(),
    source: z.enum(['typed', 'logger'], { message: 'A reading is typed or from a logger.' }),
    recordedBy: uuid.nullable(),
    createdAt: instant,
  })
  .refine(
    (r) =>
      r.currentCelsius !== null ||
      r.minCelsius !== null ||
      r.maxCelsius !== null ||
      r.humidity !== null,
    { message: 'A reading needs a temperature or the humidity.' },
  );
export type BackupReading = z.input<typeof backupReading>;

// --- Version 3 (sales — S): what a keeper sells, to whom, invoiced and paid. Helpers never see
// a backup (owners only), so buyers' details travel in it like the rest of the collection.

const minor = z
  .number()
  .int({ message: 'Give amounts as whole minor units.' })
  .min(0, { message: 'An amount cannot be negative.' })
  .max(10 ** 12, { message: 'That amount is too large.' });
const shortText = (max: number) => z.string().max(max).nullable();

/** The collection's sales settings (one element at most). The public list's link is not kept. */
export const backupSalesSettings = z
  .object({
    ...salesSettingsBody.shape,
    availabilityOn: z.boolean(),
    availabilityColumns: z.array(z.string().max(40)).max(20),
    availabilityNote: z.string().max(2000),
    nextInvoiceNumber: z.number().int().min(1).max(1_000_000),
    updatedAt: instant,
  })
  .refine((x) => x.safeMinC < x.safeMaxC, {
    message: 'The lowest safe temperature must be below the highest.',
    path: ['safeMaxC'],
  });
export type BackupSalesSettings = z.input<typeof backupSalesSettings>;

export const backupBuyer = z.object({
  id: uuid,
  name: buyerBody.shape.name,
  email: z.email({ message: 'This e-mail address is not valid.' }).max(254).nullable(),
  phone: shortText(40),
  address: shortText(500),
  notes: shortText(1000),
  createdAt: instant,
  updatedAt: instant,
});
export type BackupBuyer = z.input<typeof backupBuyer>;

export const backupListing = z.object({
  animalId: uuid,
  priceMinor: minor,
  currency: currencyCode,
  description: z.string().max(2000),
  listedPublicly: z.boolean(),
  listedAt: instant,
  updatedAt: instant,
});
export type BackupListing = z.input<typeof backupListing>;

/** A sale with its animals at the agreed price (released ones included: history). */
export const backupSale = z.object({
  id: uuid,
  buyerId: uuid,
  status: z.enum(SALE_STATUSES, { message: 'A sale is reserved, shipped, expired or cancelled.' }),
  reservedUntil: localDate,
  note: shortText(500),
  shipOn: localDate.nullable(),
  shipRoute: shortText(200),
  forecastLowC: celsius.nullable(),
  forecastHighC: celsius.nullable(),
  shipCheckConfirmedAt: instant.nullable(),
  shipCheckConcerns: z.array(shippingConcernView).nullable(),
  packing: z.record(z.string(), z.boolean()),
  carrier: shortText(80),
  tracking: shortText(120),
  shippedAt: instant.nullable(),
  endedAt: instant.nullable(),
  createdAt: instant,
  updatedAt: instant,
  animals: z
    .array(
      z.object({
        animalId: uuid,
        priceMinor: minor,
        currency: currencyCode,
        releasedAt: instant.nullable(),
      }),
    )
    .min(1, { message: 'A sale has at least one animal.' })
    .max(1000),
});
export type BackupSale = z.input<typeof backupSale>;

/** An invoice as issued, with its lines. The payment service's session is not kept. */
export const backupInvoice = z.object({
  id: uuid,
  saleId: uuid,
  number: z.string().min(1).max(20),
  currency: currencyCode,
  taxRateBp: z.number().int().min(0).max(10_000),
  taxRounding: z.enum(TAX_ROUNDINGS),
  shippingMinor: minor,
  subtotalMinor: minor,
  taxMinor: minor,
  totalMinor: minor,
  paidMinor: minor,
  refundedMinor: minor,
  status: z.enum(INVOICE_STATUSES),
  issuedOn: localDate,
  dueOn: localDate.nullable(),
  emailedAt: instant.nullable(),
  cancelledAt: instant.nullable(),
  createdAt: instant,
  updatedAt: instant,
  lines: z
    .array(
      z.object({
        position: z.number().int().min(1).max(10_000),
        animalId: uuid.nullable(),
        description: z.string().min(1).max(300),
        quantity: z.number().int().min(1).max(100_000),
        unitMinor: minor,
        netMinor: minor,
        taxMinor: minor,
      }),
    )
    .max(2000),
});
export type BackupInvoice = z.input<typeof backupInvoice>;

export const backupPayment = z.object({
  id: uuid,
  invoiceId: uuid,
  kind: z.enum(['payment', 'refund'], { message: 'A payment or a refund.' }),
  amountMinor: minor.min(1),
  currency: currencyCode,
  providerRef: z.string().min(1).max(200),
  at: instant,
});
export type BackupPayment = z.input<typeof backupPayment>;
