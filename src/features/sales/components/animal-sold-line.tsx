import { Link } from 'react-router-dom';
import { describeLocalDate } from '#shared/domain/local-dates';
import { useAnimalSale } from '../api/sales-api';

/**
 * "Sold to … on …" on a sold animal's page, for owners and keepers only: the route refuses
 * helpers, and the caller does not render this for them.
 */
export function AnimalSoldLine({
  collectionId,
  animalId,
}: {
  collectionId: string;
  animalId: string;
}) {
  const sale = useAnimalSale(collectionId, animalId);
  const s = sale.data?.sale;
  if (!s || s.status !== 'shipped') return null;
  return (
    <div className="flex flex-col gap-1">
      <p className="font-bold">
        Sold to {s.buyerName}
        {s.shippedOn ? ` on ${describeLocalDate(s.shippedOn, true)}` : ''}.
      </p>
      <Link
        to={`/sales/${s.saleId}`}
        className="inline-flex min-h-target items-center font-bold underline underline-offset-4"
      >
        Open the sale
      </Link>
    </div>
  );
}
