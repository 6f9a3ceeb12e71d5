import { and, asc, desc, eq, inArray, isNull, sql } from 'drizzle-orm';
import type { Db } from '../../db/client';
import { animals } from '../../db/schema/animals';
import { collections } from '../../db/schema/collections';
import {
  buyers,
  invoiceLines,
  invoices,
  saleAnimals,
  saleListings,
  sales,
  salesSettings,
} from '../../db/schema/sales';

export type SettingsRow = typeof salesSettings.$inferSelect;
export type BuyerRow = typeof buyers.$inferSelect;
export type SaleRow = typeof sales.$inferSelect;
export type InvoiceRow = typeof invoices.$inferSelect;
export type InvoiceLineRow = typeof invoiceLines.$inferSelect;

// ---- Settings ----------------------------------------------------------------------------

export async function findSettings(db: Db, collectionId: string) {
  const [row] = await db
    .select()
    .from(salesSettings)
    .where(eq(salesSettings.collectionId, collectionId));
  return row;
}

export async function upsertSettings(
  db: Db,
  collectionId: string,
  values: Pick<
    SettingsRow,
    | 'currency'
    | 'taxRateBp'
    | 'taxRounding'
    | 'sellerDetails'
    | 'holdDays'
    | 'safeMinC'
    | 'safeMaxC'
  >,
  at: Date,
) {
  const [row] = await db
    .insert(salesSettings)
    .values({ collectionId, ...values, updatedAt: at })
    .onConflictDoUpdate({ target: salesSettings.collectionId, set: { ...values, updatedAt: at } })
    .returning();
  return row!;
}

/**
 * The next invoice number, taken atomically: one UPDATE … RETURNING, so two invoices made at
 * once never get the same number (the row lock serialises them).
 */
export async function takeInvoiceNumber(db: Db, collectionId: string): Promise<number> {
  await db.insert(salesSettings).values({ collectionId }).onConflictDoNothing();
  const [row] = await db
    .update(salesSettings)
    .set({ nextInvoiceNumber: sql`${salesSettings.nextInvoiceNumber} + 1` })
    .where(eq(salesSettings.collectionId, collectionId))
    .returning({ taken: sql<number>`${salesSettings.nextInvoiceNumber} - 1` });
  return Number(row!.taken);
}

// ---- Buyers ------------------------------------------------------------------------------

// Written out with table names: in a one-table select Drizzle leaves columns unqualified, and
// an unqualified `id` inside the subquery would be the sale's own.
const saleCount = sql<number>`(select count(*)::int from ${sales} where ${sales}.buyer_id = ${buyers}.id)`;

export async function listBuyers(db: Db, collectionId: string) {
  return db
    .select({ buyer: buyers, saleCount })
    .from(buyers)
    .where(eq(buyers.collectionId, collectionId))
    .orderBy(asc(sql`lower(${buyers.name})`), asc(buyers.createdAt));
}

export async function findBuyer(db: Db, collectionId: string, buyerId: string) {
  const [row] = await db
    .select({ buyer: buyers, saleCount })
    .from(buyers)
    .where(and(eq(buyers.collectionId, collectionId), eq(buyers.id, buyerId)));
  return row;
}

type BuyerValues = Pick<BuyerRow, 'name' | 'email' | 'phone' | 'address' | 'notes'>;

export async function insertBuyer(db: Db, collectionId: string, values: BuyerValues) {
  const [row] = await db
    .insert(buyers)
    .values({ collectionId, ...values })
    .returning({ id: buyers.id });
  return row!.id;
}

export async function updateBuyer(
  db: Db,
  collectionId: string,
  buyerId: string,
  values: BuyerValues,
  at: Date,
) {
  const rows = await db
    .update(buyers)
    .set({ ...values, updatedAt: at })
    .where(and(eq(buyers.collectionId, collectionId), eq(buyers.id, buyerId)))
    .returning({ id: buyers.id });
  return rows.length > 0;
}

export async function deleteBuyer(db: Db, collectionId: string, buyerId: string) {
  const rows = await db
    .delete(buyers)
    .where(and(eq(buyers.collectionId, collectionId), eq(buyers.id, buyerId)))
    .returning({ id: buyers.id });
  return rows.length > 0;
}

// ---- Listings the sales read ---------------------------------------------------------------

/** No unreleased sale holds the animal (the partial unique index's condition). */
const notInLiveSale = sql`not exists (select 1 from ${saleAnimals} where ${saleAnimals}.animal_id = ${animals}.id and ${saleAnimals}.released_at is null)`;

const listedAnimal = {
  id: animals.id,
  labelCode: animals.labelCode,
  name: animals.name,
  scientificName: animals.scientificName,
  lifeStage: animals.lifeStage,
  sex: animals.sex,
  sizeMm: animals.sizeMm,
  clutch: animals.clutch,
  status: animals.status,
  priceMinor: saleListings.priceMinor,
  currency: saleListings.currency,
};

