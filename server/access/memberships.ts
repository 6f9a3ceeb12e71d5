import { and, asc, eq, sql } from 'drizzle-orm';
import type pg from 'pg';
import type { Db } from '../db/client';
import { collections, memberships } from '../db/schema/collections';
import { collectionRevisions } from '../db/schema/rounds';
import { users } from '../db/schema/users';

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

/**
 * A signed-in session (unexpired, as the session store reads it) and its user's membership in
 * a collection, with the collection's change counters, in one prepared query by primary keys:
 * the hot read of today's round checks both with one round trip (P7). Nothing is cached, so a
 * sign-out, a removed member or an ended cover counts from the next request on.
 */
export async function findSessionMembership(
  pool: pg.Pool,
  sid: string,
  collectionId: string,
): Promise<(Membership & { userId: string; signedInAt: number | undefined }) | null> {
  const { rows } = await pool.query<{
    user_id: string;
    signed_in_at: string | null;
    collection_name: string;
    time_zone: string;
    label_tag: string;
    role: Membership['role'];
    starts_at: Date | null;
    ends_at: Date | null;
    writes_closed_at: Date | null;
    records: string;
    events: string;
  }>({
    name: 'session-membership',
    text: `select m.user_id, s.sess ->> 'signedInAt' as signed_in_at, c.name as collection_name,
                  c.time_zone, c.label_tag, m.role, m.starts_at, m.ends_at, m.writes_closed_at,
                  coalesce(r.records, 0) as records, coalesce(r.events, 0) as events
           from sessions s
           join memberships m on m.collection_id = $2::uuid and m.user_id = (s.sess ->> 'userId')::uuid
           join collections c on c.id = m.collection_id
           left join collection_revisions r on r.collection_id = m.collection_id
           where s.sid = $1 and s.expire >= to_timestamp($3)`,
    // The session store's own clock and test (connect-pg-simple: expire >= to_timestamp(now)).
    values: [sid, collectionId, Math.floor(Date.now() / 1000)],
  });
  const r = rows[0];
  if (!r) return null;
  return {
    userId: r.user_id,
    signedInAt: r.signed_in_at === null ? undefined : Number(r.signed_in_at),
    collectionId,
    collectionName: r.collection_name,
    timeZone: r.time_zone,
    labelTag: r.label_tag,
    role: r.role,
    startsAt: r.starts_at,
    endsAt: r.ends_at,
    writesClosedAt: r.writes_closed_at,
    revision: { records: Number(r.records), events: Number(r.events) },
  };
}

/**
 * The collection as the membership check loaded it: what a service needs to know about the
 * collection of the request (its id, name and zone) without reading it again.
 */
export type MemberCollection = Pick<Membership, 'collectionId' | 'collectionName' | 'timeZone'>;

export async function listMembershipsOfUser(db: Db, userId: string) {
  return db
    .select(membershipFields)
    .from(memberships)
    .innerJoin(collections, eq(collections.id, memberships.collectionId))
    .where(eq(memberships.userId, userId))
    .orderBy(asc(collections.name));
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

/** The role a user holds in a collection, if any. */
export async function roleOfUser(db: Db, collectionId: string, userId: string) {
  const [row] = await db
    .select({ role: memberships.role })
    .from(memberships)
    .where(and(eq(memberships.collectionId, collectionId), eq(memberships.userId, userId)));
  return row?.role ?? null;
}

export async function insertMembership(
  db: Db,
  values: {
    collectionId: string;
    userId: string;
    role: 'owner' | 'keeper' | 'helper';
    startsAt?: Date | null;
    endsAt?: Date | null;
  },
) {
  await db.insert(memberships).values(values);
}

/** Every owner's e-mail address: who a collection's reports go to. */
export async function ownerEmails(db: Db, collectionId: string): Promise<string[]> {
  const rows = await db
    .select({ email: users.email })
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .where(and(eq(memberships.collectionId, collectionId), eq(memberships.role, 'owner')));
  return rows.map((r) => r.email);
}
