// Enumeration (issue: "the same answer for known and unknown e-mails"): sign-up, password reset,
// keeper invites and cover invites answer a known and an unknown address alike — status,
// headers that matter and body — and only the e-mail that follows differs. Membership comes
// only from accepting an invite. Timing is measured in the benchmark harness
// (`npm run bench -- S6-timing`), not here.
import { randomUUID } from 'node:crypto';
import { and, eq } from 'drizzle-orm';
import type { Response } from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { decoyHash } from '../../server/access/passwords';
import { memberships } from '../../server/db/schema/collections';
import { passwordResets, signUpTokens, users } from '../../server/db/schema/users';
import { PASSWORD, signUp, signUpLink, type SignedUp } from '../factories';
import { createTestContext, type TestContext } from '../setup/test-app';

let ctx: TestContext;
let owner: SignedUp;
let known: SignedUp;

beforeAll(async () => {
  ctx = await createTestContext();
  owner = await signUp(ctx);
  known = await signUp(ctx);
});
afterAll(async () => {
  ctx.setNow(null);
  await ctx.close();
});

const fresh = (tag: string) => `${tag}-${randomUUID().slice(0, 8)}@example.test`;

/** What a caller can see of an answer, with the address they typed taken out. */
function seen(res: Response, email: string) {
  return {
    status: res.status,
    body: JSON.parse(JSON.stringify(res.body).replaceAll(email, '<email>')),
    setsCookie: !!res.headers['set-cookie'],
    contentType: res.headers['content-type'],
  };
}

/** The mail sent to `email` after `earlier`, once the background work is done. */
async function mailTo(email: string, earlier: Set<unknown>) {
  await ctx.services.background.drain();
  return ctx.mailbox.messages.filter((m) => !earlier.has(m) && m.to.includes(email));
}

describe('the same answer for a known and an unknown e-mail', () => {
  it('at sign-up: 202 and the same words; the account holder is told, the new address gets a link', async () => {
    const unknown = fresh('new');
    const earlier = new Set(ctx.mailbox.messages);
    const linksOfKnown = () =>
      ctx.database.db.select().from(signUpTokens).where(eq(signUpTokens.email, known.email));
    const linksBefore = (await linksOfKnown()).length;
    const a = await ctx.agent().post('/api/auth/sign-up').send({ email: known.email });
    const b = await ctx.agent().post('/api/auth/sign-up').send({ email: unknown });
    expect(seen(a, known.email)).toEqual(seen(b, unknown));
    expect(a.status).toBe(202);
    expect(a.body.message).toMatch(/^Check your e-mail/);

    const [toKnown] = await mailTo(known.email, earlier);
    expect(toKnown!.subject).toBe('You already have a Rackside account');
    const [toUnknown] = await mailTo(unknown, earlier);
    expect(toUnknown!.subject).toBe('Finish making your Rackside account');
    expect(toUnknown!.text).toMatch(/http:\/\/rackside\.test\/sign-up\/finish\?token=[\w-]{43}/);
    // No link, and so no way in, was made for the address that has an account.
    expect(await linksOfKnown()).toHaveLength(linksBefore);
    expect(await ctx.database.db.select().from(users).where(eq(users.email, unknown))).toEqual([]);
  });

  it('at password reset: 202 and the same words; only the account gets a link', async () => {
    const unknown = fresh('ghost');
    const earlier = new Set(ctx.mailbox.messages);
    const a = await ctx.agent().post('/api/auth/reset-request').send({ email: known.email });
    const b = await ctx.agent().post('/api/auth/reset-request').send({ email: unknown });
    expect(seen(a, known.email)).toEqual(seen(b, unknown));
    expect(a.status).toBe(202);
    expect(await mailTo(known.email, earlier)).toHaveLength(1);
    expect(await mailTo(unknown, earlier)).toEqual([]);
    expect(
      await ctx.database.db
        .select()
        .from(passwordResets)
        .where(eq(passwordResets.userId, known.userId)),
    ).toHaveLength(1);
  });

  it('at a keeper invite: 202 and the same words; both get an invite, neither becomes a member', async () => {
    const unknown = fresh('partner');
    const earlier = new Set(ctx.mailbox.messages);
    const path = `/api/collections/${owner.collectionId}/members`;
    const a = await owner.agent.post(path).send({ email: known.email, role: 'keeper' });
    const b = await owner.agent.post(path).send({ email: unknown, role: 'keeper' });
    expect(seen(a, known.email)).toEqual(seen(b, unknown));
    expect(a.status).toBe(202);
    for (const email of [known.email, unknown]) {
      const [mail] = await mailTo(email, earlier);
      expect(mail!.subject).toBe(`Test Keeper invites you to keep Test Collection on Rackside`);
      expect(mail!.text).toMatch(/http:\/\/rackside\.test\/join\?token=[\w-]{43}/);
    }
    expect(
      await ctx.database.db
        .select()
        .from(memberships)
        .where(
          and(
            eq(memberships.collectionId, owner.collectionId),
            eq(memberships.userId, known.userId),
          ),
        ),
    ).toEqual([]);
    const list = (await owner.agent.get(path).expect(200)).body;
    expect(list.members.map((m: { email: string }) => m.email)).toEqual([owner.email]);
    expect(list.invites.map((i: { email: string }) => i.email).sort()).toEqual(
      [known.email, unknown].sort(),
    );
  });

  it('at a cover invite: 201 with an id either way', async () => {
    const unknown = fresh('sitter');
    const path = `/api/collections/${owner.collectionId}/covers`;
    const days = { firstDay: '2031-03-01', lastDay: '2031-03-03', message: '' };
    const a = await owner.agent.post(path).send({ email: known.email, ...days });
    const b = await owner.agent.post(path).send({ email: unknown, ...days });
    expect(a.status).toBe(201);
    expect(b.status).toBe(201);
    expect(Object.keys(a.body)).toEqual(Object.keys(b.body));
  });

  it('at sign-in: unknown e-mails are compared against a decoy made at the real cost (BCRYPT_COST)', async () => {
    // The test app runs at cost 10 (tests/setup/test-app.ts); bcrypt's hash names its cost.
    expect((await decoyHash(10)).slice(0, 7)).toBe('$2b$10$');
    expect((await decoyHash(11)).slice(0, 7)).toBe('$2b$11$');
  });
});

