import type { RequestHandler, Response } from 'express';
import { coverWindowMessage, coverWindowState, roleAtLeast, type Role } from '#shared/domain/roles';
import { uuid } from '#shared/schemas/common';
import { findMembership, type Membership } from '../access/memberships';
import type { Db } from '../db/client';
import { currentUserId } from './auth';
import { HttpError } from './errors';

/**
 * The one membership check for /api/collections/:collectionId/…: a non-member learns nothing
 * (404), a lower role is refused (403), and a helper only passes inside the cover window
 * (unless the route checks the window itself).
 */
export function requireMember(
  db: Db,
  minimum: Role,
  now: () => Date,
  options: { anyTime?: boolean } = {},
): RequestHandler {
  return async (req, res, next) => {
    const userId = currentUserId(req);
    const id = uuid.safeParse(req.params.collectionId);
    const membership = id.success ? await findMembership(db, id.data, userId) : null;
    if (!membership) throw new HttpError(404, 'not_found', 'We could not find that collection.');
    // anyTime: the route judges the window itself, e.g. sync checks each event's own time.
    if (
      membership.role === 'helper' &&
      !options.anyTime &&
      coverWindowState(now(), membership.startsAt, membership.endsAt) !== 'during'
    ) {
      throw new HttpError(403, 'cover_not_running', coverWindowMessage(membership, now()));
    }
    if (!roleAtLeast(membership.role, minimum)) {
      throw new HttpError(403, 'forbidden', 'Your role in this collection does not allow this.');
    }
    res.locals.membership = membership;
    next();
  };
}

export function membershipOf(res: Response): Membership {
  return res.locals.membership as Membership;
}
