import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { createdResponse, noContent } from '#shared/schemas/common';
import {
  acceptResponse,
  coverListResponse,
  coverReportsResponse,
  handoverResponse,
  helperCoverView,
  invitePreview,
  type AcceptBody,
  type CoverBody,
  type CoverChangeBody,
  type HandoverNoteBody,
  type HelperCoverView,
} from '#shared/schemas/cover';
import { ApiError, apiRequest } from '@/lib/api-client';
import { withDb } from '@/lib/db';
import { queryKeys } from '@/lib/query-keys';

export const useCovers = (collectionId: string) =>
  useQuery({
    queryKey: queryKeys.cover.covers(collectionId),
    queryFn: () => apiRequest(`/collections/${collectionId}/covers`, { schema: coverListResponse }),
  });

export function useCoverChanges(collectionId: string) {
  const queryClient = useQueryClient();
  const refresh = () =>
    queryClient.invalidateQueries({ queryKey: queryKeys.cover.covers(collectionId) });
  const base = `/collections/${collectionId}/covers`;
  return {
    create: useMutation({
      mutationFn: (body: CoverBody) =>
        apiRequest(`/collections/${collectionId}/covers`, {
          method: 'POST',
          body,
          schema: createdResponse,
        }),
      onSuccess: refresh,
    }),
    change: useMutation({
      mutationFn: ({ coverId, body }: { coverId: string; body: CoverChangeBody }) =>
        apiRequest(`${base}/${coverId}`, { method: 'PUT', body, schema: coverListResponse }),
      onSuccess: refresh,
    }),
    resend: useMutation({
      mutationFn: (coverId: string) =>
        apiRequest(`${base}/${coverId}/resend`, { method: 'POST', schema: coverListResponse }),
      onSuccess: refresh,
    }),
    // Ending makes the cover's summary: the reports are read again with the covers.
    end: useMutation({
      mutationFn: (coverId: string) =>
        apiRequest(`${base}/${coverId}/end`, { method: 'POST', schema: coverListResponse }),
      onSuccess: () =>
        Promise.all([
          refresh(),
          queryClient.invalidateQueries({ queryKey: queryKeys.cover.reports(collectionId) }),
        ]),
    }),
  };
}

export const useHandover = (collectionId: string) =>
  useQuery({
    queryKey: queryKeys.cover.handover(collectionId),
    queryFn: () =>
      apiRequest(`/collections/${collectionId}/handover`, { schema: handoverResponse }),
  });

export function useHandoverChanges(collectionId: string) {
  const queryClient = useQueryClient();
  const refresh = () =>
    Promise.all([
      queryClient.invalidateQueries({ queryKey: queryKeys.cover.handover(collectionId) }),
      queryClient.invalidateQueries({ queryKey: queryKeys.rounds.all(collectionId) }),
    ]);
  const base = `/collections/${collectionId}/handover`;
  return {
    general: useMutation({
      mutationFn: (text: string) =>
        apiRequest(`${base}/general`, { method: 'PUT', body: { text }, schema: noContent }),
      onSuccess: refresh,
    }),
    add: useMutation({
      mutationFn: (body: HandoverNoteBody) =>
        apiRequest(`${base}/notes`, { method: 'POST', body, schema: createdResponse }),
      onSuccess: refresh,
    }),
    remove: useMutation({
      mutationFn: (noteId: string) =>
        apiRequest(`${base}/notes/${noteId}`, { method: 'DELETE', schema: noContent }),
      onSuccess: refresh,
    }),
  };
}

export const useCoverReports = (collectionId: string) =>
  useQuery({
    queryKey: queryKeys.cover.reports(collectionId),
    queryFn: () =>
      apiRequest(`/collections/${collectionId}/cover-reports`, { schema: coverReportsResponse }),
  });

/**
 * The helper's cover, local first like the round: the phone keeps the last copy, so the notes,
 * cautions and history are there in a back room with no signal.
 */
export function useHelperCover(collectionId: string, userId: string) {
  const key = `cover|${userId}|${collectionId}`;
  return useQuery({
    queryKey: queryKeys.cover.mine(collectionId, userId),
    networkMode: 'always',
    queryFn: async () => {
      try {
        const view = await apiRequest(`/collections/${collectionId}/cover/mine`, {
          schema: helperCoverView,
        });
        void withDb((db) => db.put('meta', view, key)).catch(() => undefined);
        return view;
      } catch (err) {
        if (!(err instanceof ApiError) || err.status !== 0) throw err;
        const cached = (await withDb((db) => db.get('meta', key)).catch(() => undefined)) as
          HelperCoverView | undefined;
        if (!cached) throw err;
        return cached;
      }
    },
  });
}

export function useAcknowledgeSafety(collectionId: string, userId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () =>
      apiRequest(`/collections/${collectionId}/cover/mine/acknowledge`, {
        method: 'POST',
        schema: noContent,
      }),
    onSuccess: () =>
      queryClient.invalidateQueries({ queryKey: queryKeys.cover.mine(collectionId, userId) }),
  });
}

export const leaveCover = (collectionId: string) =>
  apiRequest(`/collections/${collectionId}/cover/mine`, { method: 'DELETE', schema: noContent });

export const useInvitePreview = (token: string) =>
  useQuery({
    queryKey: queryKeys.cover.invite(token),
    queryFn: () =>
      apiRequest(`/cover-invites/preview?token=${encodeURIComponent(token)}`, {
        schema: invitePreview,
      }),
    retry: false,
  });

export const acceptInvite = (body: AcceptBody) =>
  apiRequest('/cover-invites/accept', { method: 'POST', body, schema: acceptResponse });
