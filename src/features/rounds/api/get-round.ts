import { queryOptions, useQuery, useQueryClient } from '@tanstack/react-query';
import { useCallback, useEffect } from 'react';
import { localDateOf } from '#shared/domain/local-dates';
import { apiRaw, apiRequest, failureOf } from '@/lib/api-client';
import { currentRound, storedEngineInput, storeEngineInput } from '@/lib/day-on-phone';
import { withDb, type RoundDay } from '@/lib/db';
import { queryKeys } from '@/lib/query-keys';
import { storeServerRound } from '@/lib/round-cache';
import { timesSaved } from '@/lib/sync-driver';

const REFRESH_EVERY_MS = 5 * 60_000;

/**
 * The server's copy, checked against the shared schema (loaded once the answer has come, not
 * with the first screen, and not at all with no signal).
 */
export function getRound(collectionId: string, day: RoundDay, signal?: AbortSignal) {
  return apiRequest(`/collections/${collectionId}/rounds/${day}`, {
    schema: async () => (await import('#shared/schemas/rounds')).roundResponse,
    signal,
  });
}

/**
 * Keeps the engine's input current (keepers only): answered 304 while the collection has not
 * changed, so a refresh costs a header. A failure leaves the stored copy as it is.
 */
async function refreshEngineInput(userId: string, collectionId: string) {
  const held = await withDb((db) => storedEngineInput(db, userId, collectionId));
  const res = await apiRaw(`/collections/${collectionId}/rounds/engine-input`, {
    ifNoneMatch: held?.etag ?? undefined,
  });
  if (res.status === 304) return;
  if (!res.ok) throw await failureOf(res);
  const { engineInputResponse } = await import('#shared/schemas/rounds');
  const input = engineInputResponse.parse(await res.json());
  await withDb((db) => storeEngineInput(db, userId, input, res.headers.get('ETag'), new Date()));
}

/**
 * The phone's copy of a round: read from IndexedDB, so it opens with no signal at all; on a
 * new local day with no signal, built here (day-on-phone.ts).
 */
export const localRoundQueryOptions = (userId: string, collectionId: string, day: RoundDay) =>
  queryOptions({
    queryKey: queryKeys.rounds.local(collectionId, day, userId),
    queryFn: async () =>
      (await withDb((db) => currentRound(db, userId, collectionId, day, new Date()))) ?? null,
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
export function useRound(
  userId: string,
  collectionId: string,
  day: RoundDay,
  { buildsOffline = false }: { buildsOffline?: boolean } = {},
) {
  const queryClient = useQueryClient();
  const local = useQuery(localRoundQueryOptions(userId, collectionId, day));
  const server = useQuery({
    queryKey: queryKeys.rounds.server(collectionId, day),
    queryFn: async ({ signal }) => {
      for (let attempt = 1; ; attempt++) {
        const saved = timesSaved();
        const round = await getRound(collectionId, day, signal);
        // A fetch overtaken by a newer one must not store its older copy over the newer one.
        signal.throwIfAborted();
        const cached = await withDb((db) =>
          storeServerRound(db, userId, collectionId, day, round, new Date(), (merged) =>
            queryClient.setQueryData(queryKeys.rounds.local(collectionId, day, userId), merged),
          ),
        );
        // With every sync (saved taps refresh the rounds), so the phone can build tomorrow.
        if (buildsOffline) await refreshEngineInput(userId, collectionId).catch(() => undefined);
        // Taps saved while this fetch was under way may have changed the round, and the refresh
        // they asked for joined this fetch: fetch once more (a few times at most).
        if (timesSaved() === saved || attempt === 3) return cached.fetchedAt;
      }
    },
    networkMode: 'always',
    retry: false,
    refetchInterval: REFRESH_EVERY_MS,
  });
  const onDayTurn = useCallback(() => {
    void queryClient.invalidateQueries({
      queryKey: queryKeys.rounds.local(collectionId, day, userId),
    });
    void queryClient.invalidateQueries({ queryKey: queryKeys.rounds.server(collectionId, day) });
  }, [queryClient, collectionId, day, userId]);
  useDayTurn(local.data?.round.timeZone, onDayTurn);
  return { local, server };
}

const DAY_CHECK_MS = 30_000;

/** Calls `onTurn` when the local date in `zone` changes while the screen is open (midnight). */
function useDayTurn(zone: string | undefined, onTurn: () => void) {
  useEffect(() => {
    if (!zone) return;
    let date = localDateOf(new Date(), zone);
    const check = () => {
      const now = localDateOf(new Date(), zone);
      if (now === date) return;
      date = now;
      onTurn();
    };
    const timer = setInterval(check, DAY_CHECK_MS);
    document.addEventListener('visibilitychange', check);
    return () => {
      clearInterval(timer);
      document.removeEventListener('visibilitychange', check);
    };
  }, [zone, onTurn]);
}
