// The dead ends a keeper and a helper used to hit, at 360 px: a label link leads on to the
// animal's record; a helper covering the feeds reports an escape and the owner has it by
// e-mail (the dev mailbox) and on Today; anyone signed in can start a new collection.
import type { Page } from 'playwright-core';
import { describe, expect, it } from 'vitest';
import type { RoundResponse } from '#shared/schemas/rounds';
import { demoCollectionId } from '../../server/seed/demo';
import {
  expectAccessible,
  phonePage,
  screenshot,
  signInAsDemo,
  startDemoHelpersCover,
  useE2e,
} from './support';

const env = useE2e();

async function api<T>(page: Page, url: string): Promise<T> {
  return page.evaluate(
    async (u) => (await fetch(u, { headers: { 'X-Rackside-Client': '1' } })).json(),
    url,
  ) as Promise<T>;
}

describe('from the rack to the record', () => {
  it('a label link shows the item and “Open record” opens the animal’s page', async () => {
    const { context, page } = await phonePage(env.browser);
    await signInAsDemo(page, env.server.baseUrl, 'owner@northlight.test');
    const collectionId = (await demoCollectionId(env.server.ctx.database.db))!;
    const { memberships: mine } = await api<{
      memberships: { collectionId: string; labelTag: string }[];
    }>(page, '/api/collections');
    const tag = mine.find((m) => m.collectionId === collectionId)!.labelTag;
    const round = await api<RoundResponse>(page, `/api/collections/${collectionId}/rounds/today`);
    const { animal } = round.items[0]!;

    await page.goto(`${env.server.baseUrl}/l/${tag}/${animal.labelCode}`);
    const card = page.getByRole('article', { name: `${animal.name}, ${animal.labelCode}` });
    await card.waitFor();
    const open = card.getByRole('link', { name: `Open record of ${animal.name}` });
    await open.waitFor();
    const box = (await open.boundingBox())!;
    expect(box.height).toBeGreaterThanOrEqual(48);
    await expectAccessible(page, 'label link with open record');
    await screenshot(page, 'dead-ends-01-label-link');
    await open.click();
    await page.waitForURL(`**/animals/${animal.id}`);
    await page.getByRole('heading', { level: 1, name: animal.name }).waitFor();

    // Today's cards link the same way.
    await page.getByRole('link', { name: 'Today' }).click();
    await page
      .getByRole('article', { name: `${animal.name}, ${animal.labelCode}` })
      .getByRole('link', { name: `Open record of ${animal.name}` })
      .waitFor();
    await context.close();
  });
});

describe('a helper reports a problem', () => {
  it('reports an escape; the owner’s mailbox and Today have it', async () => {
    await startDemoHelpersCover(env.server);

    const h = await phonePage(env.browser);
    const page = h.page;
    await signInAsDemo(page, env.server.baseUrl, 'helper@northlight.test');
    await page.getByRole('article').first().waitFor();
    // A helper may not open the records: no link to them on the round.
    expect(await page.getByRole('link', { name: /Open record/ }).count()).toBe(0);
    await page.getByRole('button', { name: 'Report a problem or leave a note' }).click();
    await page.getByText('An animal got out').click();
    const advice = page.getByRole('region', { name: 'What to do first' });
    await expect.poll(() => advice.innerText()).toMatch(/shallow dish of water/);
    await page.getByText('Bite, sting or hairs').click();
    await expect.poll(() => advice.innerText()).toMatch(/allergic reaction/);
    await page.getByText('An animal got out').click();
    const select = page.getByLabel('Which animal?');
    await select.selectOption({ index: 1 });
    const chosen = (await select.locator('option:checked').innerText()).trim();
    await page
      .getByLabel('What you saw and did')
      .fill('The lid was pushed up; the room door is shut.');
    await expectAccessible(page, 'helper report form');
    await screenshot(page, 'dead-ends-02-report-form');
    await page.getByRole('button', { name: 'Send to the owner' }).click();
    await page.getByText('Sent. The owner has it now').waitFor();
    await screenshot(page, 'dead-ends-03-report-sent');
    await h.context.close();

    // The dev mailbox shows the owner's e-mail.
    const o = await phonePage(env.browser);
    await o.page.goto(`${env.server.baseUrl}/dev/mailbox`);
    const mail = o.page
      .getByRole('article')
      .filter({ hasText: 'reports an escape' })
      .filter({ hasText: 'owner@northlight.test' });
    await mail.first().waitFor({ timeout: 15_000 });
    expect(await mail.first().innerText()).toContain(chosen);
    await screenshot(o.page, 'dead-ends-04-mailbox');

    // And the owner's Today says so, leading to the reports.
    await signInAsDemo(o.page, env.server.baseUrl, 'owner@northlight.test');
    await o.page.getByText('A helper sent you a report').waitFor();
    await expectAccessible(o.page, 'today with a helper report');
    await o.page.getByRole('link', { name: 'Read the reports' }).click();
    const list = o.page.getByRole('list', { name: 'Reports from helpers' });
    await expect.poll(() => list.innerText()).toContain('The lid was pushed up');
    await expectAccessible(o.page, 'cover page with helper reports');
    await screenshot(o.page, 'dead-ends-05-owner-reports');
    expect([...h.consoleErrors, ...o.consoleErrors]).toEqual([]);
    await o.context.close();
  });
});

describe('a new collection', () => {
  it('is started from Settings and becomes the current one', async () => {
    const { context, page, consoleErrors } = await phonePage(env.browser);
    await signInAsDemo(page, env.server.baseUrl, 'partner@northlight.test');
    await page.getByRole('link', { name: 'Settings' }).click();
    await page.getByRole('link', { name: 'Start another collection' }).click();
    await page.getByRole('heading', { name: 'Start a collection' }).waitFor();
    await page.getByRole('button', { name: 'Start the collection' }).click();
    await page.getByText('Name your collection.').waitFor();
    await expectAccessible(page, 'new collection form');
    await page.getByLabel('Collection name').fill('Back bedroom');
    await page.getByLabel('Time zone').fill('Europe/Dublin');
    await screenshot(page, 'dead-ends-06-new-collection');
    await page.getByRole('button', { name: 'Start the collection' }).click();
    await page.waitForURL('**/today');
    await expect.poll(() => page.getByRole('banner').innerText()).toContain('Back bedroom');
    await page.getByRole('heading', { name: 'Start Back bedroom' }).waitFor();
    await page.getByRole('link', { name: 'Settings' }).click();
    const switcher = page.getByRole('group', { name: 'Collection on this device' });
    await expect.poll(() => switcher.innerText()).toContain('Back bedroom');
    expect(await switcher.innerText()).toContain('Northlight Inverts');
    expect(consoleErrors).toEqual([]);
    await context.close();
  });
});
