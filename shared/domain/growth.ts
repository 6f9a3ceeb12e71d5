import type { Sex } from './animal-facts';
import { addDays, daysBetween, type LocalDate } from './local-dates';

export interface MoltFact {
  date: LocalDate;
  sizeMm?: number | null;
  sexFromExuviae?: 'female' | 'male' | 'unknown';
  maturing?: boolean;
}

export interface GrowthPoint {
  date: LocalDate;
  sizeMm: number | null;
  /** Days since the molt before (null for the first). */
  daysSincePrevious: number | null;
  /** Size change since the last molt with a size, in per cent (null when either is missing). */
  growthPct: number | null;
}

/** Each molt in date order with the interval before it and how much the animal grew. */
export function growthSeries(molts: readonly MoltFact[]): GrowthPoint[] {
  const sorted = [...molts].sort((a, b) => a.date.localeCompare(b.date));
  let lastSize: number | null = null;
  return sorted.map((m, i) => {
    const size = m.sizeMm ?? null;
    const point: GrowthPoint = {
      date: m.date,
      sizeMm: size,
      daysSincePrevious: i === 0 ? null : daysBetween(sorted[i - 1]!.date, m.date),
      growthPct:
        size !== null && lastSize !== null
          ? Math.round(((size - lastSize) / lastSize) * 1000) / 10
          : null,
    };
    if (size !== null) lastSize = size;
    return point;
  });
}

/** Molts in the 365 days up to and including `today`. */
export function moltsInLastYear(molts: readonly MoltFact[], today: LocalDate): number {
  const from = addDays(today, -364);
  return molts.filter((m) => m.date >= from && m.date <= today).length;
}

/**
 * What the molts say about sex: a maturing molt makes a mature male (only males mature at a
 * molt, with the visible palpal bulbs and often tibial hooks — common practice, no published
 * source); otherwise the latest exuviae sexed female or male decides; "unknown" says nothing.
 */
export function sexFromMolts(current: Sex, molts: readonly MoltFact[]): Sex {
  const sorted = [...molts].sort((a, b) => a.date.localeCompare(b.date));
  if (sorted.some((m) => m.maturing)) return 'mature_male';
  const sexed = sorted
    .filter((m) => m.sexFromExuviae === 'female' || m.sexFromExuviae === 'male')
    .at(-1);
  return sexed ? (sexed.sexFromExuviae as Sex) : current;
}

/** Of the last `n` offers (ate or refused), how many were eaten. */
export function acceptanceRate(
  offers: readonly { date: LocalDate; kind: 'ate' | 'refused' }[],
  n: number,
) {
  const last = [...offers].sort((a, b) => a.date.localeCompare(b.date)).slice(-n);
  const ate = last.filter((o) => o.kind === 'ate').length;
  return {
    ate,
    offered: last.length,
    rate: last.length ? Math.round((ate / last.length) * 100) : null,
  };
}

/** Days between consecutive meals, and their median (the middle value; the mean of the two middle ones). */
export function mealIntervals(meals: readonly LocalDate[]) {
  const sorted = [...new Set(meals)].sort();
  const gaps = sorted.slice(1).map((d, i) => daysBetween(sorted[i]!, d));
  const ordered = [...gaps].sort((a, b) => a - b);
  const mid = Math.floor(ordered.length / 2);
  const median =
    ordered.length === 0
      ? null
      : ordered.length % 2
        ? ordered[mid]!
        : (ordered[mid - 1]! + ordered[mid]!) / 2;
  return { gaps, median };
}

interface MoltEventLike {
  id: string;
  kind: string;
  payload: Record<string, unknown>;
  /** ISO instant: later details win. */
  at: string;
}

/**
 * A molt and the details added to it later are one record: each molted event comes back with
 * its later details laid over its own payload (the latest detail wins), details events dropped.
 * Pass live events only (nothing undone by a void).
 */
export function mergeMoltDetails<E extends MoltEventLike>(events: readonly E[]): E[] {
  const details = new Map<string, Record<string, unknown>>();
  const added = events
    .filter((e) => e.kind === 'molt_details')
    .sort((a, b) => a.at.localeCompare(b.at));
  for (const e of added) {
    const { targetId, ...rest } = e.payload;
    if (typeof targetId === 'string') details.set(targetId, { ...details.get(targetId), ...rest });
  }
  return events
    .filter((e) => e.kind !== 'molt_details')
    .map((e) =>
      e.kind === 'molted' && details.has(e.id)
        ? { ...e, payload: { ...e.payload, ...details.get(e.id) } }
        : e,
    );
}