describe('finishing a sign-up from its link', () => {
  it('makes the account once; the link then, or a day later, no longer works', async () => {
    const email = fresh('finish');
    const token = await signUpLink(ctx, email);
    const preview = await ctx.agent().get(`/api/auth/sign-up/preview?token=${token}`).expect(200);
    expect(preview.body).toEqual({ email });
    const agent = ctx.agent();
    const made = await agent
      .post('/api/auth/sign-up/finish')
      .send({
        token,
        password: PASSWORD,
        displayName: 'Finch',
        collectionName: 'Finch racks',
        timeZone: 'Europe/London',
      })
      .expect(201);
    expect(made.body.user.email).toBe(email);
    expect(made.body.memberships).toMatchObject([
      { role: 'owner', collectionName: 'Finch racks', timeZone: 'Europe/London' },
    ]);
    await agent.get('/api/auth/me').expect(200);
    const again = await ctx.agent().post('/api/auth/sign-up/finish').send({
      token,
      password: PASSWORD,
      displayName: 'Eve',
      collectionName: 'Mine',
      timeZone: 'UTC',
    });
    expect(again.status).toBe(400);
    expect(again.body.error.message).toMatch(/expired or was already used/);

    const later = fresh('later');
    const stale = await signUpLink(ctx, later);
    ctx.setNow(new Date(Date.now() + 24 * 3_600_000 + 1_000));
    expect((await ctx.agent().get(`/api/auth/sign-up/preview?token=${stale}`)).status).toBe(400);
    ctx.setNow(null);
  });

  it('refuses a second account when two links for one address were asked for', async () => {
    const email = fresh('twice');
    const first = await signUpLink(ctx, email);
    const second = await signUpLink(ctx, email);
    await ctx
      .agent()
      .post('/api/auth/sign-up/finish')
      .send({
        token: first,
        password: PASSWORD,
        displayName: 'A',
        collectionName: 'A',
        timeZone: 'UTC',
      })
      .expect(201);
    const res = await ctx.agent().post('/api/auth/sign-up/finish').send({
      token: second,
      password: PASSWORD,
      displayName: 'B',
      collectionName: 'B',
      timeZone: 'UTC',
    });
    expect(res.status).toBe(409);
    expect(res.body.error.message).toMatch(/already exists/);
    expect(await ctx.database.db.select().from(users).where(eq(users.email, email))).toHaveLength(
      1,
    );
  });
});

