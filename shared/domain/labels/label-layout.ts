import { QUIET_ZONE_MODULES } from './qr-symbol';
import type { LabelSize } from './sheet-layout';

/**
 * Below this a module is too small for office printers and phone cameras to keep crisp.
 * ISO/IEC 18004:2015 sets no minimum module size (the X dimension is left to the application,
 * 5.3.2 and annex on user guidelines for printing); 0.5 mm is our own floor:
 * - a 300 dpi office printer places dots 25.4 / 300 = 0.085 mm apart (1 in = 25.4 mm, ISO 1:
 *   the inch defined as 25.4 mm), so a 0.5 mm module is about 6 dots wide and toner spread of a
 *   dot either side still leaves the module within about a third of its width;
 * - a phone camera held 10–15 cm from a label resolves it comfortably (common practice, no
 *   published source).
 */
export const MIN_MODULE_MM = 0.5;
/** A bigger symbol scans no better at arm's length from a rack (common practice, no published source). */
export const MAX_SYMBOL_MM = 25;
/** Inner padding where no quiet zone provides it. */
const PAD_MM = 1.2;
/** Smallest text we print: about 6 pt, still readable at a shelf (from memory). */
const MIN_TEXT_MM = 2.2;
/**
 * Clear space between the quiet zone and the text box: a glyph's side bearing or an italic
 * overhang must not reach into the quiet zone, and a scanner or a ruler measuring the symbol
 * must not meet text at its edge (common practice, no published source).
 */
export const TEXT_GAP_MM = 1;

export const LABEL_FIELDS = ['name', 'scientificName', 'stage', 'cautions'] as const;
export type LabelField = (typeof LABEL_FIELDS)[number];
export const LABEL_FIELD_WORDS: Record<LabelField, string> = {
  name: 'Name',
  scientificName: 'Scientific name',
  stage: 'Stage and sex',
  cautions: 'Caution symbols',
};

export interface Box {
  x: number;
  y: number;
  widthMm: number;
  heightMm: number;
}

export interface TextLine {
  field: 'code' | 'name' | 'scientificName' | 'stage' | 'cautions';
  /** Top of the line box inside the label. */
  y: number;
  /** Font size (or symbol size, for cautions), in mm. */
  sizeMm: number;
}

export interface LabelLayout {
  mode: 'wide' | 'stacked';
  /** The symbol itself (dark modules' extent); its quiet zone is `quiet`. */
  symbol: Box;
  quiet: Box;
  moduleMm: number;
  text: Box;
  lines: TextLine[];
  /** In stacked mode the caution symbols sit at the end of the code line. */
  cautionsBesideCode: boolean;
  /** Fields asked for that have no room on this size. */
  dropped: LabelField[];
  tooSmall: boolean;
}

const round = (mm: number) => Math.round(mm * 1000) / 1000;

/** The largest symbol (a whole half-millimetre) whose quiet zone fits a square of `box` mm. */
function symbolSide(box: number, modules: number): number {
  const fitting = (box * modules) / (modules + 2 * QUIET_ZONE_MODULES);
  return Math.min(MAX_SYMBOL_MM, Math.floor(fitting * 2) / 2);
}

/** Stacked labels: the code's size follows the label's width, never under the smallest text. */
const stackedCodeSize = (w: number) => Math.max(MIN_TEXT_MM, Math.min(5, w * 0.12));
const stackedLineSize = (codeSize: number) => Math.max(MIN_TEXT_MM, Math.min(3.5, codeSize * 0.7));
const lineNeed = (field: LabelField, lineSize: number) =>
  field === 'cautions' ? lineSize * 1.3 * 1.1 : lineSize * 1.2;

/** The QR's quiet-zone square for a given band of text under it: its module size. */
function stackedModule(w: number, h: number, modules: number, band: number): number {
  return symbolSide(Math.min(w, h - band), modules) / modules;
}

/**
 * The height of the text band under a stacked QR: the code line and as many of the asked-for
 * lines (in their order) as leave the QR's modules at MIN_MODULE_MM or more.
 */
