import { and, asc, eq, gte, inArray, sql } from 'drizzle-orm';
import type { LocalDate } from '#shared/domain/local-dates';
import type { Db } from '../../db/client';
import { animals, events, handoverNotes } from '../../db/schema/animals';
import { collections, locations } from '../../db/schema/collections';
import { animalStates, roundItems, rounds } from '../../db/schema/rounds';
import { users } from '../../db/schema/users';

export async function findCollection(db: Db, collectionId: string) {
  const [row] = await db
    .select()
    .from(collections)
    .where(eq(collections.id, collectionId))
    .limit(1);
  return row ?? null;
}
/** A collection as the round reads it: its zone, rules and feeders. */
export type RoundCollection = NonNullable<Awaited<ReturnType<typeof findCollection>>>;

export async function updateCollectionRules(db: Db, collectionId: string, rules: unknown) {
  await db.update(collections).set({ rules }).where(eq(collections.id, collectionId));
}

/** Every animal of a collection with its place and its projected state (one query). */
export async function loadAnimalsWithState(db: Db, collectionId: string, animalIds?: string[]) {
  return db
    .select({
      animal: animals,
      location: locations,
      state: animalStates.state,
      lastEventAt: animalStates.lastEventAt,
    })
    .from(animals)
    .leftJoin(locations, eq(locations.id, animals.locationId))
    .leftJoin(animalStates, eq(animalStates.animalId, animals.id))
    .where(
      animalIds
        ? and(eq(animals.collectionId, collectionId), inArray(animals.id, animalIds))
        : eq(animals.collectionId, collectionId),
    );
}
export type AnimalRow = Awaited<ReturnType<typeof loadAnimalsWithState>>[number];

/** Handover notes saying "do not feed" that still run on or after `from`: each animal's last held day. */
export async function doNotFeedNotes(db: Db, collectionId: string, from: LocalDate) {
  return db
    .select({ animalId: handoverNotes.animalId, until: handoverNotes.until })
    .from(handoverNotes)
    .where(
      and(
        eq(handoverNotes.collectionId, collectionId),
        eq(handoverNotes.doNotFeed, true),
        gte(handoverNotes.until, from),
      ),
    );
}

/** Animals with events the server received at or after `since` (a sync that raced a build). */
export async function animalsWithEventsSince(db: Db, collectionId: string, since: Date) {
  const rows = await db
    .selectDistinct({ animalId: events.animalId })
    .from(events)
    .where(and(eq(events.collectionId, collectionId), gte(events.serverReceivedAt, since)));
  return rows.map((r) => r.animalId);
}

export async function findRound(db: Db, collectionId: string, date: LocalDate) {
  const [row] = await db
    .select()
    .from(rounds)
    .where(and(eq(rounds.collectionId, collectionId), eq(rounds.localDate, date)))
    .limit(1);
  return row ?? null;
}

/** Inserts the round row unless one exists: returns its id only when this call created it. */
export async function claimRound(db: Db, collectionId: string, date: LocalDate, prepList: unknown) {
  const [row] = await db
    .insert(rounds)
    .values({ collectionId, localDate: date, prepList })
    .onConflictDoNothing({ target: [rounds.collectionId, rounds.localDate] })
    .returning({ id: rounds.id });
  return row?.id ?? null;
}

export type NewRoundItem = typeof roundItems.$inferInsert;

/** A round item as the jsonb_to_recordset statements below read it. */
const itemRow = (it: Omit<NewRoundItem, 'roundId'>) => ({
  animal_id: it.animalId,
  sort_index: it.sortIndex,
  tasks: it.tasks,
  notes: it.notes ?? [],
  carried_over_days: it.carriedOverDays ?? 0,
});

/**
 * Writes a round's items as one JSON document per 5,000 rows: PostgreSQL unpacks it with
 * jsonb_to_recordset far faster than it binds tens of thousands of parameters.
 */
