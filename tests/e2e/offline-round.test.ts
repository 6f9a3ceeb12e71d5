// Issue 4's end-to-end check: a whole round with no network, a reload with no network, and
// every tap saved exactly once when the network comes back.
import { and, eq, gte } from 'drizzle-orm';
import type { Page } from 'playwright-core';
import { describe, expect, it } from 'vitest';
import { events } from '../../server/db/schema/animals';
import { memberships } from '../../server/db/schema/collections';
import { users } from '../../server/db/schema/users';
import { demoCollectionId } from '../../server/seed/demo';
import { cutNetwork, restoreNetwork, underServiceWorker } from '../chromium';
import { expectAccessible, phonePage, screenshot, useE2e, signInAsDemo } from './support';

const env = useE2e();

const signIn = (page: Page, email: string) => signInAsDemo(page, env.server.baseUrl, email);

const syncStatus = (page: Page) =>
  page
    .getByRole('status')
    .filter({ hasText: /saved|waiting|Saving|attention/ })
    .first()
    .innerText();
const item = (page: Page, name: string) =>
  page.getByRole('article', { name: new RegExp(`^${name},`) });

async function userId(email: string) {
  const [row] = await env.server.ctx.database.db
    .select({ id: users.id })
    .from(users)
    .where(eq(users.email, email));
  return row!.id;
}

