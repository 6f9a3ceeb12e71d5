import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { HelperReportBody } from '#shared/schemas/helper-reports';
import { apiRequest } from '@/lib/api-client';
import { queryKeys } from '@/lib/query-keys';

/** Sends a helper's report; the owners get it at once (the server mails it after answering). */
export async function sendHelperReport(collectionId: string, body: HelperReportBody) {
  return apiRequest(`/collections/${collectionId}/helper-reports`, {
    method: 'POST',
    body,
    schema: async () => (await import('#shared/schemas/common')).createdResponse,
  });
}

export function useSendHelperReport(collectionId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: HelperReportBody) => sendHelperReport(collectionId, body),
    onSuccess: () =>
      queryClient.invalidateQueries({ queryKey: queryKeys.cover.helperReports(collectionId) }),
  });
}

/** The last month's reports, newest first (owners only). Today shows them: the schema loads with the answer. */
export function listHelperReports(collectionId: string) {
  return apiRequest(`/collections/${collectionId}/helper-reports`, {
    schema: async () => (await import('#shared/schemas/helper-reports')).helperReportsResponse,
  });
}

export const useHelperReports = (collectionId: string, enabled = true) =>
  useQuery({
    queryKey: queryKeys.cover.helperReports(collectionId),
    queryFn: () => listHelperReports(collectionId),
    enabled,
    refetchInterval: 5 * 60_000,
  });
