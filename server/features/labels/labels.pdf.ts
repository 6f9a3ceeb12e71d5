import PDFDocument from 'pdfkit';
import {
  CAUTION_SYMBOL_GRID,
  CAUTION_SYMBOL_PATHS,
  CAUTION_SYMBOL_STROKE,
} from '#shared/domain/caution-symbols';
import type { LabelContent } from '#shared/domain/labels/label-content';
import { qrPath } from '#shared/domain/labels/qr-symbol';
import {
  CUT_LINE_OFFSET_MM,
  CUT_LINE_WIDTH_MM,
  placeLabels,
  RULER_LENGTH_MM,
  type SheetLayout,
} from '#shared/domain/labels/sheet-layout';

/** PDF user space is 1/72 in (ISO 32000-1, 8.3.2.3); 1 in = 25.4 mm. */
const PT_PER_MM = 72 / 25.4;
const pt = (mm: number) => mm * PT_PER_MM;

function drawSymbol(doc: PDFKit.PDFDocument, label: LabelContent, x: number, y: number) {
  const { symbol } = label.layout;
  doc.save();
  doc.translate(pt(x + symbol.x), pt(y + symbol.y));
  doc.scale(pt(label.layout.moduleMm));
  doc.path(qrPath(label.symbol)).fill('#000000');
  doc.restore();
}

function drawCautions(
  doc: PDFKit.PDFDocument,
  label: LabelContent,
  x: number,
  y: number,
  sizeMm: number,
) {
  label.cautions.forEach((caution, i) => {
    doc.save();
    doc.translate(pt(x + i * (sizeMm + 0.6)), pt(y));
    doc.scale(pt(sizeMm) / CAUTION_SYMBOL_GRID);
    doc.lineWidth(CAUTION_SYMBOL_STROKE).lineCap('round').lineJoin('round').strokeColor('#000000');
    for (const d of CAUTION_SYMBOL_PATHS[caution]) doc.path(d).stroke();
    doc.restore();
  });
}

const cautionsWidth = (count: number, sizeMm: number) => (count ? count * (sizeMm + 0.6) : 0);

function drawText(doc: PDFKit.PDFDocument, label: LabelContent, x: number, y: number) {
  const { text, lines, cautionsBesideCode } = label.layout;
  for (const line of lines) {
    const top = y + line.y;
    const left = x + text.x;
    if (line.field === 'cautions') {
      drawCautions(doc, label, left, top, line.sizeMm);
      continue;
    }
    let width = text.widthMm;
    if (line.field === 'code' && cautionsBesideCode && label.cautions.length) {
      const beside = cautionsWidth(label.cautions.length, line.sizeMm);
      width -= beside;
      drawCautions(doc, label, left + text.widthMm - beside, top, line.sizeMm);
    }
    const font =
      line.field === 'code'
        ? 'Helvetica-Bold'
        : line.field === 'scientificName'
          ? 'Helvetica-Oblique'
          : 'Helvetica';
    const words = line.field === 'code' ? label.code : label[line.field];
    doc
      .font(font)
      .fontSize(pt(line.sizeMm))
      .fillColor('#000000')
      .text(words, pt(left), pt(top), {
        width: pt(width),
        height: pt(line.sizeMm * 1.2),
        lineBreak: false,
        ellipsis: true,
      });
  }
}

/** A 50 mm scale with millimetre ticks: measured on paper, it shows the print was not scaled. */
function drawRuler(doc: PDFKit.PDFDocument, sheet: SheetLayout, page: number, pages: number) {
  const { x, y, lengthMm } = sheet.ruler;
  doc.save().lineWidth(0.5).strokeColor('#000000');
  doc
    .moveTo(pt(x), pt(y))
    .lineTo(pt(x + lengthMm), pt(y))
    .stroke();
  for (let mm = 0; mm <= RULER_LENGTH_MM; mm++) {
    const tick = mm % 10 === 0 ? 3 : mm % 5 === 0 ? 2 : 1;
    doc
      .moveTo(pt(x + mm), pt(y))
      .lineTo(pt(x + mm), pt(y - tick))
      .stroke();
  }
  doc.restore();
  doc
    .font('Helvetica')
    .fontSize(7)
    .fillColor('#000000')
    .text(
      `${RULER_LENGTH_MM} mm scale: if it measures otherwise, print at actual size (100 %). Sheet ${page} of ${pages}.`,
      pt(x + lengthMm + 3),
      pt(y - 3),
      { width: pt(sheet.printable.widthMm - lengthMm - 3), lineBreak: false, ellipsis: true },
    );
}

/** One PDF page per sheet, labels where the shared layout puts them, drawn as vectors. */
export function renderLabelsPdf(
  labels: readonly LabelContent[],
  sheet: SheetLayout,
  start: number,
): Promise<Buffer> {
  const doc = new PDFDocument({
    size: [pt(sheet.page.widthMm), pt(sheet.page.heightMm)],
    margin: 0,
    autoFirstPage: false,
    info: { Title: 'Rackside labels', Creator: 'Rackside' },
  });
  const chunks: Buffer[] = [];
  doc.on('data', (c: Buffer) => chunks.push(c));
  const finished = new Promise<Buffer>((resolve, reject) => {
    doc.on('end', () => resolve(Buffer.concat(chunks)));
    doc.on('error', reject);
  });
  const places = placeLabels(labels.length, start, sheet.perSheet);
  const pages = (places.at(-1)?.sheet ?? 0) + 1;
  let page = -1;
  labels.forEach((label, i) => {
    const place = places[i]!;
    while (page < place.sheet) {
      doc.addPage();
      page += 1;
      drawRuler(doc, sheet, page + 1, pages);
    }
    const cell = sheet.cells[place.cell]!;
    // A faint cut line just outside the label, in the gap, never on the QR's quiet zone.
    doc
      .save()
      .lineWidth(pt(CUT_LINE_WIDTH_MM))
      .strokeColor('#9a9a9a')
      .dash(1.5, { space: 1.5 })
      .roundedRect(
        pt(cell.x - CUT_LINE_OFFSET_MM),
        pt(cell.y - CUT_LINE_OFFSET_MM),
        pt(sheet.label.widthMm + 2 * CUT_LINE_OFFSET_MM),
        pt(sheet.label.heightMm + 2 * CUT_LINE_OFFSET_MM),
        pt(1),
      )
      .stroke()
      .restore();
    drawSymbol(doc, label, cell.x, cell.y);
    drawText(doc, label, cell.x, cell.y);
  });
  doc.end();
  return finished;
}
