import { and, desc, eq, inArray } from 'drizzle-orm';
import type { Db } from '../../db/client';
import { animals, events } from '../../db/schema/animals';
import { users } from '../../db/schema/users';

export type NewEvent = typeof events.$inferInsert;

/** Inserts events keyed by their client-made ids; a re-sent id is left as it was. */
export async function insertEventsOnce(db: Db, rows: NewEvent[]): Promise<Set<string>> {
  const inserted = new Set<string>();
  for (let i = 0; i < rows.length; i += 500) {
    const got = await db
      .insert(events)
      .values(rows.slice(i, i + 500))
      .onConflictDoNothing({ target: events.id })
      .returning({ id: events.id });
    for (const r of got) inserted.add(r.id);
  }
  return inserted;
}

/** Of these animal ids, the ones that belong to the collection. */
export async function animalIdsInCollection(
  db: Db,
  collectionId: string,
  ids: string[],
): Promise<Set<string>> {
  if (!ids.length) return new Set();
  const rows = await db
    .select({ id: animals.id })
    .from(animals)
    .where(and(eq(animals.collectionId, collectionId), inArray(animals.id, ids)));
  return new Set(rows.map((r) => r.id));
}

/** Stored events by id, with what a duplicate or void check needs. */
export async function storedEvents(db: Db, ids: string[]) {
  if (!ids.length)
    return new Map<string, { collectionId: string; animalId: string; recordedBy: string | null }>();
  const rows = await db
    .select({
      id: events.id,
      collectionId: events.collectionId,
      animalId: events.animalId,
      recordedBy: events.recordedBy,
    })
    .from(events)
    .where(inArray(events.id, ids));
  return new Map(rows.map((r) => [r.id, r]));
}

/** An animal's newest events first, with who recorded them. */
export async function recentEventsOf(
  db: Db,
  collectionId: string,
  animalId: string,
  limit: number,
) {
  return db
    .select({
      id: events.id,
      kind: events.kind,
      effectiveAt: events.effectiveAt,
      payload: events.payload,
      flags: events.flags,
      by: users.displayName,
    })
    .from(events)
    .leftJoin(users, eq(users.id, events.recordedBy))
    .where(and(eq(events.collectionId, collectionId), eq(events.animalId, animalId)))
    .orderBy(desc(events.effectiveAt), desc(events.id))
    .limit(limit);
}
