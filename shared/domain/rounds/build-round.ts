import type { AnimalGroup, AnimalStatus, Caution, Diet, LifeStage, Sex } from '../animal-facts';
import { addDays, daysBetween, type LocalDate } from '../local-dates';
import { compareKeys, naturalKey, shelfKey, type Place } from '../walk-order';
import type { AnimalState } from './animal-state';
import { canMolt, DIET_FOOD, foodOf, GROUP_CARE, type Food } from './care-profiles';
import { feederLength, type Feeder } from './feeders';
import { offerFor } from './offer';
import { feedingInterval, postMoltHoldDays, stageCare, type Offer, type RoundRules } from './rules';

export { offerFor } from './offer';

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
  /** What a stage fed "by diet" eats (beetle adults, other); null: the group's usual diet. */
  diet?: Diet | null;
  doNotFeedUntil: LocalDate | null;
  /** Where the hold comes from: a handover note names its last day, a keeper's setting its first fed day. */
  doNotFeedBy?: 'keeper' | 'handover';
  /**
   * The date the animal joined the collection in Rackside (arrival or potting up): a settling
   * period (R16), then a first meal. Only given for an animal never fed.
   */
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
  | 'check_substrate'
  | 'do_not_feed'
  | 'settling'
  | 'not_feeding_yet'
  | 'on_mother'
  | 'pupa'
  | 'no_double_meal'
  | 'prey_inside'
  | 'remove_prey'
  | 'prey_may_stay'
  | 'check_prey'
  | 'water_due'
  | 'moisten_substrate'
  | 'mist_due'
  | 'leave_alone'
  | 'mature_male'
  | 'no_more_molts'
  | 'hanging_room'
  | 'inactive'
  | 'not_due';

/**
 * Reasons that withhold food (R4, R3, R5, R11, R16, handover and keeper holds, stages that are
 * not fed): when one of them starts during the day, that day's open feed task is withdrawn with
 * the reason in its place (R18). "No double meal" and "prey inside" are not holds: they settle,
 * they do not forbid.
 */
