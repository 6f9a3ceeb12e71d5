// P1: tap → item visibly updated AND the event committed to IndexedDB, with the CPU slowed
// 4×, 200 taps on a 150-item round; against a bare IndexedDB put of a like record in the
// same page. P1-1k: the same on a 1,000-item round. The screen only changes after the tap's
// transaction has committed (recordTap awaits it), so "visibly updated" implies "committed".
import fs from 'node:fs';
import type { Page } from 'playwright-core';
import type { Database } from '../server/db/client';
import { cutNetwork, launchBrowser } from '../tests/chromium';
import { makeKeeper, signInCookie, startBenchApp, BENCH_PASSWORD } from './bench-app';
import { ensureBuilds, percentile, phoneContext, signInContext, throttle } from './browser-setup';
import { median, type Figure } from './results-file';

const TAPS = Number(process.env.P1_TAPS ?? 200);

/** One tap, timed in the page: from the click to the frame that shows its card changed. */
interface TapTiming {
  /** click → frame showing the change: the figure. */
  total: number;
  /** click → the recorder starts (event dispatch, React's handler). */
  dispatch: number;
  /** The IndexedDB transaction (event to the outbox + the tapped item), as the app measures it. */
  idb: number;
  /** Commit → the card's DOM changed (query update, React render and commit). */
  render: number;
  /** DOM changed → the next frame (style, layout, paint and the wait for the frame). */
  frame: number;
  /** click → that frame rendered (style, layout, paint done): the card is on the screen. */
  painted: number;
}

const phases = ['dispatch', 'idb', 'render', 'frame', 'painted'] as const;

/** Bare IndexedDB puts of a record like a tap's outbox entry, timed in the page. */
const barePuts = (page: Page, taps: number) =>
  page.evaluate(async (taps) => {
    const db = await new Promise<IDBDatabase>((resolve) => {
      const req = indexedDB.open('bench-baseline', 1);
      req.onupgradeneeded = () => req.result.createObjectStore('events', { keyPath: 'id' });
      req.onsuccess = () => resolve(req.result);
    });
    const times: number[] = [];
    for (let i = 0; i < taps; i++) {
      const record = {
        id: crypto.randomUUID(),
        userId: crypto.randomUUID(),
        collectionId: crypto.randomUUID(),
        animalName: `Animal ${i}`,
        byName: 'Bench keeper',
        event: {
          id: crypto.randomUUID(),
          animalId: crypto.randomUUID(),
          kind: 'ate',
          payload: {},
          clientRecordedAt: new Date().toISOString(),
        },
      };
      const t0 = performance.now();
      const tx = db.transaction('events', 'readwrite');
      tx.objectStore('events').put(record);
      await new Promise((r) => (tx.oncomplete = r));
      times.push(performance.now() - t0);
      await new Promise((r) => setTimeout(r, 50));
    }
    db.close();
    return times;
  }, taps);

/**
 * Taps down the round in walk order, "Ate" on each card, then from the top again with
 * "Refused". Cards may be rendered only near the viewport (a virtual list), so each next card
 * is brought into view first — outside the timed span, as a keeper's thumb scrolls to it.
 */
