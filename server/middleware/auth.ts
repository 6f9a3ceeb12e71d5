import type { RequestHandler } from 'express';
import { HttpError } from './errors';

/** Refuses requests without a signed-in session; the session's user id is then trusted. */
export const requireUser: RequestHandler = (req, _res, next) => {
  if (!req.session?.userId) {
    return next(new HttpError(401, 'signed_out', 'Please sign in.'));
  }
  next();
};

export function currentUserId(req: { session: { userId?: string } }): string {
  const id = req.session.userId;
  if (!id) throw new HttpError(401, 'signed_out', 'Please sign in.');
  return id;
}
