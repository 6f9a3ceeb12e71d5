import { useQueryClient } from '@tanstack/react-query';
import { useState, type ReactNode } from 'react';
import { Link, useParams } from 'react-router-dom';
import { SEX_LABEL, STAGE_LABEL } from '#shared/domain/animal-facts';
import type { SaleDetail } from '#shared/schemas/sales';
import { NoCollection } from '@/app/layout/no-collection';
import { useShell } from '@/app/layout/use-shell';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { Loading } from '@/components/ui/spinner';
import { TextField } from '@/components/ui/text-field';
import { CareSheetLinks } from '@/features/listings/components/care-sheet-links';
import { InvoicePayment } from '@/features/payments/components/invoice-payment';
import { invoicePdfUrl, useSale, useSaleChanges } from '@/features/sales/api/sales-api';
import { InvoiceSummary, NewInvoiceForm } from '@/features/sales/components/invoice-panel';
import { money, SALE_STATUS_WORDS } from '@/features/sales/components/sales-words';
import {
  ShippingCaution,
  ShippingCheck,
  ShippingForm,
} from '@/features/sales/components/shipping-panel';
import { useTemperatureUnit } from '@/lib/preferences';
import { queryKeys } from '@/lib/query-keys';

/** One sale: its animals, buyer, hold, invoice, shipping and the hand-over. */
export function SalesDetailRoute() {
  const { collection } = useShell();
  const { saleId = '' } = useParams();
  if (!collection) return <NoCollection />;
  if (collection.role === 'helper')
    return <Notice tone="info" title="Sales are kept by the collection’s owner and keepers." />;
  return <Sale collectionId={collection.collectionId} saleId={saleId} />;
}

function Section({ title, id, children }: { title: string; id: string; children: ReactNode }) {
  return (
    <section
      aria-labelledby={id}
      className="flex flex-col gap-3 rounded-2xl border-2 border-border bg-surface p-3"
    >
      <h2 id={id} className="text-xl font-extrabold">
        {title}
      </h2>
      {children}
    </section>
  );
}

