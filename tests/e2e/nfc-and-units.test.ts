// NFC tags and temperature units (issue 19, points 4 and 5). Desktop Chromium has no Web NFC,
// so a small fake `NDEFReader` is injected before the app loads: `write()` waits until the test
// brings a tag (or makes it fail) and records the message; `scan()` listens until aborted and
// the test presents tags to it as `reading` events with a "url" record, as a phone would.
import jsQR from 'jsqr';
import type { Page } from 'playwright-core';
import sharp from 'sharp';
import { describe, expect, it } from 'vitest';
import { labelUrl } from '#shared/domain/labels/label-payload';
import type { AnimalSummary } from '#shared/schemas/animals';
import type { RoundResponse } from '#shared/schemas/rounds';
import { expectAccessible, phonePage, screenshot, signInAsDemo, useE2e } from './support';

const env = useE2e();

interface FakeNfc {
  written: unknown[];
  pendingWrite: boolean;
  scanning: boolean;
  touchTag(): void;
  failWrite(name: string): void;
  present(url: string): void;
}
declare global {
  interface Window {
    fakeNfc: FakeNfc;
  }
}

/** Runs in the page before any of the app's scripts. */
function installFakeNfc() {
  let write: { resolve: () => void; reject: (e: unknown) => void; message: unknown } | null = null;
  let scanner: EventTarget | null = null;
  const fake = {
    written: [] as unknown[],
    get pendingWrite() {
      return write !== null;
    },
    get scanning() {
      return scanner !== null;
    },
    touchTag() {
      if (!write) throw new Error('no write is waiting for a tag');
      fake.written.push(JSON.parse(JSON.stringify(write.message)));
      write.resolve();
      write = null;
    },
    failWrite(name: string) {
      write?.reject(new DOMException('fake failure', name));
      write = null;
    },
    present(url: string) {
      if (!scanner) throw new Error('nobody is scanning');
      const event = new Event('reading') as Event & { serialNumber: string; message: unknown };
      event.serialNumber = '04:a2:5c:7e:11:90:80';
      const data = new TextEncoder().encode(url);
      event.message = {
        records: [{ recordType: 'url', encoding: null, data: new DataView(data.buffer) }],
      };
      scanner.dispatchEvent(event);
    },
  };
  class FakeNDEFReader extends EventTarget {
    write(message: unknown, options?: { signal?: AbortSignal }) {
      return new Promise<void>((resolve, reject) => {
        write = { resolve, reject, message };
        options?.signal?.addEventListener('abort', () => {
          write = null;
          reject(new DOMException('aborted', 'AbortError'));
        });
      });
    }
    scan(options?: { signal?: AbortSignal }) {
      scanner = this as EventTarget;
      options?.signal?.addEventListener('abort', () => {
        if (scanner === this) scanner = null;
      });
      return Promise.resolve();
    }
  }
  Object.assign(window, { NDEFReader: FakeNDEFReader, fakeNfc: fake });
}

async function api<T>(page: Page, url: string): Promise<T> {
  return page.evaluate(
    async (u) => (await fetch(u, { headers: { 'X-Rackside-Client': '1' } })).json(),
    url,
  ) as Promise<T>;
}

/** The QR drawn on the labels page, read back from the screen. */
async function decodeQrOnScreen(page: Page, code: string): Promise<string | null> {
  const png = await page.getByRole('img', { name: `QR code for ${code}` }).screenshot();
  // The symbol is drawn without its quiet zone (the label's margin): add one in white.
  const { data, info } = await sharp(png)
    .extend({ top: 40, bottom: 40, left: 40, right: 40, background: '#ffffff' })
    .ensureAlpha()
    .raw()
    .toBuffer({ resolveWithObject: true });
  return jsQR(new Uint8ClampedArray(data), info.width, info.height)?.data ?? null;
}

/** Screenshots in every theme, with axe-core (contrast included) in each where `check`. */
async function eachTheme(page: Page, name: string, check = true) {
  for (const theme of ['light', 'dark', 'night'] as const) {
    await page.evaluate((t) => (document.documentElement.dataset.theme = t), theme);
    if (check) await expectAccessible(page, `${name} (${theme})`, theme);
    await screenshot(page, `${name}-${theme}`);
  }
}

