import { queryOptions, useQuery } from '@tanstack/react-query';
import { meResponse, type MeResponse } from '#shared/schemas/auth';
import { ApiError, apiRequest } from '@/lib/api-client';
import { cachedMe, storeMe, withDb } from '@/lib/db';
import { authKeys } from './keys';

/**
 * Who is signed in. The last answer is kept on the phone so the app still opens with no
 * signal; a real "signed out" (401) forgets it.
 */
export async function getMe(): Promise<MeResponse> {
  try {
    const me = await apiRequest('/auth/me', { schema: meResponse });
    await withDb((db) => storeMe(db, me)).catch(() => undefined);
    return me;
  } catch (err) {
    if (err instanceof ApiError && err.status === 0) {
      const known = await withDb(cachedMe).catch(() => undefined);
      if (known) return known;
    }
    if (err instanceof ApiError && err.status === 401) await withDb((db) => storeMe(db, null)).catch(() => undefined);
    throw err;
  }
}
export const meQueryOptions = () => queryOptions({ queryKey: authKeys.me(), queryFn: getMe, staleTime: 60_000, networkMode: 'always' });
export const useMe = () => useQuery(meQueryOptions());
