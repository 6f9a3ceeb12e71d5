import { addDays, type LocalDate } from '../local-dates';
import type { AnimalState } from './animal-state';
import { canMolt, foodOf, type Food } from './care-profiles';
import type { EngineAnimal } from './engine-types';
import { latest } from './reason-words';
import { postMoltHoldDays, stageCare, type RoundRules } from './rules';

// What every step of one decision starts from: the animal's food, holds and premolt signs.

/** Everything one decision needs, worked out once (docs/care-rules.md names each rule). */
export interface Situation {
  animal: EngineAnimal;
  state: AnimalState;
  rules: RoundRules;
  date: LocalDate;
  /** § Care profiles: what the animal eats at its stage. */
  food: Food;
  /** R5: the end of the post-molt hold, when a molt is recorded and the stage has a hold. */
  holdEnd: LocalDate | null;
  inHold: boolean;
  /** R4: premolt seen by the keeper. */
  premolt: boolean;
  /** R3 and R17: enough refusals in a row, for an animal that can still molt. */
  possiblePremolt: boolean;
}

export function situationOf(
  animal: EngineAnimal,
  state: AnimalState,
  rules: RoundRules,
  date: LocalDate,
): Situation {
  const food = foodOf(animal);
  const holdDays = postMoltHoldDays(rules, animal);
  const holdEnd = state.lastMolt && holdDays > 0 ? addDays(state.lastMolt, holdDays) : null;
  const premolt = state.premoltSince !== null;
  const possiblePremolt =
    food === 'prey' &&
    canMolt(animal) &&
    !premolt &&
    state.refusalStreak >= stageCare(rules, animal).refusalStreak;
  return {
    animal,
    state,
    rules,
    date,
    food,
    holdEnd,
    inHold: !!holdEnd && date < holdEnd,
    premolt,
    possiblePremolt,
  };
}

/** R16: settling in after arrival, potting up or a rehouse. Null when not settling. */
export function settlingOf(
  s: Situation,
): { since: LocalDate; until: LocalDate; rehoused: boolean } | null {
  const rehousedOn = s.state.rehousedOn ?? null;
  // The join date only counts for an animal never fed: a meal means it has settled.
  const arrived = s.state.lastMeal ? null : s.animal.addedOn;
  const since = latest(rehousedOn, arrived);
  if (!since || s.rules.settlingDays <= 0) return null;
  return { since, until: addDays(since, s.rules.settlingDays), rehoused: since === rehousedOn };
}
