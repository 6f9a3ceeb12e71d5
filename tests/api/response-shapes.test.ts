// The app checks every answer with the shared schemas (src/lib/api-client.ts): an answer that
// does not match shows as "could not read" instead of a screen. These are the answers the app
// reads, from the real server, each checked with the schema the client uses for it.
import { randomUUID } from 'node:crypto';
import { eq } from 'drizzle-orm';
import sharp from 'sharp';
import type { Response } from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { z } from 'zod';
import {
  animalListResponse,
  animalSummary,
  moveResponse,
  photoSavedResponse,
} from '#shared/schemas/animals';
import { meResponse, resetRequestedResponse } from '#shared/schemas/auth';
import { eggSacListResponse, eggSacView, slingsCreatedResponse } from '#shared/schemas/breeding';
import { choreBatchResponse } from '#shared/schemas/chores';
import {
  animalClimateResponse,
  climateRoomsResponse,
  climateTodayResponse,
  loggerImportResponse,
  roomHistoryResponse,
  roomTargetsResponse,
} from '#shared/schemas/climate';
import {
  collectionResponse,
  inviteSentResponse,
  membersResponse,
  restoreResponse,
} from '#shared/schemas/collections';
import { coloniesResponse, colonyView, stockHistoryResponse } from '#shared/schemas/colonies';
import { createdResponse, noContent } from '#shared/schemas/common';
import {
  acceptResponse,
  coverListResponse,
  coverReportsResponse,
  handoverResponse,
  helperCoverView,
  invitePreview,
} from '#shared/schemas/cover';
import { devMailResponse } from '#shared/schemas/dev';
import { historyResponse } from '#shared/schemas/events';
import { helperReportsResponse } from '#shared/schemas/helper-reports';
import { importResponse } from '#shared/schemas/import';
import { relabelResponse } from '#shared/schemas/labels';
// Sales — listings, availability (L)
import {
  availabilitySettings,
  bulkListingResponse,
  listingResponse,
  listingsResponse,
  publicAvailability,
} from '#shared/schemas/listings';
import { locationListResponse, locationResponse } from '#shared/schemas/locations';
import { invoicePayments } from '#shared/schemas/payments';
import { engineInputResponse, roundResponse, scheduleResponse } from '#shared/schemas/rounds';
import { rulesResponse } from '#shared/schemas/rules';
import {
  animalSaleResponse,
  availableResponse,
  buyersResponse,
  buyerView,
  invoiceView,
  saleDetail,
  salesResponse,
  salesSettingsResponse,
} from '#shared/schemas/sales';
import { collections, coverReports } from '../../server/db/schema/collections';
import { buyers, invoices, sales } from '../../server/db/schema/sales';
import { addMember, animalBody, createAnimal, PASSWORD, signUp, type SignedUp } from '../factories';
import { createTestContext, type TestContext } from '../setup/test-app';
import { listedClutch, receivePayment } from '../support/sales';

let ctx: TestContext;
let owner: SignedUp;
let helper: SignedUp;
let femaleId: string;

const base = (who: SignedUp = owner) => `/api/collections/${who.collectionId}`;
const day = (fromToday: number) =>
  new Date(Date.now() + fromToday * 86_400_000).toISOString().slice(0, 10);
const tokenIn = (text: string) => /token=([A-Za-z0-9_-]+)/.exec(text)![1]!;

/** The answer as the client reads it (204: no body), checked with its schema. */
function expectShape<T>(res: Response, schema: z.ZodType<T>, status = 200): T {
  expect(res.status, JSON.stringify(res.body)).toBe(status);
  const checked = schema.safeParse(status === 204 ? undefined : res.body);
  expect(checked.success, checked.error?.message).toBe(true);
  return checked.data!;
}

