import { z } from 'zod';
import { locationSummary } from './animals';
import { uuid } from './common';

const part = (what: string) =>
  z
    .string()
    .trim()
    .min(1, { message: `Name the ${what}.` })
    .max(40, { message: `Keep the ${what} under 40 characters.` });

/** A place: a position on a shelf (or in a tray) of a rack in a room. */
export const locationInput = z.object({
  room: part('room'),
  rack: part('rack'),
  shelf: part('shelf or tray'),
  position: part('position'),
});
export type LocationInput = z.infer<typeof locationInput>;

/** The keeper's walk: every place of the collection, in the order they pass them. */
export const walkOrderBody = z.object({
  locationIds: z.array(uuid).min(1, { message: 'List the places in walk order.' }).max(20_000),
});

export const locationListResponse = z.object({
  locations: z.array(locationSummary.extend({ animals: z.number().int() })),
});
export type LocationWithCount = z.infer<typeof locationListResponse>['locations'][number];
/** A place as created or renamed. */
export const locationResponse = locationSummary;
