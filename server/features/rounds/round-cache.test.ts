import { gunzipSync } from 'node:zlib';
import { describe, expect, it } from 'vitest';
import { projectState } from '#shared/domain/rounds/animal-state';
import { buildRound } from '#shared/domain/rounds/build-round';
import { roundView, type BuiltPart } from '#shared/domain/rounds/round-view';
import { DEFAULT_RULES, postMoltHoldDays } from '#shared/domain/rounds/rules';
import type { DayOutcome } from '#shared/domain/rounds/settle';
import { engineAnimal } from '../../../tests/fixtures/engine-animal';
import { createRoundJson, LatestByKey, serialiseRound } from './round-cache';

describe('LatestByKey', () => {
  it('makes a value once per key, shares it while in flight, and replaces it on a new key', async () => {
    const cache = new LatestByKey<number>(10);
    let made = 0;
    const make = (n: number) => async () => {
      made++;
      await new Promise((r) => setTimeout(r, 5));
      return n;
    };
    const [a, b] = await Promise.all([
      cache.get('c1', 'k1', make(1)),
      cache.get('c1', 'k1', make(2)),
    ]);
    expect([a, b, made]).toEqual([1, 1, 1]);
    expect(await cache.get('c1', 'k2', make(3))).toBe(3);
    expect(await cache.get('c1', 'k2', make(4))).toBe(3);
    expect(made).toBe(2);
  });

  it('forgets a failure and the oldest owner beyond its size', async () => {
    const cache = new LatestByKey<number>(2);
    await expect(cache.get('c1', 'k', () => Promise.reject(new Error('down')))).rejects.toThrow(
      'down',
    );
    await new Promise((r) => setTimeout(r, 0));
    expect(await cache.get('c1', 'k', async () => 7)).toBe(7);
    await cache.get('c2', 'k', async () => 8);
    await cache.get('c3', 'k', async () => 9);
    expect(await cache.get('c1', 'k', async () => 70)).toBe(70);
  });
});

describe('serialiseRound', () => {
  it('gives JSON bytes, a strong ETag that follows the key (RFC 9110 §8.8.3), and the same bytes gzipped', () => {
    const a = serialiseRound('c|2026-12-02|1|5', JSON.stringify({ items: [1, 2] }));
    expect(JSON.parse(a.json.toString())).toEqual({ items: [1, 2] });
    expect(a.etag).toMatch(/^"[A-Za-z0-9_-]+"$/);
    expect(serialiseRound('c|2026-12-02|1|6', '{}').etag).not.toBe(a.etag);
    expect(gunzipSync(a.gzip()).equals(a.json)).toBe(true);
    expect(a.gzip()).toBe(a.gzip());
  });
});

describe('createRoundJson', () => {
  const zone = 'America/Toronto';
  const date = '2026-12-03';
  const animals = Array.from({ length: 4 }, (_, i) =>
    engineAnimal(i === 1 ? { name: 'Ünïcode “quoted”, Ñame' } : {}),
  );
  const built = buildRound(
    animals.map((animal) => ({ animal, state: projectState([], zone, date) })),
    DEFAULT_RULES,
    date,
  );
  const part: BuiltPart = {
    builtAt: new Date('2026-12-03T05:00:00Z'),
    prepList: built.prepList,
    items: built.items.map((i) => ({
      ...i,
      addedDuringDay: false,
      postMoltHoldDays: postMoltHoldDays(DEFAULT_RULES, i.animal),
    })),
  };
  const ate = (animalId: string, eventId: string): [string, DayOutcome[]] => [
    animalId,
    [{ eventId, kind: 'ate', at: '2026-12-03T15:00:00.000Z', by: 'Robin', voids: null }],
  ];

  it('gives the bytes of JSON.stringify(roundView(…)), and again after a tap changes one item', () => {
    const roundJson = createRoundJson();
    const none = new Map<string, DayOutcome[]>();
    expect(roundJson(zone, date, part, none).toString()).toBe(
      JSON.stringify(roundView(zone, date, part, none)),
    );
    const fed = new Map([ate(animals[1]!.id, 'e1')]);
    const bytes = roundJson(zone, date, part, fed);
    expect(bytes.toString()).toBe(JSON.stringify(roundView(zone, date, part, fed)));
    expect(JSON.parse(bytes.toString()).progress.done).toBeGreaterThan(0);
  });
});
