import { sql } from 'drizzle-orm';
import {
  bigint,
  boolean,
  check,
  date,
  doublePrecision,
  index,
  integer,
  jsonb,
  pgTable,
  primaryKey,
  text,
  timestamp,
  unique,
  uniqueIndex,
  uuid,
} from 'drizzle-orm/pg-core';
import { animals } from './animals';
import { collections } from './collections';
import { users } from './users';

/*
 * Sales (decision 022). Money is always an integer count of the currency's minor unit
 * (ISO 4217 exponent, shared/domain/sales/money.ts) beside its three-letter code: never a float.
 * Helpers never read any of these tables.
 */

/** One row per collection that sells: its money, tax, shipping range and availability list. */
export const salesSettings = pgTable(
  'sales_settings',
  {
    collectionId: uuid('collection_id')
      .primaryKey()
      .references(() => collections.id, { onDelete: 'cascade' }),
    currency: text('currency').notNull().default('EUR'),
    /** Tax in basis points (2100 = 21 %); 0 when the keeper charges none. */
    taxRateBp: integer('tax_rate_bp').notNull().default(0),
    taxRounding: text('tax_rounding').notNull().default('per_invoice'),
    /** Printed at the top of invoices: the seller's name, address, tax number. */
    sellerDetails: text('seller_details').notNull().default(''),
    /** Days a new reservation is held by default. */
    holdDays: integer('hold_days').notNull().default(7),
    /** The keeper's safe shipping range in °C (common practice 5–30 °C, no published source). */
    safeMinC: doublePrecision('safe_min_c').notNull().default(5),
    safeMaxC: doublePrecision('safe_max_c').notNull().default(30),
    /** The public availability list: off until the keeper turns it on. */
    availabilityOn: boolean('availability_on').notNull().default(false),
    /** Unguessable part of the list's link; a new one retires the old link. */
    availabilityToken: text('availability_token').unique('sales_settings_availability_token'),
    /** Which columns the public list shows, from a fixed whitelist. */
    availabilityColumns: text('availability_columns')
      .array()
      .notNull()
      .default(sql`'{species,stage,size,price,count}'::text[]`),
    availabilityNote: text('availability_note').notNull().default(''),
    nextInvoiceNumber: integer('next_invoice_number').notNull().default(1),
    updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    check('sales_settings_tax', sql`${t.taxRateBp} between 0 and 10000`),
    check('sales_settings_rounding', sql`${t.taxRounding} in ('per_invoice', 'per_line')`),
    check('sales_settings_range', sql`${t.safeMinC} < ${t.safeMaxC}`),
    check('sales_settings_hold', sql`${t.holdDays} between 1 and 365`),
  ],
);

