import { useMutation, useQueryClient } from '@tanstack/react-query';
import { meResponse, type SignInBody } from '#shared/schemas/auth';
import { apiRequest } from '@/lib/api-client';
import { authKeys } from './keys';

export const signIn = (body: SignInBody) => apiRequest('/auth/sign-in', { method: 'POST', body, schema: meResponse });

export function useSignIn() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: signIn,
    onSuccess: (me) => {
      queryClient.clear();
      queryClient.setQueryData(authKeys.me(), me);
    },
  });
}
