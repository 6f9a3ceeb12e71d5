import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { apiRequest } from '@/lib/api-client';

const mailList = z.object({
  messages: z.array(z.object({ id: z.string(), to: z.array(z.string()), subject: z.string(), text: z.string(), receivedAt: z.string() })),
});
export type DevMail = z.infer<typeof mailList>['messages'][number];

export const listMail = () => apiRequest('/dev/mail', { schema: mailList });
export const mailQueryOptions = () => queryOptions({ queryKey: ['dev', 'mail'], queryFn: listMail, refetchInterval: 5000, retry: false });
export const useMail = () => useQuery(mailQueryOptions());