/** An animal offered for sale. It stays on the round until it leaves the collection. */
export const saleListings = pgTable(
  'sale_listings',
  {
    animalId: uuid('animal_id')
      .primaryKey()
      .references(() => animals.id, { onDelete: 'cascade' }),
    collectionId: uuid('collection_id')
      .notNull()
      .references(() => collections.id, { onDelete: 'cascade' }),
    priceMinor: bigint('price_minor', { mode: 'number' }).notNull(),
    currency: text('currency').notNull(),
    description: text('description').notNull().default(''),
    /** Shown on the public availability list (a keeper may sell some only privately). */
    listedPublicly: boolean('listed_publicly').notNull().default(true),
    listedBy: uuid('listed_by').references(() => users.id, { onDelete: 'set null' }),
    listedAt: timestamp('listed_at', { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    index('sale_listings_collection_idx').on(t.collectionId),
    check('sale_listings_price', sql`${t.priceMinor} >= 0`),
  ],
);

/** A buyer: contact details only the owner and keepers see. */
export const buyers = pgTable(
  'buyers',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    collectionId: uuid('collection_id')
      .notNull()
      .references(() => collections.id, { onDelete: 'cascade' }),
    name: text('name').notNull(),
    email: text('email'),
    phone: text('phone'),
    address: text('address'),
    notes: text('notes'),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index('buyers_collection_idx').on(t.collectionId)],
);

export const SALE_STATUSES = ['reserved', 'shipped', 'expired', 'cancelled'] as const;

/**
 * A sale: it starts as a reservation for a buyer until a date, gets an invoice, is paid, and
 * ends shipped (its animals retired as sold) or expired/cancelled (its animals released).
 */
export const sales = pgTable(
  'sales',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    collectionId: uuid('collection_id')
      .notNull()
      .references(() => collections.id, { onDelete: 'cascade' }),
    buyerId: uuid('buyer_id')
      .notNull()
      .references(() => buyers.id, { onDelete: 'restrict' }),
    status: text('status', { enum: SALE_STATUSES }).notNull().default('reserved'),
    /** The last day of the hold, in the collection's time zone; expires the day after. */
    reservedUntil: date('reserved_until').notNull(),
    note: text('note'),
    // Shipping: the day, the route's forecast the keeper typed in and confirmed, the checklist.
    shipOn: date('ship_on'),
    shipRoute: text('ship_route'),
    forecastLowC: doublePrecision('forecast_low_c'),
    forecastHighC: doublePrecision('forecast_high_c'),
    shipCheckConfirmedAt: timestamp('ship_check_confirmed_at', { withTimezone: true }),
    shipCheckConfirmedBy: uuid('ship_check_confirmed_by').references(() => users.id, {
      onDelete: 'set null',
    }),
    /** Sales — S: the check's concerns the keeper confirmed over ("ship anyway"); [] when none. */
    shipCheckConcerns: jsonb('ship_check_concerns'),
    /** Packing checklist: item key → ticked. */
    packing: jsonb('packing').notNull().default({}),
    carrier: text('carrier'),
    tracking: text('tracking'),
    shippedAt: timestamp('shipped_at', { withTimezone: true }),
    endedAt: timestamp('ended_at', { withTimezone: true }),
    createdBy: uuid('created_by').references(() => users.id, { onDelete: 'set null' }),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    index('sales_collection_idx').on(t.collectionId, t.status),
    index('sales_buyer_idx').on(t.buyerId),
    check('sales_status', sql`${t.status} in ('reserved', 'shipped', 'expired', 'cancelled')`),
  ],
);

/**
 * The animals of a sale at the price agreed. `releasedAt` is set when the sale expires or is
 * cancelled: an animal can be in only one unreleased sale at a time (partial unique index).
 */
export const saleAnimals = pgTable(
  'sale_animals',
  {
    saleId: uuid('sale_id')
      .notNull()
      .references(() => sales.id, { onDelete: 'cascade' }),
    animalId: uuid('animal_id')
      .notNull()
      .references(() => animals.id, { onDelete: 'cascade' }),
    priceMinor: bigint('price_minor', { mode: 'number' }).notNull(),
    currency: text('currency').notNull(),
    releasedAt: timestamp('released_at', { withTimezone: true }),
  },
  (t) => [
    primaryKey({ columns: [t.saleId, t.animalId] }),
    uniqueIndex('sale_animals_one_live_sale')
      .on(t.animalId)
      .where(sql`${t.releasedAt} is null`),
  ],
);

export const INVOICE_STATUSES = ['open', 'part_paid', 'paid', 'refunded', 'cancelled'] as const;

