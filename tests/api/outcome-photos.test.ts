// A round outcome with a note (in the event's own data, as the phone queued it) and a photo
// sent once the outcome has reached the server.
import { randomUUID } from 'node:crypto';
import sharp from 'sharp';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { addMember, createAnimal, signUp, type SignedUp } from '../factories';
import { createTestContext, type TestContext } from '../setup/test-app';

let ctx: TestContext;
let keeper: SignedUp;
let helper: SignedUp;
let outsider: SignedUp;

const base = () => `/api/collections/${keeper.collectionId}`;
const send = (who: SignedUp, list: object[]) =>
  who.agent
    .post(`${base()}/events`)
    .send({ deviceId: 'd', clientSentAt: new Date().toISOString(), events: list })
    .expect(200);
const tap = (animalId: string, kind: string, payload: object = {}) => ({
  id: randomUUID(),
  animalId,
  kind,
  payload,
  clientRecordedAt: new Date().toISOString(),
});

beforeAll(async () => {
  ctx = await createTestContext();
  keeper = await signUp(ctx);
  helper = await signUp(ctx);
  outsider = await signUp(ctx);
  await addMember(ctx.database.db, {
    collectionId: keeper.collectionId,
    userId: helper.userId,
    role: 'helper',
    startsAt: new Date(Date.now() - 3_600_000),
    endsAt: new Date(Date.now() + 86_400_000),
  });
});
afterAll(async () => {
  await ctx.close();
});

describe('notes and photos on a round outcome', () => {
  it('keeps the note in the outcome and a photo beside it, for keepers, on outcomes only', async () => {
    const id = (await createAnimal(ctx.database.db, keeper.collectionId, { name: 'Pebble' })).id;
    const ate = tap(id, 'ate', { note: 'Took it at once, left the legs.' });
    const watered = tap(id, 'watered', { note: 'Dish was dry.' });
    const results = (await send(keeper, [ate, watered])).body.results;
    expect(results.map((r: { status: string }) => r.status)).toEqual(['accepted', 'accepted']);

    const png = await sharp({ create: { width: 64, height: 48, channels: 3, background: '#456' } })
      .png()
      .toBuffer();
    const url = (eventId: string, animalId = id) =>
      `${base()}/animals/${animalId}/events/${eventId}/photo`;
    // Not yet on the server (still on the phone): a plain 404 that says to let it sync.
    const early = await keeper.agent
      .put(url(randomUUID()))
      .attach('photo', png, { filename: 'bolus.png' });
    expect(early.status).toBe(404);
    expect(early.body.error.message).toMatch(/sync first/);

    await keeper.agent.put(url(ate.id)).attach('photo', png, { filename: 'bolus.png' }).expect(204);
    const history = (await keeper.agent.get(`${base()}/events?animalId=${id}`).expect(200)).body
      .events as { id: string; payload: { note?: string }; photoVersion: string | null }[];
    const byId = new Map(history.map((e) => [e.id, e]));
    expect(byId.get(ate.id)).toMatchObject({
      payload: { note: 'Took it at once, left the legs.' },
    });
    expect(byId.get(ate.id)!.photoVersion).toBeTruthy();
    expect(byId.get(watered.id)).toMatchObject({ payload: { note: 'Dish was dry.' } });
    expect(byId.get(watered.id)!.photoVersion).toBeNull();

    const thumb = await keeper.agent.get(`${url(ate.id)}?size=thumb`).expect(200);
    expect(thumb.headers['content-type']).toBe('image/webp');
    expect((await keeper.agent.get(url(watered.id))).status).toBe(404);

    // An undo carries no photo of its own; the animal in the path must be the event's.
    const undo = tap(id, 'void', { targetId: watered.id });
    await send(keeper, [undo]);
    expect(
      (await keeper.agent.put(url(undo.id)).attach('photo', png, { filename: 'x.png' })).status,
    ).toBe(404);
    const other = (await createAnimal(ctx.database.db, keeper.collectionId, { name: 'Other' })).id;
    expect(
      (await keeper.agent.put(url(ate.id, other)).attach('photo', png, { filename: 'x.png' }))
        .status,
    ).toBe(404);

    // Photos stay with keepers, as the molt's do; a stranger learns nothing.
    expect(
      (await helper.agent.put(url(ate.id)).attach('photo', png, { filename: 'x.png' })).status,
    ).toBe(403);
    expect((await outsider.agent.get(url(ate.id))).status).toBe(404);
  });

  it('refuses a note longer than a note may be, with a readable reason', async () => {
    const id = (await createAnimal(ctx.database.db, keeper.collectionId, { name: 'Wordy' })).id;
    const long = tap(id, 'refused', { note: 'x'.repeat(2001) });
    const [result] = (await send(keeper, [long])).body.results;
    expect(result).toMatchObject({ status: 'rejected', reason: 'invalid' });
    expect(result.message).toMatch(/2,000 characters/);
  });
});
