// R18 same-day holds on the server (docs/care-rules.md, "Same-day holds"): a fact or a hold
// that lands during the day withdraws today's open feed task at once, late facts included, and a
// meal recorded while food is withheld is stored but flagged. The holds are common practice, no
// published source: live prey can injure a molting or freshly molted spider.
import { randomUUID } from 'node:crypto';
import { sql } from 'drizzle-orm';
import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import { addDays, localDateOf, startOfLocalDate } from '#shared/domain/local-dates';
import { createAnimal, signUp, type SignedUp } from '../factories';
import { createTestContext, type TestContext } from '../setup/test-app';

const ZONE = 'America/Toronto';
let ctx: TestContext;
let owner: SignedUp;

beforeAll(async () => {
  ctx = await createTestContext();
});
afterAll(async () => {
  await ctx.close();
});

// Mid-morning of a fixed day in the demo's zone, so a day's events never cross midnight.
const DAY = '2026-12-02';
const at = (hours: number, date = DAY) =>
  new Date(startOfLocalDate(date, ZONE).getTime() + hours * 3600_000);

beforeEach(async () => {
  ctx.setNow(at(10));
  owner = await signUp(ctx);
});

type Task = { kind: string; withdrawn?: { code: string; text: string } | null; done: unknown };
type Item = { animal: { id: string }; tasks: Task[]; warnings: string[] };

async function todayItem(animalId: string): Promise<Item | undefined> {
  const res = await owner.agent
    .get(`/api/collections/${owner.collectionId}/rounds/today`)
    .expect(200);
  expect(res.body.date).toBe(DAY);
  return res.body.items.find((i: Item) => i.animal.id === animalId);
}

async function send(
  animalId: string,
  kind: string,
  recordedAt: Date,
  payload: Record<string, unknown> = {},
) {
  const id = randomUUID();
  const res = await owner.agent
    .post(`/api/collections/${owner.collectionId}/events`)
    .send({
      deviceId: 'phone',
      clientSentAt: at(10).toISOString(),
      events: [{ id, animalId, kind, payload, clientRecordedAt: recordedAt.toISOString() }],
    })
    .expect(200);
  return { id, result: res.body.results[0] as { status: string; message?: string } };
}

async function sync(
  animalId: string,
  kind: string,
  recordedAt: Date,
  payload: Record<string, unknown> = {},
) {
  const { id, result } = await send(animalId, kind, recordedAt, payload);
  expect(result.status).toBe('accepted');
  return id;
}

/** An adult fed 13 days ago: due today under the 12-day adult interval (R1). */
async function dueAdult() {
  const animal = await createAnimal(ctx.database.db, owner.collectionId, {
    name: 'Juniper',
    lifeStage: 'adult',
    hasWaterDish: true,
    createdAt: at(0, addDays(DAY, -60)),
  });
  await sync(animal.id, 'ate', at(9, addDays(DAY, -13)));
  const item = await todayItem(animal.id);
  expect(item!.tasks.find((t) => t.kind === 'feed')!.withdrawn ?? null).toBeNull();
  return animal;
}

const feedOf = (item: Item | undefined) => item!.tasks.find((t) => t.kind === 'feed')!;

