import { and, eq, gte } from 'drizzle-orm';
import type { NodePgDatabase } from 'drizzle-orm/node-postgres';
import {
  addDays,
  localDateOf,
  startOfLocalDate,
  type LocalDate,
} from '../../../shared/domain/local-dates';
import {
  EMPTY_STATE,
  projectState,
  type AnimalState,
} from '../../../shared/domain/rounds/animal-state';
import {
  buildRound,
  decideAnimal,
  FEED_HOLD_CODES,
  type AnimalDecision,
  type EngineAnimal,
  type Reason,
  type RoundItem,
  type RoundTask,
} from '../../../shared/domain/rounds/build-round';
import {
  effectiveRules,
  postMoltHoldDays,
  type RoundRules,
  type RulesOverride,
} from '../../../shared/domain/rounds/rules';
import {
  liveOutcomes,
  progressOf,
  settleItem,
  settlingOutcome,
  type DayOutcome,
} from '../../../shared/domain/rounds/settle';
import type {
  RoundItemView,
  RoundResponse,
  ScheduleResponse,
} from '../../../shared/schemas/rounds';
import { handoverNotes } from '../../db/schema/animals';
import { HttpError } from '../../middleware/errors';
import { toAnimalSummary } from '../animals/animal-summary';
import { refoldStates } from '../events/projection';
import { loadEventsOf } from '../events/projection.repository';
import { LatestByKey, serialiseRound, type SerialisedRound } from './round-cache';
import {
  claimRound,
  collectionsWithLatestRound,
  findCollection,
  findRound,
  insertRoundItems,
  updateCollectionRules,
  loadAnimalsWithState,
  loadOutcomes,
  loadRoundItems,
  updateItemTasks,
  upsertUrgentItem,
  type AnimalRow,
} from './rounds.repository';

type Collection = NonNullable<Awaited<ReturnType<typeof findCollection>>>;

/** `withAddedOn`: the join date only matters for an animal never fed, and costs a zone lookup. */
function toEngineAnimal(row: AnimalRow, zone: string, withAddedOn = true): EngineAnimal {
  return {
    ...toAnimalSummary(row.animal, row.location),
    addedOn: withAddedOn ? localDateOf(row.animal.createdAt, zone) : null,
  };
}

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

/**
 * Facts that change today's round during the day: prey left with an animal that is (or turns
 * out to be) in premolt or molting must come out at once, and a hold that begins withdraws the
 * open feed task (R18); an undo may lift one.
 */
export const SAME_DAY_TRIGGERS: readonly string[] = ['prey_left_in', 'premolt_seen', 'molting_now', 'molted', 'sac_laid', 'sac_pulled', 'premolt_cleared', 'void'];

/** The first reason the engine withholds food from an animal today, if any. */
function holdOf(d: AnimalDecision): Reason | null {
  const leaveAlone = d.tasks.find((t) => t.kind === 'leave_alone')?.reasons[0];
  return leaveAlone ?? d.notes.find((n) => FEED_HOLD_CODES.has(n.code)) ?? null;
}

