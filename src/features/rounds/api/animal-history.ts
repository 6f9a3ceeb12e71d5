import { queryOptions, useQuery } from '@tanstack/react-query';
import { historyResponse } from '#shared/schemas/events';
import { apiRequest } from '@/lib/api-client';
import { queryKeys } from '@/lib/query-keys';

export const getAnimalHistory = (collectionId: string, animalId: string) =>
  apiRequest(
    `/collections/${collectionId}/events?animalId=${encodeURIComponent(animalId)}&limit=2000`,
    { schema: historyResponse },
  );
export const animalHistoryQueryOptions = (collectionId: string, animalId: string) =>
  queryOptions({
    queryKey: queryKeys.rounds.history(collectionId, animalId),
    queryFn: () => getAnimalHistory(collectionId, animalId),
  });
export const useAnimalHistory = (collectionId: string, animalId: string) =>
  useQuery(animalHistoryQueryOptions(collectionId, animalId));
