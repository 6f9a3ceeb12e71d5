import { useMutation } from '@tanstack/react-query';
import { noContent } from '#shared/schemas/common';
import { apiRequest } from '@/lib/api-client';

/** Deletes a collection for everyone; the server checks the typed name again. */
export function deleteCollection(collectionId: string, confirmName: string) {
  return apiRequest(`/collections/${collectionId}`, {
    method: 'DELETE',
    body: { confirmName },
    schema: noContent,
  });
}

export function useDeleteCollection(collectionId: string, onDeleted: () => void) {
  return useMutation({
    mutationFn: (confirmName: string) => deleteCollection(collectionId, confirmName),
    onSuccess: onDeleted,
  });
}
