import type { AnimalGroup, Diet, LifeStage } from '../animal-facts';
import { DIET_FOOD, foodOf, type Offer } from './care-profiles';
import { bodyLengthMm, pickFeeder, sameType } from './feeders';
import { stageCare, TINY_SLING_OFFER, type RoundRules } from './rules';

export interface OfferAnimal {
  group: AnimalGroup;
  lifeStage: LifeStage;
  sizeMm: number | null;
  diet?: Diet | null;
  preyType: string | null;
  preySize: string | null;
  preyCount: number | null;
}

/**
 * R13 and R19: what a feed task offers. The animal's own prey type, size and count come first;
 * otherwise the stage's default type (fruit-fly larvae for the tiniest tarantula slings) in the
 * largest catalogue size no longer than the animal's body; the stage's default size when the
 * animal's size is unknown. Fruit, plant and leaf-litter diets offer that food.
 */
export function offerFor(animal: OfferAnimal, rules: RoundRules): Offer {
  const food = foodOf(animal);
  const base =
    food === 'fruit_jelly' || food === 'plant' || food === 'detritus'
      ? DIET_FOOD[food]
      : animal.group === 'tarantula' &&
          animal.lifeStage === 'sling' &&
          animal.sizeMm !== null &&
          animal.sizeMm < rules.tinySlingMm
        ? TINY_SLING_OFFER
        : stageCare(rules, animal).offer;
  let preyType = animal.preyType ?? base.preyType;
  let preySize = animal.preySize ?? base.preySize;
  const body = food === 'prey' ? bodyLengthMm(animal, rules.spanToBody) : null;
  if (!animal.preySize && body !== null) {
    const pick = pickFeeder(rules.feeders, preyType, body, animal.preyType === null);
    if (pick) {
      preyType = sameType(pick.preyType, preyType) ? preyType : pick.preyType;
      preySize = pick.preySize;
    }
  }
  return {
    preyType,
    preySize,
    countMin: animal.preyCount ?? base.countMin,
    countMax: animal.preyCount ?? base.countMax,
  };
}
