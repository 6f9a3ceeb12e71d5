import { and, asc, eq, gt, sql } from 'drizzle-orm';
import type { Database, Db } from '../../db/client';
import { animals, eggSacs, eventPhotos, events } from '../../db/schema/animals';
import { climateReadings, roomTargets } from '../../db/schema/climate';
import { collections, locations } from '../../db/schema/collections';
import { chores, colonies, colonyStock, colonyStockChanges } from '../../db/schema/colonies';
import {
  buyers,
  invoiceLines,
  invoices,
  payments,
  saleAnimals,
  saleListings,
  sales,
  salesSettings,
} from '../../db/schema/sales';
import { users } from '../../db/schema/users';

export type NewPlace = typeof locations.$inferInsert;
export type NewAnimal = typeof animals.$inferInsert;
export type NewEvent = typeof events.$inferInsert;
export type NewEggSac = typeof eggSacs.$inferInsert;
export type NewEventPhoto = typeof eventPhotos.$inferInsert;
export type NewColony = typeof colonies.$inferInsert;
export type NewColonyStock = typeof colonyStock.$inferInsert;
export type NewStockChange = typeof colonyStockChanges.$inferInsert;
export type NewChore = typeof chores.$inferInsert;
export type NewRoomTargets = typeof roomTargets.$inferInsert;
export type NewReading = typeof climateReadings.$inferInsert;
export type NewSalesSettings = typeof salesSettings.$inferInsert;
export type NewBuyer = typeof buyers.$inferInsert;
export type NewListing = typeof saleListings.$inferInsert;
export type NewSale = typeof sales.$inferInsert;
export type NewSaleAnimal = typeof saleAnimals.$inferInsert;
export type NewInvoice = typeof invoices.$inferInsert;
export type NewInvoiceLine = typeof invoiceLines.$inferInsert;
export type NewPayment = typeof payments.$inferInsert;

type Place = { room: string; rack: string; shelf: string; position: string };
const list = (values: unknown[]) => sql.param(values);

/** A collection's own round rules (its overrides of the defaults). */
export async function rulesOf(db: Db, collectionId: string) {
  const [c] = await db
    .select({ rules: collections.rules })
    .from(collections)
    .where(eq(collections.id, collectionId));
  return c?.rules ?? null;
}

/**
 * Runs `work` in one read-only REPEATABLE READ transaction: every read in it sees the same
 * snapshot, however long it takes (a backup's pages never see an event without its animal).
 */
export function inSnapshot<T>(db: Database['db'], work: (tx: Db) => Promise<T>): Promise<T> {
  return db.transaction(work, { isolationLevel: 'repeatable read', accessMode: 'read only' });
}

/** A page of events with their animal and who recorded it, oldest first (the events CSV). */
export async function eventsWithNamesPage(
  db: Db,
  collectionId: string,
  after: { at: string; id: string } | null,
  limit: number,
) {
  return db
    .select({
      e: events,
      code: animals.labelCode,
      name: animals.name,
      by: users.displayName,
      cursor: sql<string>`${events.effectiveAt}::text`,
    })
    .from(events)
    .innerJoin(animals, eq(animals.id, events.animalId))
    .leftJoin(users, eq(users.id, events.recordedBy))
    .where(and(eq(events.collectionId, collectionId), after ? afterCursor(after) : undefined))
    .orderBy(asc(events.effectiveAt), asc(events.id))
    .limit(limit);
}

/** Names for the ids an event's payload may hold (males, places), for the history CSV. */
export async function payloadNames(db: Db, collectionId: string) {
  const [who, where] = await Promise.all([
    db
      .select({ id: animals.id, name: animals.name, code: animals.labelCode })
      .from(animals)
      .where(eq(animals.collectionId, collectionId)),
    db
      .select({
        id: locations.id,
        rack: locations.rack,
        shelf: locations.shelf,
        position: locations.position,
      })
      .from(locations)
      .where(eq(locations.collectionId, collectionId)),
  ]);
  return {
    animals: new Map(who.map((a) => [a.id, `${a.name} (${a.code})`])),
    places: new Map(where.map((l) => [l.id, `${l.rack}${l.shelf}-${l.position}`])),
  };
}

