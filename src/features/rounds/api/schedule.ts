import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { scheduleResponse } from '#shared/schemas/rounds';
import type { CareSettingsBody } from '#shared/schemas/rules';
import { apiRequest } from '@/lib/api-client';
import { queryKeys } from '@/lib/query-keys';

export const getSchedule = (collectionId: string, animalId: string) =>
  apiRequest(`/collections/${collectionId}/animals/${animalId}/schedule`, {
    schema: scheduleResponse,
  });
export const scheduleQueryOptions = (collectionId: string, animalId: string) =>
  queryOptions({
    queryKey: queryKeys.rounds.schedule(collectionId, animalId),
    queryFn: () => getSchedule(collectionId, animalId),
  });
export const useSchedule = (collectionId: string, animalId: string) =>
  useQuery(scheduleQueryOptions(collectionId, animalId));

export const patchCare = (collectionId: string, animalId: string, body: CareSettingsBody) =>
  apiRequest(`/collections/${collectionId}/animals/${animalId}/care`, {
    method: 'PATCH',
    body,
    schema: scheduleResponse,
  });

export function useSaveCare(collectionId: string, animalId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: CareSettingsBody) => patchCare(collectionId, animalId, body),
    onSuccess: (data) => {
      queryClient.setQueryData(queryKeys.rounds.schedule(collectionId, animalId), data);
      void queryClient.invalidateQueries({ queryKey: queryKeys.rounds.all(collectionId) });
    },
  });
}
