import 'fake-indexeddb/auto';
import { randomUUID } from 'node:crypto';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import type { RecordedEvent } from '#shared/schemas/events';
import { sampleRound } from '../../tests/fixtures/sample-round';
import { openRacksideDb, type RacksideDb } from './db';
import { attentionOf, nextBatch, recordTap, recordTaps, settleBatch, waitingTaps } from './outbox';
import { cachedRound, storeServerRound } from './round-cache';

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
const tap = (e: RecordedEvent, userId = USER) =>
  recordTap(db, {
    userId,
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

describe('a tap', () => {
  it('writes the event to the outbox and its effect to the cached round together', async () => {
    const e = event('ate');
    const effect = await tap(e);
    expect(effect!.item.tasks[0]!.done).toMatchObject({ eventId: e.id, by: 'Robin' });
    expect(effect!.doneDelta).toBe(1);
    expect((await cachedRound(db, USER, COLLECTION, 'today'))!.round.progress.done).toBe(1);
    expect((await waitingTaps(db, USER)).map((w) => w.event.id)).toEqual([e.id]);
  });

  it('is atomic: when the outbox write fails, the round is left as it was', async () => {
    const e = event('ate');
    await tap(e);
    // The same event id again breaks the outbox's unique index, so the transaction aborts.
    await expect(tap({ ...e, kind: 'watered' })).rejects.toThrow();
    const round = (await cachedRound(db, USER, COLLECTION, 'today'))!.round;
    expect(round.items[0]!.tasks[1]!.done).toBeNull();
    expect(round.progress.done).toBe(1);
    expect(await waitingTaps(db, USER)).toHaveLength(1);
  });

  it('keeps other people’s taps on this phone apart', async () => {
    await tap(event('ate'), 'someone-else');
    await tap(event('watered'));
    expect(await waitingTaps(db, USER)).toHaveLength(1);
    expect(await nextBatch(db, 'someone-else', 10)).toHaveLength(1);
  });
});

describe('settling a batch', () => {
  it('removes only acknowledged taps and moves refused ones to needs-attention', async () => {
    const [a, b, c, d] = [
      event('ate'),
      event('watered'),
      event('note', { payload: { text: 'x' } }),
      event('refused'),
    ];
    for (const e of [a, b, c, d]) await tap(e);
    const sent = await nextBatch(db, USER, 10);
    const counts = await settleBatch(
      db,
      sent,
      [
        { id: a.id, status: 'accepted' },
        { id: b.id, status: 'duplicate' },
        {
          id: c.id,
          status: 'rejected',
          reason: 'outside_cover',
          message: 'This was recorded outside your cover.',
        },
        // d got no verdict (e.g. a cut-off answer): it must stay queued.
      ],
      new Date('2026-12-01T15:00:00Z'),
    );
    expect(counts).toEqual({ acknowledged: 2, refused: 1 });
    expect((await waitingTaps(db, USER)).map((w) => w.event.id)).toEqual([d.id]);
    expect(await attentionOf(db, USER)).toEqual([
      expect.objectContaining({
        id: c.id,
        reason: 'outside_cover',
        message: 'This was recorded outside your cover.',
        animalName: 'Bramble',
      }),
    ]);
  });

  it('ignores verdicts for ids it did not send', async () => {
    const a = event('ate');
    await tap(a);
    const sent = await nextBatch(db, USER, 10);
    expect(
      await settleBatch(db, sent, [{ id: randomUUID(), status: 'accepted' }], new Date()),
    ).toEqual({ acknowledged: 0, refused: 0 });
    expect(await waitingTaps(db, USER)).toHaveLength(1);
  });
});

describe('a tray at once', () => {
  const asTap = (e: RecordedEvent) => ({
    userId: USER,
    byName: 'Robin',
    collectionId: COLLECTION,
    animalName: 'x',
    event: e,
  });
  const DUSTY = sampleRound().items[1]!.animal.id;

  it('records every animal in one transaction and reports each item’s change', async () => {
    const effects = await recordTaps(db, [
      asTap(event('ate')),
      asTap(event('refused', { animalId: DUSTY })),
    ]);
    expect(effects.map((e) => [e.animalId, e.doneDelta])).toEqual([
      [BRAMBLE, 1],
      [DUSTY, 1],
    ]);
    expect(await waitingTaps(db, USER)).toHaveLength(2);
    expect((await cachedRound(db, USER, COLLECTION, 'today'))!.round.progress.done).toBe(2);
  });

  it('records nothing when one of them fails', async () => {
    const ate = event('ate');
    await tap(ate);
    await expect(
      recordTaps(db, [
        asTap(event('refused', { animalId: DUSTY })),
        asTap({ ...ate, kind: 'watered' }),
      ]),
    ).rejects.toThrow();
    expect((await waitingTaps(db, USER)).map((w) => w.event.id)).toEqual([ate.id]);
    const dusty = (await cachedRound(db, USER, COLLECTION, 'today'))!.round.items[1]!;
    expect(dusty.tasks[0]!.done).toBeNull();
  });
});
