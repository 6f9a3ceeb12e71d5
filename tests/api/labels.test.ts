import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { isLabelCode } from '#shared/domain/label-codes';
import { labelContent } from '#shared/domain/labels/label-content';
import { LABEL_FIELDS } from '#shared/domain/labels/label-layout';
import { isLabelTag, labelUrl } from '#shared/domain/labels/label-payload';
import { LABEL_SIZES, placeLabels, sheetLayout } from '#shared/domain/labels/sheet-layout';
import { addMember, createAnimal, signUp, type SignedUp } from '../factories';
import { createTestContext, type TestContext } from '../setup/test-app';
import { darkPixelsAround, decodeQrIn, measureQrIn, rasterisePdf } from '../support/label-raster';

let ctx: TestContext;
let owner: SignedUp;
let other: SignedUp;
let helper: SignedUp;
let tag: string;
const animalIds: string[] = [];
const ORIGIN = 'http://localhost:3000';

const pdfUrl = () => `/api/collections/${owner.collectionId}/labels/pdf`;
const body = (overrides: Record<string, unknown> = {}) => ({
  animalIds,
  sheet: 'a4',
  size: LABEL_SIZES['wide-70x36'],
  fields: [...LABEL_FIELDS],
  start: 1,
  origin: ORIGIN,
  ...overrides,
});

beforeAll(async () => {
  ctx = await createTestContext();
  owner = await signUp(ctx);
  other = await signUp(ctx);
  helper = await signUp(ctx);
  await addMember(ctx.database.db, {
    collectionId: owner.collectionId,
    userId: helper.userId,
    role: 'helper',
    startsAt: new Date(Date.now() - 3_600_000),
    endsAt: new Date(Date.now() + 86_400_000),
  });
  const me = await owner.agent.get('/api/auth/me').expect(200);
  tag = me.body.memberships[0].labelTag;
  for (let i = 0; i < 14; i++) {
    const a = await createAnimal(ctx.database.db, owner.collectionId, {
      name: `Sling ${i + 1}`,
      cautions: i % 3 === 0 ? ['urticating_hairs'] : [],
    });
    animalIds.push(a.id);
  }
});
afterAll(async () => {
  await ctx.close();
});

describe('collection label tags', () => {
  it('gives every collection its own tag, shown with the membership', async () => {
    const mine = (await other.agent.get('/api/auth/me').expect(200)).body.memberships[0].labelTag;
    expect(isLabelTag(tag)).toBe(true);
    expect(isLabelTag(mine)).toBe(true);
    expect(mine).not.toBe(tag);
  });
});

