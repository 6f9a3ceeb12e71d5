// Compares a backup with the backup of its restored copy: the copy's records have new ids, so
// they are paired with the originals (places, animals, sacs, colonies and stock changes in list
// order; events, chores and climate readings by what they are) and the copy's ids, wherever they
// appear, are put back to the originals'.

interface Backup {
  locations: { id: string }[];
  animals: { id: string }[];
  eggSacs?: { id: string }[];
  events: { id: string; animalId: string; effectiveAt: string; kind: string }[];
  colonies?: { id: string }[];
  colonyStockChanges?: { id: string }[];
  chores?: Chore[];
  climateReadings?: Reading[];
  [key: string]: unknown;
}
type Chore = {
  id: string;
  subjectKind: string;
  subjectId: string;
  kind: string;
  effectiveAt: string;
};
type Reading = { id: string; room: string; takenAt: string; source: string };

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

  pair(original.colonies ?? [], copy.colonies ?? []);
  pair(original.colonyStockChanges ?? [], copy.colonyStockChanges ?? []);
  // Chores come in (subject, kind, id) order and readings in (room, time, id) order: ids are new,
  // so both are ordered by what they are.
  const colonyIndex = (list: { id: string }[] | undefined, id: string) =>
    String((list ?? []).findIndex((k) => k.id === id)).padStart(6, '0');
  const choreKey = (c: Chore, colonies: { id: string }[] | undefined) =>
    `${c.subjectKind}|${c.subjectKind === 'colony' ? colonyIndex(colonies, c.subjectId) : c.subjectId}|${c.kind}|${c.effectiveAt}`;
  const byChore = (list: Chore[], colonies: { id: string }[] | undefined) =>
    [...list].sort((x, y) => choreKey(x, colonies).localeCompare(choreKey(y, colonies)));
  const readingKey = (r: Reading) => `${r.room}|${r.takenAt}|${r.source}`;
  const byReading = (list: Reading[]) =>
    [...list].sort((x, y) => readingKey(x).localeCompare(readingKey(y)));
  const extra: Partial<Backup> = {};
  if (original.chores && copy.chores) {
    original.chores = byChore(original.chores, original.colonies);
    extra.chores = byChore(copy.chores, copy.colonies);
    pair(original.chores, extra.chores);
  }
  if (original.climateReadings && copy.climateReadings) {
    original.climateReadings = byReading(original.climateReadings);
    extra.climateReadings = byReading(copy.climateReadings);
    pair(original.climateReadings, extra.climateReadings);
  }
  // Sales — S: buyers, sales, invoices and payments come in the order they were made.
  for (const list of ['buyers', 'sales', 'invoices', 'payments'])
    pair(
      (original[list] as { id: string }[] | undefined) ?? [],
      (copy[list] as { id: string }[] | undefined) ?? [],
    );
  return JSON.parse(
    JSON.stringify({ ...copy, events, ...extra }, (_k, v: unknown) =>
      typeof v === 'string' && ids.has(v) ? ids.get(v) : v,
    ),
  ) as T;
}
