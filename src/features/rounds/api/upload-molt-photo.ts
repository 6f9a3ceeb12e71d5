import { useMutation, useQueryClient } from '@tanstack/react-query';
import { noContent } from '#shared/schemas/common';
import { queryKeys } from '@/lib/query-keys';
import { uploadPhoto } from '@/lib/upload-photo';

/** Where a recorded fact's photo lives: a molt's own route, or any other outcome's. */
export const eventPhotoPath = (
  collectionId: string,
  animalId: string,
  event: { id: string; kind: string },
) =>
  `/collections/${collectionId}/animals/${animalId}/${event.kind === 'molted' ? 'molts' : 'events'}/${event.id}/photo`;

/** A fact's photo (a molt's exuviae, what an outcome showed); the history shows it once read again. */
export function useUploadMoltPhoto(
  collectionId: string,
  animalId: string,
  event: { id: string; kind: string },
) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (file: File) =>
      uploadPhoto(eventPhotoPath(collectionId, animalId, event), file, noContent),
    onSuccess: () =>
      queryClient.invalidateQueries({ queryKey: queryKeys.rounds.history(collectionId, animalId) }),
  });
}
