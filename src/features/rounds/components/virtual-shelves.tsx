import { useWindowVirtualizer } from '@tanstack/react-virtual';
import { useMemo } from 'react';
import type { RoundItemView } from '#shared/schemas/rounds';
import { useScrollMargin, windowPadding } from '@/lib/use-scroll-margin';
import { Shelf, type CardProps, type ListProps } from './round-shelf';

/** A shelf longer than this is cut into parts, so no single part of the virtual list is huge. */
const PART_SIZE = 12;

/**
 * A long round: one row of the virtual list per shelf (or per part of a long shelf), each the
 * same section as in the short list, so headings stay sticky within their shelf.
 */
export default function VirtualShelves({
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
  // The list starts down the page (progress, filters); a tap resizes only the list's parent.
  const { ref: listRef, scrollMargin } = useScrollMargin<HTMLDivElement>(
    (list) => list.parentElement,
  );
  const virtualizer = useWindowVirtualizer({
    count: parts.length,
    estimateSize: (i) => 60 + parts[i]!.list.length * 330,
    overscan: 1,
    scrollMargin,
    getItemKey: (i) => parts[i]!.key,
  });
  const rows = virtualizer.getVirtualItems();
  const { padTop, padBottom } = windowPadding(rows, virtualizer.getTotalSize(), scrollMargin);
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
