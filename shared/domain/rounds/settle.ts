import type { RoundResponse } from '../../schemas/rounds';
import type { EventKind } from '../event-kinds';
import { clockTime } from '../local-dates';
import type { TaskKind } from './build-round';
import { CARE_KINDS } from './enclosure-care';
import { sameDayHold } from './same-day';

/** A reason as stored and sent (its code a plain string once it has been through JSON). */
type Reason = { code: string; text: string; dates: string[] };

/** Which of the day's outcomes settle which task (an outcome is a recorded event). */
export const SETTLED_BY: Record<TaskKind, readonly EventKind[]> = {
  remove_prey: ['prey_removed', 'ate'],
  feed: ['ate', 'refused', 'prey_left_in', 'skipped'],
  water: ['watered', 'skipped'],
  mist: ['misted', 'skipped'],
  moisten: ['substrate_moistened', 'skipped'],
  // A rehouse puts it in a clean enclosure: the spot-clean is done with it.
  spot_clean: ['spot_cleaned', 'rehoused', 'skipped'],
  rehouse: ['rehoused', 'skipped'],
  check: [
    'note',
    'premolt_seen',
    'premolt_cleared',
    'molted',
    'molting_now',
    'ate',
    'refused',
    'skipped',
  ],
  leave_alone: [],
};

export interface DayOutcome {
  eventId: string;
  kind: EventKind;
  at: string; // ISO instant
  by: string | null; // display name
  /** Ids of events this one cancels (a void). */
  voids?: string | null;
}

/** The day's outcomes without voided ones (and without the voids themselves), oldest first. */
export function liveOutcomes<T extends DayOutcome>(outcomes: readonly T[]): T[] {
  const voided = new Set(outcomes.filter((o) => o.kind === 'void' && o.voids).map((o) => o.voids!));
  return outcomes
    .filter((o) => o.kind !== 'void' && !voided.has(o.eventId))
    .sort((a, b) => (a.at < b.at ? -1 : a.at > b.at ? 1 : 0));
}

/** The outcome that settled a task, if any: the first matching one of the day. */
export function settlingOutcome<T extends DayOutcome>(
  kind: TaskKind,
  outcomes: readonly T[],
): T | null {
  return outcomes.find((o) => SETTLED_BY[kind].includes(o.kind)) ?? null;
}

/**
 * Tasks that count towards progress: leave-alone is information, not work, and a task withdrawn
 * by a hold (R18) is no longer work either.
 */
export function countsForProgress(kind: TaskKind, withdrawn?: Reason | null): boolean {
  return kind !== 'leave_alone' && !withdrawn;
}

/** "Fed while held: …" when a meal was recorded although food was withheld (R18). */
function heldMealWarning(
  meal: DayOutcome | undefined,
  hold: Reason | null | undefined,
): string | null {
  return meal && hold
    ? `Fed while held — ${hold.text} The owner will see this meal flagged.`
    : null;
}

/**
 * "Fed twice today: 08:12 Robin, 08:40 Alex" when two meals were recorded for one animal on
 * one day (two phones offline). `time` formats an instant as local HH:mm.
 */
export function doubleMealWarning(
  outcomes: readonly DayOutcome[],
  time: (iso: string) => string,
): string | null {
  const meals = outcomes.filter((o) => o.kind === 'ate');
  if (meals.length < 2) return null;
  return `Fed ${meals.length === 2 ? 'twice' : `${meals.length} times`} today: ${meals.map((m) => `${time(m.at)} ${m.by ?? 'someone'}`).join(', ')}.`;
}

/**
 * A round item's tasks, warnings and progress given the day's outcomes. The server uses it to
 * show a round; the phone uses it to show a tap at once, before anything is sent. A hold that
 * starts today withdraws the tasks it forbids (R18), unless they were settled before it began;
 * `serverWithdrawn` on a task is the server's own withdrawal (a handover note, a late fact).
 */
export function settleItem<T extends { kind: TaskKind; serverWithdrawn?: Reason | null }>(
  tasks: readonly T[],
  outcomes: readonly DayOutcome[],
  zone: string,
  postMoltHoldDays?: number,
) {
  const day = liveOutcomes(outcomes);
  const hold = sameDayHold(day, zone, postMoltHoldDays);
  let done = 0;
  let total = 0;
  let heldMeal: string | null = null;
  const settled = tasks.map((t) => {
    const by = settlingOutcome(t.kind, day);
    const startedBefore = hold && hold.withdraws.has(t.kind) && (!by || by.at > hold.at);
    const withdrawn = startedBefore
      ? CARE_KINDS.has(t.kind)
        ? hold.careReason
        : hold.reason
      : (t.serverWithdrawn ?? null);
    if (t.kind === 'feed' && withdrawn)
      heldMeal = heldMealWarning(
        day.find((o) => o.kind === 'ate' && (!hold || o.at > hold.at)),
        withdrawn,
      );
    if (countsForProgress(t.kind, withdrawn)) {
      total += 1;
      if (by) done += 1;
    }
    return {
      ...t,
      withdrawn,
      done: by ? { eventId: by.eventId, kind: by.kind, at: by.at, by: by.by } : null,
    };
  });
  const warnings = [doubleMealWarning(day, (iso) => clockTime(iso, zone)), heldMeal].filter(
    (w): w is string => !!w,
  );
  return {
    tasks: settled,
    outcomes: day.map(({ eventId, kind, at, by }) => ({ eventId, kind, at, by })),
    warnings,
    done,
    total,
  };
}

type RoundItem = RoundResponse['items'][number];

/**
 * One item with one more outcome, and how many more of its tasks are now done and how many
 * fewer are left to do (a hold withdraws tasks).
 */
export function itemWithOutcome(
  item: RoundItem,
  outcome: DayOutcome,
  zone: string,
): { item: RoundItem; doneDelta: number; totalDelta: number } {
  const before = settleItem(item.tasks, item.outcomes, zone, item.postMoltHoldDays);
  const after = settleItem(item.tasks, [...item.outcomes, outcome], zone, item.postMoltHoldDays);
  return {
    item: { ...item, tasks: after.tasks, outcomes: after.outcomes, warnings: after.warnings },
    doneDelta: after.done - before.done,
    totalDelta: after.total - before.total,
  };
}

/** The round with one more outcome for an animal (a void takes its target away). */
export function withOutcome(
  round: RoundResponse,
  animalId: string,
  outcome: DayOutcome,
): RoundResponse {
  const index = round.items.findIndex((i) => i.animal.id === animalId);
  if (index < 0) return round;
  const { item, doneDelta, totalDelta } = itemWithOutcome(
    round.items[index]!,
    outcome,
    round.timeZone,
  );
  const items = [...round.items];
  items[index] = item;
  return {
    ...round,
    items,
    progress: { done: round.progress.done + doneDelta, total: round.progress.total + totalDelta },
  };
}

/** Done and total tasks of a round's items (the same count the server makes). */
export function progressOf(items: readonly RoundItem[]): RoundResponse['progress'] {
  let done = 0;
  let total = 0;
  for (const item of items) {
    for (const t of item.tasks) {
      if (!countsForProgress(t.kind, t.withdrawn)) continue;
      total += 1;
      if (t.done) done += 1;
    }
  }
  return { done, total };
}