const tapDownTheRound = (page: Page, taps: number) =>
  page.evaluate(async (taps) => {
    const w = window as unknown as { longTasks: number[] };
    w.longTasks = [];
    new PerformanceObserver((list) =>
      list.getEntries().forEach((e) => w.longTasks.push(e.duration)),
    ).observe({ type: 'longtask' });
    const frames = (n: number) =>
      new Promise<void>((resolve) => {
        const step = (left: number) =>
          left ? requestAnimationFrame(() => step(left - 1)) : resolve();
        step(n);
      });
    const byLabel = (label: string) =>
      document.querySelector<HTMLElement>(`article[aria-label="${CSS.escape(label)}"]`);
    const raw: { t0: number; dom: number; frame: number; painted: number }[] = [];
    let prev: string | null = null;
    let pass = 0;
    for (let i = 0; i < taps; i++) {
      let article: HTMLElement | undefined;
      const before = prev ? byLabel(prev) : null;
      if (before) {
        before.scrollIntoView({ block: 'start' });
        await frames(3); // the list renders the cards that came into view
        const all = [...document.querySelectorAll<HTMLElement>('article')];
        article = all[all.indexOf(before) + 1];
      }
      if (!article) {
        if (prev) pass += 1; // the end of the round: from the top again
        window.scrollTo(0, 0);
        await frames(3);
        article = document.querySelector<HTMLElement>('article') ?? undefined;
      }
      if (!article) throw new Error(`no card to tap at tap ${i}`);
      prev = article.getAttribute('aria-label');
      const word = pass === 0 ? 'Ate' : 'Refused';
      const button = [...article.querySelectorAll('button')].find(
        (b) => b.textContent?.trim() === word,
      );
      if (!button) throw new Error(`no ${word} button on ${prev} (tap ${i})`);
      // A keeper taps what is on screen: bring the button into view first (not timed).
      button.scrollIntoView({ block: 'center' });
      await frames(2);
      let dom = 0;
      const changed = new Promise<void>((resolve) => {
        const observer = new MutationObserver(() => {
          dom = performance.now();
          observer.disconnect();
          resolve();
        });
        observer.observe(article, {
          subtree: true,
          childList: true,
          characterData: true,
          attributes: true,
        });
      });
      performance.mark('p1:tap');
      const t0 = performance.now();
      button.click();
      await changed;
      await new Promise((r) => requestAnimationFrame(() => r(null))); // the frame that shows it
      const frame = performance.now();
      // A task queued in that frame's rAF runs once the frame is rendered: the card is painted.
      await new Promise((r) => {
        const channel = new MessageChannel();
        channel.port1.onmessage = r;
        channel.port2.postMessage(null);
      });
      const painted = performance.now();
      performance.mark('p1:tap-end');
      raw.push({ t0, dom, frame, painted });
      await new Promise((r) => setTimeout(r, 50));
    }
    const committed = performance.getEntriesByName('rackside:tap-committed');
    return { raw, committed: committed.map((e) => ({ start: e.startTime, duration: e.duration })) };
  }, taps);

const outboxCount = (page: Page) =>
  page.evaluate(
    () =>
      new Promise<number>((resolve) => {
        const req = indexedDB.open('rackside');
        req.onsuccess = () => {
          const count = req.result.transaction('outbox').objectStore('outbox').count();
          count.onsuccess = () => resolve(count.result);
        };
      }),
  );

export interface TapRun {
  items: number;
  taps: number;
  timings: TapTiming[];
  puts: number[];
  longTasks: number[];
}

/** Opens a fresh keeper's round of `items` animals and times `taps` taps and as many bare puts. */
export async function measureTaps(
  database: Database,
  items: number,
  taps: number,
  /** Where to write a Chromium performance trace of the taps (P1_TRACE): where time goes. */
  tracePath?: string,
): Promise<TapRun> {
  const app = await startBenchApp(database);
  const { browser } = await launchBrowser();
  try {
    const keeper = await makeKeeper(database, items, `p1-${items}`);
    await signInCookie(app.baseUrl, keeper.email); // checks the account works before the browser does
    const context = await phoneContext(browser);
    await signInContext(context, app.baseUrl, keeper.email, BENCH_PASSWORD);
    const page = await context.newPage();
    // tsx keeps function names with a `__name` helper the page lacks (helpers in the taps' code).
    await page.addInitScript('globalThis.__name = (f) => f');
    await page.goto(`${app.baseUrl}/today`);
    // The whole round is loaded when the progress bar counts every animal (each has work).
    await page.waitForSelector(`[role="progressbar"][aria-valuemax="${items}"]`, {
      timeout: 60_000,
    });
    await page.waitForSelector('article');
    // The back room: no network, so sync attempts do not mix into the figures.
    await cutNetwork(context);
    await throttle(context, page);

    const puts = await barePuts(page, taps);
    if (tracePath)
      await browser.startTracing(page, {
        path: tracePath,
        categories: [
          'devtools.timeline',
          'disabled-by-default-devtools.timeline',
          'v8.execute',
          'blink.user_timing',
        ],
      });
    // P1_CPUPROFILE: a JavaScript profile of the taps (open in Chromium's DevTools).
    const profiler = process.env.P1_CPUPROFILE ? await context.newCDPSession(page) : null;
    if (profiler) {
      await profiler.send('Profiler.enable');
      await profiler.send('Profiler.start');
    }
    const { raw, committed } = await tapDownTheRound(page, taps);
    if (tracePath) await browser.stopTracing();
    if (profiler) {
      const { profile } = await profiler.send('Profiler.stop');
      fs.writeFileSync(`${process.env.P1_CPUPROFILE}-${items}.cpuprofile`, JSON.stringify(profile));
    }
    const longTasks = await page.evaluate(
      () => (window as unknown as { longTasks: number[] }).longTasks,
    );
    if (committed.length !== taps)
      throw new Error(`P1: ${committed.length} commits measured for ${taps} taps`);
    const outbox = await outboxCount(page);
    if (outbox !== taps)
      throw new Error(`P1: expected ${taps} taps in the outbox, found ${outbox}`);
    await context.close();
    const timings = raw.map(({ t0, dom, frame, painted }, i) => {
      const c = committed[i]!;
      return {
        total: frame - t0,
        painted: painted - t0,
        dispatch: c.start - t0,
        idb: c.duration,
        render: dom - (c.start + c.duration),
        frame: frame - dom,
      };
    });
    return { items, taps, timings, puts, longTasks };
  } finally {
    await browser.close();
    await app.close();
  }
}

