// Issue 5's end-to-end checks: print 24 labels from the browser, read every QR back from the
// rasterised PDF, then walk a rack with the phone's camera (Chromium's fake camera fed the
// printed label) recording an outcome per scan with no network.
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { and, eq, gte } from 'drizzle-orm';
import type { Page } from 'playwright-core';
import { afterAll, describe, expect, it } from 'vitest';
import { labelContent } from '#shared/domain/labels/label-content';
import { LABEL_FIELDS } from '#shared/domain/labels/label-layout';
import { labelUrl } from '#shared/domain/labels/label-payload';
import { makeQrSymbol } from '#shared/domain/labels/qr-symbol';
import { LABEL_SIZES, placeLabels, sheetLayout } from '#shared/domain/labels/sheet-layout';
import type { AnimalSummary } from '#shared/schemas/animals';
import type { RoundResponse } from '#shared/schemas/rounds';
import { events } from '../../server/db/schema/animals';
import { cutNetwork, launchWithFakeCamera, restoreNetwork, underServiceWorker } from '../chromium';
import { writeLabelVideo } from '../support/fake-camera';
import {
  decodeQrIn,
  greyRegion,
  markedColumns,
  measureQrIn,
  rasterisePdf,
  type GreyPage,
} from '../support/label-raster';
import { expectAccessible, phonePage, screenshot, signInAsDemo, useE2e } from './support';

const env = useE2e();
const CLUTCH = 'H. formosus sac 1';
const SIZE = LABEL_SIZES['wide-70x36'];
const DPI = 200;
const tmp = fs.mkdtempSync(path.join(os.tmpdir(), 'rackside-labels-'));
afterAll(() => fs.rmSync(tmp, { recursive: true, force: true }));

async function api<T>(page: Page, url: string): Promise<T> {
  return page.evaluate(
    async (u) => (await fetch(u, { headers: { 'X-Rackside-Client': '1' } })).json(),
    url,
  ) as Promise<T>;
}

/** How many collections' animal lists this phone has kept in IndexedDB. */
function storedDirectories(page: Page): Promise<number> {
  return page.evaluate(
    () =>
      new Promise<number>((resolve, reject) => {
        const open = indexedDB.open('rackside');
        open.onerror = () => reject(open.error);
        open.onsuccess = () => {
          const count = open.result.transaction('directory').objectStore('directory').count();
          count.onsuccess = () => {
            open.result.close();
            resolve(count.result);
          };
        };
      }),
  );
}

interface Printed {
  pages: GreyPage[];
  tag: string;
  animals: AnimalSummary[];
  collectionId: string;
}
let printed: Printed | null = null;

/** Where one printed label's QR (with its quiet zone) is on the rasterised sheets. */
function quietBoxOf(p: Printed, index: number, start: number) {
  const sheet = sheetLayout('letter', SIZE);
  const place = placeLabels(p.animals.length, start, sheet.perSheet)[index]!;
  const cell = sheet.cells[place.cell]!;
  const { layout } = labelContent(p.animals[index]!, p.tag, env.server.baseUrl, SIZE, LABEL_FIELDS);
  return {
    page: p.pages[place.sheet]!,
    box: { ...layout.quiet, x: cell.x + layout.quiet.x, y: cell.y + layout.quiet.y },
    cell,
  };
}