describe('NFC tags and temperature units', () => {
  it('writes a label’s URL to a tag, reads tags in walk mode, and keeps °F', async () => {
    const { context, page, consoleErrors } = await phonePage(env.browser);
    await context.addInitScript(installFakeNfc);
    await signInAsDemo(page, env.server.baseUrl, 'owner@northlight.test');
    const me = await api<{ memberships: { collectionId: string; labelTag: string }[] }>(
      page,
      '/api/auth/me',
    );
    const { collectionId, labelTag } = me.memberships[0]!;
    const [{ animals }, round] = await Promise.all([
      api<{ animals: AnimalSummary[] }>(page, `/api/collections/${collectionId}/animals`),
      api<RoundResponse>(page, `/api/collections/${collectionId}/rounds/today`),
    ]);
    const item = round.items.find((i) => i.tasks.some((t) => t.kind === 'feed'))!;
    const animal = animals.find((a) => a.id === item.animal.id)!;
    const expectedUrl = labelUrl(env.server.baseUrl, labelTag, animal.labelCode);

    // (d) Temperatures in °F, chosen once, still °F after a reload.
    await page.goto(`${env.server.baseUrl}/settings`);
    const temperatures = page.getByRole('group', { name: 'Temperatures in' });
    expect(await temperatures.getByLabel('Celsius').isChecked()).toBe(true);
    await temperatures.getByText('Fahrenheit').click();
    // The leg-span choice is kept the same way and apart from it.
    const legSpans = page.getByRole('group', { name: 'Leg spans in' });
    await legSpans.getByText('Inches').click();
    await page.reload();
    await expect.poll(() => temperatures.getByLabel('Fahrenheit').isChecked()).toBe(true);
    expect(await temperatures.getByLabel('Celsius').isChecked()).toBe(false);
    expect(await legSpans.getByLabel('Inches').isChecked()).toBe(true);
    expect(
      await page.evaluate(() => [
        localStorage.getItem('rackside.temperature-unit'),
        localStorage.getItem('rackside.size-unit'),
      ]),
    ).toEqual(['F', 'in']);
    await expectAccessible(page, 'settings with units');
    await temperatures.scrollIntoViewIfNeeded();
    await screenshot(page, 'units-01-temperature-setting');

    // (a) Write from the animal page: waiting, cancelled, refused, written.
    await page.goto(`${env.server.baseUrl}/animals/${animal.id}`);
    const labelPanel = page.getByRole('region', { name: `Label ${animal.labelCode}` });
    await labelPanel.getByRole('button', { name: 'Write to an NFC tag' }).click();
    await labelPanel.getByText('Hold the tag to the back of the phone').waitFor();
    await labelPanel.scrollIntoViewIfNeeded();
    await eachTheme(page, 'nfc-01-write-waiting');
    await labelPanel.getByRole('button', { name: 'Cancel' }).click();
    await labelPanel.getByText('Cancelled.').waitFor();
    expect(await page.evaluate(() => window.fakeNfc.pendingWrite)).toBe(false);

    await labelPanel.getByRole('button', { name: 'Write to an NFC tag' }).click();
    await expect.poll(() => page.evaluate(() => window.fakeNfc.pendingWrite)).toBe(true);
    await page.evaluate(() => window.fakeNfc.failWrite('NotAllowedError'));
    await labelPanel.getByText('The tag was not written.').waitFor();
    expect(await labelPanel.innerText()).toMatch(/site settings/);

    await labelPanel.getByRole('button', { name: 'Try again' }).click();
    await expect.poll(() => page.evaluate(() => window.fakeNfc.pendingWrite)).toBe(true);
    await page.evaluate(() => window.fakeNfc.touchTag());
    await labelPanel.getByText(`Tag written for ${animal.name} (${animal.labelCode}).`).waitFor();
    await screenshot(page, 'nfc-02-written');
    expect(await page.evaluate(() => window.fakeNfc.written)).toEqual([
      { records: [{ recordType: 'url', data: expectedUrl }] },
    ]);

    // The label printed for the same animal: its QR holds the very URL the tag got.
    await labelPanel.getByRole('link', { name: 'Print this label' }).click();
    await page.getByText('70 × 36 mm', { exact: true }).click();
    await page.getByLabel('Show at true size (scroll sideways)').check();
    expect(await decodeQrOnScreen(page, animal.labelCode)).toBe(expectedUrl);
    const nfcTags = page.getByRole('region', { name: 'NFC tags' });
    await nfcTags.getByRole('button', { name: 'Write to an NFC tag' }).click();
    await nfcTags.getByText('Hold the tag to the back of the phone').waitFor();
    await page.evaluate(() => window.fakeNfc.touchTag());
    await nfcTags.getByText(`Tag written for ${animal.name} (${animal.labelCode}).`).waitFor();
    expect(await page.evaluate(() => window.fakeNfc.written.at(-1))).toEqual({
      records: [{ recordType: 'url', data: expectedUrl }],
    });
    await expectAccessible(page, 'labels with NFC');
    await nfcTags.scrollIntoViewIfNeeded();
    await screenshot(page, 'nfc-03-labels-page');
    await page.setViewportSize({ width: 1280, height: 800 });
    await nfcTags.scrollIntoViewIfNeeded();
    await screenshot(page, 'nfc-03-labels-page-wide');
    await page.setViewportSize({ width: 360, height: 740 });

    // (b) Walk mode: a tag opens the animal like its QR; after one tap the phone listens for
    // the next tag; a tag from elsewhere gets words of its own.
    await page.getByRole('link', { name: 'Scan' }).click();
    await page.getByRole('button', { name: 'Read NFC tags' }).click();
    await page.getByText('Reading NFC tags · hold a tag to the back of the phone').waitFor();
    await page.evaluate((url) => window.fakeNfc.present(url), expectedUrl.toLowerCase());
    const scanned = page.getByRole('region', { name: 'Scanned label' });
    const card = scanned.getByRole('article', { name: `${animal.name}, ${animal.labelCode}` });
    await card.waitFor();
    // The reading box is checked by axe-core with the foreign tag's message below.
    await eachTheme(page, 'nfc-04-tag-opened', false);
    await card.getByRole('button', { name: 'Ate', exact: true }).click();
    await scanned.waitFor({ state: 'detached' });
    expect(await page.evaluate(() => window.fakeNfc.scanning)).toBe(true);

    await page.evaluate(() => window.fakeNfc.present('https://example.com/menu'));
    await expect.poll(() => scanned.innerText()).toContain('That tag is not a Rackside tag.');
    await expectAccessible(page, 'scan with a foreign tag');
    await screenshot(page, 'nfc-05-foreign-tag');
    await page.getByRole('button', { name: 'Stop reading NFC' }).click();
    expect(await page.evaluate(() => window.fakeNfc.scanning)).toBe(false);
    expect(consoleErrors.filter((e) => !/camera|NotFoundError|Requested device/i.test(e))).toEqual(
      [],
    );
    await context.close();
  });

  it('(c) draws no NFC control where the browser has no Web NFC, and Scan still has the camera', async () => {
    const { context, page } = await phonePage(env.browser);
    await signInAsDemo(page, env.server.baseUrl, 'owner@northlight.test');
    expect(await page.evaluate(() => 'NDEFReader' in window)).toBe(false);
    await page.getByRole('link', { name: 'Scan' }).click();
    await page.getByLabel('Type the code').waitFor();
    // The QR path as before: the live camera's host (html5-qrcode draws into it; headless
    // Chromium has no camera, so its notice may show instead) and the photo fallback.
    expect(await page.locator('[id^="camera-"]').count()).toBe(1);
    expect(await page.getByText('Scan a photo of a label').count()).toBe(1);
    expect(await page.getByRole('button', { name: 'Read NFC tags' }).count()).toBe(0);
    const me = await api<{ memberships: { collectionId: string }[] }>(page, '/api/auth/me');
    const round = await api<RoundResponse>(
      page,
      `/api/collections/${me.memberships[0]!.collectionId}/rounds/today`,
    );
    await page.goto(`${env.server.baseUrl}/animals/${round.items[0]!.animal.id}`);
    await page.getByRole('link', { name: 'Print this label' }).waitFor();
    expect(await page.getByRole('button', { name: 'Write to an NFC tag' }).count()).toBe(0);
    await page.getByRole('link', { name: 'Print this label' }).click();
    await page.getByRole('button', { name: 'Print labels' }).waitFor();
    expect(await page.getByRole('region', { name: 'NFC tags' }).count()).toBe(0);
    expect(await page.getByRole('button', { name: 'Write to an NFC tag' }).count()).toBe(0);
    await context.close();
  });
});