beforeAll(async () => {
  ctx = await createTestContext();
  owner = await signUp(ctx);
  helper = await signUp(ctx);
  await addMember(ctx.database.db, {
    collectionId: owner.collectionId,
    userId: helper.userId,
    role: 'helper',
    startsAt: new Date(Date.now() - 86_400_000),
    endsAt: new Date(Date.now() + 2 * 86_400_000),
  });
  femaleId = (
    await createAnimal(ctx.database.db, owner.collectionId, {
      name: 'Juniper',
      sex: 'female',
      cautions: ['urticating_hairs'],
      hasWaterDish: true,
    })
  ).id;
});
afterAll(async () => {
  await ctx.close();
});

describe('answers the app reads', () => {
  it('animals, places, photos and labels', async () => {
    const a = owner.agent;
    const place = expectShape(
      await a
        .post(`${base()}/locations`)
        .send({ room: 'Spare room', rack: 'A', shelf: '1', position: '1' }),
      locationResponse,
      201,
    );
    const created = expectShape(
      await a.post(`${base()}/animals`).send(animalBody({ locationId: place.id })),
      animalSummary,
      201,
    );
    expectShape(
      await a
        .put(`${base()}/animals/${created.id}`)
        .send(animalBody({ name: 'Juno', locationId: place.id })),
      animalSummary,
    );
    expectShape(
      await a
        .post(`${base()}/animals/${created.id}/retire`)
        .send({ status: 'rehomed', date: day(0), note: null }),
      animalSummary,
    );
    expectShape(await a.post(`${base()}/animals/${created.id}/reinstate`).send({}), animalSummary);
    expectShape(
      await a
        .post(`${base()}/animals/move`)
        .send({ animalIds: [created.id], locationId: place.id, rehoused: true }),
      moveResponse,
    );
    expectShape(await a.get(`${base()}/animals`), animalListResponse);
    const listed = expectShape(await a.get(`${base()}/locations`), locationListResponse);
    expectShape(
      await a
        .put(`${base()}/locations/order`)
        .send({ locationIds: listed.locations.map((l) => l.id) }),
      locationListResponse,
    );
    const first = listed.locations[0]!;
    expectShape(
      await a
        .post(`${base()}/locations/rename`)
        .send({ level: 'rack', room: first.room, rack: first.rack, to: first.rack }),
      locationListResponse,
    );
    const png = await sharp({ create: { width: 64, height: 48, channels: 3, background: '#654' } })
      .png()
      .toBuffer();
    expectShape(
      await a
        .put(`${base()}/animals/${created.id}/photo`)
        .attach('photo', png, { filename: 'juno.png' }),
      photoSavedResponse,
    );
    expectShape(await a.post(`${base()}/animals/${created.id}/relabel`), relabelResponse);
    const row = { ...animalBody({ name: 'Imported' }), locationId: undefined, place: null };
    expectShape(
      await a.post(`${base()}/animals/import`).send({ rows: [row] }),
      importResponse,
      201,
    );
    const spare = expectShape(
      await a
        .post(`${base()}/locations`)
        .send({ room: 'Spare room', rack: 'B', shelf: '1', position: '1' }),
      locationResponse,
      201,
    );
    expectShape(await a.delete(`${base()}/locations/${spare.id}`), noContent, 204);
  });

  it('rounds, history, schedules and rules, older stored rules included', async () => {
    const a = owner.agent;
    expectShape(await a.get(`${base()}/rounds/today`), roundResponse);
    expectShape(await a.get(`${base()}/rounds/tomorrow`), roundResponse);
    expectShape(await a.get(`${base()}/rounds/engine-input`), engineInputResponse);
    expectShape(await a.get(`${base()}/events?animalId=${femaleId}&limit=2000`), historyResponse);
    expectShape(await a.get(`${base()}/animals/${femaleId}/schedule`), scheduleResponse);
    expectShape(
      await a.patch(`${base()}/animals/${femaleId}/care`).send({ intervalDays: 9 }),
      scheduleResponse,
    );
    expectShape(await a.get(`${base()}/rules`), rulesResponse);
    expectShape(
      await a.put(`${base()}/rules`).send({
        waterEveryDays: 4,
        feeders: [{ preyType: 'cricket', preySize: 'small', lengthMm: 8 }],
      }),
      rulesResponse,
    );
    // Overrides saved before care profiles come back as they were stored.
    await ctx.database.db
      .update(collections)
      .set({ rules: { intervalDays: { adult: 20 }, groupIntervalDays: { centipede: 9 } } })
      .where(eq(collections.id, owner.collectionId));
    const legacy = expectShape(await a.get(`${base()}/rules`), rulesResponse);
    expect(legacy.rules.profiles.tarantula.stages.adult?.feedEveryDays).toBe(20);
    expect(legacy.overrides).toEqual({
      intervalDays: { adult: 20 },
      groupIntervalDays: { centipede: 9 },
    });
  });

  it('feeder colonies, their history and a batch of chores', async () => {
    const colony = expectShape(
      await owner.agent.post(`${base()}/colonies`).send({
        name: 'Shape bin',
        species: 'Blaptica dubia',
        preyType: 'roach',
        sizes: ['adult'],
        intervals: { feed: 3, water_gel: 3, clean: 14, split: null },
      }),
      colonyView,
      201,
    );
    expectShape(
      await owner.agent
        .post(`${base()}/colonies/${colony.id}/counts`)
        .send({ counts: [{ preySize: 'adult', count: 12 }] }),
      colonyView,
    );
    expectShape(await owner.agent.get(`${base()}/colonies`), coloniesResponse);
    expectShape(
      await owner.agent.get(`${base()}/colonies/${colony.id}/history`),
      stockHistoryResponse,
    );
    expectShape(
      await owner.agent.post(`${base()}/chores`).send({
        clientSentAt: new Date().toISOString(),
        chores: [
          {
            id: randomUUID(),
            subjectKind: 'colony',
            subjectId: colony.id,
            kind: 'clean',
            clientRecordedAt: new Date().toISOString(),
          },
        ],
      }),
      choreBatchResponse,
    );
    expectShape(await owner.agent.delete(`${base()}/colonies/${colony.id}`), noContent, 204);
  });

  it('breeding records', async () => {
    const a = owner.agent;
    const sac = expectShape(
      await a.post(`${base()}/egg-sacs`).send({ femaleId, laidOn: day(-50), eggCount: 80 }),
      eggSacView,
      201,
    );
    expectShape(await a.get(`${base()}/egg-sacs`), eggSacListResponse);
    expectShape(
      await a.patch(`${base()}/egg-sacs/${sac.id}`).send({ pulledOn: day(-2), slingCount: 3 }),
      eggSacListResponse,
    );
    expectShape(
      await a.post(`${base()}/egg-sacs/${sac.id}/slings`).send({
        count: 2,
        namePrefix: 'Juniper',
        room: 'Sling room',
        rack: 'S',
        shelf: '1',
        firstPosition: 1,
      }),
      slingsCreatedResponse,
      201,
    );
    expectShape(
      await a.put(`${base()}/incubation`).send({ minDays: 40, maxDays: 60 }),
      noContent,
      204,
    );
  });

  it('covers, handover notes, reports and the helper’s own cover', async () => {
    const a = owner.agent;
    const email = `sitter-${randomUUID().slice(0, 6)}@example.test`;
    expectShape(
      await a
        .post(`${base()}/covers`)
        .send({ email, firstDay: day(1), lastDay: day(3), message: 'Blue tub.' }),
      createdResponse,
      201,
    );
    const covers = expectShape(await a.get(`${base()}/covers`), coverListResponse);
    const note = expectShape(
      await a
        .post(`${base()}/handover/notes`)
        .send({ animalId: femaleId, text: 'Skip her', until: day(3), doNotFeed: true }),
      createdResponse,
      201,
    );
    expectShape(
      await a.put(`${base()}/handover/general`).send({ text: 'Lights off at ten.' }),
      noContent,
      204,
    );
    expectShape(await a.get(`${base()}/handover`), handoverResponse);
    await ctx.database.db.insert(coverReports).values({
      collectionId: owner.collectionId,
      localDate: day(0),
      subject: 'Today’s feeds',
      body: 'All fed.',
    });
    expect(
      expectShape(await a.get(`${base()}/cover-reports`), coverReportsResponse).reports,
    ).toHaveLength(1);
    expectShape(await helper.agent.get(`${base()}/cover/mine`), helperCoverView);
    expectShape(await helper.agent.post(`${base()}/cover/mine/acknowledge`), noContent, 204);
    expectShape(
      await helper.agent
        .post(`${base()}/helper-reports`)
        .send({ kind: 'escape', animalId: femaleId, note: 'Lid open.' }),
      createdResponse,
      201,
    );
    expect(
      expectShape(await a.get(`${base()}/helper-reports`), helperReportsResponse).reports,
    ).toHaveLength(1);
    expectShape(await a.delete(`${base()}/handover/notes/${note.id}`), noContent, 204);

    const mail = await ctx.mailbox.waitFor(
      (m) => m.to.includes(email) && m.subject.includes('cover the feeds'),
    );
    const sitter = ctx.agent();
    expectShape(
      await sitter.get(`/api/cover-invites/preview?token=${tokenIn(mail.text)}`),
      invitePreview,
    );
    expectShape(
      await sitter
        .post('/api/cover-invites/accept')
        .send({ token: tokenIn(mail.text), account: { displayName: 'Sam', password: PASSWORD } }),
      acceptResponse,
    );
    const cover = covers.covers.find((c) => c.email === email)!;
    expectShape(await a.post(`${base()}/covers/${cover.id}/end`), coverListResponse);
  });

  it('members, their invites, and a cover’s invite sent again', async () => {
    const a = owner.agent;
    const email = `partner-${randomUUID().slice(0, 6)}@example.test`;
    expectShape(
      await a.post(`${base()}/members`).send({ email, role: 'owner' }),
      inviteSentResponse,
      202,
    );
    const members = expectShape(await a.get(`${base()}/members`), membersResponse);
    const invite = members.invites.find((i) => i.email === email)!;
    expect(invite.role).toBe('owner');
    expectShape(await a.post(`${base()}/invites/${invite.id}/resend`), inviteSentResponse, 202);
    expectShape(await a.delete(`${base()}/invites/${invite.id}`), noContent, 204);
    const created = expectShape(
      await a.post(`${base()}/covers`).send({
        email: `again-${randomUUID().slice(0, 6)}@example.test`,
        firstDay: day(3),
        lastDay: day(5),
      }),
      createdResponse,
      201,
    );
    expectShape(await a.post(`${base()}/covers/${created.id}/resend`), coverListResponse, 202);
  });

  it('room climate', async () => {
    const a = owner.agent;
    const c = `${base()}/climate`;
    await a
      .post(`${base()}/locations`)
      .send({ room: 'Climate room', rack: 'K', shelf: '1', position: '1' })
      .expect(201);
    const t = { minCelsius: 24, maxCelsius: 28, minHumidity: null, maxHumidity: 80 };
    expectShape(
      await a.put(`${c}/targets`).send({ room: 'Climate room', ...t }),
      roomTargetsResponse,
    );
    expectShape(await helper.agent.get(`${c}/today`), climateTodayResponse);
    expectShape(await a.get(`${c}/rooms`), climateRoomsResponse);
    expectShape(
      await a.post(`${c}/import`).send({
        room: 'Climate room',
        rows: [{ takenAt: '2026-10-25T00:30:00Z', celsius: 25, humidity: null }],
      }),
      loggerImportResponse,
    );
    expectShape(await a.get(`${c}/history?room=Climate%20room`), roomHistoryResponse);
    expectShape(await a.get(`${c}/animals/${femaleId}`), animalClimateResponse);
    expectShape(await a.patch('/api/auth/me').send({ temperatureUnit: 'C' }), meResponse);
  });

  it('a restore, the mailbox and the account', async () => {
    const source = await signUp(ctx);
    await createAnimal(ctx.database.db, source.collectionId, { name: 'Packed' });
    const backup = (await source.agent.get(`${base(source)}/backup`).expect(200)).body;
    const into = await signUp(ctx);
    expectShape(await into.agent.post(`${base(into)}/restore`).send(backup), restoreResponse, 201);
    expectShape(
      await into.agent.post('/api/collections').send({ name: 'Spare', timeZone: 'Europe/Berlin' }),
      collectionResponse,
      201,
    );
    expectShape(await ctx.agent().get('/api/dev/mail'), devMailResponse);
    expectShape(
      await ctx.agent().post('/api/auth/reset-request').send({ email: owner.email }),
      resetRequestedResponse,
      202,
    );
    expectShape(await owner.agent.get('/api/auth/me'), meResponse);
  });

  // Sales — listings, availability (L)
  it('stock for sale and the public availability list', async () => {
    const a = owner.agent;
    const sling = await createAnimal(ctx.database.db, owner.collectionId, {
      name: 'Shape sling',
      lifeStage: 'sling',
      clutch: 'Shape clutch',
    });
    const price = { priceMinor: 2500, currency: 'CAD', description: 'A sling' };
    expectShape(await a.put(`${base()}/listings/${femaleId}`).send(price), listingResponse);
    expectShape(
      await a.post(`${base()}/listings/bulk`).send({ clutch: 'Shape clutch', ...price }),
      bulkListingResponse,
    );
    const listed = expectShape(await a.get(`${base()}/listings`), listingsResponse);
    expect(listed.rows.map((r) => r.animalId).sort()).toEqual([femaleId, sling.id].sort());
    expectShape(await a.delete(`${base()}/listings/${sling.id}`), noContent, 204);
    expectShape(await a.get(`${base()}/availability`), availabilitySettings);
    const on = expectShape(
      await a
        .put(`${base()}/availability`)
        .send({ on: true, columns: ['species', 'count'], note: 'Hi' }),
      availabilitySettings,
    );
    expectShape(await a.post(`${base()}/availability/new-link`), availabilitySettings);
    const path = expectShape(await a.get(`${base()}/availability`), availabilitySettings).path!;
    expect(path).not.toBe(on.path);
    expectShape(await ctx.agent().get(`/api${path}`), publicAvailability);
  });
  // Sales — payments (the checkout answer is checked in payments.test.ts, with the fake).
  it('an invoice’s payments, before and after a manual payment', async () => {
    const db = ctx.database.db;
    const collectionId = owner.collectionId;
    const [buyer] = await db
      .insert(buyers)
      .values({ collectionId, name: 'Shape buyer' })
      .returning();
    const [sale] = await db
      .insert(sales)
      .values({ collectionId, buyerId: buyer!.id, reservedUntil: day(7) })
      .returning();
    const [invoice] = await db
      .insert(invoices)
      .values({
        collectionId,
        saleId: sale!.id,
        number: 'SHAPE-1',
        currency: 'CAD',
        taxRateBp: 0,
        taxRounding: 'per_invoice',
        subtotalMinor: 2500,
        taxMinor: 0,
        totalMinor: 2500,
        issuedOn: day(0),
      })
      .returning();
    const path = `${base()}/invoices/${invoice!.id}/payments`;
    expect(expectShape(await owner.agent.get(path), invoicePayments).cardPayments).toBe(false);
    const paid = expectShape(
      await owner.agent.post(path).send({ method: 'cash', amountMinor: 2500 }),
      invoicePayments,
      201,
    );
    expect(paid.invoice.status).toBe('paid');
  });
  // Sales — S: settings, buyers, a sale from reservation to shipped, its invoice.
  it('sales: settings, buyers, a sale, its invoice, shipping and the animal’s sale', async () => {
    const c = base();
    expectShape(await owner.agent.get(`${c}/sales-settings`), salesSettingsResponse);
    expectShape(
      await owner.agent.put(`${c}/sales-settings`).send({
        currency: 'CAD',
        taxRateBp: 1300,
        taxRounding: 'per_invoice',
        sellerDetails: 'Shapes Inverts',
        holdDays: 7,
        safeMinC: 5,
        safeMaxC: 30,
      }),
      salesSettingsResponse,
    );
    const buyer = expectShape(
      await owner.agent.post(`${c}/buyers`).send({ name: 'Shape Buyer', email: 'sb@example.test' }),
      buyerView,
      201,
    );
    expectShape(await owner.agent.get(`${c}/buyers`), buyersResponse);
    expectShape(await owner.agent.get(`${c}/buyers/${buyer.id}`), buyerView);
    expectShape(
      await owner.agent.patch(`${c}/buyers/${buyer.id}`).send({ name: 'Shape Buyer' }),
      buyerView,
    );
    const ids = await listedClutch(ctx.database.db, owner.collectionId, { count: 2 });
    expectShape(await owner.agent.get(`${c}/sales/available`), availableResponse);
    const sale = expectShape(
      await owner.agent.post(`${c}/sales`).send({ buyerId: buyer.id, animalIds: ids }),
      saleDetail,
      201,
    );
    expectShape(await owner.agent.get(`${c}/sales`), salesResponse);
    expectShape(
      await owner.agent.patch(`${c}/sales/${sale.id}`).send({ note: 'Shapes' }),
      saleDetail,
    );
    const invoice = expectShape(
      await owner.agent.post(`${c}/sales/${sale.id}/invoice`).send({ shippingMinor: 1000 }),
      invoiceView,
      201,
    );
    expectShape(await owner.agent.get(`${c}/invoices/${invoice.id}`), invoiceView);
    expectShape(await owner.agent.post(`${c}/invoices/${invoice.id}/email`), invoiceView);
    expectShape(
      await owner.agent.put(`${c}/sales/${sale.id}/shipping`).send({
        shipOn: '2026-12-08',
        shipRoute: 'Toronto to Montréal',
        forecastLowC: 10,
        forecastHighC: 20,
      }),
      saleDetail,
    );
    expectShape(
      await owner.agent.post(`${c}/sales/${sale.id}/shipping/confirm`).send({}),
      saleDetail,
    );
    await receivePayment(ctx.database.db, invoice.id, invoice.totalMinor, 'paid');
    expectShape(await owner.agent.post(`${c}/sales/${sale.id}/ship`), saleDetail);
    expectShape(await owner.agent.get(`${c}/sales/${sale.id}`), saleDetail);
    expectShape(await owner.agent.get(`${c}/animals/${ids[0]}/sale`), animalSaleResponse);
    const other = expectShape(
      await owner.agent.post(`${c}/buyers`).send({ name: 'Gone Buyer' }),
      buyerView,
      201,
    );
    expectShape(await owner.agent.delete(`${c}/buyers/${other.id}`), noContent, 204);
    const second = expectShape(
      await owner.agent.post(`${c}/sales`).send({
        buyerId: buyer.id,
        animalIds: await listedClutch(ctx.database.db, owner.collectionId, { count: 1 }),
      }),
      saleDetail,
      201,
    );
    const secondInvoice = expectShape(
      await owner.agent.post(`${c}/sales/${second.id}/invoice`).send({}),
      invoiceView,
      201,
    );
    expectShape(await owner.agent.post(`${c}/invoices/${secondInvoice.id}/cancel`), invoiceView);
    expectShape(await owner.agent.post(`${c}/sales/${second.id}/cancel`), saleDetail);
  });
});
