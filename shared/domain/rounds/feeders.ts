import type { AnimalGroup } from '../animal-facts';

/**
 * One size of one feeder a collection keeps, with its typical body length (R19,
 * docs/care-rules.md § Feeder catalogue).
 */
export interface Feeder {
  preyType: string;
  preySize: string;
  lengthMm: number;
}

/**
 * The catalogue a new collection starts with. Body lengths are typical trade sizes, from
 * memory (no published source): house crickets (Acheta domesticus) from pinhead to large,
 * Blaptica dubia roaches from small nymph to adult, mealworms (Tenebrio molitor larvae),
 * flightless fruit flies (Drosophila) and their larvae.
 */
export const DEFAULT_FEEDERS: Feeder[] = [
  { preyType: 'cricket', preySize: 'pinhead', lengthMm: 3 },
  { preyType: 'cricket', preySize: 'small', lengthMm: 8 },
  { preyType: 'cricket', preySize: 'medium', lengthMm: 14 },
  { preyType: 'cricket', preySize: 'large', lengthMm: 22 },
  { preyType: 'roach', preySize: 'small nymph', lengthMm: 8 },
  { preyType: 'roach', preySize: 'medium nymph', lengthMm: 15 },
  { preyType: 'roach', preySize: 'large nymph', lengthMm: 25 },
  { preyType: 'roach', preySize: 'adult', lengthMm: 40 },
  { preyType: 'mealworm', preySize: 'small', lengthMm: 12 },
  { preyType: 'mealworm', preySize: 'large', lengthMm: 25 },
  { preyType: 'fruit-fly larvae', preySize: 'tiny', lengthMm: 3 },
  { preyType: 'fruit flies', preySize: 'flightless', lengthMm: 3 },
];

/** Groups whose size is a diagonal leg span rather than a body length. */
const MEASURED_BY_LEG_SPAN: ReadonlySet<AnimalGroup> = new Set(['tarantula', 'true_spider']);

/**
 * R19: the animal's body length in mm. A spider's size is its diagonal leg span; its body is
 * about a third to a half of that, and `spanToBody` takes the careful end. Null when unknown.
 */
export function bodyLengthMm(
  animal: { group: AnimalGroup; sizeMm: number | null },
  spanToBody: number,
): number | null {
  if (animal.sizeMm === null) return null;
  return MEASURED_BY_LEG_SPAN.has(animal.group) ? animal.sizeMm * spanToBody : animal.sizeMm;
}

export const sameType = (a: string, b: string) => a.trim().toLowerCase() === b.trim().toLowerCase();

/**
 * R19: the largest feeder no longer than the body. `anyType`: when none of the wanted type
 * fits, the largest of any type that does (the stage default gives way; a keeper's own prey
 * type does not). When nothing is that small, the smallest of the type.
 * Null when the catalogue has no size of the wanted type (the stage's own size stands).
 */
export function pickFeeder(
  feeders: readonly Feeder[],
  preyType: string,
  bodyMm: number,
  anyType = true,
): Feeder | null {
  const largestFitting = (list: readonly Feeder[]) =>
    list
      .filter((f) => f.lengthMm <= bodyMm)
      .reduce<Feeder | null>((best, f) => (!best || f.lengthMm > best.lengthMm ? f : best), null);
  const smallest = (list: readonly Feeder[]) =>
    list.reduce<Feeder | null>((best, f) => (!best || f.lengthMm < best.lengthMm ? f : best), null);
  const ofType = feeders.filter((f) => sameType(f.preyType, preyType));
  if (!ofType.length) return null;
  if (!anyType) return largestFitting(ofType) ?? smallest(ofType);
  return largestFitting(ofType) ?? largestFitting(feeders) ?? smallest(ofType);
}

/** Length of a catalogue size, to sort the prep list from small to large. */
export function feederLength(
  feeders: readonly Feeder[],
  preyType: string,
  preySize: string,
): number | null {
  return (
    feeders.find((f) => sameType(f.preyType, preyType) && sameType(f.preySize, preySize))
      ?.lengthMm ?? null
  );
}
