// Today's round at the rack on a 360 px phone: what it opens on, finished cards folding away,
// searching by place, undoing a whole shelf, a note (offline) and a photo with an outcome, the
// helper's cautions stated once, and the checklist printed for the rack.
import { and, eq, gte, inArray } from 'drizzle-orm';
import type { Page } from 'playwright-core';
import sharp from 'sharp';
import { describe, expect, it } from 'vitest';
import { eventPhotos, events } from '../../server/db/schema/animals';
import { users } from '../../server/db/schema/users';
import { cutNetwork, restoreNetwork, underServiceWorker } from '../chromium';
import {
  expectAccessible,
  phonePage,
  screenshot,
  signInAsDemo,
  startDemoHelpersCover,
  useE2e,
} from './support';

const env = useE2e();

const item = (page: Page, name: string) =>
  page.getByRole('article', { name: new RegExp(`^${name},`) });
const filterChip = (page: Page, name: RegExp) =>
  page.locator('label').filter({ has: page.getByRole('radio', { name }) });
const syncStatus = (page: Page) =>
  page
    .getByRole('status')
    .filter({ hasText: /saved|waiting|Saving|attention/ })
    .first()
    .innerText();

async function userId(email: string) {
  const [row] = await env.server.ctx.database.db
    .select({ id: users.id })
    .from(users)
    .where(eq(users.email, email));
  return row!.id;
}
const eventsSince = async (email: string, since: Date) =>
  env.server.ctx.database.db
    .select()
    .from(events)
    .where(and(eq(events.recordedBy, await userId(email)), gte(events.serverReceivedAt, since)));

/** axe in each theme, with a screenshot of each. */
async function accessibleInEveryTheme(page: Page, name: string) {
  for (const theme of ['light', 'dark', 'night'] as const) {
    await page.evaluate((t) => (document.documentElement.dataset.theme = t), theme);
    await expectAccessible(page, `${name}-${theme}`, theme);
    await screenshot(page, `${name}-${theme}`);
  }
}

