import { useQuery, useQueryClient, type QueryClient } from '@tanstack/react-query';
import type { MeResponse } from '#shared/schemas/auth';
import { ApiError, apiRequest } from '@/lib/api-client';
import { cachedMe, storeMe, withDb } from '@/lib/db';
import { queryKeys } from '@/lib/query-keys';

/** Who is signed in, from the server; the answer is kept on the phone for offline starts. */
async function fetchMe(): Promise<MeResponse> {
  try {
    const me = await apiRequest('/auth/me', {
      schema: async () => (await import('#shared/schemas/auth')).meResponse,
    });
    // Kept for the next start; the screen does not wait for the write (P3).
    void withDb((db) => storeMe(db, me)).catch(() => undefined);
    return me;
  } catch (err) {
    if (err instanceof ApiError && err.status === 401)
      await withDb((db) => storeMe(db, null)).catch(() => undefined);
    throw err;
  }
}

/** Keeps the phone's copy of `me` in step with the server after a sign-in or sign-up. */
export const rememberMe = (me: MeResponse) =>
  withDb((db) => storeMe(db, me)).catch(() => undefined);

/**
 * Local first: the phone's copy answers at once (a back room may have a signal that never
 * answers), and the server's answer replaces it in the background. A 401 from the server
 * forgets the copy and asks again, which sends the person to sign in. Both are asked at once:
 * a first visit has no copy, and opening the phone's database for the first time can take
 * longer than the server's answer (P3), so a server answer that comes first is taken.
 */
async function loadMe(queryClient: QueryClient): Promise<MeResponse> {
  const fresh = fetchMe();
  const first = await Promise.race([
    withDb(cachedMe).then(
      (me) => ({ server: false, me }),
      () => ({ server: false, me: undefined }),
    ),
    // A failed answer waits for the phone's copy: offline, it is all there is.
    fresh.then(
      (me) => ({ server: true, me }),
      () => new Promise<never>(() => undefined),
    ),
  ]);
  if (first.server || !first.me) return fresh;
  fresh.then(
    (me) => queryClient.setQueryData(queryKeys.auth.me(), me),
    (err) => {
      if (err instanceof ApiError && err.status === 401)
        void queryClient.resetQueries({ queryKey: queryKeys.auth.me() });
    },
  );
  return first.me;
}

export function useMe() {
  const queryClient = useQueryClient();
  return useQuery({
    queryKey: queryKeys.auth.me(),
    queryFn: () => loadMe(queryClient),
    staleTime: 60_000,
    networkMode: 'always',
  });
}
