import jsQR from 'jsqr';
import { describe, expect, it } from 'vitest';
import { generateLabelCodes } from '../label-codes';
import { generateLabelTag, labelUrl, readLabel } from './label-payload';
import { makeQrSymbol, qrPath, QUIET_ZONE_MODULES } from './qr-symbol';
import { rasterisePath } from './qr-test-raster';

// ISO/IEC 18004:2015, Table 7 (data capacity), alphanumeric mode at level M, versions 1–4.
const ALPHANUMERIC_CAPACITY_M = [20, 38, 61, 90];
// ISO/IEC 18004:2015, 7.4.4: the alphanumeric set.
const ALPHANUMERIC = /^[0-9A-Z $%*+\-./:]+$/;

function seeded(seed: number) {
  return () => (seed = (seed * 1103515245 + 12345) % 2 ** 31) / 2 ** 31;
}

const ORIGINS = ['http://localhost:3000', 'http://127.0.0.1:45123', 'https://rackside.example.org'];

describe('label QR symbols (ISO/IEC 18004)', () => {
  const random = seeded(7);
  const cases = ORIGINS.flatMap((origin) =>
    generateLabelCodes('NL', 8, random).map((code) => ({
      origin,
      url: labelUrl(origin, generateLabelTag(random), code),
    })),
  );

  it.each(cases)('$url decodes with jsQR to exactly the payload', ({ url }) => {
    const symbol = makeQrSymbol(url);
    const { rgba, side } = rasterisePath(qrPath(symbol), symbol);
    expect(jsQR(rgba, side, side)?.data).toBe(url);
    // ... and to the label it was made for.
    expect(readLabel(url).kind).toBe('label');
  });

  it.each(cases)(
    '$url: modules per side are 4·version + 17 and the version is the smallest that fits',
    ({ url }) => {
      const symbol = makeQrSymbol(url);
      expect(symbol.size).toBe(4 * symbol.version + 17); // ISO/IEC 18004:2015, 5.3.1
      expect(url).toMatch(ALPHANUMERIC);
      expect(url.length).toBeLessThanOrEqual(ALPHANUMERIC_CAPACITY_M[symbol.version - 1]!);
      if (symbol.version > 1)
        expect(url.length).toBeGreaterThan(ALPHANUMERIC_CAPACITY_M[symbol.version - 2]!);
    },
  );

  it('keeps a label for the demo address and a typical https host within version 3 at level M', () => {
    expect(makeQrSymbol(labelUrl('http://localhost:3000', 'ABCD', 'NL-7K3')).version).toBe(2);
    expect(
      makeQrSymbol(labelUrl('https://rackside.example.org', 'ABCD', 'ABCD-2345X')).version,
    ).toBe(3);
  });

  it('leaves the 4-module quiet zone white when rendered (ISO/IEC 18004:2015, 5.3.8)', () => {
    const symbol = makeQrSymbol(labelUrl(ORIGINS[0]!, 'ABCD', 'NL-7K3'));
    const ppm = 3;
    const { rgba, side } = rasterisePath(qrPath(symbol), symbol, ppm);
    const edge = QUIET_ZONE_MODULES * ppm;
    for (let y = 0; y < side; y++) {
      for (let x = 0; x < side; x++) {
        const inSymbol = x >= edge && x < side - edge && y >= edge && y < side - edge;
        if (!inSymbol) expect(rgba[(y * side + x) * 4]).toBe(255);
      }
    }
    // The finder pattern's corner module is dark (ISO/IEC 18004:2015, 6.3.3), right inside the zone.
    expect(rgba[(edge * side + edge) * 4]).toBe(0);
  });
});
