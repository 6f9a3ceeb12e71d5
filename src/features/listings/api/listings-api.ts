import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { BulkListingBody, ListingBody } from '#shared/schemas/listings';
import { apiRequest } from '@/lib/api-client';
import { queryKeys } from '@/lib/query-keys';

const schemas = () => import('#shared/schemas/listings');

/** The collection's stock for sale: rows, groups by species and stage, offerable clutches. */
export const useListings = (collectionId: string) =>
  useQuery({
    queryKey: queryKeys.listings.list(collectionId),
    queryFn: () =>
      apiRequest(`/collections/${collectionId}/listings`, {
        schema: async () => (await schemas()).listingsResponse,
      }),
  });

export function useListingChanges(collectionId: string) {
  const queryClient = useQueryClient();
  const base = `/collections/${collectionId}/listings`;
  const refresh = () =>
    queryClient.invalidateQueries({ queryKey: queryKeys.listings.list(collectionId) });
  return {
    put: useMutation({
      mutationFn: ({ animalId, body }: { animalId: string; body: ListingBody }) =>
        apiRequest(`${base}/${animalId}`, {
          method: 'PUT',
          body,
          schema: async () => (await schemas()).listingResponse,
        }),
      onSuccess: refresh,
    }),
    remove: useMutation({
      mutationFn: (animalId: string) =>
        apiRequest(`${base}/${animalId}`, {
          method: 'DELETE',
          schema: async () => (await import('#shared/schemas/common')).noContent,
        }),
      onSuccess: refresh,
    }),
    bulk: useMutation({
      mutationFn: (body: BulkListingBody) =>
        apiRequest(`${base}/bulk`, {
          method: 'POST',
          body,
          schema: async () => (await schemas()).bulkListingResponse,
        }),
      onSuccess: refresh,
    }),
  };
}
