import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { RoundRules, RulesOverride } from '#shared/domain/rounds/rules';
import { apiRequest } from '@/lib/api-client';
import { roundKeys } from './keys';

export interface RulesResponse {
  rules: RoundRules;
  defaults: RoundRules;
  overrides: RulesOverride;
}

export const getRules = (collectionId: string) => apiRequest<RulesResponse>(`/collections/${collectionId}/rules`);
export const rulesQueryOptions = (collectionId: string) => queryOptions({ queryKey: roundKeys.rules(collectionId), queryFn: () => getRules(collectionId) });
export const useRules = (collectionId: string) => useQuery(rulesQueryOptions(collectionId));

export const putRules = (collectionId: string, overrides: RulesOverride) =>
  apiRequest<RulesResponse>(`/collections/${collectionId}/rules`, { method: 'PUT', body: overrides });

export function useSaveRules(collectionId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (overrides: RulesOverride) => putRules(collectionId, overrides),
    onSuccess: (data) => {
      queryClient.setQueryData(roundKeys.rules(collectionId), data);
      void queryClient.invalidateQueries({ queryKey: roundKeys.all(collectionId) });
    },
  });
}
