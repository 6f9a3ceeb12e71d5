import { useState } from 'react';
import { Link } from 'react-router-dom';
import type { BuyerView } from '#shared/schemas/sales';
import { NoCollection } from '@/app/layout/no-collection';
import { useShell } from '@/app/layout/use-shell';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { Loading } from '@/components/ui/spinner';
import { useBuyerChanges, useBuyers } from '@/features/sales/api/sales-api';
import { BuyerForm } from '@/features/sales/components/buyer-form';

/** Buyers and their contact details: owners and keepers only. */
export function SalesBuyersRoute() {
  const { collection } = useShell();
  if (!collection) return <NoCollection />;
  if (collection.role === 'helper')
    return <Notice tone="info" title="Buyers are kept by the collection’s owner and keepers." />;
  return <Buyers collectionId={collection.collectionId} />;
}

function Buyers({ collectionId }: { collectionId: string }) {
  const buyers = useBuyers(collectionId);
  const { create } = useBuyerChanges(collectionId);
  const [adding, setAdding] = useState(false);
  if (buyers.isPending) return <Loading />;
  if (buyers.isError) return <Notice tone="error" title={buyers.error.message} />;
  return (
    <div className="flex flex-col gap-4">
      <Link
        to="/sales"
        className="inline-flex min-h-target items-center font-bold underline underline-offset-4"
      >
        ← Sales
      </Link>
      <h1 className="text-3xl font-extrabold">Buyers</h1>
      {buyers.data.buyers.length === 0 && <p>No buyers yet.</p>}
      <ul className="flex flex-col gap-2">
        {buyers.data.buyers.map((b) => (
          <li key={b.id}>
            <BuyerCard collectionId={collectionId} buyer={b} />
          </li>
        ))}
      </ul>
      {adding ? (
        <section
          aria-labelledby="new-buyer"
          className="flex flex-col gap-2 rounded-2xl border-2 border-border bg-surface p-3"
        >
          <h2 id="new-buyer" className="text-xl font-extrabold">
            New buyer
          </h2>
          <BuyerForm
            busy={create.isPending}
            error={create.error?.message ?? null}
            submitLabel="Add buyer"
            onSubmit={(body) => create.mutate(body, { onSuccess: () => setAdding(false) })}
            onCancel={() => setAdding(false)}
          />
        </section>
      ) : (
        <Button wide onClick={() => setAdding(true)}>
          Add a buyer
        </Button>
      )}
    </div>
  );
}

function BuyerCard({ collectionId, buyer }: { collectionId: string; buyer: BuyerView }) {
  const { update, remove } = useBuyerChanges(collectionId);
  const [editing, setEditing] = useState(false);
  if (editing)
    return (
      <section
        aria-label={`Edit ${buyer.name}`}
        className="flex flex-col gap-2 rounded-2xl border-2 border-border bg-surface p-3"
      >
        <BuyerForm
          buyer={buyer}
          busy={update.isPending}
          error={update.error?.message ?? null}
          submitLabel="Save buyer"
          onSubmit={(body) =>
            update.mutate({ buyerId: buyer.id, body }, { onSuccess: () => setEditing(false) })
          }
          onCancel={() => setEditing(false)}
        />
      </section>
    );
  return (
    <div className="flex flex-col gap-1 rounded-2xl border-2 border-border bg-surface p-3">
      <p className="text-lg font-extrabold">{buyer.name}</p>
      {buyer.email && <p>{buyer.email}</p>}
      {buyer.phone && <p>{buyer.phone}</p>}
      {buyer.address && <p className="whitespace-pre-line">{buyer.address}</p>}
      {buyer.notes && <p className="text-muted">{buyer.notes}</p>}
      <p className="text-sm text-muted">
        {buyer.saleCount} {buyer.saleCount === 1 ? 'sale' : 'sales'}
      </p>
      {remove.error && <Notice tone="error" title={remove.error.message} />}
      <div className="flex flex-wrap gap-2">
        <Button variant="secondary" onClick={() => setEditing(true)}>
          Edit
        </Button>
        <Button
          variant="danger"
          busy={remove.isPending}
          onClick={() => {
            if (window.confirm(`Delete ${buyer.name}?`)) remove.mutate(buyer.id);
          }}
        >
          Delete
        </Button>
      </div>
    </div>
  );
}
