import { useMutation, useQueryClient } from '@tanstack/react-query';
import { noContent } from '#shared/schemas/common';
import { apiRequest } from '@/lib/api-client';
import { clearCachedCollections, withDb } from '@/lib/db';

/**
 * Signs out and forgets the collections cached on this phone (rounds, animal lists, `me`). The
 * person's waiting taps stay, kept for their next sign-in (the button warns about them first).
 */
export async function signOut() {
  await apiRequest('/auth/sign-out', { method: 'POST', schema: noContent });
  await withDb(clearCachedCollections);
}

export function useSignOut() {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: signOut, onSuccess: () => queryClient.clear() });
}