export async function insertRoundItems(
  db: Db,
  roundId: string,
  items: Omit<NewRoundItem, 'roundId'>[],
) {
  for (let i = 0; i < items.length; i += 5000) {
    const chunk = items.slice(i, i + 5000).map(itemRow);
    await db.execute(sql`
      insert into round_items (round_id, animal_id, sort_index, tasks, notes, carried_over_days)
      select ${roundId}::uuid, x.animal_id, x.sort_index, x.tasks, x.notes, x.carried_over_days
      from jsonb_to_recordset(${JSON.stringify(chunk)}::jsonb)
        as x(animal_id uuid, sort_index int, tasks jsonb, notes jsonb, carried_over_days int)`);
  }
}

/**
 * Items added or rewritten during the day (R18), in one statement: an animal's item that is
 * already there keeps its place and gets the new tasks and notes.
 */
export async function upsertUrgentItems(db: Db, items: NewRoundItem[]) {
  if (!items.length) return;
  const rows = items.map((it) => ({ round_id: it.roundId, ...itemRow(it) }));
  await db.execute(sql`
    insert into round_items (round_id, animal_id, sort_index, tasks, notes, carried_over_days, added_during_day)
    select x.round_id, x.animal_id, x.sort_index, x.tasks, x.notes, x.carried_over_days, true
    from jsonb_to_recordset(${JSON.stringify(rows)}::jsonb)
      as x(round_id uuid, animal_id uuid, sort_index int, tasks jsonb, notes jsonb, carried_over_days int)
    on conflict (round_id, animal_id) do update
      set tasks = excluded.tasks, notes = excluded.notes, added_during_day = true`);
}

/** Day's items with tasks changed during the day (a hold withdrew some, R18), in one statement. */
export async function updateItemsTasks(db: Db, changes: { id: string; tasks: unknown }[]) {
  if (!changes.length) return;
  await db.execute(sql`
    update round_items i set tasks = x.tasks
    from jsonb_to_recordset(${JSON.stringify(changes)}::jsonb) as x(id uuid, tasks jsonb)
    where i.id = x.id`);
}

/**
 * A date's round, if built, with these animals' items (active animals only, as
 * `loadRoundItems` gives them): what bringing the round in line during the day reads, in one
 * query.
 */
export async function roundWithItemsOf(
  db: Db,
  collectionId: string,
  date: LocalDate,
  animalIds: string[],
) {
  const { rows } = await db.execute<{
    round_id: string;
    id: string | null;
    animal_id: string | null;
    sort_index: number | null;
    tasks: unknown;
    notes: unknown;
    carried_over_days: number | null;
  }>(sql`
    select r.id as round_id, i.id, i.animal_id, i.sort_index, i.tasks, i.notes, i.carried_over_days
    from ${rounds} r
    left join (${roundItems} i join ${animals} a on a.id = i.animal_id and a.status = 'active')
      on i.round_id = r.id and i.animal_id = any(${sql.param(animalIds)}::uuid[])
    where r.collection_id = ${collectionId} and r.local_date = ${date}`);
  if (!rows.length) return null;
  return {
    roundId: rows[0]!.round_id,
    items: rows
      .filter((r) => r.id !== null)
      .map((r) => ({
        id: r.id!,
        animalId: r.animal_id!,
        sortIndex: r.sort_index!,
        tasks: r.tasks,
        notes: r.notes,
        carriedOverDays: r.carried_over_days!,
      })),
  };
}

/** A round's items with their animals; only some animals' items when `animalIds` is given. */
export async function loadRoundItems(db: Db, roundId: string, animalIds?: string[]) {
  return (
    db
      .select({ item: roundItems, animal: animals, location: locations })
      .from(roundItems)
      .innerJoin(animals, eq(animals.id, roundItems.animalId))
      .leftJoin(locations, eq(locations.id, animals.locationId))
      // An animal retired during the day leaves today's round at once.
      .where(
        and(
          eq(roundItems.roundId, roundId),
          eq(animals.status, 'active'),
          animalIds ? inArray(roundItems.animalId, animalIds) : undefined,
        ),
      )
      .orderBy(asc(roundItems.sortIndex))
  );
}

