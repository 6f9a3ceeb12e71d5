import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { RulesOverride } from '#shared/domain/rounds/rules';
import { rulesResponse } from '#shared/schemas/rules';
import { apiRequest } from '@/lib/api-client';
import { queryKeys } from '@/lib/query-keys';

export type { RulesResponse } from '#shared/schemas/rules';

export const getRules = (collectionId: string) =>
  apiRequest(`/collections/${collectionId}/rules`, { schema: rulesResponse });
export const rulesQueryOptions = (collectionId: string) =>
  queryOptions({
    queryKey: queryKeys.rounds.rules(collectionId),
    queryFn: () => getRules(collectionId),
  });
export const useRules = (collectionId: string) => useQuery(rulesQueryOptions(collectionId));

export const putRules = (collectionId: string, overrides: RulesOverride) =>
  apiRequest(`/collections/${collectionId}/rules`, {
    method: 'PUT',
    body: overrides,
    schema: rulesResponse,
  });

export function useSaveRules(collectionId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (overrides: RulesOverride) => putRules(collectionId, overrides),
    onSuccess: (data) => {
      queryClient.setQueryData(queryKeys.rounds.rules(collectionId), data);
      void queryClient.invalidateQueries({ queryKey: queryKeys.rounds.all(collectionId) });
    },
  });
}
