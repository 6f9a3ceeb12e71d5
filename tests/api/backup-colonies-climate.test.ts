// A backup carries feeder colonies (with their stock and its history), chores, room targets and
// climate readings, and a restore brings every one of them back with new ids: a stock change
// that names a round's event points at the restored event, a colony's chore at the restored
// colony. A file made before they were kept (version 1) still restores; a poisoned one is refused
// in words with nothing half-written.
import { randomUUID } from 'node:crypto';
import { sql } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { BACKUP_VERSION } from '#shared/schemas/backup';
import { createAnimal, signUp, type SignedUp } from '../factories';
import { createTestContext, type TestContext } from '../setup/test-app';
import { withOriginalIds } from '../support/backup-compare';

type Row = Record<string, unknown>;
type Item = Row & { id: string };
interface Backup {
  version: number;
  locations: Item[];
  animals: Item[];
  events: (Item & { animalId: string; effectiveAt: string; kind: string })[];
  colonies: Item[];
  colonyStockChanges: Item[];
  chores: (Item & { subjectKind: string; subjectId: string; kind: string; effectiveAt: string })[];
  roomTargets: Row[];
  climateReadings: (Item & { room: string; takenAt: string; source: string })[];
  [key: string]: unknown;
}

let ctx: TestContext;
let source: SignedUp;
let backup: Backup;
/** The round's meal that took stock, and the undo that put it back. */
let ate: { id: string };
let undo: { id: string };

const base = (who: SignedUp) => `/api/collections/${who.collectionId}`;
const copy = (): Backup => structuredClone(backup);

/** Rows a restore may have written into a collection, the new tables included. */
async function rowsOf(collectionId: string) {
  const n = async (query: ReturnType<typeof sql>) =>
    Number((await ctx.database.db.execute<{ n: string }>(query)).rows[0]!.n);
  const count = (table: string) =>
    n(
      sql`select count(*) as n from ${sql.identifier(table)} where collection_id = ${collectionId}`,
    );
  return {
    locations: await count('locations'),
    animals: await count('animals'),
    events: await count('events'),
    colonies: await count('colonies'),
    colony_stock: await n(
      sql`select count(*) as n from colony_stock s join colonies c on c.id = s.colony_id where c.collection_id = ${collectionId}`,
    ),
    colony_stock_changes: await n(
      sql`select count(*) as n from colony_stock_changes s join colonies c on c.id = s.colony_id where c.collection_id = ${collectionId}`,
    ),
    chores: await count('chores'),
    room_targets: await count('room_targets'),
    climate_readings: await count('climate_readings'),
  };
}
const NO_ROWS = {
  locations: 0,
  animals: 0,
  events: 0,
  colonies: 0,
  colony_stock: 0,
  colony_stock_changes: 0,
  chores: 0,
  room_targets: 0,
  climate_readings: 0,
};

async function refused(file: unknown, status = 422) {
  const to = await signUp(ctx);
  const res = await to.agent
    .post(`${base(to)}/restore`)
    .set('Content-Type', 'application/json')
    .send(typeof file === 'string' ? file : JSON.stringify(file));
  expect(res.status, JSON.stringify(res.body)).toBe(status);
  expect(await rowsOf(to.collectionId)).toEqual(NO_ROWS);
  // Refused, and still empty: the good backup goes in straight after.
  await to.agent
    .post(`${base(to)}/restore`)
    .send(backup)
    .expect(201);
  return res.body.error as { message: string; issues?: { path: string; message: string }[] };
}

const colonyBody = (name: string, sizes: string[], preyType = 'roach') => ({
  name,
  species: 'Blaptica dubia',
  preyType,
  sizes,
  intervals: { feed: 3, water_gel: 2, clean: 14, split: null },
});