const ms = (n: number) => n.toFixed(1);

/** The run in words: the figure, the baseline, and where a tap's time goes. */
export function describeRun(id: string, run: TapRun): string {
  const total = run.timings.map((t) => t.total);
  const split = phases
    .map((p) => {
      const v = run.timings.map((t) => t[p]);
      return `${p} ${ms(median(v))}/${ms(percentile(v, 95))}`;
    })
    .join(', ');
  const lt = run.longTasks;
  return `${id}: ${run.taps} taps on a ${run.items}-item round: tap p50 ${ms(median(total))} ms, p95 ${ms(percentile(total, 95))} ms, max ${ms(Math.max(...total))} ms; bare put p50 ${ms(median(run.puts))} ms, p95 ${ms(percentile(run.puts, 95))} ms; a tap's time, p50/p95 ms: ${split}; main-thread tasks over 50 ms during the taps: ${lt.length}${lt.length ? ` (longest ${Math.max(...lt).toFixed(0)} ms)` : ''}.`;
}

function ratioFigure(id: string, run: TapRun): Figure & { ratio: number } {
  const tapP95 = Number(
    percentile(
      run.timings.map((t) => t.total),
      95,
    ).toFixed(1),
  );
  const putP95 = Number(percentile(run.puts, 95).toFixed(1));
  const ratio = Number((tapP95 / putP95).toFixed(2));
  return {
    id,
    what: `tap p95 (${run.taps} taps, ${run.items}-item round) as a multiple of a bare IndexedDB put p95 (same page, same throttle)`,
    value: tapP95,
    unit: 'ms',
    target: 'ratio ≤ 3',
    baseline: putP95,
    ratio,
    pass: ratio <= 3,
  };
}

export async function runP1(database: Database): Promise<{ figures: Figure[]; notes: string[] }> {
  await ensureBuilds();
  const run = await measureTaps(
    database,
    Number(process.env.P1_ITEMS ?? 150),
    TAPS,
    process.env.P1_TRACE,
  );
  const ratio = ratioFigure('P1', run);
  return {
    figures: [
      {
        id: 'P1',
        what: `tap → item updated and event committed, p95 of ${run.taps} taps on a ${run.items}-item round, CPU ×4`,
        value: ratio.value,
        unit: 'ms',
        target: 50,
        pass: ratio.value <= 50,
      },
      ratio,
    ],
    notes: [describeRun('P1', run)],
  };
}

/** P1-1k: the same taps on a 1,000-item round; the budget is the ratio alone. */
export async function runP1k(database: Database): Promise<{ figures: Figure[]; notes: string[] }> {
  await ensureBuilds();
  const run = await measureTaps(
    database,
    Number(process.env.P1_1K_ITEMS ?? 1000),
    TAPS,
    process.env.P1_TRACE?.replace(/(\.json)?$/, '-1k.json'),
  );
  return { figures: [ratioFigure('P1-1k', run)], notes: [describeRun('P1-1k', run)] };
}
