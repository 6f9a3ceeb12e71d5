// Properties of the round engine over generated collections and histories (fast-check).
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { addDays } from '../local-dates';
import { projectState, type EngineEvent } from './animal-state';
import { buildRound, decideAnimal, FEED_HOLD_CODES, type EngineAnimal } from './build-round';
import { foodOf } from './care-profiles';
import { generatedCollection } from './generated-collections.test-support';
import { DEFAULT_RULES, postMoltHoldDays } from './rules';

const ZONE = 'America/Toronto';
const TODAY = '2026-11-02'; // the day after the autumn DST change: histories cross it
const collectionArb = generatedCollection(TODAY, ZONE);

function build(collection: [EngineAnimal, EngineEvent[]][], date = TODAY) {
  return buildRound(
    collection.map(([animal, events]) => ({ animal, state: projectState(events, ZONE) })),
    DEFAULT_RULES,
    date,
  );
}

describe('round engine properties', () => {
  it('never offers food while a hold applies (R4, R5, R11, R16, do-not-feed, stages not fed), for any group and state', () => {
    fc.assert(
      fc.property(collectionArb, (collection) => {
        for (const [animal, events] of collection) {
          const state = projectState(events, ZONE);
          const d = decideAnimal(animal, state, DEFAULT_RULES, TODAY);
          const feeds = d.tasks.some((t) => t.kind === 'feed');
          // Each hold worked out here from the state, independently of the engine's reasons.
          const holdDays = postMoltHoldDays(DEFAULT_RULES, animal);
          const holdEnd = state.lastMolt && holdDays > 0 ? addDays(state.lastMolt, holdDays) : null;
          const settleFrom = [state.rehousedOn, state.lastMeal ? null : animal.addedOn]
            .filter((x): x is string => !!x)
            .sort()
            .at(-1);
          const holds = {
            postMolt: !!holdEnd && TODAY < holdEnd,
            premolt: state.premoltSince !== null,
            leaveAlone: state.leaveAlone !== null,
            doNotFeed: !!animal.doNotFeedUntil && TODAY < animal.doNotFeedUntil,
            settling: !!settleFrom && TODAY < addDays(settleFrom, DEFAULT_RULES.settlingDays),
            notFed: foodOf(animal) === 'none' || foodOf(animal) === 'substrate',
          };
          for (const [hold, applies] of Object.entries(holds))
            if (applies)
              expect(feeds, `${hold} for ${animal.group} ${animal.lifeStage}`).toBe(false);
          // R11 amended: a guarding female's dish is still topped up and her substrate moistened
          // quietly (§ Enclosure care); a molting animal gets nothing.
          const quietWater = (t: { kind: string }) =>
            (t.kind === 'water' || t.kind === 'moisten') && state.leaveAlone!.reason !== 'molting';
          if (state.leaveAlone)
            expect(
              d.tasks.every(
                (t) => t.kind === 'leave_alone' || t.kind === 'remove_prey' || quietWater(t),
              ),
            ).toBe(true);
          // § Enclosure care: no cleaning or rehouse in premolt; no rehouse in the post-molt hold,
          // while settling in, or without a molt since the last rehouse.
          const has = (kind: string) => d.tasks.some((t) => t.kind === kind);
          if (holds.premolt) expect(has('spot_clean') || has('rehouse')).toBe(false);
          if (holds.postMolt || holds.settling) expect(has('rehouse')).toBe(false);
          if (has('rehouse')) {
            expect(state.lastMolt).not.toBeNull();
            expect((state.lastRehoused ?? '') < state.lastMolt!).toBe(true);
          }
          if (animal.spotCleanEveryDays === 0) expect(has('spot_clean')).toBe(false);
          if (animal.mistEveryDays === 0) expect(has('mist')).toBe(false);
          // Whatever the engine names as a hold (the set R18 withdraws by) comes with no feed task.
          if (
            [...d.notes, ...d.tasks.flatMap((t) => t.reasons)].some((r) =>
              FEED_HOLD_CODES.has(r.code),
            )
          )
            expect(feeds).toBe(false);
          // R17: a mature male is never flagged as possible premolt.
          if (animal.sex === 'mature_male')
            expect(d.notes.some((n) => n.code === 'possible_premolt')).toBe(false);
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
      fc.property(
        collectionArb,
        fc.infiniteStream(fc.double({ min: 0, max: 0.999999, noNaN: true })),
        (collection, randoms) => {
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
        },
      ),
      { numRuns: 300 },
    );
  });

  it('counts carried-over days without skipping a day while nothing is recorded', () => {
    fc.assert(
      fc.property(collectionArb, (collection) => {
        let previous = new Map(
          build(collection, TODAY).items.flatMap((i) =>
            i.tasks.map((t) => [`${i.animal.id}:${t.kind}`, t.carriedOverDays] as const),
          ),
        );
        for (let day = 1; day <= 5; day++) {
          const date = addDays(TODAY, day);
          const next = new Map(
            build(collection, date).items.flatMap((i) =>
              i.tasks.map((t) => [`${i.animal.id}:${t.kind}`, t.carriedOverDays] as const),
            ),
          );
          for (const [key, carried] of next) {
            // A task still open grows by exactly one day; a new one starts at 0.
            if (previous.has(key) && key.endsWith(':feed'))
              expect(carried).toBe(previous.get(key)! + 1);
            if (!previous.has(key) && key.endsWith(':feed')) expect(carried).toBe(0);
          }
          previous = next;
        }
      }),
      { numRuns: 200 },
    );
  });
});
