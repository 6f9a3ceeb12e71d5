import { createHash, randomBytes } from 'node:crypto';
import type { FirstOwnerBody, SignUpFinishBody } from '#shared/schemas/auth';
import { insertCollection } from '../../access/collections';
import { insertMembership, listMembershipsOfUser } from '../../access/memberships';
import { burnComparison, decoyHash, hashPassword, verifyPassword } from '../../access/passwords';
import { findUserByEmail, findUserById, insertUser, setTemperatureUnit } from '../../access/users';
import type { Background } from '../../background';
import type { Db } from '../../db/client';
import { isUniqueViolation } from '../../db/errors';
import type { Mailer } from '../../mail/mailer';
import { HttpError } from '../../middleware/errors';
import {
  anyUserExists,
  consumePasswordReset,
  consumeSignUpToken,
  deleteSessionsOfUser,
  findSignUpToken,
  insertPasswordReset,
  insertSignUpToken,
  lockFirstOwnerSetUp,
  revokePasswordResets,
  updatePasswordHash,
} from './auth.repository';

export const RESET_TOKEN_LIFETIME_MS = 60 * 60 * 1000;
/** A sign-up link works for a day (common practice, no published source). */
export const SIGN_UP_LINK_LIFETIME_MS = 24 * 60 * 60 * 1000;

export interface AuthDeps {
  db: Db;
  mailer: Mailer;
  now: () => Date;
  bcryptCost: number;
  publicUrl: (path: string) => string;
  background: Background;
}

const WRONG_CREDENTIALS = 'That e-mail and password do not match an account.';
const SIGN_UP_LINK_INVALID =
  'This sign-up link has expired or was already used. Start again from the sign-up page.';

function hashToken(token: string): string {
  return createHash('sha256').update(token).digest('hex');
}
/** 32 random bytes, base64url: 256 bits. */
const newToken = () => randomBytes(32).toString('base64url');

