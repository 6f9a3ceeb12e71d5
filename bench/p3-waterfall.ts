// P3-WATERFALL: where a first visit's time goes. One signed-in first visit to Today and one to
// the minimal shell over P3's link (150 ms RTT, 1.6 Mbit/s, CPU ×4), each printed as the requests
// in the order they started (Resource Timing: start, first byte, end, bytes on the wire), the
// paints and every largest-contentful-paint candidate with the element it painted.
import { writeFile } from 'node:fs/promises';
import type { BrowserContext, Page } from 'playwright-core';
import type { Database } from '../server/db/client';
import { seedDemo } from '../server/seed/demo';
import { cutNetwork, launchBrowser, underServiceWorker } from '../tests/chromium';
import { startBenchApp } from './bench-app';
import {
  ensureBuilds,
  phoneContext,
  serveMinimalShell,
  signInContext,
  throttle,
} from './browser-setup';
import type { Figure } from './results-file';

interface Timeline {
  requests: { name: string; start: number; firstByte: number; end: number; kb: number }[];
  paints: { name: string; at: number }[];
  marks: { name: string; at: number }[];
  lcp: { at: number; element: string }[];
  longTasks: { start: number; duration: number }[];
}

// Long tasks are only seen by an observer that exists before they run.
const OBSERVE_LONG_TASKS = () => {
  const w = window as unknown as { __longTasks: { start: number; duration: number }[] };
  w.__longTasks = [];
  new PerformanceObserver((list) => {
    for (const e of list.getEntries())
      w.__longTasks.push({ start: e.startTime, duration: e.duration });
  }).observe({ type: 'longtask', buffered: true });
};

async function timeline(page: Page): Promise<Timeline> {
  await page.waitForTimeout(1_500); // later, larger paints
  return page.evaluate(
    () =>
      new Promise<Timeline>((resolve) => {
        const lcp: Timeline['lcp'] = [];
        new PerformanceObserver((list) => {
          for (const e of list.getEntries() as (PerformanceEntry & { element?: Element })[]) {
            const el = e.element;
            const text = el?.textContent?.trim().replace(/\s+/g, ' ').slice(0, 40) ?? '';
            lcp.push({
              at: e.startTime,
              element: el ? `<${el.tagName.toLowerCase()}> ${text}` : '(removed element)',
            });
          }
        }).observe({ type: 'largest-contentful-paint', buffered: true });
        setTimeout(() => {
          const nav = performance.getEntriesByType('navigation')[0] as PerformanceNavigationTiming;
          const resources = performance.getEntriesByType('resource') as PerformanceResourceTiming[];
          const requests = [nav, ...resources].map((r) => ({
            name: r.name.replace(location.origin, '') || '/',
            start: r.startTime,
            firstByte: r.responseStart,
            end: r.responseEnd,
            kb: r.transferSize / 1024,
          }));
          resolve({
            requests: requests.sort((a, b) => a.start - b.start),
            paints: performance.getEntriesByType('paint').map((p) => ({
              name: p.name,
              at: p.startTime,
            })),
            marks: performance
              .getEntriesByType('mark')
              .map((m) => ({ name: m.name, at: m.startTime })),
            lcp,
            longTasks: (window as unknown as { __longTasks: Timeline['longTasks'] }).__longTasks,
          });
        }, 500);
      }),
  );
}

function describe(what: string, t: Timeline): string[] {
  const ms = (n: number) => `${Math.round(n)}`.padStart(5);
  const lines = [`${what}:`, '  start  1st-byte  end   KB  request'];
  for (const r of t.requests)
    lines.push(
      `  ${ms(r.start)}  ${ms(r.firstByte)}  ${ms(r.end)} ${r.kb.toFixed(1).padStart(5)}  ${r.name.slice(0, 90)}`,
    );
  for (const p of t.paints) lines.push(`  ${ms(p.at)}  paint: ${p.name}`);
  for (const m of t.marks) lines.push(`  ${ms(m.at)}  mark: ${m.name}`);
  for (const l of t.lcp) lines.push(`  ${ms(l.at)}  LCP candidate: ${l.element}`);
  const busy = t.longTasks.reduce((s, l) => s + l.duration, 0);
  lines.push(
    `  long tasks (main thread > 50 ms): ${t.longTasks.map((l) => `${Math.round(l.start)}+${Math.round(l.duration)}`).join(', ') || 'none'} (total ${Math.round(busy)} ms)`,
  );
  return lines;
}

async function firstVisit(context: BrowserContext, url: string, ready: (p: Page) => Promise<void>) {
  await context.addInitScript(OBSERVE_LONG_TASKS);
  const page = await context.newPage();
  await throttle(context, page, true);
  await page.goto(url);
  await ready(page);
  const t = await timeline(page);
  await page.close();
  return t;
}

