import pino, { type DestinationStream } from 'pino';
import type { Env } from './env';
import { redactError, REDACTED } from './log-redaction';

/**
 * JSON lines on stdout (or `destination`, for tests that read the log). Every error goes
 * through redactError; the request logger (server/app.ts) redacts headers and queries, and
 * the paths here catch a cookie or authorisation header logged any other way.
 */
export function createLogger(
  env: Pick<Env, 'LOG_LEVEL' | 'NODE_ENV'>,
  destination?: DestinationStream,
) {
  const options: pino.LoggerOptions = {
    level: env.LOG_LEVEL ?? (env.NODE_ENV === 'test' ? 'silent' : 'info'),
    serializers: { err: redactError },
    redact: {
      paths: [
        'headers.cookie',
        'headers.authorization',
        'headers["set-cookie"]',
        '*.headers.cookie',
        '*.headers.authorization',
        '*.headers["set-cookie"]',
        '*.headers["proxy-authorization"]',
      ],
      censor: REDACTED,
    },
  };
  return destination ? pino(options, destination) : pino(options);
}
export type Logger = ReturnType<typeof createLogger>;
