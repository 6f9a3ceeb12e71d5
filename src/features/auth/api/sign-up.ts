import { useMutation, useQueryClient } from '@tanstack/react-query';
import { meResponse, type SignUpBody } from '#shared/schemas/auth';
import { apiRequest } from '@/lib/api-client';
import { authKeys } from './keys';

export const signUp = (body: SignUpBody) => apiRequest('/auth/sign-up', { method: 'POST', body, schema: meResponse });

export function useSignUp() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: signUp,
    onSuccess: (me) => {
      queryClient.clear();
      queryClient.setQueryData(authKeys.me(), me);
    },
  });
}
