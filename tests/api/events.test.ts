import { randomUUID } from 'node:crypto';
import { eq, inArray } from 'drizzle-orm';
import { afterAll, afterEach, beforeAll, describe, expect, it } from 'vitest';
import { MAX_BATCH_EVENTS } from '#shared/domain/sync-limits';
import { events } from '../../server/db/schema/animals';
import { addMember, createAnimal, signUp, type SignedUp } from '../factories';
import { createTestContext, type TestContext } from '../setup/test-app';

let ctx: TestContext;
let owner: SignedUp;
let animalId: string;

function tap(kind: string, at: Date, extra: Record<string, unknown> = {}) {
  return {
    id: randomUUID(),
    animalId,
    kind,
    payload: {},
    clientRecordedAt: at.toISOString(),
    ...extra,
  };
}
function batch(list: unknown[], sentAt = new Date()) {
  return { deviceId: 'test-device', clientSentAt: sentAt.toISOString(), events: list };
}
const url = () => `/api/collections/${owner.collectionId}/events`;
const storedIds = async (ids: string[]) =>
  (await ctx.database.db.select().from(events).where(inArray(events.id, ids)))
    .map((r) => r.id)
    .sort();

beforeAll(async () => {
  ctx = await createTestContext();
  owner = await signUp(ctx);
  animalId = (await createAnimal(ctx.database.db, owner.collectionId)).id;
});
afterEach(() => ctx.setNow(null));
afterAll(async () => {
  await ctx.close();
});

