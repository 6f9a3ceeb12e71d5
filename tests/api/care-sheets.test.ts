import { execFileSync } from 'node:child_process';
import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { events } from '../../server/db/schema/animals';
import { locations } from '../../server/db/schema/collections';
import { createAnimal, signUp, type SignedUp } from '../factories';
import { createTestContext, type TestContext } from '../setup/test-app';
import { readRfc4180 } from '../support/rfc4180';

let ctx: TestContext;
let owner: SignedUp;
let base: string;
let animalId: string;
let labelCode: string;

/** The words of a PDF as poppler's pdftotext reads them (an independent reader). */
const pdfText = (pdf: Buffer) =>
  execFileSync('pdftotext', ['-layout', '-', '-'], { input: pdf }).toString('utf8');

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
      rack: 'R',
      shelf: '1',
      position: '1',
    })
    .returning();
  const a = await createAnimal(db, owner.collectionId, {
    name: 'Formosus 04',
    scientificName: 'Hapalopus formosus',
    commonName: 'Colombian pumpkin patch',
    lifeStage: 'sling',
    sizeMm: 18,
    cautions: ['urticating_hairs'],
    notes: 'private keeper words xyzzy',
    locationId: place!.id,
  });
  animalId = a.id;
  labelCode = a.labelCode;
  const at = (iso: string) => new Date(iso);
  const row = (kind: string, payload: object, when: string, id = randomUUID()) => ({
    id,
    collectionId: owner.collectionId,
    animalId,
    kind,
    payload,
    clientRecordedAt: at(when),
    effectiveAt: at(when),
  });
  const undone = randomUUID();
  await db
    .insert(events)
    .values([
      row('ate', { preyType: 'cricket', preySize: 'pinhead', count: 1 }, '2026-11-10T17:00:00Z'),
      row('molted', { sizeMm: 18 }, '2026-11-20T17:00:00Z'),
      row(
        'ate',
        { preyType: 'cricket', preySize: 'pinhead', count: 1, note: 'meal note plugh' },
        '2026-11-27T17:00:00Z',
      ),
      row(
        'ate',
        { preyType: 'roach', preySize: 'nymph', count: 2 },
        '2026-11-30T17:00:00Z',
        undone,
      ),
      row('void', { targetId: undone }, '2026-11-30T17:05:00Z'),
      row('note', { text: 'note event words quux' }, '2026-12-01T17:00:00Z'),
    ]);
  await owner.agent
    .put(`${base}/listings/${animalId}`)
    .send({ priceMinor: 2500, currency: 'CAD', description: 'Feisty eater, on coco fibre.' })
    .expect(200);
});
afterAll(async () => {
  await ctx.close();
});

describe('care sheet PDF', () => {
  it('gives the buyer the animal, its meals, its care by the current rules and the cautions', async () => {
    const res = await owner.agent
      .get(`${base}/animals/${animalId}/care-sheet.pdf`)
      .responseType('blob')
      .expect(200);
    expect(res.headers['content-type']).toBe('application/pdf');
    const text = pdfText(res.body as Buffer).replace(/\s+/g, ' ');
    for (const words of [
      'Hapalopus formosus — Colombian pumpkin patch',
      'Stage: Sling',
      'Size: 18 mm leg span',
      'Last molt: 20 Nov 2026',
      '27 Nov 2026 — 1 × cricket, pinhead',
      '10 Nov 2026 — 1 × cricket, pinhead',
      // docs/care-rules.md § Care profiles: a tarantula sling every 3 days, 4 days' post-molt hold.
      'every 3 days',
      'no food for 4 days',
      'Moisten one corner of the substrate every 4 days',
      'Irritating hairs — protect your eyes',
      'local law and licensed practice come first',
      'From the breeder',
      'Feisty eater, on coco fibre.',
    ])
      expect(text, words).toContain(words);
    // The undone meal, the keeper's notes, the place and the label code stay home.
    for (const hidden of ['roach', 'xyzzy', 'plugh', 'quux', 'Attic Q7', labelCode])
      expect(text, hidden).not.toContain(hidden);
  });

  it('is not found for an animal of another collection', async () => {
    const other = await signUp(ctx);
    const theirs = await createAnimal(ctx.database.db, other.collectionId);
    await owner.agent.get(`${base}/animals/${theirs.id}/care-sheet.pdf`).expect(404);
    await owner.agent.get(`${base}/animals/${theirs.id}/history.csv`).expect(404);
  });
});

describe('history CSV', () => {
  it('lists the standing events in words, RFC 4180, without notes or places', async () => {
    const res = await owner.agent.get(`${base}/animals/${animalId}/history.csv`).expect(200);
    expect(res.headers['content-type']).toBe('text/csv; charset=utf-8');
    const rows = readRfc4180(res.text);
    expect(rows).toEqual([
      ['date', 'time', 'what', 'details'],
      ['2026-11-10', expect.any(String), 'Ate', '1 × cricket, pinhead'],
      ['2026-11-20', expect.any(String), 'Molted', 'size 18 mm'],
      ['2026-11-27', expect.any(String), 'Ate', '1 × cricket, pinhead'],
    ]);
  });
});
