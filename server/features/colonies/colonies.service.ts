import { COLONY_CARE_KINDS } from '#shared/domain/colonies/care';
import {
  countUpdateDeltas,
  drawLine,
  preyUsed,
  type ColonyStock,
  type PrepLineLike,
} from '#shared/domain/colonies/stock';
import { localDateOf, type LocalDate } from '#shared/domain/local-dates';
import { sameType, type Feeder } from '#shared/domain/rounds/feeders';
import type {
  ColoniesResponse,
  ColonyInput,
  ColonyView,
  CountUpdateBody,
  StockHistoryResponse,
} from '#shared/schemas/colonies';
import type { Db } from '../../db/client';
import { isUniqueViolation } from '../../db/errors';
import { HttpError } from '../../middleware/errors';
import {
  applyStockChange,
  changesFromEvents,
  colonyIdsIn,
  deleteColony,
  hasColonies,
  insertColony,
  loadColonies,
  stockChangesOf,
  updateColony,
  type ColonyRow,
  type StockRow,
} from './colonies.repository';

type Zone = { collectionId: string; timeZone: string };

/** A recorded round event as the events feature hands it to its `onRecorded` hooks. */
export interface RecordedFact {
  id: string;
  animalId: string;
  kind: string;
  payload: Record<string, unknown>;
  effectiveAt: Date;
}

export interface ColoniesDeps {
  now: () => Date;
  /** The last local date each care kind was done, per colony (the chores feature). */
  lastDone: (c: Zone, colonyIds: string[]) => Promise<Map<string, Record<string, LocalDate>>>;
  /** Forgets a removed colony's chores. */
  forgetChores: (collectionId: string, colonyId: string) => Promise<void>;
  /** The collection's feeder catalogue (its round rules). */
  feedersOf: (collectionId: string) => Promise<readonly Feeder[]>;
  /** The feed task's offer per animal on a date's round (the rounds feature). */
  offersOn: (
    collectionId: string,
    date: LocalDate,
    animalIds: string[],
  ) => Promise<ReadonlyMap<string, PrepLineLike>>;
}

const notFound = () => new HttpError(404, 'not_found', 'We could not find that colony.');
const nameTaken = () =>
  new HttpError(409, 'name_taken', 'Another colony already has that name. Choose another.');

function stockOfRows(colony: ColonyRow, stock: StockRow[]): ColonyStock {
  return {
    id: colony.id,
    name: colony.name,
    preyType: colony.preyType,
    stock: Object.fromEntries(stock.map((s) => [s.preySize, s.count])),
  };
}

/**
 * Feeder colonies: their stock per size, its history, the care that is due, and what the
 * round's meals take from them (docs/care-rules.md § Feeder colonies).
 */
