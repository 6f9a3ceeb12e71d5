import { lazy, Suspense, useMemo } from 'react';
import { shelfHeading } from '#shared/domain/places';
import type { RoundItemView } from '#shared/schemas/rounds';
import { Shelf, type ListProps } from './round-shelf';

function shelfOf(item: RoundItemView) {
  const l = item.animal.location;
  return shelfHeading(l);
}

/**
 * From this many cards on, only the shelves near the screen are in the page (a virtual list):
 * a tap's render, style, layout and paint then cost the same on a 1,000-animal round as on a
 * short one (P1, P1-1k). Shorter rounds keep every card in the page, so the browser's find-in-page
 * and a screen reader's list of headings reach all of them (memoised cards: a tap renders one).
 * (`content-visibility: auto` was tried for those: an off-screen card's innerText reads empty.)
 */
export const VIRTUAL_FROM = 100;
// Only long rounds need the virtualizer: its code loads with the first one (P4: the first
// route's JavaScript stays small).
const VirtualShelves = lazy(() => import('./virtual-shelves'));

/** Items in walk order, grouped by shelf with sticky headings. */
export function RoundList({ items, groupActions, empty, fold = false, ...card }: ListProps) {
  const groups = useMemo(() => {
    const list: [string, RoundItemView[]][] = [];
    for (const item of items) {
      const label = shelfOf(item);
      const last = list.at(-1);
      if (last && last[0] === label) last[1].push(item);
      else list.push([label, [item]]);
    }
    return list;
  }, [items]);
  if (!items.length)
    return <p className="text-muted">{empty ?? 'Nothing is due. Enjoy the quiet.'}</p>;
  const props = { ...card, fold };
  if (items.length >= VIRTUAL_FROM)
    return (
      <Suspense fallback={<p className="text-muted">Laying out the round…</p>}>
        <VirtualShelves groups={groups} groupActions={groupActions} card={props} />
      </Suspense>
    );
  return (
    <div className="flex flex-col gap-4">
      {groups.map(([label, list], i) => (
        <Shelf
          key={`${label}-${i}`}
          label={label}
          list={list}
          actions={groupActions?.(label, list)}
          card={props}
        />
      ))}
    </div>
  );
}
