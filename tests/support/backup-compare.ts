// Compares a backup with the backup of its restored copy: the copy's records have new ids, so
// they are paired with the originals (places, animals and sacs in list order, events by what they
// are) and the copy's ids, wherever they appear, are put back to the originals'.

interface Backup {
  locations: { id: string }[];
  animals: { id: string }[];
  eggSacs?: { id: string }[];
  events: { id: string; animalId: string; effectiveAt: string; kind: string }[];
  [key: string]: unknown;
}

/** The copy with every id replaced by its original's, and events in the original's order. */
export function withOriginalIds<T extends Backup>(original: T, copy: T): T {
  const ids = new Map<string, string>();
  const pair = (x: { id: string }[], y: { id: string }[]) =>
    x.forEach((v, i) => ids.set(y[i]!.id, v.id));
  pair(original.locations, copy.locations);
  pair(original.animals, copy.animals);
  pair(original.eggSacs ?? [], copy.eggSacs ?? []);
  // Events sharing a time come in id order, and ids are new: order both by what they are.
  const animalIndex = (list: { id: string }[], id: string) => list.findIndex((a) => a.id === id);
  const byWhat = (list: T['events'], animals: { id: string }[]) =>
    [...list].sort((x, y) =>
      `${x.effectiveAt}|${x.kind}|${String(animalIndex(animals, x.animalId)).padStart(6, '0')}`.localeCompare(
        `${y.effectiveAt}|${y.kind}|${String(animalIndex(animals, y.animalId)).padStart(6, '0')}`,
      ),
    );
  original.events = byWhat(original.events, original.animals);
  const events = byWhat(copy.events, copy.animals);
  pair(original.events, events);
  return JSON.parse(
    JSON.stringify({ ...copy, events }, (_k, v: unknown) =>
      typeof v === 'string' && ids.has(v) ? ids.get(v) : v,
    ),
  ) as T;
}
