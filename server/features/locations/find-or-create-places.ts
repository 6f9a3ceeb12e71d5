import { shelfKey, walkWithNewPlaces } from '#shared/domain/places';
import { compareLocations } from '#shared/domain/walk-order';
import type { Db } from '../../db/client';
import { insertPlaces, placesOf, setWalkOrder, type Place } from './locations.repository';

const key = (p: Place) => `${shelfKey(p)}\u0000${p.position}`;

/**
 * The one way places come to exist: the ids of the places named, created where the collection
 * does not have them yet, each beside its kin in the walk (on its shelf by position, after its
 * rack, after its room, or at the end; `walkWithNewPlaces`). The walk is renumbered 1…n in one
 * statement when anything was created. Used by the places editor, the pot-up and the CSV import.
 */
export async function findOrCreatePlaces(
  tx: Db,
  collectionId: string,
  wanted: readonly Place[],
): Promise<{ idOf(p: Place): string; created: string[] }> {
  const known = (await placesOf(tx, collectionId)).sort(compareLocations);
  const ids = new Map(known.map((l) => [key(l), l.id]));
  const missing = [...new Map(wanted.map((p) => [key(p), p])).entries()]
    .filter(([k]) => !ids.has(k))
    .map(([, p]) => ({ room: p.room, rack: p.rack, shelf: p.shelf, position: p.position }));
  const created: string[] = [];
  if (missing.length) {
    for (const l of await insertPlaces(tx, collectionId, missing)) {
      ids.set(key(l), l.id);
      created.push(l.id);
    }
    const walk = walkWithNewPlaces(known, missing);
    await setWalkOrder(
      tx,
      walk.map((p) => ids.get(key(p))!),
    );
  }
  return { idOf: (p) => ids.get(key(p))!, created };
}
