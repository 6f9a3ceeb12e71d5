import 'fake-indexeddb/auto';
import { randomUUID } from 'node:crypto';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import type { RecordedEvent } from '#shared/schemas/events';
import { deviceIdOf, storeMe, withDb, type RacksideDb } from '@/lib/db';
import { storeDirectory } from '@/lib/directory';
import { attentionOf, recordTap, settleBatch, waitingTaps } from '@/lib/outbox';
import { storeServerRound } from '@/lib/round-cache';
import { sampleRound } from '../../../../tests/fixtures/sample-round';
import { signOut } from './sign-out';

const USER = 'user-1';
const COLLECTION = 'collection-1';
const me = {
  user: {
    id: USER,
    email: 'robin@example.test',
    displayName: 'Robin',
    temperatureUnit: 'C' as const,
  },
  memberships: [],
};

async function tap(db: RacksideDb) {
  const event: RecordedEvent = {
    id: randomUUID(),
    animalId: randomUUID(),
    kind: 'watered',
    payload: {},
    clientRecordedAt: new Date().toISOString(),
  };
  await recordTap(db, {
    userId: USER,
    byName: 'Robin',
    collectionId: COLLECTION,
    animalName: 'Bramble',
    event,
  });
  return event.id;
}

/** Everything a signed-in phone keeps: the page's own connection, as the app uses it. */
async function fillPhone() {
  return withDb(async (db) => {
    await storeMe(db, me);
    await storeServerRound(db, USER, COLLECTION, 'today', sampleRound(), new Date());
    await storeServerRound(db, USER, COLLECTION, 'tomorrow', sampleRound(), new Date());
    await storeDirectory(db, COLLECTION, [], new Date());
    await db.put('meta', { collectionName: 'Spare room' }, `cover|${USER}|${COLLECTION}`);
    await db.put('meta', true, 'persistAsked');
    const deviceId = await deviceIdOf(db);
    const refused = await tap(db);
    const [entry] = await waitingTaps(db, USER);
    await settleBatch(
      db,
      [entry!],
      [{ id: refused, status: 'rejected', reason: 'unknown_animal', message: 'Gone.' }],
      new Date(),
    );
    const waiting = await tap(db);
    return { deviceId, waiting, refused };
  });
}

beforeEach(() => {
  vi.stubGlobal(
    'fetch',
    vi.fn(async () => new Response(null, { status: 204 })),
  );
});
afterEach(async () => {
  vi.unstubAllGlobals();
  await withDb(async (db) => {
    for (const store of [
      'rounds',
      'roundItems',
      'directory',
      'meta',
      'outbox',
      'attention',
    ] as const)
      await db.clear(store);
  });
});

describe('sign-out', () => {
  it('forgets every cached round, animal list and `me`, and keeps the device id and the person’s taps', async () => {
    const { deviceId, waiting, refused } = await fillPhone();
    await signOut();
    expect(fetch).toHaveBeenCalledWith(
      '/api/auth/sign-out',
      expect.objectContaining({ method: 'POST' }),
    );
    await withDb(async (db) => {
      expect(await db.count('rounds')).toBe(0);
      expect(await db.count('roundItems')).toBe(0);
      expect(await db.count('directory')).toBe(0);
      expect((await db.getAllKeys('meta')).sort()).toEqual(['deviceId', 'persistAsked']);
      expect(await deviceIdOf(db)).toBe(deviceId);
      // The author's own taps wait for their next sign-in here.
      expect((await waitingTaps(db, USER)).map((w) => w.event.id)).toEqual([waiting]);
      expect((await attentionOf(db, USER)).map((a) => a.id)).toEqual([refused]);
    });
  });

  it('clears nothing when the server did not sign the person out', async () => {
    vi.stubGlobal(
      'fetch',
      vi.fn(async () => {
        throw new TypeError('Failed to fetch');
      }),
    );
    await fillPhone();
    await expect(signOut()).rejects.toThrow(/No connection/);
    await withDb(async (db) => {
      expect(await db.count('rounds')).toBe(2);
      expect(await db.count('directory')).toBe(1);
      expect(await db.get('meta', 'me')).toEqual(me);
    });
  });
});
