// Issue 20, `npm start -- --lan`: the real server process over HTTPS with a certificate made by
// scripts/lan-certificate.ts, bound to 127.0.0.1 (which the certificate names) so no test uses
// this machine's own network address. Node checks the certificate; Chromium (told to ignore
// that it is self-made) opens Scan and its fake camera reads a label over HTTPS.
import { X509Certificate } from 'node:crypto';
import fs from 'node:fs';
import https from 'node:https';
import os from 'node:os';
import path from 'node:path';
import type { TLSSocket } from 'node:tls';
import type { Browser, BrowserContext } from 'playwright-core';
import QRCode from 'qrcode';
import supertest from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { labelUrl } from '#shared/domain/labels/label-payload';
import { makeQrSymbol, QUIET_ZONE_MODULES } from '#shared/domain/labels/qr-symbol';
import type { AnimalSummary } from '#shared/schemas/animals';
import { ensureLanCertificate, type LanCertificate } from '../../scripts/lan-certificate';
import { lanEnv, lanFiles } from '../../scripts/lib/lan.mjs';
import { DEMO_PASSWORD } from '../../server/access/demo-people';
import { connectDatabase } from '../../server/db/client';
import { certificateNames } from '../../server/lan/addresses';
import { seedDemo } from '../../server/seed/demo';
import { launchWithFakeCamera } from '../chromium';
import { testDatabaseUrl } from '../setup/database-urls';
import { createTestContext, createTestDatabase, dropTestDatabase } from '../setup/test-app';
import { writeLabelVideo } from '../support/fake-camera';
import { freePort, startServerProcess, type ServerProcess } from '../support/server-process';
import { expectAccessible, screenshot } from './support';

const OWNER = 'owner@northlight.test';
const tmp = fs.mkdtempSync(path.join(os.tmpdir(), 'rackside-lan-'));
const files = lanFiles(path.join(tmp, 'lan'));
let made: LanCertificate;
let ca: string;
let server: ServerProcess;
let dbName = '';

beforeAll(async () => {
  dbName = await createTestDatabase();
  const databaseUrl = testDatabaseUrl(dbName);
  const database = connectDatabase(databaseUrl, 2);
  await seedDemo(database.db, { bcryptCost: 10 });
  await database.close();
  // A machine with no network address: the certificate still names 127.0.0.1 and localhost.
  made = await ensureLanCertificate(certificateNames([], 'rackside-test'), { files });
  ca = fs.readFileSync(files.caCert, 'utf8');
  const port = await freePort();
  server = await startServerProcess({
    databaseUrl,
    port,
    https: { ca },
    env: {
      ...lanEnv({ HOST: '127.0.0.1' }, files),
      PUBLIC_URL: `https://127.0.0.1:${port}`,
    },
  });
}, 120_000);

afterAll(async () => {
  await server?.kill();
  if (dbName) await dropTestDatabase(dbName);
  fs.rmSync(tmp, { recursive: true, force: true });
});

interface Answer {
  status: number;
  headers: Record<string, string | string[] | undefined>;
  body: string;
  peer: X509Certificate;
  authorized: boolean;
}

function get(pathname: string, options: https.RequestOptions = {}, body?: string): Promise<Answer> {
  return new Promise((resolve, reject) => {
    const req = https.request(
      `${server.url}${pathname}`,
      { ca, method: body ? 'POST' : 'GET', agent: false, ...options },
      (res) => {
        const socket = res.socket as TLSSocket;
        const peer = new X509Certificate(socket.getPeerCertificate(false).raw);
        let text = '';
        res.setEncoding('utf8');
        res.on('data', (c: string) => (text += c));
        res.on('end', () =>
          resolve({
            status: res.statusCode ?? 0,
            headers: res.headers,
            body: text,
            peer,
            authorized: socket.authorized,
          }),
        );
      },
    );
    req.on('error', reject);
    req.end(body);
  });
}