describe('membership only by accepting an invite', () => {
  async function inviteKeeper(who: SignedUp, email: string) {
    const earlier = new Set(ctx.mailbox.messages);
    await who.agent
      .post(`/api/collections/${who.collectionId}/members`)
      .send({ email, role: 'keeper' })
      .expect(202);
    const [mail] = await mailTo(email, earlier);
    return /join\?token=([\w-]+)/.exec(mail!.text)![1]!;
  }

  it('an existing person joins as a keeper only when, signed in as the invited e-mail, they accept; a keeper may leave', async () => {
    const person = await signUp(ctx);
    const token = await inviteKeeper(owner, person.email);
    const preview = await ctx.agent().get(`/api/cover-invites/preview?token=${token}`).expect(200);
    expect(preview.body).toMatchObject({
      role: 'keeper',
      collectionName: 'Test Collection',
      invitedBy: 'Test Keeper',
      email: person.email,
      firstDay: null,
      lastDay: null,
      hasAccount: true,
    });
    // Someone else signed in cannot take the invite for them.
    expect((await known.agent.post('/api/cover-invites/accept').send({ token })).status).toBe(401);
    const accepted = await person.agent
      .post('/api/cover-invites/accept')
      .send({ token })
      .expect(200);
    expect(
      accepted.body.me.memberships.find(
        (m: { collectionId: string }) => m.collectionId === owner.collectionId,
      ),
    ).toMatchObject({ role: 'keeper', startsAt: null, endsAt: null });
    await person.agent.get(`/api/collections/${owner.collectionId}/animals`).expect(200);

    await person.agent.delete(`/api/collections/${owner.collectionId}/membership`).expect(204);
    expect((await person.agent.get(`/api/collections/${owner.collectionId}`)).status).toBe(404);
    const stays = await owner.agent.delete(`/api/collections/${owner.collectionId}/membership`);
    expect(stays.status).toBe(409);
    expect(stays.body.error.message).toBe(
      'You are the only owner: invite a co-owner first, or delete the collection.',
    );
  });

  it('someone new makes their account from the invite; an existing member cannot be invited again', async () => {
    const email = fresh('newkeeper');
    const token = await inviteKeeper(owner, email);
    const agent = ctx.agent();
    const res = await agent
      .post('/api/cover-invites/accept')
      .send({ token, account: { displayName: 'Nova', password: PASSWORD } })
      .expect(200);
    expect(res.body.me.memberships).toMatchObject([
      { collectionId: owner.collectionId, role: 'keeper' },
    ]);
    const again = await owner.agent
      .post(`/api/collections/${owner.collectionId}/members`)
      .send({ email, role: 'keeper' });
    expect(again.status).toBe(409);
  });
});

describe('invites are rate-limited per collection', () => {
  it('refuses the third invite of the day with 429, counting cover and keeper invites together, not refused ones', async () => {
    const limited = await createTestContext({ authLimits: { invitesPerCollection: 2 } });
    try {
      const boss = await signUp(limited);
      const other = await signUp(limited);
      const covers = `/api/collections/${boss.collectionId}/covers`;
      const members = `/api/collections/${boss.collectionId}/members`;
      const days = { firstDay: '2031-05-01', lastDay: '2031-05-02', message: 'Thanks!' };
      await boss.agent
        .post(covers)
        .send({ email: fresh('a'), ...days })
        .expect(201);
      // A refused request (a day already over) does not use the budget up.
      await boss.agent
        .post(covers)
        .send({ email: fresh('b'), firstDay: '2020-01-01', lastDay: '2020-01-02', message: '' })
        .expect(422);
      await boss.agent
        .post(members)
        .send({ email: fresh('c'), role: 'keeper' })
        .expect(202);
      const third = await boss.agent.post(covers).send({ email: fresh('d'), ...days });
      expect(third.status).toBe(429);
      expect(third.body.error.message).toBe(
        'This collection has sent 2 invites today. More can go tomorrow.',
      );
      expect(
        (await boss.agent.post(members).send({ email: fresh('e'), role: 'keeper' })).status,
      ).toBe(429);
      // Another collection has its own budget.
      await other.agent
        .post(`/api/collections/${other.collectionId}/covers`)
        .send({ email: fresh('f'), ...days })
        .expect(201);
    } finally {
      await limited.close();
    }
  });
});
