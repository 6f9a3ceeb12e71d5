// Each day's round is built once and stored: by the scheduled job shortly after local
// midnight, or by the first request of the day, whichever comes first.
import { localDateOf, type LocalDate } from '#shared/domain/local-dates';
import { buildRound, type RoundItem, type RoundTask } from '#shared/domain/rounds/build-round';
import type { BuiltPart } from '#shared/domain/rounds/round-view';
import { postMoltHoldDays } from '#shared/domain/rounds/rules';
import type { RoundResponse } from '#shared/schemas/rounds';
import type { Db } from '../../db/client';
import { rulesOf, toEngineAnimal, type RoundInput } from './round-input';
import {
  claimRound,
  collectionsWithLatestRound,
  findRound,
  insertRoundItems,
  loadRoundItems,
  type RoundCollection,
} from './rounds.repository';

/**
 * Called after a round is built, with the instant its records were read: facts a sync
 * committed while it was being built (their own reconciliation found no round yet) are
 * brought onto it then.
 */
export type AfterBuild = (c: RoundCollection, date: LocalDate, readFrom: Date) => Promise<void>;

export function createRoundBuilder(
  db: Db,
  now: () => Date,
  input: RoundInput,
  afterBuild?: AfterBuild,
) {
  /**
   * Materialises the round for `date` once: the unique (collection, date) row is claimed in
   * the same transaction as the items, so concurrent builders (several server processes, the
   * job and a request) produce exactly one round.
   */
  // Builds in progress in this process, with their reconciliation: a reader arriving meanwhile
  // waits for them rather than reading a round whose late facts are still being applied.
  const building = new Map<string, Promise<{ created: boolean }>>();

  function build(c: RoundCollection, date: LocalDate): Promise<{ created: boolean }> {
    const key = `${c.id}|${date}`;
    const running = building.get(key);
    if (running) return running.then(() => ({ created: false }));
    const started = buildOnce(c, date).finally(() => building.delete(key));
    building.set(key, started);
    return started;
  }

  async function buildOnce(c: RoundCollection, date: LocalDate): Promise<{ created: boolean }> {
    if (await findRound(db, c.id, date)) return { created: false };
    const readFrom = now();
    const round = buildRound(await input.engineInput(c, date), rulesOf(c), date);
    const result = await db.transaction(async (tx) => {
      const roundId = await claimRound(tx, c.id, date, round.prepList);
      if (!roundId) return { created: false };
      await insertRoundItems(
        tx,
        roundId,
        round.items.map((item, i) => ({
          animalId: item.animal.id,
          sortIndex: i,
          tasks: item.tasks,
          notes: item.notes,
          carriedOverDays: item.carriedOverDays,
        })),
      );
      return { created: true };
    });
    if (result.created) await afterBuild?.(c, date, readFrom);
    return result;
  }

  /** The built part of a day's round (built now if need be): what changes with the records. */
  async function builtPart(c: RoundCollection, date: LocalDate): Promise<BuiltPart> {
    await building.get(`${c.id}|${date}`);
    let row = await findRound(db, c.id, date);
    if (!row) {
      await build(c, date);
      row = (await findRound(db, c.id, date))!;
    }
    const rules = rulesOf(c);
    const items = (await loadRoundItems(db, row.id)).map((r) => {
      const animal = toEngineAnimal(r, c.timeZone, false);
      return {
        animal,
        tasks: r.item.tasks as RoundTask[],
        notes: r.item.notes as RoundItem['notes'],
        carriedOverDays: r.item.carriedOverDays,
        addedDuringDay: r.item.addedDuringDay,
        postMoltHoldDays: postMoltHoldDays(rules, animal),
      };
    });
    return { builtAt: row.builtAt, prepList: row.prepList as RoundResponse['prepList'], items };
  }

  /**
   * The scheduled job: every collection whose local day has begun without a round gets it
   * built. Runs every few minutes, so "shortly after local midnight" in every zone, DST too.
   */
  async function buildDueRounds(
    onFailure?: (collectionId: string, err: unknown) => void,
  ): Promise<string[]> {
    const built: string[] = [];
    const failed: unknown[] = [];
    for (const c of await collectionsWithLatestRound(db)) {
      // One collection's bad data (a broken rule, a zone that no longer exists) must not
      // keep every collection after it without a round: it is reported and the job goes on.
      try {
        const today = localDateOf(now(), c.timeZone);
        if (c.latest && c.latest >= today) continue;
        if ((await build(await input.collectionOf(c.id), today)).created) built.push(c.id);
      } catch (err) {
        if (onFailure) onFailure(c.id, err);
        else failed.push(err);
      }
    }
    if (failed.length)
      throw new AggregateError(
        failed,
        `${failed.length} collection(s) could not have their round built.`,
      );
    return built;
  }

  return { build, builtPart, buildDueRounds };
}
