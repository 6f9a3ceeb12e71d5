// A long round (150 animals): from 100 cards on Today keeps only the shelves near the screen in
// the page (a virtual list, P1-1k). The keeper must not notice: every shelf is reachable by
// scrolling, the search finds any card, a tap lands on its card, and the page stays accessible.
import { and, eq, inArray } from 'drizzle-orm';
import type { Page } from 'playwright-core';
import { describe, expect, it } from 'vitest';
import { BENCH_PASSWORD, makeKeeper } from '../../bench/bench-app';
import { events } from '../../server/db/schema/animals';
import { expectAccessible, phonePage, screenshot, useE2e } from './support';

const env = useE2e();
const ANIMALS = 150;
const item = (page: Page, name: string) =>
  page.getByRole('article', { name: new RegExp(`^${name},`) });

describe('a long round', () => {
  it('keeps only nearby shelves in the page, yet scrolls, finds and records every card', async () => {
    const keeper = await makeKeeper(env.server.ctx.database, ANIMALS, 'long-round');
    const { context, page, consoleErrors } = await phonePage(env.browser);
    await page.goto(`${env.server.baseUrl}/sign-in`);
    await page.getByLabel('E-mail').fill(keeper.email);
    await page.getByLabel('Password').fill(BENCH_PASSWORD);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.waitForURL('**/today');
    await page.getByRole('article').first().waitFor();

    // Every animal is due (never fed), but far fewer cards than that are in the page.
    expect(await page.getByText(new RegExp(`^0 of ${ANIMALS} animals done$`)).count()).toBe(1);
    const inPage = await page.getByRole('article').count();
    expect(inPage).toBeGreaterThan(0);
    expect(inPage).toBeLessThan(ANIMALS / 2);
    await expectAccessible(page, 'long round, top');

    // Scrolling to the end brings the last shelf into the page.
    const lastShelf = await page.evaluate(async () => {
      for (let i = 0; i < 40; i++) {
        window.scrollTo(0, document.documentElement.scrollHeight);
        await new Promise((r) => setTimeout(r, 50));
      }
      return [...document.querySelectorAll('section[aria-label]')]
        .at(-1)
        ?.getAttribute('aria-label');
    });
    expect(lastShelf).toMatch(/R2/);
    await screenshot(page, 'long-round-01-end');

    // The search finds a card that is not in the page, and one tap records it.
    const far = `Animal ${ANIMALS - 3}`;
    await page.evaluate(() => window.scrollTo(0, 0));
    await page.getByLabel('Find a label code, a place or a name').fill(far);
    await expect.poll(() => page.getByRole('article').count()).toBe(1);
    await item(page, far).getByRole('button', { name: 'Ate', exact: true }).click();
    await expect.poll(() => item(page, far).innerText()).toMatch(/✓ Ate/);
    // Its water too: the animal is done (every bench enclosure has a water dish).
    await item(page, far).getByRole('button', { name: 'Watered', exact: true }).click();
    await expect
      .poll(
        async () =>
          (
            await env.server.ctx.database.db
              .select({ kind: events.kind })
              .from(events)
              .where(
                and(eq(events.recordedBy, keeper.userId), inArray(events.kind, ['ate', 'watered'])),
              )
          ).length,
        { timeout: 15_000 },
      )
      .toBe(2);
    await page.getByLabel('Find a label code, a place or a name').fill('');
    await expect
      .poll(() => page.getByText(new RegExp(`^1 of ${ANIMALS} animals done$`)).count())
      .toBe(1);
    await expectAccessible(page, 'long round, after a tap');
    expect(consoleErrors).toEqual([]);
    await context.close();
  });
});
