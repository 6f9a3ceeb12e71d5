// An owner can delete a collection (confirmed by typing its name): every row of it and every
// photo file goes, for every member. Nobody else can, and a wrong name deletes nothing.
import { randomUUID } from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';
import { eq, sql } from 'drizzle-orm';
import sharp from 'sharp';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { animals, events } from '../../server/db/schema/animals';
import { collections, memberships } from '../../server/db/schema/collections';
import { collectionRevisions } from '../../server/db/schema/rounds';
import { addMember, animalBody, signUp, type SignedUp } from '../factories';
import { createTestContext, type TestContext } from '../setup/test-app';

let ctx: TestContext;
let owner: SignedUp;
let keeper: SignedUp;
let helper: SignedUp;
let outsider: SignedUp;
let bystander: SignedUp;

const base = (who: SignedUp) => `/api/collections/${who.collectionId}`;
const photoDir = (collectionId: string) => path.join(ctx.storageDir, 'photos', collectionId);

/** A collection with a place, an animal with a photo, a tap and a molt photo. */
async function fill(who: SignedUp) {
  const c = base(who);
  const place = (
    await who.agent
      .post(`${c}/locations`)
      .send({ room: 'Spare room', rack: 'A', shelf: '1', position: '1' })
      .expect(201)
  ).body.id as string;
  const animal = (
    await who.agent
      .post(`${c}/animals`)
      .send(animalBody({ locationId: place }))
      .expect(201)
  ).body;
  const jpeg = await sharp({ create: { width: 40, height: 30, channels: 3, background: '#553' } })
    .jpeg()
    .toBuffer();
  await who.agent
    .put(`${c}/animals/${animal.id}/photo`)
    .attach('photo', jpeg, { filename: 'a.jpg' })
    .expect(200);
  const molt = {
    id: randomUUID(),
    animalId: animal.id,
    kind: 'molted',
    payload: {},
    clientRecordedAt: new Date().toISOString(),
  };
  await who.agent
    .post(`${c}/events`)
    .send({ deviceId: 'd', clientSentAt: new Date().toISOString(), events: [molt] })
    .expect(200);
  await who.agent
    .put(`${c}/animals/${animal.id}/molts/${molt.id}/photo`)
    .attach('photo', jpeg, { filename: 'm.jpg' })
    .expect(204);
  await who.agent.get(`${c}/rounds/today`).expect(200);
  // A feeder colony with a count and a chore.
  const colony = (
    await who.agent
      .post(`${c}/colonies`)
      .send({
        name: 'Dubia bin',
        species: '',
        preyType: 'roach',
        sizes: ['adult'],
        intervals: { feed: 3, water_gel: 3, clean: 14, split: null },
      })
      .expect(201)
  ).body.id as string;
  await who.agent
    .post(`${c}/colonies/${colony}/counts`)
    .send({ counts: [{ preySize: 'adult', count: 20 }] })
    .expect(200);
  await who.agent
    .post(`${c}/chores`)
    .send({
      clientSentAt: new Date().toISOString(),
      chores: [
        {
          id: randomUUID(),
          subjectKind: 'colony',
          subjectId: colony,
          kind: 'feed',
          clientRecordedAt: new Date().toISOString(),
        },
      ],
    })
    .expect(200);
}

async function rowsOf(collectionId: string) {
  const db = ctx.database.db;
  const count = async (table: string) =>
    Number(
      (
        await db.execute<{ n: string }>(
          sql`select count(*) as n from ${sql.identifier(table)} where collection_id = ${collectionId}`,
        )
      ).rows[0]!.n,
    );
  return {
    collections: (await db.select().from(collections).where(eq(collections.id, collectionId)))
      .length,
    memberships: (
      await db.select().from(memberships).where(eq(memberships.collectionId, collectionId))
    ).length,
    animals: (await db.select().from(animals).where(eq(animals.collectionId, collectionId))).length,
    events: (await db.select().from(events).where(eq(events.collectionId, collectionId))).length,
    locations: await count('locations'),
    event_photos: await count('event_photos'),
    animal_states: await count('animal_states'),
    rounds: await count('rounds'),
    colonies: await count('colonies'),
    chores: await count('chores'),
    stock_changes: Number(
      (
        await db.execute<{ n: string }>(
          sql`select count(*) as n from colony_stock_changes s join colonies c on c.id = s.colony_id where c.collection_id = ${collectionId}`,
        )
      ).rows[0]!.n,
    ),
    revisions: (
      await db
        .select()
        .from(collectionRevisions)
        .where(eq(collectionRevisions.collectionId, collectionId))
    ).length,
  };
}

