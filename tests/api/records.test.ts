import { randomUUID } from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';
import sharp from 'sharp';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { rowToAnimal } from '#shared/domain/csv/animal-columns';
import { readCsv } from '#shared/domain/csv/csv-file';
import { firstSettings, planImport, type ImportSettings } from '#shared/domain/import/plan-import';
import type { AnimalInput } from '#shared/schemas/animals';
import { BACKUP_VERSION } from '#shared/schemas/backup';
import { addMember, animalBody, createAnimal, signUp, type SignedUp } from '../factories';
import { KEEPERS_SHEET_ROWS } from '../fixtures/keepers-sheet';
import { createTestContext, type TestContext } from '../setup/test-app';
import { withOriginalIds } from '../support/backup-compare';

let ctx: TestContext;
let owner: SignedUp;
let keeper: SignedUp;
let helper: SignedUp;
let outsider: SignedUp;

const base = (who: SignedUp = owner) => `/api/collections/${who.collectionId}`;
const filesIn = (dir: string): string[] =>
  fs.existsSync(dir)
    ? fs
        .readdirSync(dir, { withFileTypes: true })
        .flatMap((d) => (d.isDirectory() ? filesIn(path.join(dir, d.name)) : [d.name]))
    : [];

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
});
afterAll(async () => {
  await ctx.close();
});

async function place(who: SignedUp, rack: string, shelf = '1', position = '1') {
  const res = await who.agent
    .post(`${base(who)}/locations`)
    .send({ room: 'Spare room', rack, shelf, position })
    .expect(201);
  return res.body.id as string;
}

