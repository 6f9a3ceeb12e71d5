import { queryOptions, useQuery } from '@tanstack/react-query';
import { meResponse } from '#shared/schemas/auth';
import { apiRequest } from '@/lib/api-client';
import { authKeys } from './keys';

export const getMe = () => apiRequest('/auth/me', { schema: meResponse });
export const meQueryOptions = () => queryOptions({ queryKey: authKeys.me(), queryFn: getMe, staleTime: 60_000 });
export const useMe = () => useQuery(meQueryOptions());
