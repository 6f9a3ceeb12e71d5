import { roleAtLeast } from '#shared/domain/roles';
import type { AcceptBody, InvitePreview } from '#shared/schemas/cover';
import { hashInviteToken } from '../../access/invite-token';
import { roleOfUser } from '../../access/memberships';
import { hashPassword } from '../../access/passwords';
import { displayNameOf, findUserByEmail, insertUser } from '../../access/users';
import type { Db } from '../../db/client';
import { HttpError } from '../../middleware/errors';
import { daysOf } from './cover-days';
import {
  claimInvite,
  collectionOfInvite,
  findInviteByTokenHash,
  grantMembership,
} from './cover.repository';

export interface InviteAcceptanceDeps {
  now: () => Date;
  bcryptCost: number;
}

/** The invite link (a cover's or a keeper's), before and at acceptance: no membership yet. */
export function createInviteAcceptance(db: Db, deps: InviteAcceptanceDeps) {
  async function usableInvite(token: string) {
    const invite = await findInviteByTokenHash(db, hashInviteToken(token));
    if (!invite)
      throw new HttpError(
        400,
        'invite_invalid',
        'This invite link is not valid. Ask the keeper to send a new one.',
      );
    if (invite.revokedAt)
      throw new HttpError(
        400,
        'invite_revoked',
        'This invite was cancelled by the owner. Ask them to send a new one if it was a mistake.',
      );
    if (invite.acceptedAt)
      throw new HttpError(
        400,
        'invite_used',
        'This invite link was already used. Sign in to see your cover.',
      );
    if (invite.expiresAt <= deps.now())
      throw new HttpError(
        400,
        'invite_expired',
        'This invite link has expired. Ask the keeper to send a new one.',
      );
    return invite;
  }

  return {
    /** What the accept page shows before anyone signs in (the link's holder reads the mailbox). */
    async preview(token: string): Promise<InvitePreview> {
      const invite = await usableInvite(token);
      const c = await collectionOfInvite(db, invite.collectionId);
      if (!c) throw new HttpError(404, 'not_found', 'We could not find that cover.');
      const invitedBy = invite.invitedBy ? await displayNameOf(db, invite.invitedBy) : null;
      const days =
        invite.startsAt && invite.endsAt
          ? daysOf(invite.startsAt, invite.endsAt, c.timeZone)
          : { firstDay: null, lastDay: null };
      return {
        role: invite.role,
        collectionName: c.name,
        invitedBy,
        email: invite.email,
        ...days,
        message: invite.message,
        hasAccount: !!(await findUserByEmail(db, invite.email)),
      };
    },

    /**
     * Accepting is the only way into someone else's collection: as a helper for exactly the
     * cover's days, or as a keeper. Someone new gets an account; someone with an account must
     * be signed in as the invited e-mail. Returns the user to sign in (the route starts the session).
     */
    async accept(
      body: AcceptBody,
      signedInUserId: string | null,
    ): Promise<{ userId: string; collectionId: string }> {
      return db.transaction(async (tx) => {
        const invite = await usableInvite(body.token);
        // A keeper's or co-owner's invite: no days, no window.
        const keeper = invite.role !== 'helper';
        const existing = await findUserByEmail(tx, invite.email);
        let userId: string;
        if (existing) {
          if (signedInUserId !== existing.id) {
            throw new HttpError(
              401,
              'sign_in_first',
              `Sign in as ${invite.email} to accept this ${keeper ? 'invite' : 'cover'}.`,
            );
          }
          userId = existing.id;
        } else {
          if (!body.account)
            throw new HttpError(
              422,
              'invalid',
              'Choose your name and a password to make your account.',
              [{ path: 'account', message: 'Choose your name and a password.' }],
            );
          const passwordHash = await hashPassword(body.account.password, deps.bcryptCost);
          userId = (
            await insertUser(tx, {
              email: invite.email,
              displayName: body.account.displayName,
              passwordHash,
            })
          ).id;
        }
        const current = await roleOfUser(tx, invite.collectionId, userId);
        // Accepting moves someone up (a helper to keeper, a keeper to co-owner), never down.
        if (current && current !== 'helper' && roleAtLeast(current, invite.role))
          throw new HttpError(
            409,
            'already_member',
            current === 'owner'
              ? 'You already own this collection.'
              : keeper
                ? 'You already keep this collection.'
                : 'You already keep this collection; no cover is needed.',
          );
        // Claimed once: a second use of the same link finds it accepted.
        if (!(await claimInvite(tx, invite.id, userId, deps.now())))
          throw new HttpError(
            400,
            'invite_used',
            'This invite link was already used. Sign in to see your collection.',
          );
        // A keeper or owner has no window; a helper who becomes one loses theirs.
        const grant = keeper
          ? {
              role: invite.role === 'owner' ? ('owner' as const) : ('keeper' as const),
              startsAt: null,
              endsAt: null,
            }
          : { role: 'helper' as const, startsAt: invite.startsAt, endsAt: invite.endsAt };
        await grantMembership(tx, invite.collectionId, userId, grant);
        return { userId, collectionId: invite.collectionId };
      });
    },
  };
}
