import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { firstRunResponse, meResponse, type FirstOwnerBody } from '#shared/schemas/auth';
import { apiRequest } from '@/lib/api-client';
import { queryKeys } from '@/lib/query-keys';
import { rememberMe } from './get-me';

/** Whether this server has no account yet (a fresh install without the demo). */
export const getFirstRun = () => apiRequest('/auth/first-run', { schema: firstRunResponse });
export const firstRunQueryOptions = () =>
  queryOptions({ queryKey: queryKeys.auth.firstRun(), queryFn: getFirstRun, retry: false });
export const useFirstRun = () => useQuery(firstRunQueryOptions());

/** The first visit's form: the first owner's account and collection, signed in at once. */
export const createFirstOwner = (body: FirstOwnerBody) =>
  apiRequest('/auth/first-owner', { method: 'POST', body, schema: meResponse });

export function useCreateFirstOwner() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createFirstOwner,
    onSuccess: async (me) => {
      await rememberMe(me);
      queryClient.setQueryData(queryKeys.auth.firstRun(), { firstOwner: false });
      queryClient.setQueryData(queryKeys.auth.me(), me);
    },
  });
}
