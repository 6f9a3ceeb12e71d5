import { afterEach, describe, expect, it, vi } from 'vitest';
import { z } from 'zod';
import { apiRequest } from './api-client';
import {
  forgetEarlyAnswers,
  hasEarlyAnswer,
  takeEarlyAnswer,
  type EarlyRequests,
} from './early-requests';

const thing = z.object({ id: z.string() });
const json = (body: unknown, status = 200) =>
  new Response(JSON.stringify(body), { status, headers: { 'Content-Type': 'application/json' } });

/** The page's early requests as src/first-visit.ts leaves them, started `ago` ms before now. */
function earlyAnswers(answers: Record<string, Promise<Response>>, ago = 0): EarlyRequests {
  const early = { startedAt: performance.now() - ago, answers };
  vi.stubGlobal('window', { __racksideEarly: early });
  return early;
}

const serverSays = (body: unknown) =>
  vi.stubGlobal(
    'fetch',
    vi.fn(async () => json(body)),
  );

afterEach(() => vi.unstubAllGlobals());

describe('answers the page asked for early', () => {
  it('are taken by the first GET of the same path, once, without asking the server again', async () => {
    earlyAnswers({ '/things/a': Promise.resolve(json({ id: 'early' })) });
    serverSays({ id: 'server' });
    expect(await apiRequest('/things/a', { schema: thing })).toEqual({ id: 'early' });
    expect(fetch).not.toHaveBeenCalled();
    // Its body is read: the next call asks the server.
    expect(await apiRequest('/things/a', { schema: thing })).toEqual({ id: 'server' });
    expect(fetch).toHaveBeenCalledTimes(1);
  });

  it('carry the server’s failure like any answer (a 401 still sends the person to sign in)', async () => {
    earlyAnswers({
      '/auth/me': Promise.resolve(
        json({ error: { code: 'unauthenticated', message: 'Sign in first.' } }, 401),
      ),
    });
    serverSays({ id: 'server' });
    await expect(apiRequest('/auth/me', { schema: thing })).rejects.toMatchObject({
      status: 401,
      message: 'Sign in first.',
    });
  });

  it('give way to a request of its own when the early one got no answer', async () => {
    earlyAnswers({ '/things/a': Promise.reject(new TypeError('Failed to fetch')) });
    serverSays({ id: 'server' });
    expect(await apiRequest('/things/a', { schema: thing })).toEqual({ id: 'server' });
    expect(fetch).toHaveBeenCalledTimes(1);
  });

  it('are left alone by other paths, by writes and by conditional requests', async () => {
    const early = earlyAnswers({ '/things/a': Promise.resolve(json({ id: 'early' })) });
    serverSays({ id: 'server' });
    expect(await apiRequest('/things/b', { schema: thing })).toEqual({ id: 'server' });
    expect(await apiRequest('/things/a', { method: 'PUT', body: {}, schema: thing })).toEqual({
      id: 'server',
    });
    expect(await apiRequest('/things/a', { ifNoneMatch: '"v1"', schema: thing })).toEqual({
      id: 'server',
    });
    expect(Object.keys(early.answers)).toEqual(['/things/a']);
    expect(hasEarlyAnswer((p) => p.startsWith('/things/'))).toBe(true);
    expect(hasEarlyAnswer((p) => p.endsWith('/rounds/today'))).toBe(false);
  });

  it('are not served once the page has been open a while (no old round later on)', async () => {
    earlyAnswers({ '/things/a': Promise.resolve(json({ id: 'early' })) }, 60_000);
    serverSays({ id: 'server' });
    expect(takeEarlyAnswer('/things/a')).toBeUndefined();
    expect(await apiRequest('/things/a', { schema: thing })).toEqual({ id: 'server' });
  });

  it('are dropped once taps reach the server (an answer from before them is out of date)', async () => {
    earlyAnswers({ '/collections/c/rounds/today': Promise.resolve(json({ id: 'before taps' })) });
    serverSays({ id: 'after taps' });
    forgetEarlyAnswers();
    expect(hasEarlyAnswer(() => true)).toBe(false);
    expect(await apiRequest('/collections/c/rounds/today', { schema: thing })).toEqual({
      id: 'after taps',
    });
  });

  it('are nothing at all where the page asked for nothing', () => {
    expect(takeEarlyAnswer('/auth/me')).toBeUndefined();
    expect(hasEarlyAnswer(() => true)).toBe(false);
  });
});