describe('animals: create, edit, retire, move', () => {
  it('creates an animal with a drawn code and shows it in the list', async () => {
    const res = await keeper.agent.post(`${base()}/animals`).send(animalBody()).expect(201);
    expect(res.body).toMatchObject({
      name: 'Juniper',
      status: 'active',
      sizeMm: 130,
      hasWaterDish: true,
      intervalDays: 12,
      cautionNote: 'Flicks hairs when the lid opens',
    });
    expect(res.body.labelCode).toMatch(/^[A-Z2-9]{2}-[A-Z2-9]{3}$/);
    const list = await owner.agent.get(`${base()}/animals`).expect(200);
    expect(list.body.animals.map((a: { id: string }) => a.id)).toContain(res.body.id);
  });

  it('refuses bad input field by field with a readable message', async () => {
    const cases: [Partial<AnimalInput> | Record<string, unknown>, RegExp][] = [
      [{ name: '' }, /Give the animal a name/],
      [{ scientificName: 'monocentropus balfouri' }, /Did you mean “Monocentropus balfouri”\?/],
      [{ scientificName: 'Monocentropus' }, /two parts/],
      [{ sizeMm: 0 }, /above 0/],
      [{ sizeMm: 900 }, /400 mm at most/],
      [{ group: 'fish' }, /Choose a group/],
      [{ labelCode: 'NL-7K0' }, /Label codes look like/],
      [{ acquiredOn: '2025-02-30' }, /does not exist/],
      [{ cautions: ['bites'] }, /./],
      [{ locationId: 'nope' }, /Choose a place/],
      [{ care: { intervalDays: 0 } }, /./],
      // docs/care-rules.md § Stages: the stage must be one the group has.
      [
        { group: 'mantis', lifeStage: 'larva' },
        /Mantis: there is no “Larva” stage\. Choose Nymph L1–L3, Nymph L4\+, Subadult or Adult\./,
      ],
    ];
    for (const [change, message] of cases) {
      const res = await owner.agent.post(`${base()}/animals`).send({ ...animalBody(), ...change });
      expect(res.status, JSON.stringify(change)).toBe(422);
      expect(JSON.stringify(res.body.error), JSON.stringify(change)).toMatch(message);
    }
    const foreignPlace = await place(outsider, 'Z');
    const res = await owner.agent
      .post(`${base()}/animals`)
      .send(animalBody({ locationId: foreignPlace }))
      .expect(422);
    expect(res.body.error.message).toMatch(/not in this collection/);
    await owner.agent
      .post(`${base()}/animals`)
      .send(animalBody({ labelCode: 'nl-7k3' }))
      .expect(201);
    const taken = await owner.agent
      .post(`${base()}/animals`)
      .send(animalBody({ labelCode: 'NL-7K3' }))
      .expect(409);
    expect(taken.body.error.message).toMatch(/already has the code NL-7K3/);
  });

  it('keeps a move in the history when the place changes on edit, and moves many at once', async () => {
    const a = (
      await owner.agent
        .post(`${base()}/animals`)
        .send(animalBody({ name: 'Mover' }))
        .expect(201)
    ).body;
    const shelfA = await place(owner, 'A');
    const edited = await owner.agent
      .put(`${base()}/animals/${a.id}`)
      .send(animalBody({ name: 'Mover', locationId: shelfA, sizeMm: 131 }))
      .expect(200);
    expect(edited.body).toMatchObject({
      sizeMm: 131,
      location: { rack: 'A' },
      labelCode: a.labelCode,
    });
    const b = (
      await owner.agent
        .post(`${base()}/animals`)
        .send(animalBody({ name: 'Other' }))
        .expect(201)
    ).body;
    const shelfB = await place(owner, 'B');
    const moved = await owner.agent
      .post(`${base()}/animals/move`)
      .send({ animalIds: [a.id, b.id], locationId: shelfB })
      .expect(200);
    expect(moved.body.moved).toBe(2);
    const history = await owner.agent.get(`${base()}/events?animalId=${a.id}`).expect(200);
    expect(history.body.events.filter((e: { kind: string }) => e.kind === 'moved')).toHaveLength(2);
    expect(
      (
        await owner.agent
          .post(`${base()}/animals/move`)
          .send({ animalIds: [randomUUID()], locationId: shelfB })
      ).status,
    ).toBe(404);
  });

  it('takes the new stages and a diet, and a rehouse in the same place starts settling (docs/care-rules.md § Stages, § Diets, § R16)', async () => {
    const care = { ...animalBody().care, diet: 'live_prey' as const };
    const slug = (
      await owner.agent
        .post(`${base()}/animals`)
        .send(
          animalBody({
            name: 'Slug',
            scientificName: 'Arion ater',
            group: 'other',
            lifeStage: 'adult',
            cautions: [],
            care,
          }),
        )
        .expect(201)
    ).body;
    expect(slug).toMatchObject({ group: 'other', lifeStage: 'adult', diet: 'live_prey' });
    await owner.agent
      .patch(`${base()}/animals/${slug.id}/care`)
      .send({ diet: 'plant' })
      .expect(200);
    const pupa = (
      await owner.agent
        .post(`${base()}/animals`)
        .send(
          animalBody({
            name: 'Pupa',
            scientificName: 'Arion ater',
            group: 'other',
            lifeStage: 'pupa',
            cautions: [],
          }),
        )
        .expect(201)
    ).body;
    expect(
      (await owner.agent.get(`${base()}/animals/${pupa.id}/schedule`).expect(200)).body.tasks[0]
        .reasons[0].code,
    ).toBe('pupa');
    const list = await owner.agent.get(`${base()}/animals`).expect(200);
    expect(list.body.animals.find((a: { id: string }) => a.id === slug.id).diet).toBe('plant');

    // Joined a month ago and due; rehoused into a new enclosure in the same place, it settles.
    const shelf = await place(owner, 'R');
    const juniper = await createAnimal(ctx.database.db, owner.collectionId, {
      name: 'Rehoused',
      locationId: shelf,
    });
    const before = (await owner.agent.get(`${base()}/animals/${juniper.id}/schedule`).expect(200))
      .body;
    expect(before.tasks.map((t: { kind: string }) => t.kind)).toContain('feed');
    expect(
      (
        await owner.agent
          .post(`${base()}/animals/move`)
          .send({ animalIds: [juniper.id], locationId: shelf })
      ).body.moved,
    ).toBe(0); // same place: nothing to record
    expect(
      (
        await owner.agent
          .post(`${base()}/animals/move`)
          .send({ animalIds: [juniper.id], locationId: shelf, rehoused: true })
      ).body.moved,
    ).toBe(1);
    // The schedule is the round's view, as of the start of a day (today's facts reach it via the
    // same-day path): tomorrow it shows the settling period.
    ctx.setNow(new Date(Date.now() + 86_400_000));
    try {
      const after = (await owner.agent.get(`${base()}/animals/${juniper.id}/schedule`).expect(200))
        .body;
      expect(after.tasks.map((t: { kind: string }) => t.kind)).not.toContain('feed');
      expect(after.notes[0].text).toMatch(/^Settling in after a move to a new enclosure on /);
    } finally {
      ctx.setNow(null);
    }
    const history = await owner.agent.get(`${base()}/events?animalId=${juniper.id}`).expect(200);
    expect(history.body.events[0]).toMatchObject({ kind: 'moved', payload: { rehoused: true } });
  });

  it('retires an animal off the round, keeps its history, and can bring it back', async () => {
    const a = (
      await owner.agent
        .post(`${base()}/animals`)
        .send(animalBody({ name: 'Leaving' }))
        .expect(201)
    ).body;
    const retired = await owner.agent
      .post(`${base()}/animals/${a.id}/retire`)
      .send({ status: 'rehomed', date: '2026-12-01', note: 'To a friend in Ottawa' })
      .expect(200);
    expect(retired.body).toMatchObject({ status: 'rehomed', statusDate: '2026-12-01' });
    const round = await owner.agent.get(`${base()}/rounds/today`).expect(200);
    expect(round.body.items.map((i: { animal: { id: string } }) => i.animal.id)).not.toContain(
      a.id,
    );
    const history = await owner.agent.get(`${base()}/events?animalId=${a.id}`).expect(200);
    expect(history.body.events[0]).toMatchObject({
      kind: 'status_changed',
      payload: { from: 'active', to: 'rehomed', note: 'To a friend in Ottawa' },
    });
    expect(
      (
        await owner.agent
          .post(`${base()}/animals/${a.id}/retire`)
          .send({ status: 'active', date: '2026-12-01' })
      ).status,
    ).toBe(422);
    await owner.agent.post(`${base()}/animals/${a.id}/reinstate`).send({}).expect(200);
    // A phone cannot fake a status change or a move through sync.
    const sync = await owner.agent.post(`${base()}/events`).send({
      deviceId: 'd',
      clientSentAt: new Date().toISOString(),
      events: [
        {
          id: randomUUID(),
          animalId: a.id,
          kind: 'status_changed',
          payload: { from: 'active', to: 'sold' },
          clientRecordedAt: new Date().toISOString(),
        },
      ],
    });
    expect(sync.body.results[0].status).toBe('rejected');
  });

  it('lets helpers and outsiders change nothing', async () => {
    const a = (
      await owner.agent
        .post(`${base()}/animals`)
        .send(animalBody({ name: 'Guarded' }))
        .expect(201)
    ).body;
    expect((await helper.agent.post(`${base()}/animals`).send(animalBody())).status).toBe(403);
    expect((await helper.agent.put(`${base()}/animals/${a.id}`).send(animalBody())).status).toBe(
      403,
    );
    expect(
      (
        await helper.agent
          .post(`${base()}/animals/${a.id}/retire`)
          .send({ status: 'sold', date: '2026-12-01' })
      ).status,
    ).toBe(403);
    expect((await helper.agent.get(`${base()}/export/animals.csv`)).status).toBe(403);
    expect((await helper.agent.get(`${base()}/backup`)).status).toBe(403);
    expect(
      (
        await helper.agent
          .post(`${base()}/locations`)
          .send({ room: 'R', rack: 'A', shelf: '1', position: '1' })
      ).status,
    ).toBe(403);
    expect((await outsider.agent.get(`${base()}/animals/${a.id}`)).status).toBe(404);
    expect((await ctx.agent().get(`${base()}/export/events.csv`)).status).toBe(401);
  });
});

