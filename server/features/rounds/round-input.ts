// What the round engine decides from: the collection (zone, rules), each animal with its
// projected state and holds, and the day's outcomes.
import { addDays, localDateOf, startOfLocalDate, type LocalDate } from '#shared/domain/local-dates';
import {
  EMPTY_STATE,
  projectState,
  type AnimalState,
  type EngineEvent,
} from '#shared/domain/rounds/animal-state';
import type { EngineAnimal } from '#shared/domain/rounds/build-round';
import { effectiveRules, type RoundRules, type RulesOverride } from '#shared/domain/rounds/rules';
import type { DayOutcome } from '#shared/domain/rounds/settle';
import type { Db } from '../../db/client';
import { HttpError } from '../../middleware/errors';
import { toAnimalSummary } from '../animals/animal-summary';
import { eventLogsOf } from '../events/projection';
import {
  doNotFeedNotes,
  findCollection,
  loadAnimalsWithState,
  loadOutcomes,
  loadSettlingOutcomes,
  type AnimalRow,
  type RoundCollection,
} from './rounds.repository';

export const rulesOf = (c: RoundCollection): RoundRules => effectiveRules(c.rules as RulesOverride);

/** `withAddedOn`: the join date only matters for an animal never fed, and costs a zone lookup. */
export function toEngineAnimal(
  row: Pick<AnimalRow, 'animal' | 'location'>,
  zone: string,
  withAddedOn = true,
): EngineAnimal {
  return {
    ...toAnimalSummary(row.animal, row.location),
    addedOn: withAddedOn ? localDateOf(row.animal.createdAt, zone) : null,
  };
}

/** Animals whose stored state holds events on or after `before`: the log gives their state then. */
function staleFor(c: RoundCollection, rows: readonly AnimalRow[], before?: LocalDate): string[] {
  const cutoff = before ? startOfLocalDate(before, c.timeZone) : null;
  return rows
    .filter((r) => cutoff && r.lastEventAt && r.lastEventAt >= cutoff)
    .map((r) => r.animal.id);
}

export function createRoundInput(db: Db, now: () => Date) {
  async function collectionOf(collectionId: string): Promise<RoundCollection> {
    const c = await findCollection(db, collectionId);
    if (!c) throw new HttpError(404, 'not_found', 'We could not find that collection.');
    return c;
  }

  /**
   * Engine input for a collection. With `before`, states reflect only events before that
   * local date: animals with an event on or after it are re-folded from the log.
   */
  async function engineInput(c: RoundCollection, before?: LocalDate, animalIds?: string[]) {
    const rows = await loadAnimalsWithState(db, c.id, animalIds);
    const logs = await eventLogsOf(
      db,
      staleFor(c, rows, before),
      before ? startOfLocalDate(before, c.timeZone) : undefined,
    );
    const notes = await doNotFeedNotes(db, c.id, before ?? localDateOf(now(), c.timeZone));
    return engineInputOf(c, rows, notes, before, logs);
  }

  /**
   * `engineInput` from rows already loaded: `notes` may run from an earlier date (they are
   * read from `before`, or today, here), and `logs` must hold every animal `staleFor` names.
   */
  function engineInputOf(
    c: RoundCollection,
    rows: readonly AnimalRow[],
    notes: readonly { animalId: string; until: LocalDate }[],
    before?: LocalDate,
    logs?: ReadonlyMap<string, EngineEvent[]>,
  ) {
    const from = before ?? localDateOf(now(), c.timeZone);
    const stale = new Set(staleFor(c, rows, before));
    // A handover note "do not feed during the cover" holds feeding through its last day.
    const holds = new Map(
      notes.filter((h) => h.until >= from).map((h) => [h.animalId, addDays(h.until, 1)]),
    );
    return rows.map((r) => {
      const log = stale.has(r.animal.id) ? logs?.get(r.animal.id) : undefined;
      if (stale.has(r.animal.id) && !log)
        throw new Error(`engineInputOf: no log loaded for ${r.animal.id}, whose state is newer`);
      const state = log
        ? projectState(log, c.timeZone, before)
        : ((r.state as AnimalState | null) ?? EMPTY_STATE);
      const animal = toEngineAnimal(r, c.timeZone, state.lastMeal === null);
      const hold = holds.get(r.animal.id);
      if (hold && (!animal.doNotFeedUntil || hold > animal.doNotFeedUntil)) {
        animal.doNotFeedUntil = hold;
        animal.doNotFeedBy = 'handover';
      }
      return { animal, state };
    });
  }

  /** A day's outcomes, with who recorded them, by animal. */
  async function outcomesByAnimal(c: RoundCollection, date: LocalDate, animalIds?: string[]) {
    const rows = await loadOutcomes(
      db,
      c.id,
      startOfLocalDate(date, c.timeZone),
      startOfLocalDate(addDays(date, 1), c.timeZone),
      animalIds,
    );
    return outcomesOf(rows);
  }

  /**
   * For settling tasks only (reconcileTasks): per animal, the first standing outcome of each
   * kind of the day, which settles exactly the tasks all of its outcomes would.
   */
  async function settlingOutcomesByAnimal(
    c: RoundCollection,
    date: LocalDate,
    animalIds: string[],
  ) {
    return outcomesOf(
      await loadSettlingOutcomes(
        db,
        c.id,
        startOfLocalDate(date, c.timeZone),
        startOfLocalDate(addDays(date, 1), c.timeZone),
        animalIds,
      ),
    );
  }

  return { collectionOf, engineInput, engineInputOf, outcomesByAnimal, settlingOutcomesByAnimal };
}
export type RoundInput = ReturnType<typeof createRoundInput>;

/** Outcome rows (`loadOutcomes`) as the round settles them, by animal. */
export function outcomesOf(
  rows: readonly {
    id: string;
    animalId: string;
    kind: string;
    effectiveAt: Date;
    targetId: string | null;
    by: string | null;
  }[],
) {
  const map = new Map<string, DayOutcome[]>();
  for (const r of rows) {
    const outcome: DayOutcome = {
      eventId: r.id,
      kind: r.kind as DayOutcome['kind'],
      at: r.effectiveAt.toISOString(),
      by: r.by,
      voids: r.targetId,
    };
    const list = map.get(r.animalId);
    if (list) list.push(outcome);
    else map.set(r.animalId, [outcome]);
  }
  return map;
}
