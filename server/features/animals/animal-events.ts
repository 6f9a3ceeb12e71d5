import { randomUUID } from 'node:crypto';
import type { EventKind } from '../../../shared/domain/event-kinds';
import type { Db } from '../../db/client';
import { events } from '../../db/schema/animals';

/** Facts the server records itself (moves, status changes), stamped with the server's clock. */
export async function recordServerEvents(
  db: Db,
  rows: { collectionId: string; animalId: string; kind: EventKind; payload: Record<string, unknown>; recordedBy: string }[],
  now: Date,
) {
  if (!rows.length) return;
  await db.insert(events).values(
    rows.map((r) => ({ ...r, id: randomUUID(), deviceId: 'server', clientRecordedAt: now, clientSentAt: now, serverReceivedAt: now, effectiveAt: now })),
  );
}
