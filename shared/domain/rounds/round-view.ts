// A round as the API answers it: each built item settled by the day's outcomes (pure).
import type { RoundItemView, RoundResponse } from '../../schemas/rounds';
import type { LocalDate } from '../local-dates';
import type { AnimalState } from './animal-state';
import { buildRound, type EngineAnimal, type RoundItem, type RoundTask } from './build-round';
import { postMoltHoldDays, type RoundRules } from './rules';
import { progressOf, settleItem, type DayOutcome } from './settle';

/** One item as built (stored, or worked out for tomorrow), before the day's outcomes. */
export type ViewInput = {
  animal: EngineAnimal;
  tasks: RoundTask[];
  notes: RoundItem['notes'];
  carriedOverDays: number;
  addedDuringDay: boolean;
  postMoltHoldDays: number;
};

/** The stored part of a day's round: what changes with the records, not with the taps. */
export interface BuiltPart {
  builtAt: Date | null;
  prepList: RoundResponse['prepList'];
  items: ViewInput[];
}

/** What the round shows of an animal: enough to find it and handle it safely. */
function animalView(a: EngineAnimal): RoundItemView['animal'] {
  const { id, labelCode, name, scientificName, group, lifeStage, sex, cautions, location } = a;
  return {
    id,
    labelCode,
    name,
    scientificName,
    group,
    lifeStage,
    sex,
    cautions,
    location: location ?? null,
  };
}

export function viewItem(zone: string, item: ViewInput, outcomes: DayOutcome[]): RoundItemView {
  const settled = settleItem(item.tasks, outcomes, zone, item.postMoltHoldDays);
  return {
    animal: animalView(item.animal),
    tasks: settled.tasks,
    notes: item.notes,
    carriedOverDays: item.carriedOverDays,
    addedDuringDay: item.addedDuringDay,
    outcomes: settled.outcomes,
    warnings: settled.warnings,
    postMoltHoldDays: item.postMoltHoldDays,
  };
}

export function roundView(
  zone: string,
  date: LocalDate,
  part: BuiltPart,
  outcomes: Map<string, DayOutcome[]>,
): RoundResponse {
  const items = part.items.map((item) => viewItem(zone, item, outcomes.get(item.animal.id) ?? []));
  return {
    date,
    timeZone: zone,
    builtAt: part.builtAt?.toISOString() ?? null,
    items,
    prepList: part.prepList,
    progress: progressOf(items),
  };
}

/**
 * A day's round worked out from the engine's input and not stored: tomorrow's preview on the
 * server, and a day the phone builds itself when it has no signal. One function for both, so
 * the two cannot drift apart (issue: days without signal, point 5).
 */
export function unbuiltRound(
  zone: string,
  date: LocalDate,
  animals: readonly { animal: EngineAnimal; state: AnimalState }[],
  rules: RoundRules,
  outcomes: Map<string, DayOutcome[]> = new Map(),
): RoundResponse {
  const round = buildRound(animals, rules, date);
  const items = round.items.map((i) => ({
    ...i,
    addedDuringDay: false,
    postMoltHoldDays: postMoltHoldDays(rules, i.animal),
  }));
  return roundView(zone, date, { builtAt: null, prepList: round.prepList, items }, outcomes);
}
