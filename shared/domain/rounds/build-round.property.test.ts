// Properties of the round engine over generated collections and histories (fast-check).
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { ANIMAL_GROUPS, LIFE_STAGES } from '../animal-facts';
import type { EventKind } from '../event-kinds';
import { addDays, startOfLocalDate } from '../local-dates';
import { projectState, type EngineEvent } from './animal-state';
import { buildRound, decideAnimal, type EngineAnimal } from './build-round';
import { DEFAULT_RULES } from './rules';

const ZONE = 'America/Toronto';
const TODAY = '2026-11-02'; // the day after the autumn DST change: histories cross it
const KINDS: EventKind[] = ['ate', 'ate', 'ate', 'refused', 'refused', 'prey_left_in', 'prey_removed', 'watered', 'molted', 'premolt_seen', 'premolt_cleared', 'molting_now', 'sac_laid', 'sac_pulled', 'sac_hatched', 'case_laid', 'brood_started', 'brood_dispersed', 'paired', 'skipped', 'note'];

const animalArb = (i: number) =>
  fc.record({
    lifeStage: fc.constantFrom(...LIFE_STAGES),
    group: fc.constantFrom(...ANIMAL_GROUPS),
    hasWaterDish: fc.boolean(),
    sizeMm: fc.integer({ min: 5, max: 200 }),
    rack: fc.constantFrom('A', 'B', 'C'),
    shelf: fc.integer({ min: 1, max: 12 }),
    position: fc.integer({ min: 1, max: 12 }),
  }).map(
    (r): EngineAnimal => ({
      id: `a${i}`,
      labelCode: `NL-${i}`,
      name: `A${i}`,
      scientificName: 'Tliltocatl albopilosus',
      group: r.group,
      lifeStage: r.lifeStage,
      sex: 'female',
      sizeMm: r.sizeMm,
      status: 'active',
      cautions: [],
      location: { id: `l${i}`, room: 'R', rack: r.rack, shelf: String(r.shelf), position: String(r.position), walkOrder: 0 },
      hasWaterDish: r.hasWaterDish,
      intervalDays: null,
      preyType: null,
      preySize: null,
      preyCount: null,
      doNotFeedUntil: null,
      addedOn: '2026-09-01',
    }),
  );

const historyArb = (animalIndex: number) =>
  fc.array(
    fc.record({
      kind: fc.constantFrom(...KINDS),
      daysAgo: fc.integer({ min: 1, max: 60 }),
      minute: fc.integer({ min: 0, max: 1439 }),
      prey: fc.constantFrom('cricket', 'roach nymph', 'mealworm'),
    }),
    { maxLength: 25 },
  ).map((list) =>
    list.map(
      (e, j): EngineEvent => ({
        id: `e${animalIndex}-${j}`,
        kind: e.kind,
        effectiveAt: new Date(startOfLocalDate(addDays(TODAY, -e.daysAgo), ZONE).getTime() + e.minute * 60_000).toISOString(),
        payload: e.kind === 'prey_left_in' ? { preyType: e.prey } : {},
      }),
    ),
  );

const collectionArb = fc.integer({ min: 1, max: 25 }).chain((n) =>
  fc.tuple(...Array.from({ length: n }, (_, i) => fc.tuple(animalArb(i), historyArb(i)))),
);

function build(collection: [EngineAnimal, EngineEvent[]][], date = TODAY) {
  return buildRound(
    collection.map(([animal, events]) => ({ animal, state: projectState(events, ZONE) })),
    DEFAULT_RULES,
    date,
  );
}

describe('round engine properties', () => {
  it('never offers food during a post-molt hold, premolt, molting-now or leave-alone', () => {
    fc.assert(
      fc.property(collectionArb, (collection) => {
        for (const item of build(collection).items) {
          const events = collection.find(([a]) => a.id === item.animal.id)![1];
          const state = projectState(events, ZONE);
          const feeds = item.tasks.some((t) => t.kind === 'feed');
          const holdEnd = state.lastMolt ? addDays(state.lastMolt, DEFAULT_RULES.postMoltHoldDays[item.animal.lifeStage]) : null;
          if (holdEnd && TODAY < holdEnd) expect(feeds).toBe(false);
          if (state.premoltSince) expect(feeds).toBe(false);
          // R11 amended: a guarding female's dish is still topped up quietly; a molting animal gets nothing.
          const quietWater = (t: { kind: string }) => t.kind === 'water' && state.leaveAlone!.reason !== 'molting';
          if (state.leaveAlone) expect(item.tasks.every((t) => t.kind === 'leave_alone' || t.kind === 'remove_prey' || quietWater(t))).toBe(true);
        }
      }),
      { numRuns: 300 },
    );
  });

  it('puts every animal with something due on the round exactly once', () => {
    fc.assert(
      fc.property(collectionArb, (collection) => {
        const round = build(collection);
        const ids = round.items.map((i) => i.animal.id);
        expect(new Set(ids).size).toBe(ids.length);
        for (const [animal, events] of collection) {
          const decision = decideAnimal(animal, projectState(events, ZONE), DEFAULT_RULES, TODAY);
          expect(ids.includes(animal.id)).toBe(decision.tasks.length > 0);
        }
      }),
      { numRuns: 300 },
    );
  });

  it('gives the same round whatever order the events arrive in, and the same round when built twice', () => {
    fc.assert(
      fc.property(collectionArb, fc.infiniteStream(fc.double({ min: 0, max: 0.999999, noNaN: true })), (collection, randoms) => {
        const shuffled = collection.map(([a, events]): [EngineAnimal, EngineEvent[]] => {
          const copy = [...events];
          for (let i = copy.length - 1; i > 0; i--) {
            const j = Math.floor(randoms.next().value * (i + 1));
            [copy[i], copy[j]] = [copy[j]!, copy[i]!];
          }
          return [a, copy];
        });
        const first = build(collection);
        expect(build(shuffled)).toEqual(first);
        expect(build(collection)).toEqual(first);
      }),
      { numRuns: 300 },
    );
  });

  it('counts carried-over days without skipping a day while nothing is recorded', () => {
    fc.assert(
      fc.property(collectionArb, (collection) => {
        let previous = new Map(build(collection, TODAY).items.flatMap((i) => i.tasks.map((t) => [`${i.animal.id}:${t.kind}`, t.carriedOverDays] as const)));
        for (let day = 1; day <= 5; day++) {
          const date = addDays(TODAY, day);
          const next = new Map(build(collection, date).items.flatMap((i) => i.tasks.map((t) => [`${i.animal.id}:${t.kind}`, t.carriedOverDays] as const)));
          for (const [key, carried] of next) {
            // A task still open grows by exactly one day; a new one starts at 0.
            if (previous.has(key) && key.endsWith(':feed')) expect(carried).toBe(previous.get(key)! + 1);
            if (!previous.has(key) && key.endsWith(':feed')) expect(carried).toBe(0);
          }
          previous = next;
        }
      }),
      { numRuns: 200 },
    );
  });
});
