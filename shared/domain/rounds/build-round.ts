import type { AnimalGroup, AnimalStatus, Caution, LifeStage, Sex } from '../animal-facts';
import { addDays, daysBetween, type LocalDate } from '../local-dates';
import { compareKeys, naturalKey, shelfKey, type Place } from '../walk-order';
import type { AnimalState } from './animal-state';
import { feedingInterval, TINY_SLING_OFFER, type Offer, type RoundRules } from './rules';

export interface EngineAnimal {
  id: string;
  labelCode: string;
  name: string;
  scientificName: string;
  group: AnimalGroup;
  lifeStage: LifeStage;
  sex: Sex;
  sizeMm: number | null;
  status: AnimalStatus;
  cautions: Caution[];
  location: (Place & { id: string }) | null;
  hasWaterDish: boolean;
  intervalDays: number | null;
  preyType: string | null;
  preySize: string | null;
  preyCount: number | null;
  doNotFeedUntil: LocalDate | null;
  /** Where the hold comes from: a handover note names its last day, a keeper's setting its first fed day. */
  doNotFeedBy?: 'keeper' | 'handover';
  /** The date the animal joined the collection in Rackside: a first meal is due from then. */
  addedOn: LocalDate | null;
}

export type ReasonCode =
  | 'due_interval'
  | 'due_first_meal'
  | 'due_refusal_retry'
  | 'due_after_hold'
  | 'rebuild'
  | 'carried_over'
  | 'post_molt_hold'
  | 'premolt'
  | 'possible_premolt'
  | 'check_premolt'
  | 'do_not_feed'
  | 'no_double_meal'
  | 'prey_inside'
  | 'remove_prey'
  | 'prey_may_stay'
  | 'water_due'
  | 'leave_alone'
  | 'inactive'
  | 'not_due';

/**
 * Reasons that withhold food (R4, R3, R5, R11, handover and keeper holds): when one of them
 * starts during the day, that day's open feed task is withdrawn with the reason in its place
 * (R18). "No double meal" and "prey inside" are not holds: they settle, they do not forbid.
 */
export const FEED_HOLD_CODES: ReadonlySet<ReasonCode> = new Set<ReasonCode>([
  'premolt',
  'possible_premolt',
  'post_molt_hold',
  'do_not_feed',
  'leave_alone',
]);

/** Why a task is on the round, or why food is held back: a code, a sentence, its dates. */
export interface Reason {
  code: ReasonCode;
  text: string;
  dates: LocalDate[];
}

export const TASK_KINDS = ['remove_prey', 'leave_alone', 'feed', 'water', 'check'] as const;
export type TaskKind = (typeof TASK_KINDS)[number];

export interface RoundTask {
  kind: TaskKind;
  reasons: Reason[];
  offer?: Offer;
  carriedOverDays: number;
  /** Set on a stored round when a hold began during the day (R18). */
  serverWithdrawn?: Reason | null;
}

export interface AnimalDecision {
  animal: EngineAnimal;
  tasks: RoundTask[];
  /** Context that is not a task: holds, flags, "prey may stay". */
  notes: Reason[];
  nextFeed: LocalDate | null;
  nextWater: LocalDate | null;
}

export interface RoundItem {
  animal: EngineAnimal;
  tasks: RoundTask[];
  notes: Reason[];
  carriedOverDays: number;
}

export interface PrepLine {
  preyType: string;
  preySize: string;
  countMin: number;
  countMax: number;
  animals: number;
}

export interface BuiltRound {
  date: LocalDate;
  items: RoundItem[];
  prepList: PrepLine[];
}

const MONTHS = ['Jan', 'Feb', 'Mar', 'Apr', 'May', 'Jun', 'Jul', 'Aug', 'Sep', 'Oct', 'Nov', 'Dec'];
/** "3 Mar" — the short date used in reasons. */
export function shortDate(date: LocalDate): string {
  return `${Number(date.slice(8, 10))} ${MONTHS[Number(date.slice(5, 7)) - 1]}`;
}

const plural = (n: number, word: string) => `${n} ${word}${n === 1 ? '' : 's'}`;
const later = (a: LocalDate, b: LocalDate) => (a > b ? a : b);