describe('POST /collections/:id/events (sync)', () => {
  it('stores each event once; the same batch again is three duplicates', async () => {
    const list = [
      tap('ate', new Date()),
      tap('watered', new Date()),
      tap('note', new Date(), { payload: { text: 'Webbed the door shut.' } }),
    ];
    const first = await owner.agent.post(url()).send(batch(list)).expect(200);
    expect(first.body.results.map((r: { status: string }) => r.status)).toEqual([
      'accepted',
      'accepted',
      'accepted',
    ]);
    const again = await owner.agent.post(url()).send(batch(list)).expect(200);
    expect(again.body.results).toEqual(list.map((e) => ({ id: e.id, status: 'duplicate' })));
    expect(await storedIds(list.map((e) => e.id))).toEqual(list.map((e) => e.id).sort());

    const round = await owner.agent
      .get(`/api/collections/${owner.collectionId}/rounds/today`)
      .expect(200);
    const item = round.body.items.find((i: { animal: { id: string } }) => i.animal.id === animalId);
    expect(item.outcomes.map((o: { kind: string; by: string }) => [o.kind, o.by])).toEqual(
      expect.arrayContaining([
        ['ate', 'Test Keeper'],
        ['watered', 'Test Keeper'],
      ]),
    );
  });

  it('reports a repeated id inside one batch as a duplicate', async () => {
    const e = tap('watered', new Date());
    const res = await owner.agent
      .post(url())
      .send(batch([e, e]))
      .expect(200);
    expect(res.body.results.map((r: { status: string }) => r.status)).toEqual([
      'accepted',
      'duplicate',
    ]);
  });

  it('rejects bad events one by one and keeps the good ones', async () => {
    const stranger = await signUp(ctx);
    const theirAnimal = await createAnimal(ctx.database.db, stranger.collectionId);
    const good = tap('refused', new Date());
    const badPayload = tap('molted', new Date(), { payload: { sizeMm: -4 } });
    const notOurs = tap('ate', new Date(), { animalId: theirAnimal.id });
    const orphanVoid = tap('void', new Date(), { payload: { targetId: randomUUID() } });
    const noKind = { ...tap('ate', new Date()), kind: 'danced' };
    const res = await owner.agent
      .post(url())
      .send(batch([badPayload, good, notOurs, orphanVoid, noKind, 'not an event']))
      .expect(200);
    const byId = new Map(res.body.results.map((r: { id: string }) => [r.id, r]));
    expect(byId.get(good.id)).toEqual({ id: good.id, status: 'accepted' });
    expect(byId.get(badPayload.id)).toMatchObject({
      status: 'rejected',
      reason: 'invalid',
      message: 'payload.sizeMm: The size must be more than 0 mm.',
    });
    expect(byId.get(notOurs.id)).toMatchObject({ status: 'rejected', reason: 'unknown_animal' });
    expect(byId.get(orphanVoid.id)).toMatchObject({ status: 'rejected', reason: 'target_unknown' });
    expect(byId.get(noKind.id)).toMatchObject({ status: 'rejected', reason: 'invalid' });
    expect(res.body.results.at(-1)).toMatchObject({
      id: '',
      status: 'rejected',
      reason: 'invalid',
    });
    expect(await storedIds([good.id, badPayload.id, notOurs.id, orphanVoid.id, noKind.id])).toEqual(
      [good.id],
    );
  });

  it('accepts a void of an event in the same batch or already stored, and marks it in the history', async () => {
    const meal = tap('ate', new Date(Date.now() - 1000));
    const undo = tap('void', new Date(), { payload: { targetId: meal.id } });
    const res = await owner.agent
      .post(url())
      .send(batch([meal, undo]))
      .expect(200);
    expect(res.body.results.map((r: { status: string }) => r.status)).toEqual([
      'accepted',
      'accepted',
    ]);
    const history = await owner.agent.get(url()).query({ animalId }).expect(200);
    const entry = history.body.events.find((e: { id: string }) => e.id === meal.id);
    expect(entry).toMatchObject({ kind: 'ate', by: 'Test Keeper', voidedBy: undo.id });
  });

  it('corrects the batch clock offset and stores all three device and server times', async () => {
    const serverNow = new Date('2026-11-30T15:00:00.000Z');
    ctx.setNow(serverNow);
    // The phone's clock runs 10 minutes slow: it thinks it is 14:50 when the server says 15:00.
    const phoneSent = new Date(serverNow.getTime() - 10 * 60_000);
    const e = tap('watered', new Date(phoneSent.getTime() - 20 * 60_000));
    const res = await owner.agent
      .post(url())
      .send(batch([e], phoneSent))
      .expect(200);
    expect(res.body.offsetMs).toBe(600_000);
    const [row] = await ctx.database.db.select().from(events).where(eq(events.id, e.id));
    expect(row!.clientRecordedAt.toISOString()).toBe('2026-11-30T14:30:00.000Z');
    expect(row!.clientSentAt!.toISOString()).toBe('2026-11-30T14:50:00.000Z');
    expect(row!.serverReceivedAt.toISOString()).toBe('2026-11-30T15:00:00.000Z');
    expect(row!.effectiveAt.toISOString()).toBe('2026-11-30T14:40:00.000Z');
    expect(row!.flags).toEqual(['clock_corrected']);
    expect(row!.recordedBy).toBe(owner.userId);
    expect(row!.deviceId).toBe('test-device');
  });

  it(`refuses a batch of more than ${MAX_BATCH_EVENTS} events with 413 and stores none`, async () => {
    const list = Array.from({ length: MAX_BATCH_EVENTS + 1 }, () => tap('watered', new Date()));
    const res = await owner.agent.post(url()).send(batch(list)).expect(413);
    expect(res.body.error.message).toMatch(/at most 500 events/);
    expect(await storedIds(list.map((e) => e.id))).toEqual([]);
  });

  it('refuses a malformed envelope with 422, a stranger with 404 and no session with 401', async () => {
    const res = await owner.agent.post(url()).send({ events: [] }).expect(422);
    expect(res.body.error.message).toBeTruthy();
    const stranger = await signUp(ctx);
    await stranger.agent
      .post(url())
      .send(batch([tap('ate', new Date())]))
      .expect(404);
    await ctx
      .agent()
      .post(url())
      .send(batch([tap('ate', new Date())]))
      .expect(401);
  });
});

