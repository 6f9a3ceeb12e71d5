import { randomUUID } from 'node:crypto';
import { and, eq } from 'drizzle-orm';
import sharp from 'sharp';
import { afterAll, afterEach, beforeAll, describe, expect, it } from 'vitest';
import { isLabelCode } from '#shared/domain/label-codes';
import { labelContent } from '#shared/domain/labels/label-content';
import { labelUrl } from '#shared/domain/labels/label-payload';
import { LABEL_SIZES, placeLabels, sheetLayout } from '#shared/domain/labels/sheet-layout';
import {
  projectState,
  type AnimalState,
  type EngineEvent,
} from '#shared/domain/rounds/animal-state';
import type { AnimalSummary } from '#shared/schemas/animals';
import type { EggSacView } from '#shared/schemas/breeding';
import { animals, eggSacs, events } from '../../server/db/schema/animals';
import { locations } from '../../server/db/schema/collections';
import { animalStates } from '../../server/db/schema/rounds';
import { sequentialCodes } from '../../server/features/breeding/breeding.service';
import { addMember, createAnimal, signUp, type SignedUp } from '../factories';
import { createTestContext, type TestContext } from '../setup/test-app';
import { decodeQrIn, rasterisePdf } from '../support/label-raster';

let ctx: TestContext;
let keeper: SignedUp;
let helper: SignedUp;
let outsider: SignedUp;
let femaleId: string;

const base = (who: SignedUp = keeper) => `/api/collections/${who.collectionId}`;
const send = (who: SignedUp, list: object[]) =>
  who.agent
    .post(`${base()}/events`)
    .send({ deviceId: 'd', clientSentAt: new Date().toISOString(), events: list })
    .expect(200);
const molt = (animalId: string, at: string, payload: object) => ({
  id: randomUUID(),
  animalId,
  kind: 'molted',
  payload,
  clientRecordedAt: at,
});

beforeAll(async () => {
  ctx = await createTestContext();
  keeper = await signUp(ctx);
  helper = await signUp(ctx);
  outsider = await signUp(ctx);
  await addMember(ctx.database.db, {
    collectionId: keeper.collectionId,
    userId: helper.userId,
    role: 'helper',
    startsAt: new Date(Date.now() - 3_600_000),
    endsAt: new Date(Date.now() + 86_400_000),
  });
  femaleId = (
    await createAnimal(ctx.database.db, keeper.collectionId, {
      name: 'Juniper',
      sex: 'female',
      scientificName: 'Hapalopus formosus',
      cautions: ['urticating_hairs'],
    })
  ).id;
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
    const id = (
      await createAnimal(ctx.database.db, keeper.collectionId, {
        name: 'Ziggy',
        lifeStage: 'juvenile',
        sex: 'unknown',
        sizeMm: 40,
      })
    ).id;
    await send(keeper, [
      molt(id, '2026-10-01T15:00:00Z', { sizeMm: 48, exuviaeKept: true, sexFromExuviae: 'male' }),
    ]);
    expect(await animal(id)).toMatchObject({ sizeMm: 48, sex: 'male' });
    const maturing = molt(id, '2026-11-20T15:00:00Z', { sizeMm: 55, maturing: true });
    await send(keeper, [maturing]);
    expect(await animal(id)).toMatchObject({ sizeMm: 55, sex: 'mature_male' });
    await send(keeper, [
      {
        id: randomUUID(),
        animalId: id,
        kind: 'void',
        payload: { targetId: maturing.id },
        clientRecordedAt: '2026-11-20T15:05:00Z',
      },
    ]);
    expect(await animal(id)).toMatchObject({ sizeMm: 48, sex: 'male' });
  });
});

