import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { placeCode, reorderWalk } from '#shared/domain/places';
import type { AnimalSummary } from '#shared/schemas/animals';
import type { LocationWithCount } from '#shared/schemas/locations';
import { addMember, animalBody, createAnimal, signUp, type SignedUp } from '../factories';
import { createTestContext, type TestContext } from '../setup/test-app';

let ctx: TestContext;
let owner: SignedUp;
let keeper: SignedUp;
let helper: SignedUp;
let outsider: SignedUp;

const base = (who: SignedUp = owner) => `/api/collections/${who.collectionId}`;
const list = async (who: SignedUp = owner) =>
  (await who.agent.get(`${base(who)}/locations`).expect(200)).body.locations as LocationWithCount[];
const codes = (places: LocationWithCount[]) => places.map(placeCode);
const add = (who: SignedUp, rack: string, shelf: string, position: string, room = 'Spare room') =>
  who.agent.post(`${base(who)}/locations`).send({ room, rack, shelf, position });

beforeAll(async () => {
  ctx = await createTestContext();
  owner = await signUp(ctx);
  keeper = await signUp(ctx);
  helper = await signUp(ctx);
  outsider = await signUp(ctx);
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
  for (const [rack, shelf, position] of [
    ['A', '1', '1'],
    ['A', '1', '2'],
    ['A', '2', '1'],
    ['B', '1', '1'],
  ] as const)
    await add(owner, rack, shelf, position).expect(201);
});
afterAll(async () => {
  await ctx.close();
});

describe('places are written once, without doubled words', () => {
  it('stores "Rack C" and "Shelf 3" as rack C, shelf 3, and refuses the same spot typed bare', async () => {
    const res = await add(owner, 'Rack C', 'Shelf 3', 'Position 1').expect(201);
    expect(res.body).toMatchObject({ rack: 'C', shelf: '3', position: '1' });
    expect(placeCode(res.body)).toBe('C3-1');
    expect((await add(owner, 'C', '3', '1')).status).toBe(409);
  });

  it('puts a new spot beside its shelf, not at the end of the walk', async () => {
    await add(owner, 'A', '1', '3').expect(201);
    expect(codes(await list()).slice(0, 4)).toEqual(['A1-1', 'A1-2', 'A1-3', 'A2-1']);
  });
});

describe('renaming a room, rack or shelf', () => {
  it('renames a shelf with all its spots, for keepers and owners', async () => {
    const res = await keeper.agent
      .post(`${base()}/locations/rename`)
      .send({ level: 'shelf', room: 'Spare room', rack: 'A', shelf: '1', to: 'Shelf 5' })
      .expect(200);
    const renamed = (res.body.locations as LocationWithCount[]).filter((l) => l.shelf === '5');
    expect(codes(renamed)).toEqual(['A5-1', 'A5-2', 'A5-3']);
    // The walk is unchanged by a rename.
    expect(codes(res.body.locations).slice(0, 4)).toEqual(['A5-1', 'A5-2', 'A5-3', 'A2-1']);
    await owner.agent
      .post(`${base()}/locations/rename`)
      .send({ level: 'rack', room: 'Spare room', rack: 'B', to: 'Rack D' })
      .expect(200);
    expect(codes(await list())).toContain('D1-1');
  });

  it('never merges into an existing group and says what was not found', async () => {
    const clash = await owner.agent
      .post(`${base()}/locations/rename`)
      .send({ level: 'shelf', room: 'Spare room', rack: 'A', shelf: '5', to: '2' });
    expect(clash.status).toBe(409);
    expect(clash.body.error.message).toMatch(/already a shelf called “2”/);
    const missing = await owner.agent
      .post(`${base()}/locations/rename`)
      .send({ level: 'rack', room: 'Spare room', rack: 'Q', to: 'R' });
    expect(missing.status).toBe(404);
    expect(missing.body.error.message).toBe('We could not find that rack.');
    const bad = await owner.agent
      .post(`${base()}/locations/rename`)
      .send({ level: 'shelf', room: 'Spare room', rack: 'A', to: '' });
    expect(bad.status).toBe(422);
  });

  it('is refused to helpers and to people outside the collection', async () => {
    const body = { level: 'room', room: 'Spare room', to: 'Hall' };
    expect((await helper.agent.post(`${base()}/locations/rename`).send(body)).status).toBe(403);
    expect((await outsider.agent.post(`${base()}/locations/rename`).send(body)).status).toBe(404);
    expect((await list()).every((l) => l.room === 'Spare room')).toBe(true);
  });
});

