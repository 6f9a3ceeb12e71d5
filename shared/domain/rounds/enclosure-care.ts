import type { AnimalGroup } from '../animal-facts';
import { addDays, type LocalDate } from '../local-dates';
import type { AnimalDecision, EngineAnimal, Reason, TaskKind } from './engine-types';
import { carriedFrom, plural, shortDate } from './reason-words';
import type { RoundRules } from './rules';
import { settlingOf, type Situation } from './situation';

// Enclosure care (docs/care-rules.md § Enclosure care, R7, R21, R22): misting, moistening a
// sling's substrate, spot-cleaning (a bolus after a meal, and every few days) and rehousing an
// animal that has outgrown its enclosure after a molt — each its own task, each obeying holds.

export type HydrationKind = 'mist' | 'moisten';

/** Task kinds that look after the enclosure rather than feed or water the animal. */
export const CARE_KINDS: ReadonlySet<TaskKind> = new Set<TaskKind>([
  'mist',
  'moisten',
  'spot_clean',
  'rehouse',
]);

type CareAnimal = Pick<
  EngineAnimal,
  'group' | 'lifeStage' | 'sizeMm' | 'hasWaterDish' | 'mistEveryDays' | 'moistenEveryDays'
>;

/**
 * R7 and § Enclosure care: how often this animal is misted or has its substrate moistened. Its
 * own setting wins (0: never); otherwise an animal without a dish follows its profile's
 * hydration below the profile's size (no size recorded: slings only). Null: not at all.
 */
export function hydrationEvery(
  kind: HydrationKind,
  animal: CareAnimal,
  rules: RoundRules,
): { every: number; own: boolean } | null {
  const own = kind === 'mist' ? animal.mistEveryDays : animal.moistenEveryDays;
  if (own !== null && own !== undefined) return own > 0 ? { every: own, own: true } : null;
  if (animal.hasWaterDish) return null;
  const profile = rules.profiles[animal.group];
  if (profile.hydration !== kind) return null;
  const below = profile.hydrateBelowMm;
  if (
    below !== null &&
    !(animal.sizeMm !== null ? animal.sizeMm < below : animal.lifeStage === 'sling')
  )
    return null;
  return { every: profile.hydrateEveryDays, own: false };
}

/**
 * The last misting or moistening. Before these had outcomes of their own, a dishless animal's
 * "Watered" was its misting or moistening: that date counts until the first new one.
 */
function lastHydrated(kind: HydrationKind, s: Situation): LocalDate | null {
  const own = kind === 'mist' ? s.state.lastMisted : s.state.lastMoistened;
  return own ?? (s.animal.hasWaterDish ? null : s.state.lastWatered);
}

const HYDRATION_WORDS: Record<HydrationKind, { task: string; code: Reason['code'] }> = {
  mist: { task: 'mist lightly', code: 'mist_due' },
  moisten: { task: 'moisten part of the substrate', code: 'moisten_substrate' },
};

/**
 * R7 (§ Enclosure care): a misting or moistening task when due. `quiet`: a guarding female
 * (R11 amended) has the substrate moistened at the edge, without disturbing her.
 */
export function decideHydration(
  d: AnimalDecision,
  s: Situation,
  kind: HydrationKind,
  quiet = false,
) {
  const plan = hydrationEvery(kind, s.animal, s.rules);
  if (!plan) return;
  const last = lastHydrated(kind, s);
  const due = last ? addDays(last, plan.every) : s.date;
  if (due > s.date) return;
  const { task, code } = HYDRATION_WORDS[kind];
  const every = `${task} every ${plural(plan.every, 'day')}`;
  const noDish =
    s.rules.profiles[s.animal.group].hydrateBelowMm !== null ? 'No dish at this size' : 'No dish';
  const why = plan.own
    ? `Its own setting: ${every}`
    : `${noDish}: ${every}${kind === 'mist' ? ' — it drinks the droplets' : ''}`;
  const text = quiet
    ? `Moisten the substrate at the edge (${last ? `last on ${shortDate(last)}` : 'none recorded yet'}): quietly, do not disturb her.`
    : last
      ? `${why} (last on ${shortDate(last)}).`
      : `${why} (none recorded yet).`;
  const carried = last ? carriedFrom(due, s.date) : 0;
  const reasons: Reason[] = [{ code, text, dates: last ? [last] : [] }];
  if (carried > 0)
    reasons.push({
      code: 'carried_over',
      text: `Carried over ${plural(carried, 'day')}: due on ${shortDate(due)}.`,
      dates: [due],
    });
  d.tasks.push({ kind, reasons, carriedOverDays: carried });
}

/** § Enclosure care: the animal's own spot-clean interval wins (0: never), else its profile's. */
export function spotCleanEvery(
  animal: Pick<EngineAnimal, 'group' | 'spotCleanEveryDays'>,
  rules: RoundRules,
): number | null {
  const own = animal.spotCleanEveryDays;
  if (own !== null && own !== undefined) return own > 0 ? own : null;
  return rules.profiles[animal.group].spotCleanEveryDays;
}

/**
 * R21: a spot-clean the day after a meal of live prey (the bolus — the balled-up remains — is
 * dropped within a day and moulds or draws mites if left), and every N days after the last one.
 * Not in premolt: the animal may have sealed itself in, and its web or burrow is left whole.
 */
