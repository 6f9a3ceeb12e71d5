import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { drawPrepList, shortWarning } from '#shared/domain/colonies/stock';
import type { ColonyView } from '#shared/schemas/colonies';
import { createAnimal, signUp, type SignedUp } from '../factories';
import { createTestContext, type TestContext } from '../setup/test-app';

let ctx: TestContext;
let owner: SignedUp;
let base: string;

const colonyBody = (name: string, sizes: string[], preyType = 'roach') => ({
  name,
  species: 'Blaptica dubia',
  preyType,
  sizes,
  intervals: { feed: 3, water_gel: 2, clean: 14, split: null },
});
const stockOf = (c: ColonyView) => Object.fromEntries(c.stock.map((s) => [s.preySize, s.count]));
const colonies = async () =>
  (await owner.agent.get(`${base}/colonies`).expect(200)).body.colonies as ColonyView[];
const byName = async (name: string) => (await colonies()).find((c) => c.name === name)!;
const count = (id: string, counts: { preySize: string; count: number }[], reason = 'count') =>
  owner.agent.post(`${base}/colonies/${id}/counts`).send({ counts, reason }).expect(200);
const sync = (events: unknown[]) =>
  owner.agent
    .post(`${base}/events`)
    .send({ deviceId: 'colony-test', clientSentAt: new Date().toISOString(), events })
    .expect(200);

beforeAll(async () => {
  ctx = await createTestContext();
  owner = await signUp(ctx);
  base = `/api/collections/${owner.collectionId}`;
});
afterAll(async () => {
  await ctx.close();
});

