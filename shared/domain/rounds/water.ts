import { addDays, type LocalDate } from '../local-dates';
import type { AnimalState } from './animal-state';
import { GROUP_CARE } from './care-profiles';
import type { AnimalDecision, Reason, ReasonCode } from './engine-types';
import { carriedFrom, plural, shortDate } from './reason-words';
import type { RoundRules } from './rules';
import type { Situation } from './situation';

// Water (R7): a dish topped up when due; a guarding female's dish topped up quietly (R11
// amended). Misting and moistening the substrate are enclosure care (enclosure-care.ts).

/** R7: the dish, topped up every few days; misting and moistening are enclosure care now. */
function waterPlan(
  s: Situation,
): { every: number; code: ReasonCode; first: string; since: (last: string) => string } | null {
  const { animal, rules } = s;
  if (!animal.hasWaterDish) return null;
  const damp = GROUP_CARE[animal.group].dampSubstrate
    ? ' Keep part of the substrate damp too.'
    : '';
  return {
    every: rules.waterEveryDays,
    code: 'water_due',
    first: `No watering recorded yet.${damp}`,
    since: (last) =>
      `Water every ${plural(rules.waterEveryDays, 'day')}: last topped up on ${last}.${damp}`,
  };
}

/** R7: the water task when due; none for stages that are not fed or live in their food. */
export function decideWater(d: AnimalDecision, s: Situation) {
  if (s.food === 'none' || s.food === 'substrate') return;
  const plan = waterPlan(s);
  if (!plan) return;
  const { lastWatered } = s.state;
  const dueWater = lastWatered ? addDays(lastWatered, plan.every) : s.date;
  d.nextWater = dueWater;
  if (dueWater > s.date) return;
  const carried = lastWatered ? carriedFrom(dueWater, s.date) : 0;
  const reasons: Reason[] = [
    lastWatered
      ? { code: plan.code, text: plan.since(shortDate(lastWatered)), dates: [lastWatered] }
      : { code: plan.code, text: plan.first, dates: [] },
  ];
  if (carried > 0)
    reasons.push({
      code: 'carried_over',
      text: `Carried over ${plural(carried, 'day')}: due on ${shortDate(dueWater)}.`,
      dates: [dueWater],
    });
  d.tasks.push({ kind: 'water', reasons, carriedOverDays: carried });
}

/** R11 amended: a guarding female's dish, topped up quietly when due (R7's days). */
export function quietWater(
  d: AnimalDecision,
  state: AnimalState,
  rules: RoundRules,
  date: LocalDate,
) {
  if (!d.animal.hasWaterDish) return;
  const due = state.lastWatered ? addDays(state.lastWatered, rules.waterEveryDays) : date;
  d.nextWater = due;
  if (due > date) return;
  const last = state.lastWatered
    ? `last topped up on ${shortDate(state.lastWatered)}`
    : 'no watering recorded yet';
  d.tasks.push({
    kind: 'water',
    reasons: [
      {
        code: 'water_due',
        text: `Water (${last}): top up quietly, do not disturb her.`,
        dates: state.lastWatered ? [state.lastWatered] : [],
      },
    ],
    carriedOverDays: state.lastWatered ? carriedFrom(due, date) : 0,
  });
}
