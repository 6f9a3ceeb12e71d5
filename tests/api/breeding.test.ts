import { randomUUID } from 'node:crypto';
import { and, eq } from 'drizzle-orm';
import sharp from 'sharp';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { animals, events } from '../../server/db/schema/animals';
import { locations } from '../../server/db/schema/collections';
import { animalStates } from '../../server/db/schema/rounds';
import { sequentialCodes } from '../../server/features/breeding/breeding.service';
import { isLabelCode } from '../../shared/domain/label-codes';
import { labelContent } from '../../shared/domain/labels/label-content';
import { labelUrl } from '../../shared/domain/labels/label-payload';
import { LABEL_SIZES, placeLabels, sheetLayout } from '../../shared/domain/labels/sheet-layout';
import type { AnimalSummary } from '../../shared/schemas/animals';
import { addMember, createAnimal, signUp, type SignedUp } from '../factories';
import { createTestContext, type TestContext } from '../setup/test-app';
import { decodeQrIn, rasterisePdf } from '../support/label-raster';

let ctx: TestContext;
let keeper: SignedUp;
let helper: SignedUp;
let outsider: SignedUp;
let femaleId: string;

const base = (who: SignedUp = keeper) => `/api/collections/${who.collectionId}`;
const send = (who: SignedUp, list: object[]) => who.agent.post(`${base()}/events`).send({ deviceId: 'd', clientSentAt: new Date().toISOString(), events: list }).expect(200);
const molt = (animalId: string, at: string, payload: object) => ({ id: randomUUID(), animalId, kind: 'molted', payload, clientRecordedAt: at });

beforeAll(async () => {
  ctx = await createTestContext();
  keeper = await signUp(ctx);
  helper = await signUp(ctx);
  outsider = await signUp(ctx);
  await addMember(ctx.database.db, { collectionId: keeper.collectionId, userId: helper.userId, role: 'helper', startsAt: new Date(Date.now() - 3_600_000), endsAt: new Date(Date.now() + 86_400_000) });
  femaleId = (await createAnimal(ctx.database.db, keeper.collectionId, { name: 'Juniper', sex: 'female', scientificName: 'Hapalopus formosus', cautions: ['urticating_hairs'] })).id;
});
afterAll(async () => {
  await ctx.close();
});

async function animal(id: string) {
  const [row] = await ctx.database.db.select().from(animals).where(eq(animals.id, id));
  return row!;
}

describe('molts update the record', () => {
  it('sets the size after the molt and the sex the exuviae shows; a maturing molt makes a mature male; undoing puts it back', async () => {
    const id = (await createAnimal(ctx.database.db, keeper.collectionId, { name: 'Ziggy', lifeStage: 'juvenile', sex: 'unknown', sizeMm: 40 })).id;
    await send(keeper, [molt(id, '2026-10-01T15:00:00Z', { sizeMm: 48, exuviaeKept: true, sexFromExuviae: 'male' })]);
    expect(await animal(id)).toMatchObject({ sizeMm: 48, sex: 'male' });
    const maturing = molt(id, '2026-11-20T15:00:00Z', { sizeMm: 55, maturing: true });
    await send(keeper, [maturing]);
    expect(await animal(id)).toMatchObject({ sizeMm: 55, sex: 'mature_male' });
    await send(keeper, [{ id: randomUUID(), animalId: id, kind: 'void', payload: { targetId: maturing.id }, clientRecordedAt: '2026-11-20T15:05:00Z' }]);
    expect(await animal(id)).toMatchObject({ sizeMm: 48, sex: 'male' });
  });
});

describe('molt photos', () => {
  it('keeps a photo of a molt for the timeline, keepers only', async () => {
    const id = (await createAnimal(ctx.database.db, keeper.collectionId, { name: 'Shedder' })).id;
    const m = molt(id, '2026-11-01T15:00:00Z', { sizeMm: 30 });
    const fed = { id: randomUUID(), animalId: id, kind: 'ate', payload: {}, clientRecordedAt: '2026-11-10T15:00:00Z' };
    await send(keeper, [m, fed]);
    const png = await sharp({ create: { width: 64, height: 48, channels: 3, background: '#654' } }).png().toBuffer();
    const url = (eventId: string) => `${base()}/animals/${id}/molts/${eventId}/photo`;
    await keeper.agent.put(url(m.id)).attach('photo', png, { filename: 'exuviae.png' }).expect(204);
    const history = (await keeper.agent.get(`${base()}/events?animalId=${id}`).expect(200)).body.events;
    expect(history.find((e: { id: string }) => e.id === m.id).photoVersion).toBeTruthy();
    expect(history.find((e: { id: string }) => e.id === fed.id).photoVersion).toBeNull();
    const thumb = await keeper.agent.get(`${url(m.id)}?size=thumb`).expect(200);
    expect(thumb.headers['content-type']).toBe('image/webp');
    expect((await keeper.agent.put(url(fed.id)).attach('photo', png, { filename: 'x.png' })).status).toBe(404);
    expect((await helper.agent.get(url(m.id))).status).toBe(403);
    expect((await outsider.agent.get(url(m.id))).status).toBe(404);
  });
});

