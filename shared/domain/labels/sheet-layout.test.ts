import { describe, expect, it } from 'vitest';
import {
  CUT_LINE_OFFSET_MM,
  CUT_LINE_WIDTH_MM,
  LABEL_GAP_MM,
  LABEL_SIZES,
  placeLabels,
  PRINT_MARGIN_MM,
  RULER_STRIP_MM,
  SHEETS,
  sheetCount,
  sheetLayout,
  type LabelSizeId,
  type SheetId,
} from './sheet-layout';

// CSS Paged Media 3, 7.1 (page-size keywords) and ISO 216: A4 210 × 297 mm;
// Letter 8.5 × 11 in, and CSS Values 4, 6.2: 1in = 2.54cm, so 215.9 × 279.4 mm.
describe('paper sizes', () => {
  it('match ISO 216 and CSS Values 4', () => {
    expect(SHEETS.a4).toMatchObject({ widthMm: 210, heightMm: 297 });
    expect(SHEETS.letter.widthMm).toBeCloseTo(8.5 * 25.4, 6);
    expect(SHEETS.letter.heightMm).toBeCloseTo(11 * 25.4, 6);
  });
});

// Worked by hand: printable = sheet − 2 × 10 mm margin, minus the 10 mm ruler strip in height;
// n labels of size s with 3 mm gaps need n·s + (n−1)·3 ≤ space.
//   A4:     190 mm across, 267 mm down.   Letter: 195.9 mm across, 249.4 mm down.
const EXPECTED: Record<SheetId, Record<LabelSizeId, [cols: number, rows: number]>> = {
  a4: {
    'square-19': [8, 12], // 8·19+7·3 = 173 ≤ 190 (9 → 195); 12·19+11·3 = 261 ≤ 267
    'square-25': [6, 9], // 6·25+5·3 = 165 (7 → 193 > 190); 9·25+8·3 = 249 (10 → 277)
    'square-38': [4, 6], // 4·38+3·3 = 161 (5 → 202); 6·38+5·3 = 243 (7 → 284)
    'wide-50x25': [3, 9], // 3·50+2·3 = 156 (4 → 209)
    'wide-70x36': [2, 6], // 2·70+3 = 143 (3 → 216); 6·36+5·3 = 231 (7 → 270 > 267)
  },
  letter: {
    'square-19': [9, 11], // 9·19+8·3 = 195 ≤ 195.9; 11·19+10·3 = 239 (12 → 261 > 249.4)
    'square-25': [7, 9], // 7·25+6·3 = 193 ≤ 195.9; 9·25+8·3 = 249 ≤ 249.4 (a fraction inside)
    'square-38': [4, 6], // 161 (5 → 202); 243 ≤ 249.4
    'wide-50x25': [3, 9], // 156 (4 → 209); 249 ≤ 249.4
    'wide-70x36': [2, 6], // 143 (3 → 216); 231 (7 → 270)
  },
};

