// The local mailbox (GET /api/dev/mail, wherever the local SMTP fake runs: the demo and
// development) holds reset and invite links. It answers this machine, and from another host
// only a signed-in owner, with their own mail; anyone else gets the 404 of a route that is not
// there, and production never mounts it. "Another host" is real: a network namespace on its own veth link
// (tests/support/remote-host.ts), the app listening on this machine's end of it.
import type { Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import supertest from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createApp } from '../../server/app';
import { readEnv } from '../../server/env';
import { createLogger } from '../../server/logger';
import { listRoutes } from '../../server/route-list';
import { PASSWORD, signUp, type SignedUp } from '../factories';
import { createTestContext, type TestContext } from '../setup/test-app';
import { createRemoteHost, type RemoteHost } from '../support/remote-host';
import { PRODUCTION_SESSION_SECRET } from '../support/server-process';

let ctx: TestContext;
let remote: RemoteHost;
let server: Server;
let base: string;
let owner: SignedUp;
let other: SignedUp;
let helperEmail: string;
let otherResetToken: string;
const logLines: string[] = [];

const tokenIn = (text: string) => /token=([A-Za-z0-9_-]+)/.exec(text)![1]!;
const day = (fromToday: number) =>
  new Date(Date.now() + fromToday * 86_400_000).toISOString().slice(0, 10);
const json = { 'Content-Type': 'application/json', 'X-Rackside-Client': '1' };

/** Signs in from the other host; the session cookie to send with its next requests. */
async function remoteSignIn(email: string): Promise<string> {
  const res = await remote.fetch(`${base}/api/auth/sign-in`, {
    method: 'POST',
    headers: json,
    body: { email, password: PASSWORD },
  });
  expect(res.status).toBe(200);
  return res.setCookie.find((c) => c.startsWith('rackside.sid='))!.split(';')[0]!;
}

beforeAll(async () => {
  // The request log shows the peer address each request came from.
  ctx = await createTestContext({
    logger: createLogger(
      { NODE_ENV: 'test', LOG_LEVEL: 'info' },
      { write: (l: string) => void logLines.push(l) },
    ),
  });
  remote = createRemoteHost();
  server = await new Promise<Server>((resolve) => {
    const s = ctx.app.listen(0, remote.hostAddress, () => resolve(s));
  });
  base = `http://${remote.hostAddress}:${(server.address() as AddressInfo).port}`;

  owner = await signUp(ctx);
  other = await signUp(ctx);
  // Mail to someone else: a reset link for `other`...
  await other.agent.post('/api/auth/reset-request').send({ email: other.email }).expect(202);
  otherResetToken = tokenIn(
    (await ctx.mailbox.waitFor((m) => m.to.includes(other.email) && /reset-password/.test(m.text)))
      .text,
  );
  // ...and a cover invite, which also makes an account that is a helper and owns nothing.
  helperEmail = `helper-${Date.now()}@example.test`;
  await owner.agent
    .post(`/api/collections/${owner.collectionId}/covers`)
    .send({ email: helperEmail, firstDay: day(5), lastDay: day(7), message: '' })
    .expect(201);
  const invite = tokenIn((await ctx.mailbox.waitFor((m) => m.to.includes(helperEmail))).text);
  await ctx
    .agent()
    .post('/api/cover-invites/accept')
    .send({ token: invite, account: { displayName: 'Helper', password: PASSWORD } })
    .expect(200);
  // And one to the owner.
  await owner.agent.post('/api/auth/reset-request').send({ email: owner.email }).expect(202);
  await ctx.mailbox.waitFor((m) => m.to.includes(owner.email));
}, 60_000);

afterAll(async () => {
  server?.closeAllConnections();
  await new Promise((r) => (server ? server.close(r) : r(undefined)));
  remote?.close();
  await ctx?.close();
});

