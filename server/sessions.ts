// Sessions for people signed in on their own phone for weeks (docs/decisions/003-sessions.md),
// kept in PostgreSQL so every server process knows them.
import connectPgSimple from 'connect-pg-simple';
import { unsign } from 'cookie-signature';
import type { RequestHandler } from 'express';
import session from 'express-session';
import type pg from 'pg';
import type { Env } from './env';
import { HttpError } from './middleware/errors';

export const SESSION_IDLE_MS = 30 * 24 * 60 * 60 * 1000;
export const SESSION_ABSOLUTE_MS = 90 * 24 * 60 * 60 * 1000;
export const SESSION_COOKIE = 'rackside.sid';
/** How often a request may push a session's idle expiry forward in the database. */
export const SESSION_TOUCH_EVERY_MS = 10 * 60 * 1000;

const PgStore = connectPgSimple(session);

/**
 * A rolling session would be written back on every request (an UPDATE per round read); its
 * 30-day idle expiry only needs refreshing now and then (P7, decision 010).
 */
class ThrottledTouchStore extends PgStore {
  private readonly touchedAt = new Map<string, number>();

  constructor(
    options: ConstructorParameters<typeof PgStore>[0],
    private readonly now: () => Date,
  ) {
    super(options);
  }

  /** Whether a request on this session should push its idle expiry forward now. */
  touchDue(sid: string): boolean {
    return this.now().getTime() - (this.touchedAt.get(sid) ?? 0) >= SESSION_TOUCH_EVERY_MS;
  }

  override touch(sid: string, sess: session.SessionData, done?: (err?: unknown) => void) {
    const at = this.now().getTime();
    if (at - (this.touchedAt.get(sid) ?? 0) < SESSION_TOUCH_EVERY_MS) return done?.();
    if (this.touchedAt.size > 50_000) this.touchedAt.clear();
    this.touchedAt.set(sid, at);
    super.touch(sid, sess, done);
  }
}

export function createSessionStore(pool: pg.Pool, env: Env, now: () => Date) {
  return new ThrottledTouchStore(
    {
      pool,
      tableName: 'sessions',
      createTableIfMissing: false,
      pruneSessionInterval: env.NODE_ENV === 'test' ? false : 15 * 60,
    },
    now,
  );
}
export type SessionStore = ReturnType<typeof createSessionStore>;

const SESSION_COOKIE_VALUE = /(?:^|;\s*)rackside\.sid=([^;]*)/;

/**
 * The session id a request's signed session cookie carries, checked with the signature library
 * express-session itself uses (cookie-signature's `unsign`); null when absent or not ours.
 */
export function signedSessionId(cookieHeader: string | undefined, secret: string): string | null {
  const m = SESSION_COOKIE_VALUE.exec(cookieHeader ?? '');
  if (!m) return null;
  let raw: string;
  try {
    raw = decodeURIComponent(m[1]!.trim());
  } catch {
    return null;
  }
  if (!raw.startsWith('s:')) return null;
  const sid = unsign(raw.slice(2), secret);
  return sid === false ? null : sid;
}

/** Whether a session began too long ago to be used (the absolute timeout below). */
export const pastAbsoluteTimeout = (signedInAt: number | undefined) =>
  !signedInAt || Date.now() - signedInAt > SESSION_ABSOLUTE_MS;

/** The session cookie, then the absolute timeout: a sign-in ends 90 days after it began. */
export function sessions(env: Env, store: SessionStore): RequestHandler[] {
  const absoluteTimeout: RequestHandler = (req, _res, next) => {
    const began = req.session.signedInAt;
    if (req.session.userId && pastAbsoluteTimeout(began)) {
      return req.session.destroy(() =>
        next(
          new HttpError(401, 'session_expired', 'Your sign-in has expired. Please sign in again.'),
        ),
      );
    }
    next();
  };
  return [
    session({
      name: SESSION_COOKIE,
      secret: env.SESSION_SECRET,
      store,
      resave: false,
      saveUninitialized: false,
      rolling: true,
      cookie: {
        httpOnly: true,
        sameSite: 'lax',
        secure: env.COOKIE_SECURE === 'auto' ? 'auto' : env.COOKIE_SECURE === 'true',
        maxAge: SESSION_IDLE_MS,
      },
    }),
    absoluteTimeout,
  ];
}
