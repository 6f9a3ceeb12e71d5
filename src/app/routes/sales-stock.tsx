import { useState } from 'react';
import { Link } from 'react-router-dom';
import { formatMoney } from '#shared/domain/sales/money';
import { NoCollection } from '@/app/layout/no-collection';
import { useShell } from '@/app/layout/use-shell';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { SelectField } from '@/components/ui/select-field';
import { Loading } from '@/components/ui/spinner';
import { useListingChanges, useListings } from '@/features/listings/api/listings-api';
import { CareSheetLinks } from '@/features/listings/components/care-sheet-links';
import { localCurrency, OfferForm } from '@/features/listings/components/offer-form';
import { StockGroups } from '@/features/listings/components/stock-groups';

/** Stock for sale: groups by species and stage, a clutch offered at one price, each listing. */
export function SalesStockRoute() {
  const { collection } = useShell();
  if (!collection) return <NoCollection />;
  if (collection.role === 'helper')
    return <Notice tone="info" title="Sales are kept by the collection’s owner and keepers." />;
  return <SalesStock collectionId={collection.collectionId} />;
}

function SalesStock({ collectionId }: { collectionId: string }) {
  const listings = useListings(collectionId);
  const { bulk, remove } = useListingChanges(collectionId);
  const [clutch, setClutch] = useState('');
  if (listings.isPending) return <Loading />;
  if (listings.isError) return <Notice tone="error" title={listings.error.message} />;
  const { rows, groups, clutches } = listings.data;
  const chosen = clutch || clutches[0]?.clutch || '';
  const result = bulk.data;
  return (
    <div className="flex flex-col gap-4">
      <h1 className="text-3xl font-extrabold">Stock for sale</h1>
      <p className="text-muted">
        Animals on offer stay on the round until they leave. Some species need a permit to keep or
        sell where you or the buyer live: local law comes first.
      </p>
      <StockGroups groups={groups} />

      <section
        aria-labelledby="offer-clutch"
        className="flex flex-col gap-3 rounded-2xl border-2 border-border bg-surface p-3"
      >
        <h2 id="offer-clutch" className="text-xl font-extrabold">
          Offer a clutch
        </h2>
        {clutches.length === 0 ? (
          <p>No clutch has animals left to offer.</p>
        ) : (
          <>
            <SelectField
              label="Clutch"
              value={chosen}
              onChange={(e) => setClutch(e.target.value)}
              hint="All its animals you still keep and no buyer holds, at one price."
              options={clutches.map((c) => ({
                value: c.clutch,
                label: `${c.clutch} (${c.animals})`,
              }))}
            />
            <OfferForm
              key={chosen}
              defaultCurrency={rows[0]?.currency ?? localCurrency()}
              submitLabel="Offer the clutch"
              busy={bulk.isPending}
              error={bulk.error?.message ?? null}
              onSubmit={(v) => bulk.mutate({ clutch: chosen, ...v })}
            />
          </>
        )}
        {result && (
          <Notice
            tone="ok"
            title={`${result.listed} offered${result.skipped ? ` · ${result.skipped} left out (held for a buyer or no longer kept)` : ''}.`}
          />
        )}
      </section>

      {rows.length > 0 && (
        <section aria-labelledby="each-listing" className="flex flex-col gap-2">
          <h2 id="each-listing" className="text-xl font-extrabold">
            Each animal
          </h2>
          <ul className="flex flex-col gap-2">
            {rows.map((r) => (
              <li
                key={r.animalId}
                className="flex flex-col gap-2 rounded-2xl border-2 border-border bg-surface p-3"
              >
                <Link
                  to={`/animals/${r.animalId}`}
                  className="flex min-h-target flex-col justify-center"
                >
                  <span className="text-lg font-extrabold underline underline-offset-4">
                    {r.name}
                  </span>
                  <span className="text-muted">
                    {r.labelCode} · {r.sizeMm !== null ? `${r.sizeMm} mm` : 'size not recorded'}
                    {r.instar !== null && ` · instar ${r.instar}`}
                  </span>
                </Link>
                <p>
                  <span className="font-bold">{formatMoney(r.priceMinor, r.currency)}</span>
                  {' · '}
                  {r.state === 'reserved' ? 'reserved' : 'available'}
                  {!r.listedPublicly && ' · not on the public list'}
                </p>
                <CareSheetLinks collectionId={collectionId} animalId={r.animalId} />
                <Button
                  variant="danger"
                  busy={remove.isPending && remove.variables === r.animalId}
                  onClick={() => remove.mutate(r.animalId)}
                >
                  Take off sale
                </Button>
              </li>
            ))}
          </ul>
          {remove.isError && <Notice tone="error" title={remove.error.message} />}
        </section>
      )}

      <Link
        to="/sales/settings"
        className="inline-flex min-h-target items-center font-bold underline underline-offset-4"
      >
        Public availability list: settings and link
      </Link>
    </div>
  );
}