describe('npm start -- --lan: HTTPS with the certificate made for this machine', () => {
  it('serves the made certificate, verified through the home authority, and prints its QR and fingerprints', async () => {
    expect(server.url).toMatch(/^https:\/\/127\.0\.0\.1:\d+$/);
    const res = await get('/api/health');
    expect(res.status).toBe(200);
    expect(res.authorized).toBe(true);
    expect(res.peer.fingerprint256).toBe(made.serverFingerprint);
    expect(res.peer.fingerprint256).toBe(
      new X509Certificate(fs.readFileSync(files.cert)).fingerprint256,
    );
    // Without the authority the certificate is not trusted: it is this machine's own.
    await expect(get('/api/health', { ca: undefined })).rejects.toThrow(
      /unable to verify|self-signed|self signed/i,
    );
    // Nothing answers plain HTTP on that port.
    await expect(fetch(`http://127.0.0.1:${server.port}/api/health`)).rejects.toThrow();

    const printed = server.lines.join('\n');
    expect(printed).toContain(`Rackside is running at ${server.url}`);
    expect(printed).toContain(`scan this or open ${server.url}`);
    expect(printed).toContain(`Certificate to install (SHA-256): ${made.caFingerprint}`);
    expect(printed).toContain(`This server's certificate (SHA-256): ${made.serverFingerprint}`);
    // The terminal QR code of that address, every line of it.
    const qr = (await QRCode.toString(server.url, { type: 'terminal', small: true }))
      .split('\n')
      .filter((l) => /[▀▄█]/.test(l));
    expect(qr.length).toBeGreaterThan(10);
    for (const line of qr) expect(printed).toContain(line);
  });

  it('tells the client it is in LAN mode and offers the authority for download', async () => {
    const status = await get('/api/lan');
    expect(JSON.parse(status.body)).toEqual({
      lanMode: true,
      url: server.url,
      caFingerprint: made.caFingerprint,
      serverFingerprint: made.serverFingerprint,
    });
    const download = await get('/api/lan/certificate');
    expect(download.status).toBe(200);
    expect(download.headers['content-type']).toMatch(/^application\/x-x509-ca-cert/);
    expect(download.headers['content-disposition']).toBe(
      'attachment; filename=rackside-home-authority.crt',
    );
    expect(download.body).toBe(ca);
    const offered = new X509Certificate(download.body);
    expect(offered.ca).toBe(true);
    expect(offered.fingerprint256).toBe(made.caFingerprint);
  });

  it('sets the session cookie Secure over HTTPS', async () => {
    const res = await get(
      '/api/auth/sign-in',
      { headers: { 'content-type': 'application/json', 'x-rackside-client': '1' } },
      JSON.stringify({ email: OWNER, password: DEMO_PASSWORD }),
    );
    expect(res.status).toBe(200);
    const cookie = [res.headers['set-cookie'] ?? []]
      .flat()
      .find((c) => c.startsWith('rackside.sid='));
    expect(cookie).toMatch(/;\s*Secure/i);
    expect(cookie).toMatch(/;\s*HttpOnly/i);
  });

  it('answers neither the download nor LAN facts outside LAN mode', async () => {
    const ctx = await createTestContext();
    try {
      const status = await supertest(ctx.app).get('/api/lan').expect(200);
      expect(status.body).toEqual({ lanMode: false });
      const download = await supertest(ctx.app).get('/api/lan/certificate').expect(404);
      expect(download.body.error.message).toMatch(/^[A-Z].+\.$/);
    } finally {
      await ctx.close();
    }
  });
});

