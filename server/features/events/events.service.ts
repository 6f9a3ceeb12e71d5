import type { NodePgDatabase } from 'drizzle-orm/node-postgres';
import type { EventKind } from '../../../shared/domain/event-kinds';
import { applyNewEvents } from '../rounds/projection';
import type { RoundsService } from '../rounds/rounds.service';
import { insertEventsOnce, type NewEvent } from './events.repository';

export interface IncomingEvent {
  id: string;
  animalId: string;
  kind: EventKind;
  payload: Record<string, unknown>;
  recordedBy: string | null;
  deviceId: string | null;
  clientRecordedAt: Date;
  clientSentAt: Date | null;
  effectiveAt: Date;
  flags?: string[];
}

/**
 * Stores facts exactly once (the client's id is the key) and, in the same transaction,
 * brings each animal's projected state up to date; then adds any urgent task to today's round.
 */
export function createEventsService(db: NodePgDatabase, rounds: RoundsService, now: () => Date) {
  return {
    async ingest(collectionId: string, zone: string, incoming: IncomingEvent[]) {
      const received = now();
      const inserted = await db.transaction(async (tx) => {
        const rows: NewEvent[] = incoming.map((e) => ({ ...e, collectionId, serverReceivedAt: received, flags: e.flags ?? [] }));
        const ids = await insertEventsOnce(tx, rows);
        const fresh = incoming
          .filter((e) => ids.has(e.id))
          .map((e) => ({ id: e.id, animalId: e.animalId, kind: e.kind, payload: e.payload, effectiveAt: e.effectiveAt.toISOString() }));
        await applyNewEvents(tx, collectionId, zone, fresh);
        return ids;
      });
      const touched = [...new Set(incoming.filter((e) => inserted.has(e.id)).map((e) => e.animalId))];
      await rounds.addUrgentTasks(collectionId, touched);
      return { inserted };
    },
  };
}
export type EventsService = ReturnType<typeof createEventsService>;
