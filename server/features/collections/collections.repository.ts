import { and, asc, eq, gt, isNull } from 'drizzle-orm';
import type { Db } from '../../db/client';
import { collections, invites, memberships } from '../../db/schema/collections';
import { collectionRevisions } from '../../db/schema/rounds';
import { users } from '../../db/schema/users';

// Kept for events.service, which still imports the type from here: remove once it imports
// it from server/access/memberships (the events rewrite does).

export async function listMembers(db: Db, collectionId: string) {
  return db
    .select({
      userId: users.id,
      displayName: users.displayName,
      email: users.email,
      role: memberships.role,
      startsAt: memberships.startsAt,
      endsAt: memberships.endsAt,
    })
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .where(eq(memberships.collectionId, collectionId))
    .orderBy(asc(users.displayName));
}

/** Keeper invites not yet accepted and still usable, oldest first. */
export async function listOpenKeeperInvites(db: Db, collectionId: string, now: Date) {
  return db
    .select({
      id: invites.id,
      email: invites.email,
      sentAt: invites.createdAt,
      expiresAt: invites.expiresAt,
    })
    .from(invites)
    .where(
      and(
        eq(invites.collectionId, collectionId),
        eq(invites.role, 'keeper'),
        isNull(invites.acceptedAt),
        gt(invites.expiresAt, now),
      ),
    )
    .orderBy(asc(invites.createdAt));
}

export async function insertKeeperInvite(
  db: Db,
  values: {
    collectionId: string;
    email: string;
    tokenHash: string;
    expiresAt: Date;
    invitedBy: string;
  },
) {
  await db.insert(invites).values({ ...values, role: 'keeper' });
}

export async function deleteMembership(db: Db, collectionId: string, userId: string) {
  const removed = await db
    .delete(memberships)
    .where(and(eq(memberships.collectionId, collectionId), eq(memberships.userId, userId)))
    .returning({ id: memberships.id });
  return removed.length > 0;
}

/**
 * The collection and everything in it: its rows cascade (memberships, invites, places, animals,
 * events, rounds, notes, sacs, reports). Its change counters have no foreign key (the triggers
 * bump them while the cascade runs), so they go last, in the same transaction.
 */
export async function deleteCollectionRows(db: Db, collectionId: string) {
  await db.transaction(async (tx) => {
    await tx.delete(collections).where(eq(collections.id, collectionId));
    await tx.delete(collectionRevisions).where(eq(collectionRevisions.collectionId, collectionId));
  });
}