describe('locations and the walk', () => {
  it('creates places, refuses duplicates, reorders the walk and keeps occupied places', async () => {
    const who = await signUp(ctx);
    const [a, b, c] = [await place(who, 'A'), await place(who, 'B'), await place(who, 'C')];
    expect(
      (
        await who.agent
          .post(`${base(who)}/locations`)
          .send({ room: 'Spare room', rack: 'A', shelf: '1', position: '1' })
      ).status,
    ).toBe(409);
    const reordered = await who.agent
      .put(`${base(who)}/locations/order`)
      .send({ locationIds: [c, a, b] })
      .expect(200);
    expect(reordered.body.locations.map((l: { id: string }) => l.id)).toEqual([c, a, b]);
    expect(
      (await who.agent.put(`${base(who)}/locations/order`).send({ locationIds: [c, a] })).status,
    ).toBe(422);
    await who.agent
      .post(`${base(who)}/animals`)
      .send(animalBody({ locationId: a }))
      .expect(201);
    expect((await who.agent.delete(`${base(who)}/locations/${a}`)).status).toBe(409);
    await who.agent.delete(`${base(who)}/locations/${b}`).expect(204);
  });
});

describe('photos', () => {
  let animalId: string;
  const url = () => `${base()}/animals/${animalId}/photo`;
  beforeAll(async () => {
    animalId = (
      await owner.agent
        .post(`${base()}/animals`)
        .send(animalBody({ name: 'Photogenic' }))
        .expect(201)
    ).body.id;
  });

  it('stores a photo as WebP with a thumbnail, shown to members only', async () => {
    const jpeg = await sharp({
      create: { width: 2400, height: 1800, channels: 3, background: '#6b4f2a' },
    })
      .jpeg()
      .withMetadata({ exif: { IFD0: { Copyright: 'test' } } })
      .toBuffer();
    const res = await owner.agent
      .put(url())
      .attach('photo', jpeg, { filename: 'IMG_2041.jpg', contentType: 'image/jpeg' })
      .expect(200);
    expect(res.body.photoVersion).toBeTruthy();
    const thumb = await helper.agent
      .get(`${url()}?size=thumb`)
      .buffer(true)
      .parse((r, cb) => {
        const chunks: Buffer[] = [];
        r.on('data', (c: Buffer) => chunks.push(c));
        r.on('end', () => cb(null, Buffer.concat(chunks)));
      })
      .expect(200);
    expect(thumb.headers['content-type']).toBe('image/webp');
    const meta = await sharp(thumb.body as Buffer).metadata();
    expect([meta.format, meta.width, meta.height, meta.exif]).toEqual([
      'webp',
      320,
      240,
      undefined,
    ]);
    expect((await outsider.agent.get(url())).status).toBe(404);
    expect((await ctx.agent().get(url())).status).toBe(401);
    expect(filesIn(ctx.storageDir)).toHaveLength(2);
  });

  it('refuses the wrong type, too large, empty and path tricks, and writes nothing', async () => {
    const before = filesIn(ctx.storageDir).sort();
    const png = await sharp({ create: { width: 10, height: 10, channels: 3, background: '#000' } })
      .png()
      .toBuffer();
    const cases: [Buffer, string, number, RegExp][] = [
      [Buffer.from('GIF89a\x01\x00\x01\x00'), 'spider.gif', 415, /JPEG, PNG or WebP/],
      [Buffer.from('%PDF-1.7 not a photo'), 'spider.jpg', 415, /JPEG, PNG or WebP/],
      [
        Buffer.concat([Buffer.from([0xff, 0xd8, 0xff]), Buffer.alloc(100)]),
        'broken.jpg',
        415,
        /could not be read/,
      ],
      [Buffer.alloc(11 * 1024 * 1024, 0xff), 'huge.jpg', 413, /at most 10 MB/],
      [Buffer.alloc(0), 'empty.jpg', 400, /empty/],
      [png, '../../etc/passwd', 400, /file name is not allowed/],
      [png, '..\\..\\boot.png', 400, /file name is not allowed/],
    ];
    for (const [bytes, filename, status, message] of cases) {
      // `filepath` sends the name as given (form-data would otherwise keep only its last part).
      const res = await owner.agent.put(url()).attach('photo', bytes, {
        filepath: filename,
        contentType: 'image/jpeg',
      } as unknown as {
        filename: string;
      });
      expect(res.status, filename).toBe(status);
      expect(res.body.error.message, filename).toMatch(message);
    }
    expect((await helper.agent.put(url()).attach('photo', png, { filename: 'x.png' })).status).toBe(
      403,
    );
    expect(filesIn(ctx.storageDir).sort()).toEqual(before);
  });
});