export function createAuthService(deps: AuthDeps) {
  const { db } = deps;
  // Made now, so the first unknown e-mail does not pay for making it.
  void decoyHash(deps.bcryptCost);

  /** What a sign-up sends: a link to finish for a new address, a note to an existing account. */
  async function mailSignUp(email: string) {
    const user = await findUserByEmail(db, email);
    if (user) {
      await deps.mailer.send({
        to: user.email,
        subject: 'You already have a Rackside account',
        text: [
          `Hello ${user.displayName},`,
          '',
          'Someone (we hope you) tried to make a new Rackside account with this e-mail address, which already has one.',
          '',
          `Sign in: ${deps.publicUrl('/sign-in')}`,
          `Forgotten your password? Ask for a reset link: ${deps.publicUrl('/forgot-password')}`,
          '',
          'If it was not you, ignore this e-mail: nothing has changed on your account.',
        ].join('\n'),
      });
      return;
    }
    const token = newToken();
    await insertSignUpToken(db, {
      email,
      tokenHash: hashToken(token),
      expiresAt: new Date(deps.now().getTime() + SIGN_UP_LINK_LIFETIME_MS),
    });
    await deps.mailer.send({
      to: email,
      subject: 'Finish making your Rackside account',
      text: [
        'Hello,',
        '',
        'Someone (we hope you) started making a Rackside account with this e-mail address.',
        'Open this link within 24 hours to choose your name, your password and your collection:',
        '',
        deps.publicUrl(`/sign-up/finish?token=${token}`),
        '',
        'If you did not ask for this, ignore this e-mail: no account is made.',
      ].join('\n'),
    });
  }

  async function mailReset(email: string) {
    const user = await findUserByEmail(db, email);
    if (!user) return;
    const token = newToken();
    await insertPasswordReset(db, {
      userId: user.id,
      tokenHash: hashToken(token),
      expiresAt: new Date(deps.now().getTime() + RESET_TOKEN_LIFETIME_MS),
    });
    await deps.mailer.send({
      to: user.email,
      subject: 'Reset your Rackside password',
      text: [
        `Hello ${user.displayName},`,
        '',
        'Someone (we hope you) asked to reset the password of your Rackside account.',
        'Open this link within one hour to choose a new password:',
        '',
        deps.publicUrl(`/reset-password?token=${token}`),
        '',
        'If you did not ask for this, ignore this e-mail: your password stays as it is.',
      ].join('\n'),
    });
  }

  return {
    /**
     * The first step of sign-up. Whether the address has an account is decided after the
     * answer has gone (docs/decisions/012-same-answer-for-every-email.md): the caller always
     * hears the same thing, in the same time.
     */
    startSignUp(email: string) {
      deps.background.run('sign-up mail', () => mailSignUp(email));
    },

    /** The address a sign-up link is for, so its page can show it. */
    async previewSignUp(token: string) {
      const email = await findSignUpToken(db, hashToken(token), deps.now());
      if (!email) throw new HttpError(400, 'sign_up_link_invalid', SIGN_UP_LINK_INVALID);
      return { email };
    },

    /** The link's page: the account, its collection and the person's ownership, all at once. */
    async finishSignUp(body: SignUpFinishBody) {
      if (!(await findSignUpToken(db, hashToken(body.token), deps.now()))) {
        throw new HttpError(400, 'sign_up_link_invalid', SIGN_UP_LINK_INVALID);
      }
      const passwordHash = await hashPassword(body.password, deps.bcryptCost);
      try {
        return await db.transaction(async (tx) => {
          const email = await consumeSignUpToken(tx, hashToken(body.token), deps.now());
          if (!email) throw new HttpError(400, 'sign_up_link_invalid', SIGN_UP_LINK_INVALID);
          // Only the mailbox's owner gets here, so saying so reveals nothing to anyone else.
          if (await findUserByEmail(tx, email)) throw emailTaken();
          const user = await insertUser(tx, { email, displayName: body.displayName, passwordHash });
          const collectionId = await insertCollection(tx, {
            name: body.collectionName,
            timeZone: body.timeZone,
          });
          await insertMembership(tx, { collectionId, userId: user.id, role: 'owner' });
          return user;
        });
      } catch (err) {
        // Two links for one address finished at the same moment: the other one won.
        if (isUniqueViolation(err)) throw emailTaken();
        throw err;
      }
    },

    /** True until the server's first account exists. */
    async isFirstRun() {
      return !(await anyUserExists(db));
    },

    /**
     * The first visit to an empty server: the first account, its collection and its ownership,
     * with no e-mail link, and only while no account exists (checked under a lock, so two
     * visitors at the same moment make one account and the other is told to sign in).
     */
    async createFirstOwner(body: FirstOwnerBody) {
      if (await anyUserExists(db)) throw alreadySetUp();
      const passwordHash = await hashPassword(body.password, deps.bcryptCost);
      return db.transaction(async (tx) => {
        await lockFirstOwnerSetUp(tx);
        if (await anyUserExists(tx)) throw alreadySetUp();
        const user = await insertUser(tx, {
          email: body.email,
          displayName: body.displayName,
          passwordHash,
        });
        const collectionId = await insertCollection(tx, {
          name: body.collectionName,
          timeZone: body.timeZone,
        });
        await insertMembership(tx, { collectionId, userId: user.id, role: 'owner' });
        return user;
      });
    },

    /** One answer for an unknown e-mail and a wrong password, in about the same time. */
    async verifyCredentials(email: string, password: string) {
      const user = await findUserByEmail(db, email);
      if (!user) {
        await burnComparison(password, deps.bcryptCost);
        throw new HttpError(401, 'wrong_credentials', WRONG_CREDENTIALS);
      }
      if (!(await verifyPassword(password, user.passwordHash))) {
        throw new HttpError(401, 'wrong_credentials', WRONG_CREDENTIALS);
      }
      return user;
    },

    async me(userId: string) {
      const user = await findUserById(db, userId);
      if (!user) throw new HttpError(401, 'signed_out', 'Please sign in.');
      const memberships = await listMembershipsOfUser(db, userId);
      return {
        user: {
          id: user.id,
          email: user.email,
          displayName: user.displayName,
          temperatureUnit: user.temperatureUnit,
        },
        memberships: memberships.map((m) => ({
          ...m,
          startsAt: m.startsAt?.toISOString() ?? null,
          endsAt: m.endsAt?.toISOString() ?? null,
        })),
      };
    },

    /** The person's own settings (today the temperature unit); the new `me`. */
    async setPreferences(userId: string, body: { temperatureUnit: 'C' | 'F' }) {
      await setTemperatureUnit(db, userId, body.temperatureUnit);
      return this.me(userId);
    },

    async changePassword(
      userId: string,
      currentPassword: string,
      newPassword: string,
      keepSid: string,
    ) {
      const user = await findUserById(db, userId);
      if (!user || !(await verifyPassword(currentPassword, user.passwordHash))) {
        throw new HttpError(422, 'wrong_password', 'Your current password is not right.', [
          { path: 'body.currentPassword', message: 'Your current password is not right.' },
        ]);
      }
      const passwordHash = await hashPassword(newPassword, deps.bcryptCost);
      // A reset link asked for earlier (perhaps by someone else) must not undo this change.
      await db.transaction(async (tx) => {
        await updatePasswordHash(tx, userId, passwordHash, deps.now());
        await revokePasswordResets(tx, userId, deps.now());
        await deleteSessionsOfUser(tx, userId, keepSid);
      });
    },

    /**
     * Always succeeds from the caller's point of view: the look-up, the token and the e-mail
     * happen after the answer, so neither its words nor its timing say whether the e-mail exists.
     */
    requestReset(email: string) {
      deps.background.run('password reset mail', () => mailReset(email));
    },

    async resetPassword(token: string, password: string) {
      const now = deps.now();
      const userId = await consumePasswordReset(db, hashToken(token), now);
      if (!userId) {
        throw new HttpError(
          400,
          'reset_link_invalid',
          'This reset link has expired or was already used. Ask for a new one.',
        );
      }
      const passwordHash = await hashPassword(password, deps.bcryptCost);
      await db.transaction(async (tx) => {
        await updatePasswordHash(tx, userId, passwordHash, now);
        await revokePasswordResets(tx, userId, now);
        await deleteSessionsOfUser(tx, userId);
      });
    },
  };
}

const alreadySetUp = () =>
  new HttpError(
    409,
    'already_set_up',
    'This server already has its first account. Sign in, or ask its owner to invite you.',
  );

const emailTaken = () =>
  new HttpError(
    409,
    'email_taken',
    'An account with this e-mail already exists. Sign in, or reset your password.',
  );

export type AuthService = ReturnType<typeof createAuthService>;