describe('reordering the walk from the tree', () => {
  it('moves a shelf to the front of its rack and keeps its spots together', async () => {
    const before = await list();
    const shelf2 = before.find((l) => l.rack === 'A' && l.shelf === '2')!;
    const walk = reorderWalk(before, { level: 'shelf', key: `Spare room\u0000A\u00002` }, 0).map(
      (l) => l.id,
    );
    const res = await keeper.agent
      .put(`${base()}/locations/order`)
      .send({ locationIds: walk })
      .expect(200);
    expect(res.body.locations[0].id).toBe(shelf2.id);
    expect(codes(res.body.locations).slice(0, 4)).toEqual(['A2-1', 'A5-1', 'A5-2', 'A5-3']);
  });

  it('is refused to helpers', async () => {
    const ids = (await list()).map((l) => l.id);
    expect(
      (
        await helper.agent
          .put(`${base()}/locations/order`)
          .send({ locationIds: [...ids].reverse() })
      ).status,
    ).toBe(403);
    expect((await list()).map((l) => l.id)).toEqual(ids);
    expect((await helper.agent.get(`${base()}/locations`)).status).toBe(403);
  });
});

describe('who lives where', () => {
  it('lists the active animals in each spot and leaves retired ones out', async () => {
    const spot = (await list()).find((l) => placeCode(l) === 'A2-1')!;
    await owner.agent
      .post(`${base()}/animals`)
      .send(animalBody({ name: 'Rosie', locationId: spot.id }))
      .expect(201);
    const gone = await owner.agent
      .post(`${base()}/animals`)
      .send(animalBody({ name: 'Old Kiki', locationId: spot.id }))
      .expect(201);
    await owner.agent
      .post(`${base()}/animals/${gone.body.id}/retire`)
      .send({ status: 'deceased', date: '2026-12-01', note: '' })
      .expect(200);
    const listed = (await list()).find((l) => l.id === spot.id)!;
    expect(listed.occupants.map((o) => o.name)).toEqual(['Rosie']);
    expect(listed.animals).toBe(1);
  });
});

describe('pot-up finds or creates its spots in the tree', () => {
  it('uses the shelf’s own 01, 02 … spots, adds the rest beside them and strips typed words', async () => {
    const who = await signUp(ctx);
    const b = (p: string) => `/api/collections/${who.collectionId}${p}`;
    for (const position of ['01', '02'])
      await who.agent
        .post(b('/locations'))
        .send({ room: 'Sling room', rack: 'C', shelf: '1', position })
        .expect(201);
    await who.agent
      .post(b('/locations'))
      .send({ room: 'Sling room', rack: 'D', shelf: '1', position: '1' })
      .expect(201);
    const femaleId = (
      await createAnimal(ctx.database.db, who.collectionId, {
        name: 'Juniper',
        sex: 'female',
        scientificName: 'Hapalopus formosus',
      })
    ).id;
    const sac = (
      await who.agent
        .post(b('/egg-sacs'))
        .send({ femaleId, laidOn: '2026-09-01', clutch: 'Juniper sac 1' })
        .expect(201)
    ).body;
    await who.agent
      .post(b(`/egg-sacs/${sac.id}/slings`))
      .send({
        count: 3,
        namePrefix: 'Juniper',
        room: 'Sling room',
        rack: 'Rack C',
        shelf: 'Shelf 1',
        firstPosition: 2,
      })
      .expect(201);
    const animals = (await who.agent.get(b('/animals')).expect(200)).body
      .animals as AnimalSummary[];
    const slings = animals.filter((a) => a.clutch === 'Juniper sac 1');
    expect(slings.map((a) => placeCode(a.location!)).sort()).toEqual(['C1-02', 'C1-03', 'C1-04']);
    const places = (await who.agent.get(b('/locations')).expect(200)).body
      .locations as LocationWithCount[];
    // No second "1" rack C, no "Rack Rack C": one shelf, its spots in order, before rack D.
    expect(codes(places)).toEqual(['C1-01', 'C1-02', 'C1-03', 'C1-04', 'D1-1']);
    expect(places.find((l) => placeCode(l) === 'C1-02')!.occupants).toHaveLength(1);
  });
});