export async function runP3Waterfall(
  database: Database,
): Promise<{ figures: Figure[]; notes: string[] }> {
  await ensureBuilds();
  await seedDemo(database.db, { bcryptCost: 10 });
  const app = await startBenchApp(database);
  const shell = await serveMinimalShell();
  const { browser } = await launchBrowser();
  const notes: string[] = [];
  try {
    const signedIn = await phoneContext(browser);
    await signInContext(signedIn, app.baseUrl);
    const today = await firstVisit(signedIn, `${app.baseUrl}/today`, (p) =>
      p.getByRole('button', { name: 'Ate', exact: true }).first().waitFor({ timeout: 60_000 }),
    );
    if (process.env.P3_PROFILE) {
      const lines = await profileFirstVisit(signedIn, `${app.baseUrl}/today`, (p) =>
        p.getByRole('button', { name: 'Ate', exact: true }).first().waitFor({ timeout: 60_000 }),
      );
      console.log(lines.join('\n'));
    }
    await signedIn.close();
    const stranger = await phoneContext(browser);
    const signIn = await firstVisit(stranger, `${app.baseUrl}/sign-in`, (p) =>
      p.getByRole('button', { name: 'Sign in' }).waitFor({ timeout: 60_000 }),
    );
    await stranger.close();
    const plain = await phoneContext(browser);
    const minimal = await firstVisit(plain, `${shell.baseUrl}/today`, (p) =>
      p.getByText('Twenty-two animals').waitFor({ timeout: 60_000 }),
    );
    await plain.close();
    const lines = [
      ...describe('Rackside, first visit to /today, signed in', today),
      ...describe('Rackside, first visit to /sign-in', signIn),
      ...describe('Minimal shell, first visit', minimal),
    ];
    console.log(lines.join('\n'));
    notes.push(['P3 waterfall (ms from navigation start):', '```', ...lines, '```'].join('\n'));
  } finally {
    await browser.close();
    await shell.close();
    await app.close();
  }
  return { figures: [], notes };
}

/** Main-thread self time by function over one more first visit (CDP Profiler), top entries. */
export async function profileFirstVisit(
  context: BrowserContext,
  url: string,
  ready: (p: Page) => Promise<void>,
  slowLink = true,
): Promise<string[]> {
  const page = await context.newPage();
  const cdp = await throttle(context, page, slowLink);
  await cdp.send('Profiler.enable');
  await cdp.send('Profiler.setSamplingInterval', { interval: 500 });
  await cdp.send('Profiler.start');
  await page.goto(url);
  await ready(page);
  const { profile } = await cdp.send('Profiler.stop');
  await page.close();
  // The raw profile, for DevTools or a source-mapped breakdown (P3_PROFILE_OUT=/tmp/x.cpuprofile).
  if (process.env.P3_PROFILE_OUT)
    await writeFile(process.env.P3_PROFILE_OUT, JSON.stringify(profile));
  const byId = new Map(profile.nodes.map((n) => [n.id, n]));
  const self = new Map<string, number>();
  const dt = profile.timeDeltas ?? [];
  (profile.samples ?? []).forEach((id, i) => {
    const n = byId.get(id)!;
    const f = n.callFrame;
    const file = f.url.replace(/^.*\//, '') || '(native)';
    const key = `${f.functionName || '(anonymous)'} ${file}`;
    self.set(key, (self.get(key) ?? 0) + (dt[i + 1] ?? 0) / 1000);
  });
  const byFile = new Map<string, number>();
  for (const [k, v] of self) {
    const file = k.split(' ').at(-1)!;
    byFile.set(file, (byFile.get(file) ?? 0) + v);
  }
  const top = (m: Map<string, number>, n: number) =>
    [...m]
      .sort((a, b) => b[1] - a[1])
      .slice(0, n)
      .map(([k, v]) => `  ${Math.round(v).toString().padStart(6)} ms  ${k}`);
  return ['CPU self time by file:', ...top(byFile, 12), 'by function:', ...top(self, 25)];
}

/**
 * P2-WATERFALL: the same timeline for P2's offline repeat visit to Today: signed in, one online
 * visit installs the service worker and stores the round, then no network and CPU ×4.
 */
export async function runP2Waterfall(
  database: Database,
): Promise<{ figures: Figure[]; notes: string[] }> {
  await ensureBuilds();
  await seedDemo(database.db, { bcryptCost: 10 });
  const app = await startBenchApp(database);
  const { browser } = await launchBrowser();
  const notes: string[] = [];
  const roundShown = (p: Page) =>
    p.getByRole('button', { name: 'Ate', exact: true }).first().waitFor({ timeout: 60_000 });
  try {
    const phone = await phoneContext(browser);
    await signInContext(phone, app.baseUrl);
    const online = await phone.newPage();
    await online.goto(`${app.baseUrl}/today`);
    await roundShown(online);
    await underServiceWorker(online);
    await roundShown(online);
    await online.close();
    await cutNetwork(phone);
    await phone.addInitScript(OBSERVE_LONG_TASKS);
    const lines: string[] = [];
    for (let i = 1; i <= 2; i++) {
      const page = await phone.newPage();
      await throttle(phone, page, false);
      await page.goto(`${app.baseUrl}/today`);
      await roundShown(page);
      lines.push(
        ...describe(`Rackside, offline repeat visit ${i} to /today`, await timeline(page)),
      );
      await page.close();
    }
    if (process.env.P3_PROFILE) {
      const profile = await profileFirstVisit(phone, `${app.baseUrl}/today`, roundShown, false);
      lines.push(...profile);
    }
    if (process.env.P2_TRACE) {
      // A Chromium performance trace of one more visit (open it in DevTools' Performance panel).
      const page = await phone.newPage();
      await throttle(phone, page, false);
      await browser.startTracing(page, {
        path: process.env.P2_TRACE,
        categories: ['devtools.timeline', 'disabled-by-default-devtools.timeline', 'v8.execute'],
      });
      await page.goto(`${app.baseUrl}/today`);
      await roundShown(page);
      await timeline(page);
      await browser.stopTracing();
      await page.close();
    }
    console.log(lines.join('\n'));
    notes.push(['P2 waterfall (ms from navigation start):', '```', ...lines, '```'].join('\n'));
  } finally {
    await browser.close();
    await app.close();
  }
  return { figures: [], notes };
}
