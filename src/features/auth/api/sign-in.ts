import { useMutation, useQueryClient } from '@tanstack/react-query';
import { meResponse, type SignInBody } from '#shared/schemas/auth';
import { apiRequest } from '@/lib/api-client';
import { queryKeys } from '@/lib/query-keys';
import { rememberMe } from './get-me';

export const signIn = (body: SignInBody) =>
  apiRequest('/auth/sign-in', { method: 'POST', body, schema: meResponse });

export function useSignIn() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: signIn,
    onSuccess: async (me) => {
      await rememberMe(me);
      queryClient.clear();
      queryClient.setQueryData(queryKeys.auth.me(), me);
    },
  });
}