describe('molt photos', () => {
  it('keeps a photo of a molt for the timeline, keepers only', async () => {
    const id = (await createAnimal(ctx.database.db, keeper.collectionId, { name: 'Shedder' })).id;
    const m = molt(id, '2026-11-01T15:00:00Z', { sizeMm: 30 });
    const fed = {
      id: randomUUID(),
      animalId: id,
      kind: 'ate',
      payload: {},
      clientRecordedAt: '2026-11-10T15:00:00Z',
    };
    await send(keeper, [m, fed]);
    const png = await sharp({ create: { width: 64, height: 48, channels: 3, background: '#654' } })
      .png()
      .toBuffer();
    const url = (eventId: string) => `${base()}/animals/${id}/molts/${eventId}/photo`;
    await keeper.agent.put(url(m.id)).attach('photo', png, { filename: 'exuviae.png' }).expect(204);
    const history = (await keeper.agent.get(`${base()}/events?animalId=${id}`).expect(200)).body
      .events;
    expect(history.find((e: { id: string }) => e.id === m.id).photoVersion).toBeTruthy();
    expect(history.find((e: { id: string }) => e.id === fed.id).photoVersion).toBeNull();
    const thumb = await keeper.agent.get(`${url(m.id)}?size=thumb`).expect(200);
    expect(thumb.headers['content-type']).toBe('image/webp');
    expect(
      (await keeper.agent.put(url(fed.id)).attach('photo', png, { filename: 'x.png' })).status,
    ).toBe(404);
    expect((await helper.agent.get(url(m.id))).status).toBe(403);
    expect((await outsider.agent.get(url(m.id))).status).toBe(404);
  });
});

