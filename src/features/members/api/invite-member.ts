import { useMutation, useQueryClient } from '@tanstack/react-query';
import { inviteSentResponse, type MemberInviteRole } from '#shared/schemas/collections';
import { apiRequest } from '@/lib/api-client';
import { queryKeys } from '@/lib/query-keys';

/** E-mails an invite to keep (or co-own) the collection: the person joins only if they accept it. */
export const inviteMember = (collectionId: string, email: string, role: MemberInviteRole) =>
  apiRequest(`/collections/${collectionId}/members`, {
    method: 'POST',
    body: { email, role },
    schema: inviteSentResponse,
  });

export function useInviteMember(collectionId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ email, role }: { email: string; role: MemberInviteRole }) =>
      inviteMember(collectionId, email, role),
    onSuccess: () =>
      queryClient.invalidateQueries({ queryKey: queryKeys.members.list(collectionId) }),
  });
}