function isRoach(preyType: string | null): boolean {
  return !!preyType && /roach/i.test(preyType);
}

/** R13: the animal's own offer, else the stage default (tiny slings get the tiniest prey). */
export function offerFor(animal: EngineAnimal, rules: RoundRules): Offer {
  const base =
    animal.lifeStage === 'sling' && animal.sizeMm !== null && animal.sizeMm < rules.tinySlingMm
      ? TINY_SLING_OFFER
      : rules.offers[animal.lifeStage];
  return {
    preyType: animal.preyType ?? base.preyType,
    preySize: animal.preySize ?? base.preySize,
    countMin: animal.preyCount ?? base.countMin,
    countMax: animal.preyCount ?? base.countMax,
  };
}

/** Why uneaten prey must come out (R4, R6, R11), or null when it may stay. */
function removalCause(
  animal: EngineAnimal,
  state: AnimalState,
  flags: { premolt: boolean; possiblePremolt: boolean; inHold: boolean },
): string | null {
  if (state.leaveAlone?.reason === 'molting')
    return 'it is molting: live prey can injure a molting animal';
  if (flags.premolt) return 'premolt: live prey can injure a molting animal';
  if (flags.possiblePremolt) return 'possible premolt: live prey can injure a molting animal';
  if (flags.inHold) return 'post-molt hold: the fangs are still soft';
  if (animal.lifeStage === 'sling') return 'slings are not left with live prey';
  if (!isRoach(state.preyLeftIn?.preyType ?? null))
    return 'uneaten live prey can stress or bite the animal';
  if (animal.lifeStage !== 'adult') return 'only an adult may keep a roach in with it';
  return null;
}

const LEAVE_ALONE_WORDS: Record<NonNullable<AnimalState['leaveAlone']>['reason'], string> = {
  molting: 'Molting',
  guarding_sac: 'Guarding an egg sac',
  guarding_brood: 'Guarding her brood',
};

/** R11 amended: a guarding female's dish, topped up quietly when due (R7's days). */
function quietWater(decision: AnimalDecision, state: AnimalState, rules: RoundRules, date: LocalDate) {
  if (!decision.animal.hasWaterDish) return;
  const due = state.lastWatered ? addDays(state.lastWatered, rules.waterEveryDays) : date;
  decision.nextWater = due;
  if (due > date) return;
  const last = state.lastWatered ? `last topped up on ${shortDate(state.lastWatered)}` : 'no watering recorded yet';
  decision.tasks.push({
    kind: 'water',
    reasons: [{ code: 'water_due', text: `Water (${last}): top up quietly, do not disturb her.`, dates: state.lastWatered ? [state.lastWatered] : [] }],
    carriedOverDays: state.lastWatered ? Math.max(0, daysBetween(due, date)) : 0,
  });
}

const REBUILD_WORDS: Record<NonNullable<AnimalState['rebuildReason']>, string> = {
  sac_pulled: 'Rebuilding after the egg sac was pulled on',
  sac_hatched: 'Rebuilding after the egg sac hatched on',
  brood_dispersed: 'Rebuilding after her brood dispersed on',
  paired: 'Conditioning after pairing on',
  keeper: 'Rebuilding since',
};

