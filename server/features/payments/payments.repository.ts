import { and, asc, desc, eq, isNotNull, like, sql } from 'drizzle-orm';
import type { Db } from '../../db/client';
import { invoices, paymentEvents, payments } from '../../db/schema/sales';

const invoiceColumns = {
  id: invoices.id,
  collectionId: invoices.collectionId,
  saleId: invoices.saleId,
  number: invoices.number,
  currency: invoices.currency,
  totalMinor: invoices.totalMinor,
  paidMinor: invoices.paidMinor,
  refundedMinor: invoices.refundedMinor,
  status: invoices.status,
  cancelledAt: invoices.cancelledAt,
  checkoutSessionId: invoices.checkoutSessionId,
  checkoutUrl: invoices.checkoutUrl,
};
export type InvoiceRow = Awaited<ReturnType<typeof invoiceInCollection>> & {};

/** The invoice when it belongs to the collection; `lock` holds it for this transaction. */
export async function invoiceInCollection(
  db: Db,
  collectionId: string,
  invoiceId: string,
  lock = false,
) {
  const q = db
    .select(invoiceColumns)
    .from(invoices)
    .where(and(eq(invoices.id, invoiceId), eq(invoices.collectionId, collectionId)));
  const [row] = lock ? await q.for('update') : await q;
  return row ?? null;
}

/** Any collection's invoice, locked: for webhooks, which name the invoice in their metadata. */
export async function lockInvoice(db: Db, invoiceId: string) {
  const [row] = await db
    .select(invoiceColumns)
    .from(invoices)
    .where(eq(invoices.id, invoiceId))
    .for('update');
  return row ?? null;
}

export async function setCheckout(
  db: Db,
  invoiceId: string,
  session: { id: string; url: string } | null,
  at: Date,
) {
  await db
    .update(invoices)
    .set({
      checkoutSessionId: session?.id ?? null,
      checkoutUrl: session?.url ?? null,
      updatedAt: at,
    })
    .where(eq(invoices.id, invoiceId));
}

/** Stores a payment or refund once per service id: false when it was stored already. */
export async function insertPayment(
  db: Db,
  values: {
    invoiceId: string;
    kind: 'payment' | 'refund';
    amountMinor: number;
    currency: string;
    providerRef: string;
    at: Date;
  },
) {
  const rows = await db
    .insert(payments)
    .values(values)
    .onConflictDoNothing({ target: [payments.kind, payments.providerRef] })
    .returning({ id: payments.id });
  return rows.length > 0;
}

/** A refund the service reports as failed after all: it never gave the money back. */
export async function deletePayment(db: Db, kind: 'payment' | 'refund', providerRef: string) {
  await db
    .delete(payments)
    .where(and(eq(payments.kind, kind), eq(payments.providerRef, providerRef)));
}

export async function paymentsOf(db: Db, invoiceId: string) {
  return db
    .select({
      id: payments.id,
      kind: payments.kind,
      amountMinor: payments.amountMinor,
      currency: payments.currency,
      providerRef: payments.providerRef,
      at: payments.at,
    })
    .from(payments)
    .where(eq(payments.invoiceId, invoiceId))
    .orderBy(asc(payments.at), asc(payments.id));
}

export async function sumsOf(db: Db, invoiceId: string) {
  const [row] = await db
    .select({
      paid: sql<string>`coalesce(sum(${payments.amountMinor}) filter (where ${payments.kind} = 'payment'), 0)`,
      refunded: sql<string>`coalesce(sum(${payments.amountMinor}) filter (where ${payments.kind} = 'refund'), 0)`,
    })
    .from(payments)
    .where(eq(payments.invoiceId, invoiceId));
  return { paidMinor: Number(row?.paid ?? 0), refundedMinor: Number(row?.refunded ?? 0) };
}

export async function setInvoiceMoney(
  db: Db,
  invoiceId: string,
  values: {
    paidMinor: number;
    refundedMinor: number;
    status: 'open' | 'part_paid' | 'paid' | 'refunded' | 'cancelled';
  },
  at: Date,
) {
  await db
    .update(invoices)
    .set({ ...values, updatedAt: at })
    .where(eq(invoices.id, invoiceId));
}

/** Takes a webhook event by its id: false when it was taken before (the same event again). */
export async function takeEvent(db: Db, eventId: string, type: string, at: Date) {
  const rows = await db
    .insert(paymentEvents)
    .values({ eventId, type, outcome: 'received', receivedAt: at })
    .onConflictDoNothing({ target: paymentEvents.eventId })
    .returning({ eventId: paymentEvents.eventId });
  return rows.length > 0;
}

export async function settleEvent(
  db: Db,
  eventId: string,
  invoiceId: string | null,
  outcome: string,
) {
  await db
    .update(paymentEvents)
    .set({ invoiceId, outcome })
    .where(eq(paymentEvents.eventId, eventId));
}

/** The invoice's last declined card attempt (outcome `declined:<code>`), if any. */
export async function lastDeclineOf(db: Db, invoiceId: string) {
  const [row] = await db
    .select({ outcome: paymentEvents.outcome, at: paymentEvents.receivedAt })
    .from(paymentEvents)
    .where(
      and(
        eq(paymentEvents.invoiceId, invoiceId),
        isNotNull(paymentEvents.invoiceId),
        like(paymentEvents.outcome, 'declined%'),
      ),
    )
    .orderBy(desc(paymentEvents.receivedAt))
    .limit(1);
  return row ?? null;
}

/** Card payments not yet refunded in full, oldest first, with what each may still give back. */
export async function cardPaymentsOf(db: Db, invoiceId: string) {
  return db
    .select({ providerRef: payments.providerRef, amountMinor: payments.amountMinor })
    .from(payments)
    .where(
      and(
        eq(payments.invoiceId, invoiceId),
        eq(payments.kind, 'payment'),
        like(payments.providerRef, 'pi\\_%'),
      ),
    )
    .orderBy(asc(payments.at));
}

/** The invoice a card payment (its payment intent, `pi_…`) was stored for, if any. */
export async function invoiceOfCardPayment(db: Db, paymentIntent: string) {
  const [row] = await db
    .select({ invoiceId: payments.invoiceId })
    .from(payments)
    .where(and(eq(payments.kind, 'payment'), eq(payments.providerRef, paymentIntent)))
    .limit(1);
  return row?.invoiceId ?? null;
}

/** Takes a card refund's reservation (`hold:…`) off its invoice: the refund's own row replaces it. */
export async function deleteHold(db: Db, invoiceId: string, holdRef: string) {
  await db
    .delete(payments)
    .where(
      and(
        eq(payments.invoiceId, invoiceId),
        eq(payments.kind, 'refund'),
        eq(payments.providerRef, holdRef),
        like(payments.providerRef, 'hold:%'),
      ),
    );
}

/** Forgets a taken id: a refund request the service refused may be sent again. */
export async function deleteEvent(db: Db, eventId: string) {
  await db.delete(paymentEvents).where(eq(paymentEvents.eventId, eventId));
}
