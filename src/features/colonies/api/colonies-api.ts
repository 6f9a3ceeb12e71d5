import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { ColonyCareKind } from '#shared/domain/colonies/care';
import type { ColonyInput, CountUpdateBody } from '#shared/schemas/colonies';
import { ApiError, apiRequest } from '@/lib/api-client';
import { withDb } from '@/lib/db';
import { queryKeys } from '@/lib/query-keys';
import { useChoreRecorder } from '@/lib/use-chores';

const schemas = () => import('#shared/schemas/colonies');

/**
 * A collection's colonies, kept on the phone as last fetched: the prep list's draw and the
 * Colonies section on Today work with no signal.
 */
export const useColonies = (collectionId: string, { enabled = true } = {}) =>
  useQuery({
    queryKey: queryKeys.colonies.list(collectionId),
    enabled,
    networkMode: 'always',
    queryFn: async () => {
      try {
        const response = await apiRequest(`/collections/${collectionId}/colonies`, {
          schema: async () => (await schemas()).coloniesResponse,
        });
        await withDb((db) =>
          db.put('colonies', { collectionId, response, fetchedAt: new Date().toISOString() }),
        );
        return response;
      } catch (err) {
        // Only with no answer at all: a refusal (403, 404) must not show a stale copy.
        if (!(err instanceof ApiError && err.status === 0)) throw err;
        const held = await withDb((db) => db.get('colonies', collectionId));
        if (held) return held.response;
        throw err;
      }
    },
  });

export const useStockHistory = (collectionId: string, colonyId: string) =>
  useQuery({
    queryKey: queryKeys.colonies.history(collectionId, colonyId),
    queryFn: () =>
      apiRequest(`/collections/${collectionId}/colonies/${colonyId}/history`, {
        schema: async () => (await schemas()).stockHistoryResponse,
      }),
  });

export function useColonyChanges(collectionId: string) {
  const queryClient = useQueryClient();
  const base = `/collections/${collectionId}/colonies`;
  const refresh = () => queryClient.invalidateQueries({ queryKey: ['colonies', collectionId] });
  const view = async () => (await schemas()).colonyView;
  return {
    create: useMutation({
      mutationFn: (body: ColonyInput) => apiRequest(base, { method: 'POST', body, schema: view }),
      onSuccess: refresh,
    }),
    update: useMutation({
      mutationFn: ({ colonyId, body }: { colonyId: string; body: ColonyInput }) =>
        apiRequest(`${base}/${colonyId}`, { method: 'PUT', body, schema: view }),
      onSuccess: refresh,
    }),
    remove: useMutation({
      mutationFn: async (colonyId: string) =>
        apiRequest(`${base}/${colonyId}`, {
          method: 'DELETE',
          schema: async () => (await import('#shared/schemas/common')).noContent,
        }),
      onSuccess: refresh,
    }),
    count: useMutation({
      mutationFn: ({ colonyId, body }: { colonyId: string; body: CountUpdateBody }) =>
        apiRequest(`${base}/${colonyId}/counts`, { method: 'POST', body, schema: view }),
      onSuccess: refresh,
    }),
  };
}

/** One tap of colony care, through the chores outbox. */
export function useRecordColonyChore(userId: string, collectionId: string, localDate: string) {
  const { record, discard } = useChoreRecorder(userId, collectionId, localDate);
  return {
    record: (colonyId: string, kind: ColonyCareKind) => record('colony', colonyId, kind),
    discard,
  };
}
