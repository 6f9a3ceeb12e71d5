import { useState } from 'react';
import { formatMoney } from '#shared/domain/sales/money';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { useListingChanges, useListings } from '../api/listings-api';
import { CareSheetLinks } from './care-sheet-links';
import { localCurrency, OfferForm } from './offer-form';

/** On the animal page, for owners and keepers: its price, change it, take it off sale. */
export function ForSalePanel({
  collectionId,
  animalId,
  kept,
}: {
  collectionId: string;
  animalId: string;
  kept: boolean;
}) {
  const listings = useListings(collectionId);
  const { put, remove } = useListingChanges(collectionId);
  const [editing, setEditing] = useState(false);
  const row = listings.data?.rows.find((r) => r.animalId === animalId);
  return (
    <section
      aria-labelledby="for-sale"
      className="flex flex-col gap-2 rounded-2xl border-2 border-border bg-surface p-3"
    >
      <h2 id="for-sale" className="text-xl font-extrabold">
        For sale
      </h2>
      {listings.isError && <Notice tone="error" title={listings.error.message} />}
      {row && !editing && (
        <>
          <p className="text-lg">
            <span className="font-bold">{formatMoney(row.priceMinor, row.currency)}</span>
            {' · '}
            {row.state === 'reserved' ? 'reserved for a buyer' : 'available'}
            {row.listedPublicly ? '' : ' · not on the public list'}
          </p>
          {row.description && <p className="text-muted">{row.description}</p>}
        </>
      )}
      {!row && !editing && listings.isSuccess && (
        <p className="text-muted">
          {kept ? 'Not offered for sale.' : 'No longer kept: it cannot be offered.'}
        </p>
      )}
      {editing ? (
        <OfferForm
          initial={row}
          defaultCurrency={listings.data?.rows[0]?.currency ?? localCurrency()}
          submitLabel={row ? 'Save price' : 'Offer for sale'}
          busy={put.isPending}
          error={put.error?.message ?? null}
          onSubmit={(body) =>
            put.mutate({ animalId, body }, { onSuccess: () => setEditing(false) })
          }
        />
      ) : (
        kept && (
          <div className="grid grid-cols-2 gap-2">
            <Button variant="secondary" onClick={() => setEditing(true)}>
              {row ? 'Change price' : 'Offer for sale'}
            </Button>
            {row && (
              <Button
                variant="danger"
                busy={remove.isPending}
                onClick={() => remove.mutate(animalId)}
              >
                Take off sale
              </Button>
            )}
          </div>
        )
      )}
      {editing && (
        <Button variant="quiet" onClick={() => setEditing(false)}>
          Cancel
        </Button>
      )}
      {remove.isError && <Notice tone="error" title={remove.error.message} />}
      <CareSheetLinks collectionId={collectionId} animalId={animalId} />
    </section>
  );
}
