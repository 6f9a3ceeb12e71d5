// The animals page, label sizes, the breeding register and a new collection's first run, at
// 360 px (and the animals page at 1280 px), with axe-core in the light, dark and night themes.
import fs from 'node:fs';
import type { Page } from 'playwright-core';
import { describe, expect, it } from 'vitest';
import { expectAccessible, phonePage, screenshot, signInAsDemo, useE2e } from './support';

const env = useE2e();

async function inEveryTheme(page: Page, label: string) {
  for (const theme of ['light', 'dark', 'night'] as const) {
    await page.evaluate((t) => (document.documentElement.dataset.theme = t), theme);
    await expectAccessible(page, `${label} (${theme})`, theme);
    await screenshot(page, `polish-${label.replace(/\W+/g, '-')}-${theme}`);
  }
}

/** Whether an animal card covers the point `y` px down the viewport (no blank band there). */
const rowAt = (page: Page, y: number) =>
  page.evaluate((at) => {
    const items = [...document.querySelectorAll('ul[aria-label="Animals"] > li')];
    return items.some((li) => {
      const r = li.getBoundingClientRect();
      return r.top <= at && r.bottom >= at;
    });
  }, y);

describe('the animals page at 360 px', () => {
  it('shows the first animal before any tool or filter, folds filters away and never leaves blank rows', async () => {
    const { context, page, consoleErrors } = await phonePage(env.browser);
    await signInAsDemo(page, env.server.baseUrl, 'owner@northlight.test');
    await page.getByRole('link', { name: 'Animals', exact: true }).click();
    await page.waitForURL('**/animals');
    const list = page.getByRole('list', { name: 'Animals' });
    await list.getByRole('listitem').first().waitFor();
    // One primary action and one menu; the filters are one folded line with no count yet.
    expect(await page.getByRole('link', { name: 'Add animal' }).isVisible()).toBe(true);
    expect(await page.getByLabel('Stage').isVisible()).toBe(false);
    const first = await list.getByRole('listitem').first().boundingBox();
    expect(first!.y + 60).toBeLessThan(740 - 64);
    await inEveryTheme(page, 'animals phone');
    await page.evaluate(() => (document.documentElement.dataset.theme = 'light'));

    // The menu holds the other tools.
    await page.getByText('More', { exact: true }).click();
    for (const name of ['Print labels', 'Breeding', 'Import CSV', 'Places'])
      expect(await page.getByRole('link', { name, exact: true }).isVisible()).toBe(true);
    await page.getByText('More', { exact: true }).click();

    // Filters open on demand and say how many are on.
    await page.getByText('Filters', { exact: true }).click();
    await page.getByLabel('Stage').selectOption('sling');
    await expect.poll(() => page.getByText('1 on', { exact: true }).count()).toBe(1);
    await expect.poll(() => page.getByText(/^\d+ of 43 animals/).innerText()).toMatch(/^26 of/);
    await screenshot(page, 'polish-animals-filtered');
    await page.getByRole('button', { name: 'Clear filters' }).click();
    await expect.poll(() => page.getByText('43 of 43 animals').count()).toBe(1);
    await page.getByText('Filters', { exact: true }).click();

    // Scrolled anywhere, rows fill the screen from top to the tab bar: no blank band.
    for (const y of [600, 1800, 3000]) {
      await page.evaluate((to) => window.scrollTo(0, to), y);
      await page.waitForTimeout(300);
      for (const at of [120, 400, 740 - 90]) expect(await rowAt(page, at), `${y}+${at}`).toBe(true);
    }
    await screenshot(page, 'polish-animals-scrolled');

    // A new page opens at its top.
    await page.evaluate(() => window.scrollTo(0, 1800));
    await page.waitForTimeout(200);
    await list.getByRole('link').filter({ visible: true }).first().click();
    await page.waitForURL(/\/animals\/[0-9a-f-]{36}$/);
    await page.getByRole('heading', { level: 1 }).waitFor();
    // Opened at its top (ScrollRestoration scrolls as the new page lays out).
    await expect.poll(() => page.evaluate(() => window.scrollY), { timeout: 2_000 }).toBe(0);
    // The animal page opens with its name, not a photo placeholder.
    const headings = await page.locator('main h1').allInnerTexts();
    expect(headings).toHaveLength(1);
    await page.goBack();
    await page.waitForURL('**/animals');
    expect(consoleErrors).toEqual([]);
    await context.close();
  });

  it('uses a desktop’s width: a side column of links and a table without wrapped codes', async () => {
    const context = await env.browser.newContext({ viewport: { width: 1280, height: 800 } });
    const page = await context.newPage();
    await signInAsDemo(page, env.server.baseUrl, 'owner@northlight.test');
    await page.getByRole('link', { name: 'Animals', exact: true }).click();
    await page.getByRole('table').waitFor();
    const nav = (await page.getByRole('navigation', { name: 'Main' }).boundingBox())!;
    expect(nav.x).toBe(0);
    expect(nav.width).toBeLessThan(260);
    expect(nav.height).toBeGreaterThan(700);
    const table = (await page.getByRole('table').boundingBox())!;
    expect(table.width).toBeGreaterThan(900);
    // Each code stays on one line.
    const codeHeights = await page
      .locator('tbody td:nth-child(2) span')
      .evaluateAll((els) => els.map((e) => e.getBoundingClientRect().height));
    expect(Math.max(...codeHeights)).toBeLessThan(40);
    // The filters stand open on a wide screen.
    expect(await page.getByLabel('Stage').isVisible()).toBe(true);
    await inEveryTheme(page, 'animals desktop');
    // Desktop rows are not left blank while scrolling either.
    await page.evaluate(() => window.scrollTo(0, 1200));
    await page.waitForTimeout(300);
    const covered = await page.evaluate(() => {
      const rows = [...document.querySelectorAll('tbody tr:not([aria-hidden])')];
      return [150, 400, 750].every((at) =>
        rows.some((r) => {
          const b = r.getBoundingClientRect();
          return b.top <= at && b.bottom >= at;
        }),
      );
    });
    expect(covered).toBe(true);
    await context.close();
  });
});

