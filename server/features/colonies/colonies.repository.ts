import { and, asc, eq, inArray, lt } from 'drizzle-orm';
import { applyDelta } from '#shared/domain/colonies/stock';
import type { ColonyInput, StockReason } from '#shared/schemas/colonies';
import type { Db } from '../../db/client';
import { colonies, colonyStock, colonyStockChanges } from '../../db/schema/colonies';

export type ColonyRow = typeof colonies.$inferSelect;
export type StockRow = typeof colonyStock.$inferSelect;

const intervalColumns = (i: ColonyInput['intervals']) => ({
  feedEvery: i.feed,
  waterGelEvery: i.water_gel,
  cleanEvery: i.clean,
  splitEvery: i.split,
});

/** A collection's colonies with their stock rows; `lock` holds them for a stock change. */
export async function loadColonies(
  db: Db,
  collectionId: string,
  { ids, lock = false }: { ids?: string[]; lock?: boolean } = {},
): Promise<{ colony: ColonyRow; stock: StockRow[] }[]> {
  const where = and(
    eq(colonies.collectionId, collectionId),
    ids ? inArray(colonies.id, ids) : undefined,
  );
  const q = db.select().from(colonies).where(where).orderBy(asc(colonies.name), asc(colonies.id));
  const rows = lock ? await q.for('update') : await q;
  if (!rows.length) return [];
  const stock = await db
    .select()
    .from(colonyStock)
    .where(
      inArray(
        colonyStock.colonyId,
        rows.map((r) => r.id),
      ),
    )
    .orderBy(asc(colonyStock.position), asc(colonyStock.preySize));
  return rows.map((colony) => ({
    colony,
    stock: stock.filter((s) => s.colonyId === colony.id),
  }));
}

export async function insertColony(db: Db, collectionId: string, input: ColonyInput) {
  const [row] = await db
    .insert(colonies)
    .values({
      collectionId,
      name: input.name,
      species: input.species,
      preyType: input.preyType,
      ...intervalColumns(input.intervals),
    })
    .returning({ id: colonies.id });
  await db
    .insert(colonyStock)
    .values(input.sizes.map((preySize, position) => ({ colonyId: row!.id, preySize, position })));
  return row!.id;
}

/** Edits a colony; sizes no longer listed leave its stock (their history stays). */
export async function updateColony(
  db: Db,
  collectionId: string,
  colonyId: string,
  input: ColonyInput,
  at: Date,
) {
  const [row] = await db
    .update(colonies)
    .set({
      name: input.name,
      species: input.species,
      preyType: input.preyType,
      ...intervalColumns(input.intervals),
      updatedAt: at,
    })
    .where(and(eq(colonies.id, colonyId), eq(colonies.collectionId, collectionId)))
    .returning({ id: colonies.id });
  if (!row) return false;
  const held = await db.select().from(colonyStock).where(eq(colonyStock.colonyId, colonyId));
  const gone = held.filter((h) => !input.sizes.includes(h.preySize)).map((h) => h.preySize);
  if (gone.length)
    await db
      .delete(colonyStock)
      .where(and(eq(colonyStock.colonyId, colonyId), inArray(colonyStock.preySize, gone)));
  for (const [position, preySize] of input.sizes.entries())
    await db
      .insert(colonyStock)
      .values({ colonyId, preySize, position })
      .onConflictDoUpdate({
        target: [colonyStock.colonyId, colonyStock.preySize],
        set: { position },
      });
  return true;
}

export async function deleteColony(db: Db, collectionId: string, colonyId: string) {
  const rows = await db
    .delete(colonies)
    .where(and(eq(colonies.id, colonyId), eq(colonies.collectionId, collectionId)))
    .returning({ id: colonies.id });
  return rows.length > 0;
}

/** Whether the collection keeps any feeder colony (most do not). */
export async function hasColonies(db: Db, collectionId: string): Promise<boolean> {
  const rows = await db
    .select({ id: colonies.id })
    .from(colonies)
    .where(eq(colonies.collectionId, collectionId))
    .limit(1);
  return rows.length > 0;
}

export async function colonyIdsIn(db: Db, collectionId: string, ids: string[]) {
  if (!ids.length) return new Set<string>();
  const rows = await db
    .select({ id: colonies.id })
    .from(colonies)
    .where(and(eq(colonies.collectionId, collectionId), inArray(colonies.id, ids)));
  return new Set(rows.map((r) => r.id));
}

export interface StockChange {
  colonyId: string;
  preySize: string;
  delta: number;
  reason: StockReason;
  sourceEventId?: string | null;
  note?: string | null;
  at: Date;
}

/**
 * Applies one change to a size's count (never below zero: `applyDelta`) and records it with
 * the count after it. A change from a round's event already recorded for that colony and size
 * is skipped, so an event takes stock once however often it comes. The caller holds the
 * colony's row lock (`loadColonies(…, { lock: true })`). Returns what really changed.
 */
export async function applyStockChange(db: Db, change: StockChange): Promise<number> {
  const [row] = await db
    .select()
    .from(colonyStock)
    .where(
      and(eq(colonyStock.colonyId, change.colonyId), eq(colonyStock.preySize, change.preySize)),
    );
  const { count, applied } = applyDelta(row?.count ?? 0, change.delta);
  if (applied === 0) return 0;
  const inserted = await db
    .insert(colonyStockChanges)
    .values({
      colonyId: change.colonyId,
      preySize: change.preySize,
      delta: applied,
      after: count,
      reason: change.reason,
      sourceEventId: change.sourceEventId ?? null,
      note: change.note ?? null,
      at: change.at,
    })
    .onConflictDoNothing()
    .returning({ id: colonyStockChanges.id });
  if (!inserted.length) return 0;
  await db
    .insert(colonyStock)
    .values({ colonyId: change.colonyId, preySize: change.preySize, count, position: 99 })
    .onConflictDoUpdate({ target: [colonyStock.colonyId, colonyStock.preySize], set: { count } });
  return applied;
}

/** The stock an event took (its `round` changes), to put back when the event is undone. */
export async function changesFromEvents(db: Db, collectionId: string, eventIds: string[]) {
  if (!eventIds.length) return [];
  return db
    .select({
      colonyId: colonyStockChanges.colonyId,
      preySize: colonyStockChanges.preySize,
      delta: colonyStockChanges.delta,
      sourceEventId: colonyStockChanges.sourceEventId,
    })
    .from(colonyStockChanges)
    .innerJoin(colonies, eq(colonies.id, colonyStockChanges.colonyId))
    .where(
      and(
        eq(colonies.collectionId, collectionId),
        inArray(colonyStockChanges.sourceEventId, eventIds),
        eq(colonyStockChanges.reason, 'round'),
        lt(colonyStockChanges.delta, 0),
      ),
    );
}

export async function stockChangesOf(db: Db, colonyId: string) {
  return db
    .select()
    .from(colonyStockChanges)
    .where(eq(colonyStockChanges.colonyId, colonyId))
    .orderBy(asc(colonyStockChanges.at), asc(colonyStockChanges.seq))
    .limit(5000);
}
