import { useMutation, useQueryClient } from '@tanstack/react-query';
import { relabelResponse } from '#shared/schemas/labels';
import { apiRequest } from '@/lib/api-client';
import { queryKeys } from '@/lib/query-keys';

/** A new label code for a lost or damaged label; the old code stops opening the animal. */
export const relabel = (collectionId: string, animalId: string) =>
  apiRequest(`/collections/${collectionId}/animals/${animalId}/relabel`, {
    method: 'POST',
    schema: relabelResponse,
  });

/** The lists and the rounds show label codes, so both are read again. */
export function useRelabel(
  collectionId: string,
  animalId: string,
  onRelabelled: (labelCode: string) => void,
) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => relabel(collectionId, animalId),
    onSuccess: ({ labelCode }) => {
      void queryClient.invalidateQueries({ queryKey: queryKeys.animals.all(collectionId) });
      void queryClient.invalidateQueries({ queryKey: queryKeys.rounds.all(collectionId) });
      onRelabelled(labelCode);
    },
  });
}
