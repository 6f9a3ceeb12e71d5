// The projection the round engine reads (animal_states): each animal's log folded into its
// state, kept in step with the log in the same transaction as every write to it.
import {
  applyEvent,
  EMPTY_STATE,
  isInOrder,
  projectState,
  type AnimalState,
  type EngineEvent,
} from '#shared/domain/rounds/animal-state';
import type { Db } from '../../db/client';
import { animalIdsOf, loadEventsOf, lockStates, upsertStates } from './projection.repository';

/**
 * Each animal's log, for a reader whose stored state is out of date: whole, or with `before`
 * what folding it up to that instant needs (projectState with `before`).
 */
export const eventLogsOf = (
  db: Db,
  animalIds: string[],
  before?: Date,
): Promise<Map<string, EngineEvent[]>> => loadEventsOf(db, animalIds, before);

/** Re-folds animals' states from the whole event log (all of a collection's when no ids). */
export async function refoldStates(
  db: Db,
  collectionId: string,
  zone: string,
  animalIds?: string[],
) {
  const ids = animalIds ?? (await animalIdsOf(db, collectionId));
  const logs = await loadEventsOf(db, ids);
  await upsertStates(
    db,
    collectionId,
    ids.map((id) => ({ animalId: id, state: projectState(logs.get(id) ?? [], zone) })),
  );
}

/**
 * What newly stored events make of the projection, from the locked current states: events
 * that come after everything folded so far are applied one by one (`updated`); an animal that
 * got an event out of order (a phone syncing late) or a void is re-folded from its log
 * (`refold`, once the events are stored).
 */
export function foldNewEvents(
  current: ReadonlyMap<string, AnimalState>,
  zone: string,
  fresh: (EngineEvent & { animalId: string })[],
) {
  const byAnimal = new Map<string, EngineEvent[]>();
  for (const e of fresh) {
    const list = byAnimal.get(e.animalId);
    if (list) list.push(e);
    else byAnimal.set(e.animalId, [e]);
  }
  const refold: string[] = [];
  const updated: { animalId: string; state: AnimalState }[] = [];
  for (const [animalId, list] of byAnimal) {
    let state = current.get(animalId) ?? EMPTY_STATE;
    const sorted = [...list].sort((a, b) =>
      a.effectiveAt < b.effectiveAt ? -1 : a.effectiveAt > b.effectiveAt ? 1 : a.id < b.id ? -1 : 1,
    );
    if (sorted.some((e) => e.kind === 'void') || !isInOrder(state, sorted[0]!)) {
      refold.push(animalId);
      continue;
    }
    for (const e of sorted) state = applyEvent(state, e, zone);
    updated.push({ animalId, state });
  }
  return { updated, refold };
}

/**
 * Brings the projection up to date with newly stored events, in the caller's transaction
 * (the events are already stored: see recordEvents for the path that writes both at once).
 */
export async function applyNewEvents(
  db: Db,
  collectionId: string,
  zone: string,
  fresh: (EngineEvent & { animalId: string })[],
) {
  const ids = [...new Set(fresh.map((e) => e.animalId))];
  if (!ids.length) return;
  const { updated, refold } = foldNewEvents(await lockStates(db, collectionId, ids), zone, fresh);
  await upsertStates(db, collectionId, updated);
  if (refold.length) await refoldStates(db, collectionId, zone, refold);
}
