import type { NodePgDatabase } from 'drizzle-orm/node-postgres';
import { HttpError } from '../../middleware/errors';
import { findUserByEmail } from '../auth/auth.repository';
import { deleteCollectionRows, deleteMembership, findMembership, insertMembership, listMembers } from './collections.repository';

export function createCollectionsService(db: NodePgDatabase, deps: { removeFiles(collectionId: string): Promise<void> }) {
  return {
    async members(collectionId: string) {
      const rows = await listMembers(db, collectionId);
      return rows.map((m) => ({ ...m, startsAt: m.startsAt?.toISOString() ?? null, endsAt: m.endsAt?.toISOString() ?? null }));
    },

    /** Adds an existing account as a keeper; helpers join through a cover invite instead. */
    async addKeeper(collectionId: string, email: string) {
      const user = await findUserByEmail(db, email);
      if (!user) {
        throw new HttpError(404, 'no_account', 'Nobody has a Rackside account with that e-mail yet. Ask them to sign up first.');
      }
      if (await findMembership(db, collectionId, user.id)) {
        throw new HttpError(409, 'already_member', 'That person is already a member of this collection.');
      }
      await insertMembership(db, { collectionId, userId: user.id, role: 'keeper' });
    },

    /**
     * Removes the collection for everyone: its rows first (one transaction), then its photo
     * files. The typed name guards against deleting the wrong collection by a slip.
     */
    async deleteCollection(collectionId: string, name: string, confirmName: string) {
      if (confirmName.normalize('NFC') !== name.trim().normalize('NFC')) {
        throw new HttpError(422, 'invalid', `Type the collection’s name exactly as it is shown (“${name}”) to delete it.`, [{ path: 'body.confirmName', message: 'This is not the collection’s name.' }]);
      }
      await deleteCollectionRows(db, collectionId);
      await deps.removeFiles(collectionId);
    },

    async removeMember(collectionId: string, userId: string, actingUserId: string) {
      if (userId === actingUserId) {
        throw new HttpError(409, 'owner_stays', 'An owner cannot remove themselves from their own collection.');
      }
      if (!(await deleteMembership(db, collectionId, userId))) {
        throw new HttpError(404, 'not_found', 'That person is not a member of this collection.');
      }
    },
  };
}
export type CollectionsService = ReturnType<typeof createCollectionsService>;
