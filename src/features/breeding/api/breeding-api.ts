import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import {
  eggSacListResponse,
  eggSacView,
  slingsCreatedResponse,
  type EggSacBody,
  type EggSacChange,
  type SlingsBody,
} from '#shared/schemas/breeding';
import { noContent } from '#shared/schemas/common';
import { apiRequest } from '@/lib/api-client';
import { queryKeys } from '@/lib/query-keys';

export const useEggSacs = (collectionId: string) =>
  useQuery({
    queryKey: queryKeys.breeding.sacs(collectionId),
    queryFn: () =>
      apiRequest(`/collections/${collectionId}/egg-sacs`, { schema: eggSacListResponse }),
  });

export function useBreedingChanges(collectionId: string) {
  const queryClient = useQueryClient();
  const refresh = () =>
    Promise.all([
      queryClient.invalidateQueries({ queryKey: queryKeys.breeding.sacs(collectionId) }),
      queryClient.invalidateQueries({ queryKey: queryKeys.animals.all(collectionId) }),
      queryClient.invalidateQueries({ queryKey: queryKeys.rounds.all(collectionId) }),
      // A pot-up finds or creates its spots.
      queryClient.invalidateQueries({ queryKey: queryKeys.locations.list(collectionId) }),
    ]);
  const base = `/collections/${collectionId}`;
  return {
    create: useMutation({
      mutationFn: (body: EggSacBody) =>
        apiRequest(`${base}/egg-sacs`, { method: 'POST', body, schema: eggSacView }),
      onSuccess: refresh,
    }),
    change: useMutation({
      mutationFn: ({ sacId, body }: { sacId: string; body: EggSacChange }) =>
        apiRequest(`${base}/egg-sacs/${sacId}`, {
          method: 'PATCH',
          body,
          schema: eggSacListResponse,
        }),
      onSuccess: refresh,
    }),
    slings: useMutation({
      mutationFn: ({ sacId, body }: { sacId: string; body: SlingsBody }) =>
        apiRequest(`${base}/egg-sacs/${sacId}/slings`, {
          method: 'POST',
          body,
          schema: slingsCreatedResponse,
        }),
      onSuccess: refresh,
    }),
    incubation: useMutation({
      mutationFn: (body: { minDays: number; maxDays: number }) =>
        apiRequest(`${base}/incubation`, { method: 'PUT', body, schema: noContent }),
      onSuccess: refresh,
    }),
  };
}
