import { and, asc, desc, eq, gte, isNull, lt } from 'drizzle-orm';
import type { HelperReportKind } from '#shared/domain/helper-reports';
import { ownerEmails } from '../../access/memberships';
import type { Db } from '../../db/client';
import { animals, helperReports } from '../../db/schema/animals';
import { collections } from '../../db/schema/collections';
import { users } from '../../db/schema/users';

/** The animal's name and code when it belongs to the collection; null otherwise. */
export async function animalInCollection(db: Db, collectionId: string, animalId: string) {
  const [row] = await db
    .select({ id: animals.id, name: animals.name, labelCode: animals.labelCode })
    .from(animals)
    .where(and(eq(animals.id, animalId), eq(animals.collectionId, collectionId)));
  return row ?? null;
}

export async function insertHelperReport(
  db: Db,
  values: {
    collectionId: string;
    kind: HelperReportKind;
    animalId: string | null;
    animalText: string;
    note: string;
    reportedBy: string;
    createdAt: Date;
  },
) {
  const [row] = await db.insert(helperReports).values(values).returning({ id: helperReports.id });
  return row!.id;
}

/** A collection's reports made since `since`, newest first, with the animal and who reported. */
/** A collection's reports made at `since` or later (and before `before`, if given), newest first. */
export async function reportsSince(db: Db, collectionId: string, since: Date, before?: Date) {
  return db
    .select({
      id: helperReports.id,
      kind: helperReports.kind,
      animalId: animals.id,
      animalName: animals.name,
      labelCode: animals.labelCode,
      animalText: helperReports.animalText,
      note: helperReports.note,
      reportedBy: users.displayName,
      createdAt: helperReports.createdAt,
    })
    .from(helperReports)
    .leftJoin(animals, eq(animals.id, helperReports.animalId))
    .leftJoin(users, eq(users.id, helperReports.reportedBy))
    .where(
      and(
        eq(helperReports.collectionId, collectionId),
        gte(helperReports.createdAt, since),
        before ? lt(helperReports.createdAt, before) : undefined,
      ),
    )
    .orderBy(desc(helperReports.createdAt))
    .limit(100);
}

/** Reports made in [since, before) that the mail server has not yet accepted for every owner. */
export async function unsentHelperReports(db: Db, since: Date, before: Date) {
  return db
    .select({ id: helperReports.id })
    .from(helperReports)
    .where(
      and(
        isNull(helperReports.sentAt),
        gte(helperReports.createdAt, since),
        lt(helperReports.createdAt, before),
      ),
    )
    .orderBy(asc(helperReports.createdAt));
}

export interface UnsentHelperReport {
  collectionName: string;
  timeZone: string;
  kind: HelperReportKind;
  animal: { name: string; labelCode: string } | null;
  animalText: string;
  note: string;
  reportedBy: string;
  createdAt: Date;
  sentTo: string[];
}

/**
 * Sends one report under a row lock (the cover reports' lock-send-mark pattern): `send` runs
 * inside the transaction and what it returns is stored, so no owner gets it twice. False when
 * it was already sent or another process holds it.
 */
export async function withUnsentHelperReport(
  db: Db,
  id: string,
  send: (
    report: UnsentHelperReport,
    owners: string[],
  ) => Promise<{ sentTo: string[]; done: boolean }>,
  now: Date,
): Promise<boolean> {
  return db.transaction(async (tx) => {
    const [row] = await tx
      .select({
        collectionId: helperReports.collectionId,
        collectionName: collections.name,
        timeZone: collections.timeZone,
        kind: helperReports.kind,
        animalId: helperReports.animalId,
        animalText: helperReports.animalText,
        note: helperReports.note,
        reportedBy: helperReports.reportedBy,
        createdAt: helperReports.createdAt,
        sentTo: helperReports.sentTo,
      })
      .from(helperReports)
      .innerJoin(collections, eq(collections.id, helperReports.collectionId))
      .where(and(eq(helperReports.id, id), isNull(helperReports.sentAt)))
      .for('update', { of: helperReports, skipLocked: true });
    if (!row) return false;
    const animal = row.animalId
      ? await animalInCollection(tx, row.collectionId, row.animalId)
      : null;
    const [by] = row.reportedBy
      ? await tx.select({ name: users.displayName }).from(users).where(eq(users.id, row.reportedBy))
      : [];
    const result = await send(
      { ...row, animal, reportedBy: by?.name ?? 'Your helper' },
      await ownerEmails(tx, row.collectionId),
    );
    await tx
      .update(helperReports)
      .set({ sentTo: result.sentTo, sentAt: result.done ? now : null })
      .where(eq(helperReports.id, id));
    return result.done;
  });
}