/**
 * Events after a page's last one. The cursor is the time as PostgreSQL wrote it (microseconds
 * kept), so a page never repeats or skips an event that shares a millisecond. The plain `>=` on
 * the time lets the (collection, time) index start at the cursor: the row comparison alone made
 * every page read the collection's history from its beginning.
 */
const afterCursor = (after: { at: string; id: string }) =>
  sql`${events.effectiveAt} >= ${after.at}::timestamptz and (${events.effectiveAt}, ${events.id}) > (${after.at}::timestamptz, ${after.id}::uuid)`;

// --- Backup: pages in a stable order, each resuming after the last row of the one before.

/** Walk order, ties by the place itself (unique in a collection), so the order is total. */
export async function placesPage(
  db: Db,
  collectionId: string,
  after: (Place & { walkOrder: number }) | null,
  limit: number,
) {
  const { walkOrder, room, rack, shelf, position } = locations;
  return db
    .select()
    .from(locations)
    .where(
      and(
        eq(locations.collectionId, collectionId),
        after
          ? sql`(${walkOrder}, ${room}, ${rack}, ${shelf}, ${position}) > (${after.walkOrder}, ${after.room}, ${after.rack}, ${after.shelf}, ${after.position})`
          : undefined,
      ),
    )
    .orderBy(asc(walkOrder), asc(room), asc(rack), asc(shelf), asc(position))
    .limit(limit);
}

/** Label codes are unique within a collection, so they order the pages on their own. */
export async function animalsPage(
  db: Db,
  collectionId: string,
  afterCode: string | null,
  limit: number,
) {
  return db
    .select()
    .from(animals)
    .where(
      and(
        eq(animals.collectionId, collectionId),
        afterCode === null ? undefined : gt(animals.labelCode, afterCode),
      ),
    )
    .orderBy(asc(animals.labelCode))
    .limit(limit);
}

/** Events oldest first, with a molt photo's key, a page at a time (see afterCursor). */
export async function eventsPage(
  db: Db,
  collectionId: string,
  after: { at: string; id: string } | null,
  limit: number,
) {
  return db
    .select({
      e: events,
      photoKey: eventPhotos.photoKey,
      cursor: sql<string>`${events.effectiveAt}::text`,
    })
    .from(events)
    .leftJoin(eventPhotos, eq(eventPhotos.eventId, events.id))
    .where(and(eq(events.collectionId, collectionId), after ? afterCursor(after) : undefined))
    .orderBy(asc(events.effectiveAt), asc(events.id))
    .limit(limit);
}

/** A collection's feeder colonies with their stock (a handful, each with a few sizes: one read). */
export async function coloniesOf(db: Db, collectionId: string) {
  const rows = await db
    .select()
    .from(colonies)
    .where(eq(colonies.collectionId, collectionId))
    .orderBy(asc(colonies.name), asc(colonies.id));
  const stock = rows.length
    ? await db
        .select()
        .from(colonyStock)
        .innerJoin(colonies, eq(colonies.id, colonyStock.colonyId))
        .where(eq(colonies.collectionId, collectionId))
        .orderBy(asc(colonyStock.position), asc(colonyStock.preySize))
    : [];
  return rows.map((colony) => ({
    colony,
    stock: stock.filter((s) => s.colonies.id === colony.id).map((s) => s.colony_stock),
  }));
}

/**
 * One colony's stock changes in the order they were made (time, then the order of writing),
 * a page at a time: the (colony, time) index starts each page at the cursor, kept as
 * PostgreSQL's own text so microseconds are not lost.
 */
