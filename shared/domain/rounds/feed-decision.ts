import { addDays, daysBetween, type LocalDate } from '../local-dates';
import type { AnimalState } from './animal-state';
import { DIET_FOOD } from './care-profiles';
import type { AnimalDecision, Reason } from './engine-types';
import { doNotFeedText, feedBlockers } from './holds';
import { offerFor } from './offer';
import { carriedFrom, later, latest, plural, shortDate } from './reason-words';
import { feedingInterval, stageCare } from './rules';
import { settlingOf, type Situation } from './situation';

// The feed task (R1–R5, R8–R10, R13, R16, R19), or a larva's substrate check: when food is
// due, why, and what to offer.

const REBUILD_WORDS: Record<NonNullable<AnimalState['rebuildReason']>, string> = {
  sac_pulled: 'Rebuilding after the egg sac was pulled on',
  sac_hatched: 'Rebuilding after the egg sac hatched on',
  brood_dispersed: 'Rebuilding after her brood dispersed on',
  paired: 'Conditioning after pairing on',
  keeper: 'Rebuilding since',
};

/** R8: the shorter interval of a rebuilding female, when it applies to the next meal. */
function rebuildOf(s: Situation, interval: number) {
  const { state, rules, date } = s;
  const shortInterval = Math.max(1, Math.round(interval * rules.rebuildFactor));
  const until = state.rebuildSince ? addDays(state.rebuildSince, rules.rebuildDays) : null;
  // Judged by the due date (not today): an overdue meal's due date stays put when the window closes.
  const active =
    !!until && (state.lastMeal ? addDays(state.lastMeal, shortInterval) < until : date < until);
  if (!active) return null;
  const since = shortDate(state.rebuildSince!);
  const what = `${REBUILD_WORDS[state.rebuildReason ?? 'keeper']} ${since}`;
  const reason: Reason = {
    code: 'rebuild',
    text: `${what}: fed every ${plural(shortInterval, 'day')} instead of ${interval} until ${shortDate(until!)}.`,
    dates: [state.rebuildSince!, until!],
  };
  return { interval: shortInterval, reason };
}

/** R1, R2, R5, R16, R10: when food is next due, and why. */
function feedDue(
  s: Situation,
  interval: number,
  blockers: Reason[],
): { due: LocalDate; why: Reason } {
  const { state, animal, date } = s;
  const live = s.food === 'prey';
  // For fruit, plant food and litter a refusal still means the food was put in: it counts.
  const served = live ? state.lastMeal : latest(state.lastMeal, state.lastRefusal);
  const refusedSinceMeal =
    live &&
    state.refusalStreak > 0 &&
    !!state.lastRefusal &&
    (!state.lastMeal || state.lastRefusal >= state.lastMeal);

  let due: LocalDate;
  let why: Reason;
  if (refusedSinceMeal) {
    const retry = stageCare(s.rules, animal).refusalRetryDays;
    due = addDays(state.lastRefusal!, retry);
    why = {
      code: 'due_refusal_retry',
      text: `Refused on ${shortDate(state.lastRefusal!)}: offer again after ${plural(retry, 'day')}.`,
      dates: [state.lastRefusal!],
    };
  } else if (served) {
    due = addDays(served, interval);
    why = live
      ? {
          code: 'due_interval',
          text: `Due: ${plural(daysBetween(served, date), 'day')} since last meal on ${shortDate(served)}.`,
          dates: [served],
        }
      : {
          code: 'due_interval',
          text: `Due: fresh ${DIET_FOOD[s.food as keyof typeof DIET_FOOD].preyType} every ${plural(interval, 'day')} (last on ${shortDate(served)}).`,
          dates: [served],
        };
  } else {
    due = animal.addedOn && animal.addedOn < date ? animal.addedOn : date;
    why = { code: 'due_first_meal', text: 'No meal recorded yet.', dates: [] };
  }
  // After a molt, food resumes when the hold ends (for an animal never fed yet, too).
  if (s.holdEnd && state.lastMolt && (s.holdEnd > due || !state.lastMeal)) {
    due = s.holdEnd;
    why = {
      code: 'due_after_hold',
      text: `Post-molt hold ended on ${shortDate(s.holdEnd)} (molted on ${shortDate(state.lastMolt)}): food can be offered again.`,
      dates: [s.holdEnd, state.lastMolt],
    };
  }
  const settling = settlingOf(s);
  if (settling) due = later(due, settling.until);
  if (animal.doNotFeedUntil) due = later(due, animal.doNotFeedUntil);

  // R10: never two meals too close together, whatever else says.
  const minGap = Math.min(interval, 2);
  if (state.lastMeal && daysBetween(state.lastMeal, date) < minGap) {
    blockers.push({
      code: 'no_double_meal',
      text: `Ate on ${shortDate(state.lastMeal)}: never two meals within ${plural(minGap, 'day')}.`,
      dates: [state.lastMeal],
    });
    due = later(due, addDays(state.lastMeal, minGap));
  }
  return { due, why };
}

/** R1–R5, R8–R10, R13, R16, R19: the feed task, or the notes saying why there is none. */
export function decideFeed(d: AnimalDecision, s: Situation) {
  const { animal, state, rules, date } = s;
  const interval = feedingInterval(rules, animal);
  const blockers = feedBlockers(s);
  const rebuild = s.food === 'prey' ? rebuildOf(s, interval) : null;
  const { due, why } = feedDue(s, rebuild?.interval ?? interval, blockers);

  d.notes.push(...blockers);
  if (!s.premolt && !s.possiblePremolt) d.nextFeed = due;
  if (blockers.length === 0 && due <= date) {
    // R9: carried over from the day it fell due, or from the day after a deliberate skip.
    const countFrom =
      state.lastSkipped && state.lastSkipped >= due ? addDays(state.lastSkipped, 1) : due;
    const carried = carriedFrom(countFrom, date);
    const reasons = [why];
    if (rebuild) reasons.push(rebuild.reason);
    if (carried > 0)
      reasons.push({
        code: 'carried_over',
        text: `Carried over ${plural(carried, 'day')}: due on ${shortDate(countFrom)}.`,
        dates: [countFrom],
      });
    d.tasks.push({
      kind: 'feed',
      offer: offerFor(animal, rules),
      reasons,
      carriedOverDays: carried,
    });
  } else if (rebuild) {
    d.notes.push(rebuild.reason);
  }
  return blockers;
}

/** § Care profiles (beetle larva): no live prey; its food substrate is checked and topped up. */
export function decideSubstrate(d: AnimalDecision, s: Situation) {
  const { animal, state, rules, date } = s;
  const every = feedingInterval(rules, animal);
  const last = latest(state.lastObserved, state.lastMeal);
  const due = last ? addDays(last, every) : animal.addedOn ? addDays(animal.addedOn, every) : date;
  d.nextFeed = animal.doNotFeedUntil ? later(due, animal.doNotFeedUntil) : due;
  if (animal.doNotFeedUntil && date < animal.doNotFeedUntil) {
    d.notes.push({
      code: 'do_not_feed',
      text: doNotFeedText(animal),
      dates: [animal.doNotFeedUntil],
    });
    return;
  }
  if (due > date) return;
  d.tasks.push({
    kind: 'check',
    reasons: [
      {
        code: 'check_substrate',
        text: last
          ? `Larva: check its food substrate and top it up — every ${plural(every, 'day')}, last on ${shortDate(last)}.`
          : 'Larva: check its food substrate and top it up (no check recorded yet).',
        dates: last ? [last] : [],
      },
    ],
    carriedOverDays: carriedFrom(due, date),
  });
}
