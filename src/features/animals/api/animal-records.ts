import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import {
  animalSummary,
  moveResponse,
  photoSavedResponse,
  type AnimalValues,
  type MoveBody,
  type RetireBody,
} from '#shared/schemas/animals';
import { noContent } from '#shared/schemas/common';
import { importResponse } from '#shared/schemas/import';
import {
  locationListResponse,
  locationResponse,
  type LocationInput,
  type RenameGroupBody,
} from '#shared/schemas/locations';
import { apiRequest } from '@/lib/api-client';
import { queryKeys } from '@/lib/query-keys';
import { uploadPhoto } from '@/lib/upload-photo';

/** After any change to the records, the lists (and the rounds built from them) are read again. */
function useRefresh(collectionId: string) {
  const queryClient = useQueryClient();
  return () =>
    Promise.all([
      queryClient.invalidateQueries({ queryKey: queryKeys.animals.all(collectionId) }),
      queryClient.invalidateQueries({ queryKey: queryKeys.locations.list(collectionId) }),
      queryClient.invalidateQueries({ queryKey: queryKeys.rounds.all(collectionId) }),
    ]);
}

export function useSaveAnimal(collectionId: string, animalId?: string) {
  const refresh = useRefresh(collectionId);
  return useMutation({
    mutationFn: (values: AnimalValues) =>
      apiRequest(
        animalId
          ? `/collections/${collectionId}/animals/${animalId}`
          : `/collections/${collectionId}/animals`,
        {
          method: animalId ? 'PUT' : 'POST',
          body: values,
          schema: animalSummary,
        },
      ),
    onSuccess: refresh,
  });
}

export function useRetireAnimal(collectionId: string, animalId: string) {
  const refresh = useRefresh(collectionId);
  return useMutation({
    mutationFn: (body: RetireBody | null) =>
      apiRequest(
        `/collections/${collectionId}/animals/${animalId}/${body ? 'retire' : 'reinstate'}`,
        { method: 'POST', body: body ?? {}, schema: animalSummary },
      ),
    onSuccess: refresh,
  });
}

/** Several animals retired alike (one request each: the history gets one fact per animal). */
export function useRetireAllAnimals(collectionId: string) {
  const refresh = useRefresh(collectionId);
  return useMutation({
    mutationFn: async ({ animalIds, body }: { animalIds: string[]; body: RetireBody }) => {
      for (const id of animalIds)
        await apiRequest(`/collections/${collectionId}/animals/${id}/retire`, {
          method: 'POST',
          body,
          schema: animalSummary,
        });
    },
    onSuccess: refresh,
  });
}

export function useMoveAnimals(collectionId: string) {
  const refresh = useRefresh(collectionId);
  return useMutation({
    mutationFn: (body: MoveBody) =>
      apiRequest(`/collections/${collectionId}/animals/move`, {
        method: 'POST',
        body,
        schema: moveResponse,
      }),
    onSuccess: refresh,
  });
}

export function useImportAnimals(collectionId: string) {
  const refresh = useRefresh(collectionId);
  return useMutation({
    mutationFn: (rows: unknown[]) =>
      apiRequest(`/collections/${collectionId}/animals/import`, {
        method: 'POST',
        body: { rows },
        schema: importResponse,
      }),
    onSuccess: refresh,
  });
}

export function useUploadPhoto(collectionId: string, animalId: string) {
  const refresh = useRefresh(collectionId);
  return useMutation({
    mutationFn: (file: File) =>
      uploadPhoto(
        `/collections/${collectionId}/animals/${animalId}/photo`,
        file,
        photoSavedResponse,
      ),
    onSuccess: refresh,
  });
}

export function useLocations(collectionId: string, enabled = true) {
  return useQuery({
    queryKey: queryKeys.locations.list(collectionId),
    enabled: enabled && !!collectionId,
    queryFn: () =>
      apiRequest(`/collections/${collectionId}/locations`, { schema: locationListResponse }),
  });
}

export function useLocationChanges(collectionId: string) {
  const refresh = useRefresh(collectionId);
  const base = `/collections/${collectionId}/locations`;
  return {
    create: useMutation({
      mutationFn: (body: LocationInput) =>
        apiRequest(base, { method: 'POST', body, schema: locationResponse }),
      onSuccess: refresh,
    }),
    reorder: useMutation({
      mutationFn: (locationIds: string[]) =>
        apiRequest(`${base}/order`, {
          method: 'PUT',
          body: { locationIds },
          schema: locationListResponse,
        }),
      onSuccess: refresh,
    }),
    renameGroup: useMutation({
      mutationFn: (body: RenameGroupBody) =>
        apiRequest(`${base}/rename`, { method: 'POST', body, schema: locationListResponse }),
      onSuccess: refresh,
    }),
    renameSpot: useMutation({
      mutationFn: ({ id, ...body }: LocationInput & { id: string }) =>
        apiRequest(`${base}/${id}`, { method: 'PATCH', body, schema: locationResponse }),
      onSuccess: refresh,
    }),
    remove: useMutation({
      mutationFn: (locationId: string) =>
        apiRequest(`${base}/${locationId}`, { method: 'DELETE', schema: noContent }),
      onSuccess: refresh,
    }),
  };
}
