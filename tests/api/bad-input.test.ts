// S5 (budgets): every route the app answers, fed generated invalid params, queries and bodies
// (fast-check), never answers 500 and always explains itself in a JSON error a person can read.
// Uploads of the wrong type, too large, empty or with path tricks are refused and write nothing.
import fs from 'node:fs';
import path from 'node:path';
import fc from 'fast-check';
import type { Test } from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { listRoutes } from '../../server/route-list';
import { createAnimal, PASSWORD, signUp, type SignedUp } from '../factories';
import { createTestContext, type TestContext } from '../setup/test-app';

let ctx: TestContext;
let owner: SignedUp;
let animalId: string;

beforeAll(async () => {
  ctx = await createTestContext();
  owner = await signUp(ctx);
  animalId = (await createAnimal(ctx.database.db, owner.collectionId, { name: 'Fuzzy' })).id;
});
afterAll(async () => {
  await ctx.close();
});

const RUNS_PER_ROUTE = 30;

// Segments that have broken path handling somewhere before: traversal, encodings, NUL, SQL,
// very long and non-ASCII text.
const nastySegment = fc.constantFrom(
  '..',
  '%2e%2e',
  '..%2f..%2fetc%2fpasswd',
  '%00',
  "' or 1=1 --",
  '-1',
  '0',
  'null',
  'undefined',
  '%E0%A4%A',
  ' ',
  '😀'.repeat(40),
  'a'.repeat(2000),
  '00000000-0000-0000-0000-000000000000',
);
const segment = fc.oneof(
  nastySegment,
  fc.uuid().map((u) => encodeURIComponent(u)),
  fc
    .string({ maxLength: 60 })
    .filter((s) => s.length > 0)
    .map(encodeURIComponent),
);

const FIELD_NAMES = [
  'name',
  'email',
  'password',
  'currentPassword',
  'newPassword',
  'token',
  'animalIds',
  'animalId',
  'locationId',
  'events',
  'deviceId',
  'clientSentAt',
  'status',
  'date',
  'count',
  'sheet',
  'size',
  'fields',
  'start',
  'origin',
  'femaleId',
  'laidOn',
  'text',
  'until',
  'firstDay',
  'lastDay',
  'message',
  'role',
  'room',
  'rack',
  'shelf',
  'position',
  'order',
  'intervalDays',
  'refusalStreak',
  'rows',
  'collection',
  'animals',
  'care',
  'cautions',
  'account',
  'displayName',
  'timeZone',
  'labelCode',
  'namePrefix',
  'firstPosition',
  'incubation',
  'pulledOn',
  '__proto__',
  'constructor',
];
const junkValue = fc.oneof(
  fc.jsonValue({ maxDepth: 3 }),
  nastySegment,
  fc.constantFrom(1e308, -0, Number.MAX_SAFE_INTEGER + 2, '', [], {}),
);
const body = fc.oneof(
  fc.dictionary(fc.constantFrom(...FIELD_NAMES), junkValue, { maxKeys: 6 }),
  fc.jsonValue({ maxDepth: 3 }),
  // Not JSON at all, though labelled as JSON.
  fc.string({ maxLength: 80 }).map((text) => ({ rawText: text })),
);
const query = fc.dictionary(
  fc.constantFrom('animalId', 'date', 'token', 'limit', 'v', 'size', 'x', '__proto__'),
  fc.oneof(fc.string({ maxLength: 40 }), nastySegment),
  { maxKeys: 3 },
);

