import { queryOptions, useQuery, useQueryClient } from '@tanstack/react-query';
import { apiRequest } from '@/lib/api-client';
import { withDb, type RoundDay } from '@/lib/db';
import { queryKeys } from '@/lib/query-keys';
import { cachedRound, storeServerRound } from '@/lib/round-cache';

const REFRESH_EVERY_MS = 5 * 60_000;

/** The server's copy, checked against the shared schema (loaded here, not with the first screen). */
export async function getRound(collectionId: string, day: RoundDay) {
  const { roundResponse } = await import('#shared/schemas/rounds');
  return apiRequest(`/collections/${collectionId}/rounds/${day}`, { schema: roundResponse });
}

/** The phone's copy of a round: read from IndexedDB, so it opens with no signal at all. */
export const localRoundQueryOptions = (userId: string, collectionId: string, day: RoundDay) =>
  queryOptions({
    queryKey: queryKeys.rounds.local(collectionId, day, userId),
    queryFn: async () => (await withDb((db) => cachedRound(db, userId, collectionId, day))) ?? null,
    staleTime: Infinity,
    networkMode: 'always',
    // A tap replaces one item; deep-comparing the whole round on every tap would cost more
    // than the tap itself (P1).
    structuralSharing: false,
  });

/**
 * A round, local first: the screen shows the phone's copy at once and a fetch of the server's
 * copy refreshes it in the background (with this person's unsent taps kept on top).
 */
export function useRound(userId: string, collectionId: string, day: RoundDay) {
  const queryClient = useQueryClient();
  const local = useQuery(localRoundQueryOptions(userId, collectionId, day));
  const server = useQuery({
    queryKey: queryKeys.rounds.server(collectionId, day),
    queryFn: async () => {
      const round = await getRound(collectionId, day);
      const cached = await withDb((db) =>
        storeServerRound(db, userId, collectionId, day, round, new Date()),
      );
      queryClient.setQueryData(queryKeys.rounds.local(collectionId, day, userId), cached);
      return cached.fetchedAt;
    },
    networkMode: 'always',
    retry: false,
    refetchInterval: REFRESH_EVERY_MS,
  });
  return { local, server };
}
