import type { RoundItemView } from '../../schemas/rounds';
import type { EventKind } from '../event-kinds';
import { FEED_HOLD_CODES, type ReasonCode } from './build-round';
import { countsForProgress } from './settle';

/**
 * What a round item says now, after the day's outcomes: the card, the animal page and the
 * insights read these, so no screen contradicts the round (one state, everywhere).
 */
type Reason = RoundItemView['notes'][number];

/** Outcomes that end a premolt flag or a possible premolt (a meal, a molt, the keeper's word). */
const ENDS_PREMOLT: readonly EventKind[] = ['ate', 'molted', 'premolt_cleared'];
const PREMOLT_CODES: ReadonlySet<string> = new Set<ReasonCode>([
  'premolt',
  'possible_premolt',
  'check_premolt',
]);

function premoltEndedToday(item: RoundItemView): boolean {
  return item.outcomes.some((o) => ENDS_PREMOLT.includes(o.kind));
}

/** The item's notes without those today's outcomes have made untrue ("possible premolt" after a molt). */
export function currentNotes(item: RoundItemView): Reason[] {
  if (!premoltEndedToday(item)) return item.notes;
  return item.notes.filter((n) => !PREMOLT_CODES.has(n.code));
}

/** Why food is withheld from this animal right now, if it is: the first hold that applies. */
export function feedHoldOf(item: RoundItemView): Reason | null {
  const feed = item.tasks.find((t) => t.kind === 'feed');
  if (feed?.withdrawn) return feed.withdrawn;
  const leaveAlone = item.tasks.find((t) => t.kind === 'leave_alone');
  if (leaveAlone?.reasons[0]) return leaveAlone.reasons[0];
  return currentNotes(item).find((n) => FEED_HOLD_CODES.has(n.code as ReasonCode)) ?? null;
}

/** Tasks still to do today (not done, not withdrawn). */
export function openTasks(item: RoundItemView) {
  return item.tasks.filter((t) => !t.done && countsForProgress(t.kind, t.withdrawn));
}

/** Carried over from an earlier day and still not done. */
export function isOverdue(item: RoundItemView): boolean {
  return openTasks(item).some((t) => t.carriedOverDays > 0);
}

/** Flagged as a possible premolt (or due a premolt check) and not cleared by today's outcomes. */
export function isPossiblePremolt(item: RoundItemView): boolean {
  if (premoltEndedToday(item)) return false;
  return [...item.notes, ...item.tasks.flatMap((t) => t.reasons)].some(
    (r) => r.code === 'possible_premolt' || r.code === 'check_premolt',
  );
}
