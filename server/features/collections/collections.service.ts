import type { MemberInviteRole } from '#shared/schemas/collections';
import { insertCollection } from '../../access/collections';
import { INVITE_LIFETIME_MS, newInviteToken } from '../../access/invite-token';
import {
  insertMembership,
  listMembershipsOfUser,
  roleOfEmail,
  type MemberCollection,
} from '../../access/memberships';
import { displayNameOf } from '../../access/users';
import type { Background } from '../../background';
import type { Db } from '../../db/client';
import type { Mailer } from '../../mail/mailer';
import { HttpError } from '../../middleware/errors';
import {
  deleteCollectionRows,
  deleteMembership,
  deleteOwnerMembershipIfOthers,
  findPendingMemberInvite,
  insertMemberInvite,
  listMembers,
  listPendingMemberInvites,
  renewMemberInvite,
  revokeMemberInvite,
} from './collections.repository';

interface Deps {
  mailer: Mailer;
  now: () => Date;
  publicUrl: (path: string) => string;
  background: Background;
  /** Removes a collection's photo files once its rows are gone. */
  removeFiles(collectionId: string): Promise<void>;
}

/** Enough for a household's collections and a few restores; stops a runaway script. */
const MAX_MEMBERSHIPS = 50;

/**
 * An expired invite stays on the owner's list for a month, to be sent again or cancelled;
 * after that it drops off (the person never answered).
 */
const EXPIRED_SHOWN_MS = 30 * 86_400_000;

const inviteNotFound = () =>
  new HttpError(
    404,
    'not_found',
    'We could not find that invite: it may have been accepted or cancelled already.',
  );

/** What each role may do, in the e-mail's words. */
const ROLE_MAIL: Record<MemberInviteRole, { subject: string; what: string }> = {
  keeper: {
    subject: 'to keep',
    what: "to keep the collection {name} with them on Rackside: its feeding rounds, its animals' records and their labels.",
  },
  owner: {
    subject: 'to co-own',
    what: "to own the collection {name} with them on Rackside: its feeding rounds, its animals' records and labels, and also who keeps it, its covers and its backups.",
  },
};

