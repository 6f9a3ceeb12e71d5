// Places at 360 px: a sling is potted up onto a shelf picked from the tree (its rack chosen, its
// shelf named anew as "Shelf 3" and written once), the place reads the same on the animal page
// and its card; the move picker says who lives in a spot; the places editor renames a shelf and
// moves it by button and by drag. axe-core in light, dark and night on each changed screen.
import type { Page } from 'playwright-core';
import { describe, expect, it } from 'vitest';
import { expectAccessible, phonePage, screenshot, signInAsDemo, useE2e } from './support';

const env = useE2e();

async function inEveryTheme(page: Page, label: string) {
  for (const theme of ['light', 'dark', 'night'] as const) {
    await page.evaluate((t) => {
      document.documentElement.dataset.theme = t;
    }, theme);
    await expectAccessible(page, `${label} (${theme})`, theme);
    await screenshot(page, `places-${label}-${theme}`);
  }
}

const shelvesOf = (page: Page, rack: string) =>
  page
    .getByRole('list', { name: `Shelves of ${rack}` })
    .locator(':scope > li')
    .locator('button[aria-expanded] .text-lg')
    .allInnerTexts();

describe('places and pot-ups at 360 px', () => {
  it('pots up a sling onto a shelf from the tree; its place reads the same on its card and page; moving says who is where', async () => {
    const { page, consoleErrors } = await phonePage(env.browser);
    await signInAsDemo(page, env.server.baseUrl, 'owner@northlight.test');
    await page.goto(`${env.server.baseUrl}/breeding`);
    const juniper = (
      await page.getByLabel('Female', { exact: true }).locator('option').allInnerTexts()
    ).find((t) => t.startsWith('Juniper ('))!;
    await page.getByLabel('Female', { exact: true }).selectOption({ label: juniper });
    await page.getByLabel('Clutch name').fill('Juniper sac places');
    await page.getByRole('button', { name: 'Record the sac' }).click();
    const sac = page
      .getByRole('list', { name: 'Egg sacs' })
      .getByRole('listitem')
      .filter({ hasText: 'Juniper sac places' });
    await sac.getByRole('button', { name: 'Pot up slings…' }).click();
    const pot = page.getByRole('form', { name: 'Pot up slings from Juniper sac places' });
    await pot.getByLabel('How many').fill('1');
    await pot.getByLabel('Names start with').fill('Sprout');
    const shelf = pot.getByRole('group', { name: 'Onto which shelf or tray' });
    await shelf.getByLabel('Room').selectOption('Spare room');
    // Racks are offered as the keeper reads them, never "Rack Rack C".
    const racks = await shelf.getByLabel('Rack').locator('option').allInnerTexts();
    expect(racks).toEqual(expect.arrayContaining(['Rack A', 'Rack B', 'Rack C']));
    await shelf.getByLabel('Rack').selectOption('C');
    await shelf.getByLabel('Shelf or tray').selectOption('1');
    // The first free spot on the full tray is offered; spot 1 is Formosus 01's, and says so.
    await expect.poll(() => pot.getByLabel('First position').inputValue()).toBe('13');
    await pot.getByLabel('First position').fill('1');
    await expect
      .poll(() => pot.getByText(/One of these spots is taken: C1-01 by Formosus 01/).count())
      .toBe(1);
    await pot.getByRole('button', { name: 'Create 1 slings' }).click();
    await expect
      .poll(() => pot.getByText('Start at a free spot, or tick to share.').count())
      .toBe(1);
    await expectAccessible(page, 'pot-up taken');
    await screenshot(page, 'places-01-pot-up-taken');
    // A new shelf on rack C, typed with its word: stored once.
    await shelf.getByLabel('Shelf or tray').selectOption({ label: '＋ New shelf or tray…' });
    await shelf.getByLabel('Shelf or tray (new)').fill('Shelf 3');
    await expect.poll(() => pot.getByLabel('First position').inputValue()).toBe('1');
    await expect
      .poll(() => pot.getByText('The pots go in C3-1 on Rack C · Shelf 3.').count())
      .toBe(1);
    await inEveryTheme(page, '02-pot-up');
    await pot.getByRole('button', { name: 'Create 1 slings' }).click();
    await page.waitForURL('**/labels');

    await page.goto(`${env.server.baseUrl}/animals`);
    await page.getByLabel('Find', { exact: true }).fill('Sprout');
    const card = page.getByRole('listitem').filter({ hasText: 'Sprout 01' });
    await expect.poll(() => card.innerText()).toMatch(/· C3-1\b/);
    await page.getByRole('link', { name: 'Sprout 01' }).click();
    const record = page.getByRole('article', { name: /^Sprout 01, / });
    await expect.poll(() => record.innerText()).toMatch(/· C3-1\b/);
    expect(await page.getByText(/Rack Rack|Shelf Shelf/).count()).toBe(0);

    // Moving: spots say who is there.
    await page.getByRole('button', { name: 'Move…' }).click();
    const to = page.getByRole('group', { name: 'Move Sprout 01 to' });
    await to.getByLabel('Shelf or tray').selectOption('1');
    const spots = await to.getByLabel('Position').locator('option').allInnerTexts();
    expect(spots).toContain('C1-01 · taken by Formosus 01');
    await to.getByLabel('Position').selectOption({ label: 'C1-02 · taken by Formosus 02' });
    await expect.poll(() => page.getByText('C1-02 is taken by Formosus 02.').count()).toBe(1);
    await inEveryTheme(page, '03-move');
    await page.getByRole('button', { name: 'Cancel' }).click();

    expect(consoleErrors).toEqual([]);
  }, 240_000);

  it('renames a shelf in the places editor and reorders it by button and by drag', async () => {
    const { page, consoleErrors } = await phonePage(env.browser);
    await signInAsDemo(page, env.server.baseUrl, 'owner@northlight.test');
    await page.goto(`${env.server.baseUrl}/places`);
    const rackC = page.getByRole('button', { name: /^Rack C / });
    await rackC.click();
    expect(await rackC.getAttribute('aria-expanded')).toBe('true');
    const before = await shelvesOf(page, 'Rack C');
    expect(before.slice(0, 2)).toEqual(['Shelf 1', 'Shelf 2']);
    await page.getByRole('button', { name: 'Rename Rack C · Shelf 2' }).click();
    await page.getByLabel('New name for Rack C · Shelf 2').fill('Tray 5');
    await page.getByRole('button', { name: 'Save name' }).click();
    await expect
      .poll(() => shelvesOf(page, 'Rack C'))
      .toEqual(['Shelf 1', 'Tray 5', ...before.slice(2)]);
    // The keyboard's way: Earlier in the walk.
    await page.getByRole('button', { name: 'Earlier in the walk: Rack C · Tray 5' }).click();
    await expect
      .poll(() => shelvesOf(page, 'Rack C'))
      .toEqual(['Tray 5', 'Shelf 1', ...before.slice(2)]);
    await inEveryTheme(page, '04-editor');

    // Drag Tray 5 by its grip to below Shelf 1 (pointer events, captured by the grip).
    const list = page.getByRole('list', { name: 'Shelves of Rack C' });
    const grip = list.locator(':scope > li').first().locator('[title^="Drag to move"]').first();
    const second = list.locator(':scope > li').nth(1);
    await list.evaluate((el) => el.scrollIntoView({ block: 'start' }));
    const from = (await grip.boundingBox())!;
    const onto = (await second.boundingBox())!;
    await page.mouse.move(from.x + from.width / 2, from.y + from.height / 2);
    await page.mouse.down();
    await page.mouse.move(from.x + from.width / 2, onto.y + onto.height - 4, { steps: 8 });
    await page.mouse.up();
    await expect
      .poll(() => shelvesOf(page, 'Rack C'))
      .toEqual(['Shelf 1', 'Tray 5', ...before.slice(2)]);

    // The tray's slings read the new name on their page.
    await page.goto(`${env.server.baseUrl}/animals`);
    await page.getByLabel('Find', { exact: true }).fill('Formosus 13');
    await page.getByRole('link', { name: 'Formosus 13' }).click();
    await expect
      .poll(() => page.getByRole('article', { name: /^Formosus 13, / }).innerText())
      .toMatch(/· C5-01\b/);
    expect(consoleErrors).toEqual([]);
  }, 240_000);

  it('shows the places editor at 1280 px', async () => {
    const { page, context } = await phonePage(env.browser);
    await page.setViewportSize({ width: 1280, height: 900 });
    await signInAsDemo(page, env.server.baseUrl, 'owner@northlight.test');
    await page.goto(`${env.server.baseUrl}/places`);
    await page.getByRole('button', { name: /^Rack A / }).click();
    await page
      .getByRole('button', { name: /^Shelf 1 / })
      .first()
      .click();
    await expectAccessible(page, 'places 1280');
    await screenshot(page, 'places-05-editor-1280');
    await context.close();
  });
});
