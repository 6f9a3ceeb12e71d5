import { QUIET_ZONE_MODULES, type QrSymbol } from './qr-symbol';

/**
 * Test helper: paints `qrPath` output (not the module array) into an RGBA image with a white
 * quiet zone, so decoding it checks the path a label really draws.
 */
export function rasterisePath(
  path: string,
  symbol: Pick<QrSymbol, 'size'>,
  pixelsPerModule = 4,
  quiet = QUIET_ZONE_MODULES,
) {
  const side = (symbol.size + 2 * quiet) * pixelsPerModule;
  const rgba = new Uint8ClampedArray(side * side * 4).fill(255);
  for (const m of path.matchAll(/M(\d+) (\d+)h(\d+)v1h-\d+z/g)) {
    const [x, y, run] = [Number(m[1]), Number(m[2]), Number(m[3])];
    for (let py = (y + quiet) * pixelsPerModule; py < (y + quiet + 1) * pixelsPerModule; py++) {
      for (let px = (x + quiet) * pixelsPerModule; px < (x + quiet + run) * pixelsPerModule; px++) {
        const i = (py * side + px) * 4;
        rgba[i] = rgba[i + 1] = rgba[i + 2] = 0;
      }
    }
  }
  return { rgba, side };
}
