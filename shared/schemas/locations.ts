import { z } from 'zod';
import { bareName, type PlaceLevel } from '../domain/places';
import { locationSummary } from './animals';
import { uuid } from './common';

const WHAT: Record<PlaceLevel, string> = {
  room: 'room',
  rack: 'rack',
  shelf: 'shelf or tray',
  position: 'position',
};

/** One part of a place, stored without a word the app writes itself ("Rack C" is rack C). */
export const placePart = (level: PlaceLevel) =>
  z
    .string()
    .trim()
    .min(1, { message: `Name the ${WHAT[level]}.` })
    .max(40, { message: `Keep the ${WHAT[level]} under 40 characters.` })
    .transform((v) => bareName(level, v));

/** A place: a position on a shelf (or in a tray) of a rack in a room. */
export const locationInput = z.object({
  room: placePart('room'),
  rack: placePart('rack'),
  shelf: placePart('shelf'),
  position: placePart('position'),
});
export type LocationInput = z.input<typeof locationInput>;
export type LocationValues = z.output<typeof locationInput>;

/** The keeper's walk: every place of the collection, in the order they pass them. */
export const walkOrderBody = z.object({
  locationIds: z.array(uuid).min(1, { message: 'List the places in walk order.' }).max(20_000),
});

const groupName = z.string().min(1, { message: 'Say which group to rename.' }).max(40);
/**
 * Renames a whole room, rack or shelf: every place in it. The group is named by its parts as
 * stored (room, and rack for a shelf or rack, and shelf for a shelf).
 */
export const renameGroupBody = z.discriminatedUnion(
  'level',
  [
    z.object({ level: z.literal('room'), room: groupName, to: placePart('room') }),
    z.object({ level: z.literal('rack'), room: groupName, rack: groupName, to: placePart('rack') }),
    z.object({
      level: z.literal('shelf'),
      room: groupName,
      rack: groupName,
      shelf: groupName,
      to: placePart('shelf'),
    }),
  ],
  { error: () => 'Say whether a room, a rack or a shelf is renamed.' },
);
export type RenameGroupBody = z.input<typeof renameGroupBody>;
export type RenameGroupOutput = z.output<typeof renameGroupBody>;

/** An active animal living in a place: what a picker says about a taken spot. */
export const occupant = z.object({ id: z.string(), name: z.string() });

export const locationListResponse = z.object({
  locations: z.array(
    locationSummary.extend({ animals: z.number().int(), occupants: z.array(occupant) }),
  ),
});
export type LocationWithCount = z.infer<typeof locationListResponse>['locations'][number];
/** A place as created or renamed. */
export const locationResponse = locationSummary;
