import type { Caution } from '#shared/domain/animal-facts';
import { codeKey } from '#shared/domain/labels/label-payload';
import { placeCode as codeOfPlace } from '#shared/domain/places';
import { countsForProgress } from '#shared/domain/rounds/settle';
import type { RoundItemView } from '#shared/schemas/rounds';

export const ROUND_FILTERS = ['to_do', 'done', 'cautions', 'all'] as const;
export type RoundFilter = (typeof ROUND_FILTERS)[number];
export const FILTER_WORDS: Record<RoundFilter, string> = {
  to_do: 'To do',
  done: 'Done',
  cautions: 'Take care',
  all: 'All',
};
/** What the round opens on when this device has no choice stored yet: the work still to do. */
export const DEFAULT_FILTER: RoundFilter = 'to_do';

/**
 * The cautions the "Take care" filter looks for: the ones that change how an enclosure is
 * opened (tongs only, open slowly, check the lid). Urticating hairs is left out on purpose: it
 * is the standing precaution of nearly every New World tarantula (glasses on and no leaning
 * over an open enclosure, for the whole rack), so in a tarantula collection it sits on almost
 * every card and a filter on it leaves the round as it was. Its badge still shows on each card,
 * and the helper's round states it once at the top.
 */
export const HANDLING_CAUTIONS: readonly Caution[] = [
  'potent_venom',
  'sting',
  'fast_defensive',
  'escape_risk',
];

export const needsCare = (item: RoundItemView) =>
  item.animal.cautions.some((c) => HANDLING_CAUTIONS.includes(c));

/** The tasks someone records an outcome for today (leave-alone and withdrawn ones are not work). */
const workOf = (item: RoundItemView) =>
  item.tasks.filter((t) => countsForProgress(t.kind, t.withdrawn));

/**
 * Where a card stands: `to_do` while a task waits for an outcome, `done` once every one has
 * one, `info` when there is nothing to record today (only "leave alone", or every task was
 * withdrawn by a hold) — such a card is a reminder, not work.
 */
export type ItemState = 'to_do' | 'done' | 'info';
export function itemState(item: RoundItemView): ItemState {
  const work = workOf(item);
  if (!work.length) return 'info';
  return work.every((t) => t.done) ? 'done' : 'to_do';
}

/** An item is done when every task that counts has an outcome (and there was one to do). */
export const isItemDone = (item: RoundItemView) => itemState(item) === 'done';

/** The spot's code as every screen writes it ("C1-08"), or null for an animal with no place. */
export function placeCode(location: RoundItemView['animal']['location']): string | null {
  return location ? codeOfPlace(location) : null;
}

/**
 * A typed place code, however it was typed ("a1-2", "A1 2", "a1/2"): letters then a digit,
 * separators made one hyphen. Null when the text does not look like a place.
 */
function placeQuery(q: string): string | null {
  const norm = placeKey(q.replace(/[\s./·:_-]+/g, '-').replace(/^-|-$/g, ''));
  return /^[A-Z]+\d/.test(norm) ? norm : null;
}
/** Upper case, numbers without leading zeros: "c1-08" and "C1-8" are one spot. */
const placeKey = (code: string) => code.toUpperCase().replace(/(^|\D)0+(?=\d)/g, '$1');

/**
 * A search finds a label code (typed any way), a place code (a prefix: "A1" is the whole
 * shelf, "A1-2" one spot), or part of a name or species.
 */
export function matchesSearch(item: RoundItemView, search: string): boolean {
  const q = search.trim();
  if (!q) return true;
  const code = codeKey(q);
  if (code && codeKey(item.animal.labelCode).includes(code)) return true;
  const place = placeQuery(q);
  const at = placeCode(item.animal.location);
  if (place && at && placeKey(at).startsWith(place)) return true;
  const words = q.toLocaleLowerCase();
  return [item.animal.name, item.animal.scientificName].some((s) =>
    s.toLocaleLowerCase().includes(words),
  );
}

/**
 * A finished card with a warning (fed twice by two phones, fed while food was held) still wants
 * a look: it stays open and under To do as well as under Done.
 */
export const needsLook = (item: RoundItemView) => item.warnings.length > 0;

function inFilter(item: RoundItemView, filter: RoundFilter): boolean {
  const state = itemState(item);
  // Reminders ("leave alone") stay under To do: they matter at the rack although nothing is recorded.
  if (filter === 'to_do') return state !== 'done' || needsLook(item);
  if (filter === 'done') return state === 'done';
  if (filter === 'cautions') return needsCare(item);
  return true;
}

/**
 * The items a filter and a search box leave, in walk order. `kept`: cards finished since the
 * filter was chosen stay under To do (as compact rows), so a tap never makes its card vanish
 * from under the thumb; they leave when the filter is chosen again or the page is opened anew.
 */
export function filterItems(
  items: readonly RoundItemView[],
  filter: RoundFilter,
  search: string,
  kept: ReadonlySet<string> = new Set(),
): RoundItemView[] {
  return items.filter(
    (item) =>
      matchesSearch(item, search) &&
      (inFilter(item, filter) || (filter === 'to_do' && kept.has(item.animal.id))),
  );
}

export interface RoundCounts {
  /** Cards under each filter (no search): what each chip shows. */
  cards: Record<RoundFilter, number>;
  /** Animals with something to record today, and how many of them are finished. */
  animals: { done: number; total: number };
  /** The same work counted task by task (an animal may have a feed and a water). */
  tasks: { done: number; total: number };
  /** Cards that only remind (leave alone, or every task withdrawn). */
  reminders: number;
}

/** Every number on the round screen, from one pass over the items, so they always agree. */
export function roundCounts(items: readonly RoundItemView[]): RoundCounts {
  const cards: Record<RoundFilter, number> = { to_do: 0, done: 0, cautions: 0, all: 0 };
  const animals = { done: 0, total: 0 };
  const tasks = { done: 0, total: 0 };
  let reminders = 0;
  for (const item of items) {
    for (const f of ROUND_FILTERS) if (inFilter(item, f)) cards[f] += 1;
    const state = itemState(item);
    if (state === 'info') reminders += 1;
    else {
      animals.total += 1;
      if (state === 'done') animals.done += 1;
    }
    const work = workOf(item);
    tasks.total += work.length;
    tasks.done += work.filter((t) => t.done).length;
  }
  return { cards, animals, tasks, reminders };
}

/** The filter this device chose last time (stored per device, not per person). */
const FILTER_KEY = 'rackside.round-filter';
export function storedFilter(storage: Pick<Storage, 'getItem'> | undefined): RoundFilter {
  try {
    const v = storage?.getItem(FILTER_KEY);
    return (ROUND_FILTERS as readonly string[]).includes(v ?? '')
      ? (v as RoundFilter)
      : DEFAULT_FILTER;
  } catch {
    return DEFAULT_FILTER;
  }
}
export function storeFilter(storage: Pick<Storage, 'setItem'> | undefined, filter: RoundFilter) {
  try {
    storage?.setItem(FILTER_KEY, filter);
  } catch {
    // Private mode or storage full: the choice lasts for this page only.
  }
}
