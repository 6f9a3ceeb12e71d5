import { addDays, localDateOf, type LocalDate } from '#shared/domain/local-dates';
import { decideAnimal, type RoundTask } from '#shared/domain/rounds/build-round';
import { roundView, unbuiltRound, type BuiltPart } from '#shared/domain/rounds/round-view';
import {
  engineAnimalOf,
  type EngineInputResponse,
  type RoundResponse,
  type ScheduleResponse,
} from '#shared/schemas/rounds';
import type { Db } from '../../db/client';
import { HttpError } from '../../middleware/errors';
import { createRoundBuilder } from './build-days';
import { createRoundJson, LatestByKey, serialiseRound, type SerialisedRound } from './round-cache';
import { createRoundInput, rulesOf } from './round-input';
import {
  animalsWithEventsSince,
  findRound,
  loadRoundItems,
  type RoundCollection,
} from './rounds.repository';
import { createRulesService } from './rules.service';
import { createUrgentTasks } from './urgent-tasks';

/**
 * Rounds: built once a day (build-days.ts), read many times a day (cached for today), brought
 * in line during the day by facts and holds (urgent-tasks.ts), and the rules behind them.
 */
export function createRoundsService(db: Db, now: () => Date) {
  const input = createRoundInput(db, now);
  const urgent = createUrgentTasks(db, now, input);
  // A sync received up to a minute before the build read the records may have committed after
  // that read, with no round yet to reconcile: its animals are brought in line now.
  const builder = createRoundBuilder(db, now, input, async (c, date, readFrom) => {
    if (date !== localDateOf(now(), c.timeZone)) return;
    const since = new Date(readFrom.getTime() - 60_000);
    await urgent.reconcileToday(c.id, await animalsWithEventsSince(db, c.id, since));
  });
  const roundJson = createRoundJson();
  const today = (c: { timeZone: string }): LocalDate => localDateOf(now(), c.timeZone);

  async function roundFor(c: RoundCollection, date: LocalDate): Promise<RoundResponse> {
    return roundView(
      c.timeZone,
      date,
      await builder.builtPart(c, date),
      await input.outcomesByAnimal(c, date),
    );
  }

  /** Tomorrow as things stand now (not materialised: today's outcomes still change it). */
  async function tomorrowPreview(collectionId: string): Promise<RoundResponse> {
    const c = await input.collectionOf(collectionId);
    return unbuiltRound(c.timeZone, addDays(today(c), 1), await input.engineInput(c), rulesOf(c));
  }

  /**
   * What the phone needs to build a day itself with no signal: each animal as the engine sees
   * it now (today's records and handover holds included) and the rules as stored — the phone
   * merges them with the defaults exactly as `rulesOf` does.
   */
  async function engineInputFor(collectionId: string): Promise<EngineInputResponse> {
    const c = await input.collectionOf(collectionId);
    return {
      collectionId: c.id,
      timeZone: c.timeZone,
      date: today(c),
      asOf: now().toISOString(),
      rules: (c.rules ?? {}) as EngineInputResponse['rules'],
      // Animals no longer in the collection are never on a round (R12): not worth the space.
      animals: (await input.engineInput(c))
        .filter(({ animal }) => animal.status === 'active')
        .map(({ animal, state }) => ({ animal: engineAnimalOf(animal), state })),
    };
  }

  // Today's round per collection, kept while the collection's change counters stand still:
  // the built part across new events, the serialised whole until anything changes.
  // At most 32 collections each (a 500-animal round is ~2 MB with its parts and JSON), well
  // within the server's 160 MB heap (scripts/lib/server-flags.mjs); others are rebuilt on use.
  const builtParts = new LatestByKey<BuiltPart>(32);
  const serialised = new LatestByKey<SerialisedRound>(32);
  // Settings and time zone change only with the records counter.
  const collectionCache = new LatestByKey<RoundCollection>(500);

  return {
    today,

    async build(collectionId: string, date: LocalDate): Promise<{ created: boolean }> {
      return builder.build(await input.collectionOf(collectionId), date);
    },

    buildDueRounds: builder.buildDueRounds,

    /** The round for a date as it stands: built items, settled by the day's outcomes. */
    async round(collectionId: string, date: LocalDate): Promise<RoundResponse> {
      return roundFor(await input.collectionOf(collectionId), date);
    },

    /** Today's round as JSON bytes with an ETag, shared by every request until it changes. */
    async todayRoundSerialised(
      collectionId: string,
      revision: { records: number; events: number },
    ): Promise<SerialisedRound> {
      // The counters come first (the membership check read them): whatever is loaded after
      // them is at least as new as they say.
      const c = await collectionCache.get(collectionId, String(revision.records), () =>
        input.collectionOf(collectionId),
      );
      const date = today(c);
      const partKey = `${date}|${revision.records}`;
      const key = `${collectionId}|${partKey}|${revision.events}`;
      return serialised.get(collectionId, key, async () => {
        const part = await builtParts.get(collectionId, partKey, () => builder.builtPart(c, date));
        return serialiseRound(
          key,
          roundJson(c.timeZone, date, part, await input.outcomesByAnimal(c, date)),
        );
      });
    },

    async todayRound(collectionId: string) {
      const c = await input.collectionOf(collectionId);
      return roundFor(c, today(c));
    },

    tomorrowPreview,
    engineInputFor,

    /** The feed task's offer per animal on a date's round (what a meal took from a colony). */
    async offersOn(collectionId: string, date: LocalDate, animalIds: string[]) {
      const offers = new Map<string, NonNullable<RoundTask['offer']>>();
      const row = animalIds.length ? await findRound(db, collectionId, date) : null;
      if (!row) return offers;
      for (const { item } of await loadRoundItems(db, row.id, animalIds)) {
        const feed = (item.tasks as RoundTask[]).find((t) => t.kind === 'feed' && t.offer);
        if (feed?.offer) offers.set(item.animalId, feed.offer);
      }
      return offers;
    },

    async prepList(collectionId: string, date: LocalDate) {
      const c = await input.collectionOf(collectionId);
      const now = today(c);
      if (date === now) return (await roundFor(c, date)).prepList;
      if (date === addDays(now, 1)) return (await tomorrowPreview(c.id)).prepList;
      const row = await findRound(db, c.id, date);
      if (!row)
        throw new HttpError(
          404,
          'no_round',
          'There is no round for that date. Prep lists exist for past rounds, today and tomorrow.',
        );
      return row.prepList as RoundResponse['prepList'];
    },

    /**
     * Why an animal is (or is not) on today's round, with its next due dates — from the same
     * state the engine keeps, including today's facts (a meal or a molt recorded this morning),
     * so the animal's page never contradicts the round.
     */
    async schedule(collectionId: string, animalId: string): Promise<ScheduleResponse> {
      const c = await input.collectionOf(collectionId);
      const date = today(c);
      const [animal] = await input.engineInput(c, undefined, [animalId]);
      if (!animal) throw new HttpError(404, 'not_found', 'We could not find that animal.');
      const d = decideAnimal(animal.animal, animal.state, rulesOf(c), date);
      const row = await findRound(db, c.id, date);
      const [item] = row ? await loadRoundItems(db, row.id, [animalId]) : [];
      return {
        date,
        onRound: item ? true : d.tasks.length > 0,
        tasks: d.tasks,
        notes: d.notes,
        nextFeed: d.nextFeed,
        nextWater: d.nextWater,
      };
    },

    ...urgent,
    ...createRulesService(db, input),
  };
}

export type RoundsService = ReturnType<typeof createRoundsService>;
