// Today's round during the day (R18): facts and holds that arrive after it was built withdraw
// feed tasks, give them back, or add an urgent prey removal, at once.
import type { EventKind } from '#shared/domain/event-kinds';
import { localDateOf, type LocalDate } from '#shared/domain/local-dates';
import { decideAnimal, type Reason, type RoundTask } from '#shared/domain/rounds/build-round';
import { feedHoldIn, reconcileTasks } from '#shared/domain/rounds/reconcile-day';
import type { Db } from '../../db/client';
import { rulesOf, type RoundInput } from './round-input';
import { findRound, loadRoundItems, updateItemTasks, upsertUrgentItem } from './rounds.repository';

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

export function createUrgentTasks(db: Db, now: () => Date, input: RoundInput) {
  return {
    /**
     * After new facts or holds during the day, today's built round is brought in line without
     * reshuffling it (reconcileTasks): holds withdraw or give back tasks, and prey left with an
     * animal now molting or in premolt is added as an urgent removal.
     */
    async reconcileToday(collectionId: string, animalIds: string[]) {
      if (!animalIds.length) return;
      const c = await input.collectionOf(collectionId);
      const date = localDateOf(now(), c.timeZone);
      const row = await findRound(db, c.id, date);
      if (!row) return;
      const existing = new Map(
        (await loadRoundItems(db, row.id, animalIds)).map((r) => [r.animal.id, r.item]),
      );
      const outcomes = await input.outcomesByAnimal(c, date, animalIds);
      const rules = rulesOf(c);
      // As the build would see them now: the facts of the days before today only.
      const asBuilt = new Map(
        (await input.engineInput(c, date, animalIds)).map(({ animal, state }) => [
          animal.id,
          decideAnimal(animal, state, rules, date),
        ]),
      );
      for (const { animal, state } of await input.engineInput(c, undefined, animalIds)) {
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
          await upsertUrgentItem(db, {
            roundId: row.id,
            animalId: animal.id,
            sortIndex: item?.sortIndex ?? -1,
            tasks,
            notes: item?.notes ?? d.notes,
            carriedOverDays: item?.carriedOverDays ?? 0,
            addedDuringDay: true,
          });
        } else if (item && changed) {
          await updateItemTasks(db, item.id, tasks);
        }
      }
    },

    /** Whether food is withheld from these animals on a date, and why (a meal then is flagged). */
    async feedHolds(
      collectionId: string,
      animalIds: string[],
      date: LocalDate,
    ): Promise<Map<string, Reason>> {
      const holds = new Map<string, Reason>();
      if (!animalIds.length) return holds;
      const c = await input.collectionOf(collectionId);
      const rules = rulesOf(c);
      for (const { animal, state } of await input.engineInput(c, undefined, animalIds)) {
        const hold = feedHoldIn(decideAnimal(animal, state, rules, date));
        if (hold) holds.set(animal.id, hold);
      }
      return holds;
    },
  };
}
