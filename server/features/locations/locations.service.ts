import { compareLocations } from '#shared/domain/walk-order';
import type { LocationWithCount, RenameGroupOutput } from '#shared/schemas/locations';
import type { Db } from '../../db/client';
import { isUniqueViolation } from '../../db/errors';
import { HttpError } from '../../middleware/errors';
import { findOrCreatePlaces } from './find-or-create-places';
import {
  animalsAt,
  deletePlace,
  listWithAnimalCounts,
  occupantsOf,
  placesInGroup,
  placeById,
  placeIdsOf,
  renameGroup,
  setWalkOrder,
  updatePlace,
  type Place,
} from './locations.repository';

const placeTaken = () =>
  new HttpError(409, 'place_taken', 'That place already exists in this collection.');
const notFound = () => new HttpError(404, 'not_found', 'We could not find that place.');

export interface LocationsHooks {
  /** A room renamed: what another feature keeps by the room's name follows, in the same transaction. */
  onRoomRenamed?: (tx: Db, collectionId: string, from: string, to: string) => Promise<void>;
}

export function createLocationsService(db: Db, hooks: LocationsHooks = {}) {
  return {
    /** Every place in walk order, with the active animals living there. */
    async list(collectionId: string): Promise<LocationWithCount[]> {
      const [rows, living] = await Promise.all([
        listWithAnimalCounts(db, collectionId),
        occupantsOf(db, collectionId),
      ]);
      const occupants = new Map<string, { id: string; name: string }[]>();
      for (const a of living) {
        const list = occupants.get(a.locationId!) ?? [];
        list.push({ id: a.id, name: a.name });
        occupants.set(a.locationId!, list);
      }
      return rows
        .map(({ location: l, animals: n }) => ({
          id: l.id,
          room: l.room,
          rack: l.rack,
          shelf: l.shelf,
          position: l.position,
          walkOrder: l.walkOrder,
          animals: n,
          occupants: occupants.get(l.id) ?? [],
        }))
        .sort(compareLocations);
    },

    /** A new place, beside its shelf, rack or room in the walk. */
    async create(collectionId: string, body: Place) {
      try {
        return await db.transaction(async (tx) => {
          const { created } = await findOrCreatePlaces(tx, collectionId, [body]);
          if (!created[0]) throw placeTaken();
          return (await placeById(tx, collectionId, created[0]))!;
        });
      } catch (err) {
        if (isUniqueViolation(err)) throw placeTaken();
        throw err;
      }
    },

    /** A room, rack or shelf renamed: every place in it follows. Never merged into another. */
    async renameGroup(collectionId: string, body: RenameGroupOutput) {
      const what = { room: 'room', rack: 'rack', shelf: 'shelf' }[body.level];
      const group = {
        room: body.room,
        rack: body.level === 'room' ? undefined : body.rack,
        shelf: body.level === 'shelf' ? body.shelf : undefined,
      };
      await db.transaction(async (tx) => {
        const renamed = { ...group, [body.level]: body.to };
        if (body.to !== group[body.level] && (await placesInGroup(tx, collectionId, renamed)) > 0)
          throw new HttpError(
            409,
            'place_taken',
            `There is already a ${what} called “${body.to}” there. Choose another name.`,
          );
        const changed = await renameGroup(tx, collectionId, group, { [body.level]: body.to });
        if (!changed) throw new HttpError(404, 'not_found', `We could not find that ${what}.`);
        if (body.level === 'room' && body.to !== body.room)
          await hooks.onRoomRenamed?.(tx, collectionId, body.room, body.to);
      });
    },

    async rename(collectionId: string, locationId: string, body: Place) {
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
