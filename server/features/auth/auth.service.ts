import { createHash, randomBytes } from 'node:crypto';
import type { NodePgDatabase } from 'drizzle-orm/node-postgres';
import type { SignUpBody } from '../../../shared/schemas/auth';
import type { Mailer } from '../../mail/mailer';
import { HttpError } from '../../middleware/errors';
import { insertCollection, insertMembership, listMembershipsOfUser } from '../collections/collections.repository';
import {
  consumePasswordReset,
  deleteSessionsOfUser,
  findUserByEmail,
  findUserById,
  insertPasswordReset,
  insertUser,
  revokePasswordResets,
  updatePasswordHash,
} from './auth.repository';
import { burnComparison, hashPassword, verifyPassword } from './passwords';

export const RESET_TOKEN_LIFETIME_MS = 60 * 60 * 1000;

export interface AuthDeps {
  db: NodePgDatabase;
  mailer: Mailer;
  now: () => Date;
  bcryptCost: number;
  publicUrl: (path: string) => string;
}

const WRONG_CREDENTIALS = 'That e-mail and password do not match an account.';

function hashToken(token: string): string {
  return createHash('sha256').update(token).digest('hex');
}

export function createAuthService(deps: AuthDeps) {
  const { db } = deps;

  return {
    async signUp(body: SignUpBody) {
      if (await findUserByEmail(db, body.email)) {
        throw new HttpError(409, 'email_taken', 'An account with this e-mail already exists. Sign in, or reset your password.');
      }
      const passwordHash = await hashPassword(body.password, deps.bcryptCost);
      return db.transaction(async (tx) => {
        const user = await insertUser(tx, { email: body.email, displayName: body.displayName, passwordHash });
        const collectionId = await insertCollection(tx, { name: body.collectionName, timeZone: body.timeZone });
        await insertMembership(tx, { collectionId, userId: user.id, role: 'owner' });
        return user;
      });
    },

    /** One answer for an unknown e-mail and a wrong password, in about the same time. */
    async verifyCredentials(email: string, password: string) {
      const user = await findUserByEmail(db, email);
      if (!user) {
        await burnComparison(password);
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
        user: { id: user.id, email: user.email, displayName: user.displayName },
        memberships: memberships.map((m) => ({
          ...m,
          startsAt: m.startsAt?.toISOString() ?? null,
          endsAt: m.endsAt?.toISOString() ?? null,
        })),
      };
    },

    async changePassword(userId: string, currentPassword: string, newPassword: string, keepSid: string) {
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

    /** Always succeeds from the caller's point of view: whether the e-mail exists stays private. */
    async requestReset(email: string) {
      const user = await findUserByEmail(db, email);
      if (!user) return;
      const token = randomBytes(32).toString('base64url'); // 256 bits
      await insertPasswordReset(db, {
        userId: user.id,
        tokenHash: hashToken(token),
        expiresAt: new Date(deps.now().getTime() + RESET_TOKEN_LIFETIME_MS),
      });
      const link = deps.publicUrl(`/reset-password?token=${token}`);
      await deps.mailer.send({
        to: user.email,
        subject: 'Reset your Rackside password',
        text: [
          `Hello ${user.displayName},`,
          '',
          'Someone (we hope you) asked to reset the password of your Rackside account.',
          'Open this link within one hour to choose a new password:',
          '',
          link,
          '',
          'If you did not ask for this, ignore this e-mail: your password stays as it is.',
        ].join('\n'),
      });
    },

    async resetPassword(token: string, password: string) {
      const now = deps.now();
      const userId = await consumePasswordReset(db, hashToken(token), now);
      if (!userId) {
        throw new HttpError(400, 'reset_link_invalid', 'This reset link has expired or was already used. Ask for a new one.');
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

export type AuthService = ReturnType<typeof createAuthService>;
