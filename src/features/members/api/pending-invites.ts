import { useMutation, useQueryClient } from '@tanstack/react-query';
import { inviteSentResponse } from '#shared/schemas/collections';
import { noContent } from '#shared/schemas/common';
import { apiRequest } from '@/lib/api-client';
import { queryKeys } from '@/lib/query-keys';

/** An unanswered invite: a new link by e-mail (the old one stops working), or cancelled. */
export function usePendingInviteChanges(collectionId: string) {
  const queryClient = useQueryClient();
  const refresh = () =>
    queryClient.invalidateQueries({ queryKey: queryKeys.members.list(collectionId) });
  const base = `/collections/${collectionId}/invites`;
  return {
    resend: useMutation({
      mutationFn: (inviteId: string) =>
        apiRequest(`${base}/${inviteId}/resend`, { method: 'POST', schema: inviteSentResponse }),
      onSuccess: refresh,
    }),
    revoke: useMutation({
      mutationFn: (inviteId: string) =>
        apiRequest(`${base}/${inviteId}`, { method: 'DELETE', schema: noContent }),
      onSuccess: refresh,
    }),
  };
}
