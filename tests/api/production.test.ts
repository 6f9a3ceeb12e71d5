// Issue 9, production: two stateless server processes share one PostgreSQL behind an HTTPS
// reverse proxy. A session made on one works on the other, scheduled jobs run once, rate limits
// hold across both, and cookies are Secure when the proxy says the request came over HTTPS.
import PgBoss from 'pg-boss';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { connectDatabase } from '../../server/db/client';
import { migrateDatabase } from '../../server/db/migrate';
import { BUILD_DUE_ROUNDS, SEND_COVER_REPORTS } from '../../server/jobs/jobs';
import { insertOwner, PASSWORD } from '../factories';
import { testDatabaseUrl } from '../setup/database-urls';
import { createTestDatabase, dropTestDatabase } from '../setup/test-app';
import { startServerProcess, type ServerProcess } from '../support/server-process';

let name: string;
let databaseUrl: string;
let servers: ServerProcess[] = [];

// As a reverse proxy on the same host would send it (RFC 7239's predecessor, X-Forwarded-*).
const viaHttpsProxy = {
  'X-Forwarded-Proto': 'https',
  'X-Forwarded-For': '203.0.113.7',
  'X-Rackside-Client': '1',
  'Content-Type': 'application/json',
};

async function call(
  server: ServerProcess,
  method: string,
  path: string,
  body?: unknown,
  cookie?: string,
) {
  const res = await fetch(`${server.url}${path}`, {
    method,
    headers: { ...viaHttpsProxy, ...(cookie ? { Cookie: cookie } : {}) },
    body: body === undefined ? undefined : JSON.stringify(body),
  });
  return {
    status: res.status,
    setCookie: res.headers.get('set-cookie'),
    body: (await res.json().catch(() => null)) as Record<string, unknown> | null,
  };
}

beforeAll(async () => {
  name = await createTestDatabase();
  databaseUrl = testDatabaseUrl(name);
  // Migrations run once at deploy, before any server process starts.
  const database = connectDatabase(databaseUrl, 1);
  await migrateDatabase(database.db);
  await database.close();
  const env = {
    TRUST_PROXY: 'loopback',
    COOKIE_SECURE: 'auto',
    PUBLIC_URL: 'https://rackside.example',
  };
  servers = await Promise.all([
    startServerProcess({ databaseUrl, env }),
    startServerProcess({ databaseUrl, env }),
  ]);
}, 60_000);

/** An account made straight in the database: sign-up goes through an e-mail these processes send for real. */
async function owner() {
  const database = connectDatabase(databaseUrl, 1);
  try {
    return await insertOwner(database.db);
  } finally {
    await database.close();
  }
}

afterAll(async () => {
  await Promise.all(servers.map((s) => s.kill()));
  await dropTestDatabase(name);
});

describe('two server processes, one database, behind an HTTPS proxy', () => {
  it('shares sessions: signed in on one, recognised on the other, signed out everywhere', async () => {
    const [a, b] = servers as [ServerProcess, ServerProcess];
    const { email } = await owner();
    const signIn = await call(a, 'POST', '/api/auth/sign-in', { email, password: PASSWORD });
    expect(signIn.status).toBe(200);
    // OWASP ASVS 4.0.3 3.4.1–3.4.3: Secure, HttpOnly and SameSite, because the proxy said https.
    expect(signIn.setCookie).toMatch(/rackside\.sid=/);
    expect(signIn.setCookie).toMatch(/; Secure/i);
    expect(signIn.setCookie).toMatch(/; HttpOnly/i);
    expect(signIn.setCookie).toMatch(/; SameSite=Lax/i);
    const cookie = signIn.setCookie!.split(';')[0]!;
    expect((await call(b, 'GET', '/api/auth/me', undefined, cookie)).status).toBe(200);
    expect((await call(b, 'POST', '/api/auth/sign-out', undefined, cookie)).status).toBe(204);
    expect((await call(a, 'GET', '/api/auth/me', undefined, cookie)).status).toBe(401);
    // Both processes logged these requests (JSON lines on stdout), but never the cookie.
    const logged = servers.flatMap((s) => s.lines).join('\n');
    expect(logged).toContain('/api/auth/me');
    expect(logged).not.toContain(cookie.slice('rackside.sid='.length));
    expect(logged).not.toContain(decodeURIComponent(cookie.slice('rackside.sid='.length)));
  });

  it('holds a rate limit across both: failed sign-ins to one account counted together', async () => {
    const [a, b] = servers as [ServerProcess, ServerProcess];
    const { email } = await owner();
    // The default is 20 failed sign-ins per account per hour (DEFAULT_AUTH_LIMITS).
    const statuses: number[] = [];
    for (let i = 0; i < 21; i++)
      statuses.push(
        (
          await call(i % 2 ? b : a, 'POST', '/api/auth/sign-in', {
            email,
            password: `wrong password ${i}`,
          })
        ).status,
      );
    expect(statuses.slice(0, 20).every((s) => s === 401)).toBe(true);
    expect(statuses[20]).toBe(429);
  });

  it('runs each job once, though both processes work the same queues', async () => {
    const boss = new PgBoss({ connectionString: databaseUrl, schema: 'pgboss', max: 2 });
    await boss.start();
    const ids: string[] = [];
    for (let i = 0; i < 10; i++) {
      ids.push((await boss.send(BUILD_DUE_ROUNDS, { i }))!);
      ids.push((await boss.send(SEND_COVER_REPORTS, { i }))!);
    }
    const db = connectDatabase(databaseUrl, 1);
    try {
      await expect
        .poll(
          async () =>
            (
              await db.pool.query(
                "select count(*)::int as n from pgboss.job where id = any($1) and state = 'completed'",
                [ids],
              )
            ).rows[0].n,
          { timeout: 30_000, interval: 250 },
        )
        .toBe(ids.length);
    } finally {
      await db.close();
      await boss.stop({ graceful: false });
    }
    const ran = servers.flatMap((s, process) =>
      s
        .records()
        .filter((r) => r.msg === 'job done' && ids.includes(r.jobId as string))
        .map((r) => ({ id: r.jobId as string, process })),
    );
    // Every job ran, and no job ran twice (in either process or across both).
    expect(ran.map((r) => r.id).sort()).toEqual([...ids].sort());
    // Structured logs: every line is JSON with a level and a time.
    for (const s of servers)
      for (const r of s.records())
        expect(typeof r.level === 'number' && typeof r.time === 'number').toBe(true);
  });
});
