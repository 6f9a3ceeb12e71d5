// A sync batch is checked with one query for the session and membership (P5) once a session
// has been used: these tests make sure that path stores and refuses exactly what the full stack
// does, at once.
import { randomUUID } from 'node:crypto';
import { inArray, sql } from 'drizzle-orm';
import supertest from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { MAX_BATCH_EVENTS } from '#shared/domain/sync-limits';
import { events } from '../../server/db/schema/animals';
import { addMember, createAnimal, signUp, type SignedUp } from '../factories';
import { createTestContext, type TestContext } from '../setup/test-app';

let ctx: TestContext;
let owner: SignedUp;
let animalId: string;
const url = () => `/api/collections/${owner.collectionId}/events`;
const tap = (kind: string, at = new Date(Date.now() - 60_000)) => ({
  id: randomUUID(),
  animalId,
  kind,
  payload: {},
  clientRecordedAt: at.toISOString(),
});
const batch = (list: unknown[]) => ({
  deviceId: 'fast-path-test',
  clientSentAt: new Date().toISOString(),
  events: list,
});
const stored = async (ids: string[]) =>
  (
    await ctx.database.db
      .select({ id: events.id, by: events.recordedBy })
      .from(events)
      .where(inArray(events.id, ids))
  ).sort((a, b) => a.id.localeCompare(b.id));

/** An account made a member of the owner's collection, its session used once already. */
async function usedMember(role: 'keeper' | 'helper', startsAt?: Date, endsAt?: Date) {
  const other = await signUp(ctx);
  await addMember(ctx.database.db, {
    collectionId: owner.collectionId,
    userId: other.userId,
    role,
    startsAt,
    endsAt,
  });
  await other.agent.post(url()).send(batch([])).expect(200);
  return other;
}

beforeAll(async () => {
  ctx = await createTestContext();
  owner = await signUp(ctx);
  animalId = (await createAnimal(ctx.database.db, owner.collectionId)).id;
  await owner.agent.post(url()).send(batch([])).expect(200);
});
afterAll(async () => {
  await ctx.close();
});

describe('syncing on a session already in use', () => {
  it('stores each tap once, as its sender’s, and a re-sent batch is duplicates', async () => {
    const keeper = await usedMember('keeper');
    const list = [tap('ate'), tap('watered')];
    const first = await keeper.agent.post(url()).send(batch(list)).expect(200);
    expect(first.body.results).toEqual(list.map((e) => ({ id: e.id, status: 'accepted' })));
    const again = await keeper.agent.post(url()).send(batch(list)).expect(200);
    expect(again.body.results).toEqual(list.map((e) => ({ id: e.id, status: 'duplicate' })));
    expect(await stored(list.map((e) => e.id))).toEqual(
      list.map((e) => ({ id: e.id, by: keeper.userId })).sort((a, b) => a.id.localeCompare(b.id)),
    );
  });

  it('refuses a foreign page, a missing app header, a bad body and a too-large batch as the full stack does', async () => {
    const crossSite = await owner.agent
      .post(url())
      .set('Origin', 'https://evil.example')
      .send(batch([tap('watered')]))
      .expect(403);
    expect(crossSite.body.error.code).toBe('csrf');
    const noHeader = await owner.agent
      .post(url())
      .set('X-Rackside-Client', '0')
      .send(batch([tap('watered')]))
      .expect(403);
    expect(noHeader.body.error.code).toBe('csrf');
    const bad = await owner.agent.post(url()).send({ deviceId: 'x', events: 'none' }).expect(422);
    expect(bad.body.error.code).toBe('invalid');
    const list = Array.from({ length: MAX_BATCH_EVENTS + 1 }, () => tap('watered'));
    const big = await owner.agent.post(url()).send(batch(list)).expect(413);
    expect(big.body.error.code).toBe('batch_too_large');
    expect(await stored(list.map((e) => e.id))).toEqual([]);
  });

  it('refuses a stranger, a removed member, a signed-out session and no session', async () => {
    const stranger = await signUp(ctx);
    await stranger.agent.post(`/api/collections/${stranger.collectionId}/events`).send(batch([]));
    await stranger.agent
      .post(url())
      .send(batch([tap('watered')]))
      .expect(404);

    const keeper = await usedMember('keeper');
    await ctx.database.db.execute(
      sql`delete from memberships where collection_id = ${owner.collectionId} and user_id = ${keeper.userId}`,
    );
    await keeper.agent
      .post(url())
      .send(batch([tap('watered')]))
      .expect(404);

    const leaving = await usedMember('keeper');
    await leaving.agent.post('/api/auth/sign-out').expect(204);
    await leaving.agent
      .post(url())
      .send(batch([tap('watered')]))
      .expect(401);
    await supertest(ctx.app)
      .post(url())
      .set('X-Rackside-Client', '1')
      .send(batch([tap('watered')]))
      .expect(401);
  });

  it('gives a helper whose cover has ended a verdict per tap (the route judges the window)', async () => {
    const now = Date.now();
    const helper = await usedMember(
      'helper',
      new Date(now - 3 * 3_600_000),
      new Date(now + 3_600_000),
    );
    await ctx.database.db.execute(
      sql`update memberships set ends_at = ${new Date(now - 3_600_000).toISOString()} where user_id = ${helper.userId}`,
    );
    const during = tap('watered', new Date(now - 2 * 3_600_000));
    const after = tap('watered', new Date(now - 60_000));
    const res = await helper.agent
      .post(url())
      .send(batch([during, after]))
      .expect(200);
    expect(res.body.results[0]).toEqual({ id: during.id, status: 'accepted' });
    expect(res.body.results[1]).toMatchObject({ status: 'rejected', reason: 'outside_cover' });
    expect(await stored([during.id, after.id])).toEqual([{ id: during.id, by: helper.userId }]);
  });
});
