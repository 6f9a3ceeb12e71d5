import { z } from 'zod';

const flag = z
  .enum(['true', 'false', '1', '0', 'yes', 'no'])
  .transform((v) => v === 'true' || v === '1' || v === 'yes');

export const envSchema = z.object({
  NODE_ENV: z.enum(['development', 'test', 'production']).default('development'),
  HOST: z.string().default('127.0.0.1'),
  PORT: z.coerce.number().int().min(0).max(65535).default(3000),
  DATABASE_URL: z.string().url({ message: 'DATABASE_URL must be a postgres:// URL.' }),
  SESSION_SECRET: z.string().min(32, { message: 'SESSION_SECRET must be at least 32 characters.' }),
  PUBLIC_URL: z.string().url().optional(),
  SMTP_URL: z.string().url().optional(),
  MAIL_FROM: z.string().default('Rackside <no-reply@rackside.invalid>'),
  DEMO_MODE: flag.default(false),
  // Express "trust proxy": set it (e.g. "loopback" or "1") behind an HTTPS reverse proxy.
  TRUST_PROXY: z.string().optional(),
  COOKIE_SECURE: z.enum(['auto', 'true', 'false']).default('auto'),
  BCRYPT_COST: z.coerce.number().int().min(10).max(15).default(11),
  LOG_LEVEL: z.enum(['fatal', 'error', 'warn', 'info', 'debug', 'trace', 'silent']).optional(),
  STORAGE_DIR: z.string().default('.data/storage'),
});

export type Env = z.infer<typeof envSchema>;

/** The only place that reads process.env; everything else receives the parsed Env. */
export function readEnv(source: NodeJS.ProcessEnv = process.env): Env {
  const parsed = envSchema.safeParse(source);
  if (!parsed.success) {
    const lines = parsed.error.issues.map((i) => `  ${i.path.join('.')}: ${i.message}`);
    throw new Error(`Configuration is not valid:\n${lines.join('\n')}`);
  }
  return parsed.data;
}
