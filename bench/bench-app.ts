// The real app for browser and sync benchmarks: Express on loopback over the bench database.
import { randomBytes } from 'node:crypto';
import type { AddressInfo } from 'node:net';
import path from 'node:path';
import bcrypt from 'bcryptjs';
import pino from 'pino';
import { generateLabelTag } from '#shared/domain/labels/label-payload';
import { createApp } from '../server/app';
import type { Database } from '../server/db/client';
import { readEnv } from '../server/env';
import type { Mailer } from '../server/mail/mailer';

export const distDir = path.resolve(import.meta.dirname, '..', 'dist');
export const BENCH_PASSWORD = 'bench password 1234';

/** The app with every rate limit out of the way; `mailer` and `bcryptCost` as a benchmark needs. */
export async function startBenchApp(
  database: Database,
  options: { mailer?: Mailer; bcryptCost?: number } = {},
) {
  const env = readEnv({
    NODE_ENV: 'production',
    DATABASE_URL: 'postgres://unused',
    // Production refuses example values (server/env.ts): a random one, as an operator makes.
    SESSION_SECRET: randomBytes(32).toString('hex'),
    BCRYPT_COST: String(options.bcryptCost ?? 10),
    SMTP_URL: 'smtp://unused.invalid',
    PUBLIC_URL: 'http://127.0.0.1',
  });
  const { app, shutdown } = createApp({
    env,
    database,
    mailer: options.mailer ?? { send: async () => undefined, close: () => undefined },
    distDir,
    logger: pino({ level: 'silent' }),
    authLimits: {
      signInPerIp: 1_000_000,
      failedSignInPerAccount: 1_000_000,
      resetPerIp: 1_000_000,
      resetPerEmail: 1_000_000,
      signUpPerEmail: 1_000_000,
      invitesPerCollection: 1_000_000,
    },
  });
  const server = await new Promise<import('node:http').Server>((resolve) => {
    const s = app.listen(0, '127.0.0.1', () => resolve(s));
  });
  return {
    baseUrl: `http://127.0.0.1:${(server.address() as AddressInfo).port}`,
    async close() {
      server.closeAllConnections();
      await new Promise((r) => server.close(r));
      await shutdown();
    },
  };
}

/** A keeper owning a collection of `animals` adult tarantulas, none fed yet (all due today). */
export async function makeKeeper(database: Database, animals: number, tag: string) {
  const { pool } = database;
  const hash = await bcrypt.hash(BENCH_PASSWORD, 10);
  const email = `bench-${tag}-${Date.now()}@bench.test`;
  const user = await pool.query<{ id: string }>(
    `insert into users (email, password_hash, display_name) values ($1, $2, 'Bench keeper') returning id`,
    [email, hash],
  );
  const collection = await pool.query<{ id: string }>(
    `insert into collections (name, time_zone, label_tag) values ($1, 'America/Toronto', $2) returning id`,
    [`Bench ${tag}`, generateLabelTag(Math.random)],
  );
  const userId = user.rows[0]!.id;
  const collectionId = collection.rows[0]!.id;
  await pool.query(
    `insert into memberships (collection_id, user_id, role) values ($1, $2, 'owner')`,
    [collectionId, userId],
  );
  await pool.query(
    `insert into locations (collection_id, room, rack, shelf, position) select $1, 'Room', 'R' || (g / 50), (g / 10) % 5, g % 10 from generate_series(0, $2 - 1) g`,
    [collectionId, animals],
  );
  const rows = await pool.query<{ id: string }>(
    `insert into animals (collection_id, label_code, name, scientific_name, "group", life_stage, sex, location_id, has_water_dish, created_at)
     select $1, 'BN-' || l.rn, 'Animal ' || l.rn, 'Tliltocatl albopilosus', 'tarantula', 'adult', 'female', l.id, true, now() - interval '60 days'
     from (select id, row_number() over (order by id) as rn from locations where collection_id = $1) l returning id`,
    [collectionId],
  );
  return { email, userId, collectionId, animalIds: rows.rows.map((r) => r.id) };
}

/** Signs in over HTTP and returns the session cookie. */
export async function signInCookie(baseUrl: string, email: string): Promise<string> {
  const res = await fetch(`${baseUrl}/api/auth/sign-in`, {
    method: 'POST',
    headers: { 'Content-Type': 'application/json', 'X-Rackside-Client': '1' },
    body: JSON.stringify({ email, password: BENCH_PASSWORD }),
  });
  if (res.status !== 200) throw new Error(`bench sign-in failed: ${res.status}`);
  return res.headers.getSetCookie()[0]!.split(';')[0]!;
}
