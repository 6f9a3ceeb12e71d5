// Generated collections and histories for the round engine's property tests (fast-check).
import fc from 'fast-check';
import { ANIMAL_GROUPS, DIETS, SEXES, stagesOf } from '../animal-facts';
import type { EventKind } from '../event-kinds';
import { addDays, startOfLocalDate, type LocalDate } from '../local-dates';
import type { EngineEvent } from './animal-state';
import type { EngineAnimal } from './build-round';

/** Tap kinds and server facts, meals weighted as they are at a real rack. */
export const KINDS: EventKind[] = [
  'ate',
  'ate',
  'ate',
  'refused',
  'refused',
  'prey_left_in',
  'prey_removed',
  'watered',
  'misted',
  'substrate_moistened',
  'spot_cleaned',
  'rehoused',
  'molted',
  'premolt_seen',
  'premolt_cleared',
  'molting_now',
  'sac_laid',
  'sac_pulled',
  'sac_hatched',
  'case_laid',
  'brood_started',
  'brood_dispersed',
  'paired',
  'skipped',
  'note',
  'moved',
];

const animalArb = (i: number, TODAY: LocalDate) =>
  fc
    .record({
      // Any group, in a stage that group has (docs/care-rules.md § Stages).
      groupAndStage: fc
        .constantFrom(...ANIMAL_GROUPS)
        .chain((group) => fc.tuple(fc.constant(group), fc.constantFrom(...stagesOf(group)))),
      sex: fc.constantFrom(...SEXES),
      diet: fc.option(fc.constantFrom(...DIETS)),
      hasWaterDish: fc.boolean(),
      sizeMm: fc.option(fc.integer({ min: 5, max: 200 }), { freq: 5 }),
      doNotFeedUntil: fc.option(
        fc.integer({ min: -3, max: 5 }).map((d) => addDays(TODAY, d)),
        { freq: 3 },
      ),
      addedDaysAgo: fc.integer({ min: 0, max: 70 }),
      rack: fc.constantFrom('A', 'B', 'C'),
      shelf: fc.integer({ min: 1, max: 12 }),
      position: fc.integer({ min: 1, max: 12 }),
      // § Enclosure care: the animal's own intervals (0: off, none: the profile's) and its
      // enclosure, small enough now and then for a rehouse.
      mistEveryDays: fc.option(fc.integer({ min: 0, max: 10 }), { freq: 3 }),
      moistenEveryDays: fc.option(fc.integer({ min: 0, max: 10 }), { freq: 3 }),
      spotCleanEveryDays: fc.option(fc.integer({ min: 0, max: 21 }), { freq: 3 }),
      enclosure: fc.option(
        fc.tuple(
          fc.integer({ min: 40, max: 600 }),
          fc.integer({ min: 40, max: 600 }),
          fc.option(fc.integer({ min: 60, max: 900 })),
        ),
        { freq: 3 },
      ),
    })
    .map((r): EngineAnimal => ({
      id: `a${i}`,
      labelCode: `NL-${i}`,
      name: `A${i}`,
      scientificName: 'Tliltocatl albopilosus',
      group: r.groupAndStage[0],
      lifeStage: r.groupAndStage[1],
      sex: r.sex,
      sizeMm: r.sizeMm,
      status: 'active',
      cautions: [],
      location: {
        id: `l${i}`,
        room: 'R',
        rack: r.rack,
        shelf: String(r.shelf),
        position: String(r.position),
        walkOrder: 0,
      },
      hasWaterDish: r.hasWaterDish,
      intervalDays: null,
      preyType: null,
      preySize: null,
      preyCount: null,
      diet: r.diet,
      doNotFeedUntil: r.doNotFeedUntil,
      addedOn: addDays(TODAY, -r.addedDaysAgo),
      mistEveryDays: r.mistEveryDays,
      moistenEveryDays: r.moistenEveryDays,
      spotCleanEveryDays: r.spotCleanEveryDays,
      enclosureLengthMm: r.enclosure?.[0] ?? null,
      enclosureWidthMm: r.enclosure?.[1] ?? null,
      enclosureHeightMm: r.enclosure?.[2] ?? null,
    }));

const historyArb = (animalIndex: number, TODAY: LocalDate, ZONE: string) =>
  fc
    .array(
      fc.record({
        kind: fc.constantFrom(...KINDS),
        daysAgo: fc.integer({ min: 1, max: 60 }),
        minute: fc.integer({ min: 0, max: 1439 }),
        prey: fc.constantFrom('cricket', 'roach nymph', 'mealworm'),
        rehoused: fc.boolean(),
      }),
      { maxLength: 25 },
    )
    .map((list) =>
      list.map((e, j): EngineEvent => ({
        id: `e${animalIndex}-${j}`,
        kind: e.kind,
        effectiveAt: new Date(
          startOfLocalDate(addDays(TODAY, -e.daysAgo), ZONE).getTime() + e.minute * 60_000,
        ).toISOString(),
        payload:
          e.kind === 'prey_left_in'
            ? { preyType: e.prey }
            : e.kind === 'moved'
              ? { toLocationId: 'l', rehoused: e.rehoused }
              : {},
      })),
    );

/**
 * Up to 25 animals of any group and stage, each with up to 25 events in the 60 days before
 * `today` (a date chosen near a DST change makes the histories cross it).
 */
export const generatedCollection = (today: LocalDate, zone: string) =>
  fc
    .integer({ min: 1, max: 25 })
    .chain((n) =>
      fc.tuple(
        ...Array.from({ length: n }, (_, i) =>
          fc.tuple(animalArb(i, today), historyArb(i, today, zone)),
        ),
      ),
    );
