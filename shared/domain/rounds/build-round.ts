import type { LocalDate } from '../local-dates';
import { compareKeys, naturalKey, shelfKey } from '../walk-order';
import type { AnimalState } from './animal-state';
import { careNotes, decidePremoltCheck } from './checks-and-notes';
import { decideEnclosureCare, quietCare } from './enclosure-care';
import {
  TASK_KINDS,
  type AnimalDecision,
  type EngineAnimal,
  type Reason,
  type ReasonCode,
  type RoundTask,
} from './engine-types';
import { decideFeed, decideSubstrate } from './feed-decision';
import { feederLength, type Feeder } from './feeders';
import { leaveAloneReason, notFedReason } from './holds';
import { decidePreyInside } from './prey-removal';
import { shortDate } from './reason-words';
import type { RoundRules } from './rules';
import { situationOf } from './situation';
import { decideWater, quietWater } from './water';

// The round engine (docs/care-rules.md): what each animal needs on a date, step by step (the
// steps live beside this file, one concern each), and a day's round in walk order with its prep
// list. Its vocabulary is in engine-types.ts; it is exported from here too, as it always was.
export { offerFor } from './offer';
export { shortDate } from './reason-words';
export {
  TASK_KINDS,
  type AnimalDecision,
  type EngineAnimal,
  type Reason,
  type ReasonCode,
  type RoundTask,
  type TaskKind,
} from './engine-types';

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

/** Everything the engine decides about one animal on one local date. Pure. */
export function decideAnimal(
  animal: EngineAnimal,
  state: AnimalState,
  rules: RoundRules,
  date: LocalDate,
): AnimalDecision {
  const d: AnimalDecision = { animal, tasks: [], notes: [], nextFeed: null, nextWater: null };

  // R12: inactive animals are never on a round.
  if (animal.status !== 'active') {
    d.notes.push({
      code: 'inactive',
      text: `Not in the collection any more (${animal.status.replace('_', ' ')}): never on a round.`,
      dates: [],
    });
    return d;
  }
  const s = situationOf(animal, state, rules, date);
  decidePreyInside(d, s);

  // R11 (molting) and pupae: nothing else, not even water or misting. Guarding a sac or brood
  // (R11 amended): no food, no disturbance, but a dish is topped up and the substrate
  // moistened quietly when due (§ Enclosure care).
  const leaveAlone = leaveAloneReason(s);
  if (leaveAlone) {
    d.tasks.push({ kind: 'leave_alone', reasons: [leaveAlone], carriedOverDays: 0 });
    if (state.leaveAlone && state.leaveAlone.reason !== 'molting') {
      quietWater(d, state, rules, date);
      quietCare(d, s);
    }
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
  decideEnclosureCare(d, s);
  decidePremoltCheck(d, s);
  d.notes.push(...careNotes(s));

  if (d.tasks.length === 0 && d.nextFeed && d.nextFeed > date && blockers.length === 0) {
    d.notes.push({
      code: 'not_due',
      text: `Not due: next meal on ${shortDate(d.nextFeed)}.`,
      dates: [d.nextFeed],
    });
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
    (SIZE_ORDER.includes(line.preySize)
      ? SIZE_ORDER.indexOf(line.preySize)
      : Number.MAX_SAFE_INTEGER);
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
