import {
  bigint,
  boolean,
  date,
  index,
  integer,
  jsonb,
  pgTable,
  timestamp,
  unique,
  uuid,
} from 'drizzle-orm/pg-core';
import { animals } from './animals';
import { collections } from './collections';

/**
 * Per-animal state folded from the event log (last meal, refusal streak, holds…), updated in
 * the transaction that stores the events, so building a round reads O(animals).
 */
export const animalStates = pgTable(
  'animal_states',
  {
    animalId: uuid('animal_id')
      .primaryKey()
      .references(() => animals.id, { onDelete: 'cascade' }),
    collectionId: uuid('collection_id')
      .notNull()
      .references(() => collections.id, { onDelete: 'cascade' }),
    state: jsonb('state').notNull(),
    lastEventAt: timestamp('last_event_at', { withTimezone: true }),
    updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index('animal_states_collection_idx').on(t.collectionId)],
);

/** A collection's round for one local calendar date, built once and kept through its day. */
export const rounds = pgTable(
  'rounds',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    collectionId: uuid('collection_id')
      .notNull()
      .references(() => collections.id, { onDelete: 'cascade' }),
    localDate: date('local_date').notNull(),
    builtAt: timestamp('built_at', { withTimezone: true }).notNull().defaultNow(),
    prepList: jsonb('prep_list').notNull().default([]),
  },
  (t) => [unique('rounds_collection_date').on(t.collectionId, t.localDate)],
);

export const roundItems = pgTable(
  'round_items',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    roundId: uuid('round_id')
      .notNull()
      .references(() => rounds.id, { onDelete: 'cascade' }),
    animalId: uuid('animal_id')
      .notNull()
      .references(() => animals.id, { onDelete: 'cascade' }),
    sortIndex: integer('sort_index').notNull(),
    tasks: jsonb('tasks').notNull(),
    notes: jsonb('notes').notNull().default([]),
    carriedOverDays: integer('carried_over_days').notNull().default(0),
    // An urgent task that appeared during the day (e.g. prey left in with a molting animal).
    addedDuringDay: boolean('added_during_day').notNull().default(false),
  },
  (t) => [
    unique('round_items_round_animal').on(t.roundId, t.animalId),
    index('round_items_round_idx').on(t.roundId, t.sortIndex),
  ],
);

/**
 * Change counters per collection, bumped by triggers (migration 0008) whenever a table that
 * today's round is drawn from changes: `records` for animals, places, rounds and notes,
 * `events` for the event log and the names of who recorded them. A server process compares
 * them with its cached round, so a cache can never serve a round older than the database.
 * No foreign key: the triggers also fire while a collection is being deleted.
 */
export const collectionRevisions = pgTable('collection_revisions', {
  collectionId: uuid('collection_id').primaryKey(),
  records: bigint('records', { mode: 'number' }).notNull().default(0),
  events: bigint('events', { mode: 'number' }).notNull().default(0),
});
