import { useMutation, useQueryClient } from '@tanstack/react-query';
import { noContent } from '#shared/schemas/common';
import { queryKeys } from '@/lib/query-keys';
import { uploadPhoto } from '@/lib/upload-photo';

/** The molt's photo (the exuviae); the history shows it once read again. */
export function useUploadMoltPhoto(collectionId: string, animalId: string, eventId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (file: File) =>
      uploadPhoto(
        `/collections/${collectionId}/animals/${animalId}/molts/${eventId}/photo`,
        file,
        noContent,
      ),
    onSuccess: () =>
      queryClient.invalidateQueries({ queryKey: queryKeys.rounds.history(collectionId, animalId) }),
  });
}
