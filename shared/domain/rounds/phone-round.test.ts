// The round a phone builds with no signal equals the server's for the same state, rules and
// date (issue 22, point 5), over generated collections and histories that cross a DST change.
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { roundResponse } from '../../schemas/rounds';
import type { EventKind } from '../event-kinds';
import { addDays, localDateOf, startOfLocalDate, type LocalDate } from '../local-dates';
import { EMPTY_STATE, projectState, type EngineEvent } from './animal-state';
import { buildRound, type EngineAnimal } from './build-round';
import { generatedCollection } from './generated-collections.test-support';
import { inputForDate, outcomesOnDate, phoneRound, type QueuedTap } from './phone-round';
import { roundView } from './round-view';
import { DEFAULT_RULES, postMoltHoldDays } from './rules';
import type { DayOutcome } from './settle';

// The day before each zone's autumn change, so the phone's two days offline cross it.
// IANA tz database: America/Toronto leaves DST on 2026-11-01 (first Sunday of November, US/Canada
// rule), Europe/London on 2026-10-25 (last Sunday of October, EU rule).
const CASES = [
  { zone: 'America/Toronto', fetchedOn: '2026-10-31' },
  { zone: 'Europe/London', fetchedOn: '2026-10-24' },
];

const TAP_KINDS: EventKind[] = [
  'ate',
  'ate',
  'refused',
  'prey_left_in',
  'prey_removed',
  'watered',
  'molted',
  'premolt_seen',
  'premolt_cleared',
  'molting_now',
  'skipped',
  'note',
];

/** Taps made after the phone last heard from the server: later that day and the next two. */
const tapsArb = (animals: number, fetchedOn: LocalDate, zone: string, fetchedMinute: number) =>
  fc
    .array(
      fc.record({
        animal: fc.integer({ min: 0, max: animals - 1 }),
        kind: fc.constantFrom(...TAP_KINDS),
        day: fc.integer({ min: 0, max: 2 }),
        minute: fc.integer({ min: fetchedMinute + 1, max: 1439 }),
        undo: fc.boolean(),
      }),
      { maxLength: 30 },
    )
    .map((list) => {
      const taps: QueuedTap[] = [];
      list.forEach((t, j) => {
        const start = startOfLocalDate(addDays(fetchedOn, t.day), zone).getTime();
        // A day of 25 hours (the autumn change) still has its taps inside it.
        const at = new Date(start + t.minute * 60_000);
        const event = {
          id: `t${j}`,
          animalId: `a${t.animal}`,
          kind: t.kind,
          payload: t.kind === 'prey_left_in' ? { preyType: 'cricket' } : {},
          clientRecordedAt: at.toISOString(),
        };
        taps.push({ event, byName: 'Robin' });
        // Some taps are undone a minute later, as the undo button does.
        if (t.undo && j % 3 === 0)
          taps.push({
            event: {
              id: `v${j}`,
              animalId: event.animalId,
              kind: 'void',
              payload: { targetId: event.id },
              clientRecordedAt: new Date(at.getTime() + 60_000).toISOString(),
            },
            byName: 'Robin',
          });
      });
      return taps;
    });

/**
 * The server's way, written out independently of the phone's: every event in one log, each
 * state projected from the whole log before the date (round-input.ts), the round built and
 * viewed with the day's stored events as outcomes (build-days.ts, rounds.repository.ts).
 */
function serversRound(
  collection: [EngineAnimal, EngineEvent[]][],
  taps: QueuedTap[],
  zone: string,
  date: LocalDate,
) {
  const logs = new Map(collection.map(([a, events]) => [a.id, [...events]]));
  for (const { event } of taps)
    logs.get(event.animalId)!.push({
      id: event.id,
      kind: event.kind,
      effectiveAt: event.clientRecordedAt,
      payload: event.payload,
    });
  const input = collection.map(([animal]) => ({
    animal,
    state: projectState(logs.get(animal.id)!, zone, date),
  }));
  const built = buildRound(input, DEFAULT_RULES, date);
  const outcomes = new Map<string, DayOutcome[]>();
  for (const { event, byName } of taps) {
    if (localDateOf(new Date(event.clientRecordedAt), zone) !== date) continue;
    const list = outcomes.get(event.animalId) ?? [];
    list.push({
      eventId: event.id,
      kind: event.kind,
      at: event.clientRecordedAt,
      by: byName,
      voids: (event.payload.targetId as string | undefined) ?? null,
    });
    outcomes.set(event.animalId, list);
  }
  const items = built.items.map((i) => ({
    ...i,
    addedDuringDay: false,
    postMoltHoldDays: postMoltHoldDays(DEFAULT_RULES, i.animal),
  }));
  return roundView(zone, date, { builtAt: null, prepList: built.prepList, items }, outcomes);
}

