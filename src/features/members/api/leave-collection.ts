import { useMutation } from '@tanstack/react-query';
import { noContent } from '#shared/schemas/common';
import { apiRequest } from '@/lib/api-client';

/** A keeper steps out of a collection they were invited to. */
export const leaveCollection = (collectionId: string) =>
  apiRequest(`/collections/${collectionId}/membership`, { method: 'DELETE', schema: noContent });

export const useLeaveCollection = (collectionId: string, onLeft: () => void | Promise<void>) =>
  useMutation({ mutationFn: () => leaveCollection(collectionId), onSuccess: onLeft });