export function decideSpotClean(d: AnimalDecision, s: Situation) {
  if (s.premolt || s.food === 'substrate' || s.food === 'none') return;
  const own = s.animal.spotCleanEveryDays;
  if (own === 0) return; // the keeper turned it off for this animal, bolus included
  const every = spotCleanEvery(s.animal, s.rules);
  const last = s.state.lastSpotCleaned ?? null;
  const meal = s.state.lastMeal;
  const bolusDue =
    s.food === 'prey' && s.rules.bolusAfterDays > 0 && meal && (!last || meal >= last)
      ? addDays(meal, s.rules.bolusAfterDays)
      : null;
  // Counted from the last spot-clean: with none recorded, a meal starts it (no task for the
  // whole collection on its first day).
  const periodicDue = every === null || !last ? null : addDays(last, every);
  const bolus = !!bolusDue && (!periodicDue || bolusDue <= periodicDue);
  const due = bolus ? bolusDue : periodicDue;
  if (!due || due > s.date) return;
  const reason: Reason = bolus
    ? {
        code: 'bolus',
        text: `Ate on ${shortDate(meal!)}: pick out the bolus and any prey remains before they mould.`,
        dates: [meal!],
      }
    : {
        code: 'spot_clean_due',
        text: `Spot-clean every ${plural(every!, 'day')}: waste, remains and old molts out (last on ${shortDate(last!)}).`,
        dates: [last!],
      };
  const carried = carriedFrom(due, s.date);
  const reasons = [reason];
  if (carried > 0)
    reasons.push({
      code: 'carried_over',
      text: `Carried over ${plural(carried, 'day')}: due on ${shortDate(due)}.`,
      dates: [due],
    });
  d.tasks.push({ kind: 'spot_clean', reasons, carriedOverDays: carried });
}

/** What an animal's recorded size measures: a spider's diagonal leg span, else body length. */
export function sizeWord(group: AnimalGroup): string {
  return group === 'tarantula' || group === 'true_spider' ? 'leg span' : 'body length';
}

/**
 * R22: whether an enclosure is too small for an animal of its size — the floor's shorter side
 * under `rehouseFloorSpans` × its size, or, when a height is recorded (an arboreal set-up), the
 * height under `rehouseHeightSpans` × it. Null when the size or the floor is not recorded.
 */
export function outgrown(
  animal: Pick<
    EngineAnimal,
    'sizeMm' | 'enclosureLengthMm' | 'enclosureWidthMm' | 'enclosureHeightMm'
  >,
  rules: Pick<RoundRules, 'rehouseFloorSpans' | 'rehouseHeightSpans'>,
): { floor: boolean; height: boolean } | null {
  const size = animal.sizeMm;
  const length = animal.enclosureLengthMm ?? null;
  const width = animal.enclosureWidthMm ?? null;
  if (size === null || size <= 0 || length === null || width === null) return null;
  const floor = Math.min(length, width) < rules.rehouseFloorSpans * size;
  const h = animal.enclosureHeightMm ?? null;
  const height = h !== null && h < rules.rehouseHeightSpans * size;
  return floor || height ? { floor, height } : null;
}

/**
 * R22: after a molt that leaves the animal too big for its enclosure, a rehouse task until a
 * rehouse is recorded — never in premolt (seen or possible), while settling, or before the
 * post-molt hold ends (the fangs and the new skin harden first): then a note says it waits.
 */
export function decideRehouse(d: AnimalDecision, s: Situation) {
  const { state, animal, rules } = s;
  const molt = state.lastMolt;
  if (!molt) return;
  const rehoused = state.lastRehoused ?? null;
  if (rehoused && rehoused >= molt) return;
  const over = outgrown(animal, rules);
  if (!over) return;
  const size = `${Math.round(animal.sizeMm!)} mm ${sizeWord(animal.group)}`;
  const floor = `${animal.enclosureLengthMm} × ${animal.enclosureWidthMm} mm floor`;
  const what = over.floor
    ? `${size} in a ${floor} (the shorter side should be at least ${rules.rehouseFloorSpans}× its size)`
    : `${size} in an enclosure ${animal.enclosureHeightMm} mm high (at least ${rules.rehouseHeightSpans}× its size for a climber)`;
  const settling = settlingOf(s);
  const waitUntil =
    s.premolt || s.possiblePremolt
      ? 'it has molted and hardened'
      : s.inHold
        ? shortDate(s.holdEnd!)
        : settling && s.date < settling.until
          ? shortDate(settling.until)
          : null;
  if (waitUntil) {
    d.notes.push({
      code: 'rehouse_due',
      text: `Outgrown its enclosure since the molt on ${shortDate(molt)}: ${what}. Rehouse after ${waitUntil}, not before.`,
      dates: [molt],
    });
    return;
  }
  d.tasks.push({
    kind: 'rehouse',
    reasons: [
      {
        code: 'rehouse_due',
        text: `Outgrown its enclosure since the molt on ${shortDate(molt)}: ${what}. Move it to a bigger one.`,
        dates: [molt],
      },
    ],
    carriedOverDays: 0,
  });
}

/** Everything § Enclosure care gives an animal on a normal day (not left alone). */
export function decideEnclosureCare(d: AnimalDecision, s: Situation) {
  // A larva lives in its food substrate, kept moist with it (§ Care profiles › Beetle).
  if (s.food !== 'substrate' && s.food !== 'none') {
    decideHydration(d, s, 'mist');
    decideHydration(d, s, 'moisten');
  }
  decideSpotClean(d, s);
  decideRehouse(d, s);
}

/**
 * R11 amended: a female guarding a sac or a brood is disturbed as little as possible — her
 * substrate is moistened at the edge when due; no misting, no spot-clean, no rehouse.
 */
export function quietCare(d: AnimalDecision, s: Situation) {
  decideHydration(d, s, 'moisten', true);
}