beforeAll(async () => {
  ctx = await createTestContext();
  [owner, keeper, helper, outsider, bystander] = [
    await signUp(ctx),
    await signUp(ctx),
    await signUp(ctx),
    await signUp(ctx),
    await signUp(ctx),
  ];
  await addMember(ctx.database.db, {
    collectionId: owner.collectionId,
    userId: keeper.userId,
    role: 'keeper',
  });
  await addMember(ctx.database.db, {
    collectionId: owner.collectionId,
    userId: helper.userId,
    role: 'helper',
    startsAt: new Date(Date.now() - 3_600_000),
    endsAt: new Date(Date.now() + 86_400_000),
  });
  await fill(owner);
  await fill(bystander);
});
afterAll(async () => {
  await ctx.close();
});

describe('deleting a collection', () => {
  it('is refused to keepers, helpers and outsiders, and for a name typed wrong', async () => {
    const body = { confirmName: 'Test Collection' };
    expect((await keeper.agent.delete(base(owner)).send(body)).status).toBe(403);
    expect((await helper.agent.delete(base(owner)).send(body)).status).toBe(403);
    expect((await outsider.agent.delete(base(owner)).send(body)).status).toBe(404);
    expect((await ctx.agent().delete(base(owner)).send(body)).status).toBe(401);
    const wrong = await owner.agent
      .delete(base(owner))
      .send({ confirmName: 'test collection!' })
      .expect(422);
    expect(wrong.body.error.message).toBe(
      'Type the collection’s name exactly as it is shown (“Test Collection”) to delete it.',
    );
    expect((await owner.agent.delete(base(owner)).send({})).status).toBe(422);
    const rows = await rowsOf(owner.collectionId);
    expect(rows).toMatchObject({
      collections: 1,
      memberships: 3,
      animals: 1,
      events: 1,
      locations: 1,
      event_photos: 1,
    });
    expect(fs.readdirSync(photoDir(owner.collectionId))).toHaveLength(4);
  });

  it('removes every row and photo of it for everyone, and nothing of another collection', async () => {
    const before = await rowsOf(bystander.collectionId);
    const theirFiles = fs.readdirSync(photoDir(bystander.collectionId)).sort();
    await owner.agent.delete(base(owner)).send({ confirmName: '  Test Collection ' }).expect(204);

    expect(await rowsOf(owner.collectionId)).toEqual({
      collections: 0,
      memberships: 0,
      animals: 0,
      events: 0,
      locations: 0,
      event_photos: 0,
      animal_states: 0,
      rounds: 0,
      colonies: 0,
      chores: 0,
      stock_changes: 0,
      revisions: 0,
    });
    expect(fs.existsSync(photoDir(owner.collectionId))).toBe(false);
    // Its members no longer see it; its routes answer as for any unknown collection.
    for (const who of [owner, keeper, helper]) {
      const listed = (await who.agent.get('/api/collections').expect(200)).body.memberships as {
        collectionId: string;
      }[];
      expect(listed.map((m) => m.collectionId)).not.toContain(owner.collectionId);
    }
    expect((await keeper.agent.get(`${base(owner)}/animals`)).status).toBe(404);
    // The accounts stay: the owner can still sign in and use the app.
    await owner.agent.get('/api/auth/me').expect(200);

    expect(await rowsOf(bystander.collectionId)).toEqual(before);
    expect(fs.readdirSync(photoDir(bystander.collectionId)).sort()).toEqual(theirFiles);
  });
});
