// A signed-in person starts another collection of their own (a partner's, or one to restore a
// backup into): they own it, it appears in their list, and a person whose collections were all
// deleted can start again.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { animalBody, signUp } from '../factories';
import { createTestContext, type TestContext } from '../setup/test-app';

let ctx: TestContext;

beforeAll(async () => {
  ctx = await createTestContext();
});
afterAll(async () => {
  await ctx?.close();
});

describe('starting a new collection', () => {
  it('makes the person its owner and lists it beside their first one', async () => {
    const me = await signUp(ctx);
    const res = await me.agent
      .post('/api/collections')
      .send({ name: '  Shed colony ', timeZone: 'Europe/Berlin' })
      .expect(201);
    expect(res.body).toEqual({
      id: expect.any(String),
      name: 'Shed colony',
      timeZone: 'Europe/Berlin',
      role: 'owner',
    });
    const mine = (await me.agent.get('/api/collections').expect(200)).body.memberships as {
      collectionId: string;
      collectionName: string;
      role: string;
      labelTag: string;
    }[];
    expect(mine.map((m) => m.collectionId)).toEqual(
      expect.arrayContaining([me.collectionId, res.body.id]),
    );
    const fresh = mine.find((m) => m.collectionId === res.body.id)!;
    expect(fresh).toMatchObject({ collectionName: 'Shed colony', role: 'owner' });
    // Its own label tag, so labels from the two never mix.
    expect(fresh.labelTag).not.toBe(mine.find((m) => m.collectionId === me.collectionId)!.labelTag);
    // It works like any other: an owner's routes answer and it starts empty.
    const c = `/api/collections/${res.body.id}`;
    expect((await me.agent.get(`${c}/animals`).expect(200)).body.animals).toEqual([]);
    await me.agent.post(`${c}/animals`).send(animalBody()).expect(201);
    // The first collection is untouched.
    expect(
      (await me.agent.get(`/api/collections/${me.collectionId}/animals`).expect(200)).body.animals,
    ).toEqual([]);
  });

  it('works for someone whose only collection was deleted', async () => {
    const me = await signUp(ctx);
    await me.agent
      .delete(`/api/collections/${me.collectionId}`)
      .send({ confirmName: 'Test Collection' })
      .expect(204);
    expect((await me.agent.get('/api/auth/me').expect(200)).body.memberships).toEqual([]);
    const res = await me.agent
      .post('/api/collections')
      .send({ name: 'Fresh start', timeZone: 'America/Toronto' })
      .expect(201);
    const after = (await me.agent.get('/api/auth/me').expect(200)).body.memberships;
    expect(after).toHaveLength(1);
    expect(after[0]).toMatchObject({ collectionId: res.body.id, role: 'owner' });
  });

  it('refuses a missing name or an unknown time zone with a sentence, and strangers', async () => {
    const me = await signUp(ctx);
    const noName = await me.agent
      .post('/api/collections')
      .send({ name: '   ', timeZone: 'Europe/Berlin' })
      .expect(422);
    expect(JSON.stringify(noName.body)).toContain('Name your collection.');
    const badZone = await me.agent
      .post('/api/collections')
      .send({ name: 'Somewhere', timeZone: 'Mars/Olympus' })
      .expect(422);
    expect(JSON.stringify(badZone.body)).toContain('time zone');
    await ctx
      .agent()
      .post('/api/collections')
      .send({ name: 'Nobody’s', timeZone: 'Europe/Berlin' })
      .expect(401);
  });
});
