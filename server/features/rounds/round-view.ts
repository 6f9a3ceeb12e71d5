// A round as the API answers it: each built item settled by the day's outcomes (pure).
import type { LocalDate } from '#shared/domain/local-dates';
import type { EngineAnimal, RoundItem, RoundTask } from '#shared/domain/rounds/build-round';
import { progressOf, settleItem, type DayOutcome } from '#shared/domain/rounds/settle';
import type { RoundItemView, RoundResponse } from '#shared/schemas/rounds';

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
