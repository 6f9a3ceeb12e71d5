import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { passwordResets, users } from '../../server/db/schema/users';
import { PASSWORD, sessionCookie, signUp, signUpLink } from '../factories';
import { createTestContext, type TestContext } from '../setup/test-app';

let ctx: TestContext;
beforeAll(async () => {
  ctx = await createTestContext();
});
afterAll(async () => {
  await ctx.close();
});

describe('sign-up, sign-in and sign-out', () => {
  it('signs up, creating a collection the new person owns', async () => {
    const { agent, email } = await signUp(ctx);
    const me = await agent.get('/api/auth/me').expect(200);
    expect(me.body.user.email).toBe(email);
    expect(me.body.memberships).toHaveLength(1);
    expect(me.body.memberships[0]).toMatchObject({
      role: 'owner',
      collectionName: 'Test Collection',
      timeZone: 'America/Toronto',
    });
  });

  it('makes no second account for a known e-mail, in any letter case: its owner is told instead', async () => {
    const { email } = await signUp(ctx);
    const earlier = new Set(ctx.mailbox.messages);
    const res = await ctx.agent().post('/api/auth/sign-up').send({ email: email.toUpperCase() });
    expect(res.status).toBe(202);
    const mail = await ctx.mailbox.waitFor((m) => !earlier.has(m) && m.to.includes(email));
    expect(mail.subject).toBe('You already have a Rackside account');
    expect(mail.text).toContain('http://rackside.test/sign-in');
    expect(mail.text).toContain('http://rackside.test/forgot-password');
    expect(mail.text).not.toMatch(/token=/);
    expect(await ctx.database.db.select().from(users).where(eq(users.email, email))).toHaveLength(
      1,
    );
  });

  it('refuses an unknown time zone with a readable message', async () => {
    const token = await signUpLink(ctx, `tz-${Date.now()}@example.test`);
    const res = await ctx.agent().post('/api/auth/sign-up/finish').send({
      token,
      password: PASSWORD,
      displayName: 'X',
      collectionName: 'Y',
      timeZone: 'Mars/Olympus',
    });
    expect(res.status).toBe(422);
    expect(res.body.error.issues).toContainEqual({
      path: 'body.timeZone',
      message: 'Choose a time zone such as America/Toronto.',
    });
  });

  it('gives the same answer for an unknown e-mail and a wrong password', async () => {
    const { email } = await signUp(ctx);
    const wrong = await ctx
      .agent()
      .post('/api/auth/sign-in')
      .send({ email, password: 'not the password' });
    const unknown = await ctx
      .agent()
      .post('/api/auth/sign-in')
      .send({ email: 'nobody@example.test', password: 'not the password' });
    expect(wrong.status).toBe(401);
    expect(unknown.status).toBe(401);
    expect(unknown.body).toEqual(wrong.body);
  });

  it('issues a new session id at sign-in (OWASP ASVS 4.0.3 3.2.1)', async () => {
    const { email } = await signUp(ctx);
    const agent = ctx.agent();
    // A session that exists before sign-in (e.g. planted by an attacker) must not survive it.
    const first = await agent
      .post('/api/auth/sign-in')
      .send({ email, password: PASSWORD })
      .expect(200);
    const second = await agent
      .post('/api/auth/sign-in')
      .send({ email, password: PASSWORD })
      .expect(200);
    const a = sessionCookie(first);
    const b = sessionCookie(second);
    expect(a).toBeDefined();
    expect(b).toBeDefined();
    expect(b).not.toBe(a);
    // The old id no longer works.
    await ctx.agent().get('/api/auth/me').set('Cookie', a!).expect(401);
  });

  it('refuses the old cookie after sign-out (OWASP ASVS 4.0.3 3.3.1)', async () => {
    const { email } = await signUp(ctx);
    const agent = ctx.agent();
    const res = await agent
      .post('/api/auth/sign-in')
      .send({ email, password: PASSWORD })
      .expect(200);
    const cookie = sessionCookie(res)!;
    await ctx.agent().get('/api/auth/me').set('Cookie', cookie).expect(200);
    await agent.post('/api/auth/sign-out').expect(204);
    await ctx.agent().get('/api/auth/me').set('Cookie', cookie).expect(401);
  });

  it('sets the session cookie HttpOnly and SameSite, and Secure when served over HTTPS', async () => {
    const { email } = await signUp(ctx);
    const res = await ctx.agent().post('/api/auth/sign-in').send({ email, password: PASSWORD });
    const raw = ((res.headers['set-cookie'] as unknown as string[]) ?? []).join(';');
    expect(raw).toMatch(/HttpOnly/i);
    expect(raw).toMatch(/SameSite=Lax/i);
    expect(raw).not.toMatch(/Secure/i); // plain HTTP in this test; production.test covers HTTPS
  });
});

