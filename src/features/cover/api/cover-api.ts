import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { MeResponse } from '#shared/schemas/auth';
import type { AcceptBody, CoverBody, CoverSummary, HandoverNote, HandoverNoteBody, HelperCoverView, InvitePreview } from '#shared/schemas/cover';
import { ApiError, apiRequest } from '@/lib/api-client';
import { withDb } from '@/lib/db';

const keys = {
  covers: (c: string) => ['cover', c, 'covers'] as const,
  handover: (c: string) => ['cover', c, 'handover'] as const,
  reports: (c: string) => ['cover', c, 'reports'] as const,
  mine: (c: string, u: string) => ['cover', c, 'mine', u] as const,
};

export const useCovers = (collectionId: string) =>
  useQuery({ queryKey: keys.covers(collectionId), queryFn: () => apiRequest<{ covers: CoverSummary[] }>(`/collections/${collectionId}/covers`) });

export function useCoverChanges(collectionId: string) {
  const queryClient = useQueryClient();
  const refresh = () => queryClient.invalidateQueries({ queryKey: keys.covers(collectionId) });
  return {
    create: useMutation({ mutationFn: (body: CoverBody) => apiRequest(`/collections/${collectionId}/covers`, { method: 'POST', body }), onSuccess: refresh }),
    end: useMutation({ mutationFn: (coverId: string) => apiRequest(`/collections/${collectionId}/covers/${coverId}/end`, { method: 'POST' }), onSuccess: refresh }),
  };
}

export const useHandover = (collectionId: string) =>
  useQuery({ queryKey: keys.handover(collectionId), queryFn: () => apiRequest<{ generalNote: string | null; notes: HandoverNote[] }>(`/collections/${collectionId}/handover`) });

export function useHandoverChanges(collectionId: string) {
  const queryClient = useQueryClient();
  const refresh = () => Promise.all([queryClient.invalidateQueries({ queryKey: keys.handover(collectionId) }), queryClient.invalidateQueries({ queryKey: ['rounds', collectionId] })]);
  const base = `/collections/${collectionId}/handover`;
  return {
    general: useMutation({ mutationFn: (text: string) => apiRequest(`${base}/general`, { method: 'PUT', body: { text } }), onSuccess: refresh }),
    add: useMutation({ mutationFn: (body: HandoverNoteBody) => apiRequest(`${base}/notes`, { method: 'POST', body }), onSuccess: refresh }),
    remove: useMutation({ mutationFn: (noteId: string) => apiRequest(`${base}/notes/${noteId}`, { method: 'DELETE' }), onSuccess: refresh }),
  };
}

export const useCoverReports = (collectionId: string) =>
  useQuery({ queryKey: keys.reports(collectionId), queryFn: () => apiRequest<{ reports: { localDate: string; subject: string; body: string }[] }>(`/collections/${collectionId}/cover-reports`) });

/**
 * The helper's cover, local first like the round: the phone keeps the last copy, so the notes,
 * cautions and history are there in a back room with no signal.
 */
export function useHelperCover(collectionId: string, userId: string) {
  const key = `cover|${userId}|${collectionId}`;
  return useQuery({
    queryKey: keys.mine(collectionId, userId),
    networkMode: 'always',
    queryFn: async () => {
      try {
        const view = await apiRequest<HelperCoverView>(`/collections/${collectionId}/cover/mine`);
        void withDb((db) => db.put('meta', view, key)).catch(() => undefined);
        return view;
      } catch (err) {
        if (!(err instanceof ApiError) || err.status !== 0) throw err;
        const cached = (await withDb((db) => db.get('meta', key)).catch(() => undefined)) as HelperCoverView | undefined;
        if (!cached) throw err;
        return cached;
      }
    },
  });
}

export function useAcknowledgeSafety(collectionId: string, userId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => apiRequest(`/collections/${collectionId}/cover/mine/acknowledge`, { method: 'POST' }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: keys.mine(collectionId, userId) }),
  });
}

export const leaveCover = (collectionId: string) => apiRequest(`/collections/${collectionId}/cover/mine`, { method: 'DELETE' });

export const useInvitePreview = (token: string) =>
  useQuery({ queryKey: ['cover-invite', token], queryFn: () => apiRequest<InvitePreview>(`/cover-invites/preview?token=${encodeURIComponent(token)}`), retry: false });

export const acceptInvite = (body: AcceptBody) => apiRequest<{ collectionId: string; me: MeResponse }>('/cover-invites/accept', { method: 'POST', body });