beforeAll(async () => {
  ctx = await createTestContext();
  source = await signUp(ctx);
  const c = base(source);
  await source.agent
    .post(`${c}/locations`)
    .send({ room: 'Spare room', rack: 'A', shelf: '1', position: '1' })
    .expect(201);
  await source.agent
    .post(`${c}/locations`)
    .send({ room: 'Shed', rack: 'B', shelf: '1', position: '1' })
    .expect(201);

  // Two colonies; the roach colony is counted, then a meal takes from it and an undo puts back.
  const dubia = (
    await source.agent
      .post(`${c}/colonies`)
      .send(colonyBody('Dubia A', ['medium nymph', 'adult']))
      .expect(201)
  ).body as { id: string };
  const crickets = (
    await source.agent
      .post(`${c}/colonies`)
      .send(colonyBody('Cricket bin', ['small'], 'cricket'))
      .expect(201)
  ).body as { id: string };
  await source.agent
    .post(`${c}/colonies/${dubia.id}/counts`)
    .send({
      counts: [
        { preySize: 'medium nymph', count: 40 },
        { preySize: 'adult', count: 12 },
      ],
    })
    .expect(200);
  await source.agent
    .post(`${c}/colonies/${crickets.id}/counts`)
    .send({ counts: [{ preySize: 'small', count: 25 }], reason: 'correction', note: 'Recount' })
    .expect(200);
  const animal = await createAnimal(ctx.database.db, source.collectionId, {
    name: 'Roach eater',
    preyType: 'roach',
    preySize: 'medium nymph',
    preyCount: 2,
  });
  // The round's offer is what the meal takes from the colony.
  await source.agent.get(`${c}/rounds/today`).expect(200);
  const at = new Date().toISOString();
  ate = { id: randomUUID() };
  undo = { id: randomUUID() };
  const sync = (events: unknown[]) =>
    source.agent
      .post(`${c}/events`)
      .send({ deviceId: 'backup-test', clientSentAt: at, events })
      .expect(200);
  await sync([{ ...ate, animalId: animal.id, kind: 'ate', payload: {}, clientRecordedAt: at }]);
  await sync([
    {
      ...undo,
      animalId: animal.id,
      kind: 'void',
      payload: { targetId: ate.id },
      clientRecordedAt: new Date().toISOString(),
    },
  ]);

  // Chores for both colonies.
  const chore = (subjectId: string, kind: string, payload = {}) => ({
    id: randomUUID(),
    subjectKind: 'colony',
    subjectId,
    kind,
    payload,
    clientRecordedAt: new Date().toISOString(),
  });
  await source.agent
    .post(`${c}/chores`)
    .send({
      deviceId: 'phone-1',
      clientSentAt: new Date().toISOString(),
      chores: [
        chore(dubia.id, 'water_gel'),
        chore(dubia.id, 'feed', { note: 'Carrot and oats' }),
        chore(crickets.id, 'clean'),
      ],
    })
    .expect(200);

  // Room climate: targets for two rooms, a typed reading and a logger's file.
  await source.agent
    .put(`${c}/climate/targets`)
    .send({
      room: 'Spare room',
      minCelsius: 22,
      maxCelsius: 27.5,
      minHumidity: 55,
      maxHumidity: 75,
    })
    .expect(200);
  await source.agent
    .put(`${c}/climate/targets`)
    .send({ room: 'Shed', minCelsius: 18, maxCelsius: null, minHumidity: null, maxHumidity: 80 })
    .expect(200);
  // The day's typed reading travels as a room's chore, and is stored as a reading too.
  await source.agent
    .post(`${c}/chores`)
    .send({
      clientSentAt: new Date().toISOString(),
      chores: [
        {
          id: randomUUID(),
          subjectKind: 'room',
          subjectId: 'Spare room',
          kind: 'reading',
          payload: { minCelsius: 21.25, maxCelsius: 26, humidity: 62 },
          clientRecordedAt: new Date().toISOString(),
        },
      ],
    })
    .expect(200);
  await source.agent
    .post(`${c}/climate/import`)
    .send({
      room: 'Shed',
      rows: [
        { takenAt: '2026-11-30T08:00:00Z', celsius: 19.5, humidity: 70 },
        { takenAt: '2026-11-30T08:05:00Z', celsius: 19.75, humidity: null },
        { takenAt: '2026-11-30T08:10:00Z', celsius: null, humidity: 71.5 },
      ],
    })
    .expect(200);

  backup = (await source.agent.get(`${c}/backup`).expect(200)).body as Backup;
});
afterAll(async () => {
  await ctx.close();
});