describe('a round built on the phone', () => {
  for (const { zone, fetchedOn } of CASES)
    it(
      `equals the server's for the same state, rules and date, two days on, across the DST change in ${zone}`,
      () => {
        fc.assert(
          fc.property(
            generatedCollection(fetchedOn, zone).chain((collection) =>
              fc
                .integer({ min: 0, max: 1200 })
                .chain((fetchedMinute) =>
                  fc.tuple(
                    fc.constant(collection),
                    tapsArb(collection.length, fetchedOn, zone, fetchedMinute),
                  ),
                ),
            ),
            ([collection, taps]) => {
              // What the phone was sent: each state as projected when it last had signal.
              const input = {
                timeZone: zone,
                date: fetchedOn,
                rules: {},
                animals: collection.map(([animal, events]) => ({
                  animal,
                  state: projectState(events, zone),
                })),
              };
              for (const days of [1, 2]) {
                const date = addDays(fetchedOn, days);
                // Both as the app reads them: through the API's schema (field by field).
                const phone = roundResponse.parse(phoneRound(input, taps, date, true));
                const server = roundResponse.parse(serversRound(collection, taps, zone, date));
                expect(phone).toEqual(server);
              }
            },
          ),
          { numRuns: 400 },
        );
      },
      // 800 generated collections: seconds on an idle machine, more on a busy one.
      60_000,
    );
});

describe('the phone’s days, worked cases', () => {
  const zone = 'America/Toronto';
  const animal: EngineAnimal = {
    id: 'a1',
    labelCode: 'NL-1',
    name: 'Dusty',
    scientificName: 'Grammostola pulchra',
    group: 'tarantula',
    lifeStage: 'adult',
    sex: 'female',
    sizeMm: 120,
    status: 'active',
    cautions: [],
    location: null,
    hasWaterDish: true,
    intervalDays: 7,
    preyType: null,
    preySize: null,
    preyCount: null,
    diet: null,
    doNotFeedUntil: null,
    addedOn: '2026-01-01',
  };
  // Last fed eight days before the phone lost signal on Wed 2 Dec: due that day and after.
  const input = {
    timeZone: zone,
    date: '2026-12-02',
    rules: {},
    animals: [{ animal, state: { ...EMPTY_STATE, lastMeal: '2026-11-24' } }],
  };
  const tap = (id: string, kind: EventKind, at: string): QueuedTap => ({
    event: { id, animalId: 'a1', kind, payload: {}, clientRecordedAt: at },
    byName: 'Robin',
  });

  it('puts a meal tapped on the first day offline into the second day’s state, not its outcomes', () => {
    // 09:00 in Toronto on Thu 3 Dec is 14:00 UTC (EST, UTC−5).
    const taps = [tap('e1', 'ate', '2026-12-03T14:00:00.000Z')];
    const thursday = phoneRound(input, taps, '2026-12-03', true);
    expect(thursday.items[0]!.tasks.find((t) => t.kind === 'feed')?.done?.eventId).toBe('e1');
    expect(thursday.progress.done).toBeGreaterThan(0);
    const friday = phoneRound(input, taps, '2026-12-04', true);
    expect(
      friday.items.find((i) => i.animal.id === 'a1')?.tasks.some((t) => t.kind === 'feed'),
    ).toBeFalsy();
    expect(friday.items.flatMap((i) => i.outcomes)).toEqual([]);
  });

  it('leaves an undone meal out of the state, as the server does', () => {
    const taps = [
      tap('e1', 'ate', '2026-12-03T14:00:00.000Z'),
      {
        event: {
          id: 'v1',
          animalId: 'a1',
          kind: 'void' as const,
          payload: { targetId: 'e1' },
          clientRecordedAt: '2026-12-03T14:01:00.000Z',
        },
        byName: 'Robin',
      },
    ];
    const [friday] = inputForDate(input, taps, '2026-12-04');
    expect(friday!.state.lastMeal).toBe('2026-11-24');
    expect(
      outcomesOnDate(taps, zone, '2026-12-03')
        .get('a1')
        ?.map((o) => o.kind),
    ).toEqual(['ate', 'void']);
  });

  it('counts a tap at 23:59 local on its own day, not the next (UTC has already turned)', () => {
    // 23:59 on Thu 3 Dec in Toronto is 04:59 UTC on Fri 4 Dec.
    const taps = [tap('e1', 'refused', '2026-12-04T04:59:00.000Z')];
    expect([...outcomesOnDate(taps, zone, '2026-12-03').keys()]).toEqual(['a1']);
    expect(outcomesOnDate(taps, zone, '2026-12-04').size).toBe(0);
  });
});
