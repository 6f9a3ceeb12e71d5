import type { RequestHandler, Response } from 'express';
import { describeLocalDate, localDateOf } from '../../shared/domain/local-dates';
import { coverWindowState, roleAtLeast, type Role } from '../../shared/domain/roles';
import { uuid } from '../../shared/schemas/common';
import type { Db } from '../db/client';
import { findMembership, type Membership } from '../features/collections/collections.repository';
import { currentUserId } from './auth';
import { HttpError } from './errors';

export function coverMessage(m: Membership): string {
  const first = m.startsAt ? describeLocalDate(localDateOf(m.startsAt, m.timeZone), true) : null;
  // endsAt is the first instant after the cover: the last covered day is the one before it.
  const last = m.endsAt
    ? describeLocalDate(localDateOf(new Date(m.endsAt.getTime() - 1), m.timeZone), true)
    : null;
  if (first && last) return `Your cover for ${m.collectionName} runs from ${first} to ${last}.`;
  if (first) return `Your cover for ${m.collectionName} starts on ${first}.`;
  return `Your cover for ${m.collectionName} ended on ${last}.`;
}

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
      throw new HttpError(403, 'cover_not_running', coverMessage(membership));
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
