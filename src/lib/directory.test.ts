import 'fake-indexeddb/auto';
import { randomUUID } from 'node:crypto';
import { openDB } from 'idb';
import { describe, expect, it } from 'vitest';
import { sampleAnimal } from '../../tests/fixtures/sample-round';
import { openRacksideDb } from './db';
import { cachedDirectory, storeDirectory } from './directory';

describe('the animal directory on the phone', () => {
  it('keeps the last list per collection', async () => {
    const db = await openRacksideDb(`test-${randomUUID()}`);
    expect(await cachedDirectory(db, 'c1')).toBeUndefined();
    await storeDirectory(
      db,
      'c1',
      [sampleAnimal({ labelCode: 'NL-7K3' })],
      new Date('2026-12-02T12:00:00Z'),
    );
    const stored = await cachedDirectory(db, 'c1');
    expect(stored?.animals.map((a) => a.labelCode)).toEqual(['NL-7K3']);
    expect(stored?.fetchedAt).toBe('2026-12-02T12:00:00.000Z');
    db.close();
  });

  it('upgrades a version-1 database without losing queued taps', async () => {
    const name = `test-${randomUUID()}`;
    // Version 1 as the previous release created it, with one tap waiting.
    const v1 = await openDB(name, 1, {
      upgrade(db) {
        db.createObjectStore('rounds', { keyPath: 'key' });
        db.createObjectStore('roundItems', { keyPath: ['roundKey', 'animalId'] }).createIndex(
          'byRound',
          'roundKey',
        );
        const outbox = db.createObjectStore('outbox', { keyPath: 'seq', autoIncrement: true });
        outbox.createIndex('byEventId', 'event.id', { unique: true });
        outbox.createIndex('byUser', 'userId');
        db.createObjectStore('attention', { keyPath: 'id' }).createIndex('byUser', 'userId');
        db.createObjectStore('meta');
      },
    });
    await v1.add('outbox', {
      userId: 'u1',
      collectionId: 'c1',
      animalName: 'Juniper',
      byName: 'Robin',
      event: { id: 'e1' },
    });
    v1.close();

    const db = await openRacksideDb(name);
    expect((await db.getAll('outbox')).map((e) => e.event.id)).toEqual(['e1']);
    await storeDirectory(db, 'c1', [], new Date());
    expect(await cachedDirectory(db, 'c1')).toBeDefined();
    db.close();
  });
});
