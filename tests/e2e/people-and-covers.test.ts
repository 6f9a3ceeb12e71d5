// People and covers at 360 px: the owner invites a keeper by e-mail and they accept from the
// dev mailbox; a co-owner's invite is cancelled; a cover's days are changed (a wrong order is
// refused on the field); the demo helper's cover is on the cover page, is ended only after a
// confirmation and leaves its summary there and in the mailbox; an old timeline fact asks
// before it is undone. Each changed screen is checked with axe-core in the three themes, and
// photographed at 360 and 1280 px.
import type { Browser, Page } from 'playwright-core';
import { describe, expect, it } from 'vitest';
import { addDays, describeLocalDate, localDateOf } from '#shared/domain/local-dates';
import { DEMO_COLLECTION, DEMO_PASSWORD } from '../../server/access/demo-people';
import {
  expectAccessible,
  phonePage,
  screenshot,
  signInAsDemo,
  startDemoHelpersCover,
  useE2e,
} from './support';

const env = useE2e();
const onThisServer = (link: string) => link.replace(/^https?:\/\/[^/]+/, env.server.baseUrl);
const THEMES = ['light', 'dark', 'night'] as const;

/** axe-core in each theme (the palette is CSS variables on <html data-theme>); back to dark. */
async function accessibleInEveryTheme(page: Page, label: string) {
  for (const theme of THEMES) {
    await page.evaluate((t) => {
      document.documentElement.dataset.theme = t;
    }, theme);
    await expectAccessible(page, `${label} (${theme})`, theme);
  }
  await page.evaluate(() => {
    document.documentElement.dataset.theme = 'dark';
  });
}

/** The same screen on a desktop, for a look at 1280 px. */
async function desktopShot(browser: Browser, path: string, name: string, ready: string) {
  const context = await browser.newContext({ viewport: { width: 1280, height: 900 } });
  const page = await context.newPage();
  await page.goto(`${env.server.baseUrl}/sign-in`);
  await page.getByLabel('E-mail').fill('owner@northlight.test');
  await page.getByLabel('Password').fill(DEMO_PASSWORD);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.waitForURL('**/today');
  await page.goto(`${env.server.baseUrl}${path}`);
  await page.getByRole('heading', { name: ready }).first().waitFor();
  await screenshot(page, name);
  await context.close();
}

