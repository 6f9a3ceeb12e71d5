import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { TypedReadingBody } from '#shared/schemas/climate';
import { ApiError, apiRequest } from '@/lib/api-client';
import { queryKeys } from '@/lib/query-keys';

/**
 * The one way the app sends a typed room reading. The id is made on the phone, so the server
 * stores a reading sent twice once: the generic offline queue for non-animal care can take
 * this call over as it is. Until then a failed send is not kept anywhere (`notSaved`).
 */
export async function recordReading(collectionId: string, body: TypedReadingBody) {
  return apiRequest(`/collections/${collectionId}/climate/readings`, {
    method: 'POST',
    body,
    schema: async () => (await import('#shared/schemas/climate')).typedReadingResponse,
  });
}

/** True when the reading never reached the server (no signal): it was not saved. */
export const notSaved = (err: unknown) => !(err instanceof ApiError) || err.status === 0;

export function useRecordReading(collectionId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: TypedReadingBody) => recordReading(collectionId, body),
    onSuccess: () =>
      queryClient.invalidateQueries({ queryKey: queryKeys.climate.all(collectionId) }),
  });
}
