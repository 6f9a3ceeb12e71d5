import { useQuery } from '@tanstack/react-query';
import { lanStatusResponse } from '#shared/schemas/lan';
import { apiRequest } from '@/lib/api-client';
import { queryKeys } from '@/lib/query-keys';

/** Whether the server runs in LAN mode (`npm start -- --lan`), with its address and fingerprints. */
export const useLanStatus = () =>
  useQuery({
    queryKey: queryKeys.lan(),
    queryFn: () => apiRequest('/lan', { schema: lanStatusResponse }),
    // It changes only when the server restarts.
    staleTime: Infinity,
  });
