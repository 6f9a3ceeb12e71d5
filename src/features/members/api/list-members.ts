import { queryOptions, useQuery } from '@tanstack/react-query';
import { membersResponse } from '#shared/schemas/collections';
import { apiRequest } from '@/lib/api-client';
import { queryKeys } from '@/lib/query-keys';

/** The collection's members and the keeper invites still unanswered (owners only). */
export const listMembers = (collectionId: string) =>
  apiRequest(`/collections/${collectionId}/members`, { schema: membersResponse });

export const membersQueryOptions = (collectionId: string) =>
  queryOptions({
    queryKey: queryKeys.members.list(collectionId),
    queryFn: () => listMembers(collectionId),
  });

export const useMembers = (collectionId: string, enabled = true) =>
  useQuery({ ...membersQueryOptions(collectionId), enabled });
