import type { AnimalGroup } from '../animal-facts';
import { addDays } from '../local-dates';
import { canMolt } from './care-profiles';
import type { AnimalDecision, Reason } from './engine-types';
import { carriedFrom, later, shortDate } from './reason-words';
import type { Situation } from './situation';

// Looks the keeper takes (R3's premolt check) and plain words the round carries about an
// animal's kind (R17, care profiles).

/** R3: a look every N days while a possible premolt is flagged. */
export function decidePremoltCheck(d: AnimalDecision, s: Situation) {
  if (!s.possiblePremolt) return;
  const { state, rules, date } = s;
  const since = later(state.lastRefusal!, state.lastObserved ?? state.lastRefusal!);
  const dueCheck = addDays(since, rules.premoltCheckDays);
  if (dueCheck > date) return;
  d.tasks.push({
    kind: 'check',
    reasons: [
      {
        code: 'check_premolt',
        text: `Possible premolt since ${shortDate(state.lastRefusal!)}: look for a dark, shiny abdomen, a molt mat or a fresh molt.`,
        dates: [state.lastRefusal!],
      },
    ],
    carriedOverDays: carriedFrom(dueCheck, date),
  });
}

const GROUP_WORD: Record<AnimalGroup, string> = {
  tarantula: 'tarantula',
  true_spider: 'spider',
  centipede: 'centipede',
  scorpion: 'scorpion',
  mantis: 'mantis',
  beetle: 'beetle',
  other: 'animal',
};

/** R17 and § Care profiles: plain words about an animal's kind that the round should carry. */
export function careNotes(s: Situation): Reason[] {
  const { animal, state } = s;
  const notes: Reason[] = [];
  if (animal.sex === 'mature_male') {
    notes.push({
      code: 'mature_male',
      text: 'Mature male: refusing food is normal, and he will not molt again.',
      dates: [],
    });
  } else if (!canMolt(animal) && s.food === 'prey' && state.refusalStreak > 0) {
    notes.push({
      code: 'no_more_molts',
      text: `Adult ${GROUP_WORD[animal.group]}: adults do not molt, so refusals do not mean premolt.`,
      dates: [],
    });
  }
  if (animal.group === 'mantis' && canMolt(animal)) {
    notes.push({
      code: 'hanging_room',
      text: 'Needs hanging room to molt: clear height of about three times its body length, and no disturbance while it hangs.',
      dates: [],
    });
  }
  return notes;
}
