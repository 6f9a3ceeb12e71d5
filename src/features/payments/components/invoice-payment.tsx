import { useId, useState, type FormEvent } from 'react';
import {
  outstandingMinor,
  refundableMinor,
  type InvoiceStatus,
} from '#shared/domain/sales/invoice-state';
import {
  formatMoney,
  isCurrencyCode,
  minorToDecimal,
  parseAmount,
  type CurrencyCode,
} from '#shared/domain/sales/money';
import type { PaymentView } from '#shared/schemas/payments';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { SelectField } from '@/components/ui/select-field';
import { TextField } from '@/components/ui/text-field';
import { useInvoicePayments, usePaymentChanges } from '../api/invoice-payments-api';

export interface InvoicePaymentProps {
  collectionId: string;
  invoice: {
    id: string;
    status: InvoiceStatus;
    currency: string;
    totalMinor: number;
    paidMinor: number;
    refundedMinor: number;
  };
  /** Called after money changed, so the page can refresh its own copy of the invoice. */
  onChanged?: () => void;
}

const when = (iso: string) =>
  new Date(iso).toLocaleString(undefined, { dateStyle: 'medium', timeStyle: 'short' });
const day = (iso: string) => new Date(iso).toLocaleDateString(undefined, { dateStyle: 'medium' });

const METHOD_WORDS: Record<PaymentView['method'], string> = {
  card: 'card',
  bank_transfer: 'bank transfer',
  cash: 'cash',
};

/**
 * An invoice's payment: what is owed in words, card checkout (a link for the buyer), money
 * recorded by hand (a deposit by bank transfer, cash at an expo), refunds, and what happened.
 * No card number ever passes through Rackside: the buyer types it on the payment service's page.
 */
export function InvoicePayment({ collectionId, invoice: given, onChanged }: InvoicePaymentProps) {
  const headingId = useId();
  const query = useInvoicePayments(collectionId, given.id);
  const changes = usePaymentChanges(collectionId, given.id, onChanged);
  const data = query.data;
  const invoice = data?.invoice ?? { ...given, checkoutUrl: null };
  const currency = (isCurrencyCode(invoice.currency) ? invoice.currency : 'EUR') as CurrencyCode;
  const money = (minor: number) => formatMoney(minor, currency);
  const m = { ...invoice, cancelled: invoice.status === 'cancelled' };
  const owed = outstandingMinor(m);
  const refundable = refundableMinor(m);
  const takesMoney = invoice.status === 'open' || invoice.status === 'part_paid';
  const link = changes.checkout.data?.url ?? invoice.checkoutUrl;
  const hasCard = data?.payments.some((p) => p.kind === 'payment' && p.method === 'card');

  return (
    <section aria-labelledby={headingId} className="flex flex-col gap-4">
      <h2 id={headingId} className="text-xl font-extrabold">
        Payment
      </h2>
      <StatusLine status={invoice.status} money={money} owed={owed} m={invoice} />

      {data?.lastDecline && (
        <Notice tone="warning" title="The last card attempt was declined">
          {data.lastDecline.message} ({when(data.lastDecline.at)})
        </Notice>
      )}

      {takesMoney && data && !data.cardPayments && (
        <Notice title="Card payment is not set up on this server">
          Record bank transfers and cash below.
        </Notice>
      )}

      {takesMoney && data?.cardPayments && (
        <div className="flex flex-col gap-2">
          <Button
            wide
            busy={changes.checkout.isPending}
            onClick={() =>
              changes.checkout.mutate(undefined, {
                onSuccess: ({ url }) => window.open(url, '_blank', 'noopener'),
              })
            }
          >
            Open card checkout ({money(owed)})
          </Button>
          {link && <CopyLink url={link} />}
          {changes.checkout.error && <Notice tone="error" title={changes.checkout.error.message} />}
          <p className="text-sm text-muted">
            The buyer pays on the payment service’s page; Rackside never sees the card.
          </p>
        </div>
      )}

      {takesMoney && (
        <ManualPayment
          key={owed}
          currency={currency}
          suggested={owed}
          busy={changes.record.isPending}
          error={changes.record.error?.message}
          onRecord={(body) => changes.record.mutate(body)}
        />
      )}

      {refundable > 0 && (
        <Refund
          // A new amount, or the payments list arriving (card refunds possible), starts afresh.
          key={`${refundable}:${!!hasCard && !!data?.cardPayments}`}
          currency={currency}
          refundable={refundable}
          cardAllowed={!!hasCard && !!data?.cardPayments}
          busy={changes.refund.isPending}
          error={changes.refund.error?.message}
          onRefund={(body) => changes.refund.mutate(body)}
        />
      )}

      {data && data.payments.length > 0 && (
        <div>
          <h3 className="font-bold">Payments and refunds</h3>
          <ul className="mt-1 flex flex-col gap-1">
            {data.payments.map((p) => (
              <li
                key={p.id}
                className="flex flex-wrap justify-between gap-2 border-b border-border py-1"
              >
                <span>
                  {p.kind === 'payment' ? 'Paid' : 'Refunded'} by {METHOD_WORDS[p.method]},{' '}
                  {day(p.at)}
                </span>
                <span className="font-bold">
                  {p.kind === 'refund' ? '−' : ''}
                  {money(p.amountMinor)}
                </span>
              </li>
            ))}
          </ul>
        </div>
      )}
      {query.error && <Notice tone="error" title={query.error.message} />}
    </section>
  );
}

