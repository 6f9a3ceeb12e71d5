import { queryOptions, useQuery } from '@tanstack/react-query';
import { roundResponse } from '#shared/schemas/rounds';
import { apiRequest } from '@/lib/api-client';
import { roundKeys } from './keys';

export const getTomorrowRound = (collectionId: string) => apiRequest(`/collections/${collectionId}/rounds/tomorrow`, { schema: roundResponse });
export const tomorrowRoundQueryOptions = (collectionId: string) =>
  queryOptions({ queryKey: roundKeys.tomorrow(collectionId), queryFn: () => getTomorrowRound(collectionId) });
export const useTomorrowRound = (collectionId: string) => useQuery(tomorrowRoundQueryOptions(collectionId));
