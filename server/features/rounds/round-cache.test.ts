import { gunzipSync } from 'node:zlib';
import { describe, expect, it } from 'vitest';
import { LatestByKey, serialiseRound } from './round-cache';

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
