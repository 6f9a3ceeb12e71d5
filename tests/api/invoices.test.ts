import { execFileSync } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { signUp, type SignedUp } from '../factories';
import { createTestContext, type TestContext } from '../setup/test-app';
import { listedClutch, receivePayment } from '../support/sales';

let ctx: TestContext;
let owner: SignedUp;
let c: string;

beforeAll(async () => {
  ctx = await createTestContext();
  owner = await signUp(ctx);
  c = `/api/collections/${owner.collectionId}`;
  ctx.setNow(new Date('2026-12-03T17:00:00Z'));
});
afterAll(async () => {
  ctx.setNow(null);
  await ctx.close();
});

const settings = (taxRounding: 'per_invoice' | 'per_line') => ({
  currency: 'CAD',
  taxRateBp: 1300,
  taxRounding,
  sellerDetails: 'Test Inverts\n1 Queen St W, Toronto ON\nHST 123456789',
  holdDays: 7,
  safeMinC: 5,
  safeMaxC: 30,
});

async function saleOf(
  count: number,
  priceMinor: number,
  email: string | null = 'kit@example.test',
) {
  const buyer = await owner.agent
    .post(`${c}/buyers`)
    .send({ name: 'Kit Marlowe', email, address: '5 Bay St, Halifax NS' })
    .expect(201);
  const ids = await listedClutch(ctx.database.db, owner.collectionId, { count, priceMinor });
  const sale = await owner.agent
    .post(`${c}/sales`)
    .send({ buyerId: buyer.body.id, animalIds: ids })
    .expect(201);
  return sale.body.id as string;
}

function pdfText(pdf: Buffer): string {
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'invoice-'));
  const file = path.join(dir, 'invoice.pdf');
  fs.writeFileSync(file, pdf);
  try {
    return execFileSync('pdftotext', ['-layout', file, '-'], { encoding: 'utf8' });
  } finally {
    fs.rmSync(dir, { recursive: true, force: true });
  }
}

