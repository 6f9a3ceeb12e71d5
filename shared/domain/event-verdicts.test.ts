import { describe, expect, it } from 'vitest';
import {
  factsToLoad,
  judgeBatch,
  screenBatch,
  settleLostRaces,
  type BatchFacts,
  type BatchWriter,
} from './event-verdicts';

const ZONE = 'America/Toronto';
const NOW = new Date('2026-11-22T17:00:00Z'); // noon in Toronto
const COLLECTION = '00000000-0000-4000-8000-00000000c001';
const ANIMAL = '00000000-0000-4000-8000-00000000a001';
const OTHER_ANIMAL = '00000000-0000-4000-8000-00000000a002';
const KEEPER = '00000000-0000-4000-8000-00000000u001';
const HELPER = '00000000-0000-4000-8000-00000000u002';

let n = 0;
const id = () => `00000000-0000-4000-8000-${String(++n).padStart(12, '0')}`;
const tap = (
  kind: string,
  payload: Record<string, unknown> = {},
  extra: Record<string, unknown> = {},
) => ({
  id: id(),
  animalId: ANIMAL,
  kind,
  payload,
  clientRecordedAt: new Date(NOW.getTime() - 60_000).toISOString(),
  ...extra,
});

const keeper: BatchWriter = {
  collectionId: COLLECTION,
  collectionName: 'Northlight',
  timeZone: ZONE,
  role: 'keeper',
  userId: KEEPER,
  startsAt: null,
  endsAt: null,
  writesClosedAt: null,
};
const helper: BatchWriter = {
  ...keeper,
  role: 'helper',
  userId: HELPER,
  startsAt: new Date('2026-11-20T05:00:00Z'),
  endsAt: new Date('2026-11-27T05:00:00Z'),
};
const facts = (over: Partial<BatchFacts> = {}): BatchFacts => ({
  animals: new Set([ANIMAL, OTHER_ANIMAL]),
  stored: new Map(),
  breeders: new Map(),
  moltTimes: new Map(),
  ...over,
});

/** Judges a batch sent now by a phone whose clock is right. */
function judge(events: unknown[], writer = keeper, known = facts(), received = NOW) {
  return judgeBatch(screenBatch(events, received, received), writer, known, received);
}
const verdicts = (r: ReturnType<typeof judge>) => r.results.map((x) => x.reason ?? x.status);

describe('screenBatch', () => {
  it('refuses a malformed event with the field at fault, and calls a repeated id a duplicate', () => {
    const meal = tap('ate');
    const { results, candidates } = screenBatch(
      [meal, { ...tap('molted'), payload: { sizeMm: -4 } }, meal, 'not an event'],
      NOW,
      NOW,
    );
    expect(candidates.map((c) => c.index)).toEqual([0]);
    expect(results[1]).toMatchObject({
      status: 'rejected',
      reason: 'invalid',
      message: 'payload.sizeMm: The size must be more than 0 mm.',
    });
    expect(results[2]).toEqual({ id: meal.id, status: 'duplicate' });
    expect(results[3]).toMatchObject({ id: '', status: 'rejected', reason: 'invalid' });
  });

  it('files each event at the server’s time: the batch’s clock offset moves it (clock.ts)', () => {
    const sent = new Date(NOW.getTime() - 10 * 60_000); // the phone runs ten minutes slow
    const e = tap(
      'watered',
      {},
      { clientRecordedAt: new Date(sent.getTime() - 20 * 60_000).toISOString() },
    );
    const [c] = screenBatch([e], sent, NOW).candidates;
    expect(c!.effectiveAt.toISOString()).toBe(new Date(NOW.getTime() - 20 * 60_000).toISOString());
    expect(c!.flags).toEqual(['clock_corrected']);
  });
});

describe('factsToLoad', () => {
  it('asks keepers’ batches for undo targets only, helpers’ for their own ids too', () => {
    const meal = tap('ate');
    const undo = tap('void', { targetId: meal.id });
    const pairing = tap('paired', {}, { animalId: OTHER_ANIMAL });
    const screened = screenBatch([meal, undo, pairing, tap('molted')], NOW, NOW);
    expect(factsToLoad(screened, 'keeper')).toEqual({
      animalIds: [ANIMAL, OTHER_ANIMAL],
      eventIds: [meal.id],
      pairedIds: [OTHER_ANIMAL],
      moltingIds: [ANIMAL],
    });
    expect(factsToLoad(screened, 'helper').eventIds).toHaveLength(5);
  });
});