describe('same-day holds on the server round', () => {
  it('a molt synced during the day withdraws the feed task with the hold’s end date', async () => {
    const animal = await dueAdult();
    await sync(animal.id, 'molted', at(9.5));
    // Adult post-molt hold 14 days (R5): 2 Dec + 14 = 16 Dec.
    expect(feedOf(await todayItem(animal.id)).withdrawn?.text).toBe(
      'Molted today (09:30): no food until 16 Dec.',
    );
  });

  it('yesterday’s molt arriving late through sync withdraws today’s feed task too', async () => {
    const animal = await dueAdult();
    await sync(animal.id, 'molted', at(20, addDays(DAY, -1)));
    const feed = feedOf(await todayItem(animal.id));
    expect(feed.withdrawn?.code).toBe('post_molt_hold');
    expect(feed.withdrawn?.text).toMatch(/^Post-molt hold until 15 Dec \(molted on 1 Dec\)/);
  });

  it('a do-not-feed handover note withdraws the feed task, says the note’s own date, and removing it gives the task back', async () => {
    const animal = await dueAdult();
    const note = await owner.agent
      .post(`/api/collections/${owner.collectionId}/handover/notes`)
      .send({
        animalId: animal.id,
        text: 'Looks close to a molt.',
        until: '2026-12-06',
        doNotFeed: true,
      })
      .expect(201);
    expect(feedOf(await todayItem(animal.id)).withdrawn?.text).toBe(
      'Handover note: do not feed through 6 Dec.',
    );
    const schedule = await owner.agent
      .get(`/api/collections/${owner.collectionId}/animals/${animal.id}/schedule`)
      .expect(200);
    expect(schedule.body.notes.map((n: { text: string }) => n.text)).toContain(
      'Handover note: do not feed through 6 Dec.',
    );
    await owner.agent
      .delete(`/api/collections/${owner.collectionId}/handover/notes/${note.body.id}`)
      .expect(204);
    expect(feedOf(await todayItem(animal.id)).withdrawn ?? null).toBeNull();
  });

  it('a keeper’s hold set on the animal page withdraws the feed task at once', async () => {
    const animal = await dueAdult();
    await owner.agent
      .patch(`/api/collections/${owner.collectionId}/animals/${animal.id}/care`)
      .send({ doNotFeedUntil: '2026-12-05' })
      .expect(200);
    expect(feedOf(await todayItem(animal.id)).withdrawn?.text).toBe(
      "Do not feed until 5 Dec (keeper's setting).",
    );
  });

  it('an egg sac recorded today on the breeding page withdraws her feed task (R11, R18)', async () => {
    const animal = await dueAdult();
    await ctx.database.db.execute(sql`update animals set sex = 'female' where id = ${animal.id}`);
    await owner.agent
      .post(`/api/collections/${owner.collectionId}/egg-sacs`)
      .send({ femaleId: animal.id, laidOn: DAY })
      .expect(201);
    expect(feedOf(await todayItem(animal.id)).withdrawn?.code).toBe('leave_alone');
  });

  it('a meal recorded while held is stored, flagged for the owner and warned about on the round', async () => {
    const animal = await dueAdult();
    await sync(animal.id, 'premolt_seen', at(9));
    const meal = await sync(animal.id, 'ate', at(9.25));
    const history = await owner.agent
      .get(`/api/collections/${owner.collectionId}/events?animalId=${animal.id}`)
      .expect(200);
    expect(history.body.events.find((e: { id: string }) => e.id === meal).flags).toContain(
      'fed_while_held',
    );
    const item = await todayItem(animal.id);
    expect(item!.warnings.join(' ')).toMatch(/^Fed while held — Premolt seen today \(09:00\)/);
  });

  it('the animal’s schedule counts today’s meal at once', async () => {
    const animal = await dueAdult();
    await sync(animal.id, 'ate', at(9));
    const schedule = await owner.agent
      .get(`/api/collections/${owner.collectionId}/animals/${animal.id}/schedule`)
      .expect(200);
    expect(schedule.body.onRound).toBe(true);
    // Adult interval 12 days (R1): 2 Dec + 12 = 14 Dec.
    expect(schedule.body.nextFeed).toBe('2026-12-14');
    expect(localDateOf(at(10), ZONE)).toBe(DAY);
  });
});

describe('one molt, one record', () => {
  it('details added later complete the same molt; a second molt on the same day is refused', async () => {
    const animal = await dueAdult();
    const molt = await sync(animal.id, 'molted', at(9));
    await sync(animal.id, 'molt_details', at(9.5), {
      targetId: molt,
      sizeMm: 71,
      sexFromExuviae: 'female',
    });
    const second = await send(animal.id, 'molted', at(9.75), { sizeMm: 72 });
    expect(second.result.status).toBe('rejected');
    expect(second.result.message).toBe(
      'A molt is already recorded for this animal on 2 Dec. Add its size or sex to that molt instead of recording a second one.',
    );
    const history = await owner.agent
      .get(`/api/collections/${owner.collectionId}/events?animalId=${animal.id}`)
      .expect(200);
    const molts = history.body.events.filter((e: { kind: string }) => e.kind === 'molted');
    expect(molts).toHaveLength(1);
    expect(molts[0].payload).toMatchObject({ sizeMm: 71, sexFromExuviae: 'female' });
    // The animal's record follows the completed molt.
    const list = await owner.agent
      .get(`/api/collections/${owner.collectionId}/animals`)
      .expect(200);
    expect(list.body.animals.find((a: { id: string }) => a.id === animal.id)).toMatchObject({
      sizeMm: 71,
    });
  });

  it('a molt on another day is its own record, and details must point at a molt', async () => {
    const animal = await dueAdult();
    await sync(animal.id, 'molted', at(12, addDays(DAY, -40)));
    await sync(animal.id, 'molted', at(9));
    const meal = await sync(animal.id, 'watered', at(9.2));
    const wrong = await send(animal.id, 'molt_details', at(9.5), { targetId: meal, sizeMm: 50 });
    expect(wrong.result).toMatchObject({
      status: 'rejected',
      message: 'Molt details belong to a molt; this points at another kind of fact.',
    });
  });
});