describe('egg sacs', () => {
  it('records a sac with its expected window, leaves the female alone, and starts her rebuild when pulled', async () => {
    const res = await keeper.agent.post(`${base()}/egg-sacs`).send({ femaleId, laidOn: '2026-10-01', clutch: 'Formosus sac 1' }).expect(201);
    // Default window 42–56 days (common practice: about 6–8 weeks): 1 Oct + 42 = 12 Nov, + 56 = 26 Nov.
    expect(res.body).toMatchObject({ clutch: 'Formosus sac 1', expectedFrom: '2026-11-12', expectedTo: '2026-11-26', slingsCreated: 0 });
    const laid = await ctx.database.db.select({ kind: events.kind }).from(events).where(eq(events.animalId, femaleId));
    expect(laid.map((e) => e.kind)).toContain('sac_laid');
    await keeper.agent.patch(`${base()}/egg-sacs/${res.body.id}`).send({ pulledOn: '2026-11-15', eggCount: 240, eggsWithLegs: 210 }).expect(200);
    const after = await ctx.database.db.select({ kind: events.kind }).from(events).where(eq(events.animalId, femaleId));
    expect(after.map((e) => e.kind)).toContain('sac_pulled');
    // Rule R8: the engine's state for her now says she is rebuilding after the sac.
    const [projected] = await ctx.database.db.select({ state: animalStates.state }).from(animalStates).where(eq(animalStates.animalId, femaleId));
    expect(projected!.state).toMatchObject({ rebuildReason: 'sac_pulled', leaveAlone: null });

    const male = (await createAnimal(ctx.database.db, keeper.collectionId, { name: 'Bolt', sex: 'mature_male' })).id;
    const refused = await keeper.agent.post(`${base()}/egg-sacs`).send({ femaleId: male, laidOn: '2026-10-01' }).expect(422);
    expect(refused.body.error.message).toMatch(/recorded as a male/);
    expect((await keeper.agent.post(`${base()}/egg-sacs`).send({ femaleId, laidOn: '2026-10-01', incubation: { minDays: 60, maxDays: 40 } })).status).toBe(422);
  });
});

