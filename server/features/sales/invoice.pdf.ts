import PDFDocument from 'pdfkit';
import { formatMoney, type CurrencyCode } from '#shared/domain/sales/money';
import type { InvoiceView } from '#shared/schemas/sales';

const STATUS_WORDS: Record<InvoiceView['status'], string> = {
  open: 'Open',
  part_paid: 'Part paid',
  paid: 'Paid',
  refunded: 'Refunded',
  cancelled: 'Cancelled',
};

export interface InvoicePdfInput {
  invoice: InvoiceView;
  sellerDetails: string;
  collectionName: string;
  buyer: { name: string; email: string | null; phone: string | null; address: string | null };
}

/**
 * The invoice as a one- or two-page A4 PDF: seller, buyer, lines, tax per the keeper's rate and
 * rounding, total, money received and status. pdfkit's standard Helvetica (WinAnsi) covers the
 * currency symbols we sell in (€, £, ¥, kr).
 */
export function invoicePdf(input: InvoicePdfInput): Promise<Buffer> {
  const { invoice, buyer } = input;
  const money = (minor: number) => formatMoney(minor, invoice.currency as CurrencyCode, 'en-GB');
  const doc = new PDFDocument({
    size: 'A4',
    margin: 50,
    info: { Title: `Invoice ${invoice.number}` },
  });
  const chunks: Buffer[] = [];
  doc.on('data', (c: Buffer) => chunks.push(c));
  const done = new Promise<Buffer>((resolve, reject) => {
    doc.on('end', () => resolve(Buffer.concat(chunks)));
    doc.on('error', reject);
  });

  doc.font('Helvetica-Bold').fontSize(20).text(`Invoice ${invoice.number}`);
  doc.font('Helvetica').fontSize(10).moveDown(0.3);
  doc.text(`Issued ${invoice.issuedOn}${invoice.dueOn ? ` · due ${invoice.dueOn}` : ''}`);
  doc.text(`Status: ${STATUS_WORDS[invoice.status]}`);
  doc.moveDown();

  const top = doc.y;
  doc.font('Helvetica-Bold').text('From', 50, top);
  doc
    .font('Helvetica')
    .text(input.sellerDetails || input.collectionName, 50, doc.y, { width: 230 });
  const leftBottom = doc.y;
  doc.font('Helvetica-Bold').text('To', 310, top);
  doc
    .font('Helvetica')
    .text(
      [buyer.name, buyer.address, buyer.email, buyer.phone].filter(Boolean).join('\n'),
      310,
      doc.y,
      { width: 235 },
    );
  doc.y = Math.max(leftBottom, doc.y) + 20;

  const cols = { desc: 50, qty: 330, unit: 370, net: 460 };
  const header = doc.y;
  doc.font('Helvetica-Bold');
  doc.text('Description', cols.desc, header, { width: 270 });
  doc.text('Qty', cols.qty, header, { width: 35, align: 'right' });
  doc.text('Unit', cols.unit, header, { width: 80, align: 'right' });
  doc.text('Amount', cols.net, header, { width: 85, align: 'right' });
  doc
    .moveTo(50, doc.y + 2)
    .lineTo(545, doc.y + 2)
    .stroke();
  doc.font('Helvetica');
  for (const line of invoice.lines) {
    const y = doc.y + 6;
    doc.text(line.description, cols.desc, y, { width: 270 });
    const after = doc.y;
    doc.text(String(line.quantity), cols.qty, y, { width: 35, align: 'right' });
    doc.text(money(line.unitMinor), cols.unit, y, { width: 80, align: 'right' });
    doc.text(money(line.netMinor), cols.net, y, { width: 85, align: 'right' });
    doc.y = after;
  }
  doc
    .moveTo(50, doc.y + 4)
    .lineTo(545, doc.y + 4)
    .stroke();
  doc.y += 10;

  const rate = `${(invoice.taxRateBp / 100).toLocaleString('en-GB', { maximumFractionDigits: 2 })} %`;
  const total = (label: string, value: string, bold = false) => {
    const y = doc.y;
    doc.font(bold ? 'Helvetica-Bold' : 'Helvetica');
    doc.text(label, 300, y, { width: 150, align: 'right' });
    doc.text(value, cols.net, y, { width: 85, align: 'right' });
  };
  total('Subtotal', money(invoice.subtotalMinor));
  total(`Tax ${rate}`, money(invoice.taxMinor));
  total('Total', money(invoice.totalMinor), true);
  if (invoice.paidMinor > 0) total('Received', money(invoice.paidMinor));
  if (invoice.refundedMinor > 0) total('Refunded', money(invoice.refundedMinor));
  const due = invoice.totalMinor - invoice.paidMinor + invoice.refundedMinor;
  if (invoice.status !== 'cancelled' && due > 0) total('Amount due', money(due), true);

  doc.font('Helvetica').fontSize(8).moveDown(2);
  doc.text(
    invoice.taxRounding === 'per_line'
      ? 'Tax is rounded on each line and added up.'
      : 'Tax is worked out on the total of the lines and rounded once.',
    50,
    doc.y,
    { width: 495 },
  );
  doc.end();
  return done;
}
