import type { RequestHandler } from 'express';
import { HttpError } from './errors';

export const CLIENT_HEADER = 'x-rackside-client';
const SAFE = new Set(['GET', 'HEAD', 'OPTIONS']);

/**
 * Cross-site request forgery defence for cookie-authenticated writes (see
 * docs/decisions/002-csrf.md): a write must carry our custom header, which a cross-site
 * form cannot send and a cross-site script could only send after a CORS preflight we
 * never grant; and when the browser names an Origin it must be our own.
 */
export const requireSameSiteWrite: RequestHandler = (req, _res, next) => {
  if (SAFE.has(req.method)) return next();
  if (req.get(CLIENT_HEADER) !== '1') {
    return next(new HttpError(403, 'csrf', 'This request did not come from the Rackside app.'));
  }
  const origin = req.get('origin');
  if (origin) {
    let host: string;
    try {
      host = new URL(origin).host;
    } catch {
      return next(new HttpError(403, 'csrf', 'This request came from another site.'));
    }
    if (host !== req.get('host')) {
      return next(new HttpError(403, 'csrf', 'This request came from another site.'));
    }
  }
  next();
};
