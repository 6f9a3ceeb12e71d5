// A tap as the round shows it. Its own module: the phone settles every tap with it, while the
// engine that builds a whole day on the phone (phone-round.ts) loads only when a day needs it.
import type { EventKind } from '../event-kinds';
import type { DayOutcome } from './settle';

/** A tap the phone has not sent yet, as the outbox holds it. */
export interface QueuedTap {
  event: {
    id: string;
    animalId: string;
    kind: EventKind;
    payload: Record<string, unknown>;
    clientRecordedAt: string;
  };
  /** Who tapped, as the round shows it ("done by Robin"). */
  byName: string;
}

/** A tap as a day's outcome on the round, the shape the server gives its stored events. */
export function tapOutcome(event: QueuedTap['event'], by: string): DayOutcome {
  const targetId = event.kind === 'void' ? (event.payload.targetId as string) : null;
  return { eventId: event.id, kind: event.kind, at: event.clientRecordedAt, by, voids: targetId };
}
