import { eq, inArray, sql } from 'drizzle-orm';
import type { AnimalState, EngineEvent } from '#shared/domain/rounds/animal-state';
import type { Db } from '../../db/client';
import { animals, events } from '../../db/schema/animals';
import { animalStates } from '../../db/schema/rounds';

/** Every animal of a collection, by id. */
export async function animalIdsOf(db: Db, collectionId: string): Promise<string[]> {
  return (
    await db.select({ id: animals.id }).from(animals).where(eq(animals.collectionId, collectionId))
  ).map((r) => r.id);
}

/** These animals' projected states, locked until the caller's transaction ends. */
export async function lockStates(db: Db, animalIds: string[]): Promise<Map<string, AnimalState>> {
  const rows = await db
    .select({ animalId: animalStates.animalId, state: animalStates.state })
    .from(animalStates)
    .where(sql`${animalStates.animalId} = any(${sql.param(animalIds)}::uuid[])`)
    .for('update');
  return new Map(rows.map((r) => [r.animalId, r.state as AnimalState]));
}

/** Each animal's whole log as the engine folds it (unordered: the fold sorts). */
export async function loadEventsOf(
  db: Db,
  animalIds: string[],
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
    .where(inArray(events.animalId, animalIds));
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
  for (let i = 0; i < states.length; i += 1000) {
    const chunk = states.slice(i, i + 1000);
    await db.execute(sql`
      insert into animal_states (animal_id, collection_id, state, last_event_at, updated_at)
      select t.animal_id, ${collectionId}::uuid, t.state::jsonb, t.last_event_at, now()
      from unnest(${sql.param(chunk.map((s) => s.animalId))}::uuid[], ${sql.param(chunk.map((s) => JSON.stringify(s.state)))}::text[],
                  ${sql.param(chunk.map((s) => s.state.lastEventAt))}::timestamptz[]) as t(animal_id, state, last_event_at)
      on conflict (animal_id) do update set state = excluded.state, last_event_at = excluded.last_event_at, updated_at = excluded.updated_at`);
  }
}
