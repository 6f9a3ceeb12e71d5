// Issue 6's end-to-end check at 360 px: add an animal, find it, open it, edit it, give it a
// photo, and import a 200-row spreadsheet with three bad rows.
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import sharp from 'sharp';
import { afterAll, describe, expect, it } from 'vitest';
import { ANIMAL_COLUMNS } from '#shared/domain/csv/animal-columns';
import { writeCsv } from '#shared/domain/csv/csv-file';
import { expectAccessible, phonePage, screenshot, signInAsDemo, useE2e } from './support';

const env = useE2e();
const tmp = fs.mkdtempSync(path.join(os.tmpdir(), 'rackside-records-'));
afterAll(() => fs.rmSync(tmp, { recursive: true, force: true }));

/** 200 rows; rows 50, 120 and 180 (file lines 51, 121, 181) are wrong in three different ways. */
function spreadsheet(): { file: string; badLines: number[] } {
  const rows = Array.from({ length: 200 }, (_, i) => {
    const row: Record<string, string> = Object.fromEntries(ANIMAL_COLUMNS.map((c) => [c, '']));
    Object.assign(row, {
      name: `Import ${String(i + 1).padStart(3, '0')}`,
      scientific_name: 'Kochiana brunnipes (C. L. Koch, 1842)',
      group: 'tarantula',
      stage: 'sling',
      size_mm: String(8 + (i % 10)),
      room: 'Shed',
      rack: 'S',
      shelf: String(1 + Math.floor(i / 50)),
      position: String(1 + (i % 50)),
      notes: i % 7 === 0 ? 'Moulted, "twice", this month' : '',
      cautions: i % 3 === 0 ? 'fast_defensive' : '',
    });
    return row;
  });
  rows[49]!.scientific_name = 'kochiana brunnipes';
  rows[119]!.stage = 'teenager';
  rows[179]!.size_mm = 'big';
  const file = path.join(tmp, 'collection.csv');
  fs.writeFileSync(
    file,
    writeCsv(
      ANIMAL_COLUMNS.filter((c) => c !== 'status' && c !== 'status_date'),
      rows,
    ),
  );
  return { file, badLines: [51, 121, 181] };
}

