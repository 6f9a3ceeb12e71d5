// R18 on the server (docs/care-rules.md, "Same-day holds"): today's stored item brought in line
// with a new decision about the animal, without reshuffling the round.
import type { LocalDate } from '../local-dates';
import type { AnimalState } from './animal-state';
import { FEED_HOLD_CODES, type AnimalDecision, type Reason, type RoundTask } from './build-round';
import { liveOutcomes, settlingOutcome, type DayOutcome } from './settle';

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
 */
export function reconcileTasks(
  planned: readonly RoundTask[],
  d: AnimalDecision,
  state: AnimalState,
  outcomes: readonly DayOutcome[],
  date: LocalDate,
): { tasks: RoundTask[]; changed: boolean; urgent: boolean } {
  const hold = feedHoldIn(d);
  const live = liveOutcomes(outcomes);
  const leaveAlone =
    d.tasks.some((t) => t.kind === 'leave_alone') && !d.tasks.some((t) => t.kind === 'water');
  let changed = false;
  const tasks = planned.map((t) => {
    const heldKind = t.kind === 'feed' || (t.kind === 'water' && leaveAlone);
    const wanted = heldKind && hold && !settlingOutcome(t.kind, live) ? hold : null;
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
