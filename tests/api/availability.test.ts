import { randomBytes, randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { AVAILABILITY_COLUMNS } from '#shared/domain/sales/availability';
import type { AvailabilitySettingsView } from '#shared/schemas/listings';
import { events } from '../../server/db/schema/animals';
import { locations } from '../../server/db/schema/collections';
import { buyers, saleAnimals, sales } from '../../server/db/schema/sales';
import { createAnimal, signUp, type SignedUp } from '../factories';
import { createTestContext, type TestContext } from '../setup/test-app';
import { readRfc4180 } from '../support/rfc4180';

let ctx: TestContext;
let owner: SignedUp;
let base: string;
/** Everything of the collection that must never reach the public list. */
const secrets: string[] = [];
const ids: string[] = [];

const settings = async () =>
  (await owner.agent.get(`${base}/availability`).expect(200)).body as AvailabilitySettingsView;
const save = (body: object) => owner.agent.put(`${base}/availability`).send(body);
const tokenOf = (s: AvailabilitySettingsView) => s.path!.split('/').at(-1)!;

beforeAll(async () => {
  ctx = await createTestContext();
  owner = await signUp(ctx);
  base = `/api/collections/${owner.collectionId}`;
  const db = ctx.database.db;
  const [place] = await db
    .insert(locations)
    .values({
      collectionId: owner.collectionId,
      room: 'Attic Q7',
      rack: 'Rack Zeta',
      shelf: 'S9',
      position: 'P42',
    })
    .returning();
  secrets.push('Attic Q7', 'Rack Zeta', place!.id);
  const make = async (i: number, over: Parameters<typeof createAnimal>[2] = {}) => {
    const a = await createAnimal(db, owner.collectionId, {
      name: `Secret name ${i}`,
      scientificName: 'Hapalopus formosus',
      commonName: 'Colombian pumpkin patch',
      lifeStage: 'sling',
      sizeMm: 10 + i,
      locationId: place!.id,
      notes: `private note ${i} xyzzy`,
      cautionNote: `caution note ${i} plugh`,
      clutch: 'Clutch name hidden',
      ...over,
    });
    secrets.push(a.id, a.labelCode, a.name, a.notes!, a.cautionNote!);
    ids.push(a.id);
    return a;
  };
  for (let i = 1; i <= 4; i++) await make(i, i === 1 ? { sex: 'female' } : {});
  const hidden = await make(5, { scientificName: 'Kochiana brunnipes', commonName: null });
  const eventId = randomUUID();
  await db.insert(events).values({
    id: eventId,
    collectionId: owner.collectionId,
    animalId: ids[0]!,
    kind: 'ate',
    payload: { preyType: 'cricket', note: 'history words quux' },
    clientRecordedAt: new Date(),
    effectiveAt: new Date(),
  });
  secrets.push(eventId, 'history words quux', 'Clutch name hidden');
  const listing = {
    priceMinor: 2500,
    currency: 'CAD',
    description: 'listing words frobnicate',
  };
  secrets.push('listing words frobnicate');
  await owner.agent
    .post(`${base}/listings/bulk`)
    .send({ animalIds: ids.slice(0, 4), ...listing })
    .expect(200);
  // A private listing (the keeper sells it only by word of mouth) and a reserved sling.
  await owner.agent
    .put(`${base}/listings/${hidden.id}`)
    .send({ ...listing, listedPublicly: false })
    .expect(200);
  const [buyer] = await db
    .insert(buyers)
    .values({
      collectionId: owner.collectionId,
      name: 'Buyer Name Wibble',
      email: 'wibble@example.test',
    })
    .returning();
  const [sale] = await db
    .insert(sales)
    .values({ collectionId: owner.collectionId, buyerId: buyer!.id, reservedUntil: '2026-12-31' })
    .returning();
  await db
    .insert(saleAnimals)
    .values({ saleId: sale!.id, animalId: ids[3]!, priceMinor: 2500, currency: 'CAD' });
  secrets.push('Buyer Name Wibble', 'wibble@example.test', buyer!.id, sale!.id, owner.collectionId);
});
afterAll(async () => {
  await ctx.close();
});

describe('the public availability list', () => {
  it('is off by default, with no link, and a made-up link is not found', async () => {
    expect(await settings()).toEqual({
      on: false,
      columns: ['species', 'stage', 'size', 'price', 'count'],
      note: '',
      path: null,
    });
    const made = await ctx.agent().get(`/api/available/${randomBytes(24).toString('base64url')}`);
    expect(made.status).toBe(404);
  });

  it('shows grouped rows with only the chosen columns, and nothing else of the collection', async () => {
    const on = await save({
      on: true,
      columns: [...AVAILABILITY_COLUMNS],
      note: 'Ships Mondays.',
    }).expect(200);
    const view = on.body as AvailabilitySettingsView;
    expect(view.path).toMatch(/^\/available\/[A-Za-z0-9_-]{32}$/);
    const res = await ctx
      .agent()
      .get(`/api/available/${tokenOf(view)}`)
      .expect(200);
    expect(res.headers['cache-control']).toBe('no-cache');
    expect(res.headers['referrer-policy']).toBe('no-referrer');
    // Field by field: the answer's keys, and each row's keys, exactly.
    expect(Object.keys(res.body).sort()).toEqual(['collectionName', 'columns', 'note', 'rows']);
    expect(res.body.note).toBe('Ships Mondays.');
    expect(res.body.rows).toHaveLength(1);
    const [row] = res.body.rows;
    expect(Object.keys(row).sort()).toEqual([...AVAILABILITY_COLUMNS].sort());
    // Three available (the fourth is reserved, the Kochiana is not public).
    expect(row).toEqual({
      species: 'Hapalopus formosus',
      commonName: 'Colombian pumpkin patch',
      stage: 'Sling',
      sex: '1 female · 2 unsexed',
      size: '11–13 mm leg span',
      price: expect.stringMatching(/25\.00/),
      count: 3,
    });
    const text = JSON.stringify(res.body);
    expect(secrets.filter((s) => text.includes(s))).toEqual([]);
    expect(text).not.toContain('Kochiana');

    const narrow = await save({ on: true, columns: ['count', 'species'], note: '' }).expect(200);
    const [only] = (
      await ctx
        .agent()
        .get(`/api/available/${tokenOf(narrow.body)}`)
        .expect(200)
    ).body.rows;
    expect(only).toEqual({ species: 'Hapalopus formosus', count: 3 });
  });

  it('gives shops a CSV (RFC 4180 §2) of the same rows and columns', async () => {
    await save({ on: true, columns: ['species', 'sex', 'price', 'count'], note: '' }).expect(200);
    const res = await ctx.agent().get(`/api/available/${tokenOf(await settings())}/list.csv`);
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toBe('text/csv; charset=utf-8');
    // Independent strict reader (tests/support/rfc4180.ts): CRLF, quoting, equal row lengths.
    expect(readRfc4180(res.text)).toEqual([
      ['Species', 'Sex', 'Price', 'Available'],
      ['Hapalopus formosus', '1 female · 2 unsexed', '25.00 CAD', '3'],
    ]);
    expect(secrets.filter((s) => res.text.includes(s))).toEqual([]);
  });

  it('answers a retired link, a list turned off and a malformed link alike: 404', async () => {
    const old = tokenOf(await settings());
    const fresh = await owner.agent.post(`${base}/availability/new-link`).expect(200);
    expect(tokenOf(fresh.body)).not.toBe(old);
    const anon = ctx.agent();
    const retired = await anon.get(`/api/available/${old}`).expect(404);
    await anon.get(`/api/available/${old}/list.csv`).expect(404);
    await anon.get(`/api/available/${tokenOf(fresh.body)}`).expect(200);
    await save({ on: false, columns: ['species'], note: '' }).expect(200);
    const off = await anon.get(`/api/available/${tokenOf(fresh.body)}`).expect(404);
    const malformed = await anon.get('/api/available/not*a*token').expect(404);
    expect(off.body).toEqual(retired.body);
    expect(malformed.body).toEqual(retired.body);
    // Turning it on again keeps the same link.
    const again = await save({ on: true, columns: ['species'], note: '' }).expect(200);
    expect(tokenOf(again.body)).toBe(tokenOf(fresh.body));
  });

  it('takes columns only from the whitelist', async () => {
    const bad = await save({ on: true, columns: ['species', 'labelCode'], note: '' }).expect(422);
    expect(bad.body.error.message.length).toBeGreaterThan(5);
    await save({ on: true, columns: [], note: '' }).expect(422);
    await save({ on: true, columns: ['species', 'species'], note: '' }).expect(422);
  });
});

describe('a shop polling the list', () => {
  it('gets a readable 429 past 60 reads a minute from one address', async () => {
    const url = `/api/available/${tokenOf(await settings())}`;
    const anon = ctx.agent();
    let refused: { status: number; body: { error: { message: string } } } | null = null;
    for (let i = 0; i < 70 && !refused; i++) {
      const res = await anon.get(url);
      if (res.status === 429) refused = res;
      else expect(res.status).toBe(200);
    }
    expect(refused?.body.error.message).toMatch(/^Too many attempts\. Wait up to 1 minutes/);
  });
});

describe('the strict RFC 4180 reader the CSV checks trust', () => {
  it('reads quoted commas, doubled quotes and line breaks', () => {
    expect(readRfc4180('a,b\r\n"x, y","say ""hi""\r\nthere"\r\n')).toEqual([
      ['a', 'b'],
      ['x, y', 'say "hi"\r\nthere'],
    ]);
  });
  it('refuses bare LF endings, stray quotes and ragged rows', () => {
    expect(() => readRfc4180('a,b\nc,d')).toThrow(/CRLF/);
    expect(() => readRfc4180('a,b"c\r\n')).toThrow(/quote/);
    expect(() => readRfc4180('a,b\r\nc\r\n')).toThrow(/same number/);
    expect(() => readRfc4180('"a"b,c')).toThrow(/CRLF/);
  });
});
