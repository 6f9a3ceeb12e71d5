// Days without signal (decision 015): the server stopped for real, the phone's clock moved over
// two local midnights, a tap on each day's round the phone built itself, reloads, then the
// signal back — each tap stored once on its own local date, each day's server round showing it
// done, and no screen labelled with a day it is not.
import { and, eq, gte } from 'drizzle-orm';
import type { Page } from 'playwright-core';
import { describe, expect, it } from 'vitest';
import { addDays, localDateOf } from '#shared/domain/local-dates';
import { DEMO_COLLECTION } from '../../server/access/demo-people';
import { events } from '../../server/db/schema/animals';
import { users } from '../../server/db/schema/users';
import { demoCollectionId } from '../../server/seed/demo';
import { underServiceWorker } from '../chromium';
import { expectAccessible, phonePage, screenshot, signInAsDemo, useE2e } from './support';

const env = useE2e();
const DAY_MS = 86_400_000;
const ZONE = DEMO_COLLECTION.timeZone;

const syncStatus = (page: Page) =>
  page
    .getByRole('status')
    .filter({ hasText: /saved|waiting|Saving|attention/ })
    .first()
    .innerText();
const cards = (page: Page) => page.getByRole('article');
const heading = (page: Page) => page.getByRole('heading', { level: 1 }).innerText();
/** A heading naming `date` in the person's locale ("Thu 3 Dec", "Thu, Dec 3"): its day of month. */
const names = (word: string, date: string) =>
  new RegExp(`^${word} · \\D*\\b${Number(date.slice(8))}\\b`);

/** Taps the first card's first one-tap outcome it offers (Ate, else Watered) and names the animal. */
async function tapFirst(page: Page): Promise<{ name: string; kind: 'ate' | 'watered' }> {
  for (const [label, kind] of [
    ['Ate', 'ate'],
    ['Watered', 'watered'],
  ] as const) {
    const card = cards(page)
      .filter({ has: page.getByRole('button', { name: label, exact: true }) })
      .first();
    if ((await card.count()) === 0) continue;
    const name = (await card.getAttribute('aria-label'))!.split(',')[0]!;
    await card.getByRole('button', { name: label, exact: true }).click();
    await expect.poll(() => card.innerText()).toMatch(new RegExp(`✓ ${label}`));
    return { name, kind };
  }
  throw new Error('No card offers Ate or Watered.');
}

