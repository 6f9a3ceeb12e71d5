import { useState } from 'react';
import { Link, useNavigate } from 'react-router-dom';
import { addDays, localDateOf } from '#shared/domain/local-dates';
import { SALE_STATUSES } from '#shared/schemas/sales';
import { NoCollection } from '@/app/layout/no-collection';
import { useShell } from '@/app/layout/use-shell';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { Loading } from '@/components/ui/spinner';
import {
  useAvailable,
  useBuyerChanges,
  useBuyers,
  useReserve,
  useSales,
  useSalesSettings,
} from '@/features/sales/api/sales-api';
import { ReserveForm, type ReserveChoice } from '@/features/sales/components/reserve-form';
import {
  INVOICE_STATUS_WORDS,
  money,
  SALE_STATUS_WORDS,
} from '@/features/sales/components/sales-words';

/** Sales: reservations and sales by state, the Reserve flow, and the way to stock and buyers. */
export function SalesRoute() {
  const { collection } = useShell();
  if (!collection) return <NoCollection />;
  if (collection.role === 'helper')
    return <Notice tone="info" title="Sales are kept by the collection’s owner and keepers." />;
  return <Sales collectionId={collection.collectionId} timeZone={collection.timeZone} />;
}

const linkClass =
  'inline-flex min-h-target items-center justify-center rounded-xl border-2 border-border bg-surface px-4 font-bold';

function Sales({ collectionId, timeZone }: { collectionId: string; timeZone: string }) {
  const sales = useSales(collectionId);
  const [reserving, setReserving] = useState(false);
  if (sales.isPending) return <Loading />;
  if (sales.isError) return <Notice tone="error" title={sales.error.message} />;
  const { counts } = sales.data;
  return (
    <div className="flex flex-col gap-4">
      <h1 className="text-3xl font-extrabold">Sales</h1>
      <nav aria-label="Sales pages" className="flex flex-wrap gap-2">
        <Link to="/sales/stock" className={linkClass}>
          Stock for sale
        </Link>
        <Link to="/sales/buyers" className={linkClass}>
          Buyers
        </Link>
        <Link to="/sales/settings" className={linkClass}>
          Sales settings
        </Link>
      </nav>
      <p className="text-muted">
        {SALE_STATUSES.map((s) => `${SALE_STATUS_WORDS[s]}: ${counts[s]}`).join(' · ')}
      </p>
      {reserving ? (
        <section
          aria-labelledby="reserve"
          className="flex flex-col gap-3 rounded-2xl border-2 border-border bg-surface p-3"
        >
          <h2 id="reserve" className="text-xl font-extrabold">
            Reserve animals
          </h2>
          <Reserve
            collectionId={collectionId}
            timeZone={timeZone}
            onDone={() => setReserving(false)}
          />
          <Button variant="secondary" onClick={() => setReserving(false)}>
            Not now
          </Button>
        </section>
      ) : (
        <Button wide onClick={() => setReserving(true)}>
          Reserve animals for a buyer
        </Button>
      )}
      {SALE_STATUSES.map((status) => {
        const list = sales.data.sales.filter((s) => s.status === status);
        if (!list.length) return null;
        return (
          <section key={status} aria-labelledby={`sales-${status}`} className="flex flex-col gap-2">
            <h2 id={`sales-${status}`} className="text-xl font-extrabold">
              {SALE_STATUS_WORDS[status]} ({list.length})
            </h2>
            <ul className="flex flex-col gap-2">
              {list.map((s) => (
                <li key={s.id}>
                  <Link
                    to={`/sales/${s.id}`}
                    className="flex min-h-target flex-col rounded-2xl border-2 border-border bg-surface p-3"
                  >
                    <span className="text-lg font-extrabold underline underline-offset-4">
                      {s.buyer.name}
                    </span>
                    <span>
                      {s.animalCount} {s.animalCount === 1 ? 'animal' : 'animals'} ·{' '}
                      {money(s.priceMinor, s.currency)}
                    </span>
                    <span className="text-muted">
                      {s.status === 'reserved' ? `Held until ${s.reservedUntil}` : ''}
                      {s.invoiceStatus
                        ? ` · Invoice ${INVOICE_STATUS_WORDS[s.invoiceStatus].toLowerCase()}`
                        : ''}
                      {s.shipOn ? ` · Ships ${s.shipOn}` : ''}
                    </span>
                  </Link>
                </li>
              ))}
            </ul>
          </section>
        );
      })}
      {sales.data.sales.length === 0 && <p>No reservations or sales yet.</p>}
    </div>
  );
}

function Reserve({
  collectionId,
  timeZone,
  onDone,
}: {
  collectionId: string;
  timeZone: string;
  onDone: () => void;
}) {
  const available = useAvailable(collectionId);
  const buyers = useBuyers(collectionId);
  const settings = useSalesSettings(collectionId);
  const reserve = useReserve(collectionId);
  const { create } = useBuyerChanges(collectionId);
  const navigate = useNavigate();
  const [error, setError] = useState<string | null>(null);
  if (available.isPending || buyers.isPending || settings.isPending) return <Loading />;
  const failed = available.error ?? buyers.error ?? settings.error;
  if (failed) return <Notice tone="error" title={failed.message} />;

  async function submit(choice: ReserveChoice) {
    setError(null);
    try {
      const buyerId =
        'id' in choice.buyer ? choice.buyer.id : (await create.mutateAsync(choice.buyer)).id;
      const sale = await reserve.mutateAsync({
        buyerId,
        animalIds: choice.animalIds,
        reservedUntil: choice.reservedUntil,
      });
      onDone();
      navigate(`/sales/${sale.id}`);
    } catch (err) {
      setError((err as Error).message);
    }
  }

  return (
    <ReserveForm
      available={available.data!.animals}
      buyers={buyers.data!.buyers}
      defaultUntil={addDays(localDateOf(new Date(), timeZone), settings.data!.holdDays)}
      busy={reserve.isPending || create.isPending}
      error={error}
      onSubmit={(c) => void submit(c)}
    />
  );
}
