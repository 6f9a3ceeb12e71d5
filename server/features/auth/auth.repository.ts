import { and, eq, gt, isNull, sql } from 'drizzle-orm';
import type { Db } from '../../db/client';
import { passwordResets, sessions, signUpTokens, users } from '../../db/schema/users';

export async function updatePasswordHash(db: Db, userId: string, passwordHash: string, at: Date) {
  await db.update(users).set({ passwordHash, passwordChangedAt: at }).where(eq(users.id, userId));
}

export async function insertPasswordReset(
  db: Db,
  values: { userId: string; tokenHash: string; expiresAt: Date },
) {
  await db.insert(passwordResets).values(values);
}

/** Marks a live token used and returns its user — atomically, so a token works once. */
export async function consumePasswordReset(db: Db, tokenHash: string, now: Date) {
  const [row] = await db
    .update(passwordResets)
    .set({ usedAt: now })
    .where(
      and(
        eq(passwordResets.tokenHash, tokenHash),
        isNull(passwordResets.usedAt),
        gt(passwordResets.expiresAt, now),
      ),
    )
    .returning({ userId: passwordResets.userId });
  return row?.userId ?? null;
}

export async function insertSignUpToken(
  db: Db,
  values: { email: string; tokenHash: string; expiresAt: Date },
) {
  await db.insert(signUpTokens).values(values);
}

/** The address a live sign-up link was sent to, without using it up. */
export async function findSignUpToken(db: Db, tokenHash: string, now: Date) {
  const [row] = await db
    .select({ email: signUpTokens.email })
    .from(signUpTokens)
    .where(
      and(
        eq(signUpTokens.tokenHash, tokenHash),
        isNull(signUpTokens.usedAt),
        gt(signUpTokens.expiresAt, now),
      ),
    )
    .limit(1);
  return row?.email ?? null;
}

/** Marks a live sign-up link used and returns its address — atomically, so it works once. */
export async function consumeSignUpToken(db: Db, tokenHash: string, now: Date) {
  const [row] = await db
    .update(signUpTokens)
    .set({ usedAt: now })
    .where(
      and(
        eq(signUpTokens.tokenHash, tokenHash),
        isNull(signUpTokens.usedAt),
        gt(signUpTokens.expiresAt, now),
      ),
    )
    .returning({ email: signUpTokens.email });
  return row?.email ?? null;
}

/** Every outstanding reset link of a user stops working (after a password change or reset). */
export async function revokePasswordResets(db: Db, userId: string, now: Date) {
  await db
    .update(passwordResets)
    .set({ usedAt: now })
    .where(and(eq(passwordResets.userId, userId), isNull(passwordResets.usedAt)));
}

/** Signs a user out everywhere (after a password reset or change), except one session. */
export async function deleteSessionsOfUser(db: Db, userId: string, keepSid?: string) {
  await db
    .delete(sessions)
    .where(
      keepSid
        ? sql`${sessions.sess}->>'userId' = ${userId} and ${sessions.sid} <> ${keepSid}`
        : sql`${sessions.sess}->>'userId' = ${userId}`,
    );
}

/** Whether any account exists (the first-owner set-up is open only before the first). */
export async function anyUserExists(db: Db) {
  const rows = await db
    .select({ one: sql`1` })
    .from(users)
    .limit(1);
  return rows.length > 0;
}

/** Serialises first-owner set-ups until the transaction ends: two at once make one owner. */
export async function lockFirstOwnerSetUp(db: Db) {
  await db.execute(sql`select pg_advisory_xact_lock(hashtext('rackside.first-owner'))`);
}
