import PDFDocument from 'pdfkit';
import type { CareSheet } from '#shared/domain/sales/care-sheet';

/** A4 in PDF points (ISO 216: 210 × 297 mm; 1 pt = 1/72 in, ISO 32000-1 8.3.2.3). */
const A4: [number, number] = [595.28, 841.89];
const MARGIN = 50;

/** One care sheet, laid out top to bottom; pdfkit flows long text onto a new page. */
export function renderCareSheetPdf(sheet: CareSheet): Promise<Buffer> {
  const doc = new PDFDocument({
    size: A4,
    margin: MARGIN,
    info: { Title: `Care sheet — ${sheet.title}`, Creator: 'Rackside' },
  });
  const chunks: Buffer[] = [];
  doc.on('data', (c: Buffer) => chunks.push(c));
  const finished = new Promise<Buffer>((resolve, reject) => {
    doc.on('end', () => resolve(Buffer.concat(chunks)));
    doc.on('error', reject);
  });
  const width = A4[0] - 2 * MARGIN;

  const heading = (words: string) => {
    doc.moveDown(0.8).font('Helvetica-Bold').fontSize(13).fillColor('#000000').text(words);
    doc.moveDown(0.2);
  };
  const body = (words: string) =>
    doc.font('Helvetica').fontSize(10.5).fillColor('#000000').text(words, { width });
  const bullets = (lines: readonly string[]) => lines.forEach((l) => body(`•  ${l}`).moveDown(0.2));

  doc.font('Helvetica-Bold').fontSize(20).text(sheet.title, { width });
  doc.font('Helvetica').fontSize(11).fillColor('#333333').text(sheet.subtitle, { width });
  doc.text(`From ${sheet.from}`, { width });

  heading('The animal');
  for (const f of sheet.facts) {
    doc.font('Helvetica-Bold').fontSize(10.5).fillColor('#000000').text(`${f.label}: `, {
      continued: true,
    });
    doc.font('Helvetica').text(f.value);
  }

  heading('Recent meals');
  if (sheet.meals.length) for (const m of sheet.meals) body(`${m.date} — ${m.what}`);
  else body('No meals recorded yet.');

  heading('Feeding');
  bullets(sheet.feeding);
  heading('Water');
  bullets(sheet.water);

  heading('Cautions');
  for (const c of sheet.cautions) {
    doc.font('Helvetica-Bold').fontSize(10.5).text(c.title, { width });
    body(c.text).moveDown(0.3);
  }
  bullets(sheet.general);

  if (sheet.breederNotes) {
    heading('From the breeder');
    body(sheet.breederNotes);
  }
  doc.end();
  return finished;
}
