import { compareLocations } from '#shared/domain/walk-order';
import type { LocationInput, LocationWithCount } from '#shared/schemas/locations';
import type { Db } from '../../db/client';
import { isUniqueViolation } from '../../db/errors';
import { HttpError } from '../../middleware/errors';
import {
  animalsAt,
  deletePlace,
  insertAtEndOfWalk,
  listWithAnimalCounts,
  placeIdsOf,
  setWalkOrder,
  updatePlace,
} from './locations.repository';

const placeTaken = () =>
  new HttpError(409, 'place_taken', 'That place already exists in this collection.');
const notFound = () => new HttpError(404, 'not_found', 'We could not find that place.');

export function createLocationsService(db: Db) {
  return {
    /** Every place in walk order, with how many animals live there. */
    async list(collectionId: string): Promise<LocationWithCount[]> {
      const rows = await listWithAnimalCounts(db, collectionId);
      return rows
        .map(({ location: l, animals: n }) => ({
          id: l.id,
          room: l.room,
          rack: l.rack,
          shelf: l.shelf,
          position: l.position,
          walkOrder: l.walkOrder,
          animals: n,
        }))
        .sort(compareLocations);
    },

    async create(collectionId: string, body: LocationInput) {
      try {
        return await insertAtEndOfWalk(db, collectionId, body);
      } catch (err) {
        if (isUniqueViolation(err)) throw placeTaken();
        throw err;
      }
    },

    async rename(collectionId: string, locationId: string, body: LocationInput) {
      let row;
      try {
        row = await updatePlace(db, collectionId, locationId, body);
      } catch (err) {
        if (isUniqueViolation(err)) throw placeTaken();
        throw err;
      }
      if (!row) throw notFound();
      return row;
    },

    /** The walk order as the keeper lays it out: every place of the collection, once. */
    async reorder(collectionId: string, locationIds: string[]) {
      await db.transaction(async (tx) => {
        const all = await placeIdsOf(tx, collectionId);
        const given = new Set(locationIds);
        if (
          given.size !== locationIds.length ||
          all.length !== given.size ||
          all.some((id) => !given.has(id))
        ) {
          throw new HttpError(422, 'invalid', 'List every place of the collection exactly once.');
        }
        await setWalkOrder(tx, locationIds);
      });
    },

    async remove(collectionId: string, locationId: string) {
      if ((await animalsAt(db, locationId)) > 0)
        throw new HttpError(
          409,
          'not_empty',
          'Animals still live here (or did). Move them first; retired animals keep their last place.',
        );
      if (!(await deletePlace(db, collectionId, locationId))) throw notFound();
    },
  };
}
export type LocationsService = ReturnType<typeof createLocationsService>;