function Sale({ collectionId, saleId }: { collectionId: string; saleId: string }) {
  const sale = useSale(collectionId, saleId);
  const changes = useSaleChanges(collectionId, saleId);
  const [unit] = useTemperatureUnit();
  const queryClient = useQueryClient();
  if (sale.isPending) return <Loading />;
  if (sale.isError) return <Notice tone="error" title={sale.error.message} />;
  const s = sale.data;
  const open = s.status === 'reserved';
  const invoice = s.invoice;
  const paidInFull = invoice?.status === 'paid';
  return (
    <div className="flex flex-col gap-4">
      <Link
        to="/sales"
        className="inline-flex min-h-target items-center font-bold underline underline-offset-4"
      >
        ← Sales
      </Link>
      <h1 className="text-3xl font-extrabold">
        {s.buyer.name} · {SALE_STATUS_WORDS[s.status]}
      </h1>
      <p className="text-lg">
        {s.animalCount} {s.animalCount === 1 ? 'animal' : 'animals'} ·{' '}
        {money(s.priceMinor, s.currency)}
      </p>

      <Section title="Animals" id="sale-animals">
        <ul className="flex flex-col gap-1">
          {s.animals.map((a) => (
            <li key={a.id} className="flex flex-col gap-1">
              <Link
                to={`/animals/${a.id}`}
                className="flex min-h-target flex-col rounded-xl border-2 border-border px-3 py-2"
              >
                <span className="font-bold underline underline-offset-4">
                  {a.labelCode} · <i>{a.scientificName}</i>
                </span>
                <span className="text-sm text-muted">
                  {STAGE_LABEL[a.lifeStage]} · {SEX_LABEL[a.sex]}
                  {a.sizeMm !== null ? ` · ${a.sizeMm} mm` : ''} · {money(a.priceMinor, a.currency)}
                  {a.released ? ' · released' : ''}
                </span>
              </Link>
              {/* What the buyer gets with the animal (and in the shipping note's attachments). */}
              {!a.released && <CareSheetLinks collectionId={collectionId} animalId={a.id} />}
            </li>
          ))}
        </ul>
      </Section>

      <Section title="Buyer" id="sale-buyer">
        <p className="font-bold">{s.buyer.name}</p>
        {s.buyer.email && <p>{s.buyer.email}</p>}
        {s.buyer.phone && <p>{s.buyer.phone}</p>}
        {s.buyer.address && <p className="whitespace-pre-line">{s.buyer.address}</p>}
      </Section>

      {open && (
        <Section title="Hold" id="sale-hold">
          <Hold sale={s} changes={changes} />
        </Section>
      )}

      <Section title="Invoice" id="sale-invoice">
        {invoice ? (
          <>
            <InvoiceSummary invoice={invoice} />
            <InvoicePayment
              collectionId={collectionId}
              invoice={invoice}
              onChanged={() =>
                void queryClient.invalidateQueries({ queryKey: queryKeys.sales.all(collectionId) })
              }
            />
            <a
              href={invoicePdfUrl(collectionId, invoice.id)}
              target="_blank"
              rel="noreferrer"
              className="inline-flex min-h-target items-center justify-center rounded-xl border-2 border-border px-4 font-bold"
            >
              Open the invoice PDF
            </a>
            {changes.emailInvoice.error && (
              <Notice tone="error" title={changes.emailInvoice.error.message} />
            )}
            {changes.emailInvoice.isSuccess && (
              <Notice tone="ok" title="The invoice went to the buyer." />
            )}
            {invoice.status !== 'cancelled' && (
              <div className="flex flex-wrap gap-2">
                <Button
                  variant="secondary"
                  busy={changes.emailInvoice.isPending}
                  onClick={() => changes.emailInvoice.mutate(invoice.id)}
                >
                  E-mail to the buyer
                </Button>
                {open && (
                  <Button
                    variant="danger"
                    busy={changes.cancelInvoice.isPending}
                    onClick={() => {
                      if (window.confirm(`Cancel invoice ${invoice.number}?`))
                        changes.cancelInvoice.mutate(invoice.id);
                    }}
                  >
                    Cancel the invoice
                  </Button>
                )}
              </div>
            )}
            {changes.cancelInvoice.error && (
              <Notice tone="error" title={changes.cancelInvoice.error.message} />
            )}
          </>
        ) : open ? (
          <NewInvoiceForm
            currency={s.currency}
            busy={changes.invoice.isPending}
            error={changes.invoice.error?.message ?? null}
            onSubmit={(body) => changes.invoice.mutate(body)}
          />
        ) : (
          <p className="text-muted">No invoice.</p>
        )}
      </Section>

      {(open || s.status === 'shipped') && (
        <Section title="Shipping" id="sale-shipping">
          <ShippingCaution text={s.shipping.caution} />
          {open ? (
            <>
              <ShippingForm
                key={`${s.shipping.shipOn}-${s.shipping.forecastLowC}-${s.shipping.forecastHighC}`}
                shipping={s.shipping}
                unit={unit}
                busy={changes.shipping.isPending}
                error={changes.shipping.error?.message ?? null}
                onSubmit={(body) => changes.shipping.mutate(body)}
              />
              <h3 className="text-lg font-extrabold">Shipping check</h3>
              <ShippingCheck
                shipping={s.shipping}
                unit={unit}
                busy={changes.confirm.isPending}
                error={changes.confirm.error?.message ?? null}
                onConfirm={(anyway) => changes.confirm.mutate(anyway)}
              />
              <h3 className="text-lg font-extrabold">Hand over</h3>
              {!paidInFull && (
                <p className="text-muted">The animals ship once the invoice is paid in full.</p>
              )}
              {changes.ship.error && <Notice tone="error" title={changes.ship.error.message} />}
              <Button
                wide
                busy={changes.ship.isPending}
                disabled={!paidInFull || !s.shipping.confirmedAt}
                onClick={() =>
                  changes.ship.mutate(undefined, {
                    onSuccess: () =>
                      void queryClient.invalidateQueries({
                        queryKey: queryKeys.animals.all(collectionId),
                      }),
                  })
                }
              >
                Shipped: mark the animals sold
              </Button>
            </>
          ) : (
            <p>
              Shipped {s.shipping.shipOn ?? ''}
              {s.shipping.carrier ? ` with ${s.shipping.carrier}` : ''}
              {s.shipping.tracking ? ` (tracking ${s.shipping.tracking})` : ''}. The animals are
              retired as sold; their history stays.
            </p>
          )}
        </Section>
      )}
    </div>
  );
}

function Hold({ sale, changes }: { sale: SaleDetail; changes: ReturnType<typeof useSaleChanges> }) {
  const [until, setUntil] = useState(sale.reservedUntil);
  return (
    <div className="flex flex-col gap-2">
      <p>
        Held until the end of {sale.reservedUntil}. Without money received, the animals are free
        again the day after.
      </p>
      <TextField
        label="Hold until (last day)"
        type="date"
        value={until}
        onChange={(e) => setUntil(e.target.value)}
      />
      {changes.patch.error && <Notice tone="error" title={changes.patch.error.message} />}
      <div className="flex flex-wrap gap-2">
        <Button
          variant="secondary"
          busy={changes.patch.isPending}
          onClick={() => changes.patch.mutate({ reservedUntil: until })}
        >
          Change the hold
        </Button>
        <Button
          variant="danger"
          busy={changes.cancel.isPending}
          onClick={() => {
            if (window.confirm('Cancel this sale? Its animals become available again.'))
              changes.cancel.mutate();
          }}
        >
          Cancel the sale
        </Button>
      </div>
      {changes.cancel.error && <Notice tone="error" title={changes.cancel.error.message} />}
    </div>
  );
}