describe('days without signal', () => {
  it('builds each new day on the phone, keeps its taps, and settles them onto the server’s rounds', async () => {
    const started = new Date();
    const { context, page, consoleErrors } = await phonePage(env.browser);
    await context.clock.install();
    await signInAsDemo(page, env.server.baseUrl, 'owner@northlight.test');
    await underServiceWorker(page);
    await cards(page).first().waitFor();
    await expect.poll(() => syncStatus(page), { timeout: 15_000 }).toMatch(/All saved/);
    // The engine input arrives with the round (a keeper's phone keeps it).
    await expect
      .poll(() =>
        page.evaluate(
          () =>
            new Promise<number>((resolve) => {
              const open = indexedDB.open('rackside');
              open.onsuccess = () => {
                const req = open.result
                  .transaction('engineInputs')
                  .objectStore('engineInputs')
                  .count();
                req.onsuccess = () => resolve(req.result);
              };
            }),
        ),
      )
      .toBe(1);
    const day0 = localDateOf(new Date(), ZONE);

    // The server goes out of reach, for real.
    await env.server.stop();
    const taps: { name: string; kind: string; date: string }[] = [];
    for (const days of [1, 2]) {
      await context.clock.setSystemTime(new Date(Date.now() + days * DAY_MS));
      const date = addDays(day0, days);
      await page.reload();
      await cards(page).first().waitFor();
      expect(await heading(page)).toMatch(names('Today', date));
      await expect.poll(() => page.getByText('Built on this phone').count()).toBe(1);
      expect(await page.getByText(/Not today’s round/).count()).toBe(0);
      expect(await page.getByText(/showing this phone’s copy built from records of/).count()).toBe(
        1,
      );
      await screenshot(page, `offline-days-0${days}-today`);
      const tapped = await tapFirst(page);
      taps.push({ ...tapped, date });
      // A reload keeps the tap on the phone's round.
      await page.reload();
      const card = page.getByRole('article', { name: new RegExp(`^${tapped.name},`) });
      await expect.poll(() => card.innerText()).toMatch(/✓ (Ate|Watered)/);
      await expectAccessible(page, `phone-built day ${days}`);

      // Tomorrow's preview is the day after this one, built here too.
      await page
        .getByRole('link', { name: /Tomorrow/ })
        .first()
        .click();
      await expect.poll(() => heading(page)).toMatch(names('Tomorrow', addDays(date, 1)));
      await expect.poll(() => page.getByText('Built on this phone').count()).toBe(1);
      await screenshot(page, `offline-days-0${days}-tomorrow`);
      await page.getByRole('link', { name: /Today/ }).first().click();
      await cards(page).first().waitFor();
    }
    expect(new Set(taps.map((t) => t.date)).size).toBe(2);

    // The signal comes back, with the server's clock where the phone's is.
    env.server.ctx.shiftClock(2 * DAY_MS);
    await env.server.resume();
    await page.reload();
    await expect.poll(() => syncStatus(page), { timeout: 30_000 }).toMatch(/All saved/);
    await expect
      .poll(() => page.getByText('Built on this phone').count(), { timeout: 15_000 })
      .toBe(0);
    expect(await heading(page)).toMatch(names('Today', addDays(day0, 2)));

    // Every tap stored once, on its own local date.
    const db = env.server.ctx.database.db;
    const [owner] = await db
      .select({ id: users.id })
      .from(users)
      .where(eq(users.email, 'owner@northlight.test'));
    const saved = await db
      .select()
      .from(events)
      .where(and(eq(events.recordedBy, owner!.id), gte(events.serverReceivedAt, started)));
    expect(saved.map((e) => [e.kind, localDateOf(e.effectiveAt, ZONE)]).sort()).toEqual(
      taps.map((t) => [t.kind, t.date]).sort(),
    );

    // Each day's server round shows its tap done.
    const collectionId = (await demoCollectionId(db))!;
    for (const t of taps) {
      const round = await env.server.ctx.services.rounds.round(collectionId, t.date);
      const item = round.items.find((i) => i.animal.name === t.name);
      expect(
        item?.outcomes.map((o) => o.kind),
        `${t.name} on ${t.date}`,
      ).toContain(t.kind);
    }
    // Today's round was built by the server before the phone's taps arrived: a meal from the
    // first day offline leaves no open feed task for that animal today.
    if (taps[0]!.kind === 'ate') {
      const round = await env.server.ctx.services.rounds.round(collectionId, taps[1]!.date);
      const feed = round.items
        .find((i) => i.animal.name === taps[0]!.name)
        ?.tasks.find((t) => t.kind === 'feed');
      expect(!feed || !!feed.done || !!feed.withdrawn || !!feed.serverWithdrawn).toBe(true);
      if (feed && !feed.done)
        await expect
          .poll(
            () => page.getByRole('article', { name: new RegExp(`^${taps[0]!.name},`) }).innerText(),
            { timeout: 20_000 },
          )
          .toMatch(/Not due any more/);
    }
    // And the phone now shows the server's round for today with its tap on it.
    const last = taps[1]!;
    await expect
      .poll(() => page.getByRole('article', { name: new RegExp(`^${last.name},`) }).innerText())
      .toMatch(/✓ (Ate|Watered)/);
    expect(
      consoleErrors.filter((e) => !/Failed to load resource|ERR_CONNECTION_REFUSED/.test(e)),
    ).toEqual([]);
    await context.close();
  });
});
