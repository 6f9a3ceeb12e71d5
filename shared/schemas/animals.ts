import { z } from 'zod';
import {
  ANIMAL_GROUPS,
  ANIMAL_STATUSES,
  CAUTIONS,
  LIFE_STAGES,
  SEXES,
} from '../domain/animal-facts';

export const locationSummary = z.object({
  id: z.string(),
  room: z.string(),
  rack: z.string(),
  shelf: z.string(),
  position: z.string(),
  walkOrder: z.number().int(),
});
export type LocationSummary = z.infer<typeof locationSummary>;

/** A stored location row as the API shows it. */
export function toLocationSummary(l: LocationSummary | null): LocationSummary | null {
  return l ? { id: l.id, room: l.room, rack: l.rack, shelf: l.shelf, position: l.position, walkOrder: l.walkOrder } : null;
}

export const animalSummary = z.object({
  id: z.string(),
  labelCode: z.string(),
  name: z.string(),
  scientificName: z.string(),
  commonName: z.string().nullable(),
  group: z.enum(ANIMAL_GROUPS),
  lifeStage: z.enum(LIFE_STAGES),
  sex: z.enum(SEXES),
  sizeMm: z.number().nullable(),
  status: z.enum(ANIMAL_STATUSES),
  cautions: z.array(z.enum(CAUTIONS)),
  location: locationSummary.nullable(),
  hasWaterDish: z.boolean(),
  intervalDays: z.number().nullable(),
  preyType: z.string().nullable(),
  preySize: z.string().nullable(),
  preyCount: z.number().nullable(),
  doNotFeedUntil: z.string().nullable(),
  clutch: z.string().nullable(),
  /** When the animal was added to the collection (ISO). */
  addedAt: z.string(),
});
export type AnimalSummary = z.infer<typeof animalSummary>;

export const animalListResponse = z.object({ animals: z.array(animalSummary) });
export type AnimalListResponse = z.infer<typeof animalListResponse>;