/** Everything the engine decides about one animal on one local date. Pure. */
export function decideAnimal(
  animal: EngineAnimal,
  state: AnimalState,
  rules: RoundRules,
  date: LocalDate,
): AnimalDecision {
  const decision: AnimalDecision = {
    animal,
    tasks: [],
    notes: [],
    nextFeed: null,
    nextWater: null,
  };
  const { tasks, notes } = decision;

  // R12: inactive animals are never on a round.
  if (animal.status !== 'active') {
    notes.push({
      code: 'inactive',
      text: `Not in the collection any more (${animal.status.replace('_', ' ')}): never on a round.`,
      dates: [],
    });
    return decision;
  }

  const stage = animal.lifeStage;
  const interval = feedingInterval(rules, animal);
  const holdEnd = state.lastMolt ? addDays(state.lastMolt, rules.postMoltHoldDays[stage]) : null;
  const inHold = !!holdEnd && date < holdEnd;
  const premolt = state.premoltSince !== null;
  const possiblePremolt = !premolt && state.refusalStreak >= rules.refusalStreak[stage];
  const flags = { premolt, possiblePremolt, inHold };

  // R4, R6, R11: prey still inside.
  if (state.preyLeftIn) {
    const since = state.preyLeftIn.since;
    const cause = removalCause(animal, state, flags);
    if (cause) {
      tasks.push({
        kind: 'remove_prey',
        reasons: [
          {
            code: 'remove_prey',
            text: `Prey left in on ${shortDate(since)}: remove it (${cause}).`,
            dates: [since],
          },
        ],
        carriedOverDays: Math.max(0, daysBetween(addDays(since, 1), date)),
      });
    } else {
      notes.push({
        code: 'prey_may_stay',
        text: `A roach left in on ${shortDate(since)} may stay with an adult outside the molt cycle.`,
        dates: [since],
      });
    }
  }

  // R11: molting now: nothing else, not even water. Guarding a sac or brood (R11 amended):
  // no food, no disturbance, but a dish is topped up quietly when due.
  if (state.leaveAlone) {
    const { reason, since } = state.leaveAlone;
    tasks.push({
      kind: 'leave_alone',
      reasons: [{ code: 'leave_alone', text: `${LEAVE_ALONE_WORDS[reason]} since ${shortDate(since)}: leave alone — no food, no disturbance.`, dates: [since] }],
      carriedOverDays: 0,
    });
    if (reason !== 'molting') quietWater(decision, state, rules, date);
    return decision;
  }

  // ---- feeding
  const blockers: Reason[] = [];
  if (premolt) {
    blockers.push({
      code: 'premolt',
      text: `Premolt seen on ${shortDate(state.premoltSince!)}: no food until it molts; water continues.`,
      dates: [state.premoltSince!],
    });
  }
  if (possiblePremolt) {
    blockers.push({
      code: 'possible_premolt',
      text: `${state.refusalStreak} refusals in a row (last on ${shortDate(state.lastRefusal!)}): possible premolt, so no food is offered.`,
      dates: [state.lastRefusal!],
    });
  }
  if (inHold) {
    blockers.push({
      code: 'post_molt_hold',
      text: `Post-molt hold until ${shortDate(holdEnd!)} (molted on ${shortDate(state.lastMolt!)}): no food while the fangs harden.`,
      dates: [holdEnd!, state.lastMolt!],
    });
  }
  if (animal.doNotFeedUntil && date < animal.doNotFeedUntil) {
    blockers.push({
      code: 'do_not_feed',
      text:
        animal.doNotFeedBy === 'handover'
          ? `Handover note: do not feed through ${shortDate(addDays(animal.doNotFeedUntil, -1))}.`
          : `Do not feed until ${shortDate(animal.doNotFeedUntil)} (keeper's setting).`,
      dates: [animal.doNotFeedUntil],
    });
  }
  if (state.preyLeftIn) {
    blockers.push({
      code: 'prey_inside',
      text: `Prey from ${shortDate(state.preyLeftIn.since)} is still inside: no new food.`,
      dates: [state.preyLeftIn.since],
    });
  }

  // R8 shortens the interval for meals that fall due inside the rebuild window; judging by the
  // due date (not today) keeps an overdue meal's due date stable when the window closes.
  const shortInterval = Math.max(1, Math.round(interval * rules.rebuildFactor));
  const rebuildUntil = state.rebuildSince ? addDays(state.rebuildSince, rules.rebuildDays) : null;
  const rebuilding =
    !!rebuildUntil &&
    (state.lastMeal ? addDays(state.lastMeal, shortInterval) < rebuildUntil : date < rebuildUntil);
  const effectiveInterval = rebuilding ? shortInterval : interval;
  const refusedSinceMeal =
    state.refusalStreak > 0 &&
    !!state.lastRefusal &&
    (!state.lastMeal || state.lastRefusal >= state.lastMeal);

  let due: LocalDate;
  let why: Reason;
  if (refusedSinceMeal) {
    const retry = rules.refusalRetryDays[stage];
    due = addDays(state.lastRefusal!, retry);
    why = {
      code: 'due_refusal_retry',
      text: `Refused on ${shortDate(state.lastRefusal!)}: offer again after ${plural(retry, 'day')}.`,
      dates: [state.lastRefusal!],
    };
  } else if (state.lastMeal) {
    due = addDays(state.lastMeal, effectiveInterval);
    const since = daysBetween(state.lastMeal, date);
    why = {
      code: 'due_interval',
      text: `Due: ${plural(since, 'day')} since last meal on ${shortDate(state.lastMeal)}.`,
      dates: [state.lastMeal],
    };
  } else {
    due = animal.addedOn && animal.addedOn < date ? animal.addedOn : date;
    why = { code: 'due_first_meal', text: 'No meal recorded yet.', dates: [] };
  }
  // After a molt, food resumes when the hold ends (for an animal never fed yet, too).
  if (holdEnd && state.lastMolt && (holdEnd > due || !state.lastMeal)) {
    due = holdEnd;
    why = {
      code: 'due_after_hold',
      text: `Post-molt hold ended on ${shortDate(holdEnd)} (molted on ${shortDate(state.lastMolt)}): food can be offered again.`,
      dates: [holdEnd, state.lastMolt],
    };
  }
  if (animal.doNotFeedUntil && animal.doNotFeedUntil > due) due = animal.doNotFeedUntil;

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

  notes.push(...blockers);
  const rebuildReason: Reason | null = rebuilding
    ? {
        code: 'rebuild',
        text: `${REBUILD_WORDS[state.rebuildReason ?? 'keeper']} ${shortDate(state.rebuildSince!)}: fed every ${plural(effectiveInterval, 'day')} instead of ${interval} until ${shortDate(rebuildUntil!)}.`,
        dates: [state.rebuildSince!, rebuildUntil!],
      }
    : null;

  if (!premolt && !possiblePremolt) decision.nextFeed = due;
  if (blockers.length === 0 && due <= date) {
    // R9: carried over from the day it fell due, or from the day after a deliberate skip.
    const countFrom =
      state.lastSkipped && state.lastSkipped >= due ? addDays(state.lastSkipped, 1) : due;
    const carried = Math.max(0, daysBetween(countFrom, date));
    const reasons = [why];
    if (rebuildReason) reasons.push(rebuildReason);
    if (carried > 0)
      reasons.push({
        code: 'carried_over',
        text: `Carried over ${plural(carried, 'day')}: due on ${shortDate(countFrom)}.`,
        dates: [countFrom],
      });
    tasks.push({ kind: 'feed', offer: offerFor(animal, rules), reasons, carriedOverDays: carried });
  } else if (rebuildReason) {
    notes.push(rebuildReason);
  }

  // ---- water (R7): dishes only; small slings have none and drink from damp substrate and prey.
  if (animal.hasWaterDish) {
    const dueWater = state.lastWatered ? addDays(state.lastWatered, rules.waterEveryDays) : date;
    decision.nextWater = dueWater;
    if (dueWater <= date) {
      const carried = state.lastWatered ? Math.max(0, daysBetween(dueWater, date)) : 0;
      tasks.push({
        kind: 'water',
        reasons: [
          state.lastWatered
            ? {
                code: 'water_due',
                text: `Water every ${plural(rules.waterEveryDays, 'day')}: last topped up on ${shortDate(state.lastWatered)}.`,
                dates: [state.lastWatered],
              }
            : { code: 'water_due', text: 'No watering recorded yet.', dates: [] },
          ...(carried > 0
            ? [
                {
                  code: 'carried_over' as const,
                  text: `Carried over ${plural(carried, 'day')}: due on ${shortDate(dueWater)}.`,
                  dates: [dueWater],
                },
              ]
            : []),
        ],
        carriedOverDays: carried,
      });
    }
  }

  // ---- check (R3): a look every N days while a possible premolt is flagged.
  if (possiblePremolt) {
    const since = later(state.lastRefusal!, state.lastObserved ?? state.lastRefusal!);
    const dueCheck = addDays(since, rules.premoltCheckDays);
    if (dueCheck <= date) {
      tasks.push({
        kind: 'check',
        reasons: [
          {
            code: 'check_premolt',
            text: `Possible premolt since ${shortDate(state.lastRefusal!)}: look for a dark, shiny abdomen, a molt mat or a fresh molt.`,
            dates: [state.lastRefusal!],
          },
        ],
        carriedOverDays: Math.max(0, daysBetween(dueCheck, date)),
      });
    }
  }

  if (
    tasks.length === 0 &&
    decision.nextFeed &&
    decision.nextFeed > date &&
    blockers.length === 0
  ) {
    notes.push({
      code: 'not_due',
      text: `Not due: next meal on ${shortDate(decision.nextFeed)}.`,
      dates: [decision.nextFeed],
    });
  }
  tasks.sort((a, b) => TASK_KINDS.indexOf(a.kind) - TASK_KINDS.indexOf(b.kind));
  return decision;
}

