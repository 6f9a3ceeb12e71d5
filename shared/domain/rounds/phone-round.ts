// A day's round built on the phone with no signal (decision 015): the same engine and the same
// view as the server's, from the state the phone was last sent plus the taps it has queued since.
import type { RoundResponse } from '../../schemas/rounds';
import { localDateOf, type LocalDate } from '../local-dates';
import { applyEvent, compareEvents, type AnimalState, type EngineEvent } from './animal-state';
import type { EngineAnimal } from './build-round';
import { unbuiltRound } from './round-view';
import { effectiveRules, type RulesOverride } from './rules';
import type { DayOutcome } from './settle';
import { tapOutcome, type QueuedTap } from './tap-outcome';

export { tapOutcome, type QueuedTap };

/** What the phone keeps of the server's engine input (the API's `engineInputResponse`). */
export interface PhoneEngineInput {
  timeZone: string;
  /** The collection's local date when the server answered: the state covers that day so far. */
  date: LocalDate;
  rules: RulesOverride;
  animals: readonly { animal: EngineAnimal; state: AnimalState }[];
}

const engineEventOf = (e: QueuedTap['event']): EngineEvent => ({
  id: e.id,
  kind: e.kind,
  effectiveAt: e.clientRecordedAt,
  payload: e.payload,
});

/**
 * The engine's input for `date`: each state with the queued taps of the days before it folded
 * in, in the order the server folds them. An undo among the queued taps cancels its tap here as
 * on the server; an undo of a fact the server already holds cannot be unfolded from a state, so
 * it shows when the server's round replaces the phone's (decision 015).
 */
export function inputForDate(
  input: PhoneEngineInput,
  taps: readonly QueuedTap[],
  date: LocalDate,
): { animal: EngineAnimal; state: AnimalState }[] {
  const zone = input.timeZone;
  const voided = new Set(
    taps
      .filter((t) => t.event.kind === 'void')
      .map((t) => t.event.payload.targetId)
      .filter((id): id is string => typeof id === 'string'),
  );
  const before = new Map<string, EngineEvent[]>();
  for (const { event } of taps) {
    if (event.kind === 'void' || voided.has(event.id)) continue;
    if (localDateOf(new Date(event.clientRecordedAt), zone) >= date) continue;
    const list = before.get(event.animalId);
    if (list) list.push(engineEventOf(event));
    else before.set(event.animalId, [engineEventOf(event)]);
  }
  return input.animals.map(({ animal, state }) => {
    const events = before.get(animal.id);
    if (!events) return { animal, state };
    let s = state;
    for (const e of events.sort(compareEvents)) s = applyEvent(s, e, zone);
    return { animal, state: s };
  });
}

/** The day's queued taps as outcomes by animal, in the order they were made. */
export function outcomesOnDate(
  taps: readonly QueuedTap[],
  zone: string,
  date: LocalDate,
): Map<string, DayOutcome[]> {
  const map = new Map<string, DayOutcome[]>();
  const onDay = taps
    .filter((t) => localDateOf(new Date(t.event.clientRecordedAt), zone) === date)
    .sort((a, b) => compareEvents(engineEventOf(a.event), engineEventOf(b.event)));
  for (const t of onDay) {
    const list = map.get(t.event.animalId);
    const outcome = tapOutcome(t.event, t.byName);
    if (list) list.push(outcome);
    else map.set(t.event.animalId, [outcome]);
  }
  return map;
}

/**
 * The round for `date` as the phone builds it: the engine run on the stored state with the
 * earlier queued taps folded in; with `withOutcomes` (a day being walked, not a preview), that
 * day's own taps settle its tasks as the server's outcomes would.
 */
export function phoneRound(
  input: PhoneEngineInput,
  taps: readonly QueuedTap[],
  date: LocalDate,
  withOutcomes: boolean,
): RoundResponse {
  return unbuiltRound(
    input.timeZone,
    date,
    inputForDate(input, taps, date),
    effectiveRules(input.rules),
    withOutcomes ? outcomesOnDate(taps, input.timeZone, date) : new Map(),
  );
}
