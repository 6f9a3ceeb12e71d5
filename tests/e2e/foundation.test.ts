import { describe, expect, it } from 'vitest';
import { DEMO_PASSWORD } from '../../server/access/demo-people';
import { expectAccessible, phonePage, screenshot, useE2e } from './support';

const env = useE2e();

describe('the app shell at 360 × 740', () => {
  it('signs in as the demo owner, shows the demo collection, switches themes and signs out', async () => {
    const { context, page, consoleErrors } = await phonePage(env.browser);
    await page.goto(`${env.server.baseUrl}/today`);
    await page.waitForURL('**/sign-in');
    await expect.poll(() => page.getByText('Demo accounts').isVisible()).toBe(true);
    await expectAccessible(page, 'sign-in');
    await screenshot(page, 'foundation-01-sign-in');

    await page.getByLabel('E-mail').fill('owner@northlight.test');
    await page.getByLabel('Password').fill(DEMO_PASSWORD);
    // The typed password can be checked before signing in (OWASP ASVS 4.0.3 2.1.12).
    await page.getByRole('button', { name: 'Show password' }).click();
    expect(await page.getByLabel('Password').getAttribute('type')).toBe('text');
    expect(
      await page.getByRole('button', { name: 'Hide password' }).getAttribute('aria-pressed'),
    ).toBe('true');
    await screenshot(page, 'foundation-01b-password-shown');
    await page.getByRole('button', { name: 'Hide password' }).click();
    expect(await page.getByLabel('Password').getAttribute('type')).toBe('password');
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.waitForURL('**/today');
    await expect.poll(() => page.getByText('Northlight Inverts').first().isVisible()).toBe(true);
    await expect.poll(() => page.getByRole('article', { name: /Juniper/ }).isVisible()).toBe(true);
    await expectAccessible(page, 'today');
    await screenshot(page, 'foundation-02-today-dark');
    await page.getByRole('link', { name: 'Animals', exact: true }).click();
    await page.waitForURL('**/animals');
    await expect.poll(() => page.getByText('43 of 43 animals').count()).toBe(1);

    await page.getByRole('link', { name: 'Settings' }).click();
    await page.waitForURL('**/settings');
    for (const [label, theme] of [
      ['Light', 'light'],
      ['Night (red)', 'night'],
      ['Dark', 'dark'],
    ] as const) {
      await page.getByLabel(label, { exact: false }).first().check();
      expect(await page.evaluate(() => document.documentElement.dataset.theme)).toBe(theme);
      await expectAccessible(page, `settings-${theme}`, theme);
      await screenshot(page, `foundation-03-settings-${theme}`);
    }
    // The choice survives a reload.
    await page.getByLabel('Night (red)').check();
    await page.reload();
    expect(await page.evaluate(() => document.documentElement.dataset.theme)).toBe('night');
    await page.goto(`${env.server.baseUrl}/today`);
    await screenshot(page, 'foundation-04-today-night');
    await page.goto(`${env.server.baseUrl}/settings`);

    await page.getByRole('button', { name: 'Sign out' }).click();
    await page.waitForURL('**/sign-in');
    await page.goto(`${env.server.baseUrl}/today`);
    await page.waitForURL('**/sign-in');
    expect(consoleErrors).toEqual([]);
    await context.close();
  });

  it('keeps every control at least 48 px for gloved thumbs', async () => {
    const { context, page } = await phonePage(env.browser);
    await page.goto(`${env.server.baseUrl}/sign-in`);
    await page.getByLabel('E-mail').fill('owner@northlight.test');
    await page.getByLabel('Password').fill(DEMO_PASSWORD);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.waitForURL('**/today');
    for (const route of ['/today', '/tomorrow', '/animals', '/settings', '/settings/rules']) {
      await page.goto(`${env.server.baseUrl}${route}`);
      await page.getByRole('navigation', { name: 'Main' }).waitFor();
      const small = await page.$$eval(
        'button, a, input[type=radio], input[type=text], input[type=email], input[type=password], input[type=search]',
        (els) =>
          els
            .map((el) => {
              const target = el.matches('input[type=radio]') ? (el.closest('label') ?? el) : el;
              const r = target.getBoundingClientRect();
              return { what: el.outerHTML.slice(0, 80), w: r.width, h: r.height };
            })
            .filter((r) => r.w > 0 && (r.w < 48 || r.h < 48)),
      );
      expect(small, route).toEqual([]);
    }
    // Nothing scrolls sideways at 360 px.
    expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(
      360,
    );
    await context.close();
  });

  it('resets a password through the dev mailbox link', async () => {
    const { context, page } = await phonePage(env.browser);
    await page.goto(`${env.server.baseUrl}/forgot-password`);
    await page.getByLabel('E-mail').fill('partner@northlight.test');
    await page.getByRole('button', { name: 'Send me a reset link' }).click();
    await expect.poll(() => page.getByText(/a reset link is on its way/).isVisible()).toBe(true);
    await page.goto(`${env.server.baseUrl}/dev/mailbox`);
    const link = page.getByRole('link', { name: /reset-password\?token=/ });
    await link.first().waitFor();
    await expectAccessible(page, 'mailbox');
    await screenshot(page, 'foundation-05-mailbox');
    const href = (await link.first().getAttribute('href'))!;
    await page.goto(href.replace(/^https?:\/\/[^/]+/, env.server.baseUrl));
    await page.getByLabel('New password', { exact: true }).fill('a new partner password');
    await page.getByLabel('New password again').fill('a new partner password');
    await page.getByRole('button', { name: 'Save new password' }).click();
    await expect.poll(() => page.getByText(/Your password is changed/).isVisible()).toBe(true);
    await page.goto(`${env.server.baseUrl}/sign-in`);
    await page.getByLabel('E-mail').fill('partner@northlight.test');
    await page.getByLabel('Password').fill('a new partner password');
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.waitForURL('**/today');
    await context.close();
  });
});
