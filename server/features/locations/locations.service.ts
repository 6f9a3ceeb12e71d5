import { and, asc, count, eq, inArray, sql } from 'drizzle-orm';
import type { NodePgDatabase } from 'drizzle-orm/node-postgres';
import { compareLocations } from '../../../shared/domain/walk-order';
import type { LocationInput, LocationWithCount } from '../../../shared/schemas/locations';
import { isUniqueViolation } from '../../db/errors';
import { animals } from '../../db/schema/animals';
import { locations } from '../../db/schema/collections';
import { HttpError } from '../../middleware/errors';

const placeTaken = () => new HttpError(409, 'place_taken', 'That place already exists in this collection.');
const notFound = () => new HttpError(404, 'not_found', 'We could not find that place.');

export function createLocationsService(db: NodePgDatabase) {
  return {
    /** Every place in walk order, with how many animals live there. */
    async list(collectionId: string): Promise<LocationWithCount[]> {
      const rows = await db
        .select({ location: locations, animals: count(animals.id) })
        .from(locations)
        .leftJoin(animals, and(eq(animals.locationId, locations.id), eq(animals.status, 'active')))
        .where(eq(locations.collectionId, collectionId))
        .groupBy(locations.id)
        .orderBy(asc(locations.walkOrder));
      return rows
        .map(({ location: l, animals: n }) => ({ id: l.id, room: l.room, rack: l.rack, shelf: l.shelf, position: l.position, walkOrder: l.walkOrder, animals: n }))
        .sort(compareLocations);
    },

    async create(collectionId: string, body: LocationInput) {
      // A new place goes at the end of the walk until the keeper moves it.
      const [{ last } = { last: 0 }] = await db
        .select({ last: sql<number>`coalesce(max(${locations.walkOrder}), 0)::int` })
        .from(locations)
        .where(eq(locations.collectionId, collectionId));
      try {
        const [row] = await db.insert(locations).values({ collectionId, ...body, walkOrder: last + 1 }).returning();
        return row!;
      } catch (err) {
        if (isUniqueViolation(err)) throw placeTaken();
        throw err;
      }
    },

    async rename(collectionId: string, locationId: string, body: LocationInput) {
      try {
        const [row] = await db.update(locations).set(body).where(and(eq(locations.collectionId, collectionId), eq(locations.id, locationId))).returning();
        if (!row) throw notFound();
        return row;
      } catch (err) {
        if (isUniqueViolation(err)) throw placeTaken();
        throw err;
      }
    },

    /** The walk order as the keeper lays it out: every place of the collection, once. */
    async reorder(collectionId: string, locationIds: string[]) {
      await db.transaction(async (tx) => {
        const all = await tx.select({ id: locations.id }).from(locations).where(eq(locations.collectionId, collectionId));
        const given = new Set(locationIds);
        if (given.size !== locationIds.length || all.length !== given.size || all.some((l) => !given.has(l.id))) {
          throw new HttpError(422, 'invalid', 'List every place of the collection exactly once.');
        }
        // One statement: each place's new position from its index in the list.
        await tx.execute(sql`update locations set walk_order = o.i from unnest(${sql.param(locationIds)}::uuid[]) with ordinality as o(id, i) where locations.id = o.id`);
      });
    },

    async remove(collectionId: string, locationId: string) {
      const [used] = await db.select({ n: count() }).from(animals).where(eq(animals.locationId, locationId));
      if (used && used.n > 0) throw new HttpError(409, 'not_empty', 'Animals still live here (or did). Move them first; retired animals keep their last place.');
      const deleted = await db.delete(locations).where(and(eq(locations.collectionId, collectionId), inArray(locations.id, [locationId]))).returning({ id: locations.id });
      if (!deleted.length) throw notFound();
    },
  };
}
export type LocationsService = ReturnType<typeof createLocationsService>;
