import type { Page } from 'playwright-core';
import { describe, expect, it } from 'vitest';
import { expectAccessible, phonePage, screenshot, useE2e, signInAsDemo } from './support';

const env = useE2e();

const signIn = (page: Page, email: string) => signInAsDemo(page, env.server.baseUrl, email);

describe('the round screens at 360 × 740', () => {
  it('shows today with reasons, tomorrow with its prep list, the rules, and an animal’s schedule', async () => {
    const { context, page, consoleErrors } = await phonePage(env.browser);
    await signIn(page, 'owner@northlight.test');

    const bramble = page.getByRole('article', { name: /Bramble/ });
    await bramble.waitFor();
    const brambleText = await bramble.innerText();
    expect(brambleText, brambleText).toMatch(/2 refusals in a row/);
    expect(await page.getByRole('article', { name: /Formosus 04/ }).innerText()).toMatch(
      /Remove prey[\s\S]*Prey left in on/,
    );
    expect(
      await page.getByRole('progressbar', { name: 'Round progress' }).getAttribute('aria-valuenow'),
    ).toBe('0');
    await screenshot(page, 'rounds-01-today');

    await page.getByRole('link', { name: 'Tomorrow' }).click();
    await page.waitForURL('**/tomorrow');
    const prep = page.getByRole('table');
    await prep.waitFor();
    expect(await prep.innerText()).toMatch(/cricket/);
    await expectAccessible(page, 'tomorrow');
    await screenshot(page, 'rounds-02-tomorrow');
    // Print view: no navigation on paper.
    await page.emulateMedia({ media: 'print' });
    expect(await page.getByRole('navigation', { name: 'Main' }).isVisible()).toBe(false);
    await page.emulateMedia({ media: 'screen' });

    await page.goto(`${env.server.baseUrl}/settings/rules`);
    const adult = page.getByLabel('Adult (refusals)', { exact: true });
    await adult.waitFor();
    expect(await adult.inputValue()).toBe('2');
    await expectAccessible(page, 'rules');
    await screenshot(page, 'rounds-03-rules');
    await page.getByLabel('Adult (days)', { exact: true }).first().fill('-4');
    await page.getByRole('button', { name: 'Save rules' }).click();
    await expect
      .poll(() =>
        page.getByText('The tarantula adult interval must be at least 1 day.').isVisible(),
      )
      .toBe(true);
    await page.getByLabel('Adult (days)', { exact: true }).first().fill('10');
    await page.getByRole('button', { name: 'Save rules' }).click();
    await expect.poll(() => page.getByText(/Rules saved/).isVisible()).toBe(true);
    // Each group has its own profile, under its own stage names (docs/care-rules.md § Care profiles).
    await page.getByLabel('Care profile of').selectOption('mantis');
    expect(await page.getByLabel('Nymph L1–L3 (days)', { exact: true }).first().inputValue()).toBe(
      '2',
    );

    await page.getByRole('link', { name: 'Animals' }).click();
    await page.getByLabel('Find', { exact: true }).fill('Goliath');
    await page.getByRole('link', { name: 'Goliath Jr' }).click();
    await page.waitForURL('**/animals/*');
    const schedule = page.getByRole('region', { name: 'Schedule' });
    await schedule.waitFor();
    expect(await schedule.innerText()).toMatch(/Post-molt hold until/);
    await expectAccessible(page, 'animal');
    await screenshot(page, 'rounds-04-animal');
    await page.getByLabel('Feed every (days)').fill('0');
    await page.getByRole('button', { name: 'Save care settings' }).click();
    await expect
      .poll(() => page.getByText('The interval must be at least 1 day.').isVisible())
      .toBe(true);
    expect(consoleErrors).toEqual([]);
    await context.close();
  });
});
