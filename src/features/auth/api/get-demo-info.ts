import { queryOptions, useQuery } from '@tanstack/react-query';
import { demoInfoResponse } from '#shared/schemas/auth';
import { apiRequest } from '@/lib/api-client';
import { queryKeys } from '@/lib/query-keys';

/** The demo's sign-in hints; `{ demo: false }` on any other install (an older server: a quiet failure). */
export const getDemoInfo = () => apiRequest('/dev/demo', { schema: demoInfoResponse });
export const demoInfoQueryOptions = () =>
  queryOptions({
    queryKey: queryKeys.auth.demo(),
    queryFn: getDemoInfo,
    staleTime: Infinity,
    retry: false,
  });
export const useDemoInfo = () => useQuery(demoInfoQueryOptions());