describe('a clutch becomes slings', () => {
  it('numbers codes in sequence and skips codes already used', () => {
    expect(sequentialCodes('NL', 3, new Set(), 0)).toEqual(['NL-222', 'NL-223', 'NL-224']);
    // 32 symbols: after …9 comes …A, after …Z the next place carries.
    expect(sequentialCodes('NL', 2, new Set(), 31)).toEqual(['NL-22Z', 'NL-232']);
    expect(sequentialCodes('NL', 2, new Set(['NL-223']), 0)).toEqual(['NL-224', 'NL-225']);
    expect(sequentialCodes('NL', 200, new Set(), 500).every(isLabelCode)).toBe(true);
  });

  it('creates 200 slings in one transaction, in tray order, whose labels all decode', async () => {
    const sac = (await keeper.agent.post(`${base()}/egg-sacs`).send({ femaleId, laidOn: '2026-09-01', clutch: 'Formosus sac 2' }).expect(201)).body;
    const made = await keeper.agent.post(`${base()}/egg-sacs/${sac.id}/slings`).send({ count: 200, namePrefix: 'Formosus', room: 'Sling room', rack: 'S', shelf: 'Tray 1', firstPosition: 1 }).expect(201);
    expect(made.body.animalIds).toHaveLength(200);
    const list = (await keeper.agent.get(`${base()}/animals`).expect(200)).body.animals as AnimalSummary[];
    const slings = list.filter((a) => a.clutch === 'Formosus sac 2');
    expect(slings).toHaveLength(200);
    const first = slings.find((a) => a.name === 'Formosus 001')!;
    expect(first).toMatchObject({ lifeStage: 'sling', scientificName: 'Hapalopus formosus', cautions: ['urticating_hairs'], location: { rack: 'S', shelf: 'Tray 1', position: '1' } });
    expect(slings.find((a) => a.name === 'Formosus 200')!.location!.position).toBe('200');
    const sacs = (await keeper.agent.get(`${base()}/egg-sacs`).expect(200)).body.sacs;
    expect(sacs.find((s: { id: string }) => s.id === sac.id)).toMatchObject({ slingCount: 200, slingsCreated: 200 });

    // Their labels: 25 mm squares on A4, every QR decoded (ISO/IEC 18004 checks as in issue 5).
    const me = (await keeper.agent.get('/api/auth/me').expect(200)).body.memberships[0];
    const ordered = made.body.animalIds as string[];
    const pdf = (await keeper.agent.post(`${base()}/labels/pdf`).send({ animalIds: ordered, sheet: 'a4', size: LABEL_SIZES['square-25'], fields: [], start: 1, origin: 'http://localhost:3000' }).responseType('blob').expect(200)).body as Buffer;
    const sheet = sheetLayout('a4', LABEL_SIZES['square-25']);
    const pages = rasterisePdf(pdf, 200);
    const places = placeLabels(200, 1, sheet.perSheet);
    const byId = new Map(slings.map((a) => [a.id, a]));
    const wrong = ordered.filter((id, i) => {
      const a = byId.get(id)!;
      const { layout } = labelContent(a, me.labelTag, 'http://localhost:3000', sheet.label, []);
      const cell = sheet.cells[places[i]!.cell]!;
      return decodeQrIn(pages[places[i]!.sheet]!, { ...layout.quiet, x: cell.x + layout.quiet.x, y: cell.y + layout.quiet.y }) !== labelUrl('http://localhost:3000', me.labelTag, a.labelCode);
    });
    expect(wrong).toEqual([]);
  });

  it('leaves nothing behind when it fails part-way', async () => {
    const sac = (await keeper.agent.post(`${base()}/egg-sacs`).send({ femaleId, laidOn: '2026-08-01', clutch: 'Formosus sac 3' }).expect(201)).body;
    const { pool } = ctx.database;
    // A fault on the 150th sling: the database refuses that one row.
    await pool.query(`create or replace function fail_on_150() returns trigger language plpgsql as $$ begin if new.name = 'Broken 150' then raise exception 'injected failure'; end if; return new; end $$`);
    await pool.query('create trigger fail_on_150 before insert on animals for each row execute function fail_on_150()');
    try {
      const res = await keeper.agent.post(`${base()}/egg-sacs/${sac.id}/slings`).send({ count: 200, namePrefix: 'Broken', room: 'Sling room', rack: 'S', shelf: 'Tray 9', firstPosition: 1 });
      expect(res.status).toBe(500);
    } finally {
      await pool.query('drop trigger fail_on_150 on animals');
    }
    expect(await ctx.database.db.select({ id: animals.id }).from(animals).where(eq(animals.clutch, 'Formosus sac 3'))).toHaveLength(0);
    expect(await ctx.database.db.select({ id: locations.id }).from(locations).where(and(eq(locations.collectionId, keeper.collectionId), eq(locations.shelf, 'Tray 9')))).toHaveLength(0);
  });

  it('is for keepers only', async () => {
    const sac = (await keeper.agent.post(`${base()}/egg-sacs`).send({ femaleId, laidOn: '2026-07-01' }).expect(201)).body;
    for (const who of [helper, outsider]) {
      const expected = who === helper ? 403 : 404;
      expect((await who.agent.get(`${base()}/egg-sacs`)).status).toBe(expected);
      expect((await who.agent.post(`${base()}/egg-sacs`).send({ femaleId, laidOn: '2026-07-01' })).status).toBe(expected);
      expect((await who.agent.patch(`${base()}/egg-sacs/${sac.id}`).send({})).status).toBe(expected);
      expect((await who.agent.post(`${base()}/egg-sacs/${sac.id}/slings`).send({ count: 1, namePrefix: 'x', room: 'r', rack: 'r', shelf: 's', firstPosition: 1 })).status).toBe(expected);
      expect((await who.agent.put(`${base()}/incubation`).send({ minDays: 40, maxDays: 50 })).status).toBe(expected);
    }
  });
});