describe('labels, the breeding register and a first run at 360 px', () => {
  it('prints 19 mm squares (and says what each size carries), and makes their PDF', async () => {
    const { context, page, consoleErrors } = await phonePage(env.browser);
    await signInAsDemo(page, env.server.baseUrl, 'owner@northlight.test');
    await page.goto(`${env.server.baseUrl}/labels`);
    await page.getByLabel('Clutch').selectOption('H. formosus sac 1');
    await page.getByRole('button', { name: 'Choose all 24 shown' }).click();
    const sizes = page.getByRole('group', { name: 'Label size' });
    // Each size says what it carries; the 38 mm default keeps the name and species.
    await expect.poll(() => sizes.innerText()).toMatch(/38 mm square\s*Code, name, species, stage/);
    await page.getByText('19 mm square', { exact: true }).click();
    await expect.poll(() => sizes.innerText()).toMatch(/19 mm square\s*Code only/);
    await expect
      .poll(() => page.getByText(/^24 labels on 1 sheet/).innerText())
      .toMatch(/squares 0\.50 mm · short QR for the Scan screen/);
    expect(await page.getByText(/Rackside’s Scan screen opens the animal/).count()).toBe(1);
    expect(await page.getByRole('alert').count()).toBe(0);
    await inEveryTheme(page, 'labels 19 mm');

    const [download] = await Promise.all([
      page.waitForEvent('download'),
      page.getByRole('button', { name: 'Download PDF' }).click(),
    ]);
    const file = await download.path();
    expect(fs.readFileSync(file).subarray(0, 5).toString()).toBe('%PDF-');
    expect(consoleErrors).toEqual([]);
    await context.close();
  });

  it('shows the demo’s sacs and its 24-sling clutch in the breeding register, in words and local dates', async () => {
    const { context, page, consoleErrors } = await phonePage(env.browser);
    await signInAsDemo(page, env.server.baseUrl, 'owner@northlight.test');
    await page.goto(`${env.server.baseUrl}/breeding`);
    const register = page.getByRole('list', { name: 'Egg sacs, egg cases and broods' });
    await register.getByRole('listitem').first().waitFor();
    expect(await register.getByRole('listitem').count()).toBeGreaterThanOrEqual(5);
    const clutch = register.getByRole('listitem').filter({ hasText: 'H. formosus sac 1' });
    await expect.poll(() => clutch.innerText()).toMatch(/potted up 24/);
    // Its dates are words ("Laid Sun 5 Jul"), not ISO strings.
    expect(await clutch.locator('p').nth(1).innerText()).not.toMatch(/\d{4}-\d{2}-\d{2}/);
    expect(await page.getByRole('note', { name: 'About the breeding register' }).count()).toBe(0);
    await clutch.scrollIntoViewIfNeeded();
    await inEveryTheme(page, 'breeding register');
    expect(consoleErrors).toEqual([]);
    await context.close();
  });

  it('greets a new, empty collection with a first-run guide, and its register with help', async () => {
    const { context, page, consoleErrors } = await phonePage(env.browser);
    await signInAsDemo(page, env.server.baseUrl, 'partner@northlight.test');
    await page.goto(`${env.server.baseUrl}/collections/new`);
    await page.getByLabel('Collection name').fill('Shed rack');
    await page.getByLabel('Time zone').fill('Europe/Dublin');
    await page.getByRole('button', { name: 'Start the collection' }).click();
    await page.waitForURL('**/today');
    const guide = page.getByRole('region', { name: 'Start Shed rack' });
    await guide.waitFor();
    expect(await page.getByText('Nothing is due. Enjoy the quiet.').count()).toBe(0);
    expect(await page.getByRole('progressbar').count()).toBe(0);
    for (const name of ['Add an animal', 'Import a CSV file', 'Print labels'])
      expect(await guide.getByRole('link', { name }).isVisible()).toBe(true);
    await inEveryTheme(page, 'first run');

    await page.goto(`${env.server.baseUrl}/breeding`);
    await page.getByRole('note', { name: 'About the breeding register' }).waitFor();
    await inEveryTheme(page, 'empty register');

    await page.goto(`${env.server.baseUrl}/today`);
    await guide.getByRole('link', { name: 'Add an animal' }).click();
    await page.waitForURL('**/animals/new');
    expect(consoleErrors).toEqual([]);
    await context.close();
  });
});
