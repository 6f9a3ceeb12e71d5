// What the browser benchmarks share: the production build, the minimal baseline shell and its
// server, Chromium pages with CPU throttling and network emulation, and LCP from the page.
import { execFileSync } from 'node:child_process';
import type { AddressInfo } from 'node:net';
import path from 'node:path';
import react from '@vitejs/plugin-react';
import compression from 'compression';
import express from 'express';
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { build } from 'vite';
import { VitePWA } from 'vite-plugin-pwa';
import { DEMO_PASSWORD } from '../server/access/demo-people';

const root = path.resolve(import.meta.dirname, '..');
export const minimalDir = path.join(root, 'bench', '.minimal-dist');

/** Signs a browser context in (the demo owner unless told otherwise), as the page itself would. */
export async function signInContext(
  context: BrowserContext,
  baseUrl: string,
  email = 'owner@northlight.test',
  password = DEMO_PASSWORD,
) {
  const res = await context.request.post(`${baseUrl}/api/auth/sign-in`, {
    data: { email, password },
    headers: { 'X-Rackside-Client': '1' },
  });
  if (res.status() !== 200) throw new Error(`sign-in as ${email} failed: ${res.status()}`);
}

let built = false;
/** Builds Rackside (production) and the minimal shell once per bench run. */
export async function ensureBuilds() {
  if (built) return;
  execFileSync('npx', ['vite', 'build'], {
    cwd: root,
    stdio: 'ignore',
    env: { ...process.env, NODE_ENV: 'production' },
  });
  // The bench runs with NODE_ENV=test, which would give React's development build and JSX.
  const nodeEnv = process.env.NODE_ENV;
  process.env.NODE_ENV = 'production';
  await build({
    configFile: false,
    logLevel: 'silent',
    root: path.join(root, 'bench', 'minimal-shell'),
    plugins: [
      react(),
      VitePWA({
        registerType: 'prompt',
        injectRegister: false,
        manifest: false,
        workbox: { globPatterns: ['**/*.{js,css,html}'], navigateFallback: '/index.html' },
      }),
    ],
    mode: 'production',
    build: { outDir: minimalDir, emptyOutDir: true },
  }).finally(() => {
    process.env.NODE_ENV = nodeEnv;
  });
  built = true;
}

/** Serves the minimal shell the way our server serves the app (sw.js and pages uncached). */
export async function serveMinimalShell() {
  const app = express();
  // Compressed like the app itself, so the comparison is of the apps, not of the servers.
  app.use(compression());
  app.use(
    express.static(minimalDir, {
      setHeaders: (res, file) => {
        if (file.endsWith('sw.js') || file.endsWith('.html'))
          res.setHeader('Cache-Control', 'no-cache');
      },
    }),
  );
  // dotfiles: the build folder's own name starts with a dot.
  app.use((_req, res) =>
    res
      .setHeader('Cache-Control', 'no-cache')
      .sendFile(path.join(minimalDir, 'index.html'), { dotfiles: 'allow' }),
  );
  const server = await new Promise<import('node:http').Server>((resolve) => {
    const s = app.listen(0, '127.0.0.1', () => resolve(s));
  });
  return {
    baseUrl: `http://127.0.0.1:${(server.address() as AddressInfo).port}`,
    close: () => {
      server.closeAllConnections();
      return new Promise((r) => server.close(r));
    },
  };
}

export async function phoneContext(browser: Browser) {
  return browser.newContext({
    viewport: { width: 360, height: 740 },
    deviceScaleFactor: 2,
    hasTouch: true,
    isMobile: true,
  });
}

/** CPU slowed 4× (CDP Emulation.setCPUThrottlingRate), as the budgets ask. */
export async function throttle(context: BrowserContext, page: Page, slowLink = false) {
  const cdp = await context.newCDPSession(page);
  await cdp.send('Emulation.setCPUThrottlingRate', { rate: 4 });
  if (slowLink) {
    // P3's link: 150 ms round trip, 1.6 Mbit/s down (and 750 kbit/s up).
    await cdp.send('Network.enable');
    await cdp.send('Network.emulateNetworkConditions', {
      offline: false,
      latency: 150,
      downloadThroughput: 1_600_000 / 8,
      uploadThroughput: 750_000 / 8,
    });
  }
  return cdp;
}

/** The page's largest contentful paint so far (ms from navigation start). */
/** The page's last largest-contentful-paint entry: when, and which element it was. */
export async function largestContentfulPaint(
  page: Page,
): Promise<{ startTime: number; element: string }> {
  await page.waitForTimeout(1_000); // let later, larger paints land
  const lcp = await page.evaluate(
    () =>
      new Promise<{ startTime: number; element: string } | null>((resolve) => {
        new PerformanceObserver((list) => {
          const last = list.getEntries().at(-1) as
            (PerformanceEntry & { element?: Element | null }) | undefined;
          if (!last) return resolve(null);
          const el = last.element;
          const text = (el?.textContent ?? '').replace(/\s+/g, ' ').trim().slice(0, 40);
          resolve({
            startTime: last.startTime,
            element: el ? `<${el.tagName.toLowerCase()}> "${text}"` : '(removed element)',
          });
        }).observe({ type: 'largest-contentful-paint', buffered: true });
        setTimeout(() => resolve(null), 3_000);
      }),
  );
  if (lcp === null) throw new Error(`no largest-contentful-paint entry for ${page.url()}`);
  return lcp;
}

export function percentile(values: number[], p: number): number {
  const s = [...values].sort((a, b) => a - b);
  return s[Math.min(s.length - 1, Math.ceil((p / 100) * s.length) - 1)]!;
}
