import { Router, type Request } from 'express';
import { z } from 'zod';
import {
  changePasswordBody,
  firstOwnerBody,
  resetBody,
  resetRequestBody,
  signInBody,
  signUpBody,
  signUpFinishBody,
  signUpToken,
  type FirstOwnerBody,
  type SignInBody,
  type SignUpBody,
  type SignUpFinishBody,
} from '#shared/schemas/auth';
import { preferencesBody } from '#shared/schemas/climate';
import { currentUserId, requireUser } from '../../middleware/auth';
import type { Limiter } from '../../middleware/rate-limit';
import { startSession } from '../../middleware/session';
import { input, validate } from '../../middleware/validate';
import type { AuthService } from './auth.service';

export interface AuthLimits {
  /** Sign-in attempts per IP address per 15 minutes. */
  signInPerIp: number;
  /** Failed sign-ins per account per hour (OWASP ASVS 4.0.3 2.2.1: at most 100). */
  failedSignInPerAccount: number;
  /** Password-reset requests per IP per 15 minutes and per e-mail per hour. */
  resetPerIp: number;
  resetPerEmail: number;
  /** Sign-up e-mails per address per hour: nobody's mailbox is flooded from our sign-up page. */
  signUpPerEmail: number;
  /** Invites (cover and keeper) a collection may send per day: each mails the owner's words to any address. */
  invitesPerCollection: number;
}

export const DEFAULT_AUTH_LIMITS: AuthLimits = {
  signInPerIp: 60,
  failedSignInPerAccount: 20,
  resetPerIp: 10,
  resetPerEmail: 3,
  signUpPerEmail: 3,
  invitesPerCollection: 20,
};

/** Keyed on the e-mail in the body, so one account cannot be hammered from many addresses. */
function byEmail(req: Request): string {
  const raw = (req.body as { email?: unknown } | undefined)?.email;
  return typeof raw === 'string' ? raw.trim().toLowerCase() : '';
}

function destroy(req: Request) {
  return new Promise<void>((resolve, reject) =>
    req.session.destroy((err) => (err ? reject(err) : resolve())),
  );
}

export function authRoutes(
  auth: AuthService,
  limits: AuthLimits,
  cookieName: string,
  limiter: Limiter,
) {
  const router = Router();

  const signInLimit = limiter('sign-in-ip', { windowMs: 15 * 60_000, limit: limits.signInPerIp });
  const accountLimit = limiter('sign-in-account', {
    windowMs: 60 * 60_000,
    limit: limits.failedSignInPerAccount,
    keyGenerator: byEmail,
    skipSuccessfulRequests: true,
  });
  const resetIpLimit = limiter('reset-ip', { windowMs: 15 * 60_000, limit: limits.resetPerIp });
  const resetEmailLimit = limiter('reset-email', {
    windowMs: 60 * 60_000,
    limit: limits.resetPerEmail,
    keyGenerator: byEmail,
  });
  const signUpEmailLimit = limiter('sign-up-email', {
    windowMs: 60 * 60_000,
    limit: limits.signUpPerEmail,
    keyGenerator: byEmail,
  });

  // The same answer for an address with or without an account (decision 012): the e-mail says which.
  router.post(
    '/sign-up',
    signInLimit,
    signUpEmailLimit,
    validate({ body: signUpBody }),
    (_req, res) => {
      const { email } = input<SignUpBody>(res, 'body');
      auth.startSignUp(email);
      res.status(202).json({
        message: `Check your e-mail: we have sent a message to ${email} with the next step.`,
      });
    },
  );

  // An empty server's first visit (no demo): whether to offer the first-owner form, and the form.
  router.get('/first-run', async (_req, res) => {
    res.json({ firstOwner: await auth.isFirstRun() });
  });

  router.post('/first-owner', signInLimit, validate({ body: firstOwnerBody }), async (req, res) => {
    const user = await auth.createFirstOwner(input<FirstOwnerBody>(res, 'body'));
    await startSession(req, user.id);
    res.status(201).json(await auth.me(user.id));
  });

  router.get(
    '/sign-up/preview',
    signInLimit,
    validate({ query: z.object({ token: signUpToken }) }),
    async (_req, res) => {
      res.json(await auth.previewSignUp(input<{ token: string }>(res, 'query').token));
    },
  );

  router.post(
    '/sign-up/finish',
    signInLimit,
    validate({ body: signUpFinishBody }),
    async (req, res) => {
      const user = await auth.finishSignUp(input<SignUpFinishBody>(res, 'body'));
      await startSession(req, user.id);
      res.status(201).json(await auth.me(user.id));
    },
  );

  router.post(
    '/sign-in',
    signInLimit,
    accountLimit,
    validate({ body: signInBody }),
    async (req, res) => {
      const { email, password } = input<SignInBody>(res, 'body');
      const user = await auth.verifyCredentials(email, password);
      await startSession(req, user.id);
      res.json(await auth.me(user.id));
    },
  );

  router.post('/sign-out', async (req, res) => {
    await destroy(req);
    res.clearCookie(cookieName, { path: '/' });
    res.status(204).end();
  });

  router.get('/me', requireUser, async (req, res) => {
    res.json(await auth.me(currentUserId(req)));
  });
  // The person's own settings, kept on the server so every device and e-mail follows them.
  router.patch('/me', requireUser, validate({ body: preferencesBody }), async (req, res) => {
    res.json(
      await auth.setPreferences(
        currentUserId(req),
        input<{ temperatureUnit: 'C' | 'F' }>(res, 'body'),
      ),
    );
  });

  router.post(
    '/password',
    requireUser,
    validate({ body: changePasswordBody }),
    async (req, res) => {
      const body = input<{ currentPassword: string; newPassword: string }>(res, 'body');
      await auth.changePassword(
        currentUserId(req),
        body.currentPassword,
        body.newPassword,
        req.sessionID,
      );
      res.status(204).end();
    },
  );

  router.post(
    '/reset-request',
    resetIpLimit,
    resetEmailLimit,
    validate({ body: resetRequestBody }),
    (_req, res) => {
      auth.requestReset(input<{ email: string }>(res, 'body').email);
      res.status(202).json({
        message:
          'If an account uses that e-mail, a reset link is on its way. It works for one hour.',
      });
    },
  );

  router.post('/reset', resetIpLimit, validate({ body: resetBody }), async (req, res) => {
    const body = input<{ token: string; password: string }>(res, 'body');
    await auth.resetPassword(body.token, body.password);
    res.status(204).end();
  });

  return router;
}
