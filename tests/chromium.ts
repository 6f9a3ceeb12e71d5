// Debian's Chromium driven by playwright-core, for end-to-end tests and browser benchmarks.
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { chromium, type Browser } from 'playwright-core';

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
  const browser = await chromium.launch({ executablePath: '/usr/bin/chromium', headless: true, args: CHROMIUM_ARGS });
  return { browser, userDataDir };
}
