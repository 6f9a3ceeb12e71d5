// Same-day holds (R18, docs/care-rules.md) end to end at 360 px: a molt tapped with no signal
// withdraws the feed task at once and shows the hold; the animal page and the insights agree with
// the round; a do-not-feed handover note withdraws the helper's feed task.
import { eq } from 'drizzle-orm';
import type { Page } from 'playwright-core';
import { describe, expect, it } from 'vitest';
import { addDays, localDateOf } from '#shared/domain/local-dates';
import { animals } from '../../server/db/schema/animals';
import { demoCollectionId } from '../../server/seed/demo';
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
const ZONE = 'America/Toronto';
const item = (page: Page, name: string) =>
  page.getByRole('article', { name: new RegExp(`^${name},`) });
const syncStatus = (page: Page) =>
  page
    .getByRole('status')
    .filter({ hasText: /saved|waiting|Saving|attention/ })
    .first()
    .innerText();

/** The animal's page, reached through the app as a keeper would (offline: the phone's copy). */
async function openAnimal(page: Page, name: string) {
  await page.getByRole('link', { name: 'Animals', exact: true }).click();
  await page.getByRole('heading', { name: 'Animals', level: 1 }).waitFor();
  await page.getByLabel('Find', { exact: true }).fill(name);
  await page
    .getByRole('link', { name: new RegExp(`^${name}\\b`) })
    .first()
    .click();
}

