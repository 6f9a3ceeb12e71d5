// A real app on a real, private PostgreSQL database for one test file.
import { randomUUID } from 'node:crypto';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import pg from 'pg';
import supertest from 'supertest';
import { createApp, type AppOptions } from '../../server/app';
import { connectDatabase, type Database } from '../../server/db/client';
import { readEnv } from '../../server/env';
import { startDevSmtp, type DevMailbox } from '../../server/mail/dev-smtp';
import { createSmtpMailer } from '../../server/mail/mailer';
import { adminUrl, templateName, testDatabaseUrl } from './database-urls';

export interface TestContext {
  app: ReturnType<typeof createApp>['app'];
  services: ReturnType<typeof createApp>['services'];
  database: Database;
  databaseUrl: string;
  /** Where this app keeps uploaded photos. */
  storageDir: string;
  mailbox: DevMailbox;
  /** Moves the app's clock (cover windows, token expiry); pass null for the real clock. */
  setNow(date: Date | null): void;
  /** Moves the server's clock by `ms` from real time (it keeps running), as a phone's may be. */
  shiftClock(ms: number): void;
  /** A supertest agent that keeps cookies and sends the app's CSRF header. */
  agent(): ReturnType<typeof supertest.agent>;
  close(): Promise<void>;
}

export async function createTestDatabase(): Promise<string> {
  const name = `rackside_t_${randomUUID().replace(/-/g, '').slice(0, 12)}`;
  const admin = new pg.Client({ connectionString: adminUrl() });
  await admin.connect();
  await admin.query(`create database "${name}" template "${templateName()}"`);
  await admin.end();
  return name;
}

export async function dropTestDatabase(name: string): Promise<void> {
  const admin = new pg.Client({ connectionString: adminUrl() });
  await admin.connect();
  await admin.query(`drop database if exists "${name}" with (force)`);
  await admin.end();
}

export async function createTestContext(
  options: Partial<
    Pick<AppOptions, 'authLimits' | 'distDir' | 'publicUrl' | 'logger' | 'payments'>
  > & {
    /** false: as `npm start -- --no-demo` runs (DEMO_MODE=false). */
    demo?: boolean;
  } = {},
): Promise<TestContext> {
  const name = await createTestDatabase();
  const databaseUrl = testDatabaseUrl(name);
  const database = connectDatabase(databaseUrl, 5);
  const smtp = await startDevSmtp();
  const mailer = createSmtpMailer(smtp.url, 'Rackside tests <tests@rackside.invalid>');
  // Each test file writes photos to its own folder, removed on close.
  const storageDir = fs.mkdtempSync(path.join(os.tmpdir(), 'rackside-storage-'));
  const env = readEnv({
    NODE_ENV: 'test',
    DATABASE_URL: databaseUrl,
    SESSION_SECRET: 'test-secret-that-is-long-enough-for-sessions',
    DEMO_MODE: options.demo === false ? 'false' : 'true',
    BCRYPT_COST: '10',
    STORAGE_DIR: storageDir,
  });
  let fixed: Date | null = null;
  let shift = 0;
  const { app, services, shutdown } = createApp({
    env,
    database,
    mailer,
    devMailbox: smtp.mailbox,
    now: () => fixed ?? new Date(Date.now() + shift),
    publicUrl: options.publicUrl ?? 'http://rackside.test',
    authLimits: {
      signInPerIp: 10_000,
      resetPerIp: 10_000,
      resetPerEmail: 10_000,
      signUpPerEmail: 10_000,
      invitesPerCollection: 10_000,
      ...options.authLimits,
    },
    distDir: options.distDir ?? '/nonexistent',
    logger: options.logger,
    payments: options.payments,
  });
  return {
    app,
    services,
    database,
    databaseUrl,
    storageDir,
    mailbox: smtp.mailbox,
    setNow: (date) => {
      fixed = date;
    },
    shiftClock: (ms) => {
      shift = ms;
    },
    agent: () => supertest.agent(app).set('X-Rackside-Client', '1'),
    async close() {
      await shutdown();
      mailer.close();
      await smtp.stop();
      await database.close();
      await dropTestDatabase(name);
      fs.rmSync(storageDir, { recursive: true, force: true });
    },
  };
}
