import {
  boolean,
  date,
  doublePrecision,
  index,
  integer,
  jsonb,
  pgEnum,
  pgTable,
  text,
  timestamp,
  unique,
  uuid,
} from 'drizzle-orm/pg-core';
import {
  ANIMAL_GROUPS,
  ANIMAL_STATUSES,
  DIETS,
  LIFE_STAGES,
  SEXES,
} from '#shared/domain/animal-facts';
import { BREEDING_RECORDS } from '#shared/domain/breeding';
import { HELPER_REPORT_KINDS } from '#shared/domain/helper-reports';
import { collections, locations } from './collections';
import { users } from './users';

export const groupEnum = pgEnum('animal_group', ANIMAL_GROUPS);
export const stageEnum = pgEnum('life_stage', LIFE_STAGES);
export const sexEnum = pgEnum('animal_sex', SEXES);
export const statusEnum = pgEnum('animal_status', ANIMAL_STATUSES);
export const breedingRecordEnum = pgEnum('breeding_record', BREEDING_RECORDS);
export const dietEnum = pgEnum('animal_diet', DIETS);

export const animals = pgTable(
  'animals',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    collectionId: uuid('collection_id')
      .notNull()
      .references(() => collections.id, { onDelete: 'cascade' }),
    labelCode: text('label_code').notNull(),
    name: text('name').notNull(),
    scientificName: text('scientific_name').notNull(),
    commonName: text('common_name'),
    group: groupEnum('group').notNull(),
    lifeStage: stageEnum('life_stage').notNull(),
    sex: sexEnum('sex').notNull().default('unknown'),
    sizeMm: doublePrecision('size_mm'),
    locationId: uuid('location_id').references(() => locations.id, { onDelete: 'set null' }),
    hasWaterDish: boolean('has_water_dish').notNull().default(false),
    preyType: text('prey_type'),
    preySize: text('prey_size'),
    preyCount: integer('prey_count'),
    // What a stage fed "by diet" eats (beetle adults, other); null: the group's usual diet.
    diet: dietEnum('diet'),
    intervalDays: integer('interval_days'),
    // Enclosure care (docs/care-rules.md § Enclosure care): the animal's own "every N days";
    // 0 is never, null follows its care profile.
    mistEveryDays: integer('mist_every_days'),
    moistenEveryDays: integer('moisten_every_days'),
    spotCleanEveryDays: integer('spot_clean_every_days'),
    // Inside of its enclosure in mm (R22); height only for an arboreal set-up.
    enclosureLengthMm: integer('enclosure_length_mm'),
    enclosureWidthMm: integer('enclosure_width_mm'),
    enclosureHeightMm: integer('enclosure_height_mm'),
    doNotFeedUntil: date('do_not_feed_until'),
    cautions: text('cautions').array().notNull().default([]),
    cautionNote: text('caution_note'),
    status: statusEnum('status').notNull().default('active'),
    statusDate: date('status_date'),
    acquiredOn: date('acquired_on'),
    source: text('source'),
    // The animal's photo: files named by this key in the storage folder (never by the upload's name).
    photoKey: text('photo_key'),
    photoUpdatedAt: timestamp('photo_updated_at', { withTimezone: true }),
    // Slings potted up from one egg sac share a clutch name, so their labels print together.
    clutch: text('clutch'),
    notes: text('notes'),
    // Per-animal rule overrides (same shape as collection rules, subset).
    settings: jsonb('settings').notNull().default({}),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    unique('animals_collection_label').on(t.collectionId, t.labelCode),
    index('animals_collection_idx').on(t.collectionId),
  ],
);

export const events = pgTable(
  'events',
  {
    // Generated on the device, so a re-sent event is recognised and never stored twice.
    id: uuid('id').primaryKey(),
    collectionId: uuid('collection_id')
      .notNull()
      .references(() => collections.id, { onDelete: 'cascade' }),
    animalId: uuid('animal_id')
      .notNull()
      .references(() => animals.id, { onDelete: 'cascade' }),
    kind: text('kind').notNull(),
    payload: jsonb('payload').notNull().default({}),
    recordedBy: uuid('recorded_by').references(() => users.id, { onDelete: 'set null' }),
    deviceId: text('device_id'),
    clientRecordedAt: timestamp('client_recorded_at', { withTimezone: true }).notNull(),
    clientSentAt: timestamp('client_sent_at', { withTimezone: true }),
    serverReceivedAt: timestamp('server_received_at', { withTimezone: true })
      .notNull()
      .defaultNow(),
    effectiveAt: timestamp('effective_at', { withTimezone: true }).notNull(),
    flags: text('flags').array().notNull().default([]),
  },
  (t) => [
    index('events_animal_time_idx').on(t.animalId, t.effectiveAt),
    index('events_collection_time_idx').on(t.collectionId, t.effectiveAt),
  ],
);

