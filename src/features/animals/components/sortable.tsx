import { useState, type PointerEvent as ReactPointerEvent, type ReactNode } from 'react';

/** Props for the handle a row is dragged by (mouse, pen or finger: pointer events). */
export interface DragHandleProps {
  onPointerDown: (e: ReactPointerEvent<HTMLElement>) => void;
  onPointerMove: (e: ReactPointerEvent<HTMLElement>) => void;
  onPointerUp: (e: ReactPointerEvent<HTMLElement>) => void;
  onPointerCancel: () => void;
  style: { touchAction: 'none' };
}

/**
 * A list whose rows are reordered by dragging their handle. The handle captures the pointer, so
 * a finger may leave it while dragging; the row under the pointer's height is the drop place.
 * The move up/down buttons each row also has are the keyboard's way (drag is not required).
 */
export function SortableList<T>({
  items,
  keyOf,
  label,
  className = '',
  onMove,
  children,
}: {
  items: readonly T[];
  keyOf: (item: T) => string;
  label: string;
  className?: string;
  onMove: (from: number, to: number) => void;
  children: (item: T, index: number, handle: DragHandleProps, dragging: boolean) => ReactNode;
}) {
  const [drag, setDrag] = useState<{ from: number; over: number; dy: number; y0: number } | null>(
    null,
  );

  // The list is found from the handle (the nearest <ol> that holds this list's rows).
  const rowMiddles = (from: Element) =>
    [...(from.closest('ol[data-sortable]')?.children ?? [])].map((el) => {
      const r = el.getBoundingClientRect();
      return r.top + r.height / 2;
    });
  /** Where the dragged row would land: after every other row whose middle is above the pointer. */
  const overAt = (from: Element, y: number, dragged: number) =>
    rowMiddles(from).filter((mid, i) => i !== dragged && mid < y).length;

  const handle = (index: number): DragHandleProps => ({
    style: { touchAction: 'none' },
    onPointerDown: (e) => {
      if (e.button !== 0) return;
      e.preventDefault();
      e.currentTarget.setPointerCapture(e.pointerId);
      setDrag({ from: index, over: index, dy: 0, y0: e.clientY });
    },
    onPointerMove: (e) => {
      if (!drag || drag.from !== index) return;
      setDrag({
        ...drag,
        over: overAt(e.currentTarget, e.clientY, index),
        dy: e.clientY - drag.y0,
      });
    },
    onPointerUp: (e) => {
      if (!drag || drag.from !== index) return;
      e.currentTarget.releasePointerCapture(e.pointerId);
      const to = overAt(e.currentTarget, e.clientY, index);
      setDrag(null);
      if (to !== drag.from) onMove(drag.from, to);
    },
    onPointerCancel: () => setDrag(null),
  });

  return (
    <ol data-sortable aria-label={label} className={className}>
      {items.map((item, i) => {
        const dragging = drag?.from === i;
        const target = drag && !dragging && drag.over === i;
        return (
          <li
            key={keyOf(item)}
            className={`relative ${dragging ? 'z-10 opacity-80 shadow-lg' : ''} ${
              target
                ? drag.over > drag.from
                  ? 'border-b-4 border-b-primary'
                  : 'border-t-4 border-t-primary'
                : ''
            }`}
            style={dragging ? { transform: `translateY(${drag.dy}px)` } : undefined}
          >
            {children(item, i, handle(i), dragging)}
          </li>
        );
      })}
    </ol>
  );
}

/** The grip a row is dragged by: hidden from screen readers, whose way is the move buttons. */
export function DragHandle({ handle, what }: { handle: DragHandleProps; what: string }) {
  return (
    <span
      {...handle}
      aria-hidden="true"
      title={`Drag to move ${what}`}
      className="flex min-h-target min-w-target cursor-grab select-none items-center justify-center rounded-xl border-2 border-dashed border-border text-2xl text-muted active:cursor-grabbing"
    >
      ⠿
    </span>
  );
}
