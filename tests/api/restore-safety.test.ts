// A restore checks every record with the API's own schemas and is all or nothing: a poisoned
// backup (rules no API accepts, unknown cautions, duplicate codes or places, payloads wrong for
// their kind, a photo that cannot be read or written) is refused with a sentence, and leaves
// no row and no file behind, so the same collection can take a good backup straight after.
import { randomUUID } from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';
import { Readable } from 'node:stream';
import { eq, sql } from 'drizzle-orm';
import sharp from 'sharp';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { findMembership } from '../../server/access/memberships';
import { collections } from '../../server/db/schema/collections';
import { createAnimalsService } from '../../server/features/animals/animals.service';
import { createDataService } from '../../server/features/data/data.service';
import {
  createPhotosService,
  type PhotosService,
} from '../../server/features/photos/photos.service';
import { HttpError } from '../../server/middleware/errors';
import { animalBody, signUp, type SignedUp } from '../factories';
import { createTestContext, type TestContext } from '../setup/test-app';

let ctx: TestContext;
let source: SignedUp;
/** A good backup with a place, two animals (one with a photo) and history with a molt photo. */
let backup: Backup;

interface Backup {
  collection: { rules: Record<string, unknown> };
  locations: Record<string, unknown>[];
  animals: Record<string, unknown>[];
  events: Record<string, unknown>[];
  [key: string]: unknown;
}

/** The collection as the membership check hands it to the service. */
const collectionOf = async (who: SignedUp) =>
  (await findMembership(ctx.database.db, who.collectionId, who.userId))!;
const base = (who: SignedUp) => `/api/collections/${who.collectionId}`;
const copy = (): Backup => structuredClone(backup);
const filesUnder = (dir: string): string[] =>
  fs.existsSync(dir)
    ? (fs.readdirSync(dir, { recursive: true }) as string[]).filter((f) =>
        fs.statSync(path.join(dir, f)).isFile(),
      )
    : [];

/** What a failed restore must not leave: rows of the collection, its rules changed, files anywhere. */
async function leftBehind(collectionId: string) {
  const count = async (table: string) =>
    Number(
      (
        await ctx.database.db.execute<{ n: string }>(
          sql`select count(*) as n from ${sql.identifier(table)} where collection_id = ${collectionId}`,
        )
      ).rows[0]!.n,
    );
  const [c] = await ctx.database.db
    .select({ rules: collections.rules })
    .from(collections)
    .where(eq(collections.id, collectionId));
  return {
    rows: {
      locations: await count('locations'),
      animals: await count('animals'),
      events: await count('events'),
      event_photos: await count('event_photos'),
      animal_states: await count('animal_states'),
    },
    rules: c!.rules,
    photoFiles: filesUnder(path.join(ctx.storageDir, 'photos', collectionId)),
    workspaces: filesUnder(path.join(ctx.storageDir, 'restoring')),
  };
}
const NOTHING = {
  rows: { locations: 0, animals: 0, events: 0, event_photos: 0, animal_states: 0 },
  rules: {},
  photoFiles: [],
  workspaces: [],
};

async function refused(file: unknown, status = 422) {
  const to = await signUp(ctx);
  const res = await to.agent
    .post(`${base(to)}/restore`)
    .set('Content-Type', 'application/json')
    .send(typeof file === 'string' ? file : JSON.stringify(file));
  expect(res.status, JSON.stringify(res.body)).toBe(status);
  expect(await leftBehind(to.collectionId)).toEqual(NOTHING);
  // Refused, and still empty: a good backup goes in straight after.
  await to.agent
    .post(`${base(to)}/restore`)
    .send(backup)
    .expect(201);
  return res.body.error as { message: string; issues?: { path: string; message: string }[] };
}