describe('label sheets printed from the browser', () => {
  it('prints 24 clutch labels whose QR codes all decode to the right animals, at true size', async () => {
    const { page, consoleErrors } = await phonePage(env.browser);
    await signInAsDemo(page, env.server.baseUrl, 'owner@northlight.test');
    const me = await api<{ memberships: { collectionId: string; labelTag: string }[] }>(
      page,
      '/api/auth/me',
    );
    const { collectionId, labelTag: tag } = me.memberships[0]!;
    const all = await api<{ animals: AnimalSummary[] }>(
      page,
      `/api/collections/${collectionId}/animals`,
    );

    await page.getByRole('link', { name: 'Animals' }).click();
    await page.getByText('More', { exact: true }).click();
    await page.getByRole('link', { name: 'Print labels' }).click();
    await page.getByLabel('Clutch').selectOption(CLUTCH);
    await page.getByRole('button', { name: 'Choose all 24 shown' }).click();
    await page.getByText('Letter', { exact: true }).click();
    await page.getByText('70 × 36 mm', { exact: true }).click();
    await page.getByLabel('Start at position').fill('2');
    // 12 a sheet; starting at position 2 puts 11 on the first sheet, 12 on the second, 1 on a third.
    await expect
      .poll(() => page.getByText(/24 labels on 3 sheets of Letter/).innerText())
      .toMatch(/QR 25 mm, squares 1\.00 mm/);
    await expectAccessible(page, 'labels');
    await screenshot(page, 'labels-01-options');
    await page.getByRole('region', { name: 'Label preview' }).scrollIntoViewIfNeeded();
    await screenshot(page, 'labels-02-preview');

    const pdf = await page.pdf({ preferCSSPageSize: true });
    const pages = rasterisePdf(pdf, DPI);
    expect(pages).toHaveLength(3);
    // Letter at 200 dpi: 8.5 in × 200 = 1700 px, 11 in × 200 = 2200 px.
    expect([pages[0]!.width, pages[0]!.height]).toEqual([1700, 2200]);

    const animals = all.animals.filter((a) => a.clutch === CLUTCH);
    expect(animals).toHaveLength(24);
    printed = { pages, tag, animals, collectionId };
    const decoded = animals.map((_, i) => {
      const { page: sheet, box } = quietBoxOf(printed!, i, 2);
      return decodeQrIn(sheet, box);
    });
    expect(decoded).toEqual(animals.map((a) => labelUrl(env.server.baseUrl, tag, a.labelCode)));

    // ISO/IEC 18004 symbols are square; this one is laid out at 25 mm and must print at 25 ± 0.5 mm,
    // measured from its finder patterns.
    const first = quietBoxOf(printed, 0, 2);
    const size = measureQrIn(first.page, first.box)!;
    expect(Math.abs(size.widthMm - 25)).toBeLessThanOrEqual(0.5);
    expect(Math.abs(size.heightMm - 25)).toBeLessThanOrEqual(0.5);
    // The first row's cut line is printed above it as fully as below it (it was once clipped):
    // the dashed line runs 0.5 mm outside the label, so look in the 1 mm band beyond each edge.
    const { cell } = first;
    const above = markedColumns(first.page, {
      x: cell.x,
      y: cell.y - 1,
      widthMm: SIZE.widthMm,
      heightMm: 1,
    });
    const below = markedColumns(first.page, {
      x: cell.x,
      y: cell.y + SIZE.heightMm,
      widthMm: SIZE.widthMm,
      heightMm: 1,
    });
    expect(below).toBeGreaterThan(0.3 * (SIZE.widthMm / 25.4) * DPI);
    expect(Math.abs(above - below)).toBeLessThanOrEqual(0.05 * below);
    // Position 1 was used before: nothing is printed there.
    const used = sheetLayout('letter', SIZE).cells[0]!;
    expect(
      decodeQrIn(pages[0]!, {
        x: used.x,
        y: used.y,
        widthMm: SIZE.widthMm,
        heightMm: SIZE.heightMm,
      }),
    ).toBeNull();

    // A photo of one label, as html5-qrcode's file scan gets it from a phone's camera app.
    await page.getByLabel('Show at true size (scroll sideways)').check();
    const photographed = animals[3]!;
    const label = page.locator(`[data-animal-id="${photographed.id}"]`).first();
    // Clear of the fixed tab bar, as a photo of a label has nothing in front of it.
    await label.evaluate((el) => el.scrollIntoView({ block: 'center' }));
    const photo = await label.screenshot();
    await page.getByRole('link', { name: 'Scan' }).click();
    // This browser has no camera at all: the screen says so and offers the other ways in.
    await expect
      .poll(() => page.getByText('No camera was found.').count(), { timeout: 10_000 })
      .toBe(1);
    await expectAccessible(page, 'scan without a camera');
    await screenshot(page, 'scan-00-no-camera');
    await page
      .getByLabel('Scan a photo of a label')
      .setInputFiles({ name: 'label.png', mimeType: 'image/png', buffer: photo });
    // Decoding shares the CPU with the other test files in CI (it once took over 10 s there).
    await page
      .getByRole('region', { name: 'Scanned label' })
      .getByRole('article', { name: `${photographed.name}, ${photographed.labelCode}` })
      .waitFor({ timeout: 30_000 });

    // A clean label that html5-qrcode's decoder cannot read (second-reader.test.ts) is read by
    // the second one: it is another collection's, and the screen says so.
    await page.getByRole('button', { name: 'Scan next' }).click();
    const missed = makeQrSymbol(labelUrl('https://rackside.example', 'PCVZ', 'NL-9PP'));
    const png = await page.evaluate(
      ({ size, modules }) => {
        const scale = 6;
        const canvas = document.createElement('canvas');
        canvas.width = canvas.height = (size + 8) * scale;
        const context = canvas.getContext('2d')!;
        context.fillStyle = '#fff';
        context.fillRect(0, 0, canvas.width, canvas.height);
        context.fillStyle = '#000';
        modules.forEach((dark, i) => {
          if (dark)
            context.fillRect(
              (4 + (i % size)) * scale,
              (4 + Math.floor(i / size)) * scale,
              scale,
              scale,
            );
        });
        return canvas.toDataURL('image/png').split(',')[1]!;
      },
      { size: missed.size, modules: Array.from(missed.modules) },
    );
    await page.getByLabel('Scan a photo of a label').setInputFiles({
      name: 'other.png',
      mimeType: 'image/png',
      buffer: Buffer.from(png, 'base64'),
    });
    await page
      .getByRole('region', { name: 'Scanned label' })
      .getByText('This label belongs to another collection.')
      .waitFor({ timeout: 30_000 });
    expect(consoleErrors).toEqual([]);
  });
});