describe('POST /collections/:id/labels/pdf', () => {
  it('prints every chosen animal on A4 pages whose QR codes decode to their label URLs', async () => {
    const res = await owner.agent
      .post(pdfUrl())
      .send(body({ start: 5 }))
      .responseType('blob')
      .expect(200);
    expect(res.headers['content-type']).toBe('application/pdf');
    const pdf = res.body as Buffer;
    expect(pdf.subarray(0, 5).toString()).toBe('%PDF-');

    const sheet = sheetLayout('a4', LABEL_SIZES['wide-70x36']);
    expect(sheet.perSheet).toBe(12);
    // Start at cell 5: 8 labels on page 1, 6 on page 2.
    const pages = rasterisePdf(pdf, 200);
    expect(pages).toHaveLength(2);
    // A4 at 200 dpi is 1654 × 2339 px (210 / 25.4 × 200, 297 / 25.4 × 200).
    expect([pages[0]!.width, pages[0]!.height]).toEqual([1654, 2339]);

    const rows = await owner.agent
      .get(`/api/collections/${owner.collectionId}/animals`)
      .expect(200);
    const codeOf = new Map<string, string>(
      rows.body.animals.map((a: { id: string; labelCode: string }) => [a.id, a.labelCode]),
    );
    const places = placeLabels(animalIds.length, 5, sheet.perSheet);
    animalIds.forEach((id, i) => {
      const place = places[i]!;
      const cell = sheet.cells[place.cell]!;
      const content = labelContent(
        { ...rows.body.animals.find((a: { id: string }) => a.id === id) },
        tag,
        ORIGIN,
        sheet.label,
        LABEL_FIELDS,
      );
      const quiet = {
        ...content.layout.quiet,
        x: cell.x + content.layout.quiet.x,
        y: cell.y + content.layout.quiet.y,
      };
      expect(decodeQrIn(pages[place.sheet]!, quiet)).toBe(labelUrl(ORIGIN, tag, codeOf.get(id)!));
      // The symbol is drawn at the size the layout says, measured from its finder patterns:
      // 25 mm ± 0.5 (one pixel is 0.127 mm), and modules × module size agrees.
      const printed = measureQrIn(pages[place.sheet]!, quiet)!;
      expect(printed.modules).toBe(content.symbol.size);
      expect(Math.abs(printed.widthMm - 25)).toBeLessThanOrEqual(0.5);
      expect(Math.abs(printed.heightMm - 25)).toBeLessThanOrEqual(0.5);
      expect(Math.abs(printed.moduleMm * printed.modules - printed.widthMm)).toBeLessThanOrEqual(
        0.5,
      );
      // Nothing else is printed on the quiet zone: not the code's first glyph, not a cut line.
      const symbol = {
        ...content.layout.symbol,
        x: cell.x + content.layout.symbol.x,
        y: cell.y + content.layout.symbol.y,
      };
      expect(darkPixelsAround(pages[place.sheet]!, quiet, symbol)).toBe(0);
    });
    // The used cells 1–4 on page 1 are left blank.
    const firstCell = sheet.cells[0]!;
    expect(
      decodeQrIn(pages[0]!, { x: firstCell.x, y: firstCell.y, widthMm: 36, heightMm: 36 }),
    ).toBeNull();
  });

  it('prints 19 mm squares with the short QR that the Scan screen reads', async () => {
    const res = await owner.agent
      .post(pdfUrl())
      .send(body({ size: LABEL_SIZES['square-19'], animalIds: animalIds.slice(0, 3) }))
      .responseType('blob')
      .expect(200);
    const pages = rasterisePdf(res.body as Buffer, 400);
    const sheet = sheetLayout('a4', LABEL_SIZES['square-19']);
    const codes = new Map<string, string>(
      (
        await owner.agent.get(`/api/collections/${owner.collectionId}/animals`).expect(200)
      ).body.animals.map((a: { id: string; labelCode: string }) => [a.id, a.labelCode]),
    );
    animalIds.slice(0, 3).forEach((id, i) => {
      const cell = sheet.cells[i]!;
      const content = labelContent(
        {
          id,
          labelCode: codes.get(id)!,
          name: '',
          scientificName: '',
          lifeStage: 'adult',
          sex: 'unknown',
          cautions: [],
        },
        tag,
        ORIGIN,
        sheet.label,
        LABEL_FIELDS,
      );
      expect(content.short).toBe(true);
      const quiet = {
        ...content.layout.quiet,
        x: cell.x + content.layout.quiet.x,
        y: cell.y + content.layout.quiet.y,
      };
      expect(decodeQrIn(pages[0]!, quiet)).toBe(`L/${tag}/${codes.get(id)}`);
    });
  });

  it('refuses labels whose QR squares would be under 0.5 mm, saying why', async () => {
    const res = await owner.agent
      .post(pdfUrl())
      .send(body({ size: { widthMm: 15, heightMm: 15 } }))
      .expect(422);
    expect(res.body.error.code).toBe('label_too_small');
    expect(res.body.error.message).toMatch(/under the 0\.5 mm/);
  });

  it('answers bad input with 422 and a readable message, never a 500', async () => {
    const cases: [Record<string, unknown>, RegExp][] = [
      [{ sheet: 'a3' }, /Choose A4 or Letter/],
      [{ size: { widthMm: 5, heightMm: 25 } }, /at least 15 mm/],
      [{ start: 0 }, /Start at position 1/],
      [{ start: 13 }, /12 positions/],
      [{ animalIds: [] }, /at least one animal/],
      [{ animalIds: Array.from({ length: 1001 }, () => animalIds[0]) }, /At most 1000/],
      [{ origin: 'ftp://example.org' }, /http:\/\/ or https:\/\//],
      [{ fields: ['price'] }, /./],
    ];
    for (const [change, message] of cases) {
      const res = await owner.agent.post(pdfUrl()).send(body(change));
      expect(res.status, JSON.stringify(change)).toBe(422);
      expect(res.body.error.message).toMatch(message);
    }
  });

  it('prints only this collection’s animals, and only for keepers', async () => {
    const foreign = await createAnimal(ctx.database.db, other.collectionId);
    expect(
      (await owner.agent.post(pdfUrl()).send(body({ animalIds: [animalIds[0], foreign.id] })))
        .status,
    ).toBe(404);
    // Someone outside the collection learns nothing, not even that it exists.
    expect((await other.agent.post(pdfUrl()).send(body())).status).toBe(404);
    expect((await helper.agent.post(pdfUrl()).send(body())).status).toBe(403);
    expect((await ctx.agent().post(pdfUrl()).send(body())).status).toBe(401);
  });
});

describe('POST /collections/:id/animals/:animalId/relabel', () => {
  it('gives a new code with the same prefix; the old one is gone', async () => {
    const a = await createAnimal(ctx.database.db, owner.collectionId, { labelCode: 'NL-7K3' });
    const res = await owner.agent
      .post(`/api/collections/${owner.collectionId}/animals/${a.id}/relabel`)
      .expect(200);
    expect(res.body.labelCode).not.toBe('NL-7K3');
    expect(res.body.labelCode).toMatch(/^NL-/);
    expect(isLabelCode(res.body.labelCode)).toBe(true);
    const list = await owner.agent
      .get(`/api/collections/${owner.collectionId}/animals`)
      .expect(200);
    const codes = list.body.animals.map((x: { labelCode: string }) => x.labelCode);
    expect(codes).toContain(res.body.labelCode);
    expect(codes).not.toContain('NL-7K3');
  });

  it('is refused for helpers, other collections and unknown animals', async () => {
    const foreign = await createAnimal(ctx.database.db, other.collectionId);
    const url = (id: string) => `/api/collections/${owner.collectionId}/animals/${id}/relabel`;
    expect((await helper.agent.post(url(animalIds[0]!))).status).toBe(403);
    expect((await owner.agent.post(url(foreign.id))).status).toBe(404);
    expect((await owner.agent.post(url('not-a-uuid'))).status).toBe(422);
  });
});