export function createRoundsService(db: NodePgDatabase, now: () => Date) {
  async function collectionOf(collectionId: string): Promise<Collection> {
    const c = await findCollection(db, collectionId);
    if (!c) throw new HttpError(404, 'not_found', 'We could not find that collection.');
    return c;
  }
  const rulesOf = (c: Collection): RoundRules => effectiveRules(c.rules as RulesOverride);

  /**
   * Engine input for a collection. With `before`, states reflect only events before that
   * local date: animals with an event on or after it are re-folded from the log.
   */
  async function engineInput(c: Collection, before?: LocalDate, animalIds?: string[]) {
    const rows = await loadAnimalsWithState(db, c.id, animalIds);
    const cutoff = before ? startOfLocalDate(before, c.timeZone) : null;
    const stale = rows
      .filter((r) => cutoff && r.lastEventAt && r.lastEventAt >= cutoff)
      .map((r) => r.animal.id);
    const logs = await loadEventsOf(db, stale);
    // A handover note "do not feed during the cover" holds feeding through its last day.
    const holds = new Map(
      (await db
        .select({ animalId: handoverNotes.animalId, until: handoverNotes.until })
        .from(handoverNotes)
        .where(and(eq(handoverNotes.collectionId, c.id), eq(handoverNotes.doNotFeed, true), gte(handoverNotes.until, before ?? localDateOf(now(), c.timeZone))))
      ).map((h) => [h.animalId, addDays(h.until, 1)]),
    );
    return rows.map((r) => {
      const state = logs.has(r.animal.id)
        ? projectState(logs.get(r.animal.id)!, c.timeZone, before)
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

  async function outcomesByAnimal(c: Collection, date: LocalDate, animalIds?: string[]) {
    const rows = await loadOutcomes(
      db,
      c.id,
      startOfLocalDate(date, c.timeZone),
      startOfLocalDate(addDays(date, 1), c.timeZone),
      animalIds,
    );
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

  type ViewInput = {
    animal: EngineAnimal;
    tasks: RoundTask[];
    notes: RoundItem['notes'];
    carriedOverDays: number;
    addedDuringDay: boolean;
    postMoltHoldDays: number;
  };

  function viewItem(c: Collection, item: ViewInput, outcomes: DayOutcome[]): RoundItemView {
    const settled = settleItem(item.tasks, outcomes, c.timeZone, item.postMoltHoldDays);
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

  function view(
    c: Collection,
    date: LocalDate,
    builtAt: Date | null,
    items: ViewInput[],
    prepList: RoundResponse['prepList'],
    outcomes: Map<string, DayOutcome[]>,
  ): RoundResponse {
    const viewItems = items.map((item) => viewItem(c, item, outcomes.get(item.animal.id) ?? []));
    return {
      date,
      timeZone: c.timeZone,
      builtAt: builtAt?.toISOString() ?? null,
      items: viewItems,
      prepList,
      progress: progressOf(viewItems),
    };
  }

  // Each built item's view and its JSON, kept while its outcomes (and who recorded them) stand:
  // after a tap only the tapped animals' items are settled and serialised again.
  const itemJson = new WeakMap<ViewInput, { signature: string; view: RoundItemView; json: string }>();

  /** The same JSON as `JSON.stringify(view(...))`, reusing unchanged items' text. */
  function viewJson(c: Collection, date: LocalDate, part: Awaited<ReturnType<typeof builtPart>>, outcomes: Map<string, DayOutcome[]>): string {
    const entries = part.items.map((item) => {
      const own = outcomes.get(item.animal.id) ?? [];
      const signature = own.map((o) => `${o.eventId}:${o.by ?? ''}`).join(',');
      let entry = itemJson.get(item);
      if (entry?.signature !== signature) {
        const v = viewItem(c, item, own);
        entry = { signature, view: v, json: JSON.stringify(v) };
        itemJson.set(item, entry);
      }
      return entry;
    });
    const head = { date, timeZone: c.timeZone, builtAt: part.builtAt?.toISOString() ?? null };
    const tail = { prepList: part.prepList, progress: progressOf(entries.map((e) => e.view)) };
    return `${JSON.stringify(head).slice(0, -1)},"items":[${entries.map((e) => e.json).join(',')}],${JSON.stringify(tail).slice(1)}`;
  }

  async function buildFor(c: Collection, date: LocalDate): Promise<{ created: boolean }> {
    if (await findRound(db, c.id, date)) return { created: false };
    const round = buildRound(await engineInput(c, date), rulesOf(c), date);
    return db.transaction(async (tx) => {
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
  }

  /** The built part of a day's round (built now if need be): what changes with the records. */
  async function builtPart(c: Collection, date: LocalDate) {
    let row = await findRound(db, c.id, date);
    if (!row) {
      await buildFor(c, date);
      row = (await findRound(db, c.id, date))!;
    }
    const rules = rulesOf(c);
    const items = (await loadRoundItems(db, row.id)).map((r) => {
      const animal = toEngineAnimal(
        { animal: r.animal, location: r.location, state: null, lastEventAt: null },
        c.timeZone,
        false,
      );
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

  async function roundFor(c: Collection, date: LocalDate): Promise<RoundResponse> {
    const part = await builtPart(c, date);
    return view(c, date, part.builtAt, part.items, part.prepList, await outcomesByAnimal(c, date));
  }

  // Today's round per collection, kept while the collection's change counters stand still:
  // the built part across new events, the serialised whole until anything changes.
  // At most 32 collections each (a 500-animal round is ~2 MB with its parts and JSON), well
  // within the server's 160 MB heap (scripts/lib/server-flags.mjs); others are rebuilt on use.
  const builtParts = new LatestByKey<Awaited<ReturnType<typeof builtPart>>>(32);
  const serialised = new LatestByKey<SerialisedRound>(32);
  // Settings and time zone change only with the records counter.
  const collectionCache = new LatestByKey<Collection>(500);

  const service = {
    today(c: { timeZone: string }): LocalDate {
      return localDateOf(now(), c.timeZone);
    },

    /** Re-folds the projection of some (or all) animals from the event log. */
    async rebuildProjection(collectionId: string, animalIds?: string[]) {
      const c = await collectionOf(collectionId);
      await refoldStates(db, c.id, c.timeZone, animalIds);
    },

    /**
     * Materialises the round for `date` once: the unique (collection, date) row is claimed in
     * the same transaction as the items, so concurrent builders (several server processes, the
     * job and a request) produce exactly one round.
     */
    async build(collectionId: string, date: LocalDate): Promise<{ created: boolean }> {
      return buildFor(await collectionOf(collectionId), date);
    },

    /** The round for a date as it stands: built items, settled by the day's outcomes. */
    async round(collectionId: string, date: LocalDate): Promise<RoundResponse> {
      return roundFor(await collectionOf(collectionId), date);
    },

    /** Today's round as JSON bytes with an ETag, shared by every request until it changes. */
    async todayRoundSerialised(collectionId: string, revision: { records: number; events: number }): Promise<SerialisedRound> {
      // The counters come first (the membership check read them): whatever is loaded after
      // them is at least as new as they say.
      const c = await collectionCache.get(collectionId, String(revision.records), () => collectionOf(collectionId));
      const date = service.today(c);
      const partKey = `${date}|${revision.records}`;
      const key = `${collectionId}|${partKey}|${revision.events}`;
      return serialised.get(collectionId, key, async () => {
        const part = await builtParts.get(collectionId, partKey, () => builtPart(c, date));
        return serialiseRound(key, viewJson(c, date, part, await outcomesByAnimal(c, date)));
      });
    },

    async todayRound(collectionId: string) {
      const c = await collectionOf(collectionId);
      return roundFor(c, service.today(c));
    },

    /** Tomorrow as things stand now (not materialised: today's outcomes still change it). */
    async tomorrowPreview(collectionId: string): Promise<RoundResponse> {
      const c = await collectionOf(collectionId);
      const date = addDays(service.today(c), 1);
      const rules = rulesOf(c);
      const round = buildRound(await engineInput(c), rules, date);
      return view(
        c,
        date,
        null,
        round.items.map((i) => ({ ...i, addedDuringDay: false, postMoltHoldDays: postMoltHoldDays(rules, i.animal) })),
        round.prepList,
        new Map(),
      );
    },

    async prepList(collectionId: string, date: LocalDate) {
      const c = await collectionOf(collectionId);
      const today = service.today(c);
      if (date === today) return (await roundFor(c, date)).prepList;
      if (date === addDays(today, 1)) return (await service.tomorrowPreview(c.id)).prepList;
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
      const c = await collectionOf(collectionId);
      const date = service.today(c);
      const [input] = await engineInput(c, undefined, [animalId]);
      if (!input) throw new HttpError(404, 'not_found', 'We could not find that animal.');
      const d = decideAnimal(input.animal, input.state, rulesOf(c), date);
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

    /**
     * After new facts or holds during the day, today's built round is brought in line without
     * reshuffling it (R18): a hold that now applies withdraws the open feed task (and, for an
     * animal to be left alone, its water) with the reason in its place; a hold that was lifted
     * gives the task back; prey left with an animal now molting or in premolt is added as an
     * urgent removal. No new feed task is added mid-day.
     */
    async reconcileToday(collectionId: string, animalIds: string[]) {
      if (!animalIds.length) return;
      const c = await collectionOf(collectionId);
      const date = service.today(c);
      const row = await findRound(db, c.id, date);
      if (!row) return;
      const existing = new Map(
        (await loadRoundItems(db, row.id, animalIds)).map((r) => [r.animal.id, r.item]),
      );
      const settled = await outcomesByAnimal(c, date, animalIds);
      const rules = rulesOf(c);
      for (const { animal, state } of await engineInput(c, undefined, animalIds)) {
        const d = decideAnimal(animal, state, rules, date);
        const item = existing.get(animal.id);
        const planned = (item?.tasks as RoundTask[] | undefined) ?? [];
        const hold = holdOf(d);
        const outcomes = liveOutcomes(settled.get(animal.id) ?? []);
        const leaveAlone = d.tasks.some((t) => t.kind === 'leave_alone') && !d.tasks.some((t) => t.kind === 'water');
        let changed = false;
        const tasks = planned.map((t) => {
          const heldKind = t.kind === 'feed' || (t.kind === 'water' && leaveAlone);
          const wanted = heldKind && hold && !settlingOutcome(t.kind, outcomes) ? hold : null;
          if ((t.serverWithdrawn ?? null)?.text === wanted?.text) return t;
          changed = true;
          return { ...t, serverWithdrawn: wanted };
        });
        const removal = d.tasks.find((t) => t.kind === 'remove_prey');
        const urgent = removal && (state.leaveAlone || state.premoltSince) && !planned.some((t) => t.kind === 'remove_prey');
        if (urgent) {
          tasks.unshift({
            ...removal,
            reasons: [...removal.reasons, { code: 'remove_prey', text: 'Added during the day: remove it now.', dates: [date] }],
          });
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
    async feedHolds(collectionId: string, animalIds: string[], date: LocalDate): Promise<Map<string, Reason>> {
      const holds = new Map<string, Reason>();
      if (!animalIds.length) return holds;
      const c = await collectionOf(collectionId);
      const rules = rulesOf(c);
      for (const { animal, state } of await engineInput(c, undefined, animalIds)) {
        const hold = holdOf(decideAnimal(animal, state, rules, date));
        if (hold) holds.set(animal.id, hold);
      }
      return holds;
    },

    /**
     * The scheduled job: every collection whose local day has begun without a round gets it
     * built. Runs every few minutes, so "shortly after local midnight" in every zone, DST too.
     */
    async buildDueRounds(onFailure?: (collectionId: string, err: unknown) => void): Promise<string[]> {
      const built: string[] = [];
      const failed: unknown[] = [];
      for (const c of await collectionsWithLatestRound(db)) {
        // One collection's bad data (a broken rule, a zone that no longer exists) must not
        // keep every collection after it without a round: it is reported and the job goes on.
        try {
          const today = localDateOf(now(), c.timeZone);
          if (c.latest && c.latest >= today) continue;
          if ((await service.build(c.id, today)).created) built.push(c.id);
        } catch (err) {
          if (onFailure) onFailure(c.id, err);
          else failed.push(err);
        }
      }
      if (failed.length) throw new AggregateError(failed, `${failed.length} collection(s) could not have their round built.`);
      return built;
    },

    async rules(collectionId: string) {
      const c = await collectionOf(collectionId);
      return {
        rules: rulesOf(c),
        defaults: effectiveRules({}),
        overrides: (c.rules ?? {}) as RulesOverride,
      };
    },

    /** Replaces the collection's overrides; today's built round stays as it was built. */
    async replaceRules(collectionId: string, overrides: RulesOverride) {
      await updateCollectionRules(db, collectionId, overrides);
      return service.rules(collectionId);
    },
  };
  return service;
}

export type RoundsService = ReturnType<typeof createRoundsService>;
