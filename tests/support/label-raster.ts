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
    execFileSync('pdftoppm', [
      '-r',
      String(dpi),
      '-gray',
      path.join(dir, 'in.pdf'),
      path.join(dir, 'page'),
    ]);
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

export interface MeasuredSymbol {
  text: string;
  /** Modules per side, from the decoded version: 4·version + 17 (ISO/IEC 18004:2015, 5.3.1). */
  modules: number;
  /** Outer edge to outer edge of the finder patterns: the symbol's printed size. */
  widthMm: number;
  heightMm: number;
  /** One module, from the top-left finder pattern's own width (7 modules, ISO/IEC 18004:2015, 6.3.3). */
  moduleMm: number;
}

const dark = (page: GreyPage, x: number, y: number) =>
  x >= 0 && y >= 0 && x < page.width && y < page.height && page.grey[y * page.width + x]! < 128;

/**
 * From a finder pattern's centre, the first light pixel past its outer dark ring along one
 * direction: the centre's 3 × 3 dark block, a light ring, then the dark ring (1:1:3:1:1 across,
 * ISO/IEC 18004:2015, 6.3.3). The separator and the quiet zone beyond it are light.
 */
function finderEdge(
  page: GreyPage,
  centre: { x: number; y: number },
  dx: number,
  dy: number,
): number {
  let x = Math.round(centre.x);
  let y = Math.round(centre.y);
  for (const wantDark of [false, true, false]) {
    for (let steps = 0; dark(page, x, y) !== wantDark; steps++) {
      if (steps > page.dpi) throw new Error('no finder pattern edge within an inch');
      x += dx;
      y += dy;
    }
  }
  return dx ? x : y;
}

/**
 * The one QR symbol inside `box`, measured by its finder patterns: jsQR finds their centres,
 * then each is followed outward to its outer edge. Text or marks beside the symbol (even in
 * the quiet zone) do not change the measurement, unlike the extent of all dark pixels.
 */
export function measureQrIn(page: GreyPage, box: BoxMm): MeasuredSymbol | null {
  const pad = px(page, 3);
  const { rgba, w, h } = crop(page, box, pad);
  const found = jsQR(rgba, w, h, { inversionAttempts: 'dontInvert' });
  if (!found) return null;
  const onPage = (p: { x: number; y: number }) => ({
    x: p.x - pad + px(page, box.x),
    y: p.y - pad + px(page, box.y),
  });
  const topLeft = onPage(found.location.topLeftFinderPattern);
  const topRight = onPage(found.location.topRightFinderPattern);
  const bottomLeft = onPage(found.location.bottomLeftFinderPattern);
  // Edges are the first light pixel outside: the symbol spans [left, right) in pixels.
  const left = finderEdge(page, topLeft, -1, 0) + 1;
  const right = finderEdge(page, topRight, 1, 0);
  const top = finderEdge(page, topLeft, 0, -1) + 1;
  const bottom = finderEdge(page, bottomLeft, 0, 1);
  const finderRight = finderEdge(page, topLeft, 1, 0);
  const toMm = (n: number) => (n / page.dpi) * 25.4;
  return {
    text: found.data,
    modules: 4 * found.version + 17,
    widthMm: toMm(right - left),
    heightMm: toMm(bottom - top),
    moduleMm: toMm(finderRight - left) / 7,
  };
}

/**
 * Dark pixels inside `outer` but outside `inner` (mm from the page's corner): marks on a quiet
 * zone. One pixel round `inner` is left out, for its edge's anti-aliasing.
 */
export function darkPixelsAround(page: GreyPage, outer: BoxMm, inner: BoxMm): number {
  const within = (b: BoxMm, x: number, y: number) =>
    x >= px(page, b.x) - 1 &&
    x <= px(page, b.x + b.widthMm) &&
    y >= px(page, b.y) - 1 &&
    y <= px(page, b.y + b.heightMm);
  let count = 0;
  for (let y = px(page, outer.y); y < px(page, outer.y + outer.heightMm); y++) {
    for (let x = px(page, outer.x); x < px(page, outer.x + outer.widthMm); x++) {
      if (dark(page, x, y) && !within(inner, x, y)) count++;
    }
  }
  return count;
}

/** How many pixel columns of `band` hold any mark (grey or darker): how much of a line printed there. */
export function markedColumns(page: GreyPage, band: BoxMm, lighterThan = 230): number {
  let count = 0;
  for (let x = px(page, band.x); x < px(page, band.x + band.widthMm); x++) {
    for (let y = px(page, band.y); y < px(page, band.y + band.heightMm); y++) {
      if (page.grey[y * page.width + x]! < lighterThan) {
        count++;
        break;
      }
    }
  }
  return count;
}

/** Grey pixels of a region, for feeding a fake camera. */
export function greyRegion(
  page: GreyPage,
  box: BoxMm,
): { width: number; height: number; grey: Uint8Array } {
  const x0 = px(page, box.x);
  const y0 = px(page, box.y);
  const width = px(page, box.widthMm);
  const height = px(page, box.heightMm);
  const grey = new Uint8Array(width * height);
  for (let y = 0; y < height; y++)
    grey.set(
      page.grey.subarray((y0 + y) * page.width + x0, (y0 + y) * page.width + x0 + width),
      y * width,
    );
  return { width, height, grey };
}
