// Inviting a keeper or a partner (co-owner) by e-mail: only owners invite, the person joins only
// by accepting the link, the link works once and for a week, and an owner can see, send again
// or cancel an invite still waiting for an answer.
import { randomUUID } from 'node:crypto';
import { afterAll, afterEach, beforeAll, describe, expect, it } from 'vitest';
import { addMember, PASSWORD, signUp, type SignedUp } from '../factories';
import { createTestContext, type TestContext } from '../setup/test-app';

let ctx: TestContext;
let owner: SignedUp;
let keeper: SignedUp;

const base = () => `/api/collections/${owner.collectionId}`;
const tokenIn = (text: string) => /join\?token=([\w-]+)/.exec(text)![1]!;

beforeAll(async () => {
  ctx = await createTestContext();
  owner = await signUp(ctx);
  keeper = await signUp(ctx);
  await addMember(ctx.database.db, {
    collectionId: owner.collectionId,
    userId: keeper.userId,
    role: 'keeper',
  });
});
afterEach(() => ctx.setNow(null));
afterAll(async () => {
  await ctx.close();
});

/** Sends an invite and returns the token of the e-mail it produced (the latest to that address). */
async function invite(email: string, role: 'keeper' | 'owner' = 'keeper') {
  const before = ctx.mailbox.messages.filter((m) => m.to.includes(email)).length;
  const res = await owner.agent.post(`${base()}/members`).send({ email, role });
  expect(res.status).toBe(202);
  await ctx.services.background.drain();
  const mails = ctx.mailbox.messages.filter((m) => m.to.includes(email));
  expect(mails.length).toBe(before + 1);
  return { token: tokenIn(mails.at(-1)!.text), mail: mails.at(-1)! };
}

const pending = async () =>
  (await owner.agent.get(`${base()}/members`).expect(200)).body.invites as {
    id: string;
    email: string;
    role: string;
    expired: boolean;
    sentAt: string;
    expiresAt: string;
  }[];

describe('who may invite', () => {
  it('lets only an owner invite, list, resend or cancel; a keeper gets 403 and no mail goes', async () => {
    const email = `nope-${randomUUID().slice(0, 6)}@example.test`;
    const asKeeper = await keeper.agent.post(`${base()}/members`).send({ email, role: 'owner' });
    expect(asKeeper.status).toBe(403);
    expect(asKeeper.body.error.message).toBe('Your role in this collection does not allow this.');
    const { token } = await invite(email);
    const [mine] = (await pending()).filter((i) => i.email === email);
    expect((await keeper.agent.get(`${base()}/members`)).status).toBe(403);
    expect((await keeper.agent.post(`${base()}/invites/${mine!.id}/resend`)).status).toBe(403);
    expect((await keeper.agent.delete(`${base()}/invites/${mine!.id}`)).status).toBe(403);
    // Someone else's collection does not see the invite at all.
    const stranger = await signUp(ctx);
    expect(
      (await stranger.agent.delete(`/api/collections/${stranger.collectionId}/invites/${mine!.id}`))
        .status,
    ).toBe(404);
    await ctx.services.background.drain();
    expect(ctx.mailbox.messages.filter((m) => m.to.includes(email))).toHaveLength(1);
    expect(token.length).toBeGreaterThan(20);
  });

  it('refuses a bad role or e-mail with a readable 4xx, and someone already in that role', async () => {
    const bad = await owner.agent
      .post(`${base()}/members`)
      .send({ email: 'x@y.test', role: 'helper' });
    expect(bad.status).toBe(422);
    expect(JSON.stringify(bad.body.error)).toContain('Choose keeper or co-owner.');
    const worse = await owner.agent.post(`${base()}/members`).send({ email: 'not an address' });
    expect(worse.status).toBe(422);
    const again = await owner.agent
      .post(`${base()}/members`)
      .send({ email: keeper.email, role: 'keeper' });
    expect(again.status).toBe(409);
    expect(again.body.error.message).toMatch(/already keeps this collection/);
    const self = await owner.agent
      .post(`${base()}/members`)
      .send({ email: owner.email, role: 'owner' });
    expect(self.status).toBe(409);
    expect(self.body.error.message).toBe('That person already owns this collection.');
  });
});