describe('CSV export and import (RFC 4180)', () => {
  it('exports animals and imports them elsewhere losslessly: commas, quotes, line breaks, non-ASCII', async () => {
    const from = await signUp(ctx);
    const to = await signUp(ctx);
    const shelf = await place(from, 'Á, "north"', '1', '2');
    const names = ['Señora "Juniper", 2nd', 'Ñandú 🕷', 'Line\r\nbreak'];
    for (const name of names) {
      await from.agent
        .post(`${base(from)}/animals`)
        .send(
          animalBody({
            name,
            notes: `Notes for ${name},\r\nsecond line`,
            locationId: shelf,
            scientificName: 'Grammostola pulchra Mello-Leitão, 1921',
          }),
        )
        .expect(201);
    }
    const csv = (await from.agent.get(`${base(from)}/export/animals.csv`).expect(200)).text;
    expect(csv.split('\r\n')[0]!.startsWith('code,name,scientific_name')).toBe(true);
    const table = readCsv(csv);
    const rows = table.records.map((r) => {
      const result = rowToAnimal(Object.fromEntries(table.headers.map((h, i) => [h, r.cells[i]!])));
      if (!result.ok) throw new Error(result.errors.join('; '));
      return result.value;
    });
    await to.agent
      .post(`${base(to)}/animals/import`)
      .send({ rows })
      .expect(201);
    const again = (await to.agent.get(`${base(to)}/export/animals.csv`).expect(200)).text;
    expect(again).toBe(csv);
  });

  it('takes a keeper’s own sheet as the import screen reads it, and refuses raw spellings in words', async () => {
    const who = await signUp(ctx);
    // Saved with CRLF line ends this time, as RFC 4180 § 2.1 has them.
    const table = readCsv(KEEPERS_SHEET_ROWS.join('\r\n'));
    const settings: ImportSettings = {
      ...firstSettings(table),
      defaults: { group: null, stage: 'sling', sex: 'unknown' },
      dateOrder: 'month-first',
    };
    const plan = planImport(table, settings, []);
    expect(plan.problems).toEqual([]);
    await who.agent
      .post(`${base(who)}/animals/import`)
      .send({ rows: plan.ready })
      .expect(201, {
        imported: 4,
      });
    const { animals } = (await who.agent.get(`${base(who)}/animals`).expect(200)).body as {
      animals: {
        name: string;
        group: string;
        lifeStage: string;
        sex: string;
        sizeMm: number | null;
        acquiredOn: string | null;
      }[];
    };
    expect(
      animals
        .map((a) => [a.name, a.group, a.lifeStage, a.sex, a.sizeMm, a.acquiredOn])
        .sort((a, b) => String(a[0]).localeCompare(String(b[0]))),
    ).toEqual([
      ['Bram', 'tarantula', 'sling', 'male', 101.6, '2025-04-03'],
      ['Dot', 'tarantula', 'sling', 'unknown', null, null],
      ['Sprout', 'tarantula', 'sling', 'unknown', 20, '2025-04-03'],
      ['Tilly', 'tarantula', 'sling', 'female', 127, '2025-03-04'],
    ]);

    // The API takes rows as the screen sends them; a raw spreadsheet cell gets a 4xx in words.
    const raw = await who.agent.post(`${base(who)}/animals/import`).send({
      rows: [{ ...plan.ready[0], name: 'Raw', labelCode: '', sex: 'F', acquiredOn: '03/04/2025' }],
    });
    expect(raw.status).toBe(422);
    expect(raw.body.error.issues).toEqual([
      { path: 'body.rows.0.sex', message: 'Choose a sex (or unknown).' },
      { path: 'body.rows.0.acquiredOn', message: 'Write the date as YYYY-MM-DD.' },
    ]);
    expect((await who.agent.get(`${base(who)}/animals`).expect(200)).body.animals).toHaveLength(4);
  });

  it('imports all or nothing and checks every row again', async () => {
    const who = await signUp(ctx);
    const res = await who.agent.post(`${base(who)}/animals/import`).send({
      rows: [
        { ...animalBody(), locationId: undefined, place: null },
        { ...animalBody({ scientificName: 'x' }), place: null },
      ],
    });
    expect(res.status).toBe(422);
    expect((await who.agent.get(`${base(who)}/animals`).expect(200)).body.animals).toHaveLength(0);
  });

  it('exports events with local times and who recorded them', async () => {
    const csv = (await owner.agent.get(`${base()}/export/events.csv`).expect(200)).text;
    const table = readCsv(csv);
    expect(table.headers).toEqual([
      'event_id',
      'when_utc',
      'local_date',
      'local_time',
      'animal_code',
      'animal_name',
      'what',
      'details',
      'recorded_by',
      'flags',
    ]);
    expect(table.records.some((r) => r.cells[6] === 'moved' && r.cells[8] === 'Test Keeper')).toBe(
      true,
    );
    // Details are words a keeper reads in a spreadsheet, never a payload's JSON or raw ids.
    const moved = table.records.find((r) => r.cells[6] === 'moved')!;
    expect(moved.cells[7]).toMatch(/^(from \S+ )?to \S+/);
    // (An undo names the event it undoes by its event_id, a column of this same file.)
    for (const r of table.records.filter((r) => !['void', 'molt_details'].includes(r.cells[6]!)))
      expect(r.cells[7]).not.toMatch(/[{}"]|[0-9a-f]{8}-[0-9a-f]{4}-/);
  });
});

describe('full backup and restore', () => {
  it('reproduces the collection and its history exactly in an empty collection', async () => {
    const from = await signUp(ctx);
    const to = await signUp(ctx);
    const shelf = await place(from, 'A');
    const a = (
      await from.agent
        .post(`${base(from)}/animals`)
        .send(animalBody({ locationId: shelf }))
        .expect(201)
    ).body;
    await from.agent
      .post(`${base(from)}/animals`)
      .send(animalBody({ name: 'Second', clutch: 'Sac 1' }))
      .expect(201);
    const tap = {
      id: randomUUID(),
      animalId: a.id,
      kind: 'ate',
      payload: {},
      clientRecordedAt: new Date().toISOString(),
    };
    const undo = {
      id: randomUUID(),
      animalId: a.id,
      kind: 'void',
      payload: { targetId: tap.id },
      clientRecordedAt: new Date().toISOString(),
    };
    const molt = {
      id: randomUUID(),
      animalId: a.id,
      kind: 'molted',
      payload: { sizeMm: 131 },
      clientRecordedAt: new Date().toISOString(),
    };
    await from.agent
      .post(`${base(from)}/events`)
      .send({ deviceId: 'd', clientSentAt: new Date().toISOString(), events: [tap, undo, molt] })
      .expect(200);
    const exuviae = await sharp({
      create: { width: 30, height: 30, channels: 3, background: '#a85' },
    })
      .jpeg()
      .toBuffer();
    await from.agent
      .put(`${base(from)}/animals/${a.id}/molts/${molt.id}/photo`)
      .attach('photo', exuviae, { filename: 'molt.jpg' })
      .expect(204);
    const png = await sharp({ create: { width: 40, height: 30, channels: 3, background: '#335' } })
      .png()
      .toBuffer();
    await from.agent
      .put(`${base(from)}/animals/${a.id}/photo`)
      .attach('photo', png, { filename: 'a.png' })
      .expect(200);

    const backup = (await from.agent.get(`${base(from)}/backup`).expect(200)).body;
    expect(backup).toMatchObject({ format: 'rackside-backup', version: BACKUP_VERSION });
    expect((await keeper.agent.post(`${base()}/restore`).send(backup)).status).toBe(403);
    const restored = await to.agent
      .post(`${base(to)}/restore`)
      .send(backup)
      .expect(201);
    expect(restored.body).toEqual({ animals: 2, events: 3 });
    const copy = (await to.agent.get(`${base(to)}/backup`).expect(200)).body;

    // Ids are new; everything else, undo targets included, is the same.
    const back = withOriginalIds(backup, copy);
    expect({ ...back, exportedAt: null, collection: null }).toEqual({
      ...backup,
      exportedAt: null,
      collection: null,
    });
    expect(back.collection.rules).toEqual(backup.collection.rules);
    expect(copy.animals.find((x: { name: string }) => x.name === 'Juniper').photo).toBe(
      backup.animals.find((x: { name: string }) => x.name === 'Juniper').photo,
    );
    expect(backup.events.find((e: { kind: string }) => e.kind === 'molted').photo).toMatch(
      /^UklGR/,
    ); // "RIFF" in base64: WebP

    // A second restore finds the collection full; a file that is not a backup is refused.
    expect((await to.agent.post(`${base(to)}/restore`).send(backup)).status).toBe(409);
    const other = await signUp(ctx);
    const bad = await other.agent
      .post(`${base(other)}/restore`)
      .send({ format: 'spreadsheet', version: 1 });
    expect(bad.status).toBe(422);
    expect(JSON.stringify(bad.body)).toMatch(/not a Rackside backup/);
  });
});
