import { addDays } from '../local-dates';
import type { AnimalDecision } from './engine-types';
import { carriedFrom, shortDate } from './reason-words';
import type { Situation } from './situation';

// Prey still inside after a meal was offered (R4, R6, R11, R20): out it comes, or it may stay.

function isRoach(preyType: string | null): boolean {
  return !!preyType && /roach/i.test(preyType);
}

/** Why uneaten prey must come out (R4, R6, R11), or null when it may stay (R6, R20). */
function removalCause(s: Situation): string | null {
  const { animal, state } = s;
  if (state.leaveAlone?.reason === 'molting')
    return 'it is molting: live prey can injure a molting animal';
  if (s.premolt) return 'premolt: live prey can injure a molting animal';
  if (s.possiblePremolt) return 'possible premolt: live prey can injure a molting animal';
  if (s.inHold) return 'post-molt hold: the fangs are still soft';
  if (s.food === 'none') return 'it does not eat at this stage';
  if (animal.lifeStage === 'sling') return 'slings are not left with live prey';
  if (!isRoach(state.preyLeftIn?.preyType ?? null))
    return 'uneaten live prey can stress or bite the animal';
  if (animal.lifeStage !== 'adult') return 'only an adult may keep a roach in with it';
  return null;
}

/** R4, R6, R11, R20: live prey still inside — out it comes, or it may stay and is checked. */
export function decidePreyInside(d: AnimalDecision, s: Situation) {
  const inside = s.state.preyLeftIn;
  // Fruit, plant food and leaf litter stay in by design; a larva's food is its substrate.
  if (!inside || (s.food !== 'prey' && s.food !== 'none')) return;
  const { since } = inside;
  const cause = removalCause(s);
  if (cause) {
    d.tasks.push({
      kind: 'remove_prey',
      reasons: [
        {
          code: 'remove_prey',
          text: `Prey left in on ${shortDate(since)}: remove it (${cause}).`,
          dates: [since],
        },
      ],
      carriedOverDays: carriedFrom(addDays(since, 1), s.date),
    });
    return;
  }
  const checkOn = addDays(since, s.rules.preyStayCheckDays);
  if (s.date < checkOn) {
    d.notes.push({
      code: 'prey_may_stay',
      text: `A roach left in on ${shortDate(since)} may stay with an adult outside the molt cycle: check on it on ${shortDate(checkOn)}.`,
      dates: [since, checkOn],
    });
    return;
  }
  d.tasks.push({
    kind: 'remove_prey',
    reasons: [
      {
        code: 'check_prey',
        text: `A roach left in on ${shortDate(since)} was allowed to stay: check it now — record Ate if it is gone, or take it out.`,
        dates: [since, checkOn],
      },
    ],
    carriedOverDays: carriedFrom(checkOn, s.date),
  });
}
