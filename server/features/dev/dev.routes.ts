import { Router } from 'express';
import { DEMO_ACCOUNTS, DEMO_PASSWORD } from '../../db/seed/demo-people';
import type { DevMailbox } from '../../mail/dev-smtp';

/** Demo-mode helpers: the sign-in hints and the local mailbox. Never mounted in production. */
export function devRoutes(mailbox: DevMailbox | undefined) {
  const router = Router();
  router.get('/demo', (_req, res) => {
    res.json({ demo: true, accounts: DEMO_ACCOUNTS.map(({ email, role }) => ({ email, role })), password: DEMO_PASSWORD });
  });
  router.get('/mail', (_req, res) => {
    res.json({ messages: [...(mailbox?.messages ?? [])].reverse() });
  });
  return router;
}