function StatusLine({
  status,
  money,
  owed,
  m,
}: {
  status: InvoiceStatus;
  money: (minor: number) => string;
  owed: number;
  m: { totalMinor: number; paidMinor: number; refundedMinor: number };
}) {
  const text: Record<InvoiceStatus, string> = {
    open: `Not paid yet: ${money(owed)} to pay.`,
    part_paid: `Part paid: ${money(m.paidMinor)} of ${money(m.totalMinor)} received, ${money(owed)} still to pay.`,
    paid: `Paid in full (${money(m.paidMinor)} received).`,
    refunded: `Refunded: ${money(m.refundedMinor)} returned to the buyer.`,
    cancelled: 'Cancelled: this invoice takes no payment.',
  };
  return (
    <p className="text-lg" data-testid="invoice-payment-status">
      <strong>{text[status]}</strong>
      {status === 'paid' && m.refundedMinor > 0 && ` ${money(m.refundedMinor)} refunded.`}
    </p>
  );
}

function CopyLink({ url }: { url: string }) {
  const [copied, setCopied] = useState(false);
  return (
    <div className="flex flex-col gap-1">
      <Button
        variant="secondary"
        wide
        onClick={() =>
          void navigator.clipboard?.writeText(url).then(
            () => setCopied(true),
            () => setCopied(false),
          )
        }
      >
        Copy payment link for the buyer
      </Button>
      <p className="text-sm text-muted" aria-live="polite">
        {copied ? 'Copied. ' : ''}
        <a
          href={url}
          target="_blank"
          rel="noopener noreferrer"
          className="inline-flex min-h-target items-center break-all font-bold text-text underline underline-offset-4"
        >
          {url}
        </a>
      </p>
    </div>
  );
}

function ManualPayment({
  currency,
  suggested,
  busy,
  error,
  onRecord,
}: {
  currency: CurrencyCode;
  suggested: number;
  busy: boolean;
  error?: string;
  onRecord: (body: { method: 'bank_transfer' | 'cash'; amountMinor: number }) => void;
}) {
  const [method, setMethod] = useState<'bank_transfer' | 'cash'>('bank_transfer');
  const [amount, setAmount] = useState(minorToDecimal(suggested, currency));
  const [problem, setProblem] = useState<string>();
  const submit = (e: FormEvent) => {
    e.preventDefault();
    const minor = parseAmount(amount, currency);
    if (minor === null || minor <= 0) return setProblem(`Write an amount such as 25.00.`);
    setProblem(undefined);
    onRecord({ method, amountMinor: minor });
  };
  return (
    <form onSubmit={submit} className="flex flex-col gap-2 rounded-xl border-2 border-border p-3">
      <h3 className="font-bold">Record a payment received</h3>
      <SelectField
        label="How it was paid"
        value={method}
        onChange={(e) => setMethod(e.target.value as 'bank_transfer' | 'cash')}
        options={[
          { value: 'bank_transfer', label: 'Bank transfer' },
          { value: 'cash', label: 'Cash' },
        ]}
      />
      <TextField
        label={`Amount (${currency})`}
        inputMode="decimal"
        value={amount}
        onChange={(e) => setAmount(e.target.value)}
        hint="A deposit is fine: the invoice shows as part paid."
        error={problem ?? error}
      />
      <Button type="submit" variant="secondary" wide busy={busy}>
        Record payment
      </Button>
    </form>
  );
}

function Refund({
  currency,
  refundable,
  cardAllowed,
  busy,
  error,
  onRefund,
}: {
  currency: CurrencyCode;
  refundable: number;
  cardAllowed: boolean;
  busy: boolean;
  error?: string;
  onRefund: (body: { method: PaymentView['method']; amountMinor: number; nonce: string }) => void;
}) {
  // One refund per form: a second tap (or a resend) carries the same nonce and is refused by
  // the server; a new amount after a refund remounts the form with a new one.
  const [nonce] = useState(() => crypto.randomUUID());
  const [method, setMethod] = useState<PaymentView['method']>(
    cardAllowed ? 'card' : 'bank_transfer',
  );
  const [amount, setAmount] = useState(minorToDecimal(refundable, currency));
  const [problem, setProblem] = useState<string>();
  const submit = (e: FormEvent) => {
    e.preventDefault();
    const minor = parseAmount(amount, currency);
    if (minor === null || minor <= 0) return setProblem('Write an amount such as 25.00.');
    if (minor > refundable)
      return setProblem(`At most ${formatMoney(refundable, currency)} can be refunded.`);
    setProblem(undefined);
    const how = method === 'card' ? 'to the buyer’s card' : `by ${METHOD_WORDS[method]}`;
    if (window.confirm(`Refund ${formatMoney(minor, currency)} ${how}? This cannot be undone.`))
      onRefund({ method, amountMinor: minor, nonce });
  };
  const options = [
    ...(cardAllowed ? [{ value: 'card', label: 'To the buyer’s card' }] : []),
    { value: 'bank_transfer', label: 'Bank transfer (sent by me)' },
    { value: 'cash', label: 'Cash (given by me)' },
  ];
  return (
    <form onSubmit={submit} className="flex flex-col gap-2 rounded-xl border-2 border-border p-3">
      <h3 className="font-bold">Refund</h3>
      <SelectField
        label="How the money goes back"
        value={method}
        onChange={(e) => setMethod(e.target.value as PaymentView['method'])}
        options={options}
      />
      <TextField
        label={`Amount to refund (${currency})`}
        inputMode="decimal"
        value={amount}
        onChange={(e) => setAmount(e.target.value)}
        hint={`Up to ${formatMoney(refundable, currency)}.`}
        error={problem ?? error}
      />
      <Button type="submit" variant="danger" wide busy={busy}>
        Refund…
      </Button>
    </form>
  );
}
