import { randomUUID } from 'node:crypto';
import { eq } from 'drizzle-orm';
import type { EventKind } from '../../../shared/domain/event-kinds';
import type { Db } from '../../db/client';
import { events } from '../../db/schema/animals';
import { collections } from '../../db/schema/collections';
import { applyNewEvents } from '../rounds/projection';

/**
 * Facts the server records itself (moves, status changes, egg sacs), stamped with the server's
 * clock — or, for a date the keeper gave ("pulled on 3 Mar"), effective then — and folded into
 * the round engine's state in the same transaction, like synced taps.
 */
export async function recordServerEvents(
  db: Db,
  rows: { collectionId: string; animalId: string; kind: EventKind; payload: Record<string, unknown>; recordedBy: string; effectiveAt?: Date }[],
  now: Date,
) {
  if (!rows.length) return;
  const stamped = rows.map((r) => ({ ...r, id: randomUUID(), deviceId: 'server', clientRecordedAt: now, clientSentAt: now, serverReceivedAt: now, effectiveAt: r.effectiveAt ?? now }));
  await db.insert(events).values(stamped);
  const collectionId = rows[0]!.collectionId;
  const [c] = await db.select({ zone: collections.timeZone }).from(collections).where(eq(collections.id, collectionId));
  await applyNewEvents(db, collectionId, c!.zone, stamped.map((e) => ({ id: e.id, animalId: e.animalId, kind: e.kind, payload: e.payload, effectiveAt: e.effectiveAt.toISOString() })));
}