function expectReadableError(
  label: string,
  res: { status: number; headers: Record<string, string>; body: unknown; text: string },
) {
  // A PDF answer (a care sheet for our own animal) has no text.
  expect(res.status, `${label} → ${res.status} ${(res.text ?? '').slice(0, 200)}`).toBeLessThan(
    500,
  );
  if (res.status < 400) return;
  expect(res.headers['content-type'], label).toMatch(/application\/json/);
  const message = (res.body as { error?: { message?: unknown } }).error?.message;
  expect(typeof message, `${label}: ${res.text.slice(0, 200)}`).toBe('string');
  // Readable: a sentence, not a parser's internals or a stack trace.
  expect(message as string, label).toMatch(/^[A-Z"“].{5,}[.!?)]$/s);
  expect(message as string, label).not.toMatch(
    /Invalid input|expected \w+, received|\bat .*\.(ts|js):\d+|ZodError|TypeError|SyntaxError|\[object Object\]/,
  );
}

describe('S5: generated bad input on every route', () => {
  const routes = () => listRoutes(ctx.app).filter((r) => r.path !== '/api/auth/sign-out');

  it('never answers 500 and always explains the refusal', async () => {
    expect(routes().length).toBeGreaterThan(60);
    for (const route of routes()) {
      await fc.assert(
        fc.asyncProperty(
          fc.array(segment, { minLength: 4, maxLength: 4 }),
          fc.boolean(),
          query,
          body,
          async (segments, ownIds, q, b) => {
            // Half the time the path names our own collection and animal, so validation of the
            // query and body is reached; otherwise every id is generated junk.
            let i = 0;
            const url = route.path.replace(/:(\w+)/g, (_m, name: string) => {
              const junk = segments[i++ % segments.length]!;
              if (!ownIds) return junk;
              if (name === 'collectionId') return owner.collectionId;
              if (name === 'animalId') return animalId;
              return junk;
            });
            const qs = Object.entries(q)
              .map(([k, v]) => `${encodeURIComponent(k)}=${encodeURIComponent(v)}`)
              .join('&');
            const full = qs ? `${url}?${qs}` : url;
            const req = (owner.agent as unknown as Record<string, (p: string) => Test>)[
              route.method.toLowerCase()
            ]!(full);
            const text =
              typeof b === 'object' && b !== null && 'rawText' in b
                ? String((b as { rawText: string }).rawText)
                : JSON.stringify(b);
            const res = await req.set('Content-Type', 'application/json').send(text);
            expectReadableError(
              `${route.method} ${full.slice(0, 160)} body ${JSON.stringify(b).slice(0, 120)}`,
              res,
            );
          },
        ),
        { numRuns: RUNS_PER_ROUTE },
      );
    }
    // The fuzzing left the owner signed in and the account usable.
    await owner.agent.get('/api/auth/me').expect(200);
    await ctx
      .agent()
      .post('/api/auth/sign-in')
      .send({ email: owner.email, password: PASSWORD })
      .expect(200);
  }, 240_000);

  it('refuses bad uploads on both photo routes and writes nothing', async () => {
    const c = `/api/collections/${owner.collectionId}`;
    const moltId = crypto.randomUUID();
    await owner.agent
      .post(`${c}/events`)
      .send({
        deviceId: 'fuzz',
        clientSentAt: new Date().toISOString(),
        events: [
          {
            id: moltId,
            animalId,
            kind: 'molted',
            payload: {},
            clientRecordedAt: new Date().toISOString(),
          },
        ],
      })
      .expect(200);
    const filesBefore = fs.readdirSync(ctx.storageDir, { recursive: true }).length;
    const trickName = fc.constantFrom(
      '../../etc/passwd',
      '..\\..\\boot.png',
      '/etc/shadow.jpg',
      'a\u0000.jpg',
      'photo.jpg',
      '.htaccess',
      'CON.png',
      '%2e%2e%2fx.png',
      '',
    );
    const garbage = fc.oneof(
      fc.uint8Array({ minLength: 0, maxLength: 2048 }).map((a) => Buffer.from(a)),
      // Looks like a JPEG to a name or a magic-number sniff, but is not one.
      fc
        .uint8Array({ maxLength: 512 })
        .map((a) => Buffer.concat([Buffer.from([0xff, 0xd8, 0xff, 0xe0]), Buffer.from(a)])),
      fc.constant(Buffer.from('GIF89a')),
      fc.constant(Buffer.from('%PDF-1.7\n')),
      fc.constant(Buffer.alloc(0)),
    );
    for (const url of [
      `${c}/animals/${animalId}/photo`,
      `${c}/animals/${animalId}/molts/${moltId}/photo`,
      `${c}/animals/${animalId}/events/${moltId}/photo`,
    ]) {
      await fc.assert(
        fc.asyncProperty(
          garbage,
          trickName,
          fc.constantFrom('image/jpeg', 'image/png', 'application/octet-stream', 'text/plain'),
          async (bytes, filename, contentType) => {
            const res = await owner.agent
              .put(url)
              .attach('photo', bytes, { filename: filename || 'x', contentType });
            expect(
              [400, 413, 415, 422],
              `${url} ${filename} ${bytes.length} bytes → ${res.status} ${res.text.slice(0, 120)}`,
            ).toContain(res.status);
            expectReadableError(url, res);
          },
        ),
        { numRuns: 40 },
      );
      // Too large: one byte over the 10 MB limit.
      const big = await owner.agent
        .put(url)
        .attach('photo', Buffer.alloc(10 * 1024 * 1024 + 1, 0xff), {
          filename: 'big.jpg',
          contentType: 'image/jpeg',
        });
      expect(big.status).toBe(413);
      expectReadableError(url, big);
      // The wrong field name and no file at all.
      expectReadableError(
        url,
        await owner.agent.put(url).attach('picture', Buffer.from('x'), 'x.jpg'),
      );
      expectReadableError(url, await owner.agent.put(url));
    }
    expect(fs.readdirSync(ctx.storageDir, { recursive: true }).length).toBe(filesBefore);
    expect(
      fs
        .readdirSync(path.dirname(ctx.storageDir))
        .filter((f) => f === 'passwd' || f === 'boot.png'),
    ).toEqual([]);
  }, 120_000);
});
