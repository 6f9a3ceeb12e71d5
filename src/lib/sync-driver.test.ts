import { afterEach, describe, expect, it, vi } from 'vitest';
import { fetchTransport } from './sync-driver';

const batch = { deviceId: 'device-1', clientSentAt: '2026-12-01T14:00:00.000Z', events: [] };

afterEach(() => vi.unstubAllGlobals());

describe('the sync transport', () => {
  it('hands the engine every status with its body, so only per-event verdicts settle taps', async () => {
    for (const [status, body] of [
      [200, { results: [] }],
      [401, { error: { code: 'signed_out', message: 'Sign in again.' } }],
      [503, null],
    ] as const) {
      vi.stubGlobal(
        'fetch',
        vi.fn(
          async () =>
            new Response(body === null ? 'Service unavailable' : JSON.stringify(body), { status }),
        ),
      );
      expect(await fetchTransport('collection-1', batch)).toEqual({ status, body });
    }
    const [url, init] = vi.mocked(fetch).mock.calls[0]!;
    expect([url, init?.method, init?.body]).toEqual([
      '/api/collections/collection-1/events',
      'POST',
      JSON.stringify(batch),
    ]);
  });

  it('throws when no answer came (the engine keeps the batch)', async () => {
    vi.stubGlobal(
      'fetch',
      vi.fn(async () => Promise.reject(new TypeError('Failed to fetch'))),
    );
    await expect(fetchTransport('collection-1', batch)).rejects.toThrow();
  });
});