describe('a backup with feeder colonies, chores and room climate', () => {
  it('holds every one of them', () => {
    expect(backup.version).toBe(BACKUP_VERSION);
    expect(backup.colonies.map((k) => [k.name, k.stock])).toEqual([
      ['Cricket bin', [{ preySize: 'small', count: 25, position: 0 }]],
      [
        'Dubia A',
        [
          { preySize: 'medium nymph', count: 40, position: 0 },
          { preySize: 'adult', count: 12, position: 1 },
        ],
      ],
    ]);
    // Two counts, the cricket recount, the meal's take and its put-back.
    const round = backup.colonyStockChanges.filter((s) => s.reason === 'round');
    expect(backup.colonyStockChanges).toHaveLength(5);
    expect(round.map((s) => [s.sourceEventId, s.delta])).toEqual([
      [ate.id, round[0]!.delta],
      [undo.id, -(round[0]!.delta as number)],
    ]);
    expect(round[0]!.delta).toBeLessThan(0);
    expect(backup.chores).toHaveLength(4);
    expect(backup.roomTargets.map((t) => t.room)).toEqual(['Shed', 'Spare room']);
    expect(backup.climateReadings).toHaveLength(4);
  });

  it('restores into a new collection with every row equal but its ids, links followed', async () => {
    const to = await signUp(ctx);
    const c = base(to);
    await to.agent.post(`${c}/restore`).send(backup).expect(201);
    const copied = (await to.agent.get(`${c}/backup`).expect(200)).body as Backup;
    expect(await rowsOf(to.collectionId)).toEqual({
      locations: 2,
      animals: 1,
      events: 2,
      colonies: 2,
      colony_stock: 3,
      colony_stock_changes: 5,
      chores: 4,
      room_targets: 2,
      climate_readings: 4,
    });

    // The copy's links point at its own records, not the original's.
    const takeInCopy = copied.colonyStockChanges.find((s) => s.reason === 'round')!;
    const ateInCopy = copied.events.find((e) => e.kind === 'ate')!;
    expect(takeInCopy.sourceEventId).toBe(ateInCopy.id);
    expect(ateInCopy.id).not.toBe(ate.id);
    const copiedColonies = new Set(copied.colonies.map((k) => k.id));
    for (const chore of copied.chores)
      if (chore.subjectKind === 'colony')
        expect(copiedColonies.has(chore.subjectId as string)).toBe(true);
      else expect(chore.subjectId).toBe('Spare room'); // a room is named, not numbered
    expect(copied.climateReadings.map((r) => r.id)).not.toContain(backup.climateReadings[0]!.id);

    const original = structuredClone(backup);
    const back = withOriginalIds(original, copied);
    expect({ ...back, exportedAt: null }).toEqual({ ...original, exportedAt: null });

    // What the screens show is the same: colonies with their stock and last care, their
    // history, the climate rooms with targets and readings.
    const screens = async (who: SignedUp) => {
      const b = base(who);
      const { colonies } = (await who.agent.get(`${b}/colonies`).expect(200)).body as {
        colonies: { id: string; name: string }[];
      };
      const histories = await Promise.all(
        colonies.map(
          async (k) => (await who.agent.get(`${b}/colonies/${k.id}/history`).expect(200)).body,
        ),
      );
      const rooms = (await who.agent.get(`${b}/climate/rooms`).expect(200)).body;
      const history = (
        await who.agent.get(`${b}/climate/history`).query({ room: 'Shed', days: 366 }).expect(200)
      ).body;
      // Ids are new in the copy: everything else must match.
      return JSON.parse(
        JSON.stringify({ colonies, histories, rooms, history }, (k, v: unknown) =>
          k === 'id' ? undefined : v,
        ),
      ) as unknown;
    };
    expect(await screens(to)).toEqual(await screens(source));
  });

  it('a version-1 backup (made before colonies and climate were kept) still restores', async () => {
    const {
      colonies: _k,
      colonyStockChanges: _s,
      chores: _c,
      roomTargets: _t,
      climateReadings: _r,
      ...old
    } = copy();
    const to = await signUp(ctx);
    const restored = await to.agent
      .post(`${base(to)}/restore`)
      .send({ ...old, version: 1 })
      .expect(201);
    expect(restored.body).toEqual({ animals: 1, events: 2 });
    expect(await rowsOf(to.collectionId)).toEqual({
      ...NO_ROWS,
      locations: 2,
      animals: 1,
      events: 2,
    });
    const copied = (await to.agent.get(`${base(to)}/backup`).expect(200)).body as Backup;
    expect(copied.version).toBe(BACKUP_VERSION);
    expect([copied.colonies, copied.chores, copied.climateReadings]).toEqual([[], [], []]);
  });

  it('refuses a collection that already has a colony (409)', async () => {
    const to = await signUp(ctx);
    await to.agent
      .post(`${base(to)}/colonies`)
      .send(colonyBody('Dubia A', ['adult']))
      .expect(201);
    const res = await to.agent
      .post(`${base(to)}/restore`)
      .send(backup)
      .expect(409);
    expect(res.body.error.message).toBe(
      'Restore into an empty collection: this one already has feeder colonies or room climate.',
    );
  });
});

