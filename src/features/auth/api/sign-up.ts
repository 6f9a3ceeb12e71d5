import { useMutation, useQueryClient } from '@tanstack/react-query';
import { meResponse, type SignUpBody } from '#shared/schemas/auth';
import { apiRequest } from '@/lib/api-client';
import { rememberMe } from './get-me';
import { authKeys } from './keys';

export const signUp = (body: SignUpBody) => apiRequest('/auth/sign-up', { method: 'POST', body, schema: meResponse });

export function useSignUp() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: signUp,
    onSuccess: async (me) => {
      await rememberMe(me);
      queryClient.clear();
      queryClient.setQueryData(authKeys.me(), me);
    },
  });
}
