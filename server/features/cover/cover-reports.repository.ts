import { and, asc, desc, eq, gt, gte, isNotNull, isNull, lt, lte, ne, sql } from 'drizzle-orm';
import type { LocalDate } from '#shared/domain/local-dates';
import { ownerEmails } from '../../access/memberships';
import type { Db } from '../../db/client';
import { animals, events, handoverNotes } from '../../db/schema/animals';
import { collections, coverReports, invites, memberships } from '../../db/schema/collections';
import { animalStates } from '../../db/schema/rounds';
import { users } from '../../db/schema/users';

export interface UnsentReport {
  id: string;
  collectionId: string;
  subject: string;
  body: string;
  sentTo: string[];
}

/** The collection a report is about, as the report needs it. */
export interface ReportCollection {
  id: string;
  name: string;
  timeZone: string;
}

/** Helpers' covers that began before `now` and ended after `endedAfter`, with their collection. */
export async function coversSince(db: Db, now: Date, endedAfter: Date) {
  return db
    .select({
      c: { id: collections.id, name: collections.name, timeZone: collections.timeZone },
      startsAt: memberships.startsAt,
      endsAt: memberships.endsAt,
    })
    .from(memberships)
    .innerJoin(collections, eq(collections.id, memberships.collectionId))
    .where(
      and(
        eq(memberships.role, 'helper'),
        isNotNull(memberships.startsAt),
        isNotNull(memberships.endsAt),
        lt(memberships.startsAt, now),
        sql`${memberships.endsAt} > ${endedAfter}`,
      ),
    );
}

/** A collection's events in [from, to), oldest first, with their animal and who recorded them. */
export async function eventsBetween(db: Db, collectionId: string, from: Date, to: Date) {
  return db
    .select({
      id: events.id,
      kind: events.kind,
      payload: events.payload,
      at: events.effectiveAt,
      animal: animals.name,
      code: animals.labelCode,
      by: users.displayName,
    })
    .from(events)
    .innerJoin(animals, eq(animals.id, events.animalId))
    .leftJoin(users, eq(users.id, events.recordedBy))
    .where(
      and(
        eq(events.collectionId, collectionId),
        gte(events.effectiveAt, from),
        lt(events.effectiveAt, to),
      ),
    )
    .orderBy(asc(events.effectiveAt));
}

/** Every active animal's projected state, with its name and code. */
export async function activeAnimalStates(db: Db, collectionId: string) {
  return db
    .select({ name: animals.name, code: animals.labelCode, state: animalStates.state })
    .from(animalStates)
    .innerJoin(animals, eq(animals.id, animalStates.animalId))
    .where(and(eq(animalStates.collectionId, collectionId), eq(animals.status, 'active')));
}

/**
 * Claims the (collection, day) report with an empty row; its id, or null when another run has
 * it already. Another process claiming the same day waits on the unique key, then finds it taken.
 */
export async function claimReport(db: Db, collectionId: string, day: LocalDate, createdAt: Date) {
  const claimed = await db
    .insert(coverReports)
    .values({ collectionId, localDate: day, subject: '', body: '', createdAt })
    .onConflictDoNothing()
    .returning({ id: coverReports.id });
  return claimed[0]?.id ?? null;
}

export async function writeReport(db: Db, id: string, report: { subject: string; body: string }) {
  await db.update(coverReports).set(report).where(eq(coverReports.id, id));
}

/** A collection's latest reports (the last 60 days at most), newest first. */
export async function latestReports(db: Db, collectionId: string) {
  return (
    db
      .select()
      .from(coverReports)
      .where(eq(coverReports.collectionId, collectionId))
      // A cover's summary before its last day's report.
      .orderBy(desc(coverReports.localDate), sql`${coverReports.coverId} is null`)
      .limit(60)
  );
}

/** Reports made (subject written) but not yet accepted by the mail server for every owner. */
export async function unsentReports(db: Db, madeSince: Date): Promise<{ id: string }[]> {
  return db
    .select({ id: coverReports.id })
    .from(coverReports)
    .where(
      and(
        isNull(coverReports.sentAt),
        ne(coverReports.subject, ''),
        gte(coverReports.createdAt, madeSince),
      ),
    )
    .orderBy(asc(coverReports.createdAt));
}

