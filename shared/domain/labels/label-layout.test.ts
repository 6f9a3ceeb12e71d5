import { describe, expect, it } from 'vitest';
import {
  LABEL_FIELDS,
  labelLayout,
  MAX_SYMBOL_MM,
  MIN_MODULE_MM,
  TEXT_GAP_MM,
  type Box,
} from './label-layout';
import { QUIET_ZONE_MODULES } from './qr-symbol';
import { LABEL_SIZES, type LabelSizeId } from './sheet-layout';

const overlaps = (a: Box, b: Box) =>
  a.x < b.x + b.widthMm - 1e-9 &&
  b.x < a.x + a.widthMm - 1e-9 &&
  a.y < b.y + b.heightMm - 1e-9 &&
  b.y < a.y + a.heightMm - 1e-9;

// Versions 2 and 3 (25 and 29 modules) are what our label URLs reach (see qr-symbol.test.ts).
const MODULES = [25, 29];

describe('one label', () => {
  for (const id of Object.keys(LABEL_SIZES) as LabelSizeId[]) {
    for (const modules of MODULES) {
      it(`${LABEL_SIZES[id].name}, ${modules} modules: quiet zone inside the label and free of text`, () => {
        const size = LABEL_SIZES[id];
        const l = labelLayout(size, modules, LABEL_FIELDS);
        // ISO/IEC 18004:2015, 5.3.8: 4 modules of quiet zone on every side.
        expect(l.quiet.widthMm).toBeCloseTo(
          l.symbol.widthMm + 2 * QUIET_ZONE_MODULES * l.moduleMm,
          2,
        );
        expect(l.symbol.x - l.quiet.x).toBeCloseTo(QUIET_ZONE_MODULES * l.moduleMm, 2);
        expect(l.quiet.x).toBeGreaterThanOrEqual(0);
        expect(l.quiet.y).toBeGreaterThanOrEqual(0);
        expect(l.quiet.x + l.quiet.widthMm).toBeLessThanOrEqual(size.widthMm + 1e-9);
        expect(l.quiet.y + l.quiet.heightMm).toBeLessThanOrEqual(size.heightMm + 1e-9);
        expect(overlaps(l.quiet, l.text)).toBe(false);
        // The text keeps a clear gap from the quiet zone, beside it (wide) or under it (stacked).
        const gap =
          l.mode === 'wide'
            ? l.text.x - (l.quiet.x + l.quiet.widthMm)
            : l.text.y - (l.quiet.y + l.quiet.heightMm);
        expect(gap).toBeGreaterThanOrEqual(TEXT_GAP_MM - 1e-9);
        expect(l.text.x + l.text.widthMm).toBeLessThanOrEqual(size.widthMm + 1e-9);
        expect(l.symbol.widthMm).toBeLessThanOrEqual(MAX_SYMBOL_MM);
        expect(l.moduleMm).toBeCloseTo(l.symbol.widthMm / modules, 3);
        // Every printed line stays inside the text box.
        const last = l.lines.at(-1)!;
        expect(last.y + last.sizeMm).toBeLessThanOrEqual(l.text.y + l.text.heightMm + 1e-9);
        expect(l.lines[0]!.field).toBe('code');
      });
    }
  }

  it('prints a 25 mm symbol on 70 × 36 mm labels and the most text there', () => {
    const l = labelLayout(LABEL_SIZES['wide-70x36'], 25, LABEL_FIELDS);
    expect(l.symbol.widthMm).toBe(25);
    expect(l.moduleMm).toBe(1);
    expect(l.dropped).toEqual([]);
    expect(l.lines.map((x) => x.field)).toEqual([
      'code',
      'name',
      'scientificName',
      'stage',
      'cautions',
    ]);
  });

  it('gives a 25 mm square the code and the name when the QR is version 2, the code alone at version 3', () => {
    const v2 = labelLayout(LABEL_SIZES['square-25'], 25, LABEL_FIELDS);
    expect(v2.mode).toBe('stacked');
    expect(v2.lines.map((x) => x.field)).toEqual(['code', 'name']);
    expect(v2.cautionsBesideCode).toBe(true);
    expect(v2.dropped).toEqual(['scientificName', 'stage']);
    expect(v2.moduleMm).toBeGreaterThanOrEqual(MIN_MODULE_MM);
    const v3 = labelLayout(LABEL_SIZES['square-25'], 29, LABEL_FIELDS);
    expect(v3.lines.map((x) => x.field)).toEqual(['code']);
    expect(v3.tooSmall).toBe(false);
  });

  it('keeps the name, species and stage on the 38 mm default (the QR shrinks to make room)', () => {
    for (const modules of [25, 29]) {
      const l = labelLayout(LABEL_SIZES['square-38'], modules, LABEL_FIELDS);
      expect(l.dropped).toEqual([]);
      expect(l.lines.map((x) => x.field)).toEqual(['code', 'name', 'scientificName', 'stage']);
      expect(l.moduleMm).toBeGreaterThanOrEqual(MIN_MODULE_MM);
    }
  });

  it(`refuses a label whose modules would be under ${MIN_MODULE_MM} mm`, () => {
    // A full label address (version 2) on 19 mm: see label-content for the short payload.
    const l = labelLayout(LABEL_SIZES['square-19'], 25, ['name']);
    expect(l.moduleMm).toBeLessThan(MIN_MODULE_MM);
    expect(l.tooSmall).toBe(true);
    // A version-4 payload (33 modules, a long server address) is too dense even for 25 mm squares.
    expect(labelLayout(LABEL_SIZES['square-25'], 33, []).tooSmall).toBe(true);
  });
});
