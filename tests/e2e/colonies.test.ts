import { eq } from 'drizzle-orm';
import type { Page } from 'playwright-core';
import { describe, expect, it } from 'vitest';
import { chores } from '../../server/db/schema/colonies';
import { cutNetwork, restoreNetwork, underServiceWorker } from '../chromium';
import { expectAccessible, phonePage, screenshot, signInAsDemo, useE2e } from './support';

const env = useE2e();

const syncStatus = (page: Page) =>
  page
    .getByRole('status')
    .filter({ hasText: /saved|waiting|Saving|attention/ })
    .first()
    .innerText();

describe('feeder colonies at 360 × 740', () => {
  it('a colony chore recorded offline is saved once, and shown done across a reload', async () => {
    const { context, page, consoleErrors } = await phonePage(env.browser);
    await signInAsDemo(page, env.server.baseUrl, 'owner@northlight.test');

    // Today: the colonies' care due, one tap each — here with no signal.
    await underServiceWorker(page);
    const section = page.getByRole('region', { name: 'Colonies' });
    const feed = section.getByRole('button', { name: /^Feed\W*Dubia colony/ });
    await feed.waitFor();
    await expectAccessible(page, 'today with colonies');
    await screenshot(page, 'colonies-01-today');
    const fedOnServer = async () =>
      (await env.server.ctx.database.db.select().from(chores).where(eq(chores.kind, 'feed')))
        .filter((c) => c.deviceId !== 'demo-seed')
        .map((c) => c.subjectKind);
    await cutNetwork(context);
    await feed.click();
    await section.getByText('Feed done').waitFor();
    await expect.poll(() => syncStatus(page), { timeout: 10_000 }).toMatch(/Offline · 1 waiting/);
    // A reload with no signal keeps it done, from the phone's own copy.
    await page.reload();
    await section.getByText(/Feed done[\s\S]*on this phone/).waitFor();
    expect(await fedOnServer()).toEqual([]);
    await screenshot(page, 'colonies-01b-offline-chore');
    // The signal returns: sent once, and shown done from then on.
    await restoreNetwork(context);
    await page.getByRole('button', { name: 'Sync now' }).click();
    await expect.poll(fedOnServer).toEqual(['colony']);
    await expect.poll(() => syncStatus(page)).toMatch(/All saved/);
    await page.reload();
    await section.getByText('Feed done').waitFor();
    expect(await section.getByRole('button', { name: /^Feed\W*Dubia colony/ }).count()).toBe(0);
    expect(await fedOnServer()).toEqual(['colony']);
    // Today's prep list draws on the colonies too.
    await page.getByText('Today’s prep list').click();
    await page.getByRole('row').filter({ hasText: 'Pull from Cricket bin' }).first().waitFor();

    expect(consoleErrors).toEqual([]);
    await context.close();
  }, 45_000);

  it('tomorrow’s prep list names the colony that runs short, until a count refills it', async () => {
    const { context, page, consoleErrors } = await phonePage(env.browser);
    await signInAsDemo(page, env.server.baseUrl, 'owner@northlight.test');

    // Tomorrow: the large crickets come from the cricket bin, which holds too few.
    await page.getByRole('link', { name: 'Tomorrow' }).click();
    await page.waitForURL('**/tomorrow');
    const warning = page.getByRole('status').filter({ hasText: 'The colonies run short' });
    await warning.waitFor();
    expect(await warning.innerText()).toMatch(
      /Needs \d+ large cricket; the colonies hold 7 \(Cricket bin 7\): \d+ short/,
    );
    const row = page.getByRole('row').filter({ hasText: 'large' });
    expect(await row.innerText()).toMatch(/Pull from Cricket bin \(7\)[\s\S]*short/);
    await expectAccessible(page, 'tomorrow with colonies');
    await screenshot(page, 'colonies-02-tomorrow-short');
    await page.setViewportSize({ width: 1280, height: 800 });
    await screenshot(page, 'colonies-02-tomorrow-short-1280');
    await page.setViewportSize({ width: 360, height: 740 });

    // The cricket bin's page: its stock, a quick count, its stock over time.
    await page.getByRole('link', { name: 'Feeder colonies' }).click();
    await page.getByRole('link', { name: /Cricket bin/ }).click();
    await page.getByRole('heading', { name: 'Stock over time' }).waitFor();
    await page.getByRole('img', { name: /Stock over time/ }).waitFor();
    await page.getByLabel('large', { exact: true }).fill('30');
    await page.getByRole('button', { name: 'Save counts' }).click();
    await page.getByText('Counts saved.').waitFor();
    await expectAccessible(page, 'colony page');
    await screenshot(page, 'colonies-03-cricket-bin');
    await page.goto(`${env.server.baseUrl}/tomorrow`);
    await page.getByRole('row').filter({ hasText: 'Pull from Cricket bin' }).first().waitFor();
    expect(await page.getByText('The colonies run short').count()).toBe(0);

    expect(consoleErrors).toEqual([]);
    await context.close();
  }, 45_000);
});
