import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { AvailabilityBody, AvailabilitySettingsView } from '#shared/schemas/listings';
import { apiRequest } from '@/lib/api-client';
import { queryKeys } from '@/lib/query-keys';

const schemas = () => import('#shared/schemas/listings');

export const useAvailabilitySettings = (collectionId: string) =>
  useQuery({
    queryKey: queryKeys.availability.settings(collectionId),
    queryFn: () =>
      apiRequest(`/collections/${collectionId}/availability`, {
        schema: async () => (await schemas()).availabilitySettings,
      }),
  });

export function useAvailabilityChanges(collectionId: string) {
  const queryClient = useQueryClient();
  const base = `/collections/${collectionId}/availability`;
  const put = (view: AvailabilitySettingsView) =>
    queryClient.setQueryData(queryKeys.availability.settings(collectionId), view);
  const schema = async () => (await schemas()).availabilitySettings;
  return {
    save: useMutation({
      mutationFn: (body: AvailabilityBody) => apiRequest(base, { method: 'PUT', body, schema }),
      onSuccess: put,
    }),
    newLink: useMutation({
      mutationFn: () => apiRequest(`${base}/new-link`, { method: 'POST', schema }),
      onSuccess: put,
    }),
  };
}

/** The public list behind a link: no session needed, a wrong link is a 404. */
export const usePublishedList = (token: string) =>
  useQuery({
    queryKey: queryKeys.availability.published(token),
    retry: false,
    queryFn: () =>
      apiRequest(`/available/${encodeURIComponent(token)}`, {
        schema: async () => (await schemas()).publicAvailability,
      }),
  });
