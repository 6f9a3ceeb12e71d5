import { sql } from 'drizzle-orm';
import {
  date,
  index,
  integer,
  jsonb,
  pgEnum,
  pgTable,
  text,
  timestamp,
  unique,
  uniqueIndex,
  uuid,
} from 'drizzle-orm/pg-core';
import { ROLES } from '#shared/domain/roles';
import { users } from './users';

export const roleEnum = pgEnum('member_role', ROLES);

export const collections = pgTable('collections', {
  id: uuid('id').primaryKey().defaultRandom(),
  name: text('name').notNull(),
  timeZone: text('time_zone').notNull(),
  // Four characters on every label's QR that say which collection the code belongs to.
  labelTag: text('label_tag').notNull().unique('collections_label_tag'),
  // For whoever covers the feeds: where the feeders are, who to call, what to do if…
  handoverNote: text('handover_note'),
  // Egg sacs: the usual days from laying to pulling or hatching (common practice: about 6–8
  // weeks, varying by species); each sac may have its own.
  incubationMinDays: integer('incubation_min_days').notNull().default(42),
  incubationMaxDays: integer('incubation_max_days').notNull().default(56),
  // Per-collection overrides of the round engine's defaults; absent keys use the defaults.
  rules: jsonb('rules').notNull().default({}),
  createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
});

export const memberships = pgTable(
  'memberships',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    collectionId: uuid('collection_id')
      .notNull()
      .references(() => collections.id, { onDelete: 'cascade' }),
    userId: uuid('user_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    role: roleEnum('role').notNull(),
    // A helper's cover window; null for owners and keepers.
    startsAt: timestamp('starts_at', { withTimezone: true }),
    endsAt: timestamp('ends_at', { withTimezone: true }),
    // Set when the owner ends a cover early: from this instant nothing the helper sends is
    // stored, not even taps made before it (no grace, unlike a cover that runs its course).
    writesClosedAt: timestamp('writes_closed_at', { withTimezone: true }),
    // A helper reads the safety page once per cover before their first round.
    safetyAcknowledgedAt: timestamp('safety_acknowledged_at', { withTimezone: true }),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    unique('memberships_collection_user').on(t.collectionId, t.userId),
    index('memberships_user_idx').on(t.userId),
  ],
);

export const invites = pgTable(
  'invites',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    collectionId: uuid('collection_id')
      .notNull()
      .references(() => collections.id, { onDelete: 'cascade' }),
    email: text('email').notNull(),
    role: roleEnum('role').notNull(),
    tokenHash: text('token_hash').notNull().unique(),
    message: text('message'),
    startsAt: timestamp('starts_at', { withTimezone: true }),
    endsAt: timestamp('ends_at', { withTimezone: true }),
    expiresAt: timestamp('expires_at', { withTimezone: true }).notNull(),
    acceptedAt: timestamp('accepted_at', { withTimezone: true }),
    acceptedBy: uuid('accepted_by').references(() => users.id, { onDelete: 'set null' }),
    // Set when the owner cancels a keeper's or co-owner's invite before it is answered: the
    // link then says so instead of letting the person in.
    revokedAt: timestamp('revoked_at', { withTimezone: true }),
    invitedBy: uuid('invited_by').references(() => users.id, { onDelete: 'set null' }),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index('invites_collection_idx').on(t.collectionId)],
);

export const locations = pgTable(
  'locations',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    collectionId: uuid('collection_id')
      .notNull()
      .references(() => collections.id, { onDelete: 'cascade' }),
    room: text('room').notNull(),
    rack: text('rack').notNull(),
    shelf: text('shelf').notNull(),
    position: text('position').notNull(),
    // Keeper's own walk order; ties fall back to the natural sort of room/rack/shelf/position.
    walkOrder: integer('walk_order').notNull().default(0),
  },
  (t) => [unique('locations_place').on(t.collectionId, t.room, t.rack, t.shelf, t.position)],
);

/**
 * One report per covered day, and one summary per cover when it ends (early or on its last
 * day): e-mailed to the owners and kept for the app.
 */
export const coverReports = pgTable(
  'cover_reports',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    collectionId: uuid('collection_id')
      .notNull()
      .references(() => collections.id, { onDelete: 'cascade' }),
    localDate: date('local_date').notNull(),
    // Set on a cover's end summary (its local date is the cover's last day); null on a day's report.
    coverId: uuid('cover_id').references(() => invites.id, { onDelete: 'cascade' }),
    subject: text('subject').notNull(),
    body: text('body').notNull(),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    /** When the mail server accepted it for every owner; until then each run retries it. */
    sentAt: timestamp('sent_at', { withTimezone: true }),
    /** Owners it was already accepted for, so a retry after a partial failure sends no duplicate. */
    sentTo: text('sent_to').array().notNull().default([]),
  },
  (t) => [
    // One report per (collection, day), one summary per cover: each is made exactly once.
    uniqueIndex('cover_reports_collection_day')
      .on(t.collectionId, t.localDate)
      .where(sql`${t.coverId} is null`),
    uniqueIndex('cover_reports_cover').on(t.coverId),
  ],
);
