import { codeKey } from '#shared/domain/labels/label-payload';
import { countsForProgress } from '#shared/domain/rounds/settle';
import type { RoundItemView } from '#shared/schemas/rounds';

export const ROUND_FILTERS = ['to_do', 'done', 'cautions', 'all'] as const;
export type RoundFilter = (typeof ROUND_FILTERS)[number];
export const FILTER_WORDS: Record<RoundFilter, string> = {
  to_do: 'To do',
  done: 'Done',
  cautions: 'Cautions',
  all: 'All',
};

/** An item is done when every task that counts has an outcome (leave-alone is information). */
export function isItemDone(item: RoundItemView): boolean {
  return item.tasks.filter((t) => countsForProgress(t.kind)).every((t) => t.done);
}

function matches(item: RoundItemView, search: string): boolean {
  const q = search.trim();
  if (!q) return true;
  const code = codeKey(q);
  if (code && codeKey(item.animal.labelCode).includes(code)) return true;
  const words = q.toLocaleLowerCase();
  return [item.animal.name, item.animal.scientificName].some((s) =>
    s.toLocaleLowerCase().includes(words),
  );
}

/** The items a filter and a search box leave, in walk order. */
export function filterItems(
  items: readonly RoundItemView[],
  filter: RoundFilter,
  search: string,
): RoundItemView[] {
  return items.filter((item) => {
    if (!matches(item, search)) return false;
    if (filter === 'to_do') return !isItemDone(item);
    if (filter === 'done') return isItemDone(item);
    if (filter === 'cautions') return item.animal.cautions.length > 0;
    return true;
  });
}
