import { Router } from 'express';
import { DEMO_ACCOUNTS, DEMO_PASSWORD } from '../../access/demo-people';
import type { DevMailbox } from '../../mail/dev-smtp';
import { fromLoopback } from '../../middleware/loopback';
import type { AuthService } from '../auth/auth.service';

/**
 * Helpers of a local install: the demo's sign-in hints (empty without DEMO_MODE) and the local mailbox
 * (whenever the local SMTP fake runs, which is never in production: server/env.ts requires
 * SMTP_URL there, and app.ts does not mount it).
 */
export function devRoutes(
  mailbox: DevMailbox | undefined,
  auth: AuthService,
  options: { demo: boolean },
) {
  const router = Router();
  // Every install answers, so a sign-in page never meets a 404 for asking.
  router.get('/demo', (_req, res) => {
    if (!options.demo) return void res.json({ demo: false, accounts: [] });
    res.json({
      demo: true,
      accounts: DEMO_ACCOUNTS.map(({ email, role }) => ({ email, role })),
      password: DEMO_PASSWORD,
    });
  });
  if (!mailbox) return router;

  // Reset and invite links are in here. This machine sees every message; another device on
  // the network only a signed-in owner's own mail: every sign-up owns a collection, so the
  // whole mailbox for any owner would hand everyone's reset links to whoever signs up. Anyone
  // else hears what a route that is not there says: nothing tells them a mailbox exists.
  router.get('/mail', async (req, res, next) => {
    // Attachments by name only: their bytes stay in the mailbox (tests read them there).
    const all = [...mailbox.messages].reverse().map(({ attachments, ...m }) => ({
      ...m,
      attachments: (attachments ?? []).map((a) => a.filename),
    }));
    if (fromLoopback(req)) return void res.json({ scope: 'all', messages: all });
    // On to the API's own "no such route" (apiNotFound): the very answer to any unknown path.
    if (!req.session.userId) return next();
    const { user, memberships } = await auth.me(req.session.userId);
    if (!memberships.some((m) => m.role === 'owner')) return next();
    const me = user.email.toLowerCase();
    res.json({
      scope: 'mine',
      messages: all.filter((m) => m.to.some((to) => to.toLowerCase() === me)),
    });
  });
  return router;
}
