import { randomInt } from 'node:crypto';
import { and, asc, eq, sql } from 'drizzle-orm';
import { generateLabelTag } from '../../../shared/domain/labels/label-payload';
import type { Db } from '../../db/client';
import { collections, memberships } from '../../db/schema/collections';
import { collectionRevisions } from '../../db/schema/rounds';
import { users } from '../../db/schema/users';

const membershipFields = {
  collectionId: collections.id,
  collectionName: collections.name,
  timeZone: collections.timeZone,
  labelTag: collections.labelTag,
  role: memberships.role,
  startsAt: memberships.startsAt,
  endsAt: memberships.endsAt,
};

/**
 * One member's membership, with the collection's change counters read in the same query: a
 * cached round is checked against them with no further round trip (P7).
 */
export async function findMembership(db: Db, collectionId: string, userId: string) {
  const rows = await db
    .select({
      ...membershipFields,
      writesClosedAt: memberships.writesClosedAt,
      revision: {
        records: sql<number>`coalesce(${collectionRevisions.records}, 0)`.mapWith(Number),
        events: sql<number>`coalesce(${collectionRevisions.events}, 0)`.mapWith(Number),
      },
    })
    .from(memberships)
    .innerJoin(collections, eq(collections.id, memberships.collectionId))
    .leftJoin(collectionRevisions, eq(collectionRevisions.collectionId, memberships.collectionId))
    .where(and(eq(memberships.collectionId, collectionId), eq(memberships.userId, userId)))
    .limit(1);
  return rows[0] ?? null;
}
export type Membership = NonNullable<Awaited<ReturnType<typeof findMembership>>>;

export async function listMembershipsOfUser(db: Db, userId: string) {
  return db
    .select(membershipFields)
    .from(memberships)
    .innerJoin(collections, eq(collections.id, memberships.collectionId))
    .where(eq(memberships.userId, userId))
    .orderBy(asc(collections.name));
}

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
 * The role the account with this e-mail holds in a collection, if any — one query whether or
 * not such an account exists, so an invite takes the same time for both.
 */
export async function roleOfEmail(db: Db, collectionId: string, email: string) {
  const [row] = await db
    .select({ role: memberships.role })
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .where(and(eq(memberships.collectionId, collectionId), eq(users.email, email)))
    .limit(1);
  return row?.role ?? null;
}

export async function insertMembership(
  db: Db,
  values: { collectionId: string; userId: string; role: 'owner' | 'keeper' | 'helper'; startsAt?: Date | null; endsAt?: Date | null },
) {
  await db.insert(memberships).values(values);
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

const randomUnit = () => randomInt(2 ** 32) / 2 ** 32;

/** A new collection with a label tag no other collection has (a clash just draws again). */
export async function insertCollection(db: Db, values: { name: string; timeZone: string; rules?: unknown }) {
  for (;;) {
    const [row] = await db
      .insert(collections)
      .values({ ...values, labelTag: generateLabelTag(randomUnit) })
      .onConflictDoNothing({ target: collections.labelTag })
      .returning({ id: collections.id });
    if (row) return row.id;
  }
}