describe('today’s round with no signal', () => {
  it('records three outcomes offline, survives a reload offline, and saves each exactly once', async () => {
    const started = new Date();
    const { context, page, consoleErrors } = await phonePage(env.browser);
    await signIn(page, 'owner@northlight.test');
    await underServiceWorker(page);
    await item(page, 'Dusty').waitFor();
    await expect.poll(() => syncStatus(page)).toMatch(/All saved/);

    await cutNetwork(context);
    await item(page, 'Dusty').getByRole('button', { name: 'Ate', exact: true }).click();
    await item(page, 'Ember').getByRole('button', { name: 'Refused', exact: true }).click();
    await item(page, 'Verdi').getByRole('button', { name: 'Watered', exact: true }).click();
    // The screen updates from the phone's own write, with no server in reach.
    await expect.poll(() => item(page, 'Dusty').innerText()).toMatch(/✓ Ate \d\d:\d\d/);
    await expect.poll(() => syncStatus(page), { timeout: 10_000 }).toMatch(/Offline · 3 waiting/);
    await screenshot(page, 'offline-01-three-taps');

    await page.reload();
    // Finished cards are under Done (and All) once the page is opened anew.
    await item(page, 'Ember').waitFor();
    await page
      .locator('label')
      .filter({ has: page.getByRole('radio', { name: /^All/ }) })
      .click();
    await item(page, 'Dusty').waitFor();
    expect(await item(page, 'Dusty').innerText()).toMatch(/✓ Ate/);
    expect(await item(page, 'Ember').innerText()).toMatch(/✕ Refused/);
    expect(await item(page, 'Verdi').innerText()).toMatch(/✓ Watered/);
    await expect.poll(() => syncStatus(page), { timeout: 10_000 }).toMatch(/3 waiting/);
    await expectAccessible(page, 'today offline');
    await screenshot(page, 'offline-02-after-reload');

    await restoreNetwork(context);
    await expect.poll(() => syncStatus(page), { timeout: 20_000 }).toMatch(/All saved/);
    await screenshot(page, 'offline-03-saved');

    const owner = await userId('owner@northlight.test');
    const saved = await env.server.ctx.database.db
      .select()
      .from(events)
      .where(and(eq(events.recordedBy, owner), gte(events.serverReceivedAt, started)));
    expect(saved.map((e) => e.kind).sort()).toEqual(['ate', 'refused', 'watered']);

    // The same batch again: three duplicates, nothing new stored.
    const collectionId = (await demoCollectionId(env.server.ctx.database.db))!;
    const again = await page.evaluate(
      async ({ collectionId, list }) => {
        const res = await fetch(`/api/collections/${collectionId}/events`, {
          method: 'POST',
          headers: { 'Content-Type': 'application/json', 'X-Rackside-Client': '1' },
          body: JSON.stringify({
            deviceId: 'e2e',
            clientSentAt: new Date().toISOString(),
            events: list,
          }),
        });
        return (await res.json()) as { results: { status: string }[] };
      },
      {
        collectionId,
        list: saved.map((e) => ({
          id: e.id,
          animalId: e.animalId,
          kind: e.kind,
          payload: e.payload,
          clientRecordedAt: e.clientRecordedAt.toISOString(),
        })),
      },
    );
    expect(again.results.map((r) => r.status)).toEqual(['duplicate', 'duplicate', 'duplicate']);
    expect(
      consoleErrors.filter((e) => !/ERR_INTERNET_DISCONNECTED|Failed to load resource/.test(e)),
    ).toEqual([]);
    await context.close();
  });

  it('undoes the last tap with a void, never a delete', async () => {
    const started = new Date();
    const { context, page } = await phonePage(env.browser);
    await signIn(page, 'partner@northlight.test');
    await item(page, 'Tiger').waitFor();
    await item(page, 'Tiger').getByRole('button', { name: 'Refused', exact: true }).click();
    await expect.poll(() => item(page, 'Tiger').innerText()).toMatch(/✕ Refused/);
    await page.getByRole('button', { name: 'Undo' }).click();
    await expect.poll(() => item(page, 'Tiger').innerText()).not.toMatch(/✕ Refused/);
    await expect.poll(() => syncStatus(page), { timeout: 10_000 }).toMatch(/All saved/);
    const partner = await userId('partner@northlight.test');
    const saved = await env.server.ctx.database.db
      .select({ kind: events.kind })
      .from(events)
      .where(and(eq(events.recordedBy, partner), gte(events.serverReceivedAt, started)));
    expect(saved.map((e) => e.kind).sort()).toEqual(['refused', 'void']);

    // Later, from the animal's history: the undone refusal is struck through, and an older
    // fact can be undone too — again by a void.
    await page.getByRole('link', { name: 'Animals', exact: true }).click();
    // Today's own search box is labelled "Find a label code…": wait for the Animals page.
    await page.waitForURL('**/animals');
    // The collection list renders only the rows in view: find Tiger first.
    await page.getByLabel('Find', { exact: true }).fill('Tiger');
    await page.getByRole('link', { name: 'Tiger' }).click();
    const history = page.getByRole('region', { name: 'Timeline' });
    await expect.poll(() => history.innerText()).toMatch(/Refused[\s\S]*undone/);
    await expectAccessible(page, 'animal history');
    // A fact from an earlier day asks first, saying what will change (shared/domain/undo.ts).
    const undoButton = history.getByRole('button', { name: /^Undo / }).first();
    const older = (await undoButton.getAttribute('aria-label'))!.endsWith('…');
    await undoButton.click();
    if (older) {
      await history
        .getByText('The entry stays in the timeline, crossed out.', { exact: false })
        .waitFor();
      await history.getByRole('button', { name: 'Undo it' }).click();
    }
    const kinds = async () =>
      (
        await env.server.ctx.database.db
          .select({ kind: events.kind })
          .from(events)
          .where(and(eq(events.recordedBy, partner), gte(events.serverReceivedAt, started)))
      )
        .map((e) => e.kind)
        .sort();
    await expect.poll(kinds, { timeout: 10_000 }).toEqual(['refused', 'void', 'void']);
    await screenshot(page, 'offline-05-history');
    await context.close();
  });

  it('warns on both phones when owner and helper both fed the same animal offline', async () => {
    const db = env.server.ctx.database.db;
    const helper = await userId('helper@northlight.test');
    const now = Date.now();
    await db
      .update(memberships)
      // The demo helper's cover runs now, and they have read the safety page already.
      .set({
        startsAt: new Date(now - 86_400_000),
        endsAt: new Date(now + 86_400_000),
        safetyAcknowledgedAt: new Date(now),
      })
      .where(eq(memberships.userId, helper));

    const phones = await Promise.all([phonePage(env.browser), phonePage(env.browser)]);
    await signIn(phones[0].page, 'owner@northlight.test');
    await signIn(phones[1].page, 'helper@northlight.test');
    for (const { page, context } of phones) {
      // Dusty was fed in the first test: a finished card, under All rather than To do.
      await page.getByRole('article').first().waitFor();
      await page
        .locator('label')
        .filter({ has: page.getByRole('radio', { name: /^All/ }) })
        .click();
      await item(page, 'Dusty').waitFor();
      await cutNetwork(context);
      // Fed in the first test, its card is folded to a row: opened again, it offers the outcomes.
      const change = item(page, 'Dusty').getByRole('button', { name: 'Change Dusty' });
      if (await change.count()) await change.click();
      await item(page, 'Dusty').getByRole('button', { name: 'Ate', exact: true }).click();
    }
    for (const { page, context } of phones) {
      await restoreNetwork(context);
      await expect.poll(() => syncStatus(page), { timeout: 20_000 }).toMatch(/All saved/);
    }
    for (const { page } of phones) {
      await page.reload();
      await expect
        .poll(() => item(page, 'Dusty').innerText(), { timeout: 10_000 })
        .toMatch(/Fed (twice|3 times) today: \d\d:\d\d Robin \(owner\)[\s\S]*Alex \(helper\)/);
    }
    await screenshot(phones[1].page, 'offline-04-fed-twice');
    for (const { context } of phones) await context.close();
  });
});
