// Today's round during the day (R18): facts and holds that arrive after it was built withdraw
// feed tasks, give them back, or add an urgent prey removal, at once.
import type { EventKind } from '#shared/domain/event-kinds';
import { addDays, localDateOf, startOfLocalDate, type LocalDate } from '#shared/domain/local-dates';
import { decideAnimal, type Reason, type RoundTask } from '#shared/domain/rounds/build-round';
import { feedHoldIn, reconcileTasks } from '#shared/domain/rounds/reconcile-day';
import { batchMemo, type BatchMemo } from '../../batch-memo';
import type { Db } from '../../db/client';
import { eventLogsOf } from '../events/projection';
import { rulesOf, type RoundInput } from './round-input';
import {
  doNotFeedNotes,
  loadAnimalsWithState,
  roundWithItemsOf,
  updateItemsTasks,
  upsertUrgentItems,
  type NewRoundItem,
} from './rounds.repository';

/**
 * Facts that change today's round during the day: prey left with an animal that is (or turns
 * out to be) in premolt or molting must come out at once, and a hold that begins withdraws the
 * open feed task (R18); an undo may lift one.
 */
export const SAME_DAY_TRIGGERS: readonly EventKind[] = [
  'prey_left_in',
  'premolt_seen',
  'molting_now',
  'molted',
  'sac_laid',
  'sac_pulled',
  'premolt_cleared',
  'void',
];

/**
 * The animals whose newly recorded facts may change today's round: same-day triggers, and any
 * fact from an earlier day (a phone's taps from days without signal arrive after today's round
 * was built from the records it had).
 */
export function animalsToReconcile(
  recorded: readonly { animalId: string; kind: EventKind; effectiveAt: Date }[],
  zone: string,
  today: LocalDate,
): string[] {
  return [
    ...new Set(
      recorded
        .filter(
          (e) => SAME_DAY_TRIGGERS.includes(e.kind) || localDateOf(e.effectiveAt, zone) < today,
        )
        .map((e) => e.animalId),
    ),
  ];
}

/**
 * The first date of the do-not-feed notes that may hold food today in any zone (none is more
 * than a day from UTC), read before the collection's zone is known: `engineInputOf` keeps
 * those that run on or after the collection's today.
 */
const notesFrom = (now: Date): LocalDate => addDays(localDateOf(now, 'UTC'), -1);

export function createUrgentTasks(db: Db, now: () => Date, input: RoundInput) {
  // The collection (zone, rules) is read once per batch (`batch`), or per call when the
  // caller has none. What a sync batch itself changes, or what may change under it (a
  // do-not-feed note whose own reconciliation runs meanwhile), is read where it is used.
  const collection = (batch: BatchMemo, collectionId: string) =>
    batch.once(`rounds:collection:${collectionId}`, () => input.collectionOf(collectionId));

  return {
    /**
     * After new facts or holds during the day, today's built round is brought in line without
     * reshuffling it (reconcileTasks): holds withdraw or give back tasks, and prey left with an
     * animal now molting or in premolt is added as an urgent removal.
     */
    async reconcileToday(collectionId: string, animalIds: string[], batch = batchMemo()) {
      if (!animalIds.length) return;
      const c = await collection(batch, collectionId);
      const date = localDateOf(now(), c.timeZone);
      // Read after the facts were committed, at once: the round and these animals' items, the
      // animals as they stand, their logs before today (the build's view), the day's outcomes
      // that settle tasks and the do-not-feed notes. Without a round the rest goes unused.
      const [round, rows, logs, outcomes, held] = await Promise.all([
        roundWithItemsOf(db, c.id, date, animalIds),
        loadAnimalsWithState(db, c.id, animalIds),
        eventLogsOf(db, animalIds, startOfLocalDate(date, c.timeZone)),
        input.settlingOutcomesByAnimal(c, date, animalIds),
        doNotFeedNotes(db, c.id, date),
      ]);
      if (!round) return;
      const existing = new Map(round.items.map((item) => [item.animalId, item]));
      const rules = rulesOf(c);
      // As the build would see them now: the facts of the days before today only.
      const asBuilt = new Map(
        input
          .engineInputOf(c, rows, held, date, logs)
          .map(({ animal, state }) => [animal.id, decideAnimal(animal, state, rules, date)]),
      );
      const urgentItems: NewRoundItem[] = [];
      const changedItems: { id: string; tasks: RoundTask[] }[] = [];
      for (const { animal, state } of input.engineInputOf(c, rows, held)) {
        const d = decideAnimal(animal, state, rules, date);
        const item = existing.get(animal.id);
        const { tasks, changed, urgent } = reconcileTasks(
          (item?.tasks as RoundTask[] | undefined) ?? [],
          d,
          state,
          outcomes.get(animal.id) ?? [],
          date,
          asBuilt.get(animal.id),
        );
        if (urgent) {
          urgentItems.push({
            roundId: round.roundId,
            animalId: animal.id,
            sortIndex: item?.sortIndex ?? -1,
            tasks,
            notes: item?.notes ?? d.notes,
            carriedOverDays: item?.carriedOverDays ?? 0,
            addedDuringDay: true,
          });
        } else if (item && changed) {
          changedItems.push({ id: item.id, tasks });
        }
      }
      await upsertUrgentItems(db, urgentItems);
      await updateItemsTasks(db, changedItems);
    },

    /** Whether food is withheld from these animals on a date, and why (a meal then is flagged). */
    async feedHolds(
      collectionId: string,
      animalIds: string[],
      date: LocalDate,
      batch = batchMemo(),
    ): Promise<Map<string, Reason>> {
      const holds = new Map<string, Reason>();
      if (!animalIds.length) return holds;
      const [c, rows, held] = await Promise.all([
        collection(batch, collectionId),
        loadAnimalsWithState(db, collectionId, animalIds),
        doNotFeedNotes(db, collectionId, notesFrom(now())),
      ]);
      const rules = rulesOf(c);
      for (const { animal, state } of input.engineInputOf(c, rows, held)) {
        const hold = feedHoldIn(decideAnimal(animal, state, rules, date));
        if (hold) holds.set(animal.id, hold);
      }
      return holds;
    },
  };
}