describe('long lists go out a page at a time and none is lost', () => {
  it('2,100 stock changes, chores and readings sharing one instant (pages of 1,000)', async () => {
    const many = await signUp(ctx);
    const b = base(many);
    const colony = (
      await many.agent
        .post(`${b}/colonies`)
        .send(colonyBody('Busy bin', ['adult']))
        .expect(201)
    ).body as { id: string };
    await many.agent
      .post(`${b}/locations`)
      .send({ room: 'Loft', rack: 'A', shelf: '1', position: '1' })
      .expect(201);
    // Rows written straight in, all at one instant: only the cursors' tie-breaks (write order,
    // id) keep the pages apart.
    const at = '2026-11-30T08:00:00.123456Z';
    const db = ctx.database.db;
    await db.execute(sql`insert into colony_stock_changes (colony_id, prey_size, delta, after, reason, at)
      select ${colony.id}, 'adult', 1, n, 'count', ${at}::timestamptz from generate_series(1, 2100) n`);
    await db.execute(sql`insert into chores (id, collection_id, subject_kind, subject_id, kind, payload,
      client_recorded_at, server_received_at, effective_at)
      select gen_random_uuid(), ${many.collectionId}, 'colony', ${colony.id}, 'feed', '{}'::jsonb,
        ${at}::timestamptz, ${at}::timestamptz, ${at}::timestamptz from generate_series(1, 2100)`);
    await db.execute(sql`insert into climate_readings (id, collection_id, room, taken_at, humidity, source)
      select gen_random_uuid(), ${many.collectionId}, 'Loft', ${at}::timestamptz, 60, 'typed'
      from generate_series(1, 2100)`);
    const file = (await many.agent.get(`${b}/backup`).expect(200)).body as Backup;
    // Every change once, in the order written (its count after it runs 1 … 2,100).
    expect(file.colonyStockChanges.map((s) => s.after)).toEqual(
      Array.from({ length: 2100 }, (_, i) => i + 1),
    );
    expect(new Set(file.chores.map((c) => c.id)).size).toBe(2100);
    expect(new Set(file.climateReadings.map((r) => r.id)).size).toBe(2100);

    const to = await signUp(ctx);
    await to.agent
      .post(`${base(to)}/restore`)
      .send(file)
      .expect(201);
    const copied = (await to.agent.get(`${base(to)}/backup`).expect(200)).body as Backup;
    expect(copied.colonyStockChanges.map((s) => [s.after, s.at])).toEqual(
      file.colonyStockChanges.map((s) => [s.after, s.at]),
    );
    expect([copied.chores.length, copied.climateReadings.length]).toEqual([2100, 2100]);
  }, 60_000);
});