describe('people', () => {
  it('invites a keeper by e-mail, who accepts from the dev mailbox; a co-owner’s invite is cancelled', async () => {
    const email = `keeper-${Date.now()}@example.test`;
    const owner = await phonePage(env.browser);
    const page = owner.page;
    await signInAsDemo(page, env.server.baseUrl, 'owner@northlight.test');
    await page.getByRole('link', { name: 'Settings' }).click();
    await page.getByRole('link', { name: 'People: invite a partner or a keeper' }).click();
    await page.getByRole('heading', { name: 'People', exact: true }).waitFor();
    const members = page.getByRole('list', { name: 'Members' });
    await expect.poll(() => members.innerText()).toContain('Sam (partner)');
    await accessibleInEveryTheme(page, 'people');

    await page.getByLabel('Their e-mail').fill(email);
    await page.getByRole('button', { name: 'Send the invite' }).click();
    await page
      .getByText(`We have e-mailed an invite to ${email}. They join when they accept it.`)
      .waitFor();
    const waiting = page.getByRole('list', { name: 'Invites waiting for an answer' });
    await expect.poll(() => waiting.innerText()).toMatch(new RegExp(`${email}[\\s\\S]*Keeper`));
    await expect.poll(() => waiting.innerText()).toContain('link works until');
    await accessibleInEveryTheme(page, 'people with an invite');
    await screenshot(page, 'people-01-invite-sent');

    // The newcomer reads the e-mail in the dev mailbox and follows its link.
    const newcomer = await phonePage(env.browser);
    const n = newcomer.page;
    await n.goto(`${env.server.baseUrl}/dev/mailbox`);
    const mail = n
      .getByRole('article')
      .filter({ hasText: 'invites you to keep Northlight Inverts' })
      .filter({ hasText: email });
    await mail.first().waitFor({ timeout: 15_000 });
    await screenshot(n, 'people-02-mailbox');
    const href = await mail
      .first()
      .getByRole('link', { name: /\/join\?token=/ })
      .getAttribute('href');
    await n.goto(onThisServer(href!));
    await n.getByRole('heading', { name: 'Keep Northlight Inverts' }).waitFor();
    await n.getByLabel('Your name').fill('Kit');
    await n.getByLabel('Password').fill('kit keeps the slings');
    await accessibleInEveryTheme(n, 'join');
    await n.getByRole('button', { name: 'Accept the invite' }).click();
    await n.waitForURL('**/today');
    await expect.poll(() => n.getByText('Northlight Inverts').first().isVisible()).toBe(true);

    // The owner sees Kit as a keeper, and the invite no longer waits.
    await page.reload();
    await expect.poll(() => members.innerText()).toMatch(/Kit · Keeper/);
    await expect.poll(() => waiting.innerText()).not.toContain(email);

    // A partner's invite as co-owner, thought better of: cancelled after a confirmation.
    const partner = `partner-${Date.now()}@example.test`;
    await page.getByText('Co-owner (partner)').click();
    await page.getByText('also invites people, arranges covers', { exact: false }).waitFor();
    await page.getByLabel('Their e-mail').fill(partner);
    await page.getByRole('button', { name: 'Send the invite' }).click();
    await expect.poll(() => waiting.innerText()).toContain(partner);
    await page.getByRole('button', { name: `Cancel the invite to ${partner}…` }).click();
    await page
      .getByText(`Cancel the invite to ${partner}? Their link will stop working.`)
      .waitFor();
    await accessibleInEveryTheme(page, 'people, cancelling an invite');
    await screenshot(page, 'people-03-cancel');
    await page.getByRole('button', { name: 'Cancel the invite', exact: true }).click();
    await expect.poll(() => waiting.innerText()).not.toContain(partner);
    const cancelled = await env.server.ctx.mailbox.waitFor(
      (m) => m.to.includes(partner) && m.subject.includes('invites you to co-own'),
    );
    const preview = await n.request.get(
      `${env.server.baseUrl}/api/cover-invites/preview?token=${/token=([\w-]+)/.exec(cancelled.text)![1]}`,
    );
    expect(preview.status()).toBe(400);

    await desktopShot(env.browser, '/settings/people', 'people-04-desktop', 'People');
    expect(owner.consoleErrors).toEqual([]);
    expect(newcomer.consoleErrors).toEqual([]);
    await owner.context.close();
    await newcomer.context.close();
    // Axe in three themes on five screens, two browsers and a desktop look: longer than most.
  }, 300_000);
});

