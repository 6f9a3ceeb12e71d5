import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiRequest } from '@/lib/api-client';
import { memberKeys } from './keys';

export const removeMember = (collectionId: string, userId: string) =>
  apiRequest(`/collections/${collectionId}/members/${userId}`, { method: 'DELETE' });

export function useRemoveMember(collectionId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (userId: string) => removeMember(collectionId, userId),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: memberKeys.list(collectionId) }),
  });
}