describe('a poisoned backup’s new lists are refused in words, with nothing half-written', () => {
  it('stock history of a colony the file lacks, and a negative count', async () => {
    const orphan = copy();
    orphan.colonyStockChanges[0] = { ...orphan.colonyStockChanges[0]!, colonyId: randomUUID() };
    expect((await refused(orphan)).message).toBe(
      'This backup has stock history for a feeder colony it does not contain.',
    );
    const negative = copy();
    (negative.colonies[1]!.stock as Row[])[0]!.count = -3;
    const error = await refused(negative);
    expect(error.message).toBe('Feeder colony 2 (Dubia A): A count cannot be below zero.');
    expect(error.issues?.[0]?.path).toBe('colonies.1.stock.0.count');
  });

  it('two colonies of one name, and a colony holding too many sizes', async () => {
    const twice = copy();
    twice.colonies[0] = { ...twice.colonies[0]!, name: 'Dubia A' };
    expect((await refused(twice)).message).toBe(
      'Two feeder colonies in this backup are called Dubia A: each needs its own name.',
    );
    const many = copy();
    many.colonies[0]!.stock = Array.from({ length: 101 }, (_, i) => ({
      preySize: `size ${i}`,
      count: 1,
      position: i,
    }));
    expect((await refused(many)).message).toBe(
      'Feeder colony 1 (Cricket bin): A colony holds at most 100 sizes.',
    );
  });

  it('a chore the chores API would refuse: wrong care kind, a colony named by no id, a long note', async () => {
    const kind = copy();
    kind.chores[0]!.kind = 'mist';
    expect((await refused(kind)).message).toBe(
      'Chore 1: A colony’s chore is one of: feed, water_gel, clean, split.',
    );
    const name = copy();
    name.chores[1]!.subjectId = 'Dubia A';
    expect((await refused(name)).message).toBe(
      'Chore 2: A colony’s chore names the colony by its id.',
    );
    const note = copy();
    note.chores[2]!.payload = { note: 'x'.repeat(501) };
    const error = await refused(note);
    expect(error.message).toBe('Chore 3: Keep a chore’s note under 500 characters.');
    expect(error.issues?.[0]?.path).toBe('chores.2.payload.note');
  });

  it('room targets the screen would refuse, impossible readings, one logger instant twice', async () => {
    const swapped = copy();
    swapped.roomTargets[1] = { ...swapped.roomTargets[1]!, minCelsius: 30, maxCelsius: 20 };
    expect((await refused(swapped)).message).toBe(
      'Room target 2 (Spare room): The lowest temperature is above the highest. Swap them.',
    );
    const wet = copy();
    const typed = wet.climateReadings.findIndex((r) => r.source === 'typed');
    wet.climateReadings[typed]!.humidity = 140;
    expect((await refused(wet)).message).toBe(
      `Climate reading ${typed + 1} (Spare room): Relative humidity is from 0 to 100 %.`,
    );
    const twice = copy();
    const logged = twice.climateReadings.filter((r) => r.source === 'logger');
    logged[1]!.takenAt = logged[0]!.takenAt;
    expect((await refused(twice)).message).toBe(
      'This backup has two logger readings of the room Shed at the same time.',
    );
  });

  it('files out of order or too large for the parser, in the new lists too', async () => {
    const { colonies, ...rest } = copy();
    const early = `{"format":"rackside-backup","version":2,"colonies":${JSON.stringify(colonies)},${JSON.stringify(rest).slice(1)}`;
    expect((await refused(early)).message).toMatch(/out of order/);
    const huge = copy();
    huge.chores[0]!.payload = { note: 'x'.repeat(15_000_000) };
    expect((await refused(huge)).message).toMatch(/far longer than anything a backup holds/);
  });
});