describe('passwords', () => {
  it('stores a bcrypt hash with cost at least 10 (OWASP Password Storage Cheat Sheet)', async () => {
    const { userId } = await signUp(ctx);
    const [row] = await ctx.database.db.select().from(users).where(eq(users.id, userId));
    const match = /^\$2[aby]\$(\d\d)\$/.exec(row!.passwordHash);
    expect(match).not.toBeNull();
    expect(Number(match![1])).toBeGreaterThanOrEqual(10);
  });

  it('accepts a 72-byte password and refuses a 73-byte one (bcrypt reads at most 72 bytes)', async () => {
    // 'é' is two bytes in UTF-8 (RFC 3629), so 36 of them make 72 bytes from 36 characters.
    const seventyTwo = 'é'.repeat(36);
    const seventyThree = `${seventyTwo}a`;
    expect(Buffer.byteLength(seventyTwo, 'utf8')).toBe(72);
    const ok = await signUp(ctx, { password: seventyTwo });
    await ctx
      .agent()
      .post('/api/auth/sign-in')
      .send({ email: ok.email, password: seventyTwo })
      .expect(200);
    const token = await signUpLink(ctx, `long-${Date.now()}@example.test`);
    const refused = await ctx.agent().post('/api/auth/sign-up/finish').send({
      token,
      password: seventyThree,
      displayName: 'X',
      collectionName: 'Y',
      timeZone: 'America/Toronto',
    });
    expect(refused.status).toBe(422);
    expect(refused.body.error.message).toMatch(/at most 72 bytes/);
  });

  it('changes the password with the current one, and signs out other sessions', async () => {
    const { agent, email } = await signUp(ctx);
    const other = ctx.agent();
    await other.post('/api/auth/sign-in').send({ email, password: PASSWORD }).expect(200);
    await agent
      .post('/api/auth/password')
      .send({ currentPassword: 'wrong one!', newPassword: 'a brand new secret' })
      .expect(422);
    await agent
      .post('/api/auth/password')
      .send({ currentPassword: PASSWORD, newPassword: 'a brand new secret' })
      .expect(204);
    await agent.get('/api/auth/me').expect(200);
    await other.get('/api/auth/me').expect(401);
    await ctx
      .agent()
      .post('/api/auth/sign-in')
      .send({ email, password: 'a brand new secret' })
      .expect(200);
  });
});

