// Renders public/icons/icon.svg to the PNG sizes the manifest lists (run by hand after
// changing the icon; the PNGs are committed). Uses this machine's Chromium (scripts/lib/chromium.mjs) through playwright-core.
import fs from 'node:fs';
import path from 'node:path';
import { chromium } from 'playwright-core';
import { chromiumPath } from './lib/chromium.mjs';
import { repoRoot } from './lib/setup.mjs';

const dir = path.join(repoRoot, 'public', 'icons');
const svg = fs.readFileSync(path.join(dir, 'icon.svg'), 'utf8');
const browser = await chromium.launch({
  executablePath: chromiumPath(),
  args: ['--no-sandbox', '--disable-gpu'],
});
const page = await browser.newPage();
async function render(file, size, maskable) {
  await page.setViewportSize({ width: size, height: size });
  // Maskable icons keep their content inside the central 80% "safe zone" (W3C Web App Manifest).
  const inner = maskable
    ? `<div style="width:${size}px;height:${size}px;background:#241c15;display:grid;place-items:center">${svg.replace('<svg ', `<svg width="${size * 0.72}" height="${size * 0.72}" `)}</div>`
    : svg.replace('<svg ', `<svg width="${size}" height="${size}" `);
  await page.setContent(
    `<html><body style="margin:0;background:transparent">${inner}</body></html>`,
  );
  await page.screenshot({ path: path.join(dir, file), omitBackground: !maskable });
}
await render('icon-192.png', 192, false);
await render('icon-512.png', 512, false);
await render('icon-maskable-512.png', 512, true);
await browser.close();
console.log('icons written');
