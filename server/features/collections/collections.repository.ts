import { and, asc, eq, gt, inArray, isNull } from 'drizzle-orm';
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

/**
 * Keeper and co-owner invites not yet answered nor cancelled, oldest first: those still usable
 * and those expired in the last `expiredWithin` (the owner may send them again or cancel them).
 */
export async function listPendingMemberInvites(db: Db, collectionId: string, expiredSince: Date) {
  return db
    .select({
      id: invites.id,
      email: invites.email,
      role: invites.role,
      sentAt: invites.createdAt,
      expiresAt: invites.expiresAt,
    })
    .from(invites)
    .where(
      and(
        eq(invites.collectionId, collectionId),
        inArray(invites.role, ['keeper', 'owner']),
        isNull(invites.acceptedAt),
        isNull(invites.revokedAt),
        gt(invites.expiresAt, expiredSince),
      ),
    )
    .orderBy(asc(invites.createdAt));
}

export async function insertMemberInvite(
  db: Db,
  values: {
    collectionId: string;
    email: string;
    role: 'keeper' | 'owner';
    tokenHash: string;
    expiresAt: Date;
    invitedBy: string;
    createdAt: Date;
  },
) {
  await db.insert(invites).values(values);
}

/** A keeper's or co-owner's invite of this collection still waiting for an answer. */
export async function findPendingMemberInvite(db: Db, collectionId: string, inviteId: string) {
  const [row] = await db
    .select({ id: invites.id, email: invites.email, role: invites.role })
    .from(invites)
    .where(
      and(
        eq(invites.id, inviteId),
        eq(invites.collectionId, collectionId),
        inArray(invites.role, ['keeper', 'owner']),
        isNull(invites.acceptedAt),
        isNull(invites.revokedAt),
      ),
    );
  return row ?? null;
}

/** Cancels an unanswered invite; false when it was answered or cancelled meanwhile. */
export async function revokeMemberInvite(db: Db, inviteId: string, at: Date) {
  const done = await db
    .update(invites)
    .set({ revokedAt: at })
    .where(and(eq(invites.id, inviteId), isNull(invites.acceptedAt), isNull(invites.revokedAt)))
    .returning({ id: invites.id });
  return done.length > 0;
}

/**
 * A new link for an unanswered invite: the old token's hash is replaced, so the earlier e-mail's
 * link stops working. False when the invite was answered or cancelled meanwhile.
 */
export async function renewMemberInvite(
  db: Db,
  inviteId: string,
  values: { tokenHash: string; expiresAt: Date; createdAt: Date },
) {
  const done = await db
    .update(invites)
    .set(values)
    .where(and(eq(invites.id, inviteId), isNull(invites.acceptedAt), isNull(invites.revokedAt)))
    .returning({ id: invites.id });
  return done.length > 0;
}

/**
 * An owner steps out, only while another owner stays: the owners' rows are locked first, so
 * two co-owners leaving at once cannot both go. False when they are the only owner.
 */
export async function deleteOwnerMembershipIfOthers(db: Db, collectionId: string, userId: string) {
  return db.transaction(async (tx) => {
    const owners = await tx
      .select({ userId: memberships.userId })
      .from(memberships)
      .where(and(eq(memberships.collectionId, collectionId), eq(memberships.role, 'owner')))
      .for('update');
    if (owners.length <= 1 || !owners.some((o) => o.userId === userId)) return false;
    return deleteMembership(tx, collectionId, userId);
  });
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