describe('egg sacs', () => {
  it('records a sac with its expected window, leaves the female alone, and starts her rebuild when pulled', async () => {
    const res = await keeper.agent
      .post(`${base()}/egg-sacs`)
      .send({ femaleId, laidOn: '2026-10-01', clutch: 'Formosus sac 1' })
      .expect(201);
    // Default window 42–56 days (common practice: about 6–8 weeks): 1 Oct + 42 = 12 Nov, + 56 = 26 Nov.
    expect(res.body).toMatchObject({
      clutch: 'Formosus sac 1',
      expectedFrom: '2026-11-12',
      expectedTo: '2026-11-26',
      slingsCreated: 0,
    });
    const laid = await ctx.database.db
      .select({ kind: events.kind })
      .from(events)
      .where(eq(events.animalId, femaleId));
    expect(laid.map((e) => e.kind)).toContain('sac_laid');
    await keeper.agent
      .patch(`${base()}/egg-sacs/${res.body.id}`)
      .send({ pulledOn: '2026-11-15', eggCount: 240, eggsWithLegs: 210 })
      .expect(200);
    const after = await ctx.database.db
      .select({ kind: events.kind })
      .from(events)
      .where(eq(events.animalId, femaleId));
    expect(after.map((e) => e.kind)).toContain('sac_pulled');
    // Rule R8: the engine's state for her now says she is rebuilding after the sac.
    const [projected] = await ctx.database.db
      .select({ state: animalStates.state })
      .from(animalStates)
      .where(eq(animalStates.animalId, femaleId));
    expect(projected!.state).toMatchObject({ rebuildReason: 'sac_pulled', leaveAlone: null });

    const male = (
      await createAnimal(ctx.database.db, keeper.collectionId, { name: 'Bolt', sex: 'mature_male' })
    ).id;
    const refused = await keeper.agent
      .post(`${base()}/egg-sacs`)
      .send({ femaleId: male, laidOn: '2026-10-01' })
      .expect(422);
    expect(refused.body.error.message).toMatch(/recorded as a male/);
    expect(
      (
        await keeper.agent
          .post(`${base()}/egg-sacs`)
          .send({ femaleId, laidOn: '2026-10-01', incubation: { minDays: 60, maxDays: 40 } })
      ).status,
    ).toBe(422);
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
    const sac = (
      await keeper.agent
        .post(`${base()}/egg-sacs`)
        .send({ femaleId, laidOn: '2026-09-01', clutch: 'Formosus sac 2' })
        .expect(201)
    ).body;
    const made = await keeper.agent
      .post(`${base()}/egg-sacs/${sac.id}/slings`)
      .send({
        count: 200,
        namePrefix: 'Formosus',
        room: 'Sling room',
        rack: 'S',
        shelf: 'Tray 1',
        firstPosition: 1,
      })
      .expect(201);
    expect(made.body.animalIds).toHaveLength(200);
    const list = (await keeper.agent.get(`${base()}/animals`).expect(200)).body
      .animals as AnimalSummary[];
    const slings = list.filter((a) => a.clutch === 'Formosus sac 2');
    expect(slings).toHaveLength(200);
    const first = slings.find((a) => a.name === 'Formosus 001')!;
    expect(first).toMatchObject({
      lifeStage: 'sling',
      scientificName: 'Hapalopus formosus',
      cautions: ['urticating_hairs'],
      location: { rack: 'S', shelf: 'Tray 1', position: '1' },
    });
    expect(slings.find((a) => a.name === 'Formosus 200')!.location!.position).toBe('200');
    const sacs = (await keeper.agent.get(`${base()}/egg-sacs`).expect(200)).body.sacs;
    expect(sacs.find((s: { id: string }) => s.id === sac.id)).toMatchObject({
      slingCount: 200,
      slingsCreated: 200,
    });

    // Their labels: 25 mm squares on A4, every QR decoded (ISO/IEC 18004 checks as in issue 5).
    const me = (await keeper.agent.get('/api/auth/me').expect(200)).body.memberships[0];
    const ordered = made.body.animalIds as string[];
    const pdf = (
      await keeper.agent
        .post(`${base()}/labels/pdf`)
        .send({
          animalIds: ordered,
          sheet: 'a4',
          size: LABEL_SIZES['square-25'],
          fields: [],
          start: 1,
          origin: 'http://localhost:3000',
        })
        .responseType('blob')
        .expect(200)
    ).body as Buffer;
    const sheet = sheetLayout('a4', LABEL_SIZES['square-25']);
    const pages = rasterisePdf(pdf, 200);
    const places = placeLabels(200, 1, sheet.perSheet);
    const byId = new Map(slings.map((a) => [a.id, a]));
    const wrong = ordered.filter((id, i) => {
      const a = byId.get(id)!;
      const { layout } = labelContent(a, me.labelTag, 'http://localhost:3000', sheet.label, []);
      const cell = sheet.cells[places[i]!.cell]!;
      return (
        decodeQrIn(pages[places[i]!.sheet]!, {
          ...layout.quiet,
          x: cell.x + layout.quiet.x,
          y: cell.y + layout.quiet.y,
        }) !== labelUrl('http://localhost:3000', me.labelTag, a.labelCode)
      );
    });
    expect(wrong).toEqual([]);
  });

  it('leaves nothing behind when it fails part-way', async () => {
    const sac = (
      await keeper.agent
        .post(`${base()}/egg-sacs`)
        .send({ femaleId, laidOn: '2026-08-01', clutch: 'Formosus sac 3' })
        .expect(201)
    ).body;
    const { pool } = ctx.database;
    // A fault on the 150th sling: the database refuses that one row.
    await pool.query(
      `create or replace function fail_on_150() returns trigger language plpgsql as $$ begin if new.name = 'Broken 150' then raise exception 'injected failure'; end if; return new; end $$`,
    );
    await pool.query(
      'create trigger fail_on_150 before insert on animals for each row execute function fail_on_150()',
    );
    try {
      const res = await keeper.agent.post(`${base()}/egg-sacs/${sac.id}/slings`).send({
        count: 200,
        namePrefix: 'Broken',
        room: 'Sling room',
        rack: 'S',
        shelf: 'Tray 9',
        firstPosition: 1,
      });
      expect(res.status).toBe(500);
    } finally {
      await pool.query('drop trigger fail_on_150 on animals');
    }
    expect(
      await ctx.database.db
        .select({ id: animals.id })
        .from(animals)
        .where(eq(animals.clutch, 'Formosus sac 3')),
    ).toHaveLength(0);
    expect(
      await ctx.database.db
        .select({ id: locations.id })
        .from(locations)
        .where(and(eq(locations.collectionId, keeper.collectionId), eq(locations.shelf, 'Tray 9'))),
    ).toHaveLength(0);
  });

  it('is for keepers only', async () => {
    const sac = (
      await keeper.agent
        .post(`${base()}/egg-sacs`)
        .send({ femaleId, laidOn: '2026-07-01' })
        .expect(201)
    ).body;
    for (const who of [helper, outsider]) {
      const expected = who === helper ? 403 : 404;
      expect((await who.agent.get(`${base()}/egg-sacs`)).status).toBe(expected);
      expect(
        (await who.agent.post(`${base()}/egg-sacs`).send({ femaleId, laidOn: '2026-07-01' }))
          .status,
      ).toBe(expected);
      expect((await who.agent.patch(`${base()}/egg-sacs/${sac.id}`).send({})).status).toBe(
        expected,
      );
      expect(
        (
          await who.agent
            .post(`${base()}/egg-sacs/${sac.id}/slings`)
            .send({ count: 1, namePrefix: 'x', room: 'r', rack: 'r', shelf: 's', firstPosition: 1 })
        ).status,
      ).toBe(expected);
      expect(
        (await who.agent.put(`${base()}/incubation`).send({ minDays: 40, maxDays: 50 })).status,
      ).toBe(expected);
    }
  });
});

