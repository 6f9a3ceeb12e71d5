import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiRequest } from '@/lib/api-client';
import { storeMe, withDb } from '@/lib/db';

/** Signs out; the person's waiting taps stay on the phone, kept for their next sign-in. */
export async function signOut() {
  await apiRequest('/auth/sign-out', { method: 'POST' });
  await withDb((db) => storeMe(db, null));
}

export function useSignOut() {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: signOut, onSuccess: () => queryClient.clear() });
}