describe('judgeBatch', () => {
  it('accepts good events in order and refuses the rest one by one, with the reason', () => {
    const good = tap('refused');
    const stranger = tap('ate', {}, { animalId: '00000000-0000-4000-8000-00000000a999' });
    const orphanUndo = tap('void', { targetId: id() });
    const r = judge([good, stranger, orphanUndo]);
    expect(verdicts(r)).toEqual(['accepted', 'unknown_animal', 'target_unknown']);
    expect(r.accepted.map((c) => c.event.id)).toEqual([good.id]);
  });

  it('calls an id stored in this collection a duplicate, one stored elsewhere a conflict', () => {
    const mine = tap('ate');
    const theirs = tap('ate');
    const stored = new Map([
      [mine.id, { collectionId: COLLECTION, animalId: ANIMAL, kind: 'ate', recordedBy: KEEPER }],
      [theirs.id, { collectionId: 'elsewhere', animalId: ANIMAL, kind: 'ate', recordedBy: KEEPER }],
    ]);
    expect(verdicts(judge([mine, theirs], keeper, facts({ stored })))).toEqual([
      'duplicate',
      'id_conflict',
    ]);
  });

  it('lets an undo point at a tap accepted earlier in the batch, never at another animal’s', () => {
    const meal = tap('ate');
    const otherMeal = tap('ate', {}, { animalId: OTHER_ANIMAL });
    const r = judge([
      meal,
      otherMeal,
      tap('void', { targetId: meal.id }),
      tap('void', { targetId: otherMeal.id }),
    ]);
    expect(verdicts(r)).toEqual(['accepted', 'accepted', 'accepted', 'bad_target']);
  });

  it('puts molt details only on a molt, and refuses a second molt on the same local day', () => {
    const molt = tap('molted');
    const meal = tap('ate');
    const earlier = new Map([[ANIMAL, [new Date('2026-11-10T17:00:00Z')]]]);
    const r = judge(
      [
        meal,
        molt,
        tap('molt_details', { targetId: meal.id }),
        tap('molt_details', { targetId: molt.id, sizeMm: 40 }),
        tap('molted'),
      ],
      keeper,
      facts({ moltTimes: earlier }),
    );
    expect(verdicts(r)).toEqual(['accepted', 'accepted', 'bad_target', 'accepted', 'invalid']);
    expect(r.results[4]!.message).toBe(
      'A molt is already recorded for this animal on 22 Nov. Add its size or sex to that molt instead of recording a second one.',
    );
  });

  it('records a pairing only for a female of a group that breeds (breeding.ts)', () => {
    const breeders = new Map([
      [ANIMAL, { name: 'Juniper', sex: 'female' as const, group: 'tarantula' as const }],
      [
        OTHER_ANIMAL,
        { name: 'Blue Jay', sex: 'mature_male' as const, group: 'tarantula' as const },
      ],
    ]);
    const r = judge(
      [tap('paired'), tap('paired', {}, { animalId: OTHER_ANIMAL })],
      keeper,
      facts({ breeders }),
    );
    expect(verdicts(r)).toEqual(['accepted', 'invalid']);
    expect(r.results[1]!.message).toMatch(
      /^A pairing is not recorded: Blue Jay is recorded as a male/,
    );
  });

  describe('for a helper (helper-writes.ts)', () => {
    it('accepts feeding and undoing their own taps, refuses keepers’ kinds and others’ taps', () => {
      const keepersMeal = tap('ate');
      const stored = new Map([
        [
          keepersMeal.id,
          { collectionId: COLLECTION, animalId: ANIMAL, kind: 'ate', recordedBy: KEEPER },
        ],
      ]);
      const own = tap('ate');
      const r = judge(
        [
          own,
          tap('void', { targetId: own.id }),
          tap('paired'),
          tap('void', { targetId: keepersMeal.id }),
        ],
        helper,
        facts({ stored }),
      );
      expect(verdicts(r)).toEqual(['accepted', 'accepted', 'not_for_helpers', 'not_for_helpers']);
      expect(r.results[3]!.message).toBe('Helpers can undo only their own taps.');
    });

    it('refuses taps made outside the cover, after the grace, or after the owner ended it', () => {
      const before = tap('ate', {}, { clientRecordedAt: '2026-11-19T17:00:00Z' });
      expect(judge([before], helper).results[0]).toMatchObject({
        reason: 'outside_cover',
        message: expect.stringMatching(
          /^This was recorded outside your cover\. Your cover for Northlight runs from/,
        ),
      });

      const late = new Date(helper.endsAt!.getTime() + 49 * 3_600_000);
      const lastDay = tap('ate', {}, { clientRecordedAt: '2026-11-26T17:00:00Z' });
      const tooLate = judgeBatch(screenBatch([lastDay], late, late), helper, facts(), late);
      expect(tooLate.results[0]!.message).toMatch(
        /more than 48 hours after your cover for Northlight ended on/,
      );

      const closed = { ...helper, writesClosedAt: new Date('2026-11-22T16:00:00Z') };
      expect(judge([tap('ate')], closed).results[0]!.message).toMatch(
        /^Your cover for Northlight was ended on/,
      );
    });
  });
});

describe('settleLostRaces', () => {
  it('turns an accepted event another request stored first into a duplicate, or a conflict elsewhere', () => {
    const [a, b, c] = [id(), id(), id()];
    const results = [
      { id: a, status: 'accepted' as const },
      { id: b, status: 'accepted' as const },
      { id: c, status: 'accepted' as const },
    ];
    const winners = new Map([
      [a, { collectionId: COLLECTION }],
      [b, { collectionId: 'elsewhere' }],
    ]);
    expect(settleLostRaces(results, new Set([a, b]), winners, COLLECTION)).toEqual([
      { id: a, status: 'duplicate' },
      {
        id: b,
        status: 'rejected',
        reason: 'id_conflict',
        message: 'This event id is already used elsewhere.',
      },
      { id: c, status: 'accepted' },
    ]);
  });
});