describe('password reset by e-mail', () => {
  async function requestLink(email: string): Promise<string> {
    const earlier = new Set(ctx.mailbox.messages);
    await ctx.agent().post('/api/auth/reset-request').send({ email }).expect(202);
    const mail = await ctx.mailbox.waitFor(
      (m) => !earlier.has(m) && m.to.includes(email) && m.subject.includes('Reset'),
    );
    const link = /https?:\/\/\S+reset-password\?token=([\w-]+)/.exec(mail.text);
    expect(link).not.toBeNull();
    return link![1]!;
  }

  it('sends a link through the SMTP fake; the token works once', async () => {
    const { email } = await signUp(ctx);
    const token = await requestLink(email);
    expect(token.length).toBeGreaterThanOrEqual(43); // 32 random bytes, base64url: 256 bits ≥ 128
    await ctx
      .agent()
      .post('/api/auth/reset')
      .send({ token, password: 'reset password 1' })
      .expect(204);
    await ctx
      .agent()
      .post('/api/auth/sign-in')
      .send({ email, password: 'reset password 1' })
      .expect(200);
    const again = await ctx
      .agent()
      .post('/api/auth/reset')
      .send({ token, password: 'reset password 2' });
    expect(again.status).toBe(400);
    expect(again.body.error.message).toMatch(/expired or was already used/);
  });

  it('stores only a hash of the token', async () => {
    const { email, userId } = await signUp(ctx);
    const token = await requestLink(email);
    const rows = await ctx.database.db
      .select()
      .from(passwordResets)
      .where(eq(passwordResets.userId, userId));
    expect(rows).toHaveLength(1);
    expect(rows[0]!.tokenHash).not.toContain(token);
    expect(rows[0]!.tokenHash).toMatch(/^[0-9a-f]{64}$/);
  });

  it('refuses a token after an hour', async () => {
    const { email } = await signUp(ctx);
    const token = await requestLink(email);
    ctx.setNow(new Date(Date.now() + 61 * 60_000));
    try {
      await ctx
        .agent()
        .post('/api/auth/reset')
        .send({ token, password: 'too late now' })
        .expect(400);
    } finally {
      ctx.setNow(null);
    }
  });

  it('refuses a link asked for before a password change, once the password has changed', async () => {
    const { agent, email } = await signUp(ctx);
    const token = await requestLink(email);
    await agent
      .post('/api/auth/password')
      .send({ currentPassword: PASSWORD, newPassword: 'changed after asking' })
      .expect(204);
    const res = await ctx
      .agent()
      .post('/api/auth/reset')
      .send({ token, password: 'the attacker picks' });
    expect(res.status).toBe(400);
    expect(res.body.error.message).toMatch(/expired or was already used/);
    await ctx
      .agent()
      .post('/api/auth/sign-in')
      .send({ email, password: 'changed after asking' })
      .expect(200);
  });

  it('refuses every other outstanding link once one reset the password', async () => {
    const { email } = await signUp(ctx);
    const first = await requestLink(email);
    const second = await requestLink(email);
    expect(second).not.toBe(first);
    await ctx
      .agent()
      .post('/api/auth/reset')
      .send({ token: second, password: 'reset with the second' })
      .expect(204);
    expect(
      (
        await ctx
          .agent()
          .post('/api/auth/reset')
          .send({ token: first, password: 'reset with the first' })
      ).status,
    ).toBe(400);
    await ctx
      .agent()
      .post('/api/auth/sign-in')
      .send({ email, password: 'reset with the second' })
      .expect(200);
  });

  it('answers the same for an unknown e-mail, and sends nothing', async () => {
    const before = ctx.mailbox.messages.length;
    const res = await ctx
      .agent()
      .post('/api/auth/reset-request')
      .send({ email: 'ghost@example.test' });
    expect(res.status).toBe(202);
    expect(res.body.message).toMatch(/If an account uses that e-mail/);
    await new Promise((r) => setTimeout(r, 200));
    expect(ctx.mailbox.messages.length).toBe(before);
  });
});

describe('rate limiting', () => {
  it('stops repeated failed sign-ins to one account', async () => {
    const limited = await createTestContext({ authLimits: { failedSignInPerAccount: 3 } });
    try {
      const { email } = await signUp(limited);
      const statuses: number[] = [];
      for (let i = 0; i < 5; i++) {
        statuses.push(
          (
            await limited
              .agent()
              .post('/api/auth/sign-in')
              .send({ email, password: 'wrong guess!' })
          ).status,
        );
      }
      expect(statuses).toEqual([401, 401, 401, 429, 429]);
      const res = await limited
        .agent()
        .post('/api/auth/sign-in')
        .send({ email, password: PASSWORD });
      expect(res.status).toBe(429);
      expect(res.body.error.message).toMatch(/Too many attempts/);
    } finally {
      await limited.close();
    }
  });

  it('limits reset requests per e-mail', async () => {
    const limited = await createTestContext({ authLimits: { resetPerEmail: 2 } });
    try {
      const send = () =>
        limited.agent().post('/api/auth/reset-request').send({ email: 'someone@example.test' });
      expect((await send()).status).toBe(202);
      expect((await send()).status).toBe(202);
      expect((await send()).status).toBe(429);
    } finally {
      await limited.close();
    }
  });
});
