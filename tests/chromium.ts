// This machine's Chromium (CHROMIUM_PATH, else by name on PATH) driven by playwright-core, for end-to-end tests and browser benchmarks.
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { chromium, type Browser, type BrowserContext, type Page } from 'playwright-core';
import { chromiumPath } from '../scripts/lib/chromium.mjs';

export { chromiumPath };

// Flags from the machine notes: headless, no sandbox as root, and no background traffic to a
// network this machine does not have.
export const CHROMIUM_ARGS = [
  '--no-sandbox',
  '--disable-gpu',
  '--disable-quic',
  '--no-first-run',
  '--disable-background-networking',
  '--disable-component-update',
  '--disable-sync',
];

export async function launchBrowser(): Promise<{ browser: Browser; userDataDir: string }> {
  const userDataDir = fs.mkdtempSync(path.join(os.tmpdir(), 'rackside-chromium-'));
  const browser = await chromium.launch({
    executablePath: chromiumPath(),
    headless: true,
    args: CHROMIUM_ARGS,
  });
  return { browser, userDataDir };
}

/** Chromium whose camera is a video file (a printed label filmed): Scan decodes what it shows. */
export function launchWithFakeCamera(video: string): Promise<Browser> {
  return chromium.launch({
    executablePath: chromiumPath(),
    headless: true,
    args: [
      ...CHROMIUM_ARGS,
      '--use-fake-device-for-media-stream',
      '--use-fake-ui-for-media-stream',
      `--use-file-for-fake-video-capture=${video}`,
    ],
  });
}

/** Waits until a service worker controls the page, so a reload is served from its cache. */
export async function underServiceWorker(page: Page) {
  await page.evaluate(() => navigator.serviceWorker.ready);
  await page.reload();
  await page.waitForFunction(() => !!navigator.serviceWorker.controller, undefined, {
    timeout: 15_000,
  });
}

/**
 * No network for the pages AND their service worker: `setOffline` alone does not stop requests
 * the service worker makes, so every request that reaches the network is aborted too.
 */
export async function cutNetwork(context: BrowserContext) {
  await context.setOffline(true);
  await context.route('**/*', (route) => route.abort('internetdisconnected'));
}

export async function restoreNetwork(context: BrowserContext) {
  await context.unroute('**/*');
  await context.setOffline(false);
}
