// P1: tap → item visibly updated AND the event committed to IndexedDB, with the CPU slowed
// 4×, 200 taps on a 150-item round; against a bare IndexedDB put of a like record in the
// same page. The screen only changes after the tap's transaction has committed (recordTap
// awaits it), so "visibly updated" implies "committed".
import type { Database } from '../server/db/client';
import { cutNetwork, launchBrowser } from '../tests/chromium';
import { makeKeeper, signInCookie, startBenchApp, BENCH_PASSWORD } from './bench-app';
import { ensureBuilds, percentile, phoneContext, throttle } from './browser-setup';
import { median, type Figure } from './results-file';

const ITEMS = Number(process.env.P1_ITEMS ?? 150);
const TAPS = Number(process.env.P1_TAPS ?? 200);

export async function runP1(database: Database): Promise<{ figures: Figure[]; notes: string[] }> {
  await ensureBuilds();
  const app = await startBenchApp(database);
  const { browser } = await launchBrowser();
  try {
    const keeper = await makeKeeper(database, ITEMS, 'p1');
    await signInCookie(app.baseUrl, keeper.email); // checks the account works before the browser does
    const context = await phoneContext(browser);
    const signIn = await context.request.post(`${app.baseUrl}/api/auth/sign-in`, {
      data: { email: keeper.email, password: BENCH_PASSWORD },
      headers: { 'X-Rackside-Client': '1' },
    });
    if (signIn.status() !== 200) throw new Error(`P1 sign-in failed: ${signIn.status()}`);
    const page = await context.newPage();
    await page.goto(`${app.baseUrl}/today`);
    await page.waitForFunction((n) => document.querySelectorAll('article').length >= n, ITEMS, {
      timeout: 60_000,
    });
    // The back room: no network, so sync attempts do not mix into the figures.
    await cutNetwork(context);
    await throttle(context, page);

    const put = await page.evaluate(async (taps) => {
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
    }, TAPS);

    const tap = await page.evaluate(async (taps) => {
      const w = window as unknown as { longTasks: number[] };
      w.longTasks = [];
      new PerformanceObserver((list) =>
        list.getEntries().forEach((e) => w.longTasks.push(e.duration)),
      ).observe({ type: 'longtask' });
      const articles = [...document.querySelectorAll('article')];
      const times: number[] = [];
      for (let i = 0; i < taps; i++) {
        const article = articles[i % articles.length]!;
        const word = i < articles.length ? 'Ate' : 'Refused';
        const button = [...article.querySelectorAll('button')].find(
          (b) => b.textContent?.trim() === word,
        );
        if (!button) throw new Error(`no ${word} button on item ${i}`);
        // A keeper taps what is on screen: bring the item into view first (not timed).
        button.scrollIntoView({ block: 'center' });
        await new Promise((r) => requestAnimationFrame(() => requestAnimationFrame(() => r(null))));
        const changed = new Promise<void>((resolve) => {
          const observer = new MutationObserver(() => {
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
        const t0 = performance.now();
        button.click();
        await changed;
        await new Promise((r) => requestAnimationFrame(() => r(null))); // the frame that shows it
        times.push(performance.now() - t0);
        await new Promise((r) => setTimeout(r, 50));
      }
      return times;
    }, TAPS);
    const longTasks = await page.evaluate(
      () => (window as unknown as { longTasks: number[] }).longTasks,
    );
    const committed = await page.evaluate(() =>
      performance.getEntriesByName('rackside:tap-committed').map((e) => e.duration),
    );
    const outbox = await page.evaluate(
      () =>
        new Promise<number>((resolve) => {
          const req = indexedDB.open('rackside');
          req.onsuccess = () => {
            const count = req.result.transaction('outbox').objectStore('outbox').count();
            count.onsuccess = () => resolve(count.result);
          };
        }),
    );
    if (outbox !== TAPS)
      throw new Error(`P1: expected ${TAPS} taps in the outbox, found ${outbox}`);
    await context.close();

    const tapP95 = Number(percentile(tap, 95).toFixed(1));
    const putP95 = Number(percentile(put, 95).toFixed(1));
    const ratio = Number((tapP95 / putP95).toFixed(2));
    return {
      figures: [
        {
          id: 'P1',
          what: `tap → item updated and event committed, p95 of ${TAPS} taps on a ${ITEMS}-item round, CPU ×4`,
          value: tapP95,
          unit: 'ms',
          target: 50,
          pass: tapP95 <= 50,
        },
        {
          id: 'P1',
          what: 'tap p95 as a multiple of a bare IndexedDB put p95 (same page, same throttle)',
          value: tapP95,
          unit: 'ms',
          target: 'ratio ≤ 3',
          baseline: putP95,
          ratio,
          pass: ratio <= 3,
        },
      ],
      notes: [
        `P1: tap p50 ${median(tap).toFixed(1)} ms, p95 ${tapP95} ms, max ${Math.max(...tap).toFixed(1)} ms; bare put p50 ${median(put).toFixed(1)} ms, p95 ${putP95} ms; of a tap, the IndexedDB transaction alone: p50 ${median(committed).toFixed(1)} ms, p95 ${percentile(committed, 95).toFixed(1)} ms; main-thread tasks over 50 ms during the taps: ${longTasks.length}${longTasks.length ? ` (longest ${Math.max(...longTasks).toFixed(0)} ms)` : ''}.`,
      ],
    };
  } finally {
    await browser.close();
    await app.close();
  }
}
