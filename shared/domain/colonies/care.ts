import { addDays, daysBetween, type LocalDate } from '../local-dates';

/** A colony's own care, each on its own interval in days (docs/care-rules.md § Feeder colonies). */
export const COLONY_CARE_KINDS = ['feed', 'water_gel', 'clean', 'split'] as const;
export type ColonyCareKind = (typeof COLONY_CARE_KINDS)[number];

export const COLONY_CARE_WORDS: Record<ColonyCareKind, string> = {
  feed: 'Feed',
  water_gel: 'Water gel',
  clean: 'Clean',
  split: 'Split',
};

/**
 * Starting intervals for a new colony. Common practice, no published source: roach and cricket
 * colonies get fresh food and water gel every 2–3 days (gel dries out or molds), frass is
 * cleaned out about every two weeks, and a thriving colony is split every couple of months.
 */
export const DEFAULT_COLONY_INTERVALS: Record<ColonyCareKind, number | null> = {
  feed: 3,
  water_gel: 3,
  clean: 14,
  split: 60,
};

export interface DueCare {
  kind: ColonyCareKind;
  /** The day it fell due; null when it has never been done. */
  dueSince: LocalDate | null;
  /** Days past its due day (0 on the day; 0 when never done). */
  overdueDays: number;
}

/**
 * Care due on `today`: a kind with an interval is due when it has never been done or when its
 * last time plus the interval is today or earlier. A kind without an interval is never due.
 */
export function dueCare(
  intervals: Partial<Record<ColonyCareKind, number | null>>,
  lastDone: Partial<Record<ColonyCareKind, LocalDate | null>>,
  today: LocalDate,
): DueCare[] {
  const out: DueCare[] = [];
  for (const kind of COLONY_CARE_KINDS) {
    const every = intervals[kind];
    if (!every || every < 1) continue;
    const last = lastDone[kind] ?? null;
    if (last === null) {
      out.push({ kind, dueSince: null, overdueDays: 0 });
      continue;
    }
    const due = addDays(last, every);
    if (due <= today) out.push({ kind, dueSince: due, overdueDays: daysBetween(due, today) });
  }
  return out;
}
