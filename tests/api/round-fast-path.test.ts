// Today's round is read with one query for the session and membership (P7) once a session has
// been used: these tests make sure that path refuses exactly what the full stack refuses, at once.
import { sql } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createAnimal, PASSWORD, signUp, type SignedUp } from '../factories';
import { createTestContext, type TestContext } from '../setup/test-app';

let ctx: TestContext;
let owner: SignedUp;
const today = (c: SignedUp) => `/api/collections/${c.collectionId}/rounds/today`;

beforeAll(async () => {
  ctx = await createTestContext();
  owner = await signUp(ctx);
  await createAnimal(ctx.database.db, owner.collectionId);
  // Today's round is built by its first read: later reads share one version of it.
  await ctx.services.rounds.build(
    owner.collectionId,
    ctx.services.rounds.today({ timeZone: 'America/Toronto' }),
  );
});
afterAll(async () => {
  await ctx.close();
});

/** A second account made a member of the owner's collection with `role`. */
async function member(role: 'keeper' | 'helper', startsAt?: Date, endsAt?: Date) {
  const other = await signUp(ctx);
  await ctx.database.db.execute(
    sql`insert into memberships (collection_id, user_id, role, starts_at, ends_at)
        values (${owner.collectionId}, ${other.userId}, ${role}, ${startsAt?.toISOString() ?? null}, ${endsAt?.toISOString() ?? null})`,
  );
  return other;
}

describe('reading today’s round on a session already in use', () => {
  it('answers from the one-query check (no cookie sent again) with the same round and ETag', async () => {
    const first = await owner.agent.get(today(owner)).expect(200);
    // The first request of a session refreshes its idle expiry and sends the cookie again.
    expect(first.headers['set-cookie']).toBeDefined();
    const second = await owner.agent.get(today(owner)).expect(200);
    expect(second.headers['set-cookie']).toBeUndefined();
    expect(second.headers.etag).toBe(first.headers.etag);
    expect(second.body).toEqual(first.body);
    await owner.agent.get(today(owner)).set('If-None-Match', first.headers.etag!).expect(304);
  });

  it('refuses a signed-out session, a tampered cookie and a session past its absolute timeout at once', async () => {
    const keeper = await member('keeper');
    const signIn = await ctx
      .agent()
      .post('/api/auth/sign-in')
      .send({ email: keeper.email, password: PASSWORD })
      .expect(200);
    const cookie = String(signIn.headers['set-cookie']![0]).split(';')[0]!;
    for (let i = 0; i < 2; i++)
      await ctx.agent().get(today(owner)).set('Cookie', cookie).expect(200);
    const [name, value] = cookie.split('=') as [string, string];
    const tampered = `${name}=${value.slice(0, -4)}${value.endsWith('AAAA') ? 'BBBB' : 'AAAA'}`;
    await ctx.agent().get(today(owner)).set('Cookie', tampered).expect(401);

    await ctx.database.db.execute(
      sql`update sessions set sess = jsonb_set(sess::jsonb, '{signedInAt}', to_jsonb(${Date.now() - 91 * 86_400_000}::bigint))::json where sess::jsonb ->> 'userId' = ${keeper.userId}`,
    );
    await keeper.agent.get(today(owner)).expect(401);

    const again = await member('keeper');
    await again.agent.get(today(owner)).expect(200);
    await again.agent.get(today(owner)).expect(200);
    await again.agent.post('/api/auth/sign-out').expect(204);
    await again.agent.get(today(owner)).expect(401);
  });

  it('refuses a removed member and a helper whose cover ended, from the next request on', async () => {
    const keeper = await member('keeper');
    await keeper.agent.get(today(owner)).expect(200);
    await keeper.agent.get(today(owner)).expect(200);
    await ctx.database.db.execute(
      sql`delete from memberships where collection_id = ${owner.collectionId} and user_id = ${keeper.userId}`,
    );
    await keeper.agent.get(today(owner)).expect(404);

    const now = Date.now();
    const helper = await member('helper', new Date(now - 3_600_000), new Date(now + 3_600_000));
    await helper.agent.get(today(owner)).expect(200);
    const during = await helper.agent.get(today(owner)).expect(200);
    expect(during.headers['set-cookie']).toBeUndefined();
    await ctx.database.db.execute(
      sql`update memberships set ends_at = ${new Date(now - 60_000).toISOString()} where user_id = ${helper.userId}`,
    );
    await helper.agent.get(today(owner)).expect(403);
    // A helper's round is the keeper's round: the same bytes for every member (no per-role view).
    const fromOwner = await owner.agent.get(today(owner)).expect(200);
    expect(fromOwner.headers.etag).toBe(during.headers.etag);
  });
});