beforeAll(async () => {
  ctx = await createTestContext();
  source = await signUp(ctx);
  const c = base(source);
  const place = (
    await source.agent
      .post(`${c}/locations`)
      .send({ room: 'Spare room', rack: 'A', shelf: '1', position: '1' })
      .expect(201)
  ).body.id;
  await source.agent
    .post(`${c}/locations`)
    .send({ room: 'Spare room', rack: 'A', shelf: '1', position: '2' })
    .expect(201);
  const first = (
    await source.agent
      .post(`${c}/animals`)
      .send(animalBody({ locationId: place }))
      .expect(201)
  ).body;
  await source.agent
    .post(`${c}/animals`)
    .send(animalBody({ name: 'Second', cautions: [] }))
    .expect(201);
  const png = await sharp({ create: { width: 40, height: 30, channels: 3, background: '#335' } })
    .png()
    .toBuffer();
  await source.agent
    .put(`${c}/animals/${first.id}/photo`)
    .attach('photo', png, { filename: 'a.png' })
    .expect(200);
  const at = new Date().toISOString();
  const tap = {
    id: randomUUID(),
    animalId: first.id,
    kind: 'ate',
    payload: { count: 2 },
    clientRecordedAt: at,
  };
  const molt = {
    id: randomUUID(),
    animalId: first.id,
    kind: 'molted',
    payload: { sizeMm: 131 },
    clientRecordedAt: at,
  };
  const undo = {
    id: randomUUID(),
    animalId: first.id,
    kind: 'void',
    payload: { targetId: tap.id },
    clientRecordedAt: at,
  };
  await source.agent
    .post(`${c}/events`)
    .send({ deviceId: 'd', clientSentAt: at, events: [tap, molt, undo] })
    .expect(200);
  await source.agent
    .put(`${c}/animals/${first.id}/molts/${molt.id}/photo`)
    .attach('photo', png, { filename: 'm.png' })
    .expect(204);
  backup = (await source.agent.get(`${c}/backup`).expect(200)).body;
  // The animal with the photo first, so later poisons find its photo already written aside.
  backup.animals.sort((a) => (a.photo ? -1 : 1));
  expect(backup.animals[0]!.photo).toMatch(/^UklGR/);
});
afterAll(async () => {
  await ctx.close();
});

describe('a poisoned backup is refused and leaves nothing behind', () => {
  it('rules the rules screen would refuse: an interval of 0 days', async () => {
    const file = copy();
    file.collection.rules = {
      profiles: { tarantula: { stages: { adult: { feedEveryDays: 0 } } } },
    };
    const error = await refused(file);
    expect(error.message).toBe(
      'The collection: The tarantula adult interval must be at least 1 day.',
    );
  });

  it('a caution the app does not know (the helper’s round could not show it)', async () => {
    const file = copy();
    file.animals[1]!.cautions = ['spits_acid'];
    const error = await refused(file);
    expect(error.message).toMatch(
      /^Animal 2 \([A-Z0-9-]+\): Cautions: Choose one of "potent_venom"/,
    );
    expect(error.issues?.[0]?.path).toBe('animals.1.cautions.0');
  });

  it('a label code that is not one, and two animals with the same code', async () => {
    const bad = copy();
    bad.animals[0]!.labelCode = 'hello world';
    expect((await refused(bad)).message).toMatch(
      /^Animal 1 \(hello world\): Label codes look like NL-7K3/,
    );

    // The first animal's photo was already written aside when the second one clashes.
    const twice = copy();
    twice.animals[1]!.labelCode = twice.animals[0]!.labelCode;
    expect((await refused(twice)).message).toBe(
      `Two animals in this backup have the label code ${String(backup.animals[0]!.labelCode)}: each animal needs its own.`,
    );
  });

  it('the same place twice', async () => {
    const file = copy();
    file.locations[1] = { ...file.locations[0]!, id: randomUUID() };
    expect((await refused(file)).message).toBe(
      'Two places in this backup are the same room, rack, shelf and position (Spare room · A · 1 · 1): each may be listed once.',
    );
  });

  it('a payload wrong for its kind, after the molt photo was written aside', async () => {
    const file = copy();
    const tap = file.events.find((e) => e.kind === 'ate')!;
    file.events.push({ ...tap, id: randomUUID(), payload: { count: 0, colour: 'green' } });
    const last = file.events.length - 1;
    const error = await refused(file);
    expect(error.message).toMatch(/^History entry 4: /);
    expect(error.issues?.map((i) => i.path).sort()).toEqual(
      [`events.${last}.payload`, `events.${last}.payload.count`].sort(),
    );
  });

  it('an undo of an entry the backup does not hold, and history of an animal it does not hold', async () => {
    const undo = copy();
    const v = undo.events.findIndex((e) => e.kind === 'void');
    undo.events[v] = { ...undo.events[v]!, payload: { targetId: randomUUID() } };
    expect((await refused(undo)).message).toMatch(
      /^An undo in the history of [A-Z0-9-]+ refers to an entry this backup does not contain\.$/,
    );

    const orphan = copy();
    orphan.events[0] = { ...orphan.events[0]!, animalId: randomUUID() };
    expect((await refused(orphan)).message).toBe(
      'This backup has history for an animal it does not contain.',
    );
  });

  it('a photo that is not an image, or not one this server would have stored', async () => {
    const junk = copy();
    junk.events.find((e) => e.kind === 'molted')!.photo = Buffer.from(
      'RIFF\0\0\0\0WEBPVP8 not really an image',
    ).toString('base64');
    expect((await refused(junk)).message).toMatch(
      /^History entry \d: This photo could not be read/,
    );

    const huge = copy();
    const big = await sharp({
      create: { width: 2400, height: 100, channels: 3, background: '#123' },
    })
      .webp()
      .toBuffer();
    huge.animals[0]!.photo = big.toString('base64');
    expect((await refused(huge)).message).toMatch(
      /^Animal 1 \([A-Z0-9-]+\): This photo could not be read, or is larger than the 1600 px/,
    );
  });

  it('files that are not whole backups: not JSON, cut short, another format, lists out of order', async () => {
    expect(
      (await refused('{"format": "rackside-backup", "version": 1, oops', 400)).message,
    ).toMatch(/^This file is not valid JSON/);
    const whole = JSON.stringify(backup);
    expect((await refused(whole.slice(0, Math.floor(whole.length * 0.8)), 400)).message).toBe(
      'This file ends before the backup does: it may not have finished downloading.',
    );
    expect((await refused({ format: 'spreadsheet', version: 1 })).message).toBe(
      'This is not a Rackside backup file.',
    );
    expect((await refused({ ...copy(), version: 7 })).message).toMatch(
      /another version of Rackside/,
    );
    const { events, ...rest } = copy();
    expect(
      (
        await refused(
          `{"format":"rackside-backup","version":1,"events":${JSON.stringify(events)},${JSON.stringify(rest).slice(1)}`,
        )
      ).message,
    ).toMatch(/out of order/);
    expect((await refused({ ...copy(), animals: { a: backup.animals[0] } })).message).toBe(
      'This file is not a Rackside backup: “animals” should be a list.',
    );
    expect(
      (await refused(`{"format":"rackside-backup","notes":"${'x'.repeat(15_000_000)}"}`)).message,
    ).toMatch(/far longer than anything a backup holds/);
  });
});