const collator = new Intl.Collator('en', { numeric: true, sensitivity: 'base' });

interface SortKeys {
  shelf: string;
  position: string;
}
const keyCache = new WeakMap<RoundItem, SortKeys>();
function keysOf(item: RoundItem): SortKeys {
  let k = keyCache.get(item);
  if (!k) {
    const l = item.animal.location;
    const code = naturalKey(item.animal.labelCode);
    k = l
      ? { shelf: shelfKey(l), position: `${naturalKey(l.position)}\u0000${code}` }
      : { shelf: '\uffff', position: code };
    keyCache.set(item, k);
  }
  return k;
}

/**
 * R14 walk order: shelf by shelf (the keeper's own walk order, then room → rack → shelf by
 * natural sort, so 2 before 10), carried-over items first within a shelf, then by position.
 * Sort keys are computed once per item: a collator per comparison is too slow at 20,000 items.
 */
export function compareItems(a: RoundItem, b: RoundItem): number {
  const ka = keysOf(a);
  const kb = keysOf(b);
  const shelf = compareKeys(ka.shelf, kb.shelf);
  if (shelf) return shelf;
  const carried = Number(b.carriedOverDays > 0) - Number(a.carriedOverDays > 0);
  return carried || compareKeys(ka.position, kb.position);
}

