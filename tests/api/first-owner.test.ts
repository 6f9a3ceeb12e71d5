// A server started without the demo has no account: its first visitor makes the first owner's
// account there and then (no e-mail link: there may be no mail server yet), and only once.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { firstRunResponse, meResponse } from '#shared/schemas/auth';
import { PASSWORD } from '../factories';
import { createTestContext, type TestContext } from '../setup/test-app';

let ctx: TestContext;
let race: TestContext;

const details = (email: string) => ({
  email,
  password: PASSWORD,
  displayName: 'First Keeper',
  collectionName: 'Spare room racks',
  timeZone: 'Europe/Berlin',
});

beforeAll(async () => {
  [ctx, race] = await Promise.all([createTestContext(), createTestContext()]);
}, 60_000);

afterAll(async () => {
  await Promise.all([ctx?.close(), race?.close()]);
});

describe('the first visit to an empty server', () => {
  it('is offered the first-owner form, and refuses a form that is not filled in', async () => {
    const res = await ctx.agent().get('/api/auth/first-run').expect(200);
    expect(firstRunResponse.parse(res.body)).toEqual({ firstOwner: true });
    const bad = await ctx
      .agent()
      .post('/api/auth/first-owner')
      .send({ ...details('not an address'), password: 'short' })
      .expect(422);
    expect(JSON.stringify(bad.body)).toMatch(/e-mail address/);
    expect(JSON.stringify(bad.body)).toMatch(/at least 12 characters/);
    // Nothing was made.
    expect((await ctx.agent().get('/api/auth/first-run')).body).toEqual({ firstOwner: true });
  });

  it('makes the owner, their collection and a session, with no e-mail sent', async () => {
    const agent = ctx.agent();
    const res = await agent
      .post('/api/auth/first-owner')
      .send(details('First@Keeper.Example'))
      .expect(201);
    const me = meResponse.parse(res.body);
    expect(me.user.email).toBe('first@keeper.example');
    expect(me.memberships).toEqual([
      expect.objectContaining({ role: 'owner', collectionName: 'Spare room racks' }),
    ]);
    // Signed in: the collection is theirs to use at once.
    const collectionId = me.memberships[0]!.collectionId;
    await agent.get('/api/auth/me').expect(200);
    await agent.get(`/api/collections/${collectionId}/animals`).expect(200);
    expect(ctx.mailbox.messages.some((m) => m.to.includes('first@keeper.example'))).toBe(false);
    // And they sign in with that password later.
    await ctx
      .agent()
      .post('/api/auth/sign-in')
      .send({ email: 'first@keeper.example', password: PASSWORD })
      .expect(200);
  });

  it('is closed once the first account exists: the next visitor is told to sign in', async () => {
    expect((await ctx.agent().get('/api/auth/first-run')).body).toEqual({ firstOwner: false });
    const res = await ctx
      .agent()
      .post('/api/auth/first-owner')
      .send(details('second@keeper.example'))
      .expect(409);
    expect(res.body.error.message).toMatch(/already has its first account\. Sign in/);
  });

  it('makes one owner when two visitors send the form at the same moment', async () => {
    const answers = await Promise.all(
      ['a', 'b', 'c'].map((n) =>
        race
          .agent()
          .post('/api/auth/first-owner')
          .send(details(`${n}@race.example`)),
      ),
    );
    expect(answers.map((r) => r.status).sort()).toEqual([201, 409, 409]);
    const owners = await race.database.pool.query('select count(*)::int as n from users');
    expect(owners.rows[0].n).toBe(1);
  });
});
