import { queryOptions, useQuery } from '@tanstack/react-query';
import { roundResponse } from '#shared/schemas/rounds';
import { apiRequest } from '@/lib/api-client';
import { roundKeys } from './keys';

export const getTodayRound = (collectionId: string) => apiRequest(`/collections/${collectionId}/rounds/today`, { schema: roundResponse });
export const todayRoundQueryOptions = (collectionId: string) =>
  queryOptions({ queryKey: roundKeys.today(collectionId), queryFn: () => getTodayRound(collectionId) });
export const useTodayRound = (collectionId: string) => useQuery(todayRoundQueryOptions(collectionId));
