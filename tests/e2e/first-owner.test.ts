// A fresh install started without the demo (`npm start -- --no-demo`): an empty database, and
// the first person to open the app makes the first owner's account and lands on Today.
import type { Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import type { Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { launchBrowser } from '../chromium';
import { PASSWORD } from '../factories';
import { createTestContext, type TestContext } from '../setup/test-app';
import { distDir, expectAccessible, phonePage, screenshot } from './support';

let ctx: TestContext;
let server: Server;
let browser: Browser;
let baseUrl: string;

beforeAll(async () => {
  ctx = await createTestContext({ distDir, publicUrl: undefined, demo: false });
  server = await new Promise<Server>((resolve) => {
    const s = ctx.app.listen(0, '127.0.0.1', () => resolve(s));
  });
  baseUrl = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
  ({ browser } = await launchBrowser());
});

afterAll(async () => {
  await browser?.close();
  server?.closeAllConnections();
  await new Promise((r) => (server ? server.close(r) : r(undefined)));
  await ctx?.close();
});

describe('the first visit to a server without the demo', () => {
  it('leads the first visitor from the start page to making the first owner, then to Today', async () => {
    const { context, page, consoleErrors } = await phonePage(browser);
    await page.goto(baseUrl);
    await page.getByRole('heading', { name: 'Welcome to Rackside' }).waitFor();
    // No demo here: no demo accounts offered.
    expect(await page.getByText('Demo accounts').count()).toBe(0);
    await expectAccessible(page, 'first-owner form');
    await screenshot(page, 'first-owner-01-form');

    // The form says what is missing before it goes anywhere.
    await page.getByRole('button', { name: 'Create the first account' }).click();
    await page.getByText('Enter an e-mail address such as name@example.com.').waitFor();

    await page.getByLabel('E-mail').fill('keeper@home.example');
    await page.getByLabel('Your name').fill('Sam');
    await page.getByLabel('Password').fill(PASSWORD);
    await page.getByLabel('Collection name').fill('Spare room racks');
    await page.getByRole('button', { name: 'Create the first account' }).click();
    await page.waitForURL('**/today');
    await screenshot(page, 'first-owner-02-today');

    // The account is real: a second visitor is offered sign-in, and the password works.
    const second = await phonePage(browser);
    await second.page.goto(`${baseUrl}/sign-in`);
    await second.page.getByRole('button', { name: 'Sign in' }).waitFor();
    expect(await second.page.getByText('Welcome to Rackside').count()).toBe(0);
    await second.page.getByLabel('E-mail').fill('keeper@home.example');
    await second.page.getByLabel('Password').fill(PASSWORD);
    await second.page.getByRole('button', { name: 'Sign in' }).click();
    await second.page.waitForURL('**/today');
    expect(second.consoleErrors).toEqual([]);
    await second.context.close();

    expect(consoleErrors).toEqual([]);
    await context.close();
  });
});
