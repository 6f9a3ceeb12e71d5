import { and, asc, count, eq, inArray, sql } from 'drizzle-orm';
import type { Db } from '../../db/client';
import { animals } from '../../db/schema/animals';
import { locations } from '../../db/schema/collections';

type Place = { room: string; rack: string; shelf: string; position: string };

/** Every place of a collection in walk order, with how many active animals live there. */
export async function listWithAnimalCounts(db: Db, collectionId: string) {
  return db
    .select({ location: locations, animals: count(animals.id) })
    .from(locations)
    .leftJoin(animals, and(eq(animals.locationId, locations.id), eq(animals.status, 'active')))
    .where(eq(locations.collectionId, collectionId))
    .groupBy(locations.id)
    .orderBy(asc(locations.walkOrder));
}

/** A new place at the end of the walk until the keeper moves it. */
export async function insertAtEndOfWalk(db: Db, collectionId: string, place: Place) {
  const [{ last } = { last: 0 }] = await db
    .select({ last: sql<number>`coalesce(max(${locations.walkOrder}), 0)::int` })
    .from(locations)
    .where(eq(locations.collectionId, collectionId));
  const [row] = await db
    .insert(locations)
    .values({ collectionId, ...place, walkOrder: last + 1 })
    .returning();
  return row!;
}

/** The renamed place, or null when it is not in this collection. */
export async function updatePlace(db: Db, collectionId: string, locationId: string, place: Place) {
  const [row] = await db
    .update(locations)
    .set(place)
    .where(and(eq(locations.collectionId, collectionId), eq(locations.id, locationId)))
    .returning();
  return row ?? null;
}

export async function placeIdsOf(db: Db, collectionId: string) {
  return (
    await db
      .select({ id: locations.id })
      .from(locations)
      .where(eq(locations.collectionId, collectionId))
  ).map((l) => l.id);
}

/** One statement: each place's new position from its index in the list. */
export async function setWalkOrder(db: Db, locationIds: string[]) {
  await db.execute(
    sql`update locations set walk_order = o.i from unnest(${sql.param(locationIds)}::uuid[]) with ordinality as o(id, i) where locations.id = o.id`,
  );
}

/** Animals of any status whose last place this is. */
export async function animalsAt(db: Db, locationId: string) {
  const [row] = await db
    .select({ n: count() })
    .from(animals)
    .where(eq(animals.locationId, locationId));
  return row?.n ?? 0;
}

/** True when the place was in this collection and is now gone. */
export async function deletePlace(db: Db, collectionId: string, locationId: string) {
  const deleted = await db
    .delete(locations)
    .where(and(eq(locations.collectionId, collectionId), inArray(locations.id, [locationId])))
    .returning({ id: locations.id });
  return deleted.length > 0;
}
