import type { Request } from 'express';
import type pg from 'pg';
import { coverWindowState, roleAtLeast, type Role } from '#shared/domain/roles';
import { uuid } from '#shared/schemas/common';
import { findSessionMembership, type Membership } from '../access/memberships';
import { pastAbsoluteTimeout, signedSessionId, type SessionStore } from '../sessions';

/**
 * The session and membership checks of `sessions()` + `requireUser` + `requireMember` in one
 * query, for a hot read (P7): the membership when every check passes, otherwise null — and the
 * caller then hands the request to the full stack, which gives the refusal (401, 403, 404) its
 * usual answer. Also null when the session's idle expiry is due a refresh: the full stack does
 * that (and sends the cookie again), so a session read only here still rolls.
 */
export function sessionMemberCheck(
  pool: pg.Pool,
  secret: string,
  store: SessionStore,
  now: () => Date,
) {
  return async (
    req: Request,
    minimum: Role,
    // anyTime: the route judges a helper's cover window itself (as `member(…, { anyTime })`).
    options: { anyTime?: boolean } = {},
  ): Promise<(Membership & { userId: string }) | null> => {
    const sid = signedSessionId(req.headers.cookie, secret);
    if (!sid || store.touchDue(sid)) return null;
    const id = uuid.safeParse(req.params.collectionId);
    if (!id.success) return null;
    const m = await findSessionMembership(pool, sid, id.data).catch(() => null);
    if (!m || pastAbsoluteTimeout(m.signedInAt)) return null;
    if (
      m.role === 'helper' &&
      !options.anyTime &&
      coverWindowState(now(), m.startsAt, m.endsAt) !== 'during'
    )
      return null;
    return roleAtLeast(m.role, minimum) ? m : null;
  };
}
export type SessionMemberCheck = ReturnType<typeof sessionMemberCheck>;
