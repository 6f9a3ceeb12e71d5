import fs from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { distDir, useE2e } from './support';

/** Width and height from a PNG's IHDR chunk (PNG spec, ISO/IEC 15948, 11.2.2). */
function pngSize(file: string): { width: number; height: number } {
  const buf = fs.readFileSync(file);
  expect(buf.subarray(1, 4).toString('ascii')).toBe('PNG');
  return { width: buf.readUInt32BE(16), height: buf.readUInt32BE(20) };
}

const env = useE2e();

describe('installable app', () => {
  // W3C Web App Manifest; Chromium's install criteria: name or short_name, icons of 192 and
  // 512 px, start_url, display standalone/fullscreen/minimal-ui.
  it('has a manifest with what Chromium needs to install the app, and real icons', () => {
    const manifest = JSON.parse(
      fs.readFileSync(path.join(distDir, 'manifest.webmanifest'), 'utf8'),
    );
    expect(manifest.name).toBe('Rackside');
    expect(manifest.short_name).toBeTruthy();
    expect(manifest.start_url).toBe('/today');
    expect(manifest.scope).toBe('/');
    expect(manifest.display).toBe('standalone');
    expect(manifest.theme_color).toMatch(/^#[0-9a-f]{6}$/i);
    expect(manifest.background_color).toMatch(/^#[0-9a-f]{6}$/i);
    for (const [size, purpose] of [
      [192, 'any'],
      [512, 'any'],
      [512, 'maskable'],
    ] as const) {
      const icon = manifest.icons.find(
        (i: { sizes: string; purpose: string }) =>
          i.sizes === `${size}x${size}` && i.purpose === purpose,
      );
      expect(icon, `${size} ${purpose}`).toBeDefined();
      expect(pngSize(path.join(distDir, icon.src))).toEqual({ width: size, height: size });
    }
  });

  it('serves the service worker and page uncached, hashed assets immutable, and never swallows /api', async () => {
    const sw = await fetch(`${env.server.baseUrl}/sw.js`);
    expect(sw.status).toBe(200);
    expect(sw.headers.get('cache-control')).toBe('no-cache');
    const page = await fetch(`${env.server.baseUrl}/animals`, { headers: { Accept: 'text/html' } });
    expect(page.headers.get('cache-control')).toBe('no-cache');
    const html = await page.text();
    const asset = /\/assets\/[\w.-]+\.js/.exec(html)![0];
    expect((await fetch(`${env.server.baseUrl}${asset}`)).headers.get('cache-control')).toContain(
      'immutable',
    );
    const api = await fetch(`${env.server.baseUrl}/api/nothing-here`, {
      headers: { Accept: 'text/html' },
    });
    expect(api.status).toBe(404);
    expect(api.headers.get('content-type')).toContain('application/json');
  });

  it('registers a service worker that precaches the shell and fonts', async () => {
    const context = await env.browser.newContext();
    const page = await context.newPage();
    await page.goto(`${env.server.baseUrl}/sign-in`);
    const cached = await page.evaluate(async () => {
      const reg = await Promise.race([
        navigator.serviceWorker.ready,
        new Promise<null>((r) => setTimeout(() => r(null), 15_000)),
      ]);
      if (!reg) return { active: false, urls: [] as string[] };
      const deadline = Date.now() + 15_000;
      for (;;) {
        const names = await caches.keys();
        const urls: string[] = [];
        for (const name of names)
          for (const req of await (await caches.open(name)).keys())
            urls.push(new URL(req.url).pathname);
        if (urls.some((u) => u.endsWith('.woff2')) || Date.now() > deadline)
          return { active: !!reg.active, urls };
        await new Promise((r) => setTimeout(r, 250));
      }
    });
    expect(cached.active).toBe(true);
    expect(cached.urls).toContain('/index.html');
    expect(cached.urls.some((u) => /nunito-latin-400.*\.woff2$/.test(u))).toBe(true);
    expect(cached.urls.some((u) => u.startsWith('/api'))).toBe(false);
    await context.close();
  });
});
