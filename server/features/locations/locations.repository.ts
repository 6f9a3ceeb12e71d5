import { and, asc, count, eq, inArray, isNotNull, sql } from 'drizzle-orm';
import type { Db } from '../../db/client';
import { animals } from '../../db/schema/animals';
import { locations } from '../../db/schema/collections';

export type Place = { room: string; rack: string; shelf: string; position: string };

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

/** Every place of a collection with its walk position (ties broken by the caller). */
export async function placesOf(db: Db, collectionId: string) {
  return db
    .select({
      id: locations.id,
      room: locations.room,
      rack: locations.rack,
      shelf: locations.shelf,
      position: locations.position,
      walkOrder: locations.walkOrder,
    })
    .from(locations)
    .where(eq(locations.collectionId, collectionId));
}

/** New places; their walk positions are set afterwards with `setWalkOrder`. */
export async function insertPlaces(db: Db, collectionId: string, places: Place[]) {
  return db
    .insert(locations)
    .values(places.map((p) => ({ collectionId, ...p })))
    .returning();
}

/** The active animals living in a collection's places, by name. */
export async function occupantsOf(db: Db, collectionId: string) {
  return db
    .select({ id: animals.id, name: animals.name, locationId: animals.locationId })
    .from(animals)
    .where(
      and(
        eq(animals.collectionId, collectionId),
        eq(animals.status, 'active'),
        isNotNull(animals.locationId),
      ),
    )
    .orderBy(asc(animals.name));
}

type Group = { room: string; rack?: string; shelf?: string };
const inGroup = (collectionId: string, group: Group) =>
  and(
    eq(locations.collectionId, collectionId),
    eq(locations.room, group.room),
    group.rack === undefined ? undefined : eq(locations.rack, group.rack),
    group.shelf === undefined ? undefined : eq(locations.shelf, group.shelf),
  );

/** How many places a room, rack (room and rack) or shelf (room, rack and shelf) holds. */
export async function placesInGroup(db: Db, collectionId: string, group: Group) {
  const [row] = await db.select({ n: count() }).from(locations).where(inGroup(collectionId, group));
  return row?.n ?? 0;
}

/** Renames one part of every place in a group; how many places changed. */
export async function renameGroup(db: Db, collectionId: string, group: Group, set: Partial<Place>) {
  const changed = await db
    .update(locations)
    .set(set)
    .where(inGroup(collectionId, group))
    .returning({ id: locations.id });
  return changed.length;
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

export async function placeById(db: Db, collectionId: string, locationId: string) {
  const [row] = await db
    .select()
    .from(locations)
    .where(and(eq(locations.collectionId, collectionId), eq(locations.id, locationId)));
  return row ?? null;
}
