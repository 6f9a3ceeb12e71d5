import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiRequest } from '@/lib/api-client';

export const signOut = () => apiRequest('/auth/sign-out', { method: 'POST' });

export function useSignOut() {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: signOut, onSuccess: () => queryClient.clear() });
}
