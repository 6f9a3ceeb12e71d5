import { z } from 'zod';

/** The local mailbox of demo mode (`GET /api/dev/mail`). */
export const devMailResponse = z.object({
  /** `mine` from another device: only the signed-in owner's own e-mail. */
  scope: z.enum(['all', 'mine']),
  messages: z.array(
    z.object({
      id: z.string(),
      to: z.array(z.string()),
      subject: z.string(),
      text: z.string(),
      receivedAt: z.string(),
      /** Names of the files that came with it (an invoice PDF, care sheets). */
      attachments: z.array(z.string()).optional(),
    }),
  ),
});
export type DevMailResponse = z.infer<typeof devMailResponse>;
