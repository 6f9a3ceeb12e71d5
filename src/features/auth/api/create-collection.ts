import { useMutation, useQueryClient } from '@tanstack/react-query';
import { meResponse } from '#shared/schemas/auth';
import { collectionResponse, type NewCollectionBody } from '#shared/schemas/collections';
import { apiRequest } from '@/lib/api-client';
import { queryKeys } from '@/lib/query-keys';
import { chooseCollectionOnDevice } from '../hooks/use-current-collection';
import { rememberMe } from './get-me';

export const createCollection = (body: NewCollectionBody) =>
  apiRequest('/collections', { method: 'POST', body, schema: collectionResponse });

/**
 * Starts a collection and makes it this device's current one. The person's list is read again
 * at once (and kept on the phone), so the app never shows the new id without its name.
 */
export function useCreateCollection() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: async (body: NewCollectionBody) => {
      const created = await createCollection(body);
      const me = await apiRequest('/auth/me', { schema: meResponse });
      await rememberMe(me);
      queryClient.setQueryData(queryKeys.auth.me(), me);
      chooseCollectionOnDevice(created.id);
      return created;
    },
  });
}
