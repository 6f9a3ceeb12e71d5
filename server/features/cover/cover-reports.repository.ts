import { and, asc, eq, gte, inArray, isNull, ne } from 'drizzle-orm';
import type { NodePgDatabase } from 'drizzle-orm/node-postgres';
import { coverReports, memberships } from '../../db/schema/collections';
import { users } from '../../db/schema/users';

export interface UnsentReport {
  id: string;
  collectionId: string;
  subject: string;
  body: string;
  sentTo: string[];
}

/** Reports made (subject written) but not yet accepted by the mail server for every owner. */
export async function unsentReports(db: NodePgDatabase, madeSince: Date): Promise<{ id: string }[]> {
  return db
    .select({ id: coverReports.id })
    .from(coverReports)
    .where(and(isNull(coverReports.sentAt), ne(coverReports.subject, ''), gte(coverReports.createdAt, madeSince)))
    .orderBy(asc(coverReports.createdAt));
}

/**
 * Sends one unsent report under a row lock: `send` runs inside the transaction, so two
 * processes never mail the same report at once (the second skips it), and what it returns
 * is stored. True when the report is now sent to every owner; false when it is not yet, was
 * already, or another process holds it.
 */
export async function withUnsentReport(
  db: NodePgDatabase,
  id: string,
  send: (report: UnsentReport, owners: string[]) => Promise<{ sentTo: string[]; done: boolean }>,
  now: Date,
): Promise<boolean> {
  return db.transaction(async (tx) => {
    const [row] = await tx
      .select({ id: coverReports.id, collectionId: coverReports.collectionId, subject: coverReports.subject, body: coverReports.body, sentTo: coverReports.sentTo })
      .from(coverReports)
      .where(and(eq(coverReports.id, id), isNull(coverReports.sentAt)))
      .for('update', { skipLocked: true });
    if (!row) return false;
    const owners = await tx
      .select({ email: users.email })
      .from(memberships)
      .innerJoin(users, eq(users.id, memberships.userId))
      .where(and(eq(memberships.collectionId, row.collectionId), inArray(memberships.role, ['owner'])));
    const result = await send(row, owners.map((o) => o.email));
    await tx.update(coverReports).set({ sentTo: result.sentTo, sentAt: result.done ? now : null }).where(eq(coverReports.id, id));
    return result.done;
  });
}