/**
 * Sends one unsent report under a row lock: `send` runs inside the transaction, so two
 * processes never mail the same report at once (the second skips it), and what it returns
 * is stored. True when the report is now sent to every owner; false when it is not yet, was
 * already, or another process holds it.
 */
export async function withUnsentReport(
  db: Db,
  id: string,
  send: (report: UnsentReport, owners: string[]) => Promise<{ sentTo: string[]; done: boolean }>,
  now: Date,
): Promise<boolean> {
  return db.transaction(async (tx) => {
    const [row] = await tx
      .select({
        id: coverReports.id,
        collectionId: coverReports.collectionId,
        subject: coverReports.subject,
        body: coverReports.body,
        sentTo: coverReports.sentTo,
      })
      .from(coverReports)
      .where(and(eq(coverReports.id, id), isNull(coverReports.sentAt)))
      .for('update', { skipLocked: true });
    if (!row) return false;
    const result = await send(row, await ownerEmails(tx, row.collectionId));
    await tx
      .update(coverReports)
      .set({ sentTo: result.sentTo, sentAt: result.done ? now : null })
      .where(eq(coverReports.id, id));
    return result.done;
  });
}

// --- A cover's end summary (a cover_reports row with its cover's id).

/**
 * Helpers' covers that have ended since `endedSince` (on their last day or early) after they
 * began, with no summary yet, and their collection.
 */
export async function endedCoversWithoutSummary(db: Db, now: Date, endedSince: Date) {
  return db
    .select({ id: invites.id })
    .from(invites)
    .leftJoin(coverReports, eq(coverReports.coverId, invites.id))
    .where(
      and(
        eq(invites.role, 'helper'),
        isNotNull(invites.acceptedAt),
        lte(invites.endsAt, now),
        gt(invites.endsAt, endedSince),
        lt(invites.startsAt, invites.endsAt),
        isNull(coverReports.id),
      ),
    );
}

/** What a cover's summary is made from: its days, its helper, its collection. */
export async function coverForSummary(db: Db, coverId: string) {
  const [row] = await db
    .select({
      c: { id: collections.id, name: collections.name, timeZone: collections.timeZone },
      startsAt: invites.startsAt,
      endsAt: invites.endsAt,
      acceptedAt: invites.acceptedAt,
      helperId: invites.acceptedBy,
      helperName: users.displayName,
      email: invites.email,
    })
    .from(invites)
    .innerJoin(collections, eq(collections.id, invites.collectionId))
    .leftJoin(users, eq(users.id, invites.acceptedBy))
    .where(and(eq(invites.id, coverId), eq(invites.role, 'helper')));
  return row ?? null;
}

/** Claims a cover's summary with an empty row; its id, or null when another run has it. */
export async function claimSummary(
  db: Db,
  collectionId: string,
  coverId: string,
  day: LocalDate,
  createdAt: Date,
) {
  const claimed = await db
    .insert(coverReports)
    .values({ collectionId, coverId, localDate: day, subject: '', body: '', createdAt })
    .onConflictDoNothing()
    .returning({ id: coverReports.id });
  return claimed[0]?.id ?? null;
}

/** A reopened cover's summary goes: a new one is made when it ends again. */
export async function deleteSummary(db: Db, coverId: string) {
  await db.delete(coverReports).where(eq(coverReports.coverId, coverId));
}

/** The keepers' per-animal handover notes in force on the cover's first day or later. */
export async function handoverNotesForCover(db: Db, collectionId: string, firstDay: LocalDate) {
  return db
    .select({
      animal: animals.name,
      code: animals.labelCode,
      text: handoverNotes.text,
      until: handoverNotes.until,
      doNotFeed: handoverNotes.doNotFeed,
    })
    .from(handoverNotes)
    .innerJoin(animals, eq(animals.id, handoverNotes.animalId))
    .where(and(eq(handoverNotes.collectionId, collectionId), gte(handoverNotes.until, firstDay)))
    .orderBy(asc(animals.name));
}
