import { inArray } from 'drizzle-orm';
import type { Db } from '../../db/client';
import { animals, events } from '../../db/schema/animals';

export type NewEvent = typeof events.$inferInsert;

/** Inserts events keyed by their client-made ids; a re-sent id is left as it was. */
export async function insertEventsOnce(db: Db, rows: NewEvent[]): Promise<Set<string>> {
  const inserted = new Set<string>();
  for (let i = 0; i < rows.length; i += 500) {
    const got = await db.insert(events).values(rows.slice(i, i + 500)).onConflictDoNothing({ target: events.id }).returning({ id: events.id });
    for (const r of got) inserted.add(r.id);
  }
  return inserted;
}

export async function animalsOfCollection(db: Db, ids: string[]) {
  if (!ids.length) return [];
  return db.select({ id: animals.id, collectionId: animals.collectionId }).from(animals).where(inArray(animals.id, ids));
}
