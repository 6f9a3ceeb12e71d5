// One account must not be able to take a server down with a large backup: a 150 MB backup
// (75 photos of about 1 MB and 150,000 history entries, made here and streamed as it is made)
// restores into the production server process, heap capped at 160 MB
// (scripts/lib/server-flags.mjs), and the collection then downloads as a backup and as a
// history CSV; the process lives on. A declared body over the limit is refused before it is read.
import fs from 'node:fs';
import http from 'node:http';
import os from 'node:os';
import path from 'node:path';
import { Readable } from 'node:stream';
import { pipeline } from 'node:stream/promises';
import sharp from 'sharp';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { MAX_RESTORE_BYTES } from '#shared/domain/backup-limits';
import { LABEL_ALPHABET } from '#shared/domain/label-codes';
import { connectDatabase } from '../../server/db/client';
import { migrateDatabase } from '../../server/db/migrate';
import { readBackup } from '../../server/features/data/backup-reader';
import { insertOwner, PASSWORD } from '../factories';
import { testDatabaseUrl } from '../setup/database-urls';
import { createTestDatabase, dropTestDatabase } from '../setup/test-app';
import { startServerProcess, type ServerProcess } from '../support/server-process';

const TARGET_BYTES = 150 * 1024 * 1024;
const ANIMALS = 200;
const WITH_PHOTO = 75;
const HEADERS = { 'X-Rackside-Client': '1', 'Content-Type': 'application/json' };

let name: string;
let server: ServerProcess;
let cookie: string;
let collectionId: string;
const work = fs.mkdtempSync(path.join(os.tmpdir(), 'rackside-scale-'));

/** Peak and current resident memory of the server process, in MB (Linux /proc). */
function memoryOf(pid: number) {
  const status = fs.readFileSync(`/proc/${pid}/status`, 'utf8');
  const kb = (field: string) => Number(new RegExp(`${field}:\\s+(\\d+) kB`).exec(status)![1]);
  return { peakMb: Math.round(kb('VmHWM') / 1024), nowMb: Math.round(kb('VmRSS') / 1024) };
}

const uuidOf = (kind: number, n: number) =>
  `${kind.toString(16).padStart(8, '0')}-0000-4000-8000-${n.toString(16).padStart(12, '0')}`;
const codeOf = (n: number) =>
  `SC-${LABEL_ALPHABET[Math.floor(n / 32 / 32) % 32]}${LABEL_ALPHABET[Math.floor(n / 32) % 32]}${LABEL_ALPHABET[n % 32]}`;

/** The backup, made piece by piece as the upload reads it: never whole in this process either. */
async function* largeBackup(photo: string): AsyncGenerator<string> {
  let bytes = 0;
  const out = (text: string) => {
    bytes += Buffer.byteLength(text);
    return text;
  };
  yield out(
    `{"format":"rackside-backup","version":1,"exportedAt":"2026-12-01T10:00:00.000Z",\n"collection":{"name":"Scale","timeZone":"America/Toronto","rules":{"refusalStreak":{"adult":2}}},\n"locations":[`,
  );
  for (let i = 0; i < 20; i++)
    yield out(
      `${i ? ',' : ''}\n${JSON.stringify({ id: uuidOf(1, i), room: 'Spare room', rack: `R${i}`, shelf: '1', position: '1', walkOrder: i })}`,
    );
  yield out('],\n"animals":[');
  for (let i = 0; i < ANIMALS; i++) {
    const animal = {
      id: uuidOf(2, i),
      labelCode: codeOf(i),
      name: `Scale ${i}`,
      scientificName: 'Tliltocatl albopilosus (Valerio, 1980)',
      commonName: null,
      group: 'tarantula',
      lifeStage: 'adult',
      sex: 'female',
      sizeMm: 120,
      locationId: uuidOf(1, i % 20),
      hasWaterDish: true,
      preyType: null,
      preySize: null,
      preyCount: null,
      intervalDays: null,
      doNotFeedUntil: null,
      cautions: ['urticating_hairs'],
      cautionNote: null,
      status: 'active',
      statusDate: null,
      acquiredOn: '2024-05-01',
      source: null,
      clutch: null,
      notes: null,
      settings: {},
      createdAt: '2024-05-01T12:00:00.000Z',
      updatedAt: '2024-05-01T12:00:00.000Z',
    };
    yield out(`${i ? ',' : ''}\n${JSON.stringify(animal).slice(0, -1)},"photo":`);
    yield out(i < WITH_PHOTO ? `"${photo}"}` : 'null}');
  }
  yield out('],\n"events":[');
  const start = Date.parse('2025-01-01T12:00:00.000Z');
  let lines: string[] = [];
  for (let n = 0; bytes < TARGET_BYTES; n++) {
    const at = new Date(start + n * 60_000).toISOString();
    const kind = n % 3 === 0 ? 'refused' : 'ate';
    lines.push(
      `${n ? ',' : ''}\n${JSON.stringify({ id: uuidOf(3, n), animalId: uuidOf(2, n % ANIMALS), kind, payload: { preyType: 'cricket', preySize: 'large', count: 2, note: 'Took it at the entrance of the burrow' }, recordedBy: null, deviceId: 'scale-phone', clientRecordedAt: at, clientSentAt: at, serverReceivedAt: at, effectiveAt: at, flags: [], photo: null })}`,
    );
    if (lines.length === 500) {
      yield out(lines.join(''));
      lines = [];
    }
  }
  yield out(`${lines.join('')}\n]}\n`);
}

