import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { EggSacBody, EggSacChange, EggSacView, SlingsBody } from '#shared/schemas/breeding';
import { apiRequest } from '@/lib/api-client';

const sacsKey = (collectionId: string) => ['breeding', collectionId, 'sacs'] as const;

export const useEggSacs = (collectionId: string) => useQuery({ queryKey: sacsKey(collectionId), queryFn: () => apiRequest<{ sacs: EggSacView[] }>(`/collections/${collectionId}/egg-sacs`) });

export function useBreedingChanges(collectionId: string) {
  const queryClient = useQueryClient();
  const refresh = () =>
    Promise.all([
      queryClient.invalidateQueries({ queryKey: sacsKey(collectionId) }),
      queryClient.invalidateQueries({ queryKey: ['animals', collectionId] }),
      queryClient.invalidateQueries({ queryKey: ['rounds', collectionId] }),
    ]);
  const base = `/collections/${collectionId}`;
  return {
    create: useMutation({ mutationFn: (body: EggSacBody) => apiRequest<EggSacView>(`${base}/egg-sacs`, { method: 'POST', body }), onSuccess: refresh }),
    change: useMutation({ mutationFn: ({ sacId, body }: { sacId: string; body: EggSacChange }) => apiRequest(`${base}/egg-sacs/${sacId}`, { method: 'PATCH', body }), onSuccess: refresh }),
    slings: useMutation({ mutationFn: ({ sacId, body }: { sacId: string; body: SlingsBody }) => apiRequest<{ animalIds: string[] }>(`${base}/egg-sacs/${sacId}/slings`, { method: 'POST', body }), onSuccess: refresh }),
    incubation: useMutation({ mutationFn: (body: { minDays: number; maxDays: number }) => apiRequest(`${base}/incubation`, { method: 'PUT', body }), onSuccess: refresh }),
  };
}