describe('feeder colonies', () => {
  it('are created with their sizes at zero, counted, and keep every change with its reason', async () => {
    const made = await owner.agent
      .post(`${base}/colonies`)
      .send(colonyBody('Count bin', ['small nymph', 'medium nymph']))
      .expect(201);
    expect(stockOf(made.body)).toEqual({ 'small nymph': 0, 'medium nymph': 0 });
    await count(made.body.id, [
      { preySize: 'small nymph', count: 30 },
      { preySize: 'medium nymph', count: 5 },
    ]);
    const after = await count(made.body.id, [{ preySize: 'small nymph', count: 24 }], 'split');
    expect(stockOf(after.body)).toEqual({ 'small nymph': 24, 'medium nymph': 5 });

    const history = (await owner.agent.get(`${base}/colonies/${made.body.id}/history`).expect(200))
      .body.changes;
    expect(
      history.map((h: { preySize: string; delta: number; after: number; reason: string }) => [
        h.preySize,
        h.delta,
        h.after,
        h.reason,
      ]),
    ).toEqual([
      ['small nymph', 30, 30, 'count'],
      ['medium nymph', 5, 5, 'count'],
      ['small nymph', -6, 24, 'split'],
    ]);
  });

  it('refuses a fractional or negative count and a second colony of the same name, in words', async () => {
    const c = await byName('Count bin');
    const frac = await owner.agent
      .post(`${base}/colonies/${c.id}/counts`)
      .send({ counts: [{ preySize: 'small nymph', count: 2.5 }] })
      .expect(422);
    expect(frac.body.error.message).toMatch(/whole number/);
    await owner.agent
      .post(`${base}/colonies/${c.id}/counts`)
      .send({ counts: [{ preySize: 'small nymph', count: -1 }] })
      .expect(422);
    const twice = await owner.agent
      .post(`${base}/colonies`)
      .send(colonyBody('Count bin', ['adult']))
      .expect(409);
    expect(twice.body.error.message).toMatch(/already has that name/);
    await owner.agent.get(`${base}/colonies/${randomUUID()}/history`).expect(404);
    // Sizes come from the feeder catalogue, and a count is for a size the colony holds.
    const offCatalogue = await owner.agent
      .post(`${base}/colonies`)
      .send(colonyBody('Odd bin', ['jumbo']))
      .expect(422);
    expect(offCatalogue.body.error.message).toBe(
      'The feeder catalogue has no roach size called “jumbo”. Its sizes: small nymph, medium nymph, large nymph, adult.',
    );
    await owner.agent
      .post(`${base}/colonies`)
      .send(colonyBody('Odd bin', ['adult'], 'locust'))
      .expect(422);
    const foreignSize = await owner.agent
      .post(`${base}/colonies/${c.id}/counts`)
      .send({ counts: [{ preySize: 'adult', count: 3 }] })
      .expect(422);
    expect(foreignSize.body.error.message).toMatch(/holds no size called “adult”/);
    // Removed, it leaves the list (and the draws below).
    await owner.agent.delete(`${base}/colonies/${c.id}`).expect(204);
    expect((await colonies()).map((x) => x.name)).not.toContain('Count bin');
  });

  it('recording the round takes what was used from the colony the draw names, once per event, and an undo puts it back', async () => {
    const a = (
      await owner.agent
        .post(`${base}/colonies`)
        .send(colonyBody('Dubia A', ['medium nymph']))
        .expect(201)
    ).body as ColonyView;
    const b = (
      await owner.agent
        .post(`${base}/colonies`)
        .send(colonyBody('Dubia B', ['medium nymph']))
        .expect(201)
    ).body as ColonyView;
    await count(a.id, [{ preySize: 'medium nymph', count: 6 }]);
    await count(b.id, [{ preySize: 'medium nymph', count: 4 }]);
    // An adult fed two medium roach nymphs a meal (its own prey settings).
    const animal = await createAnimal(ctx.database.db, owner.collectionId, {
      name: 'Roach eater',
      preyType: 'roach',
      preySize: 'medium nymph',
      preyCount: 2,
    });
    const round = (await owner.agent.get(`${base}/rounds/today`).expect(200)).body;
    const feed = round.items
      .find((i: { animal: { id: string } }) => i.animal.id === animal.id)
      .tasks.find((t: { kind: string }) => t.kind === 'feed');
    expect(feed.offer).toMatchObject({ preyType: 'roach', preySize: 'medium nymph' });
    const took = feed.offer.countMin as number;

    // The tap names no prey: the offer's lower count comes off the fullest colony (A, 6).
    const ate = {
      id: randomUUID(),
      animalId: animal.id,
      kind: 'ate',
      payload: {},
      clientRecordedAt: new Date().toISOString(),
    };
    await sync([ate]);
    expect(stockOf(await byName('Dubia A'))['medium nymph']).toBe(6 - took);
    // The same event again (a re-sent batch) is a duplicate and takes nothing more.
    const again = await sync([ate]);
    expect(again.body.results[0].status).toBe('duplicate');
    expect(stockOf(await byName('Dubia A'))['medium nymph']).toBe(6 - took);

    // Ten left in: B now holds the most (4 against 6 − took when took ≥ 3, else A): whatever
    // the order, both are emptied and never go below zero.
    const leftIn = {
      id: randomUUID(),
      animalId: animal.id,
      kind: 'prey_left_in',
      payload: { preyType: 'roach', preySize: 'medium nymph', count: 10 },
      clientRecordedAt: new Date().toISOString(),
    };
    await sync([leftIn]);
    expect(stockOf(await byName('Dubia A'))['medium nymph']).toBe(0);
    expect(stockOf(await byName('Dubia B'))['medium nymph']).toBe(0);
    const historyB = (await owner.agent.get(`${base}/colonies/${b.id}/history`).expect(200)).body
      .changes;
    expect(historyB.at(-1)).toMatchObject({ delta: -4, after: 0, reason: 'round' });

    // Undoing the prey-left-in puts back exactly what it took: 6 − took in A, 4 in B.
    await sync([
      {
        id: randomUUID(),
        animalId: animal.id,
        kind: 'void',
        payload: { targetId: leftIn.id },
        clientRecordedAt: new Date().toISOString(),
      },
    ]);
    expect(stockOf(await byName('Dubia A'))['medium nymph']).toBe(6 - took);
    expect(stockOf(await byName('Dubia B'))['medium nymph']).toBe(4);
  });

  it('warns when tomorrow needs more than the colonies hold, naming the colony drawn on', async () => {
    // A cricket bin with 1 small cricket; an animal that eats 3 small crickets.
    const bin = (
      await owner.agent
        .post(`${base}/colonies`)
        .send(colonyBody('Cricket bin', ['small'], 'cricket'))
        .expect(201)
    ).body as ColonyView;
    await count(bin.id, [{ preySize: 'small', count: 1 }]);
    await createAnimal(ctx.database.db, owner.collectionId, {
      name: 'Cricket eater',
      preyType: 'cricket',
      preySize: 'small',
      preyCount: 3,
    });
    const tomorrow = (await owner.agent.get(`${base}/rounds/tomorrow`).expect(200)).body;
    const list = drawPrepList(
      tomorrow.prepList,
      (await colonies()).map((c) => ({ ...c, stock: stockOf(c) })),
    );
    const line = list.find((l) => l.preyType === 'cricket' && l.preySize === 'small')!;
    expect(line.draw.draws).toEqual([
      { colonyId: bin.id, colonyName: 'Cricket bin', preySize: 'small', count: 1 },
    ]);
    expect(line.draw.short).toBe(line.countMax - 1);
    expect(shortWarning(line)).toMatch(/Cricket bin 1/);
  });

  it('takes chores for its colonies: once per id, refusing a colony of another collection', async () => {
    const c = await byName('Dubia A');
    const chore = {
      id: randomUUID(),
      subjectKind: 'colony',
      subjectId: c.id,
      kind: 'water_gel',
      clientRecordedAt: new Date().toISOString(),
    };
    const body = (list: unknown[]) => ({ clientSentAt: new Date().toISOString(), chores: list });
    const first = await owner.agent
      .post(`${base}/chores`)
      .send(body([chore, chore]))
      .expect(200);
    expect(first.body.results.map((r: { status: string }) => r.status)).toEqual([
      'accepted',
      'duplicate',
    ]);
    const again = await owner.agent
      .post(`${base}/chores`)
      .send(body([chore]))
      .expect(200);
    expect(again.body.results).toEqual([{ id: chore.id, status: 'duplicate' }]);
    const today = (await owner.agent.get(`${base}/colonies`).expect(200)).body.today;
    expect((await byName('Dubia A')).lastDone.water_gel).toBe(today);

    const other = await signUp(ctx);
    const theirs = (
      await other.agent
        .post(`/api/collections/${other.collectionId}/colonies`)
        .send(colonyBody('Theirs', ['adult']))
        .expect(201)
    ).body.id;
    const bad = await owner.agent
      .post(`${base}/chores`)
      .send(
        body([
          { ...chore, id: randomUUID(), subjectId: theirs },
          { ...chore, id: randomUUID(), kind: 'mist' },
        ]),
      )
      .expect(200);
    expect(bad.body.results.map((r: { reason: string }) => r.reason)).toEqual([
      'unknown_subject',
      'invalid',
    ]);
    expect(bad.body.results[1].message).toMatch(/feed, water_gel, clean, split/);
  });
});
