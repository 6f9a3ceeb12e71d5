import { useMutation, useQueryClient } from '@tanstack/react-query';
import { inviteSentResponse } from '#shared/schemas/collections';
import { apiRequest } from '@/lib/api-client';
import { queryKeys } from '@/lib/query-keys';

/** E-mails a keeper's invite: the person joins only if they accept it. */
export const inviteMember = (collectionId: string, email: string) =>
  apiRequest(`/collections/${collectionId}/members`, {
    method: 'POST',
    body: { email, role: 'keeper' },
    schema: inviteSentResponse,
  });

export function useInviteMember(collectionId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (email: string) => inviteMember(collectionId, email),
    onSuccess: () =>
      queryClient.invalidateQueries({ queryKey: queryKeys.members.list(collectionId) }),
  });
}