describe('a helper syncing', () => {
  let helper: SignedUp;
  const coverStart = new Date('2026-11-20T12:00:00Z');
  const coverEnd = new Date('2026-11-27T12:00:00Z');

  beforeAll(async () => {
    helper = await signUp(ctx);
    await addMember(ctx.database.db, {
      collectionId: owner.collectionId,
      userId: helper.userId,
      role: 'helper',
      startsAt: coverStart,
      endsAt: coverEnd,
    });
  });

  it('during the cover: feeding accepted, breeding records and keepers’ taps refused per event', async () => {
    ctx.setNow(new Date('2026-11-22T12:00:00Z'));
    const meal = tap('ate', new Date('2026-11-22T11:59:00Z'));
    const pairing = tap('paired', new Date('2026-11-22T11:59:00Z'));
    const ownerMeal = tap('ate', new Date('2026-11-22T11:00:00Z'));
    await owner.agent
      .post(url())
      .send(batch([ownerMeal], new Date('2026-11-22T12:00:00Z')))
      .expect(200);
    const undoOwner = tap('void', new Date('2026-11-22T11:59:30Z'), {
      payload: { targetId: ownerMeal.id },
    });
    const res = await helper.agent
      .post(url())
      .send(batch([meal, pairing, undoOwner], new Date('2026-11-22T12:00:00Z')))
      .expect(200);
    expect(
      res.body.results.map((r: { status: string; reason?: string }) => r.reason ?? r.status),
    ).toEqual(['accepted', 'not_for_helpers', 'not_for_helpers']);
  });

  it('after the cover: taps made during it are saved, later ones are refused with the dates', async () => {
    ctx.setNow(new Date('2026-11-28T09:00:00Z'));
    const during = tap('watered', new Date('2026-11-26T18:00:00Z'));
    const after = tap('watered', new Date('2026-11-28T08:00:00Z'));
    const res = await helper.agent
      .post(url())
      .send(batch([during, after], new Date('2026-11-28T09:00:00Z')))
      .expect(200);
    expect(res.body.results[0]).toEqual({ id: during.id, status: 'accepted' });
    expect(res.body.results[1]).toMatchObject({ status: 'rejected', reason: 'outside_cover' });
    expect(res.body.results[1].message).toMatch(
      /recorded outside your cover\. Your cover for Test Collection ended on Fri 27 Nov 2026/,
    );
    // Reading the round stays closed outside the cover.
    await helper.agent.get(`/api/collections/${owner.collectionId}/rounds/today`).expect(403);
    // and the history is for keepers only.
    await helper.agent.get(url()).query({ animalId }).expect(403);
  });

  // The grace is HELPER_SYNC_GRACE_HOURS (48 h) after the cover's end, by the server's clock.
  it('inside the grace, taps made during the cover are stored; from 48 h after the end they are not', async () => {
    const made = new Date('2026-11-26T18:00:00Z');
    const lastSecond = new Date(coverEnd.getTime() + 48 * 3_600_000 - 1_000);
    ctx.setNow(lastSecond);
    const justInTime = tap('watered', made);
    const ok = await helper.agent
      .post(url())
      .send(batch([justInTime], lastSecond))
      .expect(200);
    expect(ok.body.results).toEqual([{ id: justInTime.id, status: 'accepted' }]);

    const graceOver = new Date(coverEnd.getTime() + 48 * 3_600_000);
    ctx.setNow(graceOver);
    const late = tap('watered', made);
    const refused = await helper.agent
      .post(url())
      .send(batch([late], graceOver))
      .expect(200);
    expect(refused.body.results[0]).toMatchObject({
      id: late.id,
      status: 'rejected',
      reason: 'outside_cover',
    });
    expect(refused.body.results[0].message).toBe(
      'This reached Rackside more than 48 hours after your cover for Test Collection ended on Fri 27 Nov 2026, so it cannot be saved. Tell the keeper what you did.',
    );
    expect(await storedIds([justInTime.id, late.id])).toEqual([justInTime.id]);
    // A tap stored inside the grace is still a duplicate when the phone sends it again later.
    const again = await helper.agent
      .post(url())
      .send(batch([justInTime], graceOver))
      .expect(200);
    expect(again.body.results).toEqual([{ id: justInTime.id, status: 'duplicate' }]);
  });

  it('an ex-helper’s backdated taps are refused weeks later, however the phone’s clocks are set', async () => {
    ctx.setNow(new Date('2026-12-20T09:00:00Z'));
    const insideCover = new Date('2026-11-26T18:00:00Z');
    // The tap dated inside the cover, sent with the true time: its corrected time is in the cover.
    const backdated = tap('ate', insideCover);
    // Both clocks set back, as if the phone still thought it was November.
    const wholeClock = tap('ate', insideCover);
    const first = await helper.agent
      .post(url())
      .send(batch([backdated], new Date('2026-12-20T09:00:00Z')))
      .expect(200);
    const second = await helper.agent
      .post(url())
      .send(batch([wholeClock], new Date('2026-11-26T18:05:00Z')))
      .expect(200);
    for (const res of [first, second]) {
      expect(res.body.results[0]).toMatchObject({ status: 'rejected', reason: 'outside_cover' });
      expect(res.body.results[0].message).toMatch(/more than 48 hours after your cover/);
    }
    expect(await storedIds([backdated.id, wholeClock.id])).toEqual([]);
  });
});
