import { and, asc, desc, eq, gte, isNull, lt } from 'drizzle-orm';
import type { Db } from '../../db/client';
import { animals } from '../../db/schema/animals';
import { climateReadings, dailyMails, roomTargets } from '../../db/schema/climate';
import { collections, locations, memberships } from '../../db/schema/collections';
import { users } from '../../db/schema/users';

export type ReadingRow = typeof climateReadings.$inferSelect;
export type TargetsRow = typeof roomTargets.$inferSelect;

/** The collection's rooms as its places name them, in name order. */
export async function roomNames(db: Db, collectionId: string): Promise<string[]> {
  const rows = await db
    .selectDistinct({ room: locations.room })
    .from(locations)
    .where(eq(locations.collectionId, collectionId))
    .orderBy(asc(locations.room));
  return rows.map((r) => r.room);
}

export async function targetsOf(db: Db, collectionId: string): Promise<TargetsRow[]> {
  return db.select().from(roomTargets).where(eq(roomTargets.collectionId, collectionId));
}

export async function upsertTargets(
  db: Db,
  values: Omit<TargetsRow, 'updatedAt'>,
  now: Date,
): Promise<TargetsRow> {
  const [row] = await db
    .insert(roomTargets)
    .values({ ...values, updatedAt: now })
    .onConflictDoUpdate({
      target: [roomTargets.collectionId, roomTargets.room],
      set: {
        minCelsius: values.minCelsius,
        maxCelsius: values.maxCelsius,
        minHumidity: values.minHumidity,
        maxHumidity: values.maxHumidity,
        updatedAt: now,
      },
    })
    .returning();
  return row!;
}

/** A room renamed with its places: its targets and readings follow. */
export async function renameRoom(db: Db, collectionId: string, from: string, to: string) {
  await db
    .update(roomTargets)
    .set({ room: to })
    .where(and(eq(roomTargets.collectionId, collectionId), eq(roomTargets.room, from)));
  await db
    .update(climateReadings)
    .set({ room: to })
    .where(and(eq(climateReadings.collectionId, collectionId), eq(climateReadings.room, from)));
}

/** Typed readings, each stored once by its id (a room chore's). */
export async function insertTypedReadings(
  db: Db,
  rows: (typeof climateReadings.$inferInsert)[],
): Promise<void> {
  if (!rows.length) return;
  await db.insert(climateReadings).values(rows).onConflictDoNothing({ target: climateReadings.id });
}

/** Logger rows, each instant of a room stored once: how many were new. */
export async function insertLoggerRows(
  db: Db,
  rows: (typeof climateReadings.$inferInsert)[],
): Promise<number> {
  let added = 0;
  // A page at a time: PostgreSQL takes at most 65,535 parameters per statement.
  for (let i = 0; i < rows.length; i += 2000) {
    const inserted = await db
      .insert(climateReadings)
      .values(rows.slice(i, i + 2000))
      .onConflictDoNothing()
      .returning({ id: climateReadings.id });
    added += inserted.length;
  }
  return added;
}

/** Readings taken in [from, to), optionally of one room or by one person, oldest first. */
export async function readingsBetween(
  db: Db,
  collectionId: string,
  from: Date,
  to: Date,
  filter: { room?: string; recordedBy?: string } = {},
): Promise<ReadingRow[]> {
  return db
    .select()
    .from(climateReadings)
    .where(
      and(
        eq(climateReadings.collectionId, collectionId),
        gte(climateReadings.takenAt, from),
        lt(climateReadings.takenAt, to),
        filter.room === undefined ? undefined : eq(climateReadings.room, filter.room),
        filter.recordedBy === undefined
          ? undefined
          : eq(climateReadings.recordedBy, filter.recordedBy),
      ),
    )
    .orderBy(asc(climateReadings.takenAt));
}

/** Rooms that have any typed reading or logger row. */
export async function roomsWithReadings(db: Db, collectionId: string): Promise<string[]> {
  const rows = await db
    .selectDistinct({ room: climateReadings.room })
    .from(climateReadings)
    .where(eq(climateReadings.collectionId, collectionId));
  return rows.map((r) => r.room);
}

/** Each room's newest reading. */
export async function latestPerRoom(db: Db, collectionId: string): Promise<ReadingRow[]> {
  return db
    .selectDistinctOn([climateReadings.room])
    .from(climateReadings)
    .where(eq(climateReadings.collectionId, collectionId))
    .orderBy(climateReadings.room, desc(climateReadings.takenAt));
}

export async function newestOfRoom(db: Db, collectionId: string, room: string, n: number) {
  return db
    .select()
    .from(climateReadings)
    .where(and(eq(climateReadings.collectionId, collectionId), eq(climateReadings.room, room)))
    .orderBy(desc(climateReadings.takenAt))
    .limit(n);
}

/** The room an animal of the collection lives in; undefined when no such animal. */
export async function roomOfAnimal(
  db: Db,
  collectionId: string,
  animalId: string,
): Promise<{ room: string | null } | undefined> {
  const [row] = await db
    .select({ room: locations.room })
    .from(animals)
    .leftJoin(locations, eq(locations.id, animals.locationId))
    .where(and(eq(animals.id, animalId), eq(animals.collectionId, collectionId)));
  return row;
}

/** Every collection with at least one room target: the daily e-mail's candidates. */
export async function collectionsWithTargets(db: Db) {
  return db
    .selectDistinct({ id: collections.id, name: collections.name, timeZone: collections.timeZone })
    .from(collections)
    .innerJoin(roomTargets, eq(roomTargets.collectionId, collections.id));
}

export async function ownersOf(db: Db, collectionId: string) {
  return db
    .select({ userId: users.id, email: users.email, temperatureUnit: users.temperatureUnit })
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .where(and(eq(memberships.collectionId, collectionId), eq(memberships.role, 'owner')));
}

/**
 * The lock-send-mark pattern for one owner's mail of one day: the row is claimed (inserted
 * once), locked, and marked sent only after `send` resolves, all in one transaction, so two
 * processes never both send it and a refused mail is tried again on the next run.
 */
export async function withUnsentDailyMail(
  db: Db,
  key: { collectionId: string; userId: string; localDate: string },
  send: () => Promise<void>,
  now: Date,
): Promise<boolean> {
  await db.insert(dailyMails).values(key).onConflictDoNothing();
  return db.transaction(async (tx) => {
    const [row] = await tx
      .select({ sentAt: dailyMails.sentAt })
      .from(dailyMails)
      .where(
        and(
          eq(dailyMails.collectionId, key.collectionId),
          eq(dailyMails.userId, key.userId),
          eq(dailyMails.localDate, key.localDate),
          isNull(dailyMails.sentAt),
        ),
      )
      .for('update', { skipLocked: true });
    if (!row) return false;
    await send();
    await tx
      .update(dailyMails)
      .set({ sentAt: now })
      .where(
        and(
          eq(dailyMails.collectionId, key.collectionId),
          eq(dailyMails.userId, key.userId),
          eq(dailyMails.localDate, key.localDate),
        ),
      );
    return true;
  });
}