describe('covers', () => {
  it('lists the demo helper’s cover, changes a cover’s days, ends one after a confirmation and shows its summary', async () => {
    const today = localDateOf(new Date(), DEMO_COLLECTION.timeZone);
    const owner = await phonePage(env.browser);
    const page = owner.page;
    await signInAsDemo(page, env.server.baseUrl, 'owner@northlight.test');
    await page.goto(`${env.server.baseUrl}/cover`);
    const covers = page.getByRole('list', { name: 'Covers' });
    // The demo helper accepted a cover starting the Friday after today.
    const alex = covers.getByRole('listitem', { name: /Alex \(helper\), Starts soon/ });
    await alex.waitFor();
    expect(await alex.innerText()).toMatch(/\w{3} \d{1,2} \w{3} to \w{3} \d{1,2} \w{3} \d{4}/);

    // A new cover, then new days for it: the wrong order is refused on the field.
    const email = `sitter-${Date.now()}@example.test`;
    await page.getByLabel('Their e-mail').fill(email);
    await page.getByRole('button', { name: 'Send the invite' }).click();
    await page.getByText(`Invite sent to ${email}.`).waitFor();
    const card = covers.getByRole('listitem', { name: new RegExp(`${email}, Invited`) });
    await card.getByRole('button', { name: 'Change days…' }).click();
    const form = card.getByRole('form', { name: `New days for ${email}` });
    await form.getByLabel('First day').fill(addDays(today, 3));
    await form.getByLabel('Last day').fill(addDays(today, 1));
    await form.getByRole('button', { name: 'Save the days' }).click();
    await form.getByText('The last day comes on or after the first day.').waitFor();
    await accessibleInEveryTheme(page, 'cover, changing days');
    await screenshot(page, 'covers-01-change-days');
    await form.getByLabel('Last day').fill(addDays(today, 6));
    await form.getByRole('button', { name: 'Save the days' }).click();
    await expect
      .poll(() => card.innerText())
      .toContain(
        `${describeLocalDate(addDays(today, 3))} to ${describeLocalDate(addDays(today, 6), true)}`,
      );
    await card.getByRole('button', { name: 'Send the invite again' }).click();
    await card.getByText(`A new invite went to ${email}.`).waitFor();
    await expect
      .poll(() => env.server.ctx.mailbox.messages.filter((m) => m.to.includes(email)).length)
      .toBe(2);

    // The demo helper's cover runs now; the owner ends it, but only after saying so.
    await startDemoHelpersCover(env.server);
    await page.reload();
    const running = covers.getByRole('listitem', { name: /Alex \(helper\), Running now/ });
    await running.getByRole('button', { name: 'End this cover now…' }).click();
    const confirm = running.getByRole('group', { name: 'End the cover' });
    await confirm
      .getByText('taps still on their phone will not be saved', { exact: false })
      .waitFor();
    await accessibleInEveryTheme(page, 'cover, confirming the end');
    await screenshot(page, 'covers-02-confirm-end');
    await confirm.getByRole('button', { name: 'Keep it running' }).click();
    expect(await running.getByRole('group', { name: 'End the cover' }).count()).toBe(0);
    await running.getByRole('button', { name: 'End this cover now…' }).click();
    await confirm.getByRole('button', { name: 'End the cover' }).click();

    const ended = covers.getByRole('listitem', { name: /Alex \(helper\), Ended/ });
    await ended.getByText('Summary of the cover').click();
    await expect.poll(() => ended.innerText()).toContain('Alex (helper)’s cover is over');
    await expect.poll(() => ended.innerText()).toContain('In numbers');
    await expect.poll(() => ended.innerText()).toContain('Handover notes for this cover');
    await accessibleInEveryTheme(page, 'cover with its summary');
    await screenshot(page, 'covers-03-summary');
    const mailed = await env.server.ctx.mailbox.waitFor(
      (m) =>
        m.to.includes('owner@northlight.test') &&
        m.subject.includes('summary of Alex (helper)’s cover'),
    );
    expect(mailed.text).toContain('In numbers');

    await desktopShot(env.browser, '/cover', 'covers-04-desktop', 'Cover for a helper');
    expect(owner.consoleErrors).toEqual([]);
    await owner.context.close();
  }, 300_000);
});

describe('the timeline', () => {
  it('asks before undoing a fact from an earlier day, and says what will change', async () => {
    const owner = await phonePage(env.browser);
    const page = owner.page;
    await signInAsDemo(page, env.server.baseUrl, 'owner@northlight.test');
    await page.getByRole('link', { name: 'Animals', exact: true }).click();
    await page.getByLabel('Find', { exact: true }).fill('Juniper');
    await page.getByRole('link', { name: 'Juniper' }).first().click();
    const history = page.getByRole('region', { name: 'Timeline' });
    const older = history.getByRole('button', { name: /^Undo .+…$/ }).first();
    await older.waitFor();
    const label = (await older.getAttribute('aria-label'))!;
    const undoneBefore = await history.getByText('· undone', { exact: false }).count();
    await older.click();
    const confirm = history.getByRole('group', { name: /^Undo .+\?$/ });
    await confirm
      .getByText('The entry stays in the timeline, crossed out.', { exact: false })
      .waitFor();
    await accessibleInEveryTheme(page, 'timeline, confirming an undo');
    await screenshot(page, 'timeline-01-confirm-undo');
    await confirm.getByRole('button', { name: 'Keep it' }).click();
    // Nothing was undone: the same button is back.
    await history.getByRole('button', { name: label }).waitFor();
    expect(await history.getByText('· undone', { exact: false }).count()).toBe(undoneBefore);
    expect(owner.consoleErrors).toEqual([]);
    await owner.context.close();
  });
});
