// The one way into the event log. Phones' taps, the facts the server records itself (moves,
// status changes, breeding records) and whole histories (a restore, the demo seed) are stored
// here, so every fact reaches the projection and the animal's record the same way.
import { randomUUID } from 'node:crypto';
import type { EventKind } from '#shared/domain/event-kinds';
import type { Db } from '../../db/client';
import { insertEvents, setEnclosure, type NewEvent } from './events.repository';
import { MOLT_FACT_KINDS, applyMoltFacts } from './molt-facts';
import { foldNewEvents, refoldStates } from './projection';
import { lockStates } from './projection.repository';

/** The collection the events belong to, as the request's membership carries it. */
export interface EventCollection {
  collectionId: string;
  timeZone: string;
}

/** A tap made on a phone, already judged (shared/domain/event-verdicts.ts). */
export interface DeviceEvent {
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

/** A fact the server records itself; without `effectiveAt` it happened when it is recorded. */
export interface ServerFact {
  animalId: string;
  kind: EventKind;
  payload: Record<string, unknown>;
  recordedBy: string | null;
  /** A date the keeper gave ("pulled on 3 Mar"). */
  effectiveAt?: Date;
}

/** An event kept as it was: from a backup, or the demo's invented history. */
export type KeptEvent = Omit<NewEvent, 'collectionId'>;

export type DeviceSource = { from: 'device'; receivedAt: Date };
export type ServerSource = { from: 'server'; at: Date };
/**
 * A whole history at once. Its events are stored as they are, a repeated id refused, and the
 * projection is left to the caller, who re-folds once at the end (`refoldStates`): folding
 * event by event would re-read a long log for every late or undone entry.
 */
export type HistorySource = { from: 'history' };

/**
 * Stores events in the caller's transaction and brings the projection and the animals' size
 * and sex (molt facts) up to date with the ones that are new. Returns the ids stored now: a
 * phone's re-sent tap is already there and is left as it was.
 */
export async function recordEvents(
  db: Db,
  collection: EventCollection,
  events: DeviceEvent[],
  source: DeviceSource,
): Promise<Set<string>>;
export async function recordEvents(
  db: Db,
  collection: EventCollection,
  events: ServerFact[],
  source: ServerSource,
): Promise<Set<string>>;
export async function recordEvents(
  db: Db,
  collection: Pick<EventCollection, 'collectionId'>,
  events: KeptEvent[],
  source: HistorySource,
): Promise<Set<string>>;
export async function recordEvents(
  db: Db,
  collection: EventCollection | Pick<EventCollection, 'collectionId'>,
  events: (DeviceEvent | ServerFact | KeptEvent)[],
  source: DeviceSource | ServerSource | HistorySource,
): Promise<Set<string>> {
  if (!events.length) return new Set();
  const { collectionId } = collection;
  if (source.from === 'history')
    return insertEvents(
      db,
      (events as KeptEvent[]).map((e) => ({ ...e, collectionId })),
      'fail',
    );
  const { timeZone } = collection as EventCollection;

  const rows: NewEvent[] =
    source.from === 'device'
      ? (events as DeviceEvent[]).map((e) => ({
          ...e,
          collectionId,
          serverReceivedAt: source.receivedAt,
          flags: e.flags ?? [],
        }))
      : (events as ServerFact[]).map((e) => ({
          ...e,
          id: randomUUID(),
          collectionId,
          // Stamped with the server's clock: there is no phone whose clock could be wrong.
          deviceId: 'server',
          clientRecordedAt: source.at,
          clientSentAt: source.at,
          serverReceivedAt: source.at,
          effectiveAt: e.effectiveAt ?? source.at,
        }));
  // The animals' states are locked first (in id order), their new states folded here, and the
  // events and states written in one statement just before the commit: the collection's change
  // counter, bumped by the insert, is then held only for the commit (P5, P7).
  const animalIds = [...new Set(rows.map((r) => r.animalId))];
  const current = await lockStates(db, collectionId, animalIds);
  const { updated, refold } = foldNewEvents(
    current,
    timeZone,
    rows.map((e) => ({
      id: e.id,
      animalId: e.animalId,
      kind: e.kind as EventKind,
      payload: e.payload as Record<string, unknown>,
      effectiveAt: e.effectiveAt.toISOString(),
    })),
  );
  const stored = await insertEvents(db, rows, 'skip', { collectionId, states: updated });
  const fresh = rows.filter((r) => stored.has(r.id));
  // A re-sent tap was already stored (it raced its first delivery): the states folded above
  // counted it again, so its animal is re-folded from the log, which holds it once.
  const raced = new Set(rows.filter((r) => !stored.has(r.id)).map((r) => r.animalId));
  const again = [...new Set([...refold, ...raced])];
  if (again.length) await refoldStates(db, collectionId, timeZone, again);
  await applyMoltFacts(db, collectionId, timeZone, [
    ...new Set(fresh.filter((e) => MOLT_FACT_KINDS.includes(e.kind)).map((e) => e.animalId)),
  ]);
  await applyRehouses(db, fresh);
  return stored;
}

/**
 * R22: a rehouse that gives the new enclosure's inside size puts it on the animal record, so the
 * round measures the next molt against the new enclosure (the latest rehouse last).
 */
async function applyRehouses(db: Db, fresh: readonly NewEvent[]) {
  const rehouses = fresh
    .filter((e) => e.kind === 'rehoused')
    .sort((a, b) => a.effectiveAt.getTime() - b.effectiveAt.getTime());
  for (const e of rehouses) {
    const p = e.payload as { lengthMm?: number; widthMm?: number; heightMm?: number };
    const values = {
      ...(p.lengthMm !== undefined ? { enclosureLengthMm: p.lengthMm } : {}),
      ...(p.widthMm !== undefined ? { enclosureWidthMm: p.widthMm } : {}),
      ...(p.heightMm !== undefined ? { enclosureHeightMm: p.heightMm } : {}),
    };
    if (Object.keys(values).length) await setEnclosure(db, e.animalId, values);
  }
}
