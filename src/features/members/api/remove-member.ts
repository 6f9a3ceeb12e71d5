import { useMutation, useQueryClient } from '@tanstack/react-query';
import { noContent } from '#shared/schemas/common';
import { apiRequest } from '@/lib/api-client';
import { queryKeys } from '@/lib/query-keys';

export const removeMember = (collectionId: string, userId: string) =>
  apiRequest(`/collections/${collectionId}/members/${userId}`, {
    method: 'DELETE',
    schema: noContent,
  });

export function useRemoveMember(collectionId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (userId: string) => removeMember(collectionId, userId),
    onSuccess: () =>
      queryClient.invalidateQueries({ queryKey: queryKeys.members.list(collectionId) }),
  });
}
