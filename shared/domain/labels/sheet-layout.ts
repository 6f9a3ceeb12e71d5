/**
 * Label sheets, in millimetres from the page's top-left corner.
 * Paper: ISO 216 A4 is 210 × 297 mm; US Letter is 8.5 × 11 in = 215.9 × 279.4 mm
 * (CSS Paged Media 3, 7.1 "page-size" keywords). CSS Values 4, 6.2: 1in = 2.54cm = 96px.
 */
export const SHEETS = {
  a4: { name: 'A4', widthMm: 210, heightMm: 297 },
  letter: { name: 'Letter', widthMm: 215.9, heightMm: 279.4 },
} as const;
export type SheetId = keyof typeof SHEETS;
export const SHEET_IDS = Object.keys(SHEETS) as SheetId[];

/** Most office printers cannot print the outer 4–6 mm; 10 mm keeps every mark on paper. */
export const PRINT_MARGIN_MM = 10;
/** Room between labels for scissors or a cutter. */
export const LABEL_GAP_MM = 3;
/** The dashed cut line round each label runs this far outside it, in the gap, and is this wide. */
export const CUT_LINE_OFFSET_MM = 0.5;
export const CUT_LINE_WIDTH_MM = 0.2;
/**
 * The browser print draws into a box this much larger than the printable area on every side:
 * the cut lines of the outer labels lie outside the printable area and would be clipped there.
 */
export const PRINT_BLEED_MM = 1;
/** The strip at the foot of each sheet that holds the 50 mm scale ruler. */
export const RULER_STRIP_MM = 10;
export const RULER_LENGTH_MM = 50;

export const LABEL_SIZES = {
  'square-19': { name: '19 mm square', widthMm: 19, heightMm: 19 },
  'square-25': { name: '25 mm square', widthMm: 25, heightMm: 25 },
  'square-38': { name: '38 mm square', widthMm: 38, heightMm: 38 },
  'wide-50x25': { name: '50 × 25 mm', widthMm: 50, heightMm: 25 },
  'wide-70x36': { name: '70 × 36 mm', widthMm: 70, heightMm: 36 },
} as const;
export type LabelSizeId = keyof typeof LABEL_SIZES;
export const LABEL_SIZE_IDS = Object.keys(LABEL_SIZES) as LabelSizeId[];
export const CUSTOM_SIZE_LIMITS = { minMm: 15, maxMm: 150 } as const;

export interface LabelSize {
  widthMm: number;
  heightMm: number;
}

export interface SheetLayout {
  page: { widthMm: number; heightMm: number };
  /** The printable area inside the margins. */
  printable: { x: number; y: number; widthMm: number; heightMm: number };
  /** What the browser print draws into: the printable area and PRINT_BLEED_MM round it. */
  printArea: { x: number; y: number; widthMm: number; heightMm: number };
  cols: number;
  rows: number;
  perSheet: number;
  /** Top-left corner of each cell, row by row. */
  cells: { x: number; y: number }[];
  label: LabelSize;
  ruler: { x: number; y: number; lengthMm: number };
}

const fit = (space: number, size: number) =>
  Math.max(0, Math.floor((space + LABEL_GAP_MM + 1e-9) / (size + LABEL_GAP_MM)));

/** Where the labels of one size sit on one sheet: a grid centred across, from the top margin down. */
export function sheetLayout(sheetId: SheetId, label: LabelSize): SheetLayout {
  const sheet = SHEETS[sheetId];
  const printable = {
    x: PRINT_MARGIN_MM,
    y: PRINT_MARGIN_MM,
    widthMm: sheet.widthMm - 2 * PRINT_MARGIN_MM,
    heightMm: sheet.heightMm - 2 * PRINT_MARGIN_MM,
  };
  const cols = fit(printable.widthMm, label.widthMm);
  const rows = fit(printable.heightMm - RULER_STRIP_MM, label.heightMm);
  const gridWidth = cols * label.widthMm + Math.max(0, cols - 1) * LABEL_GAP_MM;
  const left = printable.x + (printable.widthMm - gridWidth) / 2;
  const cells: { x: number; y: number }[] = [];
  for (let r = 0; r < rows; r++) {
    for (let c = 0; c < cols; c++) {
      cells.push({
        x: left + c * (label.widthMm + LABEL_GAP_MM),
        y: printable.y + r * (label.heightMm + LABEL_GAP_MM),
      });
    }
  }
  return {
    page: { widthMm: sheet.widthMm, heightMm: sheet.heightMm },
    printable,
    printArea: {
      x: printable.x - PRINT_BLEED_MM,
      y: printable.y - PRINT_BLEED_MM,
      widthMm: printable.widthMm + 2 * PRINT_BLEED_MM,
      heightMm: printable.heightMm + 2 * PRINT_BLEED_MM,
    },
    cols,
    rows,
    perSheet: cols * rows,
    cells,
    label,
    ruler: {
      x: printable.x,
      y: printable.y + printable.heightMm - RULER_STRIP_MM / 2,
      lengthMm: RULER_LENGTH_MM,
    },
  };
}

/**
 * Which sheet and cell each label goes to. `start` is the first free cell (1-based) on a
 * partly used first sheet; later sheets start at the top.
 */
export function placeLabels(
  count: number,
  start: number,
  perSheet: number,
): { sheet: number; cell: number }[] {
  const first = Math.min(Math.max(1, Math.floor(start)), perSheet) - 1;
  return Array.from({ length: count }, (_, i) => {
    const slot = first + i;
    return { sheet: Math.floor(slot / perSheet), cell: slot % perSheet };
  });
}

export function sheetCount(count: number, start: number, perSheet: number): number {
  if (count === 0 || perSheet === 0) return 0;
  return placeLabels(count, start, perSheet).at(-1)!.sheet + 1;
}