describe('invoices', () => {
  it('totals the sale’s animals, shipping and extra lines with the keeper’s tax', async () => {
    await owner.agent.put(`${c}/sales-settings`).send(settings('per_invoice')).expect(200);
    const saleId = await saleOf(3, 2500);
    const res = await owner.agent
      .post(`${c}/sales/${saleId}/invoice`)
      .send({
        shippingMinor: 3000,
        dueOn: '2026-12-10',
        extraLines: [{ description: 'Deli cups', quantity: 2, unitMinor: 150 }],
      })
      .expect(201);
    // Worked by hand: 3 × 25.00 + 30.00 + 2 × 1.50 = 108.00; 13 % HST = 14.04; total 122.04.
    expect(res.body).toMatchObject({
      number: '2026-0001',
      status: 'open',
      currency: 'CAD',
      subtotalMinor: 10800,
      taxMinor: 1404,
      totalMinor: 12204,
      paidMinor: 0,
      dueOn: '2026-12-10',
      issuedOn: '2026-12-03',
    });
    expect(res.body.lines.map((l: { description: string }) => l.description)).toEqual([
      expect.stringMatching(/^Hapalopus formosus, sling \(TS-/),
      expect.stringMatching(/^Hapalopus formosus, sling/),
      expect.stringMatching(/^Hapalopus formosus, sling/),
      'Shipping',
      'Deli cups',
    ]);
    // One live invoice per sale.
    const again = await owner.agent.post(`${c}/sales/${saleId}/invoice`).send({}).expect(409);
    expect(again.body.error.message).toMatch(/2026-0001/);
  });

  it('rounds per line when the keeper chose it (a cent apart from per invoice)', async () => {
    await owner.agent.put(`${c}/sales-settings`).send(settings('per_line')).expect(200);
    // Three at 2.50 with 13 %: each line's 0.325 → 0.33, so 0.99; per invoice 0.975 → 0.98.
    const saleId = await saleOf(3, 250);
    const res = await owner.agent.post(`${c}/sales/${saleId}/invoice`).send({}).expect(201);
    expect(res.body).toMatchObject({ subtotalMinor: 750, taxMinor: 99, totalMinor: 849 });
    expect(res.body.number).toBe('2026-0002');
    await owner.agent.put(`${c}/sales-settings`).send(settings('per_invoice')).expect(200);
  });

  it('numbers invoices made at once without a gap or a repeat', async () => {
    const sales = await Promise.all([saleOf(1, 1000), saleOf(1, 1000), saleOf(1, 1000)]);
    const made = await Promise.all(
      sales.map((id) => owner.agent.post(`${c}/sales/${id}/invoice`).send({})),
    );
    expect(made.map((r) => r.status)).toEqual([201, 201, 201]);
    expect(made.map((r) => r.body.number).sort()).toEqual(['2026-0003', '2026-0004', '2026-0005']);
  });

  it('prints a PDF with the seller, the buyer, the lines, the tax, the total and the status', async () => {
    const saleId = await saleOf(2, 2500);
    const invoice = (
      await owner.agent
        .post(`${c}/sales/${saleId}/invoice`)
        .send({ shippingMinor: 2000 })
        .expect(201)
    ).body;
    const res = await owner.agent
      .get(`${c}/invoices/${invoice.id}/invoice.pdf`)
      .buffer(true)
      .parse((r, done) => {
        const chunks: Buffer[] = [];
        r.on('data', (chunk: Buffer) => chunks.push(chunk));
        r.on('end', () => done(null, Buffer.concat(chunks)));
      })
      .expect(200)
      .expect('Content-Type', /application\/pdf/);
    const text = pdfText(res.body as Buffer);
    expect(text).toContain(`Invoice ${invoice.number}`);
    expect(text).toContain('Test Inverts');
    expect(text).toContain('HST 123456789');
    expect(text).toContain('Kit Marlowe');
    expect(text).toMatch(/Hapalopus formosus, sling/);
    // 70.00 + 13 % (9.10) = 79.10
    expect(text).toMatch(/Tax 13 %\s+CA\$9\.10/);
    expect(text).toMatch(/Total\s+CA\$79\.10/);
    expect(text).toContain('Status: Open');
  });

  it('e-mails the PDF to the buyer, and refuses in words when the buyer has no address', async () => {
    const saleId = await saleOf(1, 2500);
    const invoice = (await owner.agent.post(`${c}/sales/${saleId}/invoice`).send({}).expect(201))
      .body;
    const sent = await owner.agent.post(`${c}/invoices/${invoice.id}/email`).expect(200);
    expect(sent.body.emailedAt).toBe('2026-12-03T17:00:00.000Z');
    const mail = await ctx.mailbox.waitFor((m) => m.subject.includes(invoice.number));
    expect(mail.to).toEqual(['kit@example.test']);
    expect(mail.attachments).toHaveLength(1);
    expect(mail.attachments![0]!.filename).toBe(`invoice-${invoice.number}.pdf`);
    expect(pdfText(mail.attachments![0]!.content)).toContain(`Invoice ${invoice.number}`);
    // The dev mailbox still lists it, attachments by name.
    const box = await owner.agent.get('/api/dev/mail').expect(200);
    const listed = box.body.messages.find((m: { subject: string }) =>
      m.subject.includes(invoice.number),
    );
    expect(listed.attachments).toEqual([`invoice-${invoice.number}.pdf`]);

    const noEmail = await saleOf(1, 2500, null);
    const other = (await owner.agent.post(`${c}/sales/${noEmail}/invoice`).send({}).expect(201))
      .body;
    const refused = await owner.agent.post(`${c}/invoices/${other.id}/email`).expect(422);
    expect(refused.body.error.message).toMatch(/no e-mail address/);
  });

  it('cancels an unpaid invoice (a new one may follow) and refuses once money came in', async () => {
    const saleId = await saleOf(1, 2500);
    const first = (await owner.agent.post(`${c}/sales/${saleId}/invoice`).send({}).expect(201))
      .body;
    const cancelled = await owner.agent.post(`${c}/invoices/${first.id}/cancel`).expect(200);
    expect(cancelled.body.status).toBe('cancelled');
    await owner.agent.post(`${c}/invoices/${first.id}/email`).expect(409);
    const second = (await owner.agent.post(`${c}/sales/${saleId}/invoice`).send({}).expect(201))
      .body;
    expect(second.number).not.toBe(first.number);
    await receivePayment(ctx.database.db, second.id, 500, 'part_paid');
    const refused = await owner.agent.post(`${c}/invoices/${second.id}/cancel`).expect(409);
    expect(refused.body.error.message).toMatch(/[Rr]efund it first/);
    // Nor can the sale be cancelled with money received.
    await owner.agent.post(`${c}/sales/${saleId}/cancel`).expect(409);
  });

  it('finds no invoice of another collection', async () => {
    const other = await signUp(ctx);
    const saleId = await saleOf(1, 2500);
    const invoice = (await owner.agent.post(`${c}/sales/${saleId}/invoice`).send({}).expect(201))
      .body;
    await other.agent
      .get(`/api/collections/${other.collectionId}/invoices/${invoice.id}`)
      .expect(404);
    await other.agent
      .get(`/api/collections/${other.collectionId}/invoices/${invoice.id}/invoice.pdf`)
      .expect(404);
  });
});