describe('a hold that begins during the day', () => {
  it('Molted offline withdraws the feed task, the molt is completed on the card, and the animal page and insights agree', async () => {
    const { context, page, consoleErrors } = await phonePage(env.browser);
    await signInAsDemo(page, env.server.baseUrl, 'owner@northlight.test');
    await underServiceWorker(page);
    // The phone keeps its copy of the animal list once it has loaded it (a few seconds after
    // start): open the list once while online, as a keeper's phone would have.
    await page.getByRole('link', { name: 'Animals', exact: true }).click();
    await page.getByLabel('Find', { exact: true }).waitFor();
    await page.getByRole('link', { name: 'Today', exact: true }).click();
    // Dusty is an adult carried over from yesterday, due for food in the demo.
    const dusty = item(page, 'Dusty');
    await dusty.waitFor();
    expect(await dusty.innerText()).toMatch(/Feed ·/);
    await expect.poll(() => syncStatus(page)).toMatch(/All saved/);

    await cutNetwork(context);
    await dusty.getByRole('button', { name: 'More…' }).click();
    await dusty.getByRole('button', { name: 'Molted', exact: true }).click();
    // The feed task is withdrawn in the same write as the tap, with the hold's end in its place.
    await expect
      .poll(() => dusty.innerText())
      .toMatch(/Feed · withdrawn\s+Molted today \(\d\d:\d\d\): no food until \d+ \w{3}\./);
    expect(await dusty.getByRole('button', { name: 'Ate', exact: true }).count()).toBe(0);
    // One molt, one record: the card offers to complete it.
    const prompt = dusty.getByRole('form', {
      name: 'Complete the molt of' + ` ${Number(localDateOf(new Date(), ZONE).slice(8))}`,
      exact: false,
    });
    await prompt.getByLabel('Size after (mm)').fill('48');
    await prompt.getByRole('button', { name: 'Save the molt’s details' }).click();
    await expect.poll(() => prompt.count()).toBe(0);
    await screenshot(page, 'same-day-01-molted-offline');
    await expectAccessible(page, 'today with a withdrawn task');

    // A deliberate second step before feeding a held animal (the More panel is still open).
    expect(await dusty.getByRole('button', { name: 'Molted', exact: true }).count()).toBe(0);
    await dusty.getByRole('button', { name: 'Ate anyway…' }).click();
    const confirm = dusty.getByRole('alertdialog', { name: 'Food is held back' });
    expect(await confirm.innerText()).toMatch(/Molted today/);
    await screenshot(page, 'same-day-02-held-meal-confirm');
    await confirm.getByRole('button', { name: 'Cancel' }).click();

    // The animal page, still offline, says what the round says.
    await openAnimal(page, 'Dusty');
    const schedule = page.getByRole('region', { name: 'Schedule' });
    // A cold start of the app with no signal: the session check waits for its time-out first.
    await schedule.waitFor({ timeout: 60_000 });
    await expect
      .poll(() => schedule.innerText())
      .toMatch(/Molted today \(\d\d:\d\d\): no food until/);
    await screenshot(page, 'same-day-03-animal-page-offline');

    await restoreNetwork(context);
    await expect.poll(() => syncStatus(page), { timeout: 20_000 }).toMatch(/All saved/);
    // After the sync the server's next meal is the day the hold on the card ends.
    await expect
      .poll(() => schedule.innerText(), { timeout: 15_000 })
      .toMatch(/no food until (\d+ \w{3})\.[\s\S]*Next meal\s+\1/);
    const collectionId = (await demoCollectionId(env.server.ctx.database.db))!;
    const [row] = await env.server.ctx.database.db
      .select({ sizeMm: animals.sizeMm })
      .from(animals)
      .where(eq(animals.name, 'Dusty'));
    expect(row!.sizeMm).toBe(48);

    // Bramble is flagged "possible premolt" in the demo; once she molts, insights drop her.
    await page.getByRole('link', { name: 'Today', exact: true }).click();
    const bramble = item(page, 'Bramble');
    await bramble.getByRole('button', { name: 'More…' }).click();
    await bramble.getByRole('button', { name: 'Molted', exact: true }).click();
    await expect.poll(() => bramble.innerText()).not.toMatch(/possible premolt/);
    await page.goto(`${env.server.baseUrl}/breeding`);
    const premolts = page.getByRole('region', { name: 'Possible premolts' });
    await expect.poll(() => premolts.innerText()).not.toMatch(/Bramble/);
    expect(collectionId).toBeTruthy();
    expect(
      consoleErrors.filter((e) => !/ERR_INTERNET_DISCONNECTED|Failed to load resource/.test(e)),
    ).toEqual([]);
    await context.close();
  });

  it('a do-not-feed handover note withdraws the helper’s feed task', async () => {
    const db = env.server.ctx.database.db;
    await startDemoHelpersCover(env.server);
    const owner = await phonePage(env.browser);
    await signInAsDemo(owner.page, env.server.baseUrl, 'owner@northlight.test');
    const collectionId = (await demoCollectionId(db))!;
    const [ember] = await db
      .select({ id: animals.id })
      .from(animals)
      .where(eq(animals.name, 'Ember'));
    const until = addDays(localDateOf(new Date(), ZONE), 3);
    const status = await owner.page.evaluate(
      async ({ collectionId, animalId, until }) =>
        (
          await fetch(`/api/collections/${collectionId}/handover/notes`, {
            method: 'POST',
            headers: { 'Content-Type': 'application/json', 'X-Rackside-Client': '1' },
            body: JSON.stringify({
              animalId,
              text: 'Looks dark: likely premolt.',
              until,
              doNotFeed: true,
            }),
          })
        ).status,
      { collectionId, animalId: ember!.id, until },
    );
    expect(status).toBe(201);
    await owner.context.close();

    const { context, page } = await phonePage(env.browser);
    await signInAsDemo(page, env.server.baseUrl, 'helper@northlight.test');
    const card = item(page, 'Ember');
    await card.waitFor();
    await expect
      .poll(() => card.innerText())
      .toMatch(/Feed · withdrawn\s+Handover note: do not feed through \d+ \w{3}\./);
    expect(await card.getByRole('button', { name: 'Ate', exact: true }).count()).toBe(0);
    await screenshot(page, 'same-day-04-helper-note-hold');
    await expectAccessible(page, 'helper round with a withdrawn task');
    await context.close();
  });
});