describe('a partner as co-owner', () => {
  it('joins as an owner on accepting, and may then manage members; the link works once', async () => {
    const email = `partner-${randomUUID().slice(0, 6)}@example.test`;
    const { token, mail } = await invite(email, 'owner');
    expect(mail.subject).toContain('invites you to co-own');
    const preview = await ctx.agent().get(`/api/cover-invites/preview?token=${token}`).expect(200);
    expect(preview.body).toMatchObject({ role: 'owner', email, hasAccount: false });
    const partner = ctx.agent();
    const accepted = await partner
      .post('/api/cover-invites/accept')
      .send({ token, account: { displayName: 'Pat', password: PASSWORD } })
      .expect(200);
    expect(accepted.body.collectionId).toBe(owner.collectionId);
    expect((await partner.get(base()).expect(200)).body.role).toBe('owner');
    await partner.get(`${base()}/members`).expect(200);
    expect((await pending()).map((i) => i.email)).not.toContain(email);

    // Single use: the same link again, signed in or not, is refused with a readable message.
    const twice = await partner.post('/api/cover-invites/accept').send({ token });
    expect(twice.status).toBe(400);
    expect(twice.body.error.message).toMatch(/already used/);

    // With two owners, one may leave; the last one may not.
    await partner.delete(`${base()}/membership`).expect(204);
    expect((await partner.get(base())).status).toBe(404);
    const last = await owner.agent.delete(`${base()}/membership`);
    expect(last.status).toBe(409);
    expect(last.body.error.message).toBe(
      'You are the only owner: invite a co-owner first, or delete the collection.',
    );
  });

  it('moves a keeper up to co-owner when they accept, never a co-owner down', async () => {
    const other = await signUp(ctx);
    await addMember(ctx.database.db, {
      collectionId: owner.collectionId,
      userId: other.userId,
      role: 'keeper',
    });
    const { token } = await invite(other.email, 'owner');
    await other.agent.post('/api/cover-invites/accept').send({ token }).expect(200);
    expect((await other.agent.get(base()).expect(200)).body.role).toBe('owner');
    const down = await owner.agent.post(`${base()}/members`).send({ email: other.email });
    expect(down.status).toBe(409);
  });
});

describe('a pending invite', () => {
  it('is listed with its role and dates, expires after a week and can then be sent again', async () => {
    ctx.setNow(new Date('2026-12-01T10:00:00Z'));
    const email = `late-${randomUUID().slice(0, 6)}@example.test`;
    const { token } = await invite(email);
    const [listed] = (await pending()).filter((i) => i.email === email);
    expect(listed).toMatchObject({
      role: 'keeper',
      expired: false,
      sentAt: '2026-12-01T10:00:00.000Z',
      expiresAt: '2026-12-08T10:00:00.000Z',
    });

    ctx.setNow(new Date('2026-12-08T10:00:01Z'));
    const late = await ctx
      .agent()
      .post('/api/cover-invites/accept')
      .send({
        token,
        account: { displayName: 'Late', password: PASSWORD },
      });
    expect(late.status).toBe(400);
    expect(late.body.error.message).toBe(
      'This invite link has expired. Ask the keeper to send a new one.',
    );
    expect((await pending()).find((i) => i.email === email)?.expired).toBe(true);

    // Sent again: a new link for a new week; the old one stays dead.
    const resent = await owner.agent.post(`${base()}/invites/${listed!.id}/resend`).expect(202);
    expect(resent.body.message).toMatch(/earlier link no longer works/);
    await ctx.services.background.drain();
    const fresh = tokenIn(ctx.mailbox.messages.filter((m) => m.to.includes(email)).at(-1)!.text);
    expect(fresh).not.toBe(token);
    expect((await pending()).find((i) => i.email === email)).toMatchObject({
      expired: false,
      expiresAt: '2026-12-15T10:00:01.000Z',
    });
    const old = await ctx.agent().post('/api/cover-invites/accept').send({ token });
    expect(old.status).toBe(400);
    expect(old.body.error.message).toMatch(/not valid/);
    const joined = ctx.agent();
    await joined
      .post('/api/cover-invites/accept')
      .send({ token: fresh, account: { displayName: 'Late', password: PASSWORD } })
      .expect(200);
    expect((await joined.get(base()).expect(200)).body.role).toBe('keeper');
    // Answered: nothing left to resend or cancel.
    expect((await owner.agent.post(`${base()}/invites/${listed!.id}/resend`)).status).toBe(404);
    expect((await owner.agent.delete(`${base()}/invites/${listed!.id}`)).status).toBe(404);
  });

  it('once cancelled, leaves the list and its link says it was cancelled', async () => {
    const email = `revoked-${randomUUID().slice(0, 6)}@example.test`;
    const { token } = await invite(email);
    const [listed] = (await pending()).filter((i) => i.email === email);
    await owner.agent.delete(`${base()}/invites/${listed!.id}`).expect(204);
    expect((await pending()).map((i) => i.email)).not.toContain(email);
    const preview = await ctx.agent().get(`/api/cover-invites/preview?token=${token}`);
    expect(preview.status).toBe(400);
    expect(preview.body.error.message).toBe(
      'This invite was cancelled by the owner. Ask them to send a new one if it was a mistake.',
    );
    const use = await ctx
      .agent()
      .post('/api/cover-invites/accept')
      .send({ token, account: { displayName: 'Nobody', password: PASSWORD } });
    expect(use.status).toBe(400);
    expect((await owner.agent.delete(`${base()}/invites/${listed!.id}`)).status).toBe(404);
    expect((await owner.agent.delete(`${base()}/invites/not-a-uuid`)).status).toBe(422);
  });
});
