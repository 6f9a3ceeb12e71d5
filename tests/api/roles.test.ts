import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { addMember, createAnimal, signUp, type SignedUp } from '../factories';
import { createTestContext, type TestContext } from '../setup/test-app';

let ctx: TestContext;
let owner: SignedUp;
let keeper: SignedUp;
let helper: SignedUp;
let outsider: SignedUp;

// The helper covers 10–16 Dec 2026 in Toronto (EST, UTC−5): 05:00Z on the 10th to 05:00Z on the 17th.
const coverStart = new Date('2026-12-10T05:00:00Z');
const coverEnd = new Date('2026-12-17T05:00:00Z');

beforeAll(async () => {
  ctx = await createTestContext();
  owner = await signUp(ctx);
  keeper = await signUp(ctx);
  helper = await signUp(ctx);
  outsider = await signUp(ctx);
  const db = ctx.database.db;
  await addMember(db, { collectionId: owner.collectionId, userId: keeper.userId, role: 'keeper' });
  await addMember(db, {
    collectionId: owner.collectionId,
    userId: helper.userId,
    role: 'helper',
    startsAt: coverStart,
    endsAt: coverEnd,
  });
  await createAnimal(db, owner.collectionId, { name: 'Juniper' });
});
afterAll(async () => {
  await ctx.close();
});

describe('membership check on /api/collections/:id', () => {
  it('hides a collection from a non-member (404, existence not revealed)', async () => {
    const res = await outsider.agent.get(`/api/collections/${owner.collectionId}`);
    expect(res.status).toBe(404);
    const missing = await outsider.agent.get(
      '/api/collections/00000000-0000-4000-8000-000000000000',
    );
    expect(missing.status).toBe(404);
    expect(missing.body).toEqual(res.body);
    expect((await outsider.agent.get('/api/collections/not-a-uuid')).status).toBe(404);
  });

  it('asks an anonymous caller to sign in (401)', async () => {
    expect((await ctx.agent().get(`/api/collections/${owner.collectionId}`)).status).toBe(401);
  });

  it('lets owner and keeper read the animals', async () => {
    for (const who of [owner, keeper]) {
      const res = await who.agent.get(`/api/collections/${owner.collectionId}/animals`).expect(200);
      expect(res.body.animals.map((a: { name: string }) => a.name)).toEqual(['Juniper']);
    }
  });

  it('refuses a helper outside the cover window with 403 and says when the cover runs', async () => {
    for (const [when, message] of [
      [
        new Date('2026-12-10T04:59:59Z'),
        'Your cover for Test Collection runs from Thu 10 Dec 2026 to Wed 16 Dec 2026.',
      ],
      [coverEnd, 'Your cover for Test Collection ended on Wed 16 Dec 2026. Thank you!'],
    ] as const) {
      ctx.setNow(when);
      const res = await helper.agent.get(`/api/collections/${owner.collectionId}`);
      expect(res.status).toBe(403);
      expect(res.body.error.code).toBe('cover_not_running');
      expect(res.body.error.message).toBe(message);
    }
    ctx.setNow(null);
  });

  it('lets a helper in during the window, but only as a helper', async () => {
    ctx.setNow(new Date('2026-12-12T15:00:00Z'));
    try {
      const res = await helper.agent.get(`/api/collections/${owner.collectionId}`).expect(200);
      expect(res.body.role).toBe('helper');
      expect(
        (await helper.agent.get(`/api/collections/${owner.collectionId}/members`)).status,
      ).toBe(403);
    } finally {
      ctx.setNow(null);
    }
  });

  it('lets only the owner manage members; a keeper cannot', async () => {
    const newcomer = await signUp(ctx);
    const asKeeper = await keeper.agent
      .post(`/api/collections/${owner.collectionId}/members`)
      .send({ email: newcomer.email, role: 'keeper' });
    expect(asKeeper.status).toBe(403);
    expect((await keeper.agent.get(`/api/collections/${owner.collectionId}/members`)).status).toBe(
      403,
    );
    expect(
      (await keeper.agent.delete(`/api/collections/${owner.collectionId}/members/${helper.userId}`))
        .status,
    ).toBe(403);

    // An invite, not an addition: nothing changes for the newcomer until they accept it.
    const invited = await owner.agent
      .post(`/api/collections/${owner.collectionId}/members`)
      .send({ email: newcomer.email, role: 'keeper' });
    expect(invited.status).toBe(202);
    expect((await newcomer.agent.get(`/api/collections/${owner.collectionId}`)).status).toBe(404);
    const mail = await ctx.mailbox.waitFor(
      (m) => m.to.includes(newcomer.email) && m.subject.includes('invites you to keep'),
    );
    const token = /join\?token=([\w-]+)/.exec(mail.text)![1]!;
    await newcomer.agent.post('/api/cover-invites/accept').send({ token }).expect(200);
    await newcomer.agent.get(`/api/collections/${owner.collectionId}/animals`).expect(200);
    await owner.agent
      .delete(`/api/collections/${owner.collectionId}/members/${newcomer.userId}`)
      .expect(204);
    expect((await newcomer.agent.get(`/api/collections/${owner.collectionId}`)).status).toBe(404);
  });

  it('lists every collection a person belongs to, so the app can switch', async () => {
    const res = await keeper.agent.get('/api/collections').expect(200);
    expect(res.body.memberships.map((m: { role: string }) => m.role).sort()).toEqual([
      'keeper',
      'owner',
    ]);
  });
});
