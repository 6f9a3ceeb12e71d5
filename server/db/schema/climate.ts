import { sql } from 'drizzle-orm';
import {
  check,
  date,
  doublePrecision,
  index,
  pgTable,
  primaryKey,
  text,
  timestamp,
  uniqueIndex,
  uuid,
} from 'drizzle-orm/pg-core';
import { collections } from './collections';
import { users } from './users';

/**
 * A room's target range. Rooms are not rows of their own (a place's `room` is its name), so
 * targets are keyed by the room's name as stored; renaming the room renames them too
 * (locations service → climate service). Each bound may be empty. °C to a hundredth, % RH.
 */
export const roomTargets = pgTable(
  'room_targets',
  {
    collectionId: uuid('collection_id')
      .notNull()
      .references(() => collections.id, { onDelete: 'cascade' }),
    room: text('room').notNull(),
    minCelsius: doublePrecision('min_celsius'),
    maxCelsius: doublePrecision('max_celsius'),
    minHumidity: doublePrecision('min_humidity'),
    maxHumidity: doublePrecision('max_humidity'),
    updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [primaryKey({ columns: [t.collectionId, t.room] })],
);

/**
 * One reading of a room: typed on the round (min/max since the last reading and the humidity
 * now) or one row of a data logger's file (the temperature and humidity at that instant).
 * The id is the client's own (a typed reading sent twice is stored once); a logger row's
 * instant is unique per room, so importing the same file again adds nothing.
 */
export const climateReadings = pgTable(
  'climate_readings',
  {
    id: uuid('id').primaryKey(),
    collectionId: uuid('collection_id')
      .notNull()
      .references(() => collections.id, { onDelete: 'cascade' }),
    room: text('room').notNull(),
    takenAt: timestamp('taken_at', { withTimezone: true }).notNull(),
    currentCelsius: doublePrecision('current_celsius'),
    minCelsius: doublePrecision('min_celsius'),
    maxCelsius: doublePrecision('max_celsius'),
    humidity: doublePrecision('humidity'),
    source: text('source', { enum: ['typed', 'logger'] }).notNull(),
    recordedBy: uuid('recorded_by').references(() => users.id, { onDelete: 'set null' }),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    index('climate_readings_room_idx').on(t.collectionId, t.room, t.takenAt),
    uniqueIndex('climate_readings_logger_instant')
      .on(t.collectionId, t.room, t.takenAt)
      .where(sql`${t.source} = 'logger'`),
    check(
      'climate_readings_humidity',
      sql`${t.humidity} is null or ${t.humidity} between 0 and 100`,
    ),
  ],
);

/**
 * The owner's daily e-mail, once per (owner, collection, local date): claimed before sending,
 * marked sent only after the mail server accepted it (lock-send-mark, as cover reports).
 */
export const dailyMails = pgTable(
  'daily_mails',
  {
    collectionId: uuid('collection_id')
      .notNull()
      .references(() => collections.id, { onDelete: 'cascade' }),
    userId: uuid('user_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    localDate: date('local_date').notNull(),
    sentAt: timestamp('sent_at', { withTimezone: true }),
  },
  (t) => [primaryKey({ columns: [t.collectionId, t.userId, t.localDate] })],
);
