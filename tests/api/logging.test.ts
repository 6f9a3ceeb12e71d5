// No credential in the logs: real requests through the app with its own logger writing to a
// captured stream, then the whole output searched for the secrets those requests carried.
import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createLogger } from '../../server/logger';
import { PASSWORD, signUp } from '../factories';
import { createTestContext, type TestContext } from '../setup/test-app';

let ctx: TestContext;
const lines: string[] = [];
const output = () => lines.join('');
const records = () =>
  output()
    .split('\n')
    .filter(Boolean)
    .map((l) => JSON.parse(l) as Record<string, unknown>);

beforeAll(async () => {
  // The production logger at its production level, writing where the test can read it.
  const logger = createLogger(
    { NODE_ENV: 'production', LOG_LEVEL: 'info' },
    { write: (line: string) => void lines.push(line) },
  );
  ctx = await createTestContext({ logger });
});
afterAll(async () => {
  await ctx.close();
});

const sessionValue = (setCookie: string[] | string | undefined) => {
  const header = [setCookie ?? []].flat().find((c) => c.startsWith('rackside.sid='));
  if (!header) throw new Error('no session cookie was set');
  return header.split(';')[0]!.slice('rackside.sid='.length);
};

describe('request logs', () => {
  it('never hold the session cookie, an authorisation header or a one-time token', async () => {
    const owner = await signUp(ctx);
    const agent = ctx.agent();
    const signIn = await agent
      .post('/api/auth/sign-in')
      .send({ email: owner.email, password: PASSWORD })
      .expect(200);
    const cookie = sessionValue(signIn.headers['set-cookie']);
    // express-session's cookie is "s:" + id + "." + signature, URL-encoded.
    const sessionId = decodeURIComponent(cookie).slice(2).split('.')[0]!;
    expect(sessionId.length).toBeGreaterThan(20);
    await agent.get('/api/auth/me').expect(200);
    await agent
      .get(`/api/collections/${owner.collectionId}/animals`)
      .set('Authorization', 'Bearer bearer-secret-QX81Z')
      .expect(200);

    // A reset link's token, sent in a body; an invite token in a query string.
    await agent.post('/api/auth/reset-request').send({ email: owner.email }).expect(202);
    // (The sign-up link mail went to the same address first: wait for the reset link itself.)
    const mail = await ctx.mailbox.waitFor(
      (m) => m.to.includes(owner.email) && /reset-password\?token=/.test(m.text),
    );
    const resetToken = /reset-password\?token=([\w-]+)/.exec(mail.text)![1]!;
    await ctx
      .agent()
      .post('/api/auth/reset')
      .send({ token: resetToken, password: 'another horse battery' })
      .expect(204);
    const inviteToken = `invite${randomUUID().replace(/-/g, '')}`;
    await ctx.agent().get(`/api/cover-invites/preview?token=${inviteToken}`);

    const all = output();
    // The requests were logged, headers included...
    const me = records().find(
      (r) => (r.req as { url?: string } | undefined)?.url === '/api/auth/me',
    );
    expect(me, 'the /me request is in the log').toBeDefined();
    expect((me!.req as { headers: Record<string, string> }).headers.cookie).toBe('[redacted]');
    expect(all).toContain('/api/cover-invites/preview?token=[redacted]');
    // ...and no secret they carried is anywhere in the output.
    for (const secret of [
      cookie,
      decodeURIComponent(cookie),
      sessionId,
      'bearer-secret-QX81Z',
      resetToken,
      inviteToken,
      PASSWORD,
    ]) {
      expect(all.includes(secret), `log holds ${secret}`).toBe(false);
    }
  });

  it('never hold the parameter values of a failed query', async () => {
    const owner = await signUp(ctx);
    // Two ways PostgreSQL puts a value in an error: the failing row in a check violation's
    // detail, and the value itself in a cast's message. Both reach the error handler as a 500.
    await ctx.database.pool.query(
      `alter table locations add constraint log_probe_row check (rack <> 'rowprobe-K7W3Q')`,
    );
    await ctx.database.pool.query(
      `alter table locations add constraint log_probe_cast check (case when room like 'castprobe%' then room::uuid is not null else true end)`,
    );
    const place = (room: string, rack: string) =>
      owner.agent
        .post(`/api/collections/${owner.collectionId}/locations`)
        .send({ room, rack, shelf: 'shelf-V3N8P', position: 'spot-H2M5T' });
    const before = lines.length;
    expect((await place('Back room', 'rowprobe-K7W3Q')).status).toBe(500);
    expect((await place('castprobe-J4R9D', 'Rack A')).status).toBe(500);

    const logged = lines.slice(before).join('');
    const errors = records()
      .filter((r) => r.msg === 'unhandled error')
      .map((r) => JSON.stringify(r.err));
    expect(errors).toHaveLength(2);
    // Still useful: the SQL (with placeholders), the SQLSTATE and the constraint's name.
    expect(errors[0]).toContain('insert into \\"locations\\"');
    expect(errors[0]).toContain('"code":"23514"');
    expect(errors[0]).toContain('log_probe_row');
    expect(errors[1]).toContain('"code":"22P02"');
    for (const value of ['rowprobe-K7W3Q', 'castprobe-J4R9D', 'shelf-V3N8P', 'spot-H2M5T']) {
      expect(logged.includes(value), `log holds ${value}`).toBe(false);
    }
  });
});
