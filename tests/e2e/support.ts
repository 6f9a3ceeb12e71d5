// End-to-end harness: the production build served by the real Express app on a real
// database seeded with the demo, driven by Debian's Chromium through playwright-core.
import fs from 'node:fs';
import type { AddressInfo } from 'node:net';
import path from 'node:path';
import AxeBuilder from '@axe-core/playwright';
import { eq } from 'drizzle-orm';
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { afterAll, beforeAll, beforeEach, expect } from 'vitest';
import { localDateOf } from '#shared/domain/local-dates';
import { DEMO_COLLECTION, DEMO_PASSWORD } from '../../server/access/demo-people';
import { invites, memberships } from '../../server/db/schema/collections';
import { users } from '../../server/db/schema/users';
import { startPaymentFake, type PaymentFake } from '../../server/payment-fake/payment-fake';
import { seedDemo } from '../../server/seed/demo';
import { launchBrowser } from '../chromium';
import { createTestContext, type TestContext } from '../setup/test-app';

export const distDir = path.resolve(import.meta.dirname, '../../dist');
export const screenshotsDir = path.resolve(import.meta.dirname, '../../test-results/screenshots');

export interface E2eServer {
  ctx: TestContext;
  /** Sales — payments: the local fake of the card payment service the app pays through. */
  paymentFake: PaymentFake;
  baseUrl: string;
  /** Seeds the demo afresh when the collection's local day has turned since the last seed. */
  reseedIfDayTurned(): Promise<void>;
  /** Stops answering (connections refused), as a server out of reach does. */
  stop(): Promise<void>;
  /** Answers again on the same address. */
  resume(): Promise<void>;
  close(): Promise<void>;
}

const demoToday = () => localDateOf(new Date(), DEMO_COLLECTION.timeZone);

export async function startServer(): Promise<E2eServer> {
  if (!fs.existsSync(path.join(distDir, 'index.html')))
    throw new Error('No production build: run `vite build` first (npm test does).');
  let baseUrl = '';
  const paymentFake = await startPaymentFake();
  const ctx = await createTestContext({
    distDir,
    publicUrl: undefined,
    payments: {
      secretKey: paymentFake.secretKey,
      webhookSecret: paymentFake.webhookSecret,
      apiUrl: paymentFake.url,
    },
  });
  await seedDemo(ctx.database.db, { bcryptCost: 10 });
  let seededFor = demoToday();
  const listen = (port: number) =>
    new Promise<import('node:http').Server>((resolve) => {
      const s = ctx.app.listen(port, '127.0.0.1', () => resolve(s));
    });
  let server: import('node:http').Server | null = await listen(0);
  const port = (server.address() as AddressInfo).port;
  baseUrl = `http://127.0.0.1:${port}`;
  paymentFake.setWebhookTarget(`${baseUrl}/api/payments/webhook`);
  const stop = async () => {
    if (!server) return;
    const s = server;
    server = null;
    s.closeAllConnections();
    await new Promise((r) => s.close(r));
  };
  return {
    ctx,
    paymentFake,
    baseUrl,
    // The demo's round is relative to the day it was seeded; a run that crosses local midnight
    // would otherwise find yesterday's fed animals gone from today's round.
    async reseedIfDayTurned() {
      if (demoToday() === seededFor) return;
      await seedDemo(ctx.database.db, { bcryptCost: 10, reset: true });
      seededFor = demoToday();
    },
    stop,
    async resume() {
      server ??= await listen(port);
    },
    async close() {
      await stop();
      await ctx.close();
      await paymentFake.stop();
    },
  };
}

/** A phone-sized page (360 × 740) that fails the test on any console error from the app. */
export async function phonePage(
  browser: Browser,
): Promise<{ context: BrowserContext; page: Page; consoleErrors: string[] }> {
  const context = await browser.newContext({
    viewport: { width: 360, height: 740 },
    deviceScaleFactor: 2,
    hasTouch: true,
    isMobile: true,
  });
  const page = await context.newPage();
  const consoleErrors: string[] = [];
  page.on('console', (msg) => {
    // 401 from /api/auth/me on a signed-out start is expected; the browser logs every failed fetch.
    if (msg.type() === 'error' && !/status of 401/.test(msg.text())) consoleErrors.push(msg.text());
  });
  page.on('pageerror', (err) => consoleErrors.push(err.message));
  return { context, page, consoleErrors };
}

/**
 * The test app's public address is http://rackside.test (links in e-mails, the payment
 * service's way back): in this browser context they lead to the e2e server instead.
 */
export async function followPublicLinks(context: BrowserContext, baseUrl: string) {
  await context.route('http://rackside.test/**', (route) =>
    route.fulfill({
      status: 302,
      headers: { location: route.request().url().replace('http://rackside.test', baseUrl) },
    }),
  );
}

/**
 * axe-core: no serious or critical violation (WCAG 2.2 A/AA rules). In a theme other than the
 * first, only the rules a theme can change: themes set colours and nothing else (src/index.css),
 * so names, roles, structure and target sizes were checked in the first.
 */
export async function expectAccessible(page: Page, label: string, theme?: string) {
  const builder = new AxeBuilder({ page });
  if (theme && theme !== 'light') builder.withRules(['color-contrast', 'link-in-text-block']);
  else builder.withTags(['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa', 'wcag22aa']);
  const results = await builder.analyze();
  const bad = results.violations.filter((v) => v.impact === 'serious' || v.impact === 'critical');
  expect(
    bad.map(
      (v) => `${label}: ${v.id} — ${v.help} (${v.nodes.map((n) => n.target.join(' ')).join(', ')})`,
    ),
  ).toEqual([]);
}

export async function screenshot(page: Page, name: string) {
  fs.mkdirSync(screenshotsDir, { recursive: true });
  await page.screenshot({ path: path.join(screenshotsDir, `${name}.png`), fullPage: false });
}

/** Registers the usual hooks: one seeded server and one browser for the whole test file. */
export function useE2e(): { readonly server: E2eServer; readonly browser: Browser } {
  const env = {} as { server: E2eServer; browser: Browser };
  beforeAll(async () => {
    env.server = await startServer();
    ({ browser: env.browser } = await launchBrowser());
  });
  beforeEach(() => env.server.reseedIfDayTurned());
  afterAll(async () => {
    await env.browser?.close();
    await env.server?.close();
  });
  return env;
}

/** Signs a demo person in through the form and waits for Today. */
export async function signInAsDemo(page: Page, baseUrl: string, email: string) {
  await page.goto(`${baseUrl}/sign-in`);
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(DEMO_PASSWORD);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.waitForURL('**/today');
}

/** The demo helper's cover runs now (a day either side), and they have read the safety page. */
export async function startDemoHelpersCover(server: E2eServer) {
  const db = server.ctx.database.db;
  const [helper] = await db
    .select({ id: users.id })
    .from(users)
    .where(eq(users.email, 'helper@northlight.test'));
  const now = Date.now();
  await db
    .update(memberships)
    .set({
      startsAt: new Date(now - 86_400_000),
      endsAt: new Date(now + 86_400_000),
      safetyAcknowledgedAt: new Date(now),
    })
    .where(eq(memberships.userId, helper!.id));
  // The owner's cover page lists the cover from its invite: the same days there.
  await db
    .update(invites)
    .set({ startsAt: new Date(now - 86_400_000), endsAt: new Date(now + 86_400_000) })
    .where(eq(invites.acceptedBy, helper!.id));
}
