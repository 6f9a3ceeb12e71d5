import { and, desc, eq, gte, inArray, isNull, sql } from 'drizzle-orm';
import type { Db } from '../../db/client';
import { events } from '../../db/schema/animals';
import { collections, coverReports, invites, memberships } from '../../db/schema/collections';
import { users } from '../../db/schema/users';

export type InviteRow = typeof invites.$inferSelect;

// --- Covers: an owner's helper invites and the memberships they grant.

export async function insertCoverInvite(
  db: Db,
  values: {
    collectionId: string;
    email: string;
    tokenHash: string;
    message: string | null;
    startsAt: Date;
    endsAt: Date;
    expiresAt: Date;
    invitedBy: string;
  },
) {
  const [row] = await db
    .insert(invites)
    .values({ ...values, role: 'helper' })
    .returning({ id: invites.id });
  return row!.id;
}

/**
 * A collection's covers, newest first, with the helper who accepted, when they read the safety
 * notes and the cover's end summary, if made.
 */
export async function listCoverInvites(db: Db, collectionId: string) {
  return db
    .select({
      invite: invites,
      helperName: users.displayName,
      ack: memberships.safetyAcknowledgedAt,
      summaryId: coverReports.id,
    })
    .from(invites)
    .leftJoin(users, eq(users.id, invites.acceptedBy))
    .leftJoin(coverReports, eq(coverReports.coverId, invites.id))
    .leftJoin(
      memberships,
      and(
        eq(memberships.collectionId, invites.collectionId),
        eq(memberships.userId, invites.acceptedBy),
      ),
    )
    .where(and(eq(invites.collectionId, collectionId), eq(invites.role, 'helper')))
    .orderBy(desc(invites.startsAt));
}

export async function findCoverInvite(db: Db, collectionId: string, coverId: string) {
  const [row] = await db
    .select()
    .from(invites)
    .where(
      and(
        eq(invites.id, coverId),
        eq(invites.collectionId, collectionId),
        eq(invites.role, 'helper'),
      ),
    );
  return row ?? null;
}

export async function updateInvite(
  db: Db,
  inviteId: string,
  values: {
    startsAt?: Date;
    endsAt?: Date;
    expiresAt?: Date;
    message?: string | null;
    tokenHash?: string;
  },
) {
  await db.update(invites).set(values).where(eq(invites.id, inviteId));
}

/** A helper's window (and whether their late taps may still land) follows their cover's. */
export async function updateHelperMembership(
  db: Db,
  collectionId: string,
  userId: string,
  values: { startsAt?: Date; endsAt: Date; writesClosedAt: Date | null },
) {
  await db
    .update(memberships)
    .set(values)
    .where(
      and(
        eq(memberships.collectionId, collectionId),
        eq(memberships.userId, userId),
        eq(memberships.role, 'helper'),
      ),
    );
}

// --- Invite links (helper and keeper invites alike).

export async function findInviteByTokenHash(db: Db, tokenHash: string) {
  const [row] = await db.select().from(invites).where(eq(invites.tokenHash, tokenHash));
  return row ?? null;
}

/** The name and zone of an invite's collection (the link's holder is not a member yet). */
export async function collectionOfInvite(db: Db, collectionId: string) {
  const [row] = await db
    .select({ name: collections.name, timeZone: collections.timeZone })
    .from(collections)
    .where(eq(collections.id, collectionId));
  return row ?? null;
}

/** Marks a live invite accepted; false when another use of the link got there first. */
export async function claimInvite(db: Db, inviteId: string, userId: string, at: Date) {
  const claimed = await db
    .update(invites)
    .set({ acceptedAt: at, acceptedBy: userId })
    .where(and(eq(invites.id, inviteId), isNull(invites.acceptedAt)))
    .returning({ id: invites.id });
  return claimed.length > 0;
}

/** The membership an accepted invite grants, replacing a helper's earlier one. */
export async function grantMembership(
  db: Db,
  collectionId: string,
  userId: string,
  grant: { role: 'owner' | 'keeper' | 'helper'; startsAt: Date | null; endsAt: Date | null },
) {
  await db
    .insert(memberships)
    .values({ collectionId, userId, ...grant })
    .onConflictDoUpdate({
      target: [memberships.collectionId, memberships.userId],
      set: { ...grant, writesClosedAt: null, safetyAcknowledgedAt: null },
    });
}

// --- The helper's own cover.

export async function deleteHelperMembership(db: Db, collectionId: string, userId: string) {
  await db
    .delete(memberships)
    .where(
      and(
        eq(memberships.collectionId, collectionId),
        eq(memberships.userId, userId),
        eq(memberships.role, 'helper'),
      ),
    );
}

export async function setSafetyAcknowledged(
  db: Db,
  collectionId: string,
  userId: string,
  at: Date,
) {
  await db
    .update(memberships)
    .set({ safetyAcknowledgedAt: at })
    .where(and(eq(memberships.collectionId, collectionId), eq(memberships.userId, userId)));
}

export async function safetyAcknowledgedAt(db: Db, collectionId: string, userId: string) {
  const [row] = await db
    .select({ ack: memberships.safetyAcknowledgedAt })
    .from(memberships)
    .where(and(eq(memberships.collectionId, collectionId), eq(memberships.userId, userId)));
  return row?.ack ?? null;
}

/** The owner's message on the cover this helper accepted last. */
export async function acceptedInviteMessage(db: Db, collectionId: string, userId: string) {
  const [row] = await db
    .select({ message: invites.message })
    .from(invites)
    .where(and(eq(invites.collectionId, collectionId), eq(invites.acceptedBy, userId)))
    .orderBy(desc(invites.acceptedAt))
    .limit(1);
  return row?.message ?? null;
}

/** What happened to these animals since `since`, newest first, undos left out. */
export async function recentEventsOf(
  db: Db,
  collectionId: string,
  animalIds: string[],
  since: Date,
) {
  return db
    .select({
      animalId: events.animalId,
      kind: events.kind,
      at: events.effectiveAt,
      by: users.displayName,
    })
    .from(events)
    .leftJoin(users, eq(users.id, events.recordedBy))
    .where(
      and(
        eq(events.collectionId, collectionId),
        inArray(events.animalId, animalIds),
        gte(events.effectiveAt, since),
        sql`${events.kind} <> 'void'`,
      ),
    )
    .orderBy(desc(events.effectiveAt));
}