/** Notes for whoever covers: about one animal, shown until a date; optionally "do not feed". */
export const handoverNotes = pgTable(
  'handover_notes',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    collectionId: uuid('collection_id')
      .notNull()
      .references(() => collections.id, { onDelete: 'cascade' }),
    animalId: uuid('animal_id')
      .notNull()
      .references(() => animals.id, { onDelete: 'cascade' }),
    text: text('text').notNull(),
    // Local date, inclusive: the last day the note (and a "do not feed") applies.
    until: date('until').notNull(),
    doNotFeed: boolean('do_not_feed').notNull().default(false),
    createdBy: uuid('created_by').references(() => users.id, { onDelete: 'set null' }),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index('handover_notes_collection_idx').on(t.collectionId, t.until)],
);

/**
 * An egg sac (or a mantis's egg case, or a scorpion's or centipede's brood — `kind`, after the
 * female's group): laid or born, pulled, hatched or dispersed later, and the young of it.
 */
export const eggSacs = pgTable(
  'egg_sacs',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    collectionId: uuid('collection_id')
      .notNull()
      .references(() => collections.id, { onDelete: 'cascade' }),
    femaleId: uuid('female_id')
      .notNull()
      .references(() => animals.id, { onDelete: 'cascade' }),
    kind: breedingRecordEnum('kind').notNull().default('egg_sac'),
    // The name its slings share as their clutch (and their labels' filter).
    clutch: text('clutch').notNull(),
    laidOn: date('laid_on').notNull(),
    pulledOn: date('pulled_on'),
    hatchedOn: date('hatched_on'),
    // A brood: the day the young left her back (or her coils); her guarding ends then.
    dispersedOn: date('dispersed_on'),
    eggCount: integer('egg_count'),
    eggsWithLegs: integer('eggs_with_legs'),
    slingCount: integer('sling_count'),
    incubationMinDays: integer('incubation_min_days').notNull(),
    incubationMaxDays: integer('incubation_max_days').notNull(),
    notes: text('notes'),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index('egg_sacs_collection_idx').on(t.collectionId, t.laidOn)],
);

/** A photo of what an event recorded (a molt's exuviae, the sex shown on it). */
export const eventPhotos = pgTable('event_photos', {
  eventId: uuid('event_id')
    .primaryKey()
    .references(() => events.id, { onDelete: 'cascade' }),
  collectionId: uuid('collection_id')
    .notNull()
    .references(() => collections.id, { onDelete: 'cascade' }),
  photoKey: text('photo_key').notNull(),
  createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
});

/**
 * What a helper tells the owners while covering (an escape, a bite, a death, a note): kept for
 * the app and e-mailed to each owner once, as background work after the answer.
 */
export const helperReports = pgTable(
  'helper_reports',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    collectionId: uuid('collection_id')
      .notNull()
      .references(() => collections.id, { onDelete: 'cascade' }),
    kind: text('kind', { enum: HELPER_REPORT_KINDS }).notNull(),
    // An animal from the round; a deleted animal leaves the report standing.
    animalId: uuid('animal_id').references(() => animals.id, { onDelete: 'set null' }),
    // An animal off the round, as the helper wrote it (its code or name).
    animalText: text('animal_text').notNull().default(''),
    note: text('note').notNull(),
    reportedBy: uuid('reported_by').references(() => users.id, { onDelete: 'set null' }),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    /** When the mail server accepted it for every owner. */
    sentAt: timestamp('sent_at', { withTimezone: true }),
    /** Owners it was already accepted for, so a second try sends no duplicate. */
    sentTo: text('sent_to').array().notNull().default([]),
  },
  (t) => [index('helper_reports_collection_idx').on(t.collectionId, t.createdAt)],
);
