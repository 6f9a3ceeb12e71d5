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
  insertKeeperInvite,
  listMembers,
  listOpenKeeperInvites,
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

export function createCollectionsService(db: Db, deps: Deps) {
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

    /** The members, and the keeper invites still waiting for an answer. */
    async members(collectionId: string) {
      const rows = await listMembers(db, collectionId);
      const waiting = await listOpenKeeperInvites(db, collectionId, deps.now());
      return {
        members: rows.map((m) => ({
          ...m,
          startsAt: m.startsAt?.toISOString() ?? null,
          endsAt: m.endsAt?.toISOString() ?? null,
        })),
        invites: waiting.map((i) => ({
          id: i.id,
          email: i.email,
          sentAt: i.sentAt.toISOString(),
          expiresAt: i.expiresAt.toISOString(),
        })),
      };
    },

    /**
     * Invites someone to keep the collection: they join only by accepting the e-mailed link,
     * never by being added. The same work and answer whether or not the address has an
     * account (docs/decisions/012-same-answer-for-every-email.md); the e-mail goes after the answer.
     */
    async inviteKeeper(c: MemberCollection, invitedBy: string, email: string) {
      const role = await roleOfEmail(db, c.collectionId, email);
      // The owner can see the member list anyway: this tells them nothing new.
      if (role === 'keeper' || role === 'owner')
        throw new HttpError(
          409,
          'already_member',
          'That person is already a member of this collection.',
        );
      const { token, tokenHash } = newInviteToken();
      await insertKeeperInvite(db, {
        collectionId: c.collectionId,
        email,
        tokenHash,
        expiresAt: new Date(deps.now().getTime() + INVITE_LIFETIME_MS),
        invitedBy,
      });
      deps.background.run('keeper invite mail', async () => {
        const from = (await displayNameOf(db, invitedBy)) ?? 'A keeper';
        await deps.mailer.send({
          to: email,
          subject: `${from} invites you to keep ${c.collectionName} on Rackside`,
          text: [
            'Hello,',
            '',
            `${from} invites you to keep the collection ${c.collectionName} with them on Rackside: its feeding rounds, its animals' records and their labels.`,
            '',
            'Open this link to accept (it works once, within a week):',
            '',
            deps.publicUrl(`/join?token=${token}`),
            '',
            `If you do not know ${from}, ignore this e-mail: nothing happens unless you accept.`,
          ].join('\n'),
        });
      });
      return { message: `We have e-mailed an invite to ${email}. They join when they accept it.` };
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

    /** A keeper steps out of someone else's collection; the owner stays with their own. */
    async leave(collectionId: string, userId: string, role: string) {
      if (role === 'owner')
        throw new HttpError(409, 'owner_stays', 'An owner cannot leave their own collection.');
      await deleteMembership(db, collectionId, userId);
    },
  };
}
export type CollectionsService = ReturnType<typeof createCollectionsService>;