// Items 4 and 6: breeding follows the group, and a female with a sac or brood.
// Sources: the project's husbandry rules (R7, R8, R11 amended; care-profile "breeding" column);
// common practice, no published source.
describe('a female with a sac or brood', () => {
  const ZONE = 'America/Toronto';
  // 10:00 in Toronto (EST, UTC−5) on Fri 20 Nov 2026.
  const NOW = new Date('2026-11-20T15:00:00Z');
  afterEach(() => ctx.setNow(null));

  const factsOf = (animalId: string) =>
    ctx.database.db
      .select({ id: events.id, kind: events.kind, at: events.effectiveAt, payload: events.payload })
      .from(events)
      .where(eq(events.animalId, animalId));
  /** Her facts no void has cancelled, as kind@instant. */
  async function liveFacts(animalId: string) {
    const all = await factsOf(animalId);
    const voided = new Set(
      all.filter((e) => e.kind === 'void').map((e) => (e.payload as { targetId: string }).targetId),
    );
    return all
      .filter((e) => e.kind !== 'void' && !voided.has(e.id))
      .map((e) => `${e.kind}@${e.at.toISOString()}`)
      .sort();
  }
  /** The stored projection, checked against a fold of her whole log. */
  async function stateOf(animalId: string) {
    const [row] = await ctx.database.db
      .select({ state: animalStates.state })
      .from(animalStates)
      .where(eq(animalStates.animalId, animalId));
    const log = (await factsOf(animalId)).map((e) => ({
      id: e.id,
      kind: e.kind as EngineEvent['kind'],
      effectiveAt: e.at.toISOString(),
      payload: e.payload as Record<string, unknown>,
    }));
    expect(row!.state).toEqual(projectState(log, ZONE));
    return row!.state as AnimalState;
  }
  const schedule = (who: SignedUp, animalId: string) =>
    who.agent
      .get(`${base(who)}/animals/${animalId}/schedule`)
      .expect(200)
      .then(
        (r) =>
          r.body as {
            tasks: { kind: string; reasons: { text: string }[] }[];
            nextWater: string | null;
          },
      );
  const tap = (animalId: string, kind: string, at: string, payload: object = {}) => ({
    id: randomUUID(),
    animalId,
    kind,
    payload,
    clientRecordedAt: at,
  });
  const sendAs = (who: SignedUp, list: object[]) =>
    who.agent
      .post(`${base(who)}/events`)
      .send({ deviceId: 'd', clientSentAt: NOW.toISOString(), events: list })
      .expect(200);

  it('dates the keeper gives are the facts’ effective dates (noon there, or now when it is today); changing them voids and re-records', async () => {
    ctx.setNow(NOW);
    const id = (
      await createAnimal(ctx.database.db, keeper.collectionId, {
        name: 'Dated',
        sex: 'female',
        scientificName: 'Hapalopus formosus',
      })
    ).id;
    const sac = (
      await keeper.agent
        .post(`${base()}/egg-sacs`)
        .send({ femaleId: id, laidOn: '2026-10-01' })
        .expect(201)
    ).body;
    expect(sac).toMatchObject({ kind: 'egg_sac', clutch: 'Dated sac 2026-10-01' });
    // Noon on 1 Oct in Toronto is 16:00 UTC (EDT, UTC−4); on 15 and 12 Nov 17:00 UTC (EST, UTC−5).
    expect(await liveFacts(id)).toEqual(['sac_laid@2026-10-01T16:00:00.000Z']);
    await keeper.agent
      .patch(`${base()}/egg-sacs/${sac.id}`)
      .send({ pulledOn: '2026-11-15' })
      .expect(200);
    expect(await liveFacts(id)).toEqual([
      'sac_laid@2026-10-01T16:00:00.000Z',
      'sac_pulled@2026-11-15T17:00:00.000Z',
    ]);
    expect(await stateOf(id)).toMatchObject({
      leaveAlone: null,
      rebuildSince: '2026-11-15',
      rebuildReason: 'sac_pulled',
    });

    // The keeper corrects the pull to 12 Nov: the old fact is voided, the new one dated 12 Nov.
    await keeper.agent
      .patch(`${base()}/egg-sacs/${sac.id}`)
      .send({ pulledOn: '2026-11-12' })
      .expect(200);
    expect(await liveFacts(id)).toEqual([
      'sac_laid@2026-10-01T16:00:00.000Z',
      'sac_pulled@2026-11-12T17:00:00.000Z',
    ]);
    expect((await factsOf(id)).filter((e) => e.kind === 'void')).toHaveLength(1);
    expect(await stateOf(id)).toMatchObject({ rebuildSince: '2026-11-12' });
    // Saving the same dates again changes nothing.
    await keeper.agent
      .patch(`${base()}/egg-sacs/${sac.id}`)
      .send({ pulledOn: '2026-11-12', eggCount: 120 })
      .expect(200);
    expect(await factsOf(id)).toHaveLength(4);
    // Taking the pull back: she is guarding again.
    await keeper.agent.patch(`${base()}/egg-sacs/${sac.id}`).send({ pulledOn: null }).expect(200);
    expect(await liveFacts(id)).toEqual(['sac_laid@2026-10-01T16:00:00.000Z']);
    expect((await stateOf(id)).leaveAlone).toEqual({ reason: 'guarding_sac', since: '2026-10-01' });
    // Moving the laying date moves its fact.
    await keeper.agent
      .patch(`${base()}/egg-sacs/${sac.id}`)
      .send({ laidOn: '2026-10-03' })
      .expect(200);
    expect(await liveFacts(id)).toEqual(['sac_laid@2026-10-03T16:00:00.000Z']);

    // Today's date: the moment it was typed.
    const today = (
      await createAnimal(ctx.database.db, keeper.collectionId, { name: 'Today', sex: 'female' })
    ).id;
    await keeper.agent
      .post(`${base()}/egg-sacs`)
      .send({ femaleId: today, laidOn: '2026-11-20' })
      .expect(201);
    expect(await liveFacts(today)).toEqual([`sac_laid@${NOW.toISOString()}`]);

    // Dates after today, or before the laying, are refused with the reason.
    const future = await keeper.agent
      .patch(`${base()}/egg-sacs/${sac.id}`)
      .send({ pulledOn: '2026-11-21' })
      .expect(422);
    expect(future.body.error.message).toBe('Pulled on: the date cannot be after today.');
    const early = await keeper.agent
      .patch(`${base()}/egg-sacs/${sac.id}`)
      .send({ hatchedOn: '2026-09-30' })
      .expect(422);
    expect(early.body.error.message).toBe(
      'Hatched on: the date cannot be before it was laid (2026-10-03).',
    );
    expect(
      (
        await keeper.agent
          .post(`${base()}/egg-sacs`)
          .send({ femaleId: today, laidOn: '2026-11-21' })
          .expect(422)
      ).body.error.message,
    ).toBe('Laid on: the date cannot be after today.');
  });

  it('corrects facts written before records were named in them (a female with one record)', async () => {
    ctx.setNow(NOW);
    const id = (
      await createAnimal(ctx.database.db, keeper.collectionId, { name: 'Older', sex: 'female' })
    ).id;
    const sac = (
      await keeper.agent
        .post(`${base()}/egg-sacs`)
        .send({ femaleId: id, laidOn: '2026-10-01' })
        .expect(201)
    ).body;
    // As the server wrote them before: no record id, the pull dated when it was typed.
    await ctx.database.db.update(events).set({ payload: {} }).where(eq(events.animalId, id));
    await ctx.database.db.insert(events).values({
      id: randomUUID(),
      collectionId: keeper.collectionId,
      animalId: id,
      kind: 'sac_pulled',
      payload: {},
      deviceId: 'server',
      clientRecordedAt: NOW,
      effectiveAt: new Date('2026-11-19T20:00:00Z'),
    });
    await ctx.database.db
      .update(eggSacs)
      .set({ pulledOn: '2026-11-10' })
      .where(eq(eggSacs.id, sac.id));
    await keeper.agent
      .patch(`${base()}/egg-sacs/${sac.id}`)
      .send({ pulledOn: '2026-11-11' })
      .expect(200);
    expect(await liveFacts(id)).toEqual([
      'sac_laid@2026-10-01T16:00:00.000Z',
      'sac_pulled@2026-11-11T17:00:00.000Z',
    ]);
    expect(await stateOf(id)).toMatchObject({ rebuildSince: '2026-11-11' });
  });

  it('a sac that hatched with her, never pulled, ends her guarding and starts her rebuild from the hatch date', async () => {
    ctx.setNow(NOW);
    const id = (
      await createAnimal(ctx.database.db, keeper.collectionId, { name: 'Hatcher', sex: 'female' })
    ).id;
    await sendAs(keeper, [tap(id, 'ate', '2026-09-15T22:00:00Z')]);
    const sac = (
      await keeper.agent
        .post(`${base()}/egg-sacs`)
        .send({ femaleId: id, laidOn: '2026-09-20' })
        .expect(201)
    ).body;
    expect((await schedule(keeper, id)).tasks.map((t) => t.kind)).toEqual(['leave_alone']);
    await keeper.agent
      .patch(`${base()}/egg-sacs/${sac.id}`)
      .send({ hatchedOn: '2026-11-10' })
      .expect(200);
    expect(await liveFacts(id)).toEqual([
      'ate@2026-09-15T22:00:00.000Z',
      'sac_hatched@2026-11-10T17:00:00.000Z',
      'sac_laid@2026-09-20T16:00:00.000Z',
    ]);
    expect(await stateOf(id)).toMatchObject({
      leaveAlone: null,
      rebuildSince: '2026-11-10',
      rebuildReason: 'sac_hatched',
    });
    const plan = await schedule(keeper, id);
    const feed = plan.tasks.find((t) => t.kind === 'feed')!;
    // R8: adult interval 12 × 0.5 = 6 days, for 56 days from 10 Nov: until 5 Jan.
    expect(feed.reasons.map((r) => r.text)).toContain(
      'Rebuilding after the egg sac hatched on 10 Nov: fed every 6 days instead of 12 until 5 Jan.',
    );
    // A pull recorded after all: the pull is what ends the guarding, from its own date.
    await keeper.agent
      .patch(`${base()}/egg-sacs/${sac.id}`)
      .send({ pulledOn: '2026-11-12' })
      .expect(200);
    expect(await stateOf(id)).toMatchObject({
      rebuildSince: '2026-11-12',
      rebuildReason: 'sac_pulled',
    });
    expect((await liveFacts(id)).filter((f) => f.startsWith('sac_hatched'))).toEqual([]);
  });

  it('gives a guarding female only a quiet water task when her water is due (R11 amended)', async () => {
    ctx.setNow(NOW);
    const owner = await signUp(ctx);
    const id = (
      await createAnimal(ctx.database.db, owner.collectionId, {
        name: 'Mother',
        sex: 'female',
        hasWaterDish: true,
      })
    ).id;
    await sendAs(owner, [
      tap(id, 'ate', '2026-11-01T22:00:00Z'),
      tap(id, 'watered', '2026-11-16T22:00:00Z'),
    ]);
    await owner.agent
      .post(`${base(owner)}/egg-sacs`)
      .send({ femaleId: id, laidOn: '2026-11-05' })
      .expect(201);
    // Watered 16 Nov, every 3 days (R7): due 19 Nov, so carried over to today.
    const round = (await owner.agent.get(`${base(owner)}/rounds/today`).expect(200)).body;
    const item = round.items.find((i: { animal: { id: string } }) => i.animal.id === id);
    expect(item.tasks.map((t: { kind: string }) => t.kind)).toEqual(['leave_alone', 'water']);
    expect(item.tasks[0].reasons[0].text).toBe(
      'Guarding an egg sac since 5 Nov: leave alone — no food, no disturbance.',
    );
    expect(item.tasks[1].reasons[0].text).toBe(
      'Water (last topped up on 16 Nov): top up quietly, do not disturb her.',
    );
    // Topped up: the task is done, and she stays guarded.
    await sendAs(owner, [tap(id, 'watered', NOW.toISOString())]);
    const done = (await owner.agent.get(`${base(owner)}/rounds/today`).expect(200)).body.items.find(
      (i: { animal: { id: string } }) => i.animal.id === id,
    );
    expect(done.tasks[1]).toMatchObject({ kind: 'water', done: { kind: 'watered' } });
    expect((await stateOf(id)).leaveAlone).toEqual({ reason: 'guarding_sac', since: '2026-11-05' });
    // No other task until the next water is due, three days on.
    ctx.setNow(new Date('2026-11-21T15:00:00Z'));
    const after = await schedule(owner, id);
    expect(after.tasks.map((t) => t.kind)).toEqual(['leave_alone']);
    expect(after.nextWater).toBe('2026-11-23');
    ctx.setNow(new Date('2026-11-23T15:00:00Z'));
    expect((await schedule(owner, id)).tasks.map((t) => t.kind)).toEqual(['leave_alone', 'water']);
  });

  it('refuses a pairing or a sac for a male, a juvenile whose sex is not known, and a beetle; a female is accepted', async () => {
    ctx.setNow(NOW);
    const male = await createAnimal(ctx.database.db, keeper.collectionId, {
      name: 'Dart',
      sex: 'male',
    });
    const juvenile = await createAnimal(ctx.database.db, keeper.collectionId, {
      name: 'Pip',
      sex: 'unknown',
      lifeStage: 'juvenile',
    });
    const beetle = await createAnimal(ctx.database.db, keeper.collectionId, {
      name: 'Stag',
      sex: 'female',
      group: 'beetle',
      scientificName: 'Coleoptera sp.',
    });
    const female = await createAnimal(ctx.database.db, keeper.collectionId, {
      name: 'Willing',
      sex: 'female',
    });
    const expected: [typeof male, string][] = [
      [male, "Dart is recorded as a male. Change the sex on the animal's page if that is wrong."],
      [juvenile, "Pip's sex is not known yet. Record her as a female on the animal's page first."],
      [
        beetle,
        'Beetles lay their eggs in the substrate: there is no egg sac, egg case or brood to record.',
      ],
    ];
    for (const [animal, message] of expected) {
      const res = await keeper.agent
        .post(`${base()}/egg-sacs`)
        .send({ femaleId: animal.id, laidOn: '2026-11-01' })
        .expect(422);
      expect(res.body.error.message).toBe(message);
    }
    const taps = [
      ...expected.map(([a]) => tap(a.id, 'paired', NOW.toISOString(), { outcome: 'accepted' })),
      tap(female.id, 'paired', NOW.toISOString(), { outcome: 'accepted' }),
    ];
    const res = await sendAs(keeper, taps);
    expect(
      res.body.results.map((r: { status: string; reason?: string }) => r.reason ?? r.status),
    ).toEqual(['invalid', 'invalid', 'invalid', 'accepted']);
    expect(res.body.results.map((r: { message?: string }) => r.message ?? null)).toEqual([
      ...expected.map(([, m]) => `A pairing is not recorded: ${m}`),
      null,
    ]);
    expect(await liveFacts(male.id)).toEqual([]);
    expect(await stateOf(female.id)).toMatchObject({
      rebuildReason: 'paired',
      rebuildSince: '2026-11-20',
    });
  });

  it('goes out in the backup and comes back: the records, and their facts still naming them', async () => {
    ctx.setNow(NOW);
    const from = await signUp(ctx);
    const mother = await createAnimal(ctx.database.db, from.collectionId, {
      name: 'Carrier',
      sex: 'female',
      group: 'scorpion',
      scientificName: 'Heterometrus spinifer',
    });
    await from.agent
      .post(`${base(from)}/egg-sacs`)
      .send({ femaleId: mother.id, laidOn: '2026-11-05', slingCount: 19, clutch: 'Carrier brood' })
      .expect(201);
    const backup = (await from.agent.get(`${base(from)}/backup`).expect(200)).body;
    expect(backup.eggSacs).toHaveLength(1);
    const to = await signUp(ctx);
    await to.agent
      .post(`${base(to)}/restore`)
      .send(backup)
      .expect(201);
    const [copy] = (await to.agent.get(`${base(to)}/egg-sacs`).expect(200)).body
      .sacs as EggSacView[];
    expect(copy).toMatchObject({
      kind: 'brood',
      clutch: 'Carrier brood',
      laidOn: '2026-11-05',
      slingCount: 19,
      femaleName: 'Carrier',
    });
    // Its fact names the copy, so a date changed in the copy corrects the copy's facts.
    await to.agent
      .patch(`${base(to)}/egg-sacs/${copy!.id}`)
      .send({ laidOn: '2026-11-04' })
      .expect(200);
    expect(await liveFacts(copy!.femaleId)).toEqual(['brood_started@2026-11-04T17:00:00.000Z']);
    // A backup made before sacs were kept still restores.
    const { eggSacs: _none, ...older } = backup;
    const third = await signUp(ctx);
    await third.agent
      .post(`${base(third)}/restore`)
      .send(older)
      .expect(201);
  });

  it('records a scorpion’s brood (birth date, scorplings; left alone until it disperses) and a mantis’s egg case', async () => {
    ctx.setNow(NOW);
    const scorpion = await createAnimal(ctx.database.db, keeper.collectionId, {
      name: 'Empress',
      sex: 'female',
      group: 'scorpion',
      scientificName: 'Heterometrus spinifer',
      hasWaterDish: true,
    });
    const brood = (
      await keeper.agent
        .post(`${base()}/egg-sacs`)
        .send({ femaleId: scorpion.id, laidOn: '2026-11-05', slingCount: 28 })
        .expect(201)
    ).body;
    // Scorplings disperse after their first molt, about 1–3 weeks (from memory): 12–26 Nov.
    expect(brood).toMatchObject({
      kind: 'brood',
      femaleGroup: 'scorpion',
      clutch: 'Empress brood 2026-11-05',
      slingCount: 28,
      expectedFrom: '2026-11-12',
      expectedTo: '2026-11-26',
    });
    expect(await liveFacts(scorpion.id)).toEqual(['brood_started@2026-11-05T17:00:00.000Z']);
    expect((await stateOf(scorpion.id)).leaveAlone).toEqual({
      reason: 'guarding_brood',
      since: '2026-11-05',
    });
    const guarded = await schedule(keeper, scorpion.id);
    expect(guarded.tasks.map((t) => t.kind)).toEqual(['leave_alone', 'water']);
    expect(guarded.tasks[0]!.reasons[0]!.text).toBe(
      'Carrying her brood since 5 Nov: leave alone — no food, no disturbance.',
    );
    expect(
      (
        await keeper.agent
          .patch(`${base()}/egg-sacs/${brood.id}`)
          .send({ pulledOn: '2026-11-18' })
          .expect(422)
      ).body.error.message,
    ).toBe('A brood is not pulled: record when it dispersed.');
    await keeper.agent
      .patch(`${base()}/egg-sacs/${brood.id}`)
      .send({ dispersedOn: '2026-11-18' })
      .expect(200);
    expect(await stateOf(scorpion.id)).toMatchObject({
      leaveAlone: null,
      rebuildSince: '2026-11-18',
      rebuildReason: 'brood_dispersed',
    });
    expect((await schedule(keeper, scorpion.id)).tasks.map((t) => t.kind)).toContain('feed');

    const mantis = await createAnimal(ctx.database.db, keeper.collectionId, {
      name: 'Hook',
      sex: 'female',
      group: 'mantis',
      scientificName: 'Hierodula membranacea',
    });
    const ootheca = (
      await keeper.agent
        .post(`${base()}/egg-sacs`)
        .send({ femaleId: mantis.id, laidOn: '2026-11-02' })
        .expect(201)
    ).body;
    // An egg case incubates about 4–8 weeks (common practice, no published source): 30 Nov – 28 Dec.
    expect(ootheca).toMatchObject({
      kind: 'egg_case',
      femaleGroup: 'mantis',
      clutch: 'Hook case 2026-11-02',
      expectedFrom: '2026-11-30',
      expectedTo: '2026-12-28',
    });
    expect(await liveFacts(mantis.id)).toEqual(['case_laid@2026-11-02T17:00:00.000Z']);
    // A mantis does not guard her ootheca: she stays on the round.
    expect((await stateOf(mantis.id)).leaveAlone).toBeNull();
    // Fed (and misted: no dish for a mantis, docs/care-rules.md § Mantis), never left alone.
    expect((await schedule(keeper, mantis.id)).tasks.map((t) => t.kind)).toEqual(['feed', 'mist']);
    const listed = (await keeper.agent.get(`${base()}/egg-sacs`).expect(200)).body.sacs as {
      id: string;
      kind: string;
    }[];
    expect(
      listed
        .filter((s) => s.id === brood.id || s.id === ootheca.id)
        .map((s) => s.kind)
        .sort(),
    ).toEqual(['brood', 'egg_case']);
  });
});
