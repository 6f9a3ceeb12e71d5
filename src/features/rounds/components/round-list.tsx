import { memo, type ReactNode } from 'react';
import { shelfHeading } from '#shared/domain/places';
import type { RoundItemView } from '#shared/schemas/rounds';
import { RoundItemCard } from './round-item-card';

function shelfOf(item: RoundItemView) {
  const l = item.animal.location;
  return shelfHeading(l);
}

// A tap changes one item; the other cards keep their props and skip rendering (P1 budget).
const Card = memo(function Card({
  item,
  timeZone,
  myName,
  actions,
  openRecord,
}: {
  item: RoundItemView;
  timeZone: string;
  myName?: string;
  actions?: (item: RoundItemView) => ReactNode;
  openRecord?: boolean;
}) {
  return (
    <RoundItemCard item={item} timeZone={timeZone} myName={myName} openRecord={openRecord}>
      {actions?.(item)}
    </RoundItemCard>
  );
});

/** Items in walk order, grouped by shelf with sticky headings. */
export function RoundList({
  items,
  timeZone,
  myName,
  actions,
  groupActions,
  openRecord,
  empty = 'Nothing is due. Enjoy the quiet.',
}: {
  items: RoundItemView[];
  timeZone: string;
  myName?: string;
  /** Keep it stable (useCallback) so untouched cards are not rendered again. */
  actions?: (item: RoundItemView) => ReactNode;
  /** Under each shelf's heading, e.g. a whole tray at once. */
  groupActions?: (label: string, items: RoundItemView[]) => ReactNode;
  /** Each card links to its animal's page (not for helpers: the server keeps it from them). */
  openRecord?: boolean;
  empty?: string;
}) {
  const groups: [string, RoundItemView[]][] = [];
  for (const item of items) {
    const label = shelfOf(item);
    const last = groups.at(-1);
    if (last && last[0] === label) last[1].push(item);
    else groups.push([label, [item]]);
  }
  if (!items.length) return <p className="text-muted">{empty}</p>;
  return (
    <div className="flex flex-col gap-4">
      {groups.map(([label, list], i) => (
        <section key={`${label}-${i}`} aria-label={label} className="flex flex-col gap-2">
          <h2 className="sticky top-0 z-10 bg-bg py-1 text-lg font-extrabold">{label}</h2>
          {groupActions?.(label, list)}
          {list.map((item) => (
            <Card
              key={item.animal.id}
              item={item}
              timeZone={timeZone}
              myName={myName}
              actions={actions}
              openRecord={openRecord}
            />
          ))}
        </section>
      ))}
    </div>
  );
}