/** Listed, active animals in no unreleased sale: what may be reserved now. */
export async function availableAnimals(db: Db, collectionId: string) {
  return db
    .select(listedAnimal)
    .from(saleListings)
    .innerJoin(animals, eq(animals.id, saleListings.animalId))
    .where(
      and(eq(saleListings.collectionId, collectionId), eq(animals.status, 'active'), notInLiveSale),
    )
    .orderBy(asc(animals.clutch), asc(animals.labelCode));
}

/** The listings of these animals in this collection (whatever their state). */
export async function listedAnimals(db: Db, collectionId: string, animalIds: string[]) {
  return db
    .select(listedAnimal)
    .from(saleListings)
    .innerJoin(animals, eq(animals.id, saleListings.animalId))
    .where(and(eq(saleListings.collectionId, collectionId), inArray(animals.id, animalIds)));
}

// ---- Sales -------------------------------------------------------------------------------

export async function insertSale(
  db: Db,
  values: Pick<SaleRow, 'collectionId' | 'buyerId' | 'reservedUntil' | 'note' | 'createdBy'>,
  at: Date,
) {
  const [row] = await db
    .insert(sales)
    .values({ ...values, createdAt: at, updatedAt: at })
    .returning({ id: sales.id });
  return row!.id;
}

export async function insertSaleAnimals(
  db: Db,
  rows: { saleId: string; animalId: string; priceMinor: number; currency: string }[],
) {
  await db.insert(saleAnimals).values(rows);
}

const liveInvoice = and(eq(invoices.saleId, sales.id), isNull(invoices.cancelledAt));

export async function listSales(db: Db, collectionId: string) {
  return db
    .select({
      sale: sales,
      buyerName: buyers.name,
      animalCount: sql<number>`(select count(*)::int from ${saleAnimals} where ${saleAnimals}.sale_id = ${sales}.id)`,
      priceMinor: sql<number>`(select coalesce(sum(${saleAnimals}.price_minor), 0)::bigint from ${saleAnimals} where ${saleAnimals}.sale_id = ${sales}.id)`,
      currency: sql<
        string | null
      >`(select min(${saleAnimals}.currency) from ${saleAnimals} where ${saleAnimals}.sale_id = ${sales}.id)`,
      invoiceStatus: invoices.status,
    })
    .from(sales)
    .innerJoin(buyers, eq(buyers.id, sales.buyerId))
    .leftJoin(invoices, liveInvoice)
    .where(eq(sales.collectionId, collectionId))
    .orderBy(desc(sales.createdAt));
}

/** One sale of the collection; `lock` holds its row for a change (FOR UPDATE). */
export async function findSale(db: Db, collectionId: string, saleId: string, lock = false) {
  const q = db
    .select()
    .from(sales)
    .where(and(eq(sales.collectionId, collectionId), eq(sales.id, saleId)));
  const [row] = lock ? await q.for('update') : await q;
  return row;
}

export async function saleAnimalsOf(db: Db, saleId: string) {
  return db
    .select({
      id: animals.id,
      labelCode: animals.labelCode,
      name: animals.name,
      scientificName: animals.scientificName,
      lifeStage: animals.lifeStage,
      sex: animals.sex,
      sizeMm: animals.sizeMm,
      group: animals.group,
      status: animals.status,
      priceMinor: saleAnimals.priceMinor,
      currency: saleAnimals.currency,
      releasedAt: saleAnimals.releasedAt,
    })
    .from(saleAnimals)
    .innerJoin(animals, eq(animals.id, saleAnimals.animalId))
    .where(eq(saleAnimals.saleId, saleId))
    .orderBy(asc(animals.labelCode));
}

export async function updateSale(db: Db, saleId: string, values: Partial<SaleRow>) {
  await db.update(sales).set(values).where(eq(sales.id, saleId));
}

/** Ends a sale that is still reserved; false when it had already moved on (idempotent). */
export async function endReservedSale(
  db: Db,
  saleId: string,
  status: 'expired' | 'cancelled',
  at: Date,
) {
  const rows = await db
    .update(sales)
    .set({ status, endedAt: at, updatedAt: at })
    .where(and(eq(sales.id, saleId), eq(sales.status, 'reserved')))
    .returning({ id: sales.id });
  return rows.length > 0;
}

