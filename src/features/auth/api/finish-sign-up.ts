import { useMutation, useQueryClient } from '@tanstack/react-query';
import { meResponse, type SignUpFinishBody } from '#shared/schemas/auth';
import { apiRequest } from '@/lib/api-client';
import { queryKeys } from '@/lib/query-keys';
import { rememberMe } from './get-me';

/** The sign-up link's page: makes the account and its collection, and signs in. */
export const finishSignUp = (body: SignUpFinishBody) =>
  apiRequest('/auth/sign-up/finish', { method: 'POST', body, schema: meResponse });

export function useFinishSignUp() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: finishSignUp,
    onSuccess: async (me, body) => {
      await rememberMe(me);
      // Whatever an earlier person left in the cache goes; the link's own look-up stays, or
      // its page would ask again for a link that is now used (and be told so).
      const link = JSON.stringify(queryKeys.auth.signUpLink(body.token));
      queryClient.removeQueries({ predicate: (q) => JSON.stringify(q.queryKey) !== link });
      queryClient.setQueryData(queryKeys.auth.me(), me);
    },
  });
}
