import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { AnimalSummary, AnimalValues, MoveBody, RetireBody } from '#shared/schemas/animals';
import type { LocationInput, LocationWithCount } from '#shared/schemas/locations';
import { apiRequest } from '@/lib/api-client';
import { uploadPhoto } from '@/lib/upload-photo';
import { animalKeys } from './list-animals';

const locationKeys = { list: (collectionId: string) => ['locations', collectionId] as const };

/** After any change to the records, the lists (and the rounds built from them) are read again. */
function useRefresh(collectionId: string) {
  const queryClient = useQueryClient();
  return () =>
    Promise.all([
      queryClient.invalidateQueries({ queryKey: animalKeys.all(collectionId) }),
      queryClient.invalidateQueries({ queryKey: locationKeys.list(collectionId) }),
      queryClient.invalidateQueries({ queryKey: ['rounds', collectionId] }),
    ]);
}

export function useSaveAnimal(collectionId: string, animalId?: string) {
  const refresh = useRefresh(collectionId);
  return useMutation({
    mutationFn: (values: AnimalValues) =>
      apiRequest<AnimalSummary>(animalId ? `/collections/${collectionId}/animals/${animalId}` : `/collections/${collectionId}/animals`, {
        method: animalId ? 'PUT' : 'POST',
        body: values,
      }),
    onSuccess: refresh,
  });
}

export function useRetireAnimal(collectionId: string, animalId: string) {
  const refresh = useRefresh(collectionId);
  return useMutation({
    mutationFn: (body: RetireBody | null) =>
      apiRequest<AnimalSummary>(`/collections/${collectionId}/animals/${animalId}/${body ? 'retire' : 'reinstate'}`, { method: 'POST', body: body ?? {} }),
    onSuccess: refresh,
  });
}

/** Several animals retired alike (one request each: the history gets one fact per animal). */
export function useRetireAllAnimals(collectionId: string) {
  const refresh = useRefresh(collectionId);
  return useMutation({
    mutationFn: async ({ animalIds, body }: { animalIds: string[]; body: RetireBody }) => {
      for (const id of animalIds) await apiRequest(`/collections/${collectionId}/animals/${id}/retire`, { method: 'POST', body });
    },
    onSuccess: refresh,
  });
}

export function useMoveAnimals(collectionId: string) {
  const refresh = useRefresh(collectionId);
  return useMutation({
    mutationFn: (body: MoveBody) => apiRequest<{ moved: number }>(`/collections/${collectionId}/animals/move`, { method: 'POST', body }),
    onSuccess: refresh,
  });
}

export function useImportAnimals(collectionId: string) {
  const refresh = useRefresh(collectionId);
  return useMutation({
    mutationFn: (rows: unknown[]) => apiRequest<{ imported: number }>(`/collections/${collectionId}/animals/import`, { method: 'POST', body: { rows } }),
    onSuccess: refresh,
  });
}

export function useUploadPhoto(collectionId: string, animalId: string) {
  const refresh = useRefresh(collectionId);
  return useMutation({ mutationFn: (file: File) => uploadPhoto(`/collections/${collectionId}/animals/${animalId}/photo`, file), onSuccess: refresh });
}

export function useLocations(collectionId: string) {
  return useQuery({
    queryKey: locationKeys.list(collectionId),
    queryFn: () => apiRequest<{ locations: LocationWithCount[] }>(`/collections/${collectionId}/locations`),
  });
}

export function useLocationChanges(collectionId: string) {
  const refresh = useRefresh(collectionId);
  const base = `/collections/${collectionId}/locations`;
  return {
    create: useMutation({ mutationFn: (body: LocationInput) => apiRequest(base, { method: 'POST', body }), onSuccess: refresh }),
    reorder: useMutation({ mutationFn: (locationIds: string[]) => apiRequest(`${base}/order`, { method: 'PUT', body: { locationIds } }), onSuccess: refresh }),
    remove: useMutation({ mutationFn: (locationId: string) => apiRequest(`${base}/${locationId}`, { method: 'DELETE' }), onSuccess: refresh }),
  };
}
