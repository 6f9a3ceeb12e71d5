// T1: the collection table with 5,000 animals in Chromium at phone size: the first render of
// the list (data already on the phone) and each keystroke in its search box, until the new
// result is painted. Medians over every sample; the page is not throttled (the target
// is for Chromium as is); a 4× CPU run is noted beside it.
import type { Page } from 'playwright-core';
import type { Database } from '../server/db/client';
import { launchBrowser } from '../tests/chromium';
import { BENCH_PASSWORD, makeKeeper, startBenchApp } from './bench-app';
import { ensureBuilds, percentile, phoneContext, throttle } from './browser-setup';
import { median, type Figure } from './results-file';

const ANIMALS = Number(process.env.T1_ANIMALS ?? 5000);
const RENDERS = 5;
const QUERIES = ['animal 12', 'bn-33', 'tliltocatl', 'animal 4999'];

/** Leaves /animals and comes back (client-side, data cached): time until the rows are painted. */
async function firstRender(page: Page): Promise<number> {
  await page.getByRole('link', { name: 'Today', exact: true }).click();
  await page.waitForURL('**/today');
  return page.evaluate(async () => {
    const link = [...document.querySelectorAll('nav a')].find((a) =>
      a.textContent?.includes('Animals'),
    ) as HTMLAnchorElement;
    const t0 = performance.now();
    link.click();
    await new Promise<void>((resolve) => {
      const check = () =>
        document.querySelector('[aria-label="Animals"] li, table tbody tr td')
          ? resolve()
          : requestAnimationFrame(check);
      check();
    });
    await new Promise((r) => requestAnimationFrame(() => r(null)));
    return performance.now() - t0;
  });
}

/**
 * Types each query a character at a time. React handles an input event as a discrete update and
 * commits before the event returns; the time ends after the next frame is painted (the timer
 * queued from requestAnimationFrame runs once that frame is done).
 */
async function keystrokes(page: Page): Promise<{ times: number[]; counts: string[] }> {
  return page.evaluate(async (queries) => {
    const input = document.querySelector('input[type="search"]') as HTMLInputElement;
    const count = document.querySelector('main p[aria-live="polite"]')!;
    const setValue = Object.getOwnPropertyDescriptor(HTMLInputElement.prototype, 'value')!.set!;
    const times: number[] = [];
    const counts: string[] = [];
    for (const q of queries) {
      for (let i = 0; i <= q.length; i++) {
        const value = i === q.length ? '' : q.slice(0, i + 1);
        const t0 = performance.now();
        setValue.call(input, value);
        input.dispatchEvent(new Event('input', { bubbles: true }));
        await new Promise((r) => requestAnimationFrame(() => setTimeout(r, 0)));
        times.push(performance.now() - t0);
        if (i === q.length - 1) counts.push(`${q} → ${count.textContent}`);
        await new Promise((r) => setTimeout(r, 30));
      }
    }
    return { times, counts };
  }, QUERIES);
}

export async function runT1(database: Database): Promise<{ figures: Figure[]; notes: string[] }> {
  await ensureBuilds();
  const app = await startBenchApp(database);
  const { browser } = await launchBrowser();
  try {
    const keeper = await makeKeeper(database, ANIMALS, 't1');
    const context = await phoneContext(browser);
    const signIn = await context.request.post(`${app.baseUrl}/api/auth/sign-in`, {
      data: { email: keeper.email, password: BENCH_PASSWORD },
      headers: { 'X-Rackside-Client': '1' },
    });
    if (signIn.status() !== 200) throw new Error(`T1 sign-in failed: ${signIn.status()}`);
    const page = await context.newPage();
    await page.goto(`${app.baseUrl}/animals`);
    await page.getByText(`${ANIMALS} of ${ANIMALS} animals`).waitFor({ timeout: 60_000 });
    // tsx names the helpers inside the evaluated functions with an `__name` call; give the page one.
    await page.evaluate('globalThis.__name = (f) => f');

    const renders: number[] = [];
    for (let i = 0; i < RENDERS; i++) renders.push(await firstRender(page));
    const { times: keys, counts } = await keystrokes(page);
    await throttle(context, page);
    const { times: slowKeys } = await keystrokes(page);

    const keyMedian = Math.round(median(keys) * 10) / 10;
    const renderMedian = Math.round(median(renders));
    return {
      figures: [
        {
          id: 'T1',
          what: `collection table, ${ANIMALS} animals, first render (data cached, phone size), median of ${RENDERS}`,
          value: renderMedian,
          unit: 'ms',
          target: 'none set',
          pass: true,
        },
        {
          id: 'T1',
          what: `collection table, ${ANIMALS} animals, search keystroke → painted, median of ${keys.length}`,
          value: keyMedian,
          unit: 'ms',
          target: 100,
          pass: keyMedian <= 100,
        },
      ],
      notes: [
        `T1: keystroke p95 ${Math.round(percentile(keys, 95))} ms; with the CPU slowed 4× median ${Math.round(median(slowKeys))} ms, p95 ${Math.round(percentile(slowKeys, 95))} ms (${slowKeys.length} keystrokes).`,
        `T1: first renders ${renders.map((r) => Math.round(r)).join(', ')} ms; results seen: ${counts.join('; ')}.`,
      ],
    };
  } finally {
    await browser.close();
    await app.close();
  }
}
