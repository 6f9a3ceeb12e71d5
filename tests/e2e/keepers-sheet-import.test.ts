// A keeper's own spreadsheet at 360 px: no group or stage column, sexes as F/M/unsexed/?, sizes
// in inches, centimetres and `4"`, dates as 03/04/2025 and 2025-4-3. The keeper answers the two
// questions the file leaves open, sees "4 of 4 rows ready" and every row is imported as meant.
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import type { Page } from 'playwright-core';
import { afterAll, describe, expect, it } from 'vitest';
import type { AnimalListResponse } from '#shared/schemas/animals';
import { demoCollectionId } from '../../server/seed/demo';
import { KEEPERS_SHEET } from '../fixtures/keepers-sheet';
import { expectAccessible, phonePage, screenshot, signInAsDemo, useE2e } from './support';

const env = useE2e();
const tmp = fs.mkdtempSync(path.join(os.tmpdir(), 'rackside-sheet-'));
afterAll(() => fs.rmSync(tmp, { recursive: true, force: true }));

/** The theme as Settings sets it: on <html> and remembered on the device. */
async function showTheme(page: Page, theme: 'light' | 'dark' | 'night') {
  await page.evaluate((t) => {
    document.documentElement.dataset.theme = t;
    localStorage.setItem('rackside.theme', t);
  }, theme);
}

describe('importing a keeper’s own spreadsheet at 360 px', () => {
  it('asks only what the file leaves open, explains the rows that wait, and imports all four', async () => {
    const { page, consoleErrors } = await phonePage(env.browser);
    await signInAsDemo(page, env.server.baseUrl, 'owner@northlight.test');
    const file = path.join(tmp, 'my tarantulas.csv');
    // Names no demo animal has, so the list shows exactly what the import made.
    fs.writeFileSync(file, KEEPERS_SHEET);
    await page.goto(`${env.server.baseUrl}/import`);
    await page.getByLabel('Choose a CSV file').setInputFiles(file);

    // The columns are offered by plain names, and guessed from the keeper's headers.
    const species = page.getByLabel('Your “Species”');
    expect(await species.inputValue()).toBe('scientific_name');
    expect(await species.locator('option:checked').innerText()).toBe('Species (scientific name)');
    expect(await page.getByLabel('Your “Size”').locator('option:checked').innerText()).toBe('Size');
    expect(await page.getByText(/scientific_name|size_mm/).count()).toBe(0);

    // Before the two choices, each row says in words what it waits for.
    await expect.poll(() => page.getByText('0 of 4 rows ready; 4 need attention.').count()).toBe(1);
    const waiting = page
      .getByRole('list', { name: 'Rows that need attention' })
      .locator(':scope > li');
    expect(await waiting.count()).toBe(4);
    const tilly = await waiting.first().innerText();
    expect(tilly).toMatch(/^Line 2 · Tilly/);
    expect(tilly).toContain('Life stage: none given. Choose one above');
    expect(tilly).toContain('“03/04/2025” could be day first or month first.');
    for (const theme of ['light', 'dark', 'night'] as const) {
      await showTheme(page, theme);
      await expectAccessible(page, `import-questions-${theme}`, theme);
    }
    await screenshot(page, 'import-01-questions-night');

    await page.getByLabel('Life stage').selectOption('juvenile');
    await page.getByText('Day first', { exact: true }).click();
    expect(await page.getByRole('radio', { name: /^Day first/ }).isChecked()).toBe(true);
    await expect.poll(() => page.getByText('4 of 4 rows ready; 0 need attention.').count()).toBe(1);
    expect(await page.getByRole('list', { name: 'Rows that need attention' }).count()).toBe(0);
    const ready = page.getByRole('list', { name: 'Rows ready to import' }).locator(':scope > li');
    const previews = await ready.allInnerTexts();
    expect(previews).toHaveLength(4);
    // Each conversion is shown beside what the keeper wrote.
    expect(previews[0]).toMatch(
      /Tarantula, juvenile · Female · 127 mm \(5in\) · acquired .+ \(03\/04\/2025\)/,
    );
    expect(previews[1]).toContain('Male · 101.6 mm (4")');
    expect(previews[2]).toContain('Sex unknown · 20 mm (2 cm)');
    for (const theme of ['light', 'dark', 'night'] as const) {
      await showTheme(page, theme);
      await expectAccessible(page, `import-ready-${theme}`, theme);
      await screenshot(page, `import-02-ready-${theme}`);
    }

    await page.getByRole('button', { name: 'Import 4 rows' }).click();
    await expect
      .poll(() => page.getByText('Imported 4 animals.').count(), { timeout: 15_000 })
      .toBe(1);
    await expectAccessible(page, 'import-done');

    // Stored as meant: inches and centimetres in millimetres, the chosen day-first date.
    const collectionId = (await demoCollectionId(env.server.ctx.database.db))!;
    const { animals } = (await page.evaluate(
      async (u) => (await fetch(u, { headers: { 'X-Rackside-Client': '1' } })).json(),
      `/api/collections/${collectionId}/animals`,
    )) as AnimalListResponse;
    const imported = ['Tilly', 'Bram', 'Sprout', 'Dot'].map((name) => {
      const a = animals.find((x) => x.name === name)!;
      return [a.name, a.group, a.lifeStage, a.sex, a.sizeMm, a.acquiredOn];
    });
    expect(imported).toEqual([
      ['Tilly', 'tarantula', 'juvenile', 'female', 127, '2025-04-03'],
      ['Bram', 'tarantula', 'juvenile', 'male', 101.6, '2025-04-03'],
      ['Sprout', 'tarantula', 'juvenile', 'unknown', 20, '2025-04-03'],
      ['Dot', 'tarantula', 'juvenile', 'unknown', null, null],
    ]);
    expect(consoleErrors).toEqual([]);
  });
});