function stackedBand(w: number, h: number, modules: number, fields: readonly LabelField[]) {
  const codeSize = stackedCodeSize(w);
  const lineSize = stackedLineSize(codeSize);
  let band = TEXT_GAP_MM + codeSize * 1.15 + PAD_MM * 0.5 + 0.01;
  for (const field of LABEL_FIELDS) {
    // Caution symbols sit at the end of the code line on stacked labels.
    if (!fields.includes(field) || field === 'cautions') continue;
    const next = band + lineNeed(field, lineSize);
    if (stackedModule(w, h, modules, next) < MIN_MODULE_MM) break;
    band = next;
  }
  return band;
}

/**
 * Where the QR and the text go on one label. Wide labels (at least 1.5 : 1) put the QR on the
 * left and the text beside it; others put the text in a band under the QR. The quiet zone is
 * always inside the label and nothing is drawn on it.
 */
export function labelLayout(
  size: LabelSize,
  modules: number,
  fields: readonly LabelField[],
): LabelLayout {
  const { widthMm: w, heightMm: h } = size;
  const wide = w >= 1.5 * h;
  let quietSide: number;
  let text: Box;
  if (wide) {
    quietSide = Math.min(h, w / 2);
    text = { x: quietSide, y: PAD_MM, widthMm: w - quietSide - PAD_MM, heightMm: h - 2 * PAD_MM };
  } else {
    // The text band under the QR takes what the asked-for lines need, one line at a time, as
    // long as the QR's modules stay at MIN_MODULE_MM or more; lines past that are dropped.
    const band = stackedBand(w, h, modules, fields);
    quietSide = Math.min(w, h - band);
    text = {
      x: PAD_MM,
      y: quietSide,
      widthMm: w - 2 * PAD_MM,
      heightMm: h - quietSide - PAD_MM * 0.5,
    };
  }
  const side = symbolSide(quietSide, modules);
  const moduleMm = side / modules;
  const quietMm = moduleMm * QUIET_ZONE_MODULES;
  const quiet = wide
    ? {
        x: 0,
        y: (h - side) / 2 - quietMm,
        widthMm: side + 2 * quietMm,
        heightMm: side + 2 * quietMm,
      }
    : {
        x: (w - side) / 2 - quietMm,
        y: 0,
        widthMm: side + 2 * quietMm,
        heightMm: side + 2 * quietMm,
      };
  const symbol = { x: quiet.x + quietMm, y: quiet.y + quietMm, widthMm: side, heightMm: side };
  if (wide) {
    const x = quiet.x + quiet.widthMm + TEXT_GAP_MM;
    text = { ...text, x, widthMm: w - x - PAD_MM };
  } else {
    const y = Math.max(text.y, quiet.y + quiet.heightMm + TEXT_GAP_MM);
    text = { ...text, y, heightMm: h - y - PAD_MM * 0.5 };
  }

  const codeSize = wide ? Math.min(6, h * 0.2) : stackedCodeSize(w);
  const lineSize = wide
    ? Math.max(MIN_TEXT_MM, Math.min(3.5, codeSize * 0.55))
    : stackedLineSize(codeSize);
  const lines: TextLine[] = [{ field: 'code', y: text.y, sizeMm: codeSize }];
  let used = codeSize * 1.15;
  const dropped: LabelField[] = [];
  const cautionsBesideCode = !wide && fields.includes('cautions');
  for (const field of LABEL_FIELDS) {
    if (!fields.includes(field) || (field === 'cautions' && cautionsBesideCode)) continue;
    // Caution symbols print a little larger than text: they are the part read at a glance.
    const sizeMm = field === 'cautions' ? lineSize * 1.3 : lineSize;
    const need = lineNeed(field, lineSize);
    if (used + need > text.heightMm + 1e-9) {
      dropped.push(field);
      continue;
    }
    lines.push({ field, y: round(text.y + used), sizeMm: round(sizeMm) });
    used += need;
  }
  return {
    mode: wide ? 'wide' : 'stacked',
    symbol: mapBox(symbol),
    quiet: mapBox(quiet),
    moduleMm: round(moduleMm),
    text: mapBox(text),
    lines,
    cautionsBesideCode,
    dropped,
    tooSmall: moduleMm < MIN_MODULE_MM,
  };
}

function mapBox(b: Box): Box {
  return { x: round(b.x), y: round(b.y), widthMm: round(b.widthMm), heightMm: round(b.heightMm) };
}