describe('a photo write that fails', () => {
  it('rolls everything back, removes the photos already written, and the restore can be tried again', async () => {
    const to = await signUp(ctx);
    const db = ctx.database.db;
    const photos = createPhotosService(db, ctx.storageDir, () => new Date());
    let writes = 0;
    let first: Promise<string> | undefined;
    let writtenBeforeFailure: string[] = [];
    // The disk fills up at the second photo: the first is already on disk, in the workspace.
    const failing: PhotosService = {
      ...photos,
      async openRestoreWorkspace() {
        const workspace = await photos.openRestoreWorkspace();
        return {
          ...workspace,
          async stagePhoto(webp: Buffer) {
            if (++writes === 1) return (first = workspace.stagePhoto(webp));
            await first;
            writtenBeforeFailure = filesUnder(path.join(ctx.storageDir, 'restoring')).filter((f) =>
              f.endsWith('.webp'),
            );
            throw Object.assign(new Error('ENOSPC: no space left on device, write'), {
              code: 'ENOSPC',
            });
          },
        };
      },
    };
    const animals = createAnimalsService(db);
    const stream = () => Readable.from([Buffer.from(JSON.stringify(backup))]);
    const error = await createDataService(db, { animals, photos: failing })
      .restore(await collectionOf(to), stream())
      .catch((e: unknown) => e);
    expect(error).toBeInstanceOf(HttpError);
    expect(error).toMatchObject({
      status: 503,
      message:
        'The server could not store the photos of this backup, so nothing was restored. Try again later.',
    });
    expect(writes).toBe(2);
    expect(writtenBeforeFailure).toHaveLength(2);
    expect(await leftBehind(to.collectionId)).toEqual(NOTHING);

    // With room on the disk again, the same backup restores into the same collection.
    expect(
      await createDataService(db, { animals, photos }).restore(await collectionOf(to), stream()),
    ).toEqual({ animals: 2, events: 3 });
    const after = await leftBehind(to.collectionId);
    expect(after.rows).toEqual({
      locations: 2,
      animals: 2,
      events: 3,
      event_photos: 1,
      animal_states: 2,
    });
    expect(after.photoFiles).toHaveLength(4);
    expect(after.workspaces).toEqual([]);
  });

  it('a backup over the size limit is refused as it arrives (413), with nothing kept', async () => {
    const to = await signUp(ctx);
    const db = ctx.database.db;
    const photos = createPhotosService(db, ctx.storageDir, () => new Date());
    const small = createDataService(db, {
      animals: createAnimalsService(db),
      photos,
      maxRestoreBytes: 1024,
    });
    const chunks = [Buffer.from(JSON.stringify(backup))];
    const error = await small
      .restore(await collectionOf(to), Readable.from(chunks))
      .catch((e: unknown) => e);
    expect(error).toMatchObject({
      status: 413,
      message: 'This backup is larger than Rackside restores (1 KB at most).',
    });
    const declared = await small
      .restore(await collectionOf(to), Readable.from(chunks), 2048)
      .catch((e: unknown) => e);
    expect(declared).toMatchObject({ status: 413 });
    expect(await leftBehind(to.collectionId)).toEqual(NOTHING);
  });
});