/**
 * A collection's events in [from, to) with who recorded them: the day's outcomes. Plain SQL
 * with only the fields a round shows (not the whole payload): it runs whenever a tap lands.
 */
export async function loadOutcomes(
  db: Db,
  collectionId: string,
  from: Date,
  to: Date,
  animalIds?: string[],
) {
  const { rows } = await db.execute<{
    id: string;
    animal_id: string;
    kind: string;
    effective_at: Date;
    target_id: string | null;
    by: string | null;
  }>(sql`
    select e.id, e.animal_id, e.kind, e.effective_at, e.payload ->> 'targetId' as target_id, u.display_name as by
    from ${events} e left join ${users} u on u.id = e.recorded_by
    where e.collection_id = ${collectionId} and e.effective_at >= ${from.toISOString()} and e.effective_at < ${to.toISOString()}
      ${
        animalIds
          ? sql`and e.animal_id in (${sql.join(
              animalIds.map((id) => sql`${id}::uuid`),
              sql`, `,
            )})`
          : sql``
      }`);
  return rows.map((r) => ({
    id: r.id,
    animalId: r.animal_id,
    kind: r.kind,
    effectiveAt: new Date(r.effective_at),
    targetId: r.target_id,
    by: r.by,
  }));
}

/**
 * Of a collection's events in [from, to) for these animals, the first of each kind that no
 * undo of the period cancelled (undos themselves left out): what `loadOutcomes` gives, cut to
 * what settling a task asks — whether an outcome of a kind stands (settle.ts: liveOutcomes,
 * settlingOutcome). A reconciliation runs at every sync: an animal with a busy day has many
 * outcomes, and this reads a few.
 */
export async function loadSettlingOutcomes(
  db: Db,
  collectionId: string,
  from: Date,
  to: Date,
  animalIds: string[],
) {
  if (!animalIds.length) return [];
  const { rows } = await db.execute<{
    id: string;
    animal_id: string;
    kind: string;
    effective_at: Date;
    by: string | null;
  }>(sql`
    with day as materialized (
      select e.id, e.animal_id, e.kind, e.effective_at, e.recorded_by,
             case when e.kind = 'void' then e.payload ->> 'targetId' end as target_id
      from ${events} e
      where e.collection_id = ${collectionId} and e.animal_id = any(${sql.param(animalIds)}::uuid[])
        and e.effective_at >= ${from.toISOString()} and e.effective_at < ${to.toISOString()}
    ),
    -- An undo counts for its own animal's list, as liveOutcomes reads it.
    undone as (select distinct animal_id, target_id from day where target_id is not null),
    firsts as (
      select distinct on (d.animal_id, d.kind) d.id, d.animal_id, d.kind, d.effective_at, d.recorded_by
      from day d left join undone x on x.animal_id = d.animal_id and x.target_id = d.id::text
      where d.kind <> 'void' and x.target_id is null
      order by d.animal_id, d.kind, d.effective_at, d.id
    )
    select f.id, f.animal_id, f.kind, f.effective_at, u.display_name as by
    from firsts f left join ${users} u on u.id = f.recorded_by`);
  return rows.map((r) => ({
    id: r.id,
    animalId: r.animal_id,
    kind: r.kind,
    effectiveAt: new Date(r.effective_at),
    targetId: null,
    by: r.by,
  }));
}

/** Each collection with the date of its newest built round (null when none). */
export async function collectionsWithLatestRound(db: Db) {
  return db
    .select({
      id: collections.id,
      timeZone: collections.timeZone,
      latest: sql<string | null>`max(${rounds.localDate})`,
    })
    .from(collections)
    .leftJoin(rounds, eq(rounds.collectionId, collections.id))
    .groupBy(collections.id);
}
