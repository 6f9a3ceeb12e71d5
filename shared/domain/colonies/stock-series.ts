/** One stock change as the history lists it (shared/schemas/colonies.ts `stockChange`). */
export interface StockChangeFact {
  at: string;
  preySize: string;
  after: number;
}

export interface StockPoint {
  at: string;
  /** Each size's count at that moment: a size not counted yet is absent. */
  counts: Record<string, number>;
  total: number;
}

/**
 * A colony's stock over time for its chart: one point per moment something changed, with every
 * size's count carried forward from its last change. Changes at the same instant (one count
 * update of several sizes) make one point.
 */
export function stockSeries(changes: readonly StockChangeFact[]): StockPoint[] {
  const sorted = changes
    .map((c, i) => ({ c, i }))
    .sort((a, b) => a.c.at.localeCompare(b.c.at) || a.i - b.i)
    .map((x) => x.c);
  const now: Record<string, number> = {};
  const out: StockPoint[] = [];
  for (const c of sorted) {
    now[c.preySize] = c.after;
    const point = {
      at: c.at,
      counts: { ...now },
      total: Object.values(now).reduce((a, b) => a + b, 0),
    };
    if (out.at(-1)?.at === c.at) out[out.length - 1] = point;
    else out.push(point);
  }
  return out;
}
