import { stageLabel } from '#shared/domain/animal-facts';
import { priceWords, sexWords, sizeWords } from '#shared/domain/sales/availability';
import type { ListingGroup } from '#shared/schemas/listings';

/** Stock by species and stage: what is on offer, what is held for a buyer. */
export function StockGroups({ groups }: { groups: readonly ListingGroup[] }) {
  if (!groups.length) return <p>Nothing is offered for sale yet.</p>;
  return (
    <ul className="grid gap-2 lg:grid-cols-2">
      {groups.map((g) => (
        <li
          key={`${g.scientificName}|${g.lifeStage}`}
          className="flex flex-col gap-1 rounded-2xl border-2 border-border bg-surface p-3"
        >
          <p className="text-lg font-extrabold">
            <i>{g.scientificName}</i> · {stageLabel(g.group, g.lifeStage)}
          </p>
          {g.commonName && <p className="text-muted">{g.commonName}</p>}
          <p className="font-bold">
            {g.available} available · {g.reserved} reserved
          </p>
          {g.available > 0 && (
            <>
              <p>{sexWords(g.sexes)}</p>
              <p>{sizeWords(g)}</p>
              <p>{priceWords(g.price)}</p>
            </>
          )}
        </li>
      ))}
    </ul>
  );
}
