import { queryOptions, useQuery } from '@tanstack/react-query';
import { demoInfoResponse } from '#shared/schemas/auth';
import { apiRequest } from '@/lib/api-client';
import { queryKeys } from '@/lib/query-keys';

/** Answers only in demo mode; elsewhere the route does not exist and this query fails quietly. */
export const getDemoInfo = () => apiRequest('/dev/demo', { schema: demoInfoResponse });
export const demoInfoQueryOptions = () =>
  queryOptions({
    queryKey: queryKeys.auth.demo(),
    queryFn: getDemoInfo,
    staleTime: Infinity,
    retry: false,
  });
export const useDemoInfo = () => useQuery(demoInfoQueryOptions());