beforeAll(async () => {
  name = await createTestDatabase();
  const databaseUrl = testDatabaseUrl(name);
  const database = connectDatabase(databaseUrl, 1);
  await migrateDatabase(database.db);
  // Sign-up goes through an e-mailed link: the owner is written straight to the database.
  const owner = await insertOwner(database.db);
  await database.close();
  server = await startServerProcess({ databaseUrl, quiet: true });
  const res = await fetch(`${server.url}/api/auth/sign-in`, {
    method: 'POST',
    headers: HEADERS,
    body: JSON.stringify({ email: owner.email, password: PASSWORD }),
  });
  expect(res.status).toBe(200);
  cookie = res.headers.get('set-cookie')!.split(';')[0]!;
  collectionId = owner.collectionId;
}, 60_000);

afterAll(async () => {
  await server?.kill();
  await dropTestDatabase(name);
  fs.rmSync(work, { recursive: true, force: true });
});

describe('a 150 MB backup against the 160 MB heap', () => {
  it('restores, streamed in, and downloads again, streamed out, with the server alive throughout', async () => {
    // About 1 MB of WebP that libvips really has to decode (noise does not compress).
    const noise = Buffer.alloc(1200 * 1000 * 3);
    for (let i = 0; i < noise.length; i++) noise[i] = (i * 2654435761) >>> 24;
    const photo = (
      await sharp(noise, { raw: { width: 1200, height: 1000, channels: 3 } })
        .webp({ quality: 95 })
        .toBuffer()
    ).toString('base64');
    expect(photo.length).toBeGreaterThan(700_000);
    const pid = server.child.pid!;
    const before = memoryOf(pid);

    let sent = 0;
    const body = Readable.from(largeBackup(photo)).on('data', (chunk: Buffer | string) => {
      sent += Buffer.byteLength(chunk);
    });
    const restore = await fetch(`${server.url}/api/collections/${collectionId}/restore`, {
      method: 'POST',
      headers: { ...HEADERS, Cookie: cookie },
      body: Readable.toWeb(body) as ReadableStream,
      duplex: 'half',
    } as RequestInit);
    const restored = (await restore.json()) as { animals: number; events: number };
    expect(restore.status, JSON.stringify(restored)).toBe(201);
    expect(sent).toBeGreaterThanOrEqual(TARGET_BYTES);
    expect(restored.animals).toBe(ANIMALS);
    expect(restored.events).toBeGreaterThan(100_000);
    const afterRestore = memoryOf(pid);
    expect(server.child.exitCode).toBeNull();
    expect((await fetch(`${server.url}/api/health`)).status).toBe(200);

    // Out again, to a file, and read back record by record: every animal and event is there.
    const download = await fetch(`${server.url}/api/collections/${collectionId}/backup`, {
      headers: { Cookie: cookie },
    });
    expect(download.status).toBe(200);
    const file = path.join(work, 'backup.json');
    await pipeline(
      Readable.fromWeb(download.body as import('node:stream/web').ReadableStream),
      fs.createWriteStream(file),
    );
    // The history as CSV streams too: one record per event after the header.
    const csv = await fetch(`${server.url}/api/collections/${collectionId}/export/events.csv`, {
      headers: { Cookie: cookie },
    });
    expect(csv.status).toBe(200);
    let lineBreaks = 0;
    for await (const chunk of csv.body as unknown as AsyncIterable<Uint8Array>)
      for (const b of chunk) if (b === 0x0a) lineBreaks++;
    expect(lineBreaks).toBe(restored.events);
    const afterBackup = memoryOf(pid);
    expect(server.child.exitCode).toBeNull();
    const counts = { animals: 0, events: 0, photos: 0 };
    for await (const record of readBackup(file)) {
      if (record.kind !== 'item' || (record.list !== 'animals' && record.list !== 'events'))
        continue;
      counts[record.list]++;
      if ((record.value as { photo: string | null }).photo === photo) counts.photos++;
    }
    expect(counts).toEqual({ animals: ANIMALS, events: restored.events, photos: WITH_PHOTO });
    expect(fs.statSync(file).size).toBeGreaterThan(TARGET_BYTES * 0.9);

    // Figures for docs/decisions/014-backup-and-restore-at-scale.md: resident memory of the whole process, heap and libvips.
    console.info(
      `150 MB restore: RSS before ${before.nowMb} MB, peak after restore ${afterRestore.peakMb} MB, peak after backup ${afterBackup.peakMb} MB`,
    );
    // Measured ~270 MB after the restore and ~300 MB after the backup (decision 014); a runaway shows here.
    expect(afterBackup.peakMb).toBeLessThan(350);
  }, 300_000);

  it('refuses a declared body over the limit before reading it (413, a sentence)', async () => {
    const answer = await new Promise<{ status: number; body: string }>((resolve, reject) => {
      const req = http.request(`${server.url}/api/collections/${collectionId}/restore`, {
        method: 'POST',
        headers: { ...HEADERS, Cookie: cookie, 'Content-Length': String(MAX_RESTORE_BYTES + 1) },
      });
      req.on('response', (res) => {
        let body = '';
        res.on('data', (c: Buffer) => (body += c.toString()));
        res.on('end', () => {
          resolve({ status: res.statusCode!, body });
          req.destroy();
        });
      });
      req.on('error', reject);
      req.flushHeaders();
    });
    expect(answer.status).toBe(413);
    expect(JSON.parse(answer.body)).toEqual({
      error: {
        code: 'too_large',
        message: 'This backup is larger than Rackside restores (512 MB at most).',
      },
    });
    expect(server.child.exitCode).toBeNull();
  });
});
