import { useState, type FormEvent } from 'react';
import { isCurrencyCode, parseAmount } from '#shared/domain/sales/money';
import type { InvoiceBody, InvoiceView } from '#shared/schemas/sales';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { TextField } from '@/components/ui/text-field';
import { INVOICE_STATUS_WORDS, money } from './sales-words';

/** Issue the invoice: the sale's animals become its lines, with shipping and a due day. */
export function NewInvoiceForm({
  currency,
  busy,
  error,
  onSubmit,
}: {
  currency: string;
  busy: boolean;
  error: string | null;
  onSubmit: (body: InvoiceBody) => void;
}) {
  const [shipping, setShipping] = useState('');
  const [dueOn, setDueOn] = useState('');
  const [problem, setProblem] = useState<string | null>(null);
  function submit(e: FormEvent) {
    e.preventDefault();
    const shippingMinor =
      shipping.trim() === ''
        ? 0
        : isCurrencyCode(currency)
          ? parseAmount(shipping, currency)
          : null;
    if (shippingMinor === null)
      return setProblem(`Give shipping as an amount in ${currency}, e.g. 30.00.`);
    setProblem(null);
    onSubmit({ shippingMinor, dueOn: dueOn || null, extraLines: [] });
  }
  return (
    <form onSubmit={submit} className="flex flex-col gap-3" noValidate>
      <TextField
        label={`Shipping (${currency})`}
        inputMode="decimal"
        value={shipping}
        onChange={(e) => setShipping(e.target.value)}
        hint="Leave empty when the buyer collects."
      />
      <TextField
        label="Due on"
        type="date"
        value={dueOn}
        onChange={(e) => setDueOn(e.target.value)}
      />
      {(problem ?? error) && <Notice tone="error" title={problem ?? error ?? ''} />}
      <Button type="submit" wide busy={busy}>
        Issue the invoice
      </Button>
    </form>
  );
}

/** The issued invoice: its lines, tax and totals as they were issued, and its status. */
export function InvoiceSummary({ invoice }: { invoice: InvoiceView }) {
  const m = (minor: number) => money(minor, invoice.currency);
  return (
    <div className="flex flex-col gap-2">
      <p className="text-lg font-extrabold">
        Invoice {invoice.number} · {INVOICE_STATUS_WORDS[invoice.status]}
      </p>
      <p className="text-sm text-muted">
        Issued {invoice.issuedOn}
        {invoice.dueOn ? ` · due ${invoice.dueOn}` : ''}
        {invoice.emailedAt ? ' · e-mailed to the buyer' : ''}
      </p>
      <table className="w-full text-left">
        <caption className="sr-only">Invoice lines</caption>
        <thead>
          <tr className="border-b-2 border-border">
            <th scope="col" className="py-1">
              Line
            </th>
            <th scope="col" className="py-1 text-right">
              Amount
            </th>
          </tr>
        </thead>
        <tbody>
          {invoice.lines.map((l) => (
            <tr key={l.position} className="border-b border-border align-top">
              <td className="py-1 pr-2">
                {l.quantity > 1 ? `${l.quantity} × ` : ''}
                {l.description}
              </td>
              <td className="py-1 text-right">{m(l.netMinor)}</td>
            </tr>
          ))}
        </tbody>
        <tfoot>
          <tr>
            <th scope="row" className="py-1 pr-3 text-right font-normal">
              Subtotal
            </th>
            <td className="py-1 text-right">{m(invoice.subtotalMinor)}</td>
          </tr>
          <tr>
            <th scope="row" className="py-1 pr-3 text-right font-normal">
              Tax {invoice.taxRateBp / 100} %
            </th>
            <td className="py-1 text-right">{m(invoice.taxMinor)}</td>
          </tr>
          <tr>
            <th scope="row" className="py-1 pr-3 text-right">
              Total
            </th>
            <td className="py-1 text-right font-extrabold">{m(invoice.totalMinor)}</td>
          </tr>
          {invoice.paidMinor > 0 && (
            <tr>
              <th scope="row" className="py-1 pr-3 text-right font-normal">
                Received
              </th>
              <td className="py-1 text-right">{m(invoice.paidMinor)}</td>
            </tr>
          )}
        </tfoot>
      </table>
    </div>
  );
}
