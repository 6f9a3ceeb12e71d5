// Issue 8's end-to-end check at 360 px: a molt with its size draws the growth chart; an egg sac
// becomes a tray of slings, straight to their labels. Breeding follows the group: the female
// picker lists only females of groups that have a sac, case or brood, and its words follow hers.
import { describe, expect, it } from 'vitest';
import { expectAccessible, phonePage, screenshot, signInAsDemo, useE2e } from './support';

const env = useE2e();

describe('growth and breeding at 360 px', () => {
  it('records a molt and shows the chart; records a sac, pots up its slings and prints their labels', async () => {
    const { page, consoleErrors } = await phonePage(env.browser);
    await signInAsDemo(page, env.server.baseUrl, 'owner@northlight.test');
    await page.getByRole('link', { name: 'Animals', exact: true }).click();
    await page.getByLabel('Find', { exact: true }).fill('Juniper');
    await page.getByRole('link', { name: 'Juniper' }).click();

    const molt = page.getByRole('form', { name: 'Record a molt' });
    await molt.getByLabel('Size after (mm)').fill('136');
    await molt.getByLabel('The exuviae shows').selectOption('female');
    await molt.getByRole('button', { name: 'Record the molt' }).click();
    // Once recorded, the form completes that same molt (one molt, one record) and says so.
    await expect.poll(() => page.getByText('Molt recorded.').count()).toBe(1);
    expect(await page.getByRole('form', { name: /^Complete the molt of / }).count()).toBe(1);
    // Once the molt is synced, the history has it and the chart draws it.
    const chart = page.getByRole('img', { name: /Leg span after each molt: .*136 mm/ });
    await expect.poll(() => chart.count(), { timeout: 20_000 }).toBe(1);
    await expect.poll(() => page.getByText(/Leg span 136 mm/).count(), { timeout: 10_000 }).toBe(1);
    await expectAccessible(page, 'animal with growth');
    await chart.scrollIntoViewIfNeeded();
    await screenshot(page, 'breeding-01-growth');

    await page.getByRole('link', { name: 'Animals', exact: true }).click();
    await page.getByText('More', { exact: true }).click();
    await page.getByRole('link', { name: 'Breeding' }).click();
    const juniper = (
      await page.getByLabel('Female', { exact: true }).locator('option').allInnerTexts()
    ).find((t) => t.startsWith('Juniper ('))!;
    await page.getByLabel('Female', { exact: true }).selectOption({ label: juniper });
    await page.getByLabel('Clutch name').fill('Juniper sac E2E');
    await page.getByRole('button', { name: 'Record the sac' }).click();
    const sac = page
      .getByRole('list', { name: 'Egg sacs' })
      .getByRole('listitem')
      .filter({ hasText: 'Juniper sac E2E' });
    await sac.waitFor();
    await sac.getByRole('button', { name: 'Pot up slings…' }).click();
    const pot = page.getByRole('form', { name: 'Pot up slings from Juniper sac E2E' });
    await pot.getByLabel('How many').fill('12');
    // A new room, rack and tray, named down the tree.
    await pot.getByLabel('Room').selectOption({ label: '＋ New room…' });
    await pot.getByLabel('Room (new)').fill('Sling room');
    await pot.getByLabel('Rack (new)').fill('S');
    await pot.getByLabel('Shelf or tray (new)').fill('T1');
    await expectAccessible(page, 'breeding');
    await screenshot(page, 'breeding-02-pot-up');
    await pot.getByRole('button', { name: 'Create 12 slings' }).click();
    await page.waitForURL('**/labels');
    await expect
      .poll(() => page.getByText(/^12 labels on 1 sheet/).count(), { timeout: 10_000 })
      .toBe(1);
    await screenshot(page, 'breeding-03-labels');
    expect(consoleErrors).toEqual([]);
  });

  it('offers only females that can breed, and records a scorpion’s brood in its own words', async () => {
    const { page, consoleErrors } = await phonePage(env.browser);
    await signInAsDemo(page, env.server.baseUrl, 'owner@northlight.test');
    await page.getByRole('link', { name: 'Animals', exact: true }).click();
    await page.getByText('More', { exact: true }).click();
    await page.getByRole('link', { name: 'Breeding' }).click();
    const picker = page.getByLabel('Female', { exact: true });
    await picker.waitFor();
    const options = await picker.locator('option').allInnerTexts();
    // The demo's mature male, its centipede and juveniles of unknown sex, and its slings are not offered.
    for (const name of ['Blue Jay', 'Rattler', 'Verdi', 'Tiger', 'Pebble'])
      expect(options.some((o) => o.startsWith(`${name} (`))).toBe(false);
    expect(options.some((o) => o.startsWith('Juniper ('))).toBe(true);
    const form = page.getByRole('form', { name: /^Record / });
    expect(await form.getByRole('heading').innerText()).toBe('Record an egg sac');

    await picker.selectOption({ label: options.find((o) => o.endsWith('· Scorpion'))! });
    expect(await form.getByRole('heading').innerText()).toBe('Record a brood');
    await form.getByLabel('Scorplings').fill('31');
    await form.getByLabel('Clutch name').fill('Scorplings E2E');
    await form.getByRole('button', { name: 'Record the brood' }).click();
    const brood = page
      .getByRole('list', { name: /Egg sacs/ })
      .getByRole('listitem')
      .filter({ hasText: 'Scorplings E2E' });
    await brood.waitFor();
    expect(await brood.innerText()).toMatch(
      /Brood[\s\S]*Born on [A-Z][a-z]{2}[^·]+ · likely to disperse from [^·]+ to [^·]+[\s\S]*Scorplings 31/,
    );
    await brood.getByRole('button', { name: 'Update…' }).click();
    expect(await brood.getByLabel('Dispersed on').count()).toBe(1);
    expect(await brood.getByLabel('Pulled on').count()).toBe(0);
    await expectAccessible(page, 'breeding by group');
    await screenshot(page, 'breeding-04-scorpion-brood');
    expect(consoleErrors).toEqual([]);
  });
});
