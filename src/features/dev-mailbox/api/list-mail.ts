import { queryOptions, useQuery } from '@tanstack/react-query';
import { devMailResponse, type DevMailResponse } from '#shared/schemas/dev';
import { apiRequest } from '@/lib/api-client';
import { queryKeys } from '@/lib/query-keys';

export type DevMail = DevMailResponse['messages'][number];
export type MailScope = DevMailResponse['scope'];

export const listMail = () => apiRequest('/dev/mail', { schema: devMailResponse });
export const mailQueryOptions = () =>
  queryOptions({
    queryKey: queryKeys.devMail(),
    queryFn: listMail,
    refetchInterval: 5000,
    retry: false,
  });
export const useMail = () => useQuery(mailQueryOptions());
