// Issue 9, S6: the session and sign-in items of OWASP ASVS 4.0.3 (level 2) that docs/security.md
// lists and the other auth tests do not already prove.
import { randomUUID } from 'node:crypto';
import { sql } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { SESSION_ABSOLUTE_MS, SESSION_TOUCH_EVERY_MS } from '../../server/sessions';
import { PASSWORD, sessionCookie, signUp, signUpLink } from '../factories';
import { createTestContext, type TestContext } from '../setup/test-app';

let ctx: TestContext;
beforeAll(async () => {
  ctx = await createTestContext();
});
afterAll(async () => {
  await ctx.close();
});

/** The session id inside the signed cookie `rackside.sid=s:<sid>.<signature>`. */
const sidOf = (cookie: string) => decodeURIComponent(cookie.split('=')[1]!).slice(2).split('.')[0]!;

async function expiryOf(sid: string): Promise<Date> {
  const { rows } = await ctx.database.pool.query<{ expire: Date }>(
    'select expire from sessions where sid = $1',
    [sid],
  );
  return rows[0]!.expire;
}

describe('session ids and expiry', () => {
  it('makes session ids of at least 128 random bits (ASVS 3.2.2, 3.2.4)', async () => {
    const sids = new Set<string>();
    for (let i = 0; i < 5; i++) {
      const token = await signUpLink(ctx, `sid-${randomUUID().slice(0, 8)}@example.test`);
      const res = await ctx.agent().post('/api/auth/sign-up/finish').send({
        token,
        password: PASSWORD,
        displayName: 'S',
        collectionName: 'S',
        timeZone: 'UTC',
      });
      const sid = sidOf(sessionCookie(res)!);
      // express-session draws 24 bytes from the CSPRNG (uid-safe): 32 base64url characters.
      expect(sid).toMatch(/^[A-Za-z0-9_-]{32}$/);
      sids.add(sid);
    }
    expect(sids.size).toBe(5);
  });

  it('ends a session idle past its expiry (ASVS 3.3.2, our 30 days)', async () => {
    const { agent } = await signUp(ctx);
    const me = await agent.get('/api/auth/me').expect(200);
    expect(me.body.user).toBeTruthy();
    await ctx.database.pool.query(
      `update sessions set expire = now() - interval '1 second' where sess::jsonb ->> 'userId' = $1`,
      [me.body.user.id],
    );
    await agent.get('/api/auth/me').expect(401);
  });

  it('pushes the idle expiry forward when used, at most every ten minutes', async () => {
    const email = `touch-${randomUUID().slice(0, 8)}@example.test`;
    await signUp(ctx, { email });
    const agent = ctx.agent();
    const signIn = await agent
      .post('/api/auth/sign-in')
      .send({ email, password: PASSWORD })
      .expect(200);
    const sid = sidOf(sessionCookie(signIn)!);
    await agent.get('/api/auth/me').expect(200);
    const first = await expiryOf(sid);
    await new Promise((r) => setTimeout(r, 1100));
    await agent.get('/api/auth/me').expect(200);
    expect((await expiryOf(sid)).getTime()).toBe(first.getTime());
    // The stored expiry has whole seconds: let one pass on the real clock, then jump the app's.
    await new Promise((r) => setTimeout(r, 1100));
    ctx.setNow(new Date(Date.now() + SESSION_TOUCH_EVERY_MS + 1000));
    try {
      await agent.get('/api/auth/me').expect(200);
    } finally {
      ctx.setNow(null);
    }
    expect((await expiryOf(sid)).getTime()).toBeGreaterThan(first.getTime());
  });

  it('ends a session 90 days after sign-in however busy it is (ASVS 3.3.2, absolute)', async () => {
    const { agent, userId } = await signUp(ctx);
    const long = Date.now() - SESSION_ABSOLUTE_MS - 60_000;
    await ctx.database.db.execute(
      sql`update sessions set sess = jsonb_set(sess::jsonb, '{signedInAt}', to_jsonb(${long}::bigint))::json where sess::jsonb ->> 'userId' = ${userId}`,
    );
    const res = await agent.get('/api/auth/me').expect(401);
    expect(res.body.error.code).toBe('session_expired');
    const { rows } = await ctx.database.pool.query(
      `select 1 from sessions where sess::jsonb ->> 'userId' = $1`,
      [userId],
    );
    expect(rows).toHaveLength(0);
  });
});

describe('passwords and resets', () => {
  it('asks for at least 12 characters (ASVS 2.1.1)', async () => {
    const token = await signUpLink(ctx, `short-${randomUUID().slice(0, 8)}@example.test`);
    const res = await ctx.agent().post('/api/auth/sign-up/finish').send({
      token,
      password: 'eleven char',
      displayName: 'S',
      collectionName: 'S',
      timeZone: 'UTC',
    });
    expect(res.status).toBe(422);
    expect(res.body.error.message).toBe('Password: Use at least 12 characters.');
  });

  it('signs every session out after a reset (ASVS 3.3.3)', async () => {
    const { agent, email } = await signUp(ctx);
    await ctx.agent().post('/api/auth/reset-request').send({ email }).expect(202);
    const mail = await ctx.mailbox.waitFor(
      (m) => m.to.includes(email) && m.subject.includes('Reset'),
    );
    const token = /token=([\w-]+)/.exec(mail.text)![1]!;
    await ctx
      .agent()
      .post('/api/auth/reset')
      .send({ token, password: 'a brand new password' })
      .expect(204);
    await agent.get('/api/auth/me').expect(401);
  });
});

describe('sign-in attempts from one address (ASVS 2.2.1)', () => {
  it('are limited per IP whichever accounts they name', async () => {
    const limited = await createTestContext({ authLimits: { signInPerIp: 3 } });
    try {
      const statuses: number[] = [];
      for (let i = 0; i < 4; i++)
        statuses.push(
          (
            await limited
              .agent()
              .post('/api/auth/sign-in')
              .send({ email: `nobody-${i}@example.test`, password: 'not a real password' })
          ).status,
        );
      expect(statuses).toEqual([401, 401, 401, 429]);
    } finally {
      await limited.close();
    }
  });
});