export function createColoniesService(db: Db, deps: ColoniesDeps) {
  const { now } = deps;

  async function views(c: Zone, ids?: string[]): Promise<ColonyView[]> {
    const rows = await loadColonies(db, c.collectionId, { ids });
    const done = await deps.lastDone(
      c,
      rows.map((r) => r.colony.id),
    );
    return rows.map(({ colony, stock }) => ({
      id: colony.id,
      name: colony.name,
      species: colony.species,
      preyType: colony.preyType,
      stock: stock.map((s) => ({ preySize: s.preySize, count: s.count })),
      intervals: {
        feed: colony.feedEvery,
        water_gel: colony.waterGelEvery,
        clean: colony.cleanEvery,
        split: colony.splitEvery,
      },
      lastDone: Object.fromEntries(
        COLONY_CARE_KINDS.map((k) => [k, done.get(colony.id)?.[k] ?? null]),
      ) as ColonyView['lastDone'],
      updatedAt: colony.updatedAt.toISOString(),
    }));
  }

  async function one(c: Zone, colonyId: string): Promise<ColonyView> {
    const [view] = await views(c, [colonyId]);
    if (!view) throw notFound();
    return view;
  }

  /** A colony's prey type and sizes come from the catalogue, so the prep list can draw on it. */
  async function checkCatalogue(collectionId: string, input: ColonyInput) {
    const feeders = (await deps.feedersOf(collectionId)).filter((f) =>
      sameType(f.preyType, input.preyType),
    );
    if (!feeders.length)
      throw new HttpError(
        422,
        'not_in_catalogue',
        `“${input.preyType}” is not a prey type of the feeder catalogue. Choose one from the list, or add it in Settings → Round rules.`,
      );
    const unknown = input.sizes.filter((s) => !feeders.some((f) => sameType(f.preySize, s)));
    if (unknown.length)
      throw new HttpError(
        422,
        'not_in_catalogue',
        `The feeder catalogue has no ${input.preyType} size called “${unknown[0]}”. Its sizes: ${feeders.map((f) => f.preySize).join(', ')}.`,
      );
  }

  const uniqueName = async <T>(work: () => Promise<T>): Promise<T> => {
    try {
      return await work();
    } catch (err) {
      if (isUniqueViolation(err)) throw nameTaken();
      throw err;
    }
  };

  /**
   * The stock the round's meals took: each `ate` or `prey_left_in` comes off the colonies the
   * draw names for its prey (the same rule as the prep list), once per event id; a `void` of
   * such an event puts back exactly what it took. Called after the events are committed, only
   * with events stored for the first time.
   */
  async function takeUsed(c: Zone, recorded: readonly RecordedFact[]) {
    const using = recorded.filter((e) => e.kind === 'ate' || e.kind === 'prey_left_in');
    const voids = recorded.filter(
      (e) => e.kind === 'void' && typeof e.payload.targetId === 'string',
    );
    if (!using.length && !voids.length) return;
    // Without a colony there is nothing to take from or put back: a batch then costs one look
    // instead of the round's offers and a locking transaction.
    if (!(await hasColonies(db, c.collectionId))) return;
    // Offers come from the round of each event's own local date.
    const byDate = new Map<LocalDate, string[]>();
    for (const e of using) {
      const date = localDateOf(e.effectiveAt, c.timeZone);
      byDate.set(date, [...(byDate.get(date) ?? []), e.animalId]);
    }
    const offers = new Map<string, PrepLineLike>();
    for (const [date, ids] of byDate)
      for (const [animalId, offer] of await deps.offersOn(c.collectionId, date, ids))
        offers.set(`${date}|${animalId}`, offer);

    await db.transaction(async (tx) => {
      const rows = await loadColonies(tx, c.collectionId, { lock: true });
      if (!rows.length) return;
      const colonies = rows.map((r) => stockOfRows(r.colony, r.stock));
      for (const e of using) {
        const offer = offers.get(`${localDateOf(e.effectiveAt, c.timeZone)}|${e.animalId}`) ?? null;
        const used = preyUsed(e.kind, e.payload, offer);
        if (!used) continue;
        const draw = drawLine(used.preyType, used.preySize, used.count, colonies);
        for (const d of draw.draws) {
          const applied = await applyStockChange(tx, {
            colonyId: d.colonyId,
            preySize: d.preySize,
            delta: -d.count,
            reason: 'round',
            sourceEventId: e.id,
            note: e.kind === 'ate' ? 'Eaten on the round' : 'Left in on the round',
            at: e.effectiveAt,
          });
          // The next event of the batch draws on what is left.
          const col = colonies.find((x) => x.id === d.colonyId)!;
          col.stock = { ...col.stock, [d.preySize]: (col.stock[d.preySize] ?? 0) + applied };
        }
      }
      const taken = await changesFromEvents(
        tx,
        c.collectionId,
        voids.map((v) => v.payload.targetId as string),
      );
      for (const v of voids)
        for (const t of taken.filter((x) => x.sourceEventId === v.payload.targetId))
          await applyStockChange(tx, {
            colonyId: t.colonyId,
            preySize: t.preySize,
            delta: -t.delta,
            reason: 'round',
            sourceEventId: v.id,
            note: 'Put back: the outcome was undone',
            at: v.effectiveAt,
          });
    });
  }

  return {
    async list(c: Zone): Promise<ColoniesResponse> {
      return { today: localDateOf(now(), c.timeZone), colonies: await views(c) };
    },

    one,

    async create(c: Zone, input: ColonyInput): Promise<ColonyView> {
      await checkCatalogue(c.collectionId, input);
      const id = await uniqueName(() =>
        db.transaction((tx) => insertColony(tx, c.collectionId, input)),
      );
      return one(c, id);
    },

    async update(c: Zone, colonyId: string, input: ColonyInput): Promise<ColonyView> {
      await checkCatalogue(c.collectionId, input);
      const found = await uniqueName(() =>
        db.transaction((tx) => updateColony(tx, c.collectionId, colonyId, input, now())),
      );
      if (!found) throw notFound();
      return one(c, colonyId);
    },

    async remove(c: Zone, colonyId: string): Promise<void> {
      if (!(await deleteColony(db, c.collectionId, colonyId))) throw notFound();
      await deps.forgetChores(c.collectionId, colonyId);
    },

    /** A quick count after a colony check: each size set to what was seen. */
    async countUpdate(c: Zone, colonyId: string, body: CountUpdateBody): Promise<ColonyView> {
      await db.transaction(async (tx) => {
        const [row] = await loadColonies(tx, c.collectionId, { ids: [colonyId], lock: true });
        if (!row) throw notFound();
        const held = stockOfRows(row.colony, row.stock).stock;
        const foreign = body.counts.find(
          (s) => !row.stock.some((h) => sameType(h.preySize, s.preySize)),
        );
        if (foreign)
          throw new HttpError(
            422,
            'unknown_size',
            `${row.colony.name} holds no size called “${foreign.preySize}”: add it to the colony first.`,
          );
        const at = now();
        for (const change of countUpdateDeltas(held, body.counts))
          await applyStockChange(tx, {
            colonyId,
            preySize: change.preySize,
            delta: change.delta,
            reason: body.reason,
            note: body.note ?? null,
            at,
          });
      });
      return one(c, colonyId);
    },

    async history(c: Zone, colonyId: string): Promise<StockHistoryResponse> {
      await one(c, colonyId);
      const rows = await stockChangesOf(db, colonyId);
      return {
        changes: rows.map((r) => ({
          at: r.at.toISOString(),
          preySize: r.preySize,
          delta: r.delta,
          after: r.after,
          reason: r.reason as StockHistoryResponse['changes'][number]['reason'],
          note: r.note,
        })),
      };
    },

    /** For the chores feature: which of these ids are colonies of the collection. */
    colonyIdsIn: (collectionId: string, ids: string[]) => colonyIdsIn(db, collectionId, ids),

    takeUsed,
  };
}
export type ColoniesService = ReturnType<typeof createColoniesService>;
