import { and, desc, eq, inArray, sql } from 'drizzle-orm';
import type { Db } from '../../db/client';
import { animals, eventPhotos, events } from '../../db/schema/animals';
import { users } from '../../db/schema/users';

export type NewEvent = typeof events.$inferInsert;

const list = (values: unknown[]) => sql.param(values);

/**
 * Inserts events in one statement per 1,000 over unnest()ed column arrays: a dozen parameters
 * instead of thousands (P5). `ifStored: 'skip'` leaves a re-sent id as it was (the ids of
 * phones' taps are their key) and returns only the ids inserted now; `'fail'` makes a repeated
 * id an error (a backup listing an entry twice).
 */
export async function insertEvents(
  db: Db,
  rows: NewEvent[],
  ifStored: 'skip' | 'fail',
  states?: StatesToWrite,
): Promise<Set<string>> {
  const inserted = new Set<string>();
  for (let i = 0; i < rows.length; i += 1000) {
    const chunk = rows.slice(i, i + 1000);
    const iso = (d: Date | null | undefined) => d?.toISOString() ?? null;
    // The projected states go with the first chunk, in the same statement (one round trip).
    const withStates = i === 0 && states?.states.length ? states : null;
    const result = await db.execute<{ id: string }>(sql`
      ${withStates ? sql`with ins as (` : sql``}
      insert into events (id, collection_id, animal_id, kind, payload, recorded_by, device_id,
                          client_recorded_at, client_sent_at, server_received_at, effective_at, flags)
      select t.id, t.collection_id, t.animal_id, t.kind, t.payload::jsonb, t.recorded_by, t.device_id,
             t.client_recorded_at, t.client_sent_at, t.server_received_at, t.effective_at,
             coalesce(string_to_array(nullif(t.flags, ''), ','), '{}')
      from unnest(
        ${list(chunk.map((r) => r.id))}::uuid[], ${list(chunk.map((r) => r.collectionId))}::uuid[],
        ${list(chunk.map((r) => r.animalId))}::uuid[], ${list(chunk.map((r) => r.kind))}::text[],
        ${list(chunk.map((r) => JSON.stringify(r.payload ?? {})))}::text[], ${list(chunk.map((r) => r.recordedBy ?? null))}::uuid[],
        ${list(chunk.map((r) => r.deviceId ?? null))}::text[], ${list(chunk.map((r) => iso(r.clientRecordedAt)))}::timestamptz[],
        ${list(chunk.map((r) => iso(r.clientSentAt)))}::timestamptz[], ${list(chunk.map((r) => iso(r.serverReceivedAt) ?? new Date().toISOString()))}::timestamptz[],
        ${list(chunk.map((r) => iso(r.effectiveAt)))}::timestamptz[], ${list(chunk.map((r) => (r.flags ?? []).join(',')))}::text[]
      ) as t(id, collection_id, animal_id, kind, payload, recorded_by, device_id,
             client_recorded_at, client_sent_at, server_received_at, effective_at, flags)
      ${ifStored === 'skip' ? sql`on conflict (id) do nothing` : sql``}
      returning id
      ${withStates ? sql`), st as (${upsertStatesSql(withStates)}) select id from ins` : sql``}`);
    for (const r of result.rows) inserted.add(r.id);
  }
  return inserted;
}

/** Projected states to write with new events (projection.ts decides them). */
export interface StatesToWrite {
  collectionId: string;
  states: { animalId: string; state: { lastEventAt: string | null } }[];
}

/** The upsert of projected states over unnest()ed arrays. */
export function upsertStatesSql({ collectionId, states }: StatesToWrite) {
  return sql`
    insert into animal_states (animal_id, collection_id, state, last_event_at, updated_at)
    select t.animal_id, ${collectionId}::uuid, t.state::jsonb, t.last_event_at, now()
    from unnest(${list(states.map((s) => s.animalId))}::uuid[], ${list(states.map((s) => JSON.stringify(s.state)))}::text[],
                ${list(states.map((s) => s.state.lastEventAt))}::timestamptz[]) as t(animal_id, state, last_event_at)
    on conflict (animal_id) do update set state = excluded.state, last_event_at = excluded.last_event_at, updated_at = excluded.updated_at`;
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
    .where(
      and(eq(animals.collectionId, collectionId), sql`${animals.id} = any(${list(ids)}::uuid[])`),
    );
  return new Set(rows.map((r) => r.id));
}

