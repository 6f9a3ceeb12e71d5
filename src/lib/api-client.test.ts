import { afterEach, describe, expect, it, vi } from 'vitest';
import { z } from 'zod';
import { noContent } from '#shared/schemas/common';
import { ApiError, apiRaw, apiRequest } from './api-client';

const answer = (status: number, body?: unknown, type = 'application/json') =>
  vi.stubGlobal(
    'fetch',
    vi.fn(
      async () =>
        new Response(
          body === undefined ? null : typeof body === 'string' ? body : JSON.stringify(body),
          { status, headers: { 'Content-Type': type } },
        ),
    ),
  );
const thing = z.object({ id: z.string() });
const failure = (work: Promise<unknown>) =>
  work.then(
    () => expect.fail('expected a failure'),
    (err: unknown) => err as ApiError,
  );

afterEach(() => vi.unstubAllGlobals());

describe('JSON mode', () => {
  it('returns the answer as its schema reads it, with our CSRF header on the request', async () => {
    answer(200, { id: 'a', extra: 1 });
    expect(await apiRequest('/things/a', { schema: thing })).toEqual({ id: 'a' });
    const [url, init] = vi.mocked(fetch).mock.calls[0]!;
    expect(url).toBe('/api/things/a');
    expect(init?.headers).toMatchObject({ 'X-Rackside-Client': '1', Accept: 'application/json' });
  });

  it('loads a schema given as a loader only once an answer has come (P2: none with no signal)', async () => {
    const load = vi.fn(async () => thing);
    vi.stubGlobal(
      'fetch',
      vi.fn(async () => Promise.reject(new TypeError('Failed to fetch'))),
    );
    expect(await failure(apiRequest('/things/a', { schema: load }))).toMatchObject({ status: 0 });
    answer(500, { error: { code: 'broken', message: 'Down for a moment.' } });
    expect(await failure(apiRequest('/things/a', { schema: load }))).toMatchObject({
      status: 500,
      code: 'broken',
    });
    expect(load).not.toHaveBeenCalled();
    answer(200, { id: 'b' });
    expect(await apiRequest('/things/a', { schema: load })).toEqual({ id: 'b' });
    expect(load).toHaveBeenCalledOnce();
  });

  it('reads a 204 as undefined and refuses a body where none was expected', async () => {
    answer(204);
    expect(await apiRequest('/things/a', { method: 'DELETE', schema: noContent })).toBeUndefined();
    answer(200, { id: 'a' });
    expect(
      (await failure(apiRequest('/things/a', { method: 'DELETE', schema: noContent }))).code,
    ).toBe('bad_response');
  });

  it('turns an answer that does not match its schema into a readable error, not a crash', async () => {
    answer(200, { id: 7 });
    const err = await failure(apiRequest('/things/a', { schema: thing }));
    expect(err).toBeInstanceOf(ApiError);
    expect(err).toMatchObject({ status: 200, code: 'bad_response', issues: undefined });
    expect(err.message).toMatch(/could not read/);
    answer(200, '<html>a proxy’s page</html>', 'text/html');
    expect((await failure(apiRequest('/things/a', { schema: thing }))).code).toBe('bad_response');
  });

  it('gives the server’s own words and field issues for a failure, and a sentence for any other', async () => {
    answer(422, {
      error: {
        code: 'invalid',
        message: 'Name the room.',
        issues: [{ path: 'body.room', message: 'Name the room.' }],
      },
    });
    expect(
      await failure(apiRequest('/things', { method: 'POST', body: {}, schema: thing })),
    ).toMatchObject({
      status: 422,
      code: 'invalid',
      message: 'Name the room.',
      issues: [{ path: 'body.room', message: 'Name the room.' }],
    });
    answer(502, '<html>Bad gateway</html>', 'text/html');
    expect(await failure(apiRequest('/things', { schema: thing }))).toMatchObject({
      status: 502,
      code: 'http_502',
      message: 'Rackside answered with an error (502). Try again.',
    });
  });

  it('says so when no answer came', async () => {
    vi.stubGlobal(
      'fetch',
      vi.fn(async () => Promise.reject(new TypeError('Failed to fetch'))),
    );
    expect(await failure(apiRequest('/things', { schema: thing }))).toMatchObject({
      status: 0,
      code: 'offline',
    });
  });

  it('sends JSON as JSON, and a file or a form as it is', async () => {
    answer(204);
    await apiRequest('/a', { method: 'POST', body: { x: 1 }, schema: noContent });
    const file = new Blob(['{}'], { type: 'application/json' });
    await apiRequest('/b', { method: 'POST', body: file, schema: noContent });
    const form = new FormData();
    await apiRequest('/c', { method: 'PUT', body: form, schema: noContent });
    const [a, b, c] = vi.mocked(fetch).mock.calls.map(([, init]) => init!) as [
      RequestInit,
      RequestInit,
      RequestInit,
    ];
    expect([a.body, a.headers]).toEqual([
      '{"x":1}',
      expect.objectContaining({ 'Content-Type': 'application/json' }),
    ]);
    expect(b.body).toBe(file);
    expect(c.body).toBe(form);
    // The browser writes the multipart boundary itself.
    expect(c.headers).not.toHaveProperty('Content-Type');
  });
});

describe('raw mode', () => {
  it('hands back every status untouched, for callers that judge it themselves', async () => {
    answer(403, { error: { code: 'forbidden', message: 'No.' } });
    const res = await apiRaw('/collections/c/events', { method: 'POST', body: { events: [] } });
    expect(res.status).toBe(403);
    expect(await res.json()).toEqual({ error: { code: 'forbidden', message: 'No.' } });
  });

  it('answers offline at once, without a fetch, when the browser knows it has no network', async () => {
    answer(200, { id: 'a' });
    vi.stubGlobal('navigator', { onLine: false });
    expect(await failure(apiRaw('/x'))).toMatchObject({ status: 0, code: 'offline' });
    expect(fetch).not.toHaveBeenCalled();
    // Online as far as the browser knows (it may still be wrong): the request is made.
    vi.stubGlobal('navigator', { onLine: true });
    expect((await apiRaw('/x')).status).toBe(200);
    expect(fetch).toHaveBeenCalledOnce();
  });

  it('throws when no answer came, and lets the caller’s own timeout through as it is', async () => {
    vi.stubGlobal(
      'fetch',
      vi.fn(async () => Promise.reject(new TypeError('Failed to fetch'))),
    );
    expect(await failure(apiRaw('/x'))).toMatchObject({ status: 0, code: 'offline' });
    const timeout = AbortSignal.abort(new DOMException('Timed out', 'TimeoutError'));
    vi.stubGlobal(
      'fetch',
      vi.fn(async () => Promise.reject(timeout.reason)),
    );
    expect(await failure(apiRaw('/x', { signal: timeout }))).toMatchObject({
      name: 'TimeoutError',
    });
  });
});
