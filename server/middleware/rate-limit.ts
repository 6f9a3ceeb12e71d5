import { rateLimit, type Options } from 'express-rate-limit';
import { HttpError } from './errors';

/** A rate limit whose refusal is our JSON error with a readable wait. */
export function limiter(options: Partial<Options>) {
  return rateLimit({
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    handler: (_req, _res, next, opts) => {
      const minutes = Math.ceil(opts.windowMs / 60_000);
      next(new HttpError(429, 'rate_limited', `Too many attempts. Wait up to ${minutes} minutes and try again.`));
    },
    ...options,
  });
}
