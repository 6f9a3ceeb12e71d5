import { execFileSync } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import jsQR from 'jsqr';

/** One rasterised PDF page in 8-bit grey. */
export interface GreyPage {
  width: number;
  height: number;
  dpi: number;
  grey: Uint8Array;
}

export interface BoxMm {
  x: number;
  y: number;
  widthMm: number;
  heightMm: number;
}

/** Reads a binary PGM (Netpbm "P5", 8-bit), which is what `pdftoppm -gray` writes. */
function readPgm(file: Buffer, dpi: number): GreyPage {
  const tokens: string[] = [];
  let i = 0;
  while (tokens.length < 4) {
    while (/\s/.test(String.fromCharCode(file[i]!))) i++;
    if (file[i] === 0x23) {
      while (file[i] !== 0x0a) i++;
      continue;
    }
    let t = '';
    while (!/\s/.test(String.fromCharCode(file[i]!))) t += String.fromCharCode(file[i++]!);
    tokens.push(t);
  }
  const [magic, w, h, max] = tokens;
  if (magic !== 'P5' || max !== '255') throw new Error(`not an 8-bit PGM: ${magic} ${max}`);
  const width = Number(w);
  const height = Number(h);
  return { width, height, dpi, grey: file.subarray(i + 1, i + 1 + width * height) };
}

/** Every page of a PDF at `dpi`, rasterised by poppler's pdftoppm (an independent renderer). */
export function rasterisePdf(pdf: Buffer, dpi = 300): GreyPage[] {
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'rackside-pdf-'));
  try {
    fs.writeFileSync(path.join(dir, 'in.pdf'), pdf);
    execFileSync('pdftoppm', ['-r', String(dpi), '-gray', path.join(dir, 'in.pdf'), path.join(dir, 'page')]);
    return fs
      .readdirSync(dir)
      .filter((f) => f.endsWith('.pgm'))
      .sort()
      .map((f) => readPgm(fs.readFileSync(path.join(dir, f)), dpi));
  } finally {
    fs.rmSync(dir, { recursive: true, force: true });
  }
}

const px = (page: GreyPage, mm: number) => Math.round((mm / 25.4) * page.dpi);

/** A region of a page as RGBA, padded with white so jsQR sees a generous quiet zone. */
function crop(page: GreyPage, box: BoxMm, padPx = 0) {
  const x0 = px(page, box.x);
  const y0 = px(page, box.y);
  const w = px(page, box.widthMm) + 2 * padPx;
  const h = px(page, box.heightMm) + 2 * padPx;
  const rgba = new Uint8ClampedArray(w * h * 4).fill(255);
  for (let y = padPx; y < h - padPx; y++) {
    for (let x = padPx; x < w - padPx; x++) {
      const sx = x0 + x - padPx;
      const sy = y0 + y - padPx;
      const v = sx < page.width && sy < page.height ? page.grey[sy * page.width + sx]! : 255;
      const o = (y * w + x) * 4;
      rgba[o] = rgba[o + 1] = rgba[o + 2] = v;
    }
  }
  return { rgba, w, h };
}

/** The text of the one QR symbol inside `box` (mm from the page's corner), or null. */
export function decodeQrIn(page: GreyPage, box: BoxMm): string | null {
  const { rgba, w, h } = crop(page, box, px(page, 3));
  return jsQR(rgba, w, h, { inversionAttempts: 'dontInvert' })?.data ?? null;
}

/** The size of the dark marks inside `box`, in mm: a QR symbol's printed width and height. */
export function darkExtentMm(page: GreyPage, box: BoxMm): { widthMm: number; heightMm: number } {
  const x0 = px(page, box.x);
  const y0 = px(page, box.y);
  let [minX, minY, maxX, maxY] = [Infinity, Infinity, -Infinity, -Infinity];
  for (let y = y0; y < y0 + px(page, box.heightMm); y++) {
    for (let x = x0; x < x0 + px(page, box.widthMm); x++) {
      if (page.grey[y * page.width + x]! < 128) {
        minX = Math.min(minX, x);
        maxX = Math.max(maxX, x);
        minY = Math.min(minY, y);
        maxY = Math.max(maxY, y);
      }
    }
  }
  const toMm = (n: number) => (n / page.dpi) * 25.4;
  return { widthMm: toMm(maxX - minX + 1), heightMm: toMm(maxY - minY + 1) };
}

/** Grey pixels of a region, for feeding a fake camera. */
export function greyRegion(page: GreyPage, box: BoxMm): { width: number; height: number; grey: Uint8Array } {
  const x0 = px(page, box.x);
  const y0 = px(page, box.y);
  const width = px(page, box.widthMm);
  const height = px(page, box.heightMm);
  const grey = new Uint8Array(width * height);
  for (let y = 0; y < height; y++) grey.set(page.grey.subarray((y0 + y) * page.width + x0, (y0 + y) * page.width + x0 + width), y * width);
  return { width, height, grey };
}
