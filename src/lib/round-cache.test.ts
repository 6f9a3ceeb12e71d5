import 'fake-indexeddb/auto';
import { randomUUID } from 'node:crypto';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import type { RecordedEvent } from '#shared/schemas/events';
import { sampleRound } from '../../tests/fixtures/sample-round';
import { openRacksideDb, type CachedRound, type RacksideDb } from './db';
import { recordTap } from './outbox';
import { applyTapEffect, cachedRound, storeServerRound } from './round-cache';

const USER = 'user-1';
const COLLECTION = 'collection-1';
const BRAMBLE = sampleRound().items[0]!.animal.id;
let db: RacksideDb;

const event = (kind: RecordedEvent['kind'], extra: Partial<RecordedEvent> = {}): RecordedEvent => ({
  id: randomUUID(),
  animalId: BRAMBLE,
  kind,
  payload: {},
  clientRecordedAt: '2026-12-01T14:00:00.000Z',
  ...extra,
});
const tap = (e: RecordedEvent) =>
  recordTap(db, {
    userId: USER,
    byName: 'Robin',
    collectionId: COLLECTION,
    animalName: 'Bramble',
    event: e,
  });

beforeEach(async () => {
  db = await openRacksideDb(`test-${randomUUID()}`);
  await storeServerRound(db, USER, COLLECTION, 'today', sampleRound(), new Date());
});
afterEach(() => db.close());

describe('the phone’s copy of a round', () => {
  it('is read back in walk order with its progress counted from the items', async () => {
    const cached = (await cachedRound(db, USER, COLLECTION, 'today'))!;
    expect(cached.round.items.map((i) => i.animal.id)).toEqual(
      sampleRound().items.map((i) => i.animal.id),
    );
    expect(cached.round.progress).toEqual(sampleRound().progress);
    expect(await cachedRound(db, USER, COLLECTION, 'tomorrow')).toBeUndefined();
  });

  it('takes a tap’s effect on the screen’s copy as the stored copy has it', async () => {
    const before = (await cachedRound(db, USER, COLLECTION, 'today'))!;
    const effect = (await tap(event('ate')))!;
    const onScreen = applyTapEffect(before, effect);
    expect(onScreen.round).toEqual((await cachedRound(db, USER, COLLECTION, 'today'))!.round);
  });
});

describe('a fresh copy of the round from the server', () => {
  it('keeps showing taps that have not been sent yet', async () => {
    const a = event('ate');
    await tap(a);
    const stored = await storeServerRound(db, USER, COLLECTION, 'today', sampleRound(), new Date());
    expect(stored.round.items[0]!.tasks[0]!.done?.eventId).toBe(a.id);
    expect(stored.round.progress.done).toBe(1);
  });

  it('hands the merged round to the screen before its write ends, and a tap made then lands on it', async () => {
    const a = event('ate');
    await tap(a);
    let shown: CachedRound | undefined;
    let tapped: Promise<unknown> | undefined;
    const stored = await storeServerRound(
      db,
      USER,
      COLLECTION,
      'today',
      sampleRound(),
      new Date(),
      (merged) => {
        shown = merged;
        // A tap while the write is under way queues behind it.
        tapped = tap(event('refused'));
      },
    );
    expect(shown).toBe(stored);
    expect(shown!.round.items[0]!.tasks[0]!.done?.eventId).toBe(a.id);
    await tapped;
    const after = await cachedRound(db, USER, COLLECTION, 'today');
    expect(after!.round.items[0]!.outcomes.map((o) => o.kind)).toEqual(['ate', 'refused']);
  });

  it('does not count a tap twice once the server has it', async () => {
    const a = event('ate');
    await tap(a);
    const fromServer = sampleRound();
    fromServer.items[0]!.outcomes = [
      { eventId: a.id, kind: 'ate', at: a.clientRecordedAt, by: 'Robin' },
    ];
    fromServer.items[0]!.tasks[0]!.done = {
      eventId: a.id,
      kind: 'ate',
      at: a.clientRecordedAt,
      by: 'Robin',
    };
    fromServer.progress.done = 1;
    const stored = await storeServerRound(db, USER, COLLECTION, 'today', fromServer, new Date());
    expect(stored.round.items[0]!.outcomes).toHaveLength(1);
    expect(stored.round.progress.done).toBe(1);
  });

  it('applies a waiting undo to an outcome the server already has', async () => {
    const meal = event('ate');
    const fromServer = sampleRound();
    fromServer.items[0]!.outcomes = [
      { eventId: meal.id, kind: 'ate', at: meal.clientRecordedAt, by: 'Robin' },
    ];
    await tap(event('void', { payload: { targetId: meal.id } }));
    const stored = await storeServerRound(db, USER, COLLECTION, 'today', fromServer, new Date());
    expect(stored.round.items[0]!.outcomes).toEqual([]);
  });
});
