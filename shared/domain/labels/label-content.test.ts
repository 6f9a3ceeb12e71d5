import jsQR from 'jsqr';
import { describe, expect, it } from 'vitest';
import { labelCapacity, labelContent, printProblem, type LabelAnimal } from './label-content';
import { LABEL_FIELDS, MIN_MODULE_MM } from './label-layout';
import { readLabel } from './label-payload';
import { qrPath, QUIET_ZONE_MODULES } from './qr-symbol';
import { rasterisePath } from './qr-test-raster';
import { LABEL_SIZE_IDS, LABEL_SIZES } from './sheet-layout';

// The label rules these tests hold the sizes to:
// - ISO/IEC 18004:2015, 5.3.1: a symbol has 4·version + 17 modules a side (version 1: 21).
// - ISO/IEC 18004:2015, 9.1 (and 5.3.8): a quiet zone 4 modules wide on every side, free of marks.
// - ISO/IEC 18004:2015, Table 7: level M holds 20 alphanumeric characters at version 1,
//   38 at version 2 and 61 at version 3.
// - MIN_MODULE_MM (0.5 mm) is our print floor: about 6 dots of a 300 dpi printer
//   (25.4 mm / 300 = 0.085 mm a dot), see label-layout.ts.
const ORIGINS = ['http://localhost:3000', 'http://127.0.0.1:45123', 'https://rackside.example.org'];
const sling: LabelAnimal = {
  id: 'a',
  labelCode: 'NL-7K3',
  name: 'Formosus 01',
  scientificName: 'Hapalopus formosus',
  lifeStage: 'sling',
  group: 'tarantula',
  sex: 'unknown',
  cautions: ['urticating_hairs'],
};

describe('what each label size can carry', () => {
  it.each(ORIGINS)('every offered size prints a readable QR for %s', (origin) => {
    for (const id of LABEL_SIZE_IDS) {
      const c = labelCapacity(LABEL_SIZES[id], origin);
      expect(c.fits, `${id} at ${origin}`).toBe(true);
      expect(c.moduleMm).toBeGreaterThanOrEqual(MIN_MODULE_MM);
    }
  });

  it('19 mm squares carry the code and a short QR that Rackside’s scanner reads', () => {
    const size = LABEL_SIZES['square-19'];
    const capacity = labelCapacity(size, ORIGINS[2]!);
    expect(capacity).toMatchObject({ fits: true, short: true });
    expect(capacity.fields.filter((f) => f !== 'cautions')).toEqual([]);

    const label = labelContent(sling, 'AB7K', ORIGINS[2]!, size, LABEL_FIELDS);
    expect(label.short).toBe(true);
    expect(label.url).toBe('L/AB7K/NL-7K3');
    expect(label.symbol.size).toBe(21);
    expect(label.layout.moduleMm).toBeGreaterThanOrEqual(MIN_MODULE_MM);
    expect(printProblem([label])).toBeNull();
    // The quiet zone is 4 modules and stays inside the 19 mm label.
    expect(label.layout.quiet.widthMm).toBeCloseTo(
      label.layout.symbol.widthMm + 2 * QUIET_ZONE_MODULES * label.layout.moduleMm,
      2,
    );
    expect(label.layout.quiet.x + label.layout.quiet.widthMm).toBeLessThanOrEqual(19);
    expect(label.layout.lines[0]).toMatchObject({ field: 'code' });
    const last = label.layout.lines.at(-1)!;
    expect(last.y + last.sizeMm).toBeLessThanOrEqual(19);

    // It decodes, and the scanner reads it as this collection's label for this code.
    const { rgba, side } = rasterisePath(qrPath(label.symbol), label.symbol);
    const text = jsQR(rgba, side, side)?.data;
    expect(text).toBe('L/AB7K/NL-7K3');
    expect(readLabel(text!)).toEqual({ kind: 'label', tag: 'AB7K', code: 'NL-7K3' });
    expect(readLabel('l/ab7k/nl-7k3')).toEqual({ kind: 'label', tag: 'AB7K', code: 'NL-7K3' });
    expect(readLabel('L/AB7K/NL-7KO').kind).toBe('malformed');
  });

  it('larger sizes keep the full address, which any phone camera opens', () => {
    for (const id of ['square-25', 'square-38', 'wide-50x25', 'wide-70x36'] as const) {
      const label = labelContent(sling, 'AB7K', ORIGINS[0]!, LABEL_SIZES[id], LABEL_FIELDS);
      expect(label.short, id).toBe(false);
      expect(label.url).toBe('HTTP://LOCALHOST:3000/L/AB7K/NL-7K3');
    }
  });

  it('the 38 mm default carries the name, species and stage', () => {
    const capacity = labelCapacity(LABEL_SIZES['square-38'], ORIGINS[2]!);
    expect(capacity.short).toBe(false);
    expect(capacity.fields).toEqual(['name', 'scientificName', 'stage', 'cautions']);
  });

  it('a 15 mm custom square cannot carry a readable code, and says why', () => {
    const size = { widthMm: 15, heightMm: 15 };
    expect(labelCapacity(size, ORIGINS[0]!).fits).toBe(false);
    const label = labelContent(sling, 'AB7K', ORIGINS[0]!, size, []);
    expect(printProblem([label])).toMatch(/under the 0\.5 mm/);
  });
});