describe('GET /api/dev/mail from another host', () => {
  it('arrives from the other host’s own address, not this machine’s', async () => {
    const res = await remote.fetch(`${base}/api/health?probe=remote`);
    expect(res.status).toBe(200);
    const logged = logLines
      .map((l) => JSON.parse(l) as { req?: { url: string; remoteAddress: string } })
      .find((r) => r.req?.url === '/api/health?probe=remote');
    expect(logged?.req?.remoteAddress).toBe(remote.remoteAddress);
  });

  it('is not there for a caller who is not signed in (404, as for any unknown route)', async () => {
    const res = await remote.fetch(`${base}/api/dev/mail`);
    expect(res.status).toBe(404);
    expect(JSON.stringify(res.body)).not.toContain(otherResetToken);
    const unknown = await remote.fetch(`${base}/api/dev/nothing-here`);
    expect(unknown.status).toBe(404);
    expect((res.body as { error: { code: string } }).error.code).toBe(
      (unknown.body as { error: { code: string } }).error.code,
    );
  });

  it('is not there for a signed-in account that owns no collection', async () => {
    const cookie = await remoteSignIn(helperEmail);
    const res = await remote.fetch(`${base}/api/dev/mail`, { headers: { Cookie: cookie } });
    expect(res.status).toBe(404);
    expect(JSON.stringify(res.body)).not.toContain(otherResetToken);
  });

  it('shows a signed-in owner their own mail only, never another person’s reset link', async () => {
    const cookie = await remoteSignIn(owner.email);
    const res = await remote.fetch(`${base}/api/dev/mail`, { headers: { Cookie: cookie } });
    expect(res.status).toBe(200);
    const body = res.body as { scope: string; messages: { to: string[]; text: string }[] };
    expect(body.scope).toBe('mine');
    expect(body.messages.length).toBeGreaterThan(0);
    expect(body.messages.every((m) => m.to.includes(owner.email))).toBe(true);
    expect(JSON.stringify(body)).not.toContain(otherResetToken);
  });
});

describe('GET /api/dev/mail on this machine', () => {
  it('shows everything to a loopback client', async () => {
    const res = await ctx.agent().get('/api/dev/mail').expect(200);
    expect(res.body.scope).toBe('all');
    expect(JSON.stringify(res.body)).toContain(otherResetToken);
  });

  it('refuses what a local proxy forwarded for another host, unless signed in as an owner', async () => {
    const res = await ctx.agent().get('/api/dev/mail').set('X-Forwarded-For', '192.168.1.20');
    expect(res.status).toBe(404);
    expect(JSON.stringify(res.body)).not.toContain(otherResetToken);
  });
});

describe('which install has it', () => {
  const configured = (extra: Record<string, string>) =>
    createApp({
      env: readEnv({
        DATABASE_URL: ctx.databaseUrl,
        SESSION_SECRET: PRODUCTION_SESSION_SECRET,
        ...extra,
      }),
      database: ctx.database,
      mailer: { send: async () => undefined, close: () => undefined },
      devMailbox: ctx.mailbox,
      logger: createLogger({ NODE_ENV: 'test' }),
      distDir: '/nonexistent',
    });

  it('a home install without the demo keeps the mailbox (its sign-up links are there), not the demo hints', async () => {
    const home = configured({ NODE_ENV: 'development', DEMO_MODE: 'false' });
    try {
      const routes = listRoutes(home.app).map((r) => `${r.method} ${r.path}`);
      expect(routes).toContain('GET /api/dev/mail');
      const hints = await supertest(home.app).get('/api/dev/demo').expect(200);
      expect(hints.body).toEqual({ demo: false, accounts: [] });
    } finally {
      await home.shutdown();
    }
  });
});

describe('in production', () => {
  it('is not mounted, demo mode or not', async () => {
    const env = readEnv({
      NODE_ENV: 'production',
      DEMO_MODE: 'true',
      DATABASE_URL: ctx.databaseUrl,
      SESSION_SECRET: PRODUCTION_SESSION_SECRET,
      SMTP_URL: 'smtp://mail.example.test:587',
      PUBLIC_URL: 'https://rackside.example',
    });
    const prod = createApp({
      env,
      database: ctx.database,
      mailer: { send: async () => undefined, close: () => undefined },
      devMailbox: ctx.mailbox,
      logger: createLogger({ NODE_ENV: 'test' }),
      distDir: '/nonexistent',
    });
    try {
      const routes = listRoutes(prod.app).map((r) => `${r.method} ${r.path}`);
      expect(routes).toContain('GET /api/dev/demo');
      expect(routes).not.toContain('GET /api/dev/mail');
      expect((await supertest(prod.app).get('/api/dev/mail')).status).toBe(404);
    } finally {
      await prod.shutdown();
    }
  });
});
