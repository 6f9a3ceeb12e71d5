// P2 (offline repeat visit), P3 (first visit over a slow mobile link) and P4 (first-route
// JavaScript), each against a minimal React + router + query + PWA shell measured the same way.
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { firstRouteJs } from '../scripts/first-route-size.mjs';
import type { Database } from '../server/db/client';
import { seedDemo } from '../server/seed/demo';
import { cutNetwork, launchBrowser, underServiceWorker } from '../tests/chromium';
import { distDir, startBenchApp } from './bench-app';
import {
  ensureBuilds,
  largestContentfulPaint,
  minimalDir,
  phoneContext,
  serveMinimalShell,
  signInContext,
  throttle,
} from './browser-setup';
import { median, type Figure } from './results-file';

const RUNS = 5;

const roundReady = (page: Page) =>
  page.getByRole('button', { name: 'Ate', exact: true }).first().waitFor({ timeout: 60_000 });
const shellReady = (page: Page) =>
  page.getByText('Twenty-two animals').waitFor({ timeout: 60_000 });

/** Opens `url` in a new page of `context` under the throttles and returns its LCP. */
async function visit(
  context: BrowserContext,
  url: string,
  ready: (p: Page) => Promise<void>,
  slowLink: boolean,
  elements?: string[],
): Promise<number> {
  const page = await context.newPage();
  await throttle(context, page, slowLink);
  await page.goto(url);
  await ready(page).catch(async (err) => {
    throw new Error(
      `${url} never got ready; the page said: ${(await page.locator('body').innerText()).slice(0, 300)}`,
      { cause: err },
    );
  });
  const lcp = await largestContentfulPaint(page);
  elements?.push(lcp.element);
  await page.close();
  return lcp.startTime;
}

async function withApps<T>(
  database: Database,
  work: (apps: { app: string; shell: string; browser: Browser }) => Promise<T>,
): Promise<T> {
  await ensureBuilds();
  await seedDemo(database.db, { bcryptCost: 10 }); // does nothing when the demo is already there
  const app = await startBenchApp(database);
  const shell = await serveMinimalShell();
  const { browser } = await launchBrowser();
  try {
    return await work({ app: app.baseUrl, shell: shell.baseUrl, browser });
  } finally {
    await browser.close();
    await shell.close();
    await app.close();
  }
}

const ratioFigure = (
  id: string,
  what: string,
  value: number,
  baseline: number,
  target: number,
  maxRatio: number,
): Figure[] => {
  const ratio = Number((value / baseline).toFixed(2));
  return [
    { id, what, value: Math.round(value), unit: 'ms', target, pass: value <= target },
    {
      id,
      what: `${what}, as a multiple of the minimal shell`,
      value: Math.round(value),
      unit: 'ms',
      target: `ratio ≤ ${maxRatio}`,
      baseline: Math.round(baseline),
      ratio,
      pass: ratio <= maxRatio,
    },
  ];
};

export async function runP2(database: Database): Promise<{ figures: Figure[]; notes: string[] }> {
  return withApps(database, async ({ app, shell, browser }) => {
    // First visits online: the service worker installs and the round reaches IndexedDB.
    const step = (what: string) => console.log(`  P2: ${what}`);
    const appContext = await phoneContext(browser);
    await signInContext(appContext, app);
    const first = await appContext.newPage();
    await first.goto(`${app}/today`);
    await roundReady(first);
    step('round shown; waiting for the service worker');
    await underServiceWorker(first);
    await roundReady(first);
    await first.close();
    const shellContext = await phoneContext(browser);
    const warm = await shellContext.newPage();
    await warm.goto(`${shell}/today`);
    step('minimal shell shown; waiting for its service worker');
    await underServiceWorker(warm);
    step('both under their service workers; measuring offline visits');
    await warm.close();
    // Then no network at all, CPU ×4, and repeat visits.
    await cutNetwork(appContext);
    await cutNetwork(shellContext);
    const appLcp: number[] = [];
    const shellLcp: number[] = [];
    const appElements: string[] = [];
    for (let i = 0; i < RUNS; i++) {
      appLcp.push(await visit(appContext, `${app}/today`, roundReady, false, appElements));
      shellLcp.push(await visit(shellContext, `${shell}/today`, shellReady, false));
    }
    return {
      figures: ratioFigure(
        'P2',
        `offline repeat visit to Today (service worker + IndexedDB), LCP, CPU ×4, median of ${RUNS}`,
        median(appLcp),
        median(shellLcp),
        1000,
        1.5,
      ),
      notes: [
        `P2 LCP runs: Rackside ${appLcp.map(Math.round).join(', ')} ms; minimal shell ${shellLcp.map(Math.round).join(', ')} ms.`,
        `P2 Rackside's LCP elements: ${[...new Set(appElements)].join('; ')}.`,
      ],
    };
  });
}

export async function runP3(database: Database): Promise<{ figures: Figure[]; notes: string[] }> {
  return withApps(database, async ({ app, shell, browser }) => {
    const today: number[] = [];
    const todayElements: string[] = [];
    const signInPage: number[] = [];
    const shellLcp: number[] = [];
    for (let i = 0; i < RUNS; i++) {
      // Each visit in a fresh context: empty HTTP cache, no service worker yet.
      const signedIn = await phoneContext(browser);
      await signInContext(signedIn, app);
      today.push(await visit(signedIn, `${app}/today`, roundReady, true, todayElements));
      await signedIn.close();
      const stranger = await phoneContext(browser);
      signInPage.push(
        await visit(
          stranger,
          `${app}/sign-in`,
          (p) => p.getByRole('button', { name: 'Sign in' }).waitFor({ timeout: 60_000 }),
          true,
        ),
      );
      await stranger.close();
      const plain = await phoneContext(browser);
      shellLcp.push(await visit(plain, `${shell}/today`, shellReady, true));
      await plain.close();
    }
    return {
      figures: [
        ...ratioFigure(
          'P3',
          `first visit to Today, signed in (150 ms RTT, 1.6 Mbit/s, CPU ×4), LCP, median of ${RUNS}`,
          median(today),
          median(shellLcp),
          2500,
          1.5,
        ),
        ...ratioFigure(
          'P3',
          `first visit to the sign-in page (same link), LCP, median of ${RUNS}`,
          median(signInPage),
          median(shellLcp),
          2500,
          1.5,
        ),
      ],
      notes: [
        `P3 LCP runs: Today ${today.map(Math.round).join(', ')} ms; sign-in ${signInPage.map(Math.round).join(', ')} ms; minimal shell ${shellLcp.map(Math.round).join(', ')} ms.`,
        `P3 Today's LCP elements: ${[...new Set(todayElements)].join('; ')}.`,
      ],
    };
  });
}

export async function runP4(): Promise<{ figures: Figure[]; notes: string[] }> {
  await ensureBuilds();
  const app = firstRouteJs(distDir);
  const shell = firstRouteJs(minimalDir);
  const kb = (b: number) => Number((b / 1024).toFixed(1));
  return {
    figures: [
      {
        id: 'P4',
        what: 'JavaScript for the first route (entry + preloaded chunks), gzip',
        value: kb(app.gzipBytes),
        unit: 'KB',
        target: 150,
        baseline: kb(shell.gzipBytes),
        ratio: Number((app.gzipBytes / shell.gzipBytes).toFixed(2)),
        pass: app.gzipBytes <= 150 * 1024,
      },
    ],
    notes: [
      `P4 files: ${app.files.map((f) => `${f.file} ${kb(f.gzipBytes)} KB`).join('; ')}; minimal shell ${kb(shell.gzipBytes)} KB.`,
    ],
  };
}
