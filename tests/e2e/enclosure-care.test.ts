// Enclosure care on Today (docs/care-rules.md § Enclosure care): the demo's misting, spot-clean
// and rehouse tasks recorded with no signal, kept across a reload, and saved exactly once.
import { eq, gte } from 'drizzle-orm';
import type { Page } from 'playwright-core';
import { describe, expect, it } from 'vitest';
import { animals, events } from '../../server/db/schema/animals';
import { cutNetwork, restoreNetwork, underServiceWorker } from '../chromium';
import { expectAccessible, phonePage, screenshot, signInAsDemo, useE2e } from './support';

const env = useE2e();

const syncStatus = (page: Page) =>
  page
    .getByRole('status')
    .filter({ hasText: /saved|waiting|Saving|attention/ })
    .first()
    .innerText();
const item = (page: Page, name: string) =>
  page.getByRole('article', { name: new RegExp(`^${name},`) });

describe('enclosure care on today’s round', () => {
  it('mists, spot-cleans and rehouses offline, keeps them across a reload, and saves each once', async () => {
    const started = new Date();
    const { context, page, consoleErrors } = await phonePage(env.browser);
    await signInAsDemo(page, env.server.baseUrl, 'owner@northlight.test');
    await underServiceWorker(page);
    // The mantis is misted every 2 days, Rusty is due a spot-clean, and Stripes outgrew its tub
    // at its last molt (server/seed/demo.ts).
    await item(page, 'Mantra').waitFor();
    expect(await item(page, 'Mantra').innerText()).toMatch(/Mist[\s\S]*drinks the droplets/);
    expect(await item(page, 'Rusty').innerText()).toMatch(/Spot-clean/);
    expect(await item(page, 'Stripes').innerText()).toMatch(
      /Rehouse[\s\S]*Outgrown its enclosure since the molt on/,
    );
    await expect.poll(() => syncStatus(page)).toMatch(/All saved/);
    await expectAccessible(page, 'today with enclosure care');
    await item(page, 'Stripes').scrollIntoViewIfNeeded();
    await screenshot(page, 'enclosure-01-today-360');

    await cutNetwork(context);
    await item(page, 'Mantra').getByRole('button', { name: 'Misted', exact: true }).click();
    await item(page, 'Rusty').getByRole('button', { name: 'Spot-cleaned', exact: true }).click();
    await item(page, 'Stripes').getByRole('button', { name: 'Rehoused', exact: true }).click();
    await expect.poll(() => syncStatus(page), { timeout: 10_000 }).toMatch(/Offline · 3 waiting/);

    await page.reload();
    await page
      .locator('label')
      .filter({ has: page.getByRole('radio', { name: /^All/ }) })
      .click();
    await item(page, 'Mantra').waitFor();
    expect(await item(page, 'Mantra').innerText()).toMatch(/✓ Misted/);
    expect(await item(page, 'Rusty').innerText()).toMatch(/✓ Spot-cleaned/);
    expect(await item(page, 'Stripes').innerText()).toMatch(/✓ Rehoused/);
    await expect.poll(() => syncStatus(page), { timeout: 10_000 }).toMatch(/3 waiting/);
    await expectAccessible(page, 'enclosure care offline');
    await item(page, 'Stripes').scrollIntoViewIfNeeded();
    await screenshot(page, 'enclosure-02-offline-after-reload-360');

    await restoreNetwork(context);
    await expect.poll(() => syncStatus(page), { timeout: 20_000 }).toMatch(/All saved/);
    const saved = await env.server.ctx.database.db
      .select({ kind: events.kind, name: animals.name })
      .from(events)
      .innerJoin(animals, eq(animals.id, events.animalId))
      .where(gte(events.serverReceivedAt, started));
    expect(saved.map((e) => `${e.name} ${e.kind}`).sort()).toEqual([
      'Mantra misted',
      'Rusty spot_cleaned',
      'Stripes rehoused',
    ]);

    await page.setViewportSize({ width: 1280, height: 900 });
    await item(page, 'Stripes').scrollIntoViewIfNeeded();
    await screenshot(page, 'enclosure-03-saved-1280');
    expect(
      consoleErrors.filter((e) => !/ERR_INTERNET_DISCONNECTED|Failed to load resource/.test(e)),
    ).toEqual([]);
    await context.close();
  });
});
