import { Router } from 'express';
import { DEMO_ACCOUNTS, DEMO_PASSWORD } from '../../access/demo-people';
import type { DevMailbox } from '../../mail/dev-smtp';
import { HttpError } from '../../middleware/errors';
import { fromLoopback } from '../../middleware/loopback';
import type { AuthService } from '../auth/auth.service';

/** Demo-mode helpers (DEMO_MODE only): the sign-in hints and, never in production, the local mailbox. */
export function devRoutes(
  mailbox: DevMailbox | undefined,
  auth: AuthService,
  options: { mountMailbox: boolean },
) {
  const router = Router();
  router.get('/demo', (_req, res) => {
    res.json({
      demo: true,
      accounts: DEMO_ACCOUNTS.map(({ email, role }) => ({ email, role })),
      password: DEMO_PASSWORD,
    });
  });
  if (!options.mountMailbox) return router;

  // Reset and invite links are in here. This machine sees every message; another device on
  // the network only a signed-in owner's own mail: every sign-up owns a collection, so the
  // whole mailbox for any owner would hand everyone's reset links to whoever signs up.
  router.get('/mail', async (req, res) => {
    const all = [...(mailbox?.messages ?? [])].reverse();
    if (fromLoopback(req)) return void res.json({ scope: 'all', messages: all });
    if (!req.session.userId)
      throw new HttpError(
        401,
        'signed_out',
        'From another device, sign in as an owner to read the e-mail sent to you here.',
      );
    const { user, memberships } = await auth.me(req.session.userId);
    if (!memberships.some((m) => m.role === 'owner'))
      throw new HttpError(
        403,
        'forbidden',
        'Only owners can read their e-mail here from another device.',
      );
    const me = user.email.toLowerCase();
    res.json({
      scope: 'mine',
      messages: all.filter((m) => m.to.some((to) => to.toLowerCase() === me)),
    });
  });
  return router;
}
