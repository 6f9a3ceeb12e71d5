// The production bundle as operators run it: it refuses to start without a mail server, a
// public address and a strong session secret, naming each, and given a mail server it never
// loads the local SMTP fake's packages.
import { spawn } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { SERVER_NODE_FLAGS } from '../../scripts/lib/server-flags.mjs';
import { connectDatabase } from '../../server/db/client';
import { migrateDatabase } from '../../server/db/migrate';
import { repoRoot } from '../../server/repo-root';
import { testDatabaseUrl } from '../setup/database-urls';
import { createTestDatabase, dropTestDatabase } from '../setup/test-app';
import {
  bundleOnce,
  PRODUCTION_SESSION_SECRET,
  startServerProcess,
} from '../support/server-process';

let name: string;
let databaseUrl: string;
const tmp = fs.mkdtempSync(path.join(os.tmpdir(), 'rackside-config-'));
const importLog = path.resolve(import.meta.dirname, '../support/import-log.mjs');
/** The local fake's packages (server/mail/dev-smtp.ts). */
const FAKE_PACKAGES = /\/node_modules\/(smtp-server|mailparser)\//;

beforeAll(async () => {
  name = await createTestDatabase();
  databaseUrl = testDatabaseUrl(name);
  const database = connectDatabase(databaseUrl, 1);
  await migrateDatabase(database.db);
  await database.close();
}, 60_000);

afterAll(async () => {
  await dropTestDatabase(name);
  fs.rmSync(tmp, { recursive: true, force: true });
});

/** Runs the bundle to its end: its exit code and everything it wrote. */
async function runToExit(
  env: Record<string, string>,
): Promise<{ code: number | null; output: string }> {
  const child = spawn(process.execPath, [...SERVER_NODE_FLAGS, await bundleOnce()], {
    cwd: repoRoot(),
    env: { PATH: process.env.PATH ?? '', ...env },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  let output = '';
  child.stdout.on('data', (c: Buffer) => (output += c.toString()));
  child.stderr.on('data', (c: Buffer) => (output += c.toString()));
  const code = await new Promise<number | null>((resolve) => child.once('exit', resolve));
  return { code, output };
}

describe('production configuration', () => {
  const complete = () => ({
    NODE_ENV: 'production',
    DATABASE_URL: databaseUrl,
    SESSION_SECRET: PRODUCTION_SESSION_SECRET,
    SMTP_URL: 'smtp://127.0.0.1:9',
    PUBLIC_URL: 'https://rackside.example',
    PORT: '0',
  });

  it.each([
    ['SMTP_URL', undefined, /SMTP_URL is required in production/],
    ['PUBLIC_URL', undefined, /PUBLIC_URL is required in production/],
    ['SESSION_SECRET', undefined, /SESSION_SECRET is required/],
    ['SESSION_SECRET', 'too-short', /SESSION_SECRET must be at least 32 characters/],
    [
      'SESSION_SECRET',
      'change-me-to-a-long-random-value-0123456789',
      /SESSION_SECRET is not strong enough for production/,
    ],
  ] as const)(
    'refuses to start with %s %s, saying so plainly',
    async (name, value, message) => {
      const env: Record<string, string> = complete();
      if (value === undefined) delete env[name];
      else env[name] = value;
      const { code, output } = await runToExit(env);
      expect(code).toBe(1);
      expect(output).toMatch(message);
      expect(output).toContain(`${name}:`);
      // Only what is wrong is named.
      for (const other of ['SMTP_URL', 'PUBLIC_URL', 'SESSION_SECRET'].filter((n) => n !== name))
        expect(output).not.toContain(`${other}:`);
      // A message for an operator, not a stack trace.
      expect(output).not.toMatch(/\n\s+at /);
    },
    60_000,
  );

  it('names all three at once when all three are missing', async () => {
    const { SMTP_URL, PUBLIC_URL, SESSION_SECRET, ...rest } = complete();
    void [SMTP_URL, PUBLIC_URL, SESSION_SECRET];
    const { code, output } = await runToExit(rest);
    expect(code).toBe(1);
    expect(output).toContain('SMTP_URL is required in production');
    expect(output).toContain('PUBLIC_URL is required in production');
    expect(output).toContain('SESSION_SECRET is required');
  }, 60_000);

  it('loads no package of the local mail fake when given a mail server', async () => {
    const log = path.join(tmp, 'production-imports.txt');
    const server = await startServerProcess({
      databaseUrl,
      nodeArgs: ['--import', importLog],
      env: { RACKSIDE_IMPORT_LOG: log },
    });
    await server.kill();
    const loaded = fs.readFileSync(log, 'utf8');
    // The log sees packages (the real mailer among them), but not the fake's.
    expect(loaded).toMatch(/\/node_modules\/nodemailer\//);
    expect(loaded).not.toMatch(FAKE_PACKAGES);
  }, 60_000);

  it('(the same check, outside production without a mail server, does see them)', async () => {
    const log = path.join(tmp, 'development-imports.txt');
    const server = await startServerProcess({
      databaseUrl,
      nodeArgs: ['--import', importLog],
      env: { RACKSIDE_IMPORT_LOG: log, NODE_ENV: 'development', SMTP_URL: '' },
    });
    await server.kill();
    expect(fs.readFileSync(log, 'utf8')).toMatch(FAKE_PACKAGES);
  }, 60_000);
});
