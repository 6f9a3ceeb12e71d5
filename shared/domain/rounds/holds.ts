import type { AnimalGroup } from '../animal-facts';
import { addDays } from '../local-dates';
import type { EngineAnimal, Reason } from './engine-types';
import { shortDate } from './reason-words';
import { settlingOf, type Situation } from './situation';

// What withholds food, or leaves an animal alone altogether (R3–R5, R11, R16, stages not fed,
// keeper and handover holds, prey still inside).

/** A keeper's hold names the first day food may be offered; a handover note its last held day. */
export function doNotFeedText(animal: EngineAnimal): string {
  const until = animal.doNotFeedUntil!;
  return animal.doNotFeedBy === 'handover'
    ? `Handover note: do not feed through ${shortDate(addDays(until, -1))}.`
    : `Do not feed until ${shortDate(until)} (keeper's setting).`;
}

/** What a female guarding eggs or young is doing, in her group's words (R11). */
function guardingWords(group: AnimalGroup): string {
  if (group === 'centipede') return 'Brooding her eggs';
  if (group === 'scorpion') return 'Carrying her brood';
  return 'Guarding an egg sac';
}

/** R11 and § Care profiles (pupa): left alone — no food, no water, no disturbance. */
export function leaveAloneReason(s: Situation): Reason | null {
  const { state, animal } = s;
  if (state.leaveAlone) {
    const { reason, since } = state.leaveAlone;
    const what = reason === 'molting' ? 'Molting' : guardingWords(animal.group);
    return {
      code: 'leave_alone',
      text: `${what} since ${shortDate(since)}: leave alone — no food, no disturbance.`,
      dates: [since],
    };
  }
  if (animal.lifeStage === 'pupa' && s.food === 'none')
    return {
      code: 'pupa',
      text: 'Pupa: leave it alone in its chamber — no food, no digging, until the adult comes out.',
      dates: [],
    };
  return null;
}

/** § Stages: first instars and scorplings on the mother are not fed (R16's sibling rule). */
export function notFedReason(s: Situation): Reason | null {
  if (s.food !== 'none') return null;
  if (s.animal.group === 'scorpion')
    return {
      code: 'on_mother',
      text: 'Scorpling on its mother’s back: not fed until its first molt and it leaves her.',
      dates: [],
    };
  return {
    code: 'not_feeding_yet',
    text: 'First instar: it lives on its yolk and does not eat until its next molt — no food yet.',
    dates: [],
  };
}

/** Everything that withholds food today (R3, R4, R5, R16, keeper and handover holds, R6). */
export function feedBlockers(s: Situation): Reason[] {
  const { state, animal, date } = s;
  const blockers: Reason[] = [];
  if (s.premolt) {
    blockers.push({
      code: 'premolt',
      text: `Premolt seen on ${shortDate(state.premoltSince!)}: no food until it molts; water continues.`,
      dates: [state.premoltSince!],
    });
  }
  if (s.possiblePremolt) {
    blockers.push({
      code: 'possible_premolt',
      text: `${state.refusalStreak} refusals in a row (last on ${shortDate(state.lastRefusal!)}): possible premolt, so no food is offered.`,
      dates: [state.lastRefusal!],
    });
  }
  if (s.inHold) {
    blockers.push({
      code: 'post_molt_hold',
      text: `Post-molt hold until ${shortDate(s.holdEnd!)} (molted on ${shortDate(state.lastMolt!)}): no food while the fangs harden.`,
      dates: [s.holdEnd!, state.lastMolt!],
    });
  }
  const settling = settlingOf(s);
  if (settling && date < settling.until) {
    blockers.push({
      code: 'settling',
      text: settling.rehoused
        ? `Settling in after a move to a new enclosure on ${shortDate(settling.since)}: no food until ${shortDate(settling.until)}.`
        : `Settling in since it joined the collection on ${shortDate(settling.since)}: no food until ${shortDate(settling.until)}.`,
      dates: [settling.until, settling.since],
    });
  }
  if (animal.doNotFeedUntil && date < animal.doNotFeedUntil) {
    blockers.push({
      code: 'do_not_feed',
      text: doNotFeedText(animal),
      dates: [animal.doNotFeedUntil],
    });
  }
  if (state.preyLeftIn && s.food === 'prey') {
    blockers.push({
      code: 'prey_inside',
      text: `Prey from ${shortDate(state.preyLeftIn.since)} is still inside: no new food.`,
      dates: [state.preyLeftIn.since],
    });
  }
  return blockers;
}
