import { rateLimit, type ClientRateLimitInfo, type Options, type Store } from 'express-rate-limit';
import type pg from 'pg';
import { HttpError } from './errors';

/**
 * express-rate-limit's counters in PostgreSQL, so a limit holds across every server process
 * (docs/decisions/010-production.md). One row per key and window; the database clock decides
 * when a window ends, so processes with drifting clocks agree.
 */
export class PgRateLimitStore implements Store {
  readonly localKeys = false;
  private windowMs = 60_000;

  constructor(
    private readonly pool: pg.Pool,
    readonly prefix: string,
  ) {}

  init(options: Options) {
    this.windowMs = options.windowMs;
  }

  async get(key: string): Promise<ClientRateLimitInfo | undefined> {
    const { rows } = await this.pool.query<{ hits: number; reset_at: Date }>(
      'select hits, reset_at from rate_limits where key = $1 and reset_at > now()',
      [this.prefix + key],
    );
    return rows[0] ? { totalHits: rows[0].hits, resetTime: rows[0].reset_at } : undefined;
  }

  async increment(key: string): Promise<ClientRateLimitInfo> {
    const { rows } = await this.pool.query<{ hits: number; reset_at: Date }>(
      `insert into rate_limits (key, hits, reset_at) values ($1, 1, now() + make_interval(secs => $2::double precision / 1000))
       on conflict (key) do update set
         hits = case when rate_limits.reset_at <= now() then 1 else rate_limits.hits + 1 end,
         reset_at = case when rate_limits.reset_at <= now() then excluded.reset_at else rate_limits.reset_at end
       returning hits, reset_at`,
      [this.prefix + key, this.windowMs],
    );
    // Now and then, sweep windows that ended long ago so the table stays small.
    if (Math.random() < 0.01)
      void this.pool
        .query("delete from rate_limits where reset_at < now() - interval '1 day'")
        .catch(() => undefined);
    return { totalHits: rows[0]!.hits, resetTime: rows[0]!.reset_at };
  }

  async decrement(key: string): Promise<void> {
    await this.pool.query(
      'update rate_limits set hits = greatest(hits - 1, 0) where key = $1 and reset_at > now()',
      [this.prefix + key],
    );
  }

  async resetKey(key: string): Promise<void> {
    await this.pool.query('delete from rate_limits where key = $1', [this.prefix + key]);
  }
}

export type Limiter = (name: string, options: Partial<Options>) => ReturnType<typeof rateLimit>;

/** Rate limits whose counters live in PostgreSQL and whose refusal is our JSON error. */
export function createLimiter(pool: pg.Pool): Limiter {
  return (name, options) =>
    rateLimit({
      standardHeaders: 'draft-8',
      legacyHeaders: false,
      store: new PgRateLimitStore(pool, `${name}:`),
      handler: (_req, _res, next, opts) => {
        const minutes = Math.ceil(opts.windowMs / 60_000);
        next(
          new HttpError(
            429,
            'rate_limited',
            `Too many attempts. Wait up to ${minutes} minutes and try again.`,
          ),
        );
      },
      ...options,
    });
}
