export interface Place {
  room: string;
  rack: string;
  shelf: string;
  position: string;
  walkOrder: number;
}

// Natural sort as a plain string key: digit runs padded, so "2" sorts before "10" and
// "C1-02" before "C1-10" (R14). Keys are remembered: a round sorts thousands of places.
const naturalKeys = new Map<string, string>();
export function naturalKey(s: string): string {
  let k = naturalKeys.get(s);
  if (k === undefined) {
    k = s.toLowerCase().replace(/\d+/g, (d) => d.padStart(12, '0'));
    if (naturalKeys.size > 100_000) naturalKeys.clear();
    naturalKeys.set(s, k);
  }
  return k;
}

/** The keeper's own walk order first, then room → rack → shelf by natural sort. */
export function shelfKey(p: Place): string {
  return `${String(p.walkOrder + 1e9).padStart(12, '0')}\u0000${naturalKey(p.room)}\u0000${naturalKey(p.rack)}\u0000${naturalKey(p.shelf)}`;
}

export const compareKeys = (a: string, b: string) => (a < b ? -1 : a > b ? 1 : 0);

/** R14 walk order of two places; places come before "no place". */
export function compareLocations(a: Place | null, b: Place | null): number {
  if (!a || !b) return a ? -1 : b ? 1 : 0;
  return (
    compareKeys(shelfKey(a), shelfKey(b)) ||
    compareKeys(naturalKey(a.position), naturalKey(b.position))
  );
}