export async function stockChangesPage(
  db: Db,
  colonyId: string,
  after: { at: string; seq: number } | null,
  limit: number,
) {
  const { at, seq } = colonyStockChanges;
  return db
    .select({ change: colonyStockChanges, cursor: sql<string>`${at}::text` })
    .from(colonyStockChanges)
    .where(
      and(
        eq(colonyStockChanges.colonyId, colonyId),
        after
          ? sql`${at} >= ${after.at}::timestamptz and (${at}, ${seq}) > (${after.at}::timestamptz, ${after.seq})`
          : undefined,
      ),
    )
    .orderBy(asc(at), asc(seq))
    .limit(limit);
}

type ChoreCursor = { subjectKind: string; subjectId: string; kind: string; id: string };

/**
 * A page of chores in the order of their (collection, subject, kind) index, then id. The
 * subject id is compared as the column's own type (uuid today, text for a room's name).
 */
export async function choresPage(
  db: Db,
  collectionId: string,
  after: ChoreCursor | null,
  limit: number,
) {
  const { subjectKind, subjectId, kind, id } = chores;
  return db
    .select()
    .from(chores)
    .where(
      and(
        eq(chores.collectionId, collectionId),
        after
          ? sql`(${subjectKind}, ${subjectId}, ${kind}, ${id}) > (${after.subjectKind}, ${after.subjectId}, ${after.kind}, ${after.id}::uuid)`
          : undefined,
      ),
    )
    .orderBy(asc(subjectKind), asc(subjectId), asc(kind), asc(id))
    .limit(limit);
}

/** A collection's room targets (one row per room: one read). */
export async function roomTargetsOf(db: Db, collectionId: string) {
  return db
    .select()
    .from(roomTargets)
    .where(eq(roomTargets.collectionId, collectionId))
    .orderBy(asc(roomTargets.room));
}

/** Climate readings by room and time (the (collection, room, time) index), then id. */
export async function readingsPage(
  db: Db,
  collectionId: string,
  after: { room: string; at: string; id: string } | null,
  limit: number,
) {
  const { room, takenAt, id } = climateReadings;
  return db
    .select({ reading: climateReadings, cursor: sql<string>`${takenAt}::text` })
    .from(climateReadings)
    .where(
      and(
        eq(climateReadings.collectionId, collectionId),
        after
          ? sql`(${room}, ${takenAt}, ${id}) > (${after.room}, ${after.at}::timestamptz, ${after.id}::uuid)`
          : undefined,
      ),
    )
    .orderBy(asc(room), asc(takenAt), asc(id))
    .limit(limit);
}

// --- Restore: one transaction writes everything or nothing.

/**
 * What a collection already holds that a restore would add to: animals, places, feeder colonies,
 * room targets and readings (a restore needs all at zero).
 */
export async function recordCounts(db: Db, collectionId: string) {
  const n = (table: string) =>
    sql`(select count(*) from ${sql.identifier(table)} where collection_id = ${collectionId})::int`;
  const rows = await db.execute<{
    animals: number;
    places: number;
    colonies: number;
    targets: number;
    readings: number;
    sales: number;
  }>(
    sql`select ${n('animals')} as animals, ${n('locations')} as places, ${n('colonies')} as colonies,
      ${n('room_targets')} as targets, ${n('climate_readings')} as readings,
      ${n('buyers')} + ${n('sales_settings')} as sales`,
  );
  return rows.rows[0]!;
}

/**
 * Holds the collection row until the transaction ends, so two restores into one collection
 * wait for each other. NO KEY UPDATE leaves other writers (which only take KEY SHARE through
 * their foreign keys) alone.
 */
export async function lockCollection(tx: Db, collectionId: string) {
  await tx.execute(sql`select id from collections where id = ${collectionId} for no key update`);
}

export async function insertPlaces(tx: Db, rows: NewPlace[]) {
  if (rows.length) await tx.insert(locations).values(rows);
}

/** A collection's egg sacs, egg cases and broods (a handful per female: one read). */
export async function sacsOf(db: Db, collectionId: string) {
  return db
    .select()
    .from(eggSacs)
    .where(eq(eggSacs.collectionId, collectionId))
    .orderBy(asc(eggSacs.laidOn), asc(eggSacs.createdAt), asc(eggSacs.clutch));
}

