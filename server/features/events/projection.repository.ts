import { and, eq, inArray, lt, or, sql } from 'drizzle-orm';
import {
  EMPTY_STATE,
  type AnimalState,
  type EngineEvent,
} from '#shared/domain/rounds/animal-state';
import type { Db } from '../../db/client';
import { animals, events } from '../../db/schema/animals';
import { animalStates } from '../../db/schema/rounds';
import { upsertStatesSql } from './events.repository';

/** Every animal of a collection, by id. */
export async function animalIdsOf(db: Db, collectionId: string): Promise<string[]> {
  return (
    await db.select({ id: animals.id }).from(animals).where(eq(animals.collectionId, collectionId))
  ).map((r) => r.id);
}

/**
 * These animals' projected states, locked until the caller's transaction ends — in id order,
 * so two batches sharing animals wait for each other instead of deadlocking. An animal with no
 * state yet gets an empty one first, so that it too is locked (two first batches for the same
 * animal must not both fold from nothing).
 */
export async function lockStates(
  db: Db,
  collectionId: string,
  animalIds: string[],
): Promise<Map<string, AnimalState>> {
  const lock = async (ids: string[]) =>
    (
      await db
        .select({ animalId: animalStates.animalId, state: animalStates.state })
        .from(animalStates)
        .where(sql`${animalStates.animalId} = any(${sql.param(ids)}::uuid[])`)
        .orderBy(animalStates.animalId)
        .for('update')
    ).map((r) => [r.animalId, r.state as AnimalState] as const);
  const found = new Map(await lock(animalIds));
  // Created in id order too (waits on another's new rows then follow the same order).
  const missing = animalIds.filter((id) => !found.has(id)).sort();
  if (!missing.length) return found;
  await db.execute(sql`
    insert into animal_states (animal_id, collection_id, state, last_event_at, updated_at)
    select t.id, ${collectionId}::uuid, ${JSON.stringify(EMPTY_STATE)}::jsonb, null, now()
    from unnest(${sql.param(missing)}::uuid[]) as t(id)
    on conflict (animal_id) do nothing`);
  for (const [id, state] of await lock(missing)) found.set(id, state);
  return found;
}

/**
 * Each animal's whole log as the engine folds it (unordered: the fold sorts). With `before`,
 * only what a fold up to that instant reads: the events before it, and every undo (an undo
 * made later still cancels an earlier event).
 */
export async function loadEventsOf(
  db: Db,
  animalIds: string[],
  before?: Date,
): Promise<Map<string, EngineEvent[]>> {
  const byAnimal = new Map<string, EngineEvent[]>(animalIds.map((id) => [id, []]));
  if (!animalIds.length) return byAnimal;
  const rows = await db
    .select({
      id: events.id,
      animalId: events.animalId,
      kind: events.kind,
      effectiveAt: events.effectiveAt,
      payload: events.payload,
    })
    .from(events)
    .where(
      before
        ? and(
            sql`${events.animalId} = any(${sql.param(animalIds)}::uuid[])`,
            or(lt(events.effectiveAt, before), eq(events.kind, 'void')),
          )
        : inArray(events.animalId, animalIds),
    );
  for (const r of rows) {
    byAnimal.get(r.animalId)!.push({
      id: r.id,
      kind: r.kind as EngineEvent['kind'],
      effectiveAt: r.effectiveAt.toISOString(),
      payload: r.payload as Record<string, unknown>,
    });
  }
  return byAnimal;
}

/** Writes projected states, one statement per 1,000 animals over unnest()ed arrays. */
export async function upsertStates(
  db: Db,
  collectionId: string,
  states: { animalId: string; state: AnimalState }[],
) {
  for (let i = 0; i < states.length; i += 1000)
    await db.execute(upsertStatesSql({ collectionId, states: states.slice(i, i + 1000) }));
}