export function createCollectionsService(db: Db, deps: Deps) {
  /** The invite's e-mail, after the answer (decision 012). */
  function mailInvite(
    c: MemberCollection,
    invitedBy: string,
    email: string,
    role: MemberInviteRole,
    token: string,
  ) {
    deps.background.run(`${role} invite mail`, async () => {
      const from = (await displayNameOf(db, invitedBy)) ?? 'A keeper';
      const words = ROLE_MAIL[role];
      await deps.mailer.send({
        to: email,
        subject: `${from} invites you ${words.subject} ${c.collectionName} on Rackside`,
        text: [
          'Hello,',
          '',
          `${from} invites you ${words.what.replace('{name}', c.collectionName)}`,
          '',
          'Open this link to accept (it works once, within a week):',
          '',
          deps.publicUrl(`/join?token=${token}`),
          '',
          `If you do not know ${from}, ignore this e-mail: nothing happens unless you accept.`,
        ].join('\n'),
      });
    });
  }

  return {
    /** A new, empty collection owned by the person who starts it (sign-up makes the first). */
    async create(userId: string, values: { name: string; timeZone: string }) {
      const mine = await listMembershipsOfUser(db, userId);
      if (mine.length >= MAX_MEMBERSHIPS)
        throw new HttpError(
          409,
          'too_many_collections',
          `You belong to ${MAX_MEMBERSHIPS} collections already. Delete or leave one first.`,
        );
      const id = await db.transaction(async (tx) => {
        const collectionId = await insertCollection(tx, values);
        await insertMembership(tx, { collectionId, userId, role: 'owner' });
        return collectionId;
      });
      return { id, name: values.name, timeZone: values.timeZone, role: 'owner' as const };
    },

    /** The members, and the keeper and co-owner invites still waiting for an answer. */
    async members(collectionId: string) {
      const now = deps.now();
      const rows = await listMembers(db, collectionId);
      const waiting = await listPendingMemberInvites(
        db,
        collectionId,
        new Date(now.getTime() - EXPIRED_SHOWN_MS),
      );
      return {
        members: rows.map((m) => ({
          ...m,
          startsAt: m.startsAt?.toISOString() ?? null,
          endsAt: m.endsAt?.toISOString() ?? null,
        })),
        invites: waiting.map((i) => ({
          id: i.id,
          email: i.email,
          role: i.role === 'owner' ? ('owner' as const) : ('keeper' as const),
          sentAt: i.sentAt.toISOString(),
          expiresAt: i.expiresAt.toISOString(),
          expired: i.expiresAt <= now,
        })),
      };
    },

    /**
     * Invites someone to keep the collection, or a partner to own it too: they join only by
     * accepting the e-mailed link, never by being added. The same work and answer whether or
     * not the address has an account (docs/decisions/012-same-answer-for-every-email.md); the
     * e-mail goes after the answer.
     */
    async invite(
      c: MemberCollection,
      invitedBy: string,
      body: { email: string; role: MemberInviteRole },
    ) {
      const role = await roleOfEmail(db, c.collectionId, body.email);
      // The owner can see the member list anyway: this tells them nothing new. A keeper may be
      // invited to co-own (they accept or not); nobody is invited to a role they already hold.
      if (role === 'owner' || (role === 'keeper' && body.role === 'keeper'))
        throw new HttpError(
          409,
          'already_member',
          role === 'owner'
            ? 'That person already owns this collection.'
            : 'That person already keeps this collection. Invite them as co-owner instead if they should own it too.',
        );
      const { token, tokenHash } = newInviteToken();
      const now = deps.now();
      await insertMemberInvite(db, {
        collectionId: c.collectionId,
        email: body.email,
        role: body.role,
        tokenHash,
        expiresAt: new Date(now.getTime() + INVITE_LIFETIME_MS),
        invitedBy,
        createdAt: now,
      });
      mailInvite(c, invitedBy, body.email, body.role, token);
      return {
        message: `We have e-mailed an invite to ${body.email}. They join when they accept it.`,
      };
    },

    /** A new link for an unanswered invite (the earlier one stops working), valid a week again. */
    async resendInvite(c: MemberCollection, invitedBy: string, inviteId: string) {
      const invite = await findPendingMemberInvite(db, c.collectionId, inviteId);
      if (!invite) throw inviteNotFound();
      const { token, tokenHash } = newInviteToken();
      const now = deps.now();
      if (
        !(await renewMemberInvite(db, invite.id, {
          tokenHash,
          expiresAt: new Date(now.getTime() + INVITE_LIFETIME_MS),
          createdAt: now,
        }))
      )
        throw inviteNotFound();
      const role = invite.role === 'owner' ? 'owner' : 'keeper';
      mailInvite(c, invitedBy, invite.email, role, token);
      return {
        message: `We have e-mailed a new invite to ${invite.email}; the earlier link no longer works.`,
      };
    },

    /** Cancels an unanswered invite: its link then says it was cancelled. */
    async revokeInvite(collectionId: string, inviteId: string) {
      const invite = await findPendingMemberInvite(db, collectionId, inviteId);
      if (!invite || !(await revokeMemberInvite(db, invite.id, deps.now()))) throw inviteNotFound();
    },

    /**
     * Removes the collection for everyone: its rows first (one transaction), then its photo
     * files. The typed name guards against deleting the wrong collection by a slip.
     */
    async deleteCollection(c: MemberCollection, confirmName: string) {
      const name = c.collectionName;
      if (confirmName.normalize('NFC') !== name.trim().normalize('NFC')) {
        throw new HttpError(
          422,
          'invalid',
          `Type the collection’s name exactly as it is shown (“${name}”) to delete it.`,
          [{ path: 'body.confirmName', message: 'This is not the collection’s name.' }],
        );
      }
      await deleteCollectionRows(db, c.collectionId);
      await deps.removeFiles(c.collectionId);
    },

    async removeMember(collectionId: string, userId: string, actingUserId: string) {
      if (userId === actingUserId) {
        throw new HttpError(
          409,
          'owner_stays',
          'An owner cannot remove themselves from their own collection.',
        );
      }
      if (!(await deleteMembership(db, collectionId, userId))) {
        throw new HttpError(404, 'not_found', 'That person is not a member of this collection.');
      }
    },

    /**
     * A keeper steps out of someone else's collection; an owner only while a co-owner stays
     * (a collection always has an owner).
     */
    async leave(collectionId: string, userId: string, role: string) {
      if (role === 'owner') {
        if (!(await deleteOwnerMembershipIfOthers(db, collectionId, userId)))
          throw new HttpError(
            409,
            'owner_stays',
            'You are the only owner: invite a co-owner first, or delete the collection.',
          );
        return;
      }
      await deleteMembership(db, collectionId, userId);
    },
  };
}
export type CollectionsService = ReturnType<typeof createCollectionsService>;