describe('walk mode with the camera', () => {
  it('scans a printed label with no signal, opens the item, records one tap and returns to the camera', async () => {
    expect(printed, 'the print test runs first').not.toBeNull();
    const p = printed!;
    const { page: probe } = await phonePage(env.browser);
    await signInAsDemo(probe, env.server.baseUrl, 'owner@northlight.test');
    const round = await api<RoundResponse>(
      probe,
      `/api/collections/${p.collectionId}/rounds/today`,
    );
    const index = p.animals.findIndex((a) =>
      round.items.some((i) => i.animal.id === a.id && i.tasks.some((t) => t.kind === 'feed')),
    );
    expect(index).toBeGreaterThanOrEqual(0);
    const animal = p.animals[index]!;
    const notDue = p.animals.find((a) => !round.items.some((i) => i.animal.id === a.id)) ?? null;
    await probe.context().close();

    // The camera sees the printed label: a crop of the rasterised sheet with the QR in the
    // middle of the frame, as a keeper aims it, and the label's text beside it.
    const { page: sheet, box, cell } = quietBoxOf(p, index, 2);
    const video = path.join(tmp, 'label.y4m');
    const centre = box.x + box.widthMm / 2;
    writeLabelVideo(
      video,
      greyRegion(sheet, {
        x: centre - 30,
        y: cell.y - 2,
        widthMm: 60,
        heightMm: SIZE.heightMm + 4,
      }),
    );
    const browser = await launchWithFakeCamera(video);
    try {
      const { context, page, consoleErrors } = await phonePage(browser);
      await context.grantPermissions(['camera'], { origin: env.server.baseUrl });
      await signInAsDemo(page, env.server.baseUrl, 'owner@northlight.test');
      await underServiceWorker(page);
      await page.getByRole('article').first().waitFor();
      // With a signal the phone keeps a copy of the animal list (fetched just after the first screen).
      await expect.poll(() => storedDirectories(page), { timeout: 15_000 }).toBe(1);
      const started = new Date();

      await cutNetwork(context);
      await page.getByRole('link', { name: 'Scan' }).click();
      const scanned = page.getByRole('region', { name: 'Scanned label' });
      const card = scanned.getByRole('article', { name: `${animal.name}, ${animal.labelCode}` });
      // Decoding camera frames shares two cores with the other test files in CI: one run in
      // several took over 20 s to find the label, so the wait is generous.
      await card.waitFor({ timeout: 45_000 });
      await expectAccessible(page, 'scan result');
      await screenshot(page, 'scan-01-item-open');
      await card.getByRole('button', { name: 'Ate', exact: true }).click();

      // One tap, then straight back to the camera; the label still in view does not reopen.
      await scanned.waitFor({ state: 'detached' });
      await expect
        .poll(() => page.getByRole('status').filter({ hasText: 'Ate ·' }).innerText())
        .toContain(`${animal.name} (${animal.labelCode})`);
      await page.waitForTimeout(2500);
      expect(await scanned.count()).toBe(0);
      await expect
        .poll(() => page.getByText(/1 waiting/).count(), { timeout: 10_000 })
        .toBeGreaterThan(0);
      await screenshot(page, 'scan-02-back-to-camera');

      // A typed code, in lower case with stray spaces, for an animal not due today.
      if (notDue) {
        await page
          .getByLabel('Type the code')
          .fill(` ${notDue.labelCode.toLowerCase().replace('-', ' - ')} `);
        await page.getByRole('button', { name: 'Open' }).click();
        await expect
          .poll(() => scanned.innerText())
          .toMatch(new RegExp(`${notDue.name} is not due today — record anyway\\?`));
        expect(await scanned.getByRole('button', { name: 'Ate', exact: true }).count()).toBe(0);
        await scanned.getByRole('button', { name: 'Record anyway' }).click();
        await expect
          .poll(() => scanned.getByRole('button', { name: 'Watered', exact: true }).count())
          .toBe(1);
        await screenshot(page, 'scan-03-not-due');
        await scanned.getByRole('button', { name: 'Scan next' }).click();
      }
      for (const [typed, message] of [
        ['nl-7ko', 'That is not a label code.'],
        ['https://example.com/menu', 'That QR code is not a Rackside label.'],
        ['NL-2222', 'No animal here has the code NL-2222.'],
      ] as const) {
        // The box empties when the scanner is back to waiting (an effect after "Scan next").
        await expect.poll(() => page.getByLabel('Type the code').inputValue()).toBe('');
        await page.getByLabel('Type the code').fill(typed);
        await page.getByRole('button', { name: 'Open' }).click();
        await expect.poll(() => scanned.innerText()).toContain(message);
        await scanned.getByRole('button', { name: 'Scan next' }).click();
      }

      await restoreNetwork(context);
      await expect
        .poll(
          async () => {
            const saved = await env.server.ctx.database.db
              .select({ kind: events.kind })
              .from(events)
              .where(and(eq(events.animalId, animal.id), gte(events.serverReceivedAt, started)));
            return saved.map((e) => e.kind);
          },
          { timeout: 20_000 },
        )
        .toEqual(['ate']);

      // What a phone's own camera app opens: the label URL, upper case as printed.
      await page.goto(
        labelUrl(env.server.baseUrl, p.tag, animal.labelCode).replace(
          /^HTTP:\/\/127\.0\.0\.1/,
          'http://127.0.0.1',
        ),
      );
      await page.getByRole('article', { name: `${animal.name}, ${animal.labelCode}` }).waitFor();
      await expect
        .poll(() =>
          page.getByRole('article', { name: `${animal.name}, ${animal.labelCode}` }).innerText(),
        )
        .toMatch(/✓ Ate/);
      await screenshot(page, 'scan-04-label-link');
      expect(
        consoleErrors.filter((e) => !/ERR_INTERNET_DISCONNECTED|Failed to load resource/.test(e)),
      ).toEqual([]);
    } finally {
      await browser.close();
    }
  });
});
