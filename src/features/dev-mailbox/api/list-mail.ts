import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { apiRequest } from '@/lib/api-client';

const mailList = z.object({
  /** `mine` from another device: only the signed-in owner's own e-mail. */
  scope: z.enum(['all', 'mine']),
  messages: z.array(z.object({ id: z.string(), to: z.array(z.string()), subject: z.string(), text: z.string(), receivedAt: z.string() })),
});
export type DevMail = z.infer<typeof mailList>['messages'][number];
export type MailScope = z.infer<typeof mailList>['scope'];

export const listMail = () => apiRequest('/dev/mail', { schema: mailList });
export const mailQueryOptions = () => queryOptions({ queryKey: ['dev', 'mail'], queryFn: listMail, refetchInterval: 5000, retry: false });
export const useMail = () => useQuery(mailQueryOptions());
