import { memo, useState, type ReactNode } from 'react';
import type { RoundItemView } from '#shared/schemas/rounds';
import { Button } from '@/components/ui/button';
import { isItemDone, needsLook } from '../filter-items';
import { DoneRow, RoundItemCard, settledOutcomes } from './round-item-card';

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

export interface ListProps {
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

export type CardProps = Omit<ListProps, 'items' | 'groupActions' | 'empty'> & { fold: boolean };

export function Shelf({
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