describe('collection records at 360 px', () => {
  it('adds, finds, opens, edits and photographs an animal', async () => {
    const { page, consoleErrors } = await phonePage(env.browser);
    await signInAsDemo(page, env.server.baseUrl, 'owner@northlight.test');
    await page.getByRole('link', { name: 'Animals', exact: true }).click();
    await page.getByRole('link', { name: 'Add animal' }).click();
    await page.getByLabel('Name', { exact: true }).fill('Saffron');
    await page.getByLabel('Scientific name').fill('grammostola pulchra');
    await page.getByRole('button', { name: 'Add animal' }).click();
    await expect.poll(() => page.getByText(/Did you mean “Grammostola pulchra”\?/).count()).toBe(1);
    await page.getByRole('button', { name: 'Use “Grammostola pulchra”' }).click();
    await page.getByLabel('Life stage').selectOption('juvenile');
    await page.getByLabel('Leg span (mm)').fill('55');
    await page.getByLabel('Urticating hairs').check();
    await expectAccessible(page, 'animal form');
    await screenshot(page, 'records-01-form');
    await page.getByRole('button', { name: 'Add animal' }).click();
    await page.waitForURL(/\/animals\/[0-9a-f-]{36}$/);
    await page.getByRole('article', { name: /^Saffron, / }).waitFor();

    await page.getByRole('link', { name: 'Animals', exact: true }).click();
    await page.getByLabel('Find', { exact: true }).fill('saffron');
    await expect.poll(() => page.getByText(/^1 of \d+ animals/).count()).toBe(1);
    await expectAccessible(page, 'collection table');
    await screenshot(page, 'records-02-table');
    await page.getByRole('link', { name: 'Saffron' }).click();
    await page.getByRole('link', { name: 'Edit' }).click();
    await page.getByLabel('Leg span (mm)').fill('61');
    await page.getByRole('button', { name: 'Save changes' }).click();
    await expect.poll(() => page.getByText(/Leg span 61 mm/).count()).toBe(1);

    const jpeg = await sharp({
      create: { width: 1200, height: 900, channels: 3, background: '#4a3520' },
    })
      .jpeg()
      .toBuffer();
    await page
      .getByLabel('Add a photo')
      .setInputFiles({ name: 'saffron.jpg', mimeType: 'image/jpeg', buffer: jpeg });
    const photo = page.getByRole('img', { name: 'Saffron, Grammostola pulchra' });
    await photo.waitFor();
    await expect
      .poll(() => photo.evaluate((img: HTMLImageElement) => img.complete && img.naturalWidth))
      .toBe(320);
    await expectAccessible(page, 'animal page');
    await screenshot(page, 'records-03-animal');

    // Quick actions: move it, retire it (off the round, history kept), bring it back.
    await page.getByRole('button', { name: 'Move…' }).click();
    // Picked down the tree; B3-1 is free (B3-4 and B3-5 are taken).
    const to = page.getByRole('group', { name: 'Move Saffron to' });
    await to.getByLabel('Room').selectOption('Spare room');
    await to.getByLabel('Rack').selectOption('B');
    await to.getByLabel('Shelf or tray').selectOption('3');
    await to.getByLabel('Position').selectOption({ label: 'B3-1 · free' });
    await page.getByRole('button', { name: 'Move', exact: true }).click();
    await to.waitFor({ state: 'detached' });
    await expect
      .poll(() => page.getByRole('article', { name: /^Saffron, / }).innerText())
      .toMatch(/· B3-1\b/);
    await page.getByRole('button', { name: 'Retire…' }).click();
    await page.getByLabel('Why').selectOption('rehomed');
    await page.getByRole('button', { name: 'Retire', exact: true }).click();
    await expect
      .poll(() => page.getByText(/Rehomed on [^:]*\d[^:]*: not on any round\./).count())
      .toBe(1);
    await page.getByRole('button', { name: 'Back in the collection' }).click();
    await expect.poll(() => page.getByRole('button', { name: 'Retire…' }).count()).toBe(1);
    const timeline = page.getByRole('region', { name: 'Timeline' });
    await timeline.getByText('Moves', { exact: true }).click();
    await expect.poll(() => timeline.getByText(/^Moved$|^Status changed/).count()).toBe(3);
    expect(consoleErrors).toEqual([]);
  });

  it('imports a 200-row CSV and reports exactly the three bad rows by line', async () => {
    const { page, consoleErrors } = await phonePage(env.browser);
    await signInAsDemo(page, env.server.baseUrl, 'owner@northlight.test');
    const { file, badLines } = spreadsheet();
    await page.goto(`${env.server.baseUrl}/import`);
    await page.getByLabel('Choose a CSV file').setInputFiles(file);
    await expect
      .poll(() => page.getByText('197 of 200 rows ready; 3 need attention.').count())
      .toBe(1);
    const problems = page
      .getByRole('list', { name: 'Rows that need attention' })
      .locator(':scope > li');
    expect(await problems.count()).toBe(3);
    const texts = await problems.allInnerTexts();
    expect(texts.map((t) => Number(/^Line (\d+) ·/.exec(t)?.[1]))).toEqual(badLines);
    expect(texts[0]).toContain('Species (scientific name):');
    expect(texts[0]).toContain('Did you mean “Kochiana brunnipes”?');
    expect(texts[1]).toMatch(/^Line 121 · Import 120\s+Life stage: “teenager” is not a life stage/);
    expect(texts[2]).toMatch(/^Line 181 · Import 180\s+Size: “big” is not a size we can read/);
    await expectAccessible(page, 'import');
    await screenshot(page, 'records-04-import-check');
    await page.getByRole('button', { name: 'Import 197 rows' }).click();
    await expect
      .poll(() => page.getByText('Imported 197 animals.').count(), { timeout: 15_000 })
      .toBe(1);

    await page.getByRole('link', { name: 'Animals', exact: true }).click();
    await page.getByLabel('Find', { exact: true }).fill('Import 1');
    // "Import 1" matches Import 100–199; of those, 120 and 180 were refused.
    await expect.poll(() => page.getByText(/^98 of \d+ animals/).count()).toBe(1);
    expect(consoleErrors).toEqual([]);
  });
});