describe('today’s round at 360 × 740', () => {
  it('opens on To do, folds a finished card that can be changed, finds places and remembers the filter', async () => {
    const { context, page, consoleErrors } = await phonePage(env.browser);
    await signInAsDemo(page, env.server.baseUrl, 'owner@northlight.test');
    await item(page, 'Dusty').waitFor();
    expect(await page.getByRole('radio', { name: /^To do/ }).isChecked()).toBe(true);
    // One unit everywhere: animals. Two cards only say "leave alone" and are not counted as work.
    expect(await page.getByText(/^0 of 24 animals done$/).count()).toBe(1);
    expect(await page.getByRole('radio', { name: /^To do 26 animals/ }).count()).toBe(1);
    // Take care leaves the handling cautions, not the hairs nearly every card carries.
    expect(await page.getByRole('radio', { name: /^Take care 9 animals/ }).count()).toBe(1);

    // The place code printed on the card finds it, however it is typed.
    const search = page.getByLabel('Find a label code, a place or a name');
    await search.fill('a1 3');
    await expect.poll(() => page.getByRole('article').count()).toBe(1);
    expect(await item(page, 'Dusty').isVisible()).toBe(true);
    await search.fill('C1-8');
    await expect.poll(() => page.getByRole('article').count()).toBe(1);
    expect(await item(page, 'Formosus 08').isVisible()).toBe(true);
    await search.fill('C2');
    await expect.poll(() => page.getByRole('article').count()).toBe(5);
    await search.fill('');

    // Dusty only had a feed: one tap finishes it and the card folds to a row, still under To do.
    const tall = (await item(page, 'Dusty').boundingBox())!.height;
    await item(page, 'Dusty').getByRole('button', { name: 'Ate', exact: true }).click();
    await expect.poll(() => item(page, 'Dusty').innerText()).toMatch(/✓ Ate \d\d:\d\d/);
    const row = item(page, 'Dusty');
    expect(await row.getByRole('button', { name: 'Change Dusty' }).isVisible()).toBe(true);
    expect(await row.getByRole('button', { name: 'Refused' }).count()).toBe(0);
    expect((await row.boundingBox())!.height).toBeLessThan(tall / 2);
    expect((await row.boundingBox())!.height).toBeLessThanOrEqual(80);
    expect(await page.getByText(/^1 of 24 animals done$/).count()).toBe(1);
    expect(await page.getByRole('radio', { name: /^Done 1 animal/ }).count()).toBe(1);
    await screenshot(page, 'today-round-01-folded');

    // Opened again, the outcome can be undone (a void) and another recorded.
    await row.getByRole('button', { name: 'Change Dusty' }).click();
    await item(page, 'Dusty').getByRole('button', { name: 'Undo Ate for Dusty' }).click();
    await expect.poll(() => item(page, 'Dusty').innerText()).not.toMatch(/✓ Ate/);
    await item(page, 'Dusty').getByRole('button', { name: 'Refused', exact: true }).click();
    await expect.poll(() => item(page, 'Dusty').innerText()).toMatch(/✓ Refused/);
    await accessibleInEveryTheme(page, 'today-round-02-to-do');

    // The choice of filter stays with this device.
    await filterChip(page, /^All/).click();
    await page.reload();
    await item(page, 'Dusty').waitFor();
    expect(await page.getByRole('radio', { name: /^All/ }).isChecked()).toBe(true);
    // Back to To do: a card finished before is gone from it (it is under Done).
    await filterChip(page, /^To do/).click();
    await expect.poll(() => item(page, 'Dusty').count()).toBe(0);
    await filterChip(page, /^Done/).click();
    await expect.poll(() => item(page, 'Dusty').count()).toBe(1);
    await filterChip(page, /^To do/).click();
    expect(consoleErrors).toEqual([]);
    await context.close();
  });

  it('undoes a whole shelf saved at once, through voids', async () => {
    const started = new Date();
    const { context, page } = await phonePage(env.browser);
    await signInAsDemo(page, env.server.baseUrl, 'partner@northlight.test');
    const shelf = page.getByRole('region', { name: /Rack C · Shelf 2/ });
    await shelf.getByRole('button', { name: /Whole shelf at once \(\d+\)/ }).click();
    const save = shelf.getByRole('button', { name: /^Record \d+: \d+ ate$/ });
    const count = Number((await save.innerText()).match(/Record (\d+)/)![1]);
    expect(count).toBeGreaterThanOrEqual(2);
    await save.click();
    const toast = page.getByRole('status').filter({ hasText: 'saved on' });
    await expect.poll(() => toast.innerText()).toMatch(new RegExp(`${count} saved on .*Shelf 2`));
    await expect.poll(() => shelf.getByRole('button', { name: /^Change / }).count()).toBe(count);
    await screenshot(page, 'today-round-03-shelf-saved');
    await toast.getByRole('button', { name: 'Undo' }).click();
    await expect.poll(() => shelf.getByRole('button', { name: /^Change / }).count()).toBe(0);
    await expect.poll(() => syncStatus(page), { timeout: 20_000 }).toMatch(/All saved/);
    const saved = await eventsSince('partner@northlight.test', started);
    const ate = saved.filter((e) => e.kind === 'ate');
    const voids = saved.filter((e) => e.kind === 'void');
    expect(ate).toHaveLength(count);
    expect(voids.map((v) => (v.payload as { targetId: string }).targetId).sort()).toEqual(
      ate.map((e) => e.id).sort(),
    );
    await context.close();
  });

  it('records an outcome with a note with no signal, and a photo once the outcome is saved', async () => {
    const started = new Date();
    const { context, page, consoleErrors } = await phonePage(env.browser);
    await signInAsDemo(page, env.server.baseUrl, 'owner@northlight.test');
    await underServiceWorker(page);
    await item(page, 'Juniper').waitFor();
    await expect.poll(() => syncStatus(page)).toMatch(/All saved/);

    await cutNetwork(context);
    const juniper = item(page, 'Juniper');
    await juniper.getByRole('button', { name: 'Note or photo' }).click();
    await juniper.getByLabel('Note for Juniper').fill('Dish was bone dry, refilled twice.');
    await screenshot(page, 'today-round-04-note');
    await accessibleInEveryTheme(page, 'today-round-04-note');
    await juniper.getByRole('button', { name: 'Watered', exact: true }).click();
    await expect.poll(() => juniper.innerText()).toMatch(/✓ Watered/);
    await expect.poll(() => syncStatus(page), { timeout: 10_000 }).toMatch(/1 waiting/);

    // A photo with the next outcome: it waits for the signal, and says so.
    const png = await sharp({ create: { width: 64, height: 48, channels: 3, background: '#864' } })
      .png()
      .toBuffer();
    await juniper.getByRole('button', { name: 'Note or photo' }).click();
    await juniper.getByLabel('Note for Juniper').fill('Took it at once.');
    await juniper
      .getByText('Add a photo')
      .locator('input[type=file]')
      .setInputFiles({ name: 'meal.png', mimeType: 'image/png', buffer: png });
    expect(await juniper.innerText()).toMatch(/needs a signal/);
    await juniper.getByRole('button', { name: 'Ate', exact: true }).click();
    // Fed and watered: the card folds, and the row tells how the photo is getting on.
    const row = item(page, 'Juniper');
    await expect.poll(() => row.innerText()).toMatch(/Photo with Ate: waiting for a signal/);
    await screenshot(page, 'today-round-05-photo-waiting');

    await restoreNetwork(context);
    await expect.poll(() => row.innerText(), { timeout: 30_000 }).toMatch(/Photo with Ate: saved/);
    await expect.poll(() => syncStatus(page), { timeout: 20_000 }).toMatch(/All saved/);
    const saved = await eventsSince('owner@northlight.test', started);
    const byKind = new Map(saved.map((e) => [e.kind, e]));
    expect(byKind.get('watered')!.payload).toEqual({ note: 'Dish was bone dry, refilled twice.' });
    expect(byKind.get('ate')!.payload).toEqual({ note: 'Took it at once.' });
    const photos = await env.server.ctx.database.db
      .select()
      .from(eventPhotos)
      .where(inArray(eventPhotos.eventId, [byKind.get('ate')!.id]));
    expect(photos).toHaveLength(1);
    expect(
      consoleErrors.filter((e) => !/ERR_INTERNET_DISCONNECTED|Failed to load resource/.test(e)),
    ).toEqual([]);
    await context.close();
  });

  it('states each caution once at the top of the helper’s round, with a badge on each card', async () => {
    await startDemoHelpersCover(env.server);
    const { context, page, consoleErrors } = await phonePage(env.browser);
    await signInAsDemo(page, env.server.baseUrl, 'helper@northlight.test');
    await item(page, 'Ember').waitFor();
    const cautions = page.getByRole('region', { name: 'Cautions on today’s round' });
    expect(await cautions.innerText()).toMatch(/Potent venom — never use your hands · 4 animals/);
    // The guidance is written once on the page, not on each card.
    const guidance = /A bite can cause severe cramps/;
    expect(await page.getByText(guidance).count()).toBe(1);
    expect(await page.getByText(guidance).isVisible()).toBe(false);
    await cautions.getByText(/^Potent venom — never use your hands/).click();
    expect(await page.getByText(guidance).isVisible()).toBe(true);
    expect(await item(page, 'Ember').getByRole('list', { name: 'Cautions' }).innerText()).toMatch(
      /Potent venom[\s\S]*Fast or defensive[\s\S]*Escape risk/,
    );
    // Helpers add notes, not photos.
    await item(page, 'Ember').getByRole('button', { name: 'Add a note' }).click();
    expect(await item(page, 'Ember').getByText('Add a photo').count()).toBe(0);
    await accessibleInEveryTheme(page, 'today-round-06-helper');
    expect(consoleErrors).toEqual([]);
    await context.close();
  });

  it('prints a checklist of the round, one line per animal with boxes to tick', async () => {
    const { context, page, consoleErrors } = await phonePage(env.browser);
    await signInAsDemo(page, env.server.baseUrl, 'owner@northlight.test');
    await page.getByRole('link', { name: 'Print a checklist of this round' }).click();
    await page.waitForURL('**/today/checklist');
    const table = page.getByRole('table');
    await table.waitFor();
    // Every card of the round is a row, in walk order.
    expect(await table.locator('tbody tr').count()).toBe(26);
    const dusty = table.locator('tbody tr').filter({ hasText: 'Dusty' });
    expect(await dusty.innerText()).toMatch(
      /A1-3[\s\S]*Dusty[\s\S]*Aphonopelma chalcodes[\s\S]*Urticating hairs[\s\S]*Feed · 1–3 × large cricket/,
    );
    const ember = table.locator('tbody tr').filter({ hasText: 'Ember' });
    expect(await ember.innerText()).toMatch(/Potent venom[\s\S]*Feed[\s\S]*Water/);
    // The table fits the phone: nothing scrolls sideways.
    const wide = await page.evaluate(
      () => document.documentElement.scrollWidth > document.documentElement.clientWidth,
    );
    expect(wide).toBe(false);
    await accessibleInEveryTheme(page, 'today-round-07-checklist');
    await page.emulateMedia({ media: 'print' });
    expect(await page.getByRole('button', { name: 'Print' }).isVisible()).toBe(false);
    expect(await page.getByRole('navigation', { name: 'Main' }).isVisible()).toBe(false);
    // Black on white on paper, whatever the theme on screen.
    expect(await dusty.evaluate((el) => getComputedStyle(el.querySelector('td')!).color)).toBe(
      'rgb(0, 0, 0)',
    );
    await screenshot(page, 'today-round-08-checklist-print');
    await page.emulateMedia({ media: 'screen' });
    await page.setViewportSize({ width: 1280, height: 900 });
    await screenshot(page, 'today-round-09-checklist-1280');
    await page.goto(`${env.server.baseUrl}/today`);
    await item(page, 'Ember').waitFor();
    await screenshot(page, 'today-round-10-today-1280');
    expect(consoleErrors).toEqual([]);
    await context.close();
  });
});
