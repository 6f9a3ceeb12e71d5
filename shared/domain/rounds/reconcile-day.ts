// R18 on the server (docs/care-rules.md, "Same-day holds"): today's stored item brought in line
// with a new decision about the animal, without reshuffling the round.
import type { LocalDate } from '../local-dates';
import type { AnimalState } from './animal-state';
import { FEED_HOLD_CODES, type AnimalDecision, type Reason, type RoundTask } from './build-round';
import { CARE_KINDS } from './enclosure-care';
import { shortDate } from './reason-words';
import { liveOutcomes, settlingOutcome, type DayOutcome } from './settle';

/** Holds that also stop misting, cleaning or a rehouse (a keeper's do-not-feed does not). */
const CARE_HOLD_CODES: ReadonlySet<string> = new Set([
  'leave_alone',
  'premolt',
  'possible_premolt',
  'post_molt_hold',
  'settling',
]);

/** The first reason the engine withholds food from an animal, if any. */
export function feedHoldIn(d: AnimalDecision): Reason | null {
  const leaveAlone = d.tasks.find((t) => t.kind === 'leave_alone')?.reasons[0];
  return leaveAlone ?? d.notes.find((n) => FEED_HOLD_CODES.has(n.code)) ?? null;
}

/**
 * A hold that now applies withdraws the open feed task (and, for an animal to be left alone,
 * its water) with the reason in its place; a hold that was lifted gives the task back; prey
 * left with an animal now molting or in premolt becomes an urgent removal at the top. No new
 * feed task is added mid-day. `changed`: the tasks differ from `planned`.
 *
 * `asBuiltNow`, when given, is the decision the round's build would make now from the facts of
 * the days before (a phone's taps from days without signal arrive after the round was built):
 * a feed or water task it no longer gives is withdrawn with the next due date in its place.
 */
export function reconcileTasks(
  planned: readonly RoundTask[],
  d: AnimalDecision,
  state: AnimalState,
  outcomes: readonly DayOutcome[],
  date: LocalDate,
  asBuiltNow?: AnimalDecision,
): { tasks: RoundTask[]; changed: boolean; urgent: boolean } {
  const hold = feedHoldIn(d);
  const live = liveOutcomes(outcomes);
  const leaveAlone =
    d.tasks.some((t) => t.kind === 'leave_alone') && !d.tasks.some((t) => t.kind === 'water');
  let changed = false;
  const tasks = planned.map((t) => {
    // Enclosure care a hold now forbids is gone from the new decision (§ Enclosure care).
    const heldKind =
      t.kind === 'feed' ||
      (t.kind === 'water' && leaveAlone) ||
      (CARE_KINDS.has(t.kind) &&
        !!hold &&
        CARE_HOLD_CODES.has(hold.code) &&
        !d.tasks.some((n) => n.kind === t.kind));
    const settled = !!settlingOutcome(t.kind, live);
    const wanted =
      (heldKind && hold && !settled ? hold : null) ??
      (asBuiltNow && !settled ? lapsed(t.kind, asBuiltNow) : null);
    if ((t.serverWithdrawn ?? null)?.text === wanted?.text) return t;
    changed = true;
    return { ...t, serverWithdrawn: wanted };
  });
  const removal = d.tasks.find((t) => t.kind === 'remove_prey');
  const urgent =
    !!removal &&
    !!(state.leaveAlone || state.premoltSince) &&
    !planned.some((t) => t.kind === 'remove_prey');
  if (urgent) {
    tasks.unshift({
      ...removal,
      reasons: [
        ...removal.reasons,
        { code: 'remove_prey', text: 'Added during the day: remove it now.', dates: [date] },
      ],
    });
  }
  return { tasks, changed, urgent };
}

/** A feed, water or enclosure-care task the build would no longer give, with when it is next due. */
function lapsed(kind: RoundTask['kind'], built: AnimalDecision): Reason | null {
  if (kind !== 'feed' && kind !== 'water' && !CARE_KINDS.has(kind)) return null;
  if (built.tasks.some((t) => t.kind === kind)) return null;
  if (CARE_KINDS.has(kind))
    return {
      code: 'not_due',
      text: 'Not due any more: records from an earlier day arrived after this round was made.',
      dates: [],
    };
  const next = kind === 'feed' ? built.nextFeed : built.nextWater;
  return {
    code: 'not_due',
    text: `Not due any more: records from an earlier day arrived after this round was made${next ? ` (next ${kind === 'feed' ? 'meal' : 'top-up'} on ${shortDate(next)})` : ''}.`,
    dates: next ? [next] : [],
  };
}
