import 'fake-indexeddb/auto';
import { randomUUID } from 'node:crypto';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { EMPTY_STATE } from '#shared/domain/rounds/animal-state';
import type { EngineAnimal } from '#shared/domain/rounds/build-round';
import type { RecordedEvent } from '#shared/schemas/events';
import type { EngineInputResponse } from '#shared/schemas/rounds';
import { currentRound, storeEngineInput } from './day-on-phone';
import { openRacksideDb, type RacksideDb } from './db';
import { recordTap, waitingTaps } from './outbox';
import { storeServerRound } from './round-cache';

const USER = 'user-1';
const COLLECTION = 'collection-1';
const ZONE = 'America/Toronto';
let db: RacksideDb;

const animal = (id: string, name: string, position: string): EngineAnimal => ({
  id,
  labelCode: `NL-${position}`,
  name,
  scientificName: 'Grammostola pulchra',
  group: 'tarantula',
  lifeStage: 'adult',
  sex: 'female',
  sizeMm: 120,
  status: 'active',
  cautions: [],
  location: { id: `l${id}`, room: 'Back room', rack: 'A', shelf: '1', position, walkOrder: 0 },
  hasWaterDish: false,
  intervalDays: 7,
  preyType: null,
  preySize: null,
  preyCount: null,
  diet: null,
  doNotFeedUntil: null,
  addedOn: '2026-01-01',
  spotCleanEveryDays: 0, // feeding days only: spot-cleans are enclosure-care.test.ts's
});

// Sent on Wed 2 Dec at 11:42 Toronto time (16:42 UTC): Dusty last ate on 24 Nov (due since
// 1 Dec), Ember on 28 Nov (due on 5 Dec).
const INPUT: EngineInputResponse = {
  collectionId: COLLECTION,
  timeZone: ZONE,
  date: '2026-12-02',
  asOf: '2026-12-02T16:42:00.000Z',
  rules: {},
  animals: [
    { animal: animal('a1', 'Dusty', '1'), state: { ...EMPTY_STATE, lastMeal: '2026-11-24' } },
    { animal: animal('a2', 'Ember', '2'), state: { ...EMPTY_STATE, lastMeal: '2026-11-28' } },
  ],
};
// 09:00 in Toronto (EST, UTC−5).
const morningOf = (date: string) => new Date(`${date}T14:00:00.000Z`);

const tap = (animalId: string, kind: RecordedEvent['kind'], at: Date) =>
  recordTap(db, {
    userId: USER,
    byName: 'Robin',
    collectionId: COLLECTION,
    animalName: animalId === 'a1' ? 'Dusty' : 'Ember',
    event: { id: randomUUID(), animalId, kind, payload: {}, clientRecordedAt: at.toISOString() },
  });

const today = (now: Date) => currentRound(db, USER, COLLECTION, 'today', now);
const names = (r: { round: { items: { animal: { name: string } }[] } } | undefined) =>
  r?.round.items.map((i) => i.animal.name);

beforeEach(async () => {
  db = await openRacksideDb(`test-${randomUUID()}`);
});
afterEach(() => db.close());

describe('a new local day with no signal', () => {
  it('is built on the phone from the stored input, marked as such with the data’s time', async () => {
    await storeEngineInput(db, USER, INPUT, '"e1"', new Date(INPUT.asOf));
    const thursday = (await today(morningOf('2026-12-03')))!;
    expect(thursday.round.date).toBe('2026-12-03');
    expect(thursday.builtOnPhone).toBe(true);
    expect(thursday.fetchedAt).toBe(INPUT.asOf);
    expect(names(thursday)).toEqual(['Dusty']);
  });

  it('takes taps like a server round, keeps them across reads, and folds them into the next day', async () => {
    await storeEngineInput(db, USER, INPUT, '"e1"', new Date(INPUT.asOf));
    await today(morningOf('2026-12-03'));
    const effect = await tap('a1', 'ate', morningOf('2026-12-03'));
    expect(effect?.doneDelta).toBe(1);
    const reread = (await today(new Date('2026-12-03T20:00:00.000Z')))!;
    expect(reread.round.progress).toEqual({ done: 1, total: 1 });

    // Saturday 5 Dec: Dusty ate on Thursday (next due 10 Dec); Ember is due.
    const saturday = (await today(morningOf('2026-12-05')))!;
    expect(saturday.round.date).toBe('2026-12-05');
    expect(names(saturday)).toEqual(['Ember']);
    expect(saturday.round.progress.done).toBe(0);
  });

  it('rebuilds tomorrow’s preview for the day after the phone’s today', async () => {
    await storeEngineInput(db, USER, INPUT, '"e1"', new Date(INPUT.asOf));
    const preview = (await currentRound(
      db,
      USER,
      COLLECTION,
      'tomorrow',
      morningOf('2026-12-04'),
    ))!;
    expect(preview.round.date).toBe('2026-12-05');
    expect(preview.builtOnPhone).toBe(true);
  });

  it('without stored input (a helper’s phone) keeps the old copy, whose date tells the truth', async () => {
    const wednesday = (await (async () => {
      await storeEngineInput(db, USER, INPUT, '"e1"', new Date(INPUT.asOf));
      return today(morningOf('2026-12-03'));
    })())!;
    const other = 'user-2';
    await storeServerRound(db, other, COLLECTION, 'today', wednesday.round, new Date());
    const kept = await currentRound(db, other, COLLECTION, 'today', morningOf('2026-12-04'));
    expect(kept?.round.date).toBe('2026-12-03');
    expect(kept?.builtOnPhone).toBeUndefined();
  });
});

describe('when the signal returns', () => {
  it('puts only that day’s waiting taps on the server’s round, and lists taps it has no card for', async () => {
    await storeEngineInput(db, USER, INPUT, '"e1"', new Date(INPUT.asOf));
    // Friday: Dusty's dish topped up (still waiting). Saturday: Ember fed, and that tap synced.
    await today(morningOf('2026-12-04'));
    await tap('a1', 'watered', morningOf('2026-12-04'));
    const phone = (await today(morningOf('2026-12-05')))!;
    expect(names(phone)).toEqual(['Dusty', 'Ember']);
    await tap('a2', 'ate', morningOf('2026-12-05'));
    const synced = (await waitingTaps(db, USER)).find((e) => e.event.animalId === 'a2')!;
    await db.delete('outbox', synced.seq!);

    // The server's Saturday round has no card for Ember (moved to another collection, say).
    const serverRound = {
      ...phone.round,
      builtAt: '2026-12-05T05:00:00.000Z',
      items: phone.round.items.filter((i) => i.animal.id === 'a1'),
    };
    const stored = await storeServerRound(db, USER, COLLECTION, 'today', serverRound, new Date());
    expect(stored.builtOnPhone).toBeUndefined();
    // Friday's waiting tap is Friday's: not shown on Saturday's round.
    expect(stored.round.items.flatMap((i) => i.outcomes)).toEqual([]);
    expect(stored.unsettled?.map((t) => [t.animalName, t.kind])).toEqual([['Ember', 'ate']]);
    // Still listed after the next refresh of the same day.
    const again = await storeServerRound(db, USER, COLLECTION, 'today', serverRound, new Date());
    expect(again.unsettled?.map((t) => t.animalName)).toEqual(['Ember']);
  });
});
