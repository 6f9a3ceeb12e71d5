import { and, eq, inArray, max } from 'drizzle-orm';
import type { StoredChore } from '#shared/domain/chore-verdicts';
import type { Db } from '../../db/client';
import { chores } from '../../db/schema/colonies';

export type NewChore = typeof chores.$inferInsert;

export async function storedChores(db: Db, ids: string[]): Promise<Map<string, StoredChore>> {
  if (!ids.length) return new Map();
  const rows = await db
    .select({
      id: chores.id,
      collectionId: chores.collectionId,
      subjectKind: chores.subjectKind,
      subjectId: chores.subjectId,
      kind: chores.kind,
    })
    .from(chores)
    .where(inArray(chores.id, ids));
  return new Map(rows.map((r) => [r.id, r]));
}

/** Stores the chores not stored yet (by id); returns the ids this call inserted. */
export async function insertChores(db: Db, rows: NewChore[]): Promise<Set<string>> {
  if (!rows.length) return new Set();
  const inserted = await db
    .insert(chores)
    .values(rows)
    .onConflictDoNothing({ target: chores.id })
    .returning({ id: chores.id });
  return new Set(inserted.map((r) => r.id));
}

/** The latest time each care kind was done, per subject. */
export async function lastDoneOf(
  db: Db,
  collectionId: string,
  subjectKind: string,
  subjectIds: string[],
) {
  if (!subjectIds.length) return [];
  return db
    .select({ subjectId: chores.subjectId, kind: chores.kind, last: max(chores.effectiveAt) })
    .from(chores)
    .where(
      and(
        eq(chores.collectionId, collectionId),
        eq(chores.subjectKind, subjectKind),
        inArray(chores.subjectId, subjectIds),
      ),
    )
    .groupBy(chores.subjectId, chores.kind);
}

export async function deleteChoresOf(
  db: Db,
  collectionId: string,
  subjectKind: string,
  subjectId: string,
) {
  await db
    .delete(chores)
    .where(
      and(
        eq(chores.collectionId, collectionId),
        eq(chores.subjectKind, subjectKind),
        eq(chores.subjectId, subjectId),
      ),
    );
}