export const FEED_HOLD_CODES: ReadonlySet<ReasonCode> = new Set<ReasonCode>([
  'premolt',
  'possible_premolt',
  'post_molt_hold',
  'do_not_feed',
  'leave_alone',
  'settling',
  'not_feeding_yet',
  'on_mother',
  'pupa',
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
  /** Context that is not a task: holds, flags, "prey may stay", care notes. */
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
const latest = (...dates: (LocalDate | null | undefined)[]): LocalDate | null =>
  dates.reduce<LocalDate | null>((best, d) => (d && (!best || d > best) ? d : best), null);
const carriedFrom = (due: LocalDate, date: LocalDate) => Math.max(0, daysBetween(due, date));

/** A keeper's hold names the first day food may be offered; a handover note its last held day. */
function doNotFeedText(animal: EngineAnimal): string {
  const until = animal.doNotFeedUntil!;
  return animal.doNotFeedBy === 'handover'
    ? `Handover note: do not feed through ${shortDate(addDays(until, -1))}.`
    : `Do not feed until ${shortDate(until)} (keeper's setting).`;
}

function isRoach(preyType: string | null): boolean {
  return !!preyType && /roach/i.test(preyType);
}

/** Everything one decision needs, worked out once (docs/care-rules.md names each rule). */
interface Situation {
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

function situationOf(animal: EngineAnimal, state: AnimalState, rules: RoundRules, date: LocalDate): Situation {
  const food = foodOf(animal);
  const holdDays = postMoltHoldDays(rules, animal);
  const holdEnd = state.lastMolt && holdDays > 0 ? addDays(state.lastMolt, holdDays) : null;
  const premolt = state.premoltSince !== null;
  const possiblePremolt =
    food === 'prey' && canMolt(animal) && !premolt && state.refusalStreak >= stageCare(rules, animal).refusalStreak;
  return { animal, state, rules, date, food, holdEnd, inHold: !!holdEnd && date < holdEnd, premolt, possiblePremolt };
}

/** Why uneaten prey must come out (R4, R6, R11), or null when it may stay (R6, R20). */
function removalCause(s: Situation): string | null {
  const { animal, state } = s;
  if (state.leaveAlone?.reason === 'molting') return 'it is molting: live prey can injure a molting animal';
  if (s.premolt) return 'premolt: live prey can injure a molting animal';
  if (s.possiblePremolt) return 'possible premolt: live prey can injure a molting animal';
  if (s.inHold) return 'post-molt hold: the fangs are still soft';
  if (s.food === 'none') return 'it does not eat at this stage';
  if (animal.lifeStage === 'sling') return 'slings are not left with live prey';
  if (!isRoach(state.preyLeftIn?.preyType ?? null)) return 'uneaten live prey can stress or bite the animal';
  if (animal.lifeStage !== 'adult') return 'only an adult may keep a roach in with it';
  return null;
}

/** R4, R6, R11, R20: live prey still inside — out it comes, or it may stay and is checked. */
function decidePreyInside(d: AnimalDecision, s: Situation) {
  const inside = s.state.preyLeftIn;
  // Fruit, plant food and leaf litter stay in by design; a larva's food is its substrate.
  if (!inside || (s.food !== 'prey' && s.food !== 'none')) return;
  const { since } = inside;
  const cause = removalCause(s);
  if (cause) {
    d.tasks.push({
      kind: 'remove_prey',
      reasons: [{ code: 'remove_prey', text: `Prey left in on ${shortDate(since)}: remove it (${cause}).`, dates: [since] }],
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

/** What a female guarding eggs or young is doing, in her group's words (R11). */
function guardingWords(group: AnimalGroup): string {
  if (group === 'centipede') return 'Brooding her eggs';
  if (group === 'scorpion') return 'Carrying her brood';
  return 'Guarding an egg sac';
}

/** R11 and § Care profiles (pupa): left alone — no food, no water, no disturbance. */
function leaveAloneReason(s: Situation): Reason | null {
  const { state, animal } = s;
  if (state.leaveAlone) {
    const { reason, since } = state.leaveAlone;
    const what = reason === 'molting' ? 'Molting' : guardingWords(animal.group);
    return { code: 'leave_alone', text: `${what} since ${shortDate(since)}: leave alone — no food, no disturbance.`, dates: [since] };
  }
  if (animal.lifeStage === 'pupa' && s.food === 'none')
    return { code: 'pupa', text: 'Pupa: leave it alone in its chamber — no food, no digging, until the adult comes out.', dates: [] };
  return null;
}

/** § Stages: first instars and scorplings on the mother are not fed (R16's sibling rule). */
function notFedReason(s: Situation): Reason | null {
  if (s.food !== 'none') return null;
  if (s.animal.group === 'scorpion')
    return { code: 'on_mother', text: 'Scorpling on its mother’s back: not fed until its first molt and it leaves her.', dates: [] };
  return { code: 'not_feeding_yet', text: 'First instar: it lives on its yolk and does not eat until its next molt — no food yet.', dates: [] };
}

/** R16: settling in after arrival, potting up or a rehouse. Null when not settling. */
function settlingOf(s: Situation): { since: LocalDate; until: LocalDate; rehoused: boolean } | null {
  const rehousedOn = s.state.rehousedOn ?? null;
  // The join date only counts for an animal never fed: a meal means it has settled.
  const arrived = s.state.lastMeal ? null : s.animal.addedOn;
  const since = latest(rehousedOn, arrived);
  if (!since || s.rules.settlingDays <= 0) return null;
  return { since, until: addDays(since, s.rules.settlingDays), rehoused: since === rehousedOn };
}

/** Everything that withholds food today (R3, R4, R5, R16, keeper and handover holds, R6). */
function feedBlockers(s: Situation): Reason[] {
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
  const active = !!until && (state.lastMeal ? addDays(state.lastMeal, shortInterval) < until : date < until);
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
function feedDue(s: Situation, interval: number, blockers: Reason[]): { due: LocalDate; why: Reason } {
  const { state, animal, date } = s;
  const live = s.food === 'prey';
  // For fruit, plant food and litter a refusal still means the food was put in: it counts.
  const served = live ? state.lastMeal : latest(state.lastMeal, state.lastRefusal);
  const refusedSinceMeal =
    live && state.refusalStreak > 0 && !!state.lastRefusal && (!state.lastMeal || state.lastRefusal >= state.lastMeal);

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
      ? { code: 'due_interval', text: `Due: ${plural(daysBetween(served, date), 'day')} since last meal on ${shortDate(served)}.`, dates: [served] }
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
function decideFeed(d: AnimalDecision, s: Situation) {
  const { animal, state, rules, date } = s;
  const interval = feedingInterval(rules, animal);
  const blockers = feedBlockers(s);
  const rebuild = s.food === 'prey' ? rebuildOf(s, interval) : null;
  const { due, why } = feedDue(s, rebuild?.interval ?? interval, blockers);

  d.notes.push(...blockers);
  if (!s.premolt && !s.possiblePremolt) d.nextFeed = due;
  if (blockers.length === 0 && due <= date) {
    // R9: carried over from the day it fell due, or from the day after a deliberate skip.
    const countFrom = state.lastSkipped && state.lastSkipped >= due ? addDays(state.lastSkipped, 1) : due;
    const carried = carriedFrom(countFrom, date);
    const reasons = [why];
    if (rebuild) reasons.push(rebuild.reason);
    if (carried > 0)
      reasons.push({ code: 'carried_over', text: `Carried over ${plural(carried, 'day')}: due on ${shortDate(countFrom)}.`, dates: [countFrom] });
    d.tasks.push({ kind: 'feed', offer: offerFor(animal, rules), reasons, carriedOverDays: carried });
  } else if (rebuild) {
    d.notes.push(rebuild.reason);
  }
  return blockers;
}

/** § Care profiles (beetle larva): no live prey; its food substrate is checked and topped up. */
function decideSubstrate(d: AnimalDecision, s: Situation) {
  const { animal, state, rules, date } = s;
  const every = feedingInterval(rules, animal);
  const last = latest(state.lastObserved, state.lastMeal);
  const due = last ? addDays(last, every) : animal.addedOn ? addDays(animal.addedOn, every) : date;
  d.nextFeed = animal.doNotFeedUntil ? later(due, animal.doNotFeedUntil) : due;
  if (animal.doNotFeedUntil && date < animal.doNotFeedUntil) {
    d.notes.push({ code: 'do_not_feed', text: doNotFeedText(animal), dates: [animal.doNotFeedUntil] });
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

/** R7 and § Care profiles: how the animal gets water — a dish, moist substrate, misting, none. */
function waterPlan(s: Situation): { every: number; code: ReasonCode; first: string; since: (last: string) => string } | null {
  const { animal, rules } = s;
  if (animal.hasWaterDish) {
    const damp = GROUP_CARE[animal.group].dampSubstrate ? ' Keep part of the substrate damp too.' : '';
    return {
      every: rules.waterEveryDays,
      code: 'water_due',
      first: `No watering recorded yet.${damp}`,
      since: (last) => `Water every ${plural(rules.waterEveryDays, 'day')}: last topped up on ${last}.${damp}`,
    };
  }
  const profile = rules.profiles[animal.group];
  if (profile.hydration === 'none') return null;
  const below = profile.hydrateBelowMm;
  if (below !== null && !(animal.sizeMm !== null ? animal.sizeMm < below : animal.lifeStage === 'sling')) return null;
  const every = profile.hydrateEveryDays;
  const noDish = below !== null ? 'No dish at this size' : 'No dish';
  if (profile.hydration === 'moisten') {
    return {
      every,
      code: 'moisten_substrate',
      first: `${noDish}: moisten part of the substrate (no watering recorded yet).`,
      since: (last) => `${noDish}: moisten part of the substrate every ${plural(every, 'day')} (last on ${last}).`,
    };
  }
  return {
    every,
    code: 'mist_due',
    first: `${noDish}: mist lightly — it drinks the droplets (no misting recorded yet).`,
    since: (last) => `${noDish}: mist lightly every ${plural(every, 'day')} — it drinks the droplets (last on ${last}).`,
  };
}

/** R7: the water task when due; none for stages that are not fed or live in their food. */
function decideWater(d: AnimalDecision, s: Situation) {
  if (s.food === 'none' || s.food === 'substrate') return;
  const plan = waterPlan(s);
  if (!plan) return;
  const { lastWatered } = s.state;
  const dueWater = lastWatered ? addDays(lastWatered, plan.every) : s.date;
  d.nextWater = dueWater;
  if (dueWater > s.date) return;
  const carried = lastWatered ? carriedFrom(dueWater, s.date) : 0;
  const reasons: Reason[] = [
    lastWatered ? { code: plan.code, text: plan.since(shortDate(lastWatered)), dates: [lastWatered] } : { code: plan.code, text: plan.first, dates: [] },
  ];
  if (carried > 0) reasons.push({ code: 'carried_over', text: `Carried over ${plural(carried, 'day')}: due on ${shortDate(dueWater)}.`, dates: [dueWater] });
  d.tasks.push({ kind: 'water', reasons, carriedOverDays: carried });
}

/** R3: a look every N days while a possible premolt is flagged. */
function decidePremoltCheck(d: AnimalDecision, s: Situation) {
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
function careNotes(s: Situation): Reason[] {
  const { animal, state } = s;
  const notes: Reason[] = [];
  if (animal.sex === 'mature_male') {
    notes.push({ code: 'mature_male', text: 'Mature male: refusing food is normal, and he will not molt again.', dates: [] });
  } else if (!canMolt(animal) && s.food === 'prey' && state.refusalStreak > 0) {
    notes.push({ code: 'no_more_molts', text: `Adult ${GROUP_WORD[animal.group]}: adults do not molt, so refusals do not mean premolt.`, dates: [] });
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

/** R11 amended: a guarding female's dish, topped up quietly when due (R7's days). */
function quietWater(d: AnimalDecision, state: AnimalState, rules: RoundRules, date: LocalDate) {
  if (!d.animal.hasWaterDish) return;
  const due = state.lastWatered ? addDays(state.lastWatered, rules.waterEveryDays) : date;
  d.nextWater = due;
  if (due > date) return;
  const last = state.lastWatered ? `last topped up on ${shortDate(state.lastWatered)}` : 'no watering recorded yet';
  d.tasks.push({
    kind: 'water',
    reasons: [{ code: 'water_due', text: `Water (${last}): top up quietly, do not disturb her.`, dates: state.lastWatered ? [state.lastWatered] : [] }],
    carriedOverDays: state.lastWatered ? carriedFrom(due, date) : 0,
  });
}

/** Everything the engine decides about one animal on one local date. Pure. */
export function decideAnimal(animal: EngineAnimal, state: AnimalState, rules: RoundRules, date: LocalDate): AnimalDecision {
  const d: AnimalDecision = { animal, tasks: [], notes: [], nextFeed: null, nextWater: null };

  // R12: inactive animals are never on a round.
  if (animal.status !== 'active') {
    d.notes.push({ code: 'inactive', text: `Not in the collection any more (${animal.status.replace('_', ' ')}): never on a round.`, dates: [] });
    return d;
  }
  const s = situationOf(animal, state, rules, date);
  decidePreyInside(d, s);

  // R11 (molting) and pupae: nothing else, not even water. Guarding a sac or brood (R11
  // amended): no food, no disturbance, but a dish is topped up quietly when due.
  const leaveAlone = leaveAloneReason(s);
  if (leaveAlone) {
    d.tasks.push({ kind: 'leave_alone', reasons: [leaveAlone], carriedOverDays: 0 });
    if (state.leaveAlone && state.leaveAlone.reason !== 'molting') quietWater(d, state, rules, date);
    return d;
  }
  // Stages that are not fed: a note, no task.
  const notFed = notFedReason(s);
  if (notFed) {
    d.notes.push(notFed);
    return d;
  }

  const blockers = s.food === 'substrate' ? (decideSubstrate(d, s), []) : decideFeed(d, s);
  decideWater(d, s);
  decidePremoltCheck(d, s);
  d.notes.push(...careNotes(s));

  if (d.tasks.length === 0 && d.nextFeed && d.nextFeed > date && blockers.length === 0) {
    d.notes.push({ code: 'not_due', text: `Not due: next meal on ${shortDate(d.nextFeed)}.`, dates: [d.nextFeed] });
  }
  d.tasks.sort((a, b) => TASK_KINDS.indexOf(a.kind) - TASK_KINDS.indexOf(b.kind));
  return d;
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

/**
 * R15: feed tasks summed by prey type and size — what to pull from the feeder tubs. Sizes sort
 * by their length in the collection's feeder catalogue, else by the usual size words.
 */
export function prepList(items: readonly RoundItem[], feeders: readonly Feeder[] = []): PrepLine[] {
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
  const rank = (line: PrepLine) =>
    feederLength(feeders, line.preyType, line.preySize) ??
    (SIZE_ORDER.includes(line.preySize) ? SIZE_ORDER.indexOf(line.preySize) : Number.MAX_SAFE_INTEGER);
  return [...lines.values()].sort(
    (a, b) =>
      collator.compare(a.preyType, b.preyType) ||
      rank(a) - rank(b) ||
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
  return { date, items, prepList: prepList(items, rules.feeders) };
}
