import { and, asc, count, eq, inArray, sql } from 'drizzle-orm';
import type { EventKind } from '#shared/domain/event-kinds';
import type { Db } from '../../db/client';
import { animals, eggSacs, events } from '../../db/schema/animals';
import { collections, locations } from '../../db/schema/collections';

export type EggSacRow = typeof eggSacs.$inferSelect;
type NewAnimal = typeof animals.$inferInsert;

/** The collection's usual incubation window, for records of groups without their own. */
export async function incubationDefaults(db: Db, collectionId: string) {
  const [c] = await db
    .select({ minDays: collections.incubationMinDays, maxDays: collections.incubationMaxDays })
    .from(collections)
    .where(eq(collections.id, collectionId));
  return c!;
}

export async function findAnimal(db: Db, collectionId: string, animalId: string) {
  const [a] = await db
    .select()
    .from(animals)
    .where(and(eq(animals.id, animalId), eq(animals.collectionId, collectionId)));
  return a ?? null;
}

export async function findSac(db: Db, collectionId: string, sacId: string) {
  const [row] = await db
    .select()
    .from(eggSacs)
    .where(and(eq(eggSacs.id, sacId), eq(eggSacs.collectionId, collectionId)));
  return row ?? null;
}

/** A collection's records with their female, oldest first, and how many young each potted up. */
export async function listSacs(db: Db, collectionId: string) {
  const rows = await db
    .select({ sac: eggSacs, female: animals.name, group: animals.group })
    .from(eggSacs)
    .innerJoin(animals, eq(animals.id, eggSacs.femaleId))
    .where(eq(eggSacs.collectionId, collectionId))
    .orderBy(asc(eggSacs.laidOn));
  const clutches = rows.map((r) => r.sac.clutch);
  const made = clutches.length
    ? await db
        .select({ clutch: animals.clutch, n: count() })
        .from(animals)
        .where(and(eq(animals.collectionId, collectionId), inArray(animals.clutch, clutches)))
        .groupBy(animals.clutch)
    : [];
  const byClutch = new Map(made.map((m) => [m.clutch, m.n]));
  return rows.map((r) => ({ ...r, slingsCreated: byClutch.get(r.sac.clutch) ?? 0 }));
}

export async function insertSac(db: Db, values: typeof eggSacs.$inferInsert) {
  const [row] = await db.insert(eggSacs).values(values).returning();
  return row!;
}

export async function updateSac(
  db: Db,
  sacId: string,
  values: Partial<typeof eggSacs.$inferInsert>,
) {
  const [row] = await db.update(eggSacs).set(values).where(eq(eggSacs.id, sacId)).returning();
  return row!;
}

/** Marks how many young a record produced, when the keeper had not counted them. */
export async function setSlingCount(db: Db, sacId: string, count: number) {
  await db.update(eggSacs).set({ slingCount: count }).where(eq(eggSacs.id, sacId));
}

export async function codesInCollection(db: Db, collectionId: string) {
  return (
    await db
      .select({ code: animals.labelCode })
      .from(animals)
      .where(eq(animals.collectionId, collectionId))
  ).map((r) => r.code);
}

/** The names of the spots on one shelf. */
export async function positionsOnShelf(
  db: Db,
  collectionId: string,
  shelf: { room: string; rack: string; shelf: string },
) {
  return (
    await db
      .select({ position: locations.position })
      .from(locations)
      .where(
        and(
          eq(locations.collectionId, collectionId),
          eq(locations.room, shelf.room),
          eq(locations.rack, shelf.rack),
          eq(locations.shelf, shelf.shelf),
        ),
      )
  ).map((l) => l.position);
}

/** Many animals, 250 rows a statement; their ids in the order given. */
export async function insertAnimalsReturningIds(db: Db, rows: NewAnimal[]) {
  const ids: string[] = [];
  for (let i = 0; i < rows.length; i += 250)
    ids.push(
      ...(
        await db
          .insert(animals)
          .values(rows.slice(i, i + 250))
          .returning({ id: animals.id })
      ).map((r) => r.id),
    );
  return ids;
}

export async function setIncubation(
  db: Db,
  collectionId: string,
  minDays: number,
  maxDays: number,
) {
  await db
    .update(collections)
    .set({ incubationMinDays: minDays, incubationMaxDays: maxDays })
    .where(eq(collections.id, collectionId));
}

export async function sacCountOf(db: Db, femaleId: string) {
  const [{ n } = { n: 0 }] = await db
    .select({ n: count() })
    .from(eggSacs)
    .where(eq(eggSacs.femaleId, femaleId));
  return n;
}

/**
 * A female's breeding facts of these kinds that no void has cancelled, with the record each
 * was written for (null for facts written before records were named in them).
 */
export async function liveBreedingFacts(db: Db, femaleId: string, kinds: readonly EventKind[]) {
  const rows = await db
    .select({
      id: events.id,
      kind: events.kind,
      effectiveAt: events.effectiveAt,
      sacId: sql<string | null>`${events.payload}->>'sacId'`,
    })
    .from(events)
    .where(
      and(
        eq(events.animalId, femaleId),
        sql`${events.kind} = any(${sql.param([...kinds])}::text[])`,
        sql`not exists (select 1 from events v where v.animal_id = ${events.animalId} and v.kind = 'void' and v.payload->>'targetId' = ${events.id}::text)`,
      ),
    )
    .orderBy(asc(events.effectiveAt), asc(events.id));
  return rows.map((r) => ({ ...r, kind: r.kind as EventKind }));
}
