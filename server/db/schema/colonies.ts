import { sql } from 'drizzle-orm';
import {
  bigserial,
  check,
  index,
  integer,
  jsonb,
  pgTable,
  primaryKey,
  text,
  timestamp,
  unique,
  uuid,
} from 'drizzle-orm/pg-core';
import { collections } from './collections';
import { users } from './users';

/** A feeder colony (a roach bin, a cricket tub): its prey type and its own care intervals. */
export const colonies = pgTable(
  'colonies',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    collectionId: uuid('collection_id')
      .notNull()
      .references(() => collections.id, { onDelete: 'cascade' }),
    name: text('name').notNull(),
    species: text('species').notNull().default(''),
    /** Matches the feeder catalogue's prey type, so the prep list can draw on it. */
    preyType: text('prey_type').notNull(),
    feedEvery: integer('feed_every'),
    waterGelEvery: integer('water_gel_every'),
    cleanEvery: integer('clean_every'),
    splitEvery: integer('split_every'),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    index('colonies_collection_idx').on(t.collectionId),
    unique('colonies_collection_name').on(t.collectionId, t.name),
  ],
);

/** A colony's estimated count of one size; `position` keeps the keeper's order of sizes. */
export const colonyStock = pgTable(
  'colony_stock',
  {
    colonyId: uuid('colony_id')
      .notNull()
      .references(() => colonies.id, { onDelete: 'cascade' }),
    preySize: text('prey_size').notNull(),
    count: integer('count').notNull().default(0),
    position: integer('position').notNull().default(0),
  },
  (t) => [
    primaryKey({ columns: [t.colonyId, t.preySize] }),
    check('colony_stock_not_negative', sql`${t.count} >= 0`),
  ],
);

/**
 * Every change to a colony's stock, with its reason: a count update, prey used by the round
 * (and put back when that outcome is undone), a split, a correction. `sourceEventId` is the
 * round's event that caused it: unique per colony and size, so an event takes stock once.
 */
export const colonyStockChanges = pgTable(
  'colony_stock_changes',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    /** Order of writing: changes made in one transaction share their `at`. */
    seq: bigserial('seq', { mode: 'number' }).notNull(),
    colonyId: uuid('colony_id')
      .notNull()
      .references(() => colonies.id, { onDelete: 'cascade' }),
    preySize: text('prey_size').notNull(),
    delta: integer('delta').notNull(),
    after: integer('after').notNull(),
    reason: text('reason').notNull(),
    sourceEventId: uuid('source_event_id'),
    note: text('note'),
    at: timestamp('at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    index('colony_stock_changes_colony_time_idx').on(t.colonyId, t.at),
    index('colony_stock_changes_source_idx').on(t.sourceEventId),
    unique('colony_stock_changes_once').on(t.sourceEventId, t.colonyId, t.preySize),
  ],
);

/**
 * Care of things that are not animals (decision 020): a subject kind and id, the care done and
 * when. The id is made on the phone, so a re-sent chore is known and never stored twice.
 */
export const chores = pgTable(
  'chores',
  {
    id: uuid('id').primaryKey(),
    collectionId: uuid('collection_id')
      .notNull()
      .references(() => collections.id, { onDelete: 'cascade' }),
    subjectKind: text('subject_kind').notNull(),
    /** A colony's uuid, or a room's name (rooms are the places' names: decision 019). */
    subjectId: text('subject_id').notNull(),
    kind: text('kind').notNull(),
    payload: jsonb('payload').notNull().default({}),
    recordedBy: uuid('recorded_by').references(() => users.id, { onDelete: 'set null' }),
    deviceId: text('device_id'),
    clientRecordedAt: timestamp('client_recorded_at', { withTimezone: true }).notNull(),
    serverReceivedAt: timestamp('server_received_at', { withTimezone: true })
      .notNull()
      .defaultNow(),
    effectiveAt: timestamp('effective_at', { withTimezone: true }).notNull(),
  },
  (t) => [index('chores_subject_idx').on(t.collectionId, t.subjectKind, t.subjectId, t.kind)],
);