export async function insertSacs(tx: Db, rows: NewEggSac[]) {
  if (rows.length) await tx.insert(eggSacs).values(rows);
}

export async function insertAnimals(tx: Db, rows: NewAnimal[]) {
  if (rows.length) await tx.insert(animals).values(rows);
}

export async function insertColonies(tx: Db, rows: NewColony[], stock: NewColonyStock[]) {
  if (rows.length) await tx.insert(colonies).values(rows);
  if (stock.length) await tx.insert(colonyStock).values(stock);
}

/** Inserted in the file's order, so the order of writing (`seq`) keeps the original's order. */
export async function insertStockChanges(tx: Db, rows: NewStockChange[]) {
  if (rows.length) await tx.insert(colonyStockChanges).values(rows);
}

export async function insertChores(tx: Db, rows: NewChore[]) {
  if (rows.length) await tx.insert(chores).values(rows);
}

export async function insertRoomTargets(tx: Db, rows: NewRoomTargets[]) {
  if (rows.length) await tx.insert(roomTargets).values(rows);
}

export async function insertReadings(tx: Db, rows: NewReading[]) {
  if (rows.length) await tx.insert(climateReadings).values(rows);
}

export async function insertEventPhotos(tx: Db, rows: NewEventPhoto[]) {
  if (rows.length) await tx.insert(eventPhotos).values(rows);
}

/** Of these ids, the accounts this server has (a backup may come from another server). */
export async function existingUserIds(tx: Db, ids: string[]): Promise<Set<string>> {
  if (!ids.length) return new Set();
  const rows = await tx
    .select({ id: users.id })
    .from(users)
    .where(sql`${users.id} = any(${list(ids)}::uuid[])`);
  return new Set(rows.map((r) => r.id));
}

/** An undo whose target is not a fact about the same animal in this collection, if any. */
export async function findStrayUndo(tx: Db, collectionId: string) {
  const rows = await tx.execute<{ code: string }>(sql`
    select a.label_code as code from events v
    join animals a on a.id = v.animal_id
    where v.collection_id = ${collectionId} and v.kind = 'void'
      and not exists (select 1 from events t where t.id = (v.payload->>'targetId')::uuid
                      and t.collection_id = v.collection_id and t.animal_id = v.animal_id)
    limit 1`);
  return rows.rows[0] ?? null;
}

/** The animal with the longest history, when it is longer than `limit`. */
export async function findAnimalWithMoreEvents(tx: Db, collectionId: string, limit: number) {
  const rows = await tx.execute<{ code: string; n: string }>(sql`
    select a.label_code as code, count(*) as n from events e join animals a on a.id = e.animal_id
    where e.collection_id = ${collectionId}
    group by a.label_code having count(*) > ${limit} order by count(*) desc limit 1`);
  const row = rows.rows[0];
  return row ? { code: row.code, events: Number(row.n) } : null;
}

/** A page of the collection's animals with how many events each has, by id. */
export async function animalEventCounts(
  tx: Db,
  collectionId: string,
  afterId: string | null,
  limit: number,
) {
  const rows = await tx.execute<{ id: string; n: string }>(sql`
    select a.id, (select count(*) from events e where e.animal_id = a.id) as n from animals a
    where a.collection_id = ${collectionId} ${afterId ? sql`and a.id > ${afterId}::uuid` : sql``}
    order by a.id limit ${limit}`);
  return rows.rows.map((r) => ({ id: r.id, events: Number(r.n) }));
}

export async function setCollectionRules(tx: Db, collectionId: string, rules: unknown) {
  await tx.update(collections).set({ rules }).where(eq(collections.id, collectionId));
}

// ---- Sales — S: a breeder's sales are hundreds, not millions; each list is one read.

export async function salesSettingsOf(db: Db, collectionId: string) {
  return db.select().from(salesSettings).where(eq(salesSettings.collectionId, collectionId));
}