const SIZE_ORDER = ['tiny', 'pinhead', 'small', 'medium', 'large', 'adult'];

/** R15: feed tasks summed by prey type and size — what to pull from the feeder tubs. */
export function prepList(items: readonly RoundItem[]): PrepLine[] {
  const lines = new Map<string, PrepLine>();
  for (const item of items) {
    for (const task of item.tasks) {
      if (task.kind !== 'feed' || !task.offer) continue;
      const key = `${task.offer.preyType}|${task.offer.preySize}`;
      const line = lines.get(key) ?? {
        preyType: task.offer.preyType,
        preySize: task.offer.preySize,
        countMin: 0,
        countMax: 0,
        animals: 0,
      };
      line.countMin += task.offer.countMin;
      line.countMax += task.offer.countMax;
      line.animals += 1;
      lines.set(key, line);
    }
  }
  const rank = (size: string) =>
    SIZE_ORDER.includes(size) ? SIZE_ORDER.indexOf(size) : SIZE_ORDER.length;
  return [...lines.values()].sort(
    (a, b) =>
      collator.compare(a.preyType, b.preyType) ||
      rank(a.preySize) - rank(b.preySize) ||
      collator.compare(a.preySize, b.preySize),
  );
}

/** The round for `date`: every animal with a task, in walk order, and the prep list. */
export function buildRound(
  animals: readonly { animal: EngineAnimal; state: AnimalState }[],
  rules: RoundRules,
  date: LocalDate,
): BuiltRound {
  const items: RoundItem[] = [];
  for (const { animal, state } of animals) {
    const d = decideAnimal(animal, state, rules, date);
    if (d.tasks.length === 0) continue;
    items.push({
      animal,
      tasks: d.tasks,
      notes: d.notes,
      carriedOverDays: Math.max(...d.tasks.map((t) => t.carriedOverDays)),
    });
  }
  items.sort(compareItems);
  return { date, items, prepList: prepList(items) };
}
