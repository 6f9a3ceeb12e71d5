import { useWindowVirtualizer } from '@tanstack/react-virtual';
import { memo, useLayoutEffect, useMemo, useRef, useState, type ReactNode } from 'react';
import { shelfHeading } from '#shared/domain/places';
import type { RoundItemView } from '#shared/schemas/rounds';
import { Button } from '@/components/ui/button';
import { isItemDone, needsLook } from '../filter-items';
import { DoneRow, RoundItemCard, settledOutcomes } from './round-item-card';

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
  status,
  onUndo,
  openRecord,
  fold,
}: {
  item: RoundItemView;
  timeZone: string;
  myName?: string;
  actions?: (item: RoundItemView) => ReactNode;
  status?: (item: RoundItemView) => ReactNode;
  onUndo?: (item: RoundItemView, eventId: string, word: string) => void;
  openRecord?: boolean;
  fold: boolean;
}) {
  // A finished card folds to a row. Opened again ("Change"), it stays open until it is folded
  // or finished anew: the outcomes it was opened with are remembered, not a bare flag.
  const settled = settledOutcomes(item)
    .map((o) => o.eventId)
    .join(',');
  const [openedAt, setOpenedAt] = useState<string | null>(null);
  const done = fold && isItemDone(item) && !needsLook(item);
  if (done && openedAt !== settled)
    return (
      <DoneRow
        item={item}
        timeZone={timeZone}
        myName={myName}
        onExpand={() => setOpenedAt(settled)}
      >
        {status?.(item)}
      </DoneRow>
    );
  return (
    <RoundItemCard
      item={item}
      timeZone={timeZone}
      myName={myName}
      openRecord={openRecord}
      // Undo sits on a finished card opened again ("Change"); a tap just made has its toast.
      onUndo={done && onUndo ? (eventId, word) => onUndo(item, eventId, word) : undefined}
      corner={
        done && (
          <Button
            variant="secondary"
            aria-expanded
            className="self-end px-3 text-base"
            onClick={() => setOpenedAt(null)}
          >
            Fold<span className="sr-only"> {item.animal.name}</span>
          </Button>
        )
      }
    >
      {actions?.(item)}
      {status?.(item)}
    </RoundItemCard>
  );
});

/**
 * From this many cards on, only the shelves near the screen are in the page (a virtual list):
 * a tap's render, style, layout and paint then cost the same on a 1,000-animal round as on a
 * short one (P1, P1-1k). Shorter rounds keep every card in the page, so the browser's find-in-page
 * and a screen reader's list of headings reach all of them (memoised cards: a tap renders one).
 * (`content-visibility: auto` was tried for those: an off-screen card's innerText reads empty.)
 */
export const VIRTUAL_FROM = 100;
/** A shelf longer than this is cut into parts, so no single part of the virtual list is huge. */
const PART_SIZE = 12;

interface ListProps {
  items: RoundItemView[];
  timeZone: string;
  myName?: string;
  /** Keep it stable (useCallback) so untouched cards are not rendered again. */
  actions?: (item: RoundItemView) => ReactNode;
  /** Under each shelf's heading, e.g. a whole tray at once. */
  groupActions?: (label: string, items: RoundItemView[]) => ReactNode;
  /** Under each card and each folded row (keep it stable), e.g. a photo on its way. */
  status?: (item: RoundItemView) => ReactNode;
  /** Undo an outcome from a finished card opened again (keep it stable). */
  onUndo?: (item: RoundItemView, eventId: string, word: string) => void;
  /** Each card links to its animal's page (not for helpers: the server keeps it from them). */
  openRecord?: boolean;
  /** Fold finished cards to a compact row (today's round; not a preview). */
  fold?: boolean;
  empty?: string;
}

type CardProps = Omit<ListProps, 'items' | 'groupActions' | 'empty'> & { fold: boolean };

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
    return <VirtualShelves groups={groups} groupActions={groupActions} card={props} />;
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

function Shelf({
  label,
  list,
  actions,
  card,
}: {
  label: string;
  list: RoundItemView[];
  actions: ReactNode;
  card: CardProps;
}) {
  return (
    <section aria-label={label} className="flex flex-col gap-2">
      <h2 className="sticky top-0 z-10 bg-bg py-1 text-lg font-extrabold">{label}</h2>
      {actions}
      {list.map((item) => (
        <Card key={item.animal.id} item={item} {...card} />
      ))}
    </section>
  );
}

/**
 * A long round: one row of the virtual list per shelf (or per part of a long shelf), each the
 * same section as in the short list, so headings stay sticky within their shelf.
 */
function VirtualShelves({
  groups,
  groupActions,
  card,
}: {
  groups: [string, RoundItemView[]][];
  groupActions?: ListProps['groupActions'];
  card: CardProps;
}) {
  const parts = useMemo(
    () =>
      groups.flatMap(([label, list], g) => {
        const out: { key: string; label: string; list: RoundItemView[]; whole: RoundItemView[] }[] =
          [];
        for (let i = 0; i < list.length; i += PART_SIZE)
          out.push({
            key: `${label}-${g}-${i}`,
            label,
            list: list.slice(i, i + PART_SIZE),
            whole: list,
          });
        return out;
      }),
    [groups],
  );
  // The list starts down the page (progress, filters): the window virtualizer must know where.
  const listRef = useRef<HTMLDivElement>(null);
  const [scrollMargin, setScrollMargin] = useState(0);
  useLayoutEffect(() => {
    const measure = () => {
      const el = listRef.current;
      if (el) setScrollMargin(Math.round(el.getBoundingClientRect().top + window.scrollY));
    };
    measure();
    const observer = new ResizeObserver(measure);
    if (listRef.current?.parentElement) observer.observe(listRef.current.parentElement);
    window.addEventListener('resize', measure);
    return () => {
      observer.disconnect();
      window.removeEventListener('resize', measure);
    };
  }, []);
  const virtualizer = useWindowVirtualizer({
    count: parts.length,
    estimateSize: (i) => 60 + parts[i]!.list.length * 330,
    overscan: 1,
    scrollMargin,
    getItemKey: (i) => parts[i]!.key,
  });
  const rows = virtualizer.getVirtualItems();
  const padTop = Math.max(0, (rows[0]?.start ?? scrollMargin) - scrollMargin);
  const padBottom = Math.max(
    0,
    virtualizer.getTotalSize() - ((rows.at(-1)?.end ?? scrollMargin) - scrollMargin),
  );
  return (
    <div ref={listRef} style={{ paddingTop: padTop, paddingBottom: padBottom }}>
      {rows.map((row) => {
        const part = parts[row.index]!;
        const first = part.list[0] === part.whole[0];
        return (
          <div
            key={row.key}
            data-index={row.index}
            ref={virtualizer.measureElement}
            className="pb-4"
          >
            <Shelf
              label={part.label}
              list={part.list}
              actions={first ? groupActions?.(part.label, part.whole) : undefined}
              card={card}
            />
          </div>
        );
      })}
    </div>
  );
}
