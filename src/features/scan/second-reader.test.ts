import { createRequire } from 'node:module';
import { describe, expect, it } from 'vitest';
import { labelUrl } from '#shared/domain/labels/label-payload';
import { makeQrSymbol, qrPath } from '#shared/domain/labels/qr-symbol';
import { rasterisePath } from '#shared/domain/labels/qr-test-raster';
import { readQrPixels } from './second-reader';

// The ZXing build html5-qrcode decodes with (its own bundled copy, read here as a witness).
const ZXing = createRequire(import.meta.url)('html5-qrcode/third_party/zxing-js.umd.js');

function zxingReads(rgba: Uint8ClampedArray, side: number): string | null {
  const luminance = new Uint8ClampedArray(side * side);
  for (let i = 0; i < luminance.length; i++) luminance[i] = rgba[i * 4]!;
  try {
    const bitmap = new ZXing.BinaryBitmap(
      new ZXing.HybridBinarizer(new ZXing.RGBLuminanceSource(luminance, side, side)),
    );
    return new ZXing.QRCodeReader().decode(bitmap).text as string;
  } catch {
    return null;
  }
}

const ORIGIN = 'https://rackside.example';

describe('the second QR reader', () => {
  // Label addresses, found by sweeping random tags and codes, whose clean symbols (6 px a
  // module, full quiet zone) html5-qrcode's ZXing cannot read: it reports a format, checksum
  // or not-found error after choosing a wrong finder pattern.
  const missed = [
    ['PCVZ', 'NL-9PP'],
    ['SBWM', 'NL-ZWA'],
    ['CZF7', 'NL-G7H'],
    ['YH95', 'NL-KWQ'],
    ['NVY8', 'NL-S2Y'],
  ].map(([tag, code]) => labelUrl(ORIGIN, tag!, code!));

  it.each(missed)('reads %s, which the first reader misses', (url) => {
    const symbol = makeQrSymbol(url);
    const { rgba, side } = rasterisePath(qrPath(symbol), symbol, 6);
    expect(zxingReads(rgba, side)).toBeNull();
    expect(readQrPixels({ data: rgba, width: side, height: side })).toBe(url);
  });

  it('reads what the first reader reads', () => {
    const url = labelUrl(ORIGIN, '83JG', 'NL-PPX');
    const symbol = makeQrSymbol(url);
    const { rgba, side } = rasterisePath(qrPath(symbol), symbol, 6);
    expect(zxingReads(rgba, side)).toBe(url);
    expect(readQrPixels({ data: rgba, width: side, height: side })).toBe(url);
  });

  it('finds nothing in a blank picture', () => {
    const side = 120;
    const blank = new Uint8ClampedArray(side * side * 4).fill(255);
    expect(readQrPixels({ data: blank, width: side, height: side })).toBeNull();
  });
});