describe('labels per sheet', () => {
  for (const sheet of Object.keys(EXPECTED) as SheetId[]) {
    for (const size of Object.keys(LABEL_SIZES) as LabelSizeId[]) {
      const [cols, rows] = EXPECTED[sheet][size];
      it(`${SHEETS[sheet].name}, ${LABEL_SIZES[size].name}: ${cols} × ${rows} = ${cols * rows}`, () => {
        const layout = sheetLayout(sheet, LABEL_SIZES[size]);
        expect([layout.cols, layout.rows]).toEqual([cols, rows]);
        expect(layout.perSheet).toBe(cols * rows);
        expect(layout.cells).toHaveLength(cols * rows);
      });
    }
  }

  it('keeps every label inside the printable margin and clear of the ruler strip', () => {
    for (const sheet of Object.keys(SHEETS) as SheetId[]) {
      const page = SHEETS[sheet];
      for (const size of Object.values(LABEL_SIZES)) {
        const layout = sheetLayout(sheet, size);
        for (const cell of layout.cells) {
          expect(cell.x).toBeGreaterThanOrEqual(PRINT_MARGIN_MM - 1e-9);
          expect(cell.y).toBeGreaterThanOrEqual(PRINT_MARGIN_MM - 1e-9);
          expect(cell.x + size.widthMm).toBeLessThanOrEqual(page.widthMm - PRINT_MARGIN_MM + 1e-9);
          expect(cell.y + size.heightMm).toBeLessThanOrEqual(
            page.heightMm - PRINT_MARGIN_MM - RULER_STRIP_MM + 1e-9,
          );
        }
        // Neighbours never touch: the gap is kept between every pair in a row and a column.
        const [a, b] = layout.cells;
        if (layout.cols > 1) expect(b!.x - a!.x - size.widthMm).toBeCloseTo(LABEL_GAP_MM, 9);
        expect(layout.ruler.y).toBeGreaterThan(layout.cells.at(-1)!.y + size.heightMm);
        expect(layout.ruler.y).toBeLessThan(page.heightMm - PRINT_MARGIN_MM);
      }
    }
  });

  it('leaves room in the browser print for every cut line, also round a grid that fills the printable area', () => {
    // 93.5 mm: two across fill A4's 190 mm exactly, so the outer cut lines lie outside the printable area.
    const sizes = [...Object.values(LABEL_SIZES), { widthMm: 93.5, heightMm: 40 }];
    for (const sheet of Object.keys(SHEETS) as SheetId[]) {
      for (const size of sizes) {
        const { cells, printArea, page } = sheetLayout(sheet, size);
        const reach = CUT_LINE_OFFSET_MM + CUT_LINE_WIDTH_MM;
        for (const cell of cells) {
          expect(cell.x - reach).toBeGreaterThanOrEqual(printArea.x - 1e-9);
          expect(cell.y - reach).toBeGreaterThanOrEqual(printArea.y - 1e-9);
          expect(cell.x + size.widthMm + reach).toBeLessThanOrEqual(
            printArea.x + printArea.widthMm + 1e-9,
          );
          expect(cell.y + size.heightMm + reach).toBeLessThanOrEqual(
            printArea.y + printArea.heightMm + 1e-9,
          );
        }
        // Still well inside what office printers reach (4–6 mm from the edge), centred on the page.
        expect(printArea.x).toBeGreaterThanOrEqual(6);
        expect(printArea.x + printArea.widthMm).toBeCloseTo(page.widthMm - printArea.x, 9);
        expect(printArea.y + printArea.heightMm).toBeCloseTo(page.heightMm - printArea.y, 9);
      }
    }
  });

  it('fits nothing when a label is wider than the printable area', () => {
    expect(sheetLayout('a4', { widthMm: 200, heightMm: 20 }).perSheet).toBe(0);
  });
});

describe('start position on a partly used sheet', () => {
  it('skips the used cells of the first sheet only', () => {
    // 54 a sheet (A4, 25 mm): starting at cell 50 puts 5 labels on sheet 1 (cells 50–54), the
    // rest from the top of sheet 2.
    const places = placeLabels(8, 50, 54);
    expect(places.map((p) => p.cell + 1)).toEqual([50, 51, 52, 53, 54, 1, 2, 3]);
    expect(places.map((p) => p.sheet)).toEqual([0, 0, 0, 0, 0, 1, 1, 1]);
    expect(sheetCount(8, 50, 54)).toBe(2);
    expect(sheetCount(5, 50, 54)).toBe(1);
  });

  it('starts at the top by default and keeps a start past the end on the last cell', () => {
    expect(placeLabels(2, 1, 12).map((p) => p.cell)).toEqual([0, 1]);
    expect(placeLabels(1, 99, 12)).toEqual([{ sheet: 0, cell: 11 }]);
    expect(placeLabels(1, 0, 12)).toEqual([{ sheet: 0, cell: 0 }]);
  });
});