describe('a phone on the home network', () => {
  let browser: Browser;
  let context: BrowserContext;
  let animal: AnimalSummary;

  beforeAll(async () => {
    // The demo owner's first animal, and its label's QR code held up to the fake camera.
    const signIn = await get(
      '/api/auth/sign-in',
      { headers: { 'content-type': 'application/json', 'x-rackside-client': '1' } },
      JSON.stringify({ email: OWNER, password: DEMO_PASSWORD }),
    );
    const cookie = [signIn.headers['set-cookie'] ?? []].flat()[0]!.split(';')[0]!;
    const headers = { cookie, 'x-rackside-client': '1' };
    const me = JSON.parse((await get('/api/auth/me', { headers })).body) as {
      memberships: { collectionId: string; labelTag: string }[];
    };
    const { collectionId, labelTag } = me.memberships[0]!;
    const list = JSON.parse(
      (await get(`/api/collections/${collectionId}/animals`, { headers })).body,
    ) as { animals: AnimalSummary[] };
    animal = list.animals.find((a) => a.labelCode)!;
    const symbol = makeQrSymbol(labelUrl(server.url, labelTag, animal.labelCode));
    const scale = 6;
    const side = (symbol.size + 2 * QUIET_ZONE_MODULES) * scale;
    const grey = new Uint8Array(side * side).fill(255);
    for (let y = 0; y < side; y++)
      for (let x = 0; x < side; x++) {
        const mx = Math.floor(x / scale) - QUIET_ZONE_MODULES;
        const my = Math.floor(y / scale) - QUIET_ZONE_MODULES;
        if (mx >= 0 && my >= 0 && mx < symbol.size && my < symbol.size)
          grey[y * side + x] = symbol.modules[my * symbol.size + mx] ? 0 : 255;
      }
    const video = path.join(tmp, 'label.y4m');
    writeLabelVideo(video, { width: side, height: side, grey });
    browser = await launchWithFakeCamera(video);
    context = await browser.newContext({
      viewport: { width: 360, height: 740 },
      deviceScaleFactor: 2,
      hasTouch: true,
      isMobile: true,
      // The phone has not trusted the home authority in this test: Chromium is told to go on.
      ignoreHTTPSErrors: true,
    });
    await context.grantPermissions(['camera'], { origin: server.url });
  }, 60_000);

  afterAll(async () => {
    await browser?.close();
  });

  it('signs in over HTTPS, opens Scan, and the camera reads a label', async () => {
    const page = await context.newPage();
    const pageErrors: string[] = [];
    page.on('pageerror', (err) => pageErrors.push(err.message));
    await page.goto(`${server.url}/sign-in`);
    expect(await page.evaluate(() => window.isSecureContext)).toBe(true);
    await page.getByLabel('E-mail').fill(OWNER);
    await page.getByLabel('Password').fill(DEMO_PASSWORD);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.waitForURL('**/today');
    await page.getByRole('link', { name: 'Scan' }).click();
    const scanned = page.getByRole('region', { name: 'Scanned label' });
    // Decoding camera frames shares two cores with other test files: the wait is generous.
    await expect
      .poll(() => scanned.innerText().catch(() => ''), { timeout: 45_000, interval: 500 })
      .toContain(animal.name);
    await screenshot(page, 'lan-01-scan-over-https');
    expect(pageErrors).toEqual([]);
    await page.close();
  });

  it('shows on Settings how to use and trust it on the phone, readable in every theme', async () => {
    const page = await context.newPage();
    await page.goto(`${server.url}/settings`);
    const section = page.getByRole('region', { name: 'Use Rackside on your phone' });
    await section.waitFor();
    await expect.poll(() => section.innerText()).toContain(server.url);
    expect(await section.getByRole('img', { name: `QR code of ${server.url}` }).count()).toBe(1);
    const link = section.getByRole('link', { name: "Download this computer's certificate" });
    expect(await link.getAttribute('href')).toBe('/api/lan/certificate');
    expect((await section.innerText()).replace(/\s/g, '')).toContain(made.caFingerprint);
    // The phone gets the file its installer opens.
    const [download] = await Promise.all([page.waitForEvent('download'), link.click()]);
    expect(download.suggestedFilename()).toBe('rackside-home-authority.crt');
    expect(fs.readFileSync(await download.path(), 'utf8')).toBe(ca);
    // Every target at least 48 px high.
    for (const target of [
      link,
      section.getByText('On Android', { exact: true }),
      section.getByText('On iPhone or iPad', { exact: true }),
    ])
      expect((await target.boundingBox())!.height).toBeGreaterThanOrEqual(48);
    await section.getByText('On Android', { exact: true }).click();
    await section.getByText('On iPhone or iPad', { exact: true }).click();
    await expect.poll(() => section.innerText()).toContain('Encryption & credentials');
    expect(await section.innerText()).toContain('Certificate Trust Settings');
    for (const theme of ['light', 'dark', 'night']) {
      await page.evaluate((t) => localStorage.setItem('rackside.theme', t), theme);
      await page.reload();
      await section.waitFor();
      await section.getByText('On Android', { exact: true }).click();
      await expectAccessible(page, `phone setup, ${theme}`, theme);
      await section.getByRole('heading').scrollIntoViewIfNeeded();
      await page.evaluate(() => window.scrollBy(0, -80));
      await screenshot(page, `lan-02-settings-${theme}-360`);
    }
    await page.setViewportSize({ width: 1280, height: 900 });
    await section.scrollIntoViewIfNeeded();
    await expectAccessible(page, 'phone setup, wide');
    await screenshot(page, 'lan-03-settings-night-1280');
    await page.close();
  });
});