/** The sale an animal is in now (its unreleased row), with that sale's buyer; locked. */
export async function liveSaleOfAnimal(db: Db, collectionId: string, animalId: string) {
  const [row] = await db
    .select({
      saleId: sales.id,
      status: sales.status,
      buyerName: buyers.name,
      labelCode: animals.labelCode,
    })
    .from(saleAnimals)
    .innerJoin(sales, eq(sales.id, saleAnimals.saleId))
    .innerJoin(buyers, eq(buyers.id, sales.buyerId))
    .innerJoin(animals, eq(animals.id, saleAnimals.animalId))
    .where(
      and(
        eq(saleAnimals.animalId, animalId),
        eq(sales.collectionId, collectionId),
        isNull(saleAnimals.releasedAt),
      ),
    )
    .for('update', { of: sales });
  return row;
}

export async function releaseAnimal(db: Db, saleId: string, animalId: string, at: Date) {
  await db
    .update(saleAnimals)
    .set({ releasedAt: at })
    .where(
      and(
        eq(saleAnimals.saleId, saleId),
        eq(saleAnimals.animalId, animalId),
        isNull(saleAnimals.releasedAt),
      ),
    );
}

/** How many of a sale's animals are still in it. */
export async function heldCount(db: Db, saleId: string): Promise<number> {
  const [row] = await db
    .select({ n: sql<number>`count(*)::int` })
    .from(saleAnimals)
    .where(and(eq(saleAnimals.saleId, saleId), isNull(saleAnimals.releasedAt)));
  return Number(row?.n ?? 0);
}

export async function releaseAnimals(db: Db, saleId: string, at: Date) {
  await db
    .update(saleAnimals)
    .set({ releasedAt: at })
    .where(and(eq(saleAnimals.saleId, saleId), isNull(saleAnimals.releasedAt)));
}

/**
 * Sales whose hold may have run out: still reserved, with their collection's zone and the
 * money received on their live invoice (the service decides with `reservationExpired`).
 */
export async function reservedSales(db: Db) {
  return db
    .select({
      id: sales.id,
      collectionId: sales.collectionId,
      timeZone: collections.timeZone,
      reservedUntil: sales.reservedUntil,
      // Money kept: a fully refunded sale holds nothing and may expire.
      paidMinor: sql<number>`coalesce(${invoices.paidMinor} - ${invoices.refundedMinor}, 0)`,
    })
    .from(sales)
    .innerJoin(collections, eq(collections.id, sales.collectionId))
    .leftJoin(invoices, liveInvoice)
    .where(eq(sales.status, 'reserved'));
}

/** The sale that took this animal away (shipped), for the animal's page. */
export async function soldWith(db: Db, collectionId: string, animalId: string) {
  const [row] = await db
    .select({
      saleId: sales.id,
      buyerName: buyers.name,
      shippedAt: sales.shippedAt,
      status: sales.status,
    })
    .from(saleAnimals)
    .innerJoin(sales, eq(sales.id, saleAnimals.saleId))
    .innerJoin(buyers, eq(buyers.id, sales.buyerId))
    .where(
      and(
        eq(sales.collectionId, collectionId),
        eq(saleAnimals.animalId, animalId),
        isNull(saleAnimals.releasedAt),
      ),
    )
    .orderBy(desc(sales.createdAt))
    .limit(1);
  return row;
}

// ---- Invoices ----------------------------------------------------------------------------

export async function liveInvoiceOf(db: Db, saleId: string, lock = false) {
  const q = db
    .select()
    .from(invoices)
    .where(and(eq(invoices.saleId, saleId), isNull(invoices.cancelledAt)));
  const [row] = lock ? await q.for('update') : await q;
  return row;
}

export async function findInvoice(db: Db, collectionId: string, invoiceId: string, lock = false) {
  const q = db
    .select()
    .from(invoices)
    .where(and(eq(invoices.collectionId, collectionId), eq(invoices.id, invoiceId)));
  const [row] = lock ? await q.for('update') : await q;
  return row;
}

export async function linesOf(db: Db, invoiceId: string) {
  return db
    .select()
    .from(invoiceLines)
    .where(eq(invoiceLines.invoiceId, invoiceId))
    .orderBy(asc(invoiceLines.position));
}

export async function insertInvoice(
  db: Db,
  values: typeof invoices.$inferInsert,
  lines: Omit<typeof invoiceLines.$inferInsert, 'invoiceId'>[],
) {
  const [row] = await db.insert(invoices).values(values).returning();
  await db.insert(invoiceLines).values(lines.map((l) => ({ ...l, invoiceId: row!.id })));
  return row!;
}

export async function cancelInvoiceRow(db: Db, invoiceId: string, at: Date) {
  await db
    .update(invoices)
    .set({ status: 'cancelled', cancelledAt: at, updatedAt: at })
    .where(and(eq(invoices.id, invoiceId), isNull(invoices.cancelledAt)));
}

export async function markEmailed(db: Db, invoiceId: string, at: Date) {
  await db.update(invoices).set({ emailedAt: at, updatedAt: at }).where(eq(invoices.id, invoiceId));
}
