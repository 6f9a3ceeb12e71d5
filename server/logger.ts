import pino from 'pino';
import type { Env } from './env';

export function createLogger(env: Pick<Env, 'LOG_LEVEL' | 'NODE_ENV'>) {
  return pino({ level: env.LOG_LEVEL ?? (env.NODE_ENV === 'test' ? 'silent' : 'info') });
}
export type Logger = ReturnType<typeof createLogger>;