export async function buyersOf(db: Db, collectionId: string) {
  return db
    .select()
    .from(buyers)
    .where(eq(buyers.collectionId, collectionId))
    .orderBy(asc(buyers.createdAt), asc(buyers.id));
}

// Ties broken by the animal's label code, which a restore keeps (its ids are new), so a backup
// of the restored collection lists them in the same order.
export async function listingsOf(db: Db, collectionId: string) {
  const rows = await db
    .select({ listing: saleListings })
    .from(saleListings)
    .innerJoin(animals, eq(animals.id, saleListings.animalId))
    .where(eq(saleListings.collectionId, collectionId))
    .orderBy(asc(saleListings.listedAt), asc(animals.labelCode));
  return rows.map((r) => r.listing);
}

/** Sales in the order they were made, each with its animals. */
export async function salesOf(db: Db, collectionId: string) {
  const rows = await db
    .select()
    .from(sales)
    .where(eq(sales.collectionId, collectionId))
    .orderBy(asc(sales.createdAt), asc(sales.id));
  const held = await db
    .select({ a: saleAnimals })
    .from(saleAnimals)
    .innerJoin(sales, eq(sales.id, saleAnimals.saleId))
    .innerJoin(animals, eq(animals.id, saleAnimals.animalId))
    .where(eq(sales.collectionId, collectionId))
    .orderBy(asc(animals.labelCode));
  return rows.map((sale) => ({ sale, animals: held.filter((h) => h.a.saleId === sale.id) }));
}

export async function invoicesOf(db: Db, collectionId: string) {
  const rows = await db
    .select()
    .from(invoices)
    .where(eq(invoices.collectionId, collectionId))
    .orderBy(asc(invoices.createdAt), asc(invoices.number));
  const lines = await db
    .select({ l: invoiceLines })
    .from(invoiceLines)
    .innerJoin(invoices, eq(invoices.id, invoiceLines.invoiceId))
    .where(eq(invoices.collectionId, collectionId))
    .orderBy(asc(invoiceLines.position));
  return rows.map((invoice) => ({
    invoice,
    lines: lines.filter((x) => x.l.invoiceId === invoice.id).map((x) => x.l),
  }));
}

export async function paymentsOf(db: Db, collectionId: string) {
  return db
    .select({ p: payments })
    .from(payments)
    .innerJoin(invoices, eq(invoices.id, payments.invoiceId))
    .where(eq(invoices.collectionId, collectionId))
    .orderBy(asc(payments.at), asc(payments.id));
}

export async function insertSalesRows(
  tx: Db,
  rows: {
    settings: NewSalesSettings[];
    buyers: NewBuyer[];
    listings: NewListing[];
    sales: NewSale[];
    saleAnimals: NewSaleAnimal[];
    invoices: NewInvoice[];
    lines: NewInvoiceLine[];
    payments: NewPayment[];
  },
) {
  if (rows.settings.length) await tx.insert(salesSettings).values(rows.settings);
  if (rows.buyers.length) await tx.insert(buyers).values(rows.buyers);
  if (rows.listings.length) await tx.insert(saleListings).values(rows.listings);
  if (rows.sales.length) await tx.insert(sales).values(rows.sales);
  if (rows.saleAnimals.length) await tx.insert(saleAnimals).values(rows.saleAnimals);
  if (rows.invoices.length) await tx.insert(invoices).values(rows.invoices);
  if (rows.lines.length) await tx.insert(invoiceLines).values(rows.lines);
  if (rows.payments.length) await tx.insert(payments).values(rows.payments);
}

/** Payment refs (kind|ref) already on this server: the original of a copy restored beside it. */
export async function takenProviderRefs(tx: Db, rows: { kind: string; providerRef: string }[]) {
  if (!rows.length) return new Set<string>();
  const found = await tx
    .select({ kind: payments.kind, ref: payments.providerRef })
    .from(payments)
    .where(sql`${payments.providerRef} = any(${list(rows.map((r) => r.providerRef))}::text[])`);
  return new Set(found.map((f) => `${f.kind}|${f.ref}`));
}