/** An invoice for a sale: its lines, shipping and tax as issued (amounts are a snapshot). */
export const invoices = pgTable(
  'invoices',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    collectionId: uuid('collection_id')
      .notNull()
      .references(() => collections.id, { onDelete: 'cascade' }),
    saleId: uuid('sale_id')
      .notNull()
      .references(() => sales.id, { onDelete: 'cascade' }),
    /** The keeper's running number, e.g. "2026-0007". */
    number: text('number').notNull(),
    currency: text('currency').notNull(),
    taxRateBp: integer('tax_rate_bp').notNull(),
    taxRounding: text('tax_rounding').notNull(),
    shippingMinor: bigint('shipping_minor', { mode: 'number' }).notNull().default(0),
    subtotalMinor: bigint('subtotal_minor', { mode: 'number' }).notNull(),
    taxMinor: bigint('tax_minor', { mode: 'number' }).notNull(),
    totalMinor: bigint('total_minor', { mode: 'number' }).notNull(),
    paidMinor: bigint('paid_minor', { mode: 'number' }).notNull().default(0),
    refundedMinor: bigint('refunded_minor', { mode: 'number' }).notNull().default(0),
    status: text('status', { enum: INVOICE_STATUSES }).notNull().default('open'),
    issuedOn: date('issued_on').notNull(),
    dueOn: date('due_on'),
    /** The payment service's checkout session for this invoice (no card data is ever here). */
    checkoutSessionId: text('checkout_session_id'),
    checkoutUrl: text('checkout_url'),
    emailedAt: timestamp('emailed_at', { withTimezone: true }),
    cancelledAt: timestamp('cancelled_at', { withTimezone: true }),
    createdBy: uuid('created_by').references(() => users.id, { onDelete: 'set null' }),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    unique('invoices_collection_number').on(t.collectionId, t.number),
    uniqueIndex('invoices_one_live_per_sale')
      .on(t.saleId)
      .where(sql`${t.cancelledAt} is null`),
    uniqueIndex('invoices_checkout_session').on(t.checkoutSessionId),
    check(
      'invoices_status',
      sql`${t.status} in ('open', 'part_paid', 'paid', 'refunded', 'cancelled')`,
    ),
    check('invoices_rounding', sql`${t.taxRounding} in ('per_invoice', 'per_line')`),
  ],
);

/** An invoice's lines as issued: an animal, or shipping, or anything the keeper adds. */
export const invoiceLines = pgTable(
  'invoice_lines',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    invoiceId: uuid('invoice_id')
      .notNull()
      .references(() => invoices.id, { onDelete: 'cascade' }),
    position: integer('position').notNull(),
    animalId: uuid('animal_id').references(() => animals.id, { onDelete: 'set null' }),
    description: text('description').notNull(),
    quantity: integer('quantity').notNull().default(1),
    unitMinor: bigint('unit_minor', { mode: 'number' }).notNull(),
    netMinor: bigint('net_minor', { mode: 'number' }).notNull(),
    taxMinor: bigint('tax_minor', { mode: 'number' }).notNull(),
  },
  (t) => [
    unique('invoice_lines_position').on(t.invoiceId, t.position),
    check('invoice_lines_quantity', sql`${t.quantity} > 0`),
  ],
);

/** Money in or out for an invoice, as the payment service reported it (never card data). */
export const payments = pgTable(
  'payments',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    invoiceId: uuid('invoice_id')
      .notNull()
      .references(() => invoices.id, { onDelete: 'cascade' }),
    kind: text('kind', { enum: ['payment', 'refund'] }).notNull(),
    amountMinor: bigint('amount_minor', { mode: 'number' }).notNull(),
    currency: text('currency').notNull(),
    /** The service's id for the payment or refund: one row per id. */
    providerRef: text('provider_ref').notNull(),
    at: timestamp('at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    unique('payments_provider_ref').on(t.kind, t.providerRef),
    index('payments_invoice_idx').on(t.invoiceId),
    check('payments_kind', sql`${t.kind} in ('payment', 'refund')`),
    check('payments_amount', sql`${t.amountMinor} > 0`),
  ],
);

/** Every webhook event taken, by the service's event id: the same event twice is done once. */
export const paymentEvents = pgTable('payment_events', {
  eventId: text('event_id').primaryKey(),
  type: text('type').notNull(),
  invoiceId: uuid('invoice_id').references(() => invoices.id, { onDelete: 'set null' }),
  outcome: text('outcome').notNull(),
  receivedAt: timestamp('received_at', { withTimezone: true }).notNull().defaultNow(),
});