/** What deciding whether an animal may breed needs (name, sex, group), by id. */
export async function breedersAmong(db: Db, collectionId: string, ids: string[]) {
  if (!ids.length)
    return new Map<
      string,
      {
        name: string;
        sex: (typeof animals.$inferSelect)['sex'];
        group: (typeof animals.$inferSelect)['group'];
      }
    >();
  const rows = await db
    .select({ id: animals.id, name: animals.name, sex: animals.sex, group: animals.group })
    .from(animals)
    .where(
      and(eq(animals.collectionId, collectionId), sql`${animals.id} = any(${list(ids)}::uuid[])`),
    );
  return new Map(rows.map(({ id, ...r }) => [id, r]));
}

/** Stored events by id, with what a duplicate or void check needs. */
export async function storedEvents(db: Db, ids: string[]) {
  if (!ids.length)
    return new Map<
      string,
      { collectionId: string; animalId: string; kind: string; recordedBy: string | null }
    >();
  const rows = await db
    .select({
      id: events.id,
      collectionId: events.collectionId,
      animalId: events.animalId,
      kind: events.kind,
      recordedBy: events.recordedBy,
    })
    .from(events)
    .where(sql`${events.id} = any(${list(ids)}::uuid[])`);
  return new Map(rows.map((r) => [r.id, r]));
}

/** When each of these animals molted, molts undone by a void left out. */
export async function liveMoltTimes(db: Db, animalIds: string[]): Promise<Map<string, Date[]>> {
  const byAnimal = new Map<string, Date[]>(animalIds.map((id) => [id, []]));
  if (!animalIds.length) return byAnimal;
  const { rows } = await db.execute<{ animal_id: string; effective_at: Date }>(sql`
    select m.animal_id, m.effective_at from ${events} m
    where m.kind = 'molted' and m.animal_id = any(${list(animalIds)}::uuid[])
      and not exists (select 1 from ${events} v where v.kind = 'void' and v.animal_id = m.animal_id and v.payload ->> 'targetId' = m.id::text)`);
  for (const r of rows) byAnimal.get(r.animal_id)?.push(new Date(r.effective_at));
  return byAnimal;
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
      photo: eventPhotos.createdAt,
    })
    .from(events)
    .leftJoin(users, eq(users.id, events.recordedBy))
    .leftJoin(eventPhotos, eq(eventPhotos.eventId, events.id))
    .where(and(eq(events.collectionId, collectionId), eq(events.animalId, animalId)))
    .orderBy(desc(events.effectiveAt), desc(events.id))
    .limit(limit);
}

/** These animals' molts, molt details and voids: what their size and sex follow. */
export async function moltRecordsOf(db: Db, collectionId: string, animalIds: string[]) {
  return db
    .select({
      id: events.id,
      animalId: events.animalId,
      kind: events.kind,
      payload: events.payload,
      at: events.effectiveAt,
    })
    .from(events)
    .where(
      and(
        eq(events.collectionId, collectionId),
        inArray(events.animalId, animalIds),
        inArray(events.kind, ['molted', 'molt_details', 'void']),
      ),
    );
}

export async function sexesOf(db: Db, animalIds: string[]) {
  return db
    .select({ id: animals.id, sex: animals.sex })
    .from(animals)
    .where(inArray(animals.id, animalIds));
}

export async function setSexAndSize(
  db: Db,
  animalId: string,
  values: { sex: (typeof animals.$inferSelect)['sex']; sizeMm?: number },
) {
  await db.update(animals).set(values).where(eq(animals.id, animalId));
}

/** A rehouse's new enclosure size on the animal record (R22). */
export async function setEnclosure(
  db: Db,
  animalId: string,
  values: Partial<
    Pick<
      typeof animals.$inferInsert,
      'enclosureLengthMm' | 'enclosureWidthMm' | 'enclosureHeightMm'
    >
  >,
) {
  await db
    .update(animals)
    .set({ ...values, updatedAt: new Date() })
    .where(eq(animals.id, animalId));
}
