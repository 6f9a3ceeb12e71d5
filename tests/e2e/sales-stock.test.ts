import { describe, expect, it } from 'vitest';
import { expectAccessible, phonePage, screenshot, signInAsDemo, useE2e } from './support';

const env = useE2e();

describe('stock for sale at 360 × 740', () => {
  it('offers a clutch in bulk, publishes the list, and a stranger reads it without signing in', async () => {
    const { context, page, consoleErrors } = await phonePage(env.browser);
    await signInAsDemo(page, env.server.baseUrl, 'owner@northlight.test');
    await page.goto(`${env.server.baseUrl}/sales/stock`);
    await page.getByRole('heading', { name: 'Stock for sale' }).waitFor();
    // The demo offers half the clutch.
    const group = page.getByRole('listitem').filter({ hasText: 'Hapalopus formosus · Sling' });
    await group.getByText('12 available · 0 reserved').waitFor();

    // The whole clutch at one price, typed as text.
    const offer = page.getByRole('region', { name: 'Offer a clutch' });
    await offer.getByLabel('Clutch').selectOption('H. formosus sac 1');
    await offer.getByLabel('Price').fill('22.50');
    await offer.getByLabel('Currency').selectOption('CAD');
    await offer.getByRole('button', { name: 'Offer the clutch' }).click();
    await offer.getByText('24 offered.').waitFor();
    await group.getByText('24 available · 0 reserved').waitFor();
    expect(await group.innerText()).toMatch(/22\.50/);
    await screenshot(page, 'sales-stock-01-groups');

    // The public list: off by default; on, with its own link, in the sales settings.
    await page.getByRole('link', { name: 'Public availability list: settings and link' }).click();
    const settings = page.getByRole('region', { name: 'Public availability list' });
    await settings.getByLabel('Publish the list').check();
    await settings.getByLabel('Note on the list').fill('We ship on Mondays, heat packs in winter.');
    await settings.getByRole('button', { name: 'Save list settings' }).click();
    const link = settings.getByLabel(/^Link/);
    await link.waitFor();
    const url = await link.inputValue();
    expect(url).toMatch(/\/available\/[A-Za-z0-9_-]{32}$/);
    await settings.scrollIntoViewIfNeeded();
    await expectAccessible(page, 'availability settings');
    await screenshot(page, 'sales-stock-02-availability-settings');
    await page.setViewportSize({ width: 1280, height: 800 });
    await page.goBack();
    await page.getByRole('heading', { name: 'Stock for sale' }).scrollIntoViewIfNeeded();
    await screenshot(page, 'sales-stock-03-groups-1280');
    expect(consoleErrors).toEqual([]);
    await context.close();

    // A stranger: a fresh browser context, no session.
    const stranger = await phonePage(env.browser);
    await stranger.page.goto(url);
    await stranger.page.getByRole('heading', { name: 'Northlight Inverts' }).waitFor();
    await stranger.page.getByText('We ship on Mondays, heat packs in winter.').waitFor();
    const card = stranger.page.getByRole('listitem').filter({ hasText: 'Hapalopus formosus' });
    expect(await card.innerText()).toMatch(/Sling[\s\S]*22\.50[\s\S]*24/);
    // No app chrome: no navigation, no sign-in prompt.
    expect(await stranger.page.getByRole('navigation').count()).toBe(0);
    const csv = stranger.page.getByRole('link', { name: 'Download as CSV' });
    expect(await csv.getAttribute('href')).toMatch(
      /\/api\/available\/[A-Za-z0-9_-]{32}\/list\.csv$/,
    );
    await expectAccessible(stranger.page, 'public availability list');
    await screenshot(stranger.page, 'sales-stock-04-public-list');
    await stranger.page.setViewportSize({ width: 1280, height: 800 });
    await screenshot(stranger.page, 'sales-stock-05-public-list-1280');
    expect(stranger.consoleErrors).toEqual([]);
    await stranger.context.close();
  }, 45_000);

  it('an animal’s page shows its price to the keeper, who changes it there', async () => {
    const { context, page, consoleErrors } = await phonePage(env.browser);
    await signInAsDemo(page, env.server.baseUrl, 'owner@northlight.test');
    await page.goto(`${env.server.baseUrl}/sales/stock`);
    await page.getByRole('link', { name: /^Formosus 02/ }).click();
    const panel = page.getByRole('region', { name: 'For sale' });
    await panel.getByText(/ · available/).waitFor();
    expect(
      await panel.getByRole('link', { name: 'Care sheet (PDF)' }).getAttribute('href'),
    ).toMatch(/\/animals\/[0-9a-f-]{36}\/care-sheet\.pdf$/);
    await panel.getByRole('button', { name: 'Change price' }).click();
    await panel.getByLabel('Price').fill('30');
    await panel.getByRole('button', { name: 'Save price' }).click();
    await panel.getByText(/CA\$30\.00 · available/).waitFor();
    await panel.scrollIntoViewIfNeeded();
    await expectAccessible(page, 'animal for sale');
    await screenshot(page, 'sales-stock-06-animal-for-sale');
    expect(consoleErrors).toEqual([]);
    await context.close();
  }, 45_000);
});
