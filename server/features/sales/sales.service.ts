import type { z } from 'zod';
import { stageLabel } from '#shared/domain/animal-facts';
import { localDateOf } from '#shared/domain/local-dates';
import { invoiceStatus } from '#shared/domain/sales/invoice-state';
import { invoiceTotals, type TaxRounding } from '#shared/domain/sales/invoice-totals';
import { formatMoney, MAX_MINOR, type CurrencyCode } from '#shared/domain/sales/money';
import { packingChecklist, SHIPPING_CAUTION } from '#shared/domain/sales/packing';
import {
  defaultReservedUntil,
  holdDateProblem,
  reservationExpired,
} from '#shared/domain/sales/reservations';
import { shippingConcerns, type ShippingConcern } from '#shared/domain/sales/shipping-check';
import type {
  AnimalSaleResponse,
  AvailableAnimal,
  BuyerView,
  InvoiceView,
  SaleDetail,
  SalesResponse,
  SalesSettings,
} from '#shared/schemas/sales';
import type {
  buyerBody,
  buyerPatchBody,
  confirmShippingBody,
  invoiceBody,
  reserveBody,
  salePatchBody,
  salesSettingsBody,
  shippingBody,
} from '#shared/schemas/sales';
import type { MemberCollection } from '../../access/memberships';
import type { Background } from '../../background';
import type { Db } from '../../db/client';
import { isForeignKeyViolation, isUniqueViolation } from '../../db/errors';
import type { Logger } from '../../logger';
import type { Mailer } from '../../mail/mailer';
import { HttpError } from '../../middleware/errors';
import { invoicePdf } from './invoice.pdf';
import * as repo from './sales.repository';

type Collection = Pick<MemberCollection, 'collectionId' | 'collectionName' | 'timeZone'>;

export interface SalesDeps {
  now: () => Date;
  mailer: Mailer;
  background: Background;
  logger: Logger;
  /** The animals feature's status change inside our transaction (retire as sold). */
  retireAsSold: (
    tx: Db,
    collection: Collection,
    animalId: string,
    userId: string,
    body: { status: 'sold'; date: string; saleId: string },
  ) => Promise<void>;
  /** A care sheet PDF per animal for the shipping note (the care-sheets feature). */
  careSheetPdf: (collection: Collection, animalId: string) => Promise<Buffer>;
  /**
   * The payments feature, before an invoice is cancelled: the buyer's checkout link stops
   * taking money at the payment service. Throws a 409 when the buyer has just paid there (the
   * webhook may not have arrived yet), so the cancel does not go ahead over money received.
   */
  closeCheckout: (collectionId: string, invoiceId: string) => Promise<void>;
  /** The payments feature: a card checkout link for the invoice e-mail, or null (card off…). */
  paymentLink: (collectionId: string, invoiceId: string) => Promise<string | null>;
}

/** A collection that never saved its sales settings sells with these (the table's defaults). */
export const DEFAULT_SALES_SETTINGS: SalesSettings = {
  currency: 'EUR',
  taxRateBp: 0,
  taxRounding: 'per_invoice',
  sellerDetails: '',
  holdDays: 7,
  safeMinC: 5,
  safeMaxC: 30,
};

const buyerNotFound = () => new HttpError(404, 'not_found', 'We could not find that buyer.');
const saleNotFound = () => new HttpError(404, 'not_found', 'We could not find that sale.');
const invoiceNotFound = () => new HttpError(404, 'not_found', 'We could not find that invoice.');
const conflict = (code: string, message: string) => new HttpError(409, code, message);

const STATUS_WORDS = {
  shipped: 'has been shipped',
  expired: 'has expired',
  cancelled: 'was cancelled',
} as const;
function mustBeReserved(sale: repo.SaleRow, what: string) {
  if (sale.status !== 'reserved')
    throw conflict('sale_ended', `This sale ${STATUS_WORDS[sale.status]}: ${what}`);
}

/** A concern in the keeper's words (temperatures in °C; the page shows the person's unit). */
export function concernWords(concern: ShippingConcern): string {
  switch (concern.kind) {
    case 'too_cold':
      return `The forecast low of ${concern.lowC} °C is below your safe minimum of ${concern.minC} °C.`;
    case 'too_hot':
      return `The forecast high of ${concern.highC} °C is above your safe maximum of ${concern.maxC} °C.`;
    case 'weekend_risk':
      return 'A parcel sent late in the week that is delayed a day may sit in a depot over the weekend.';
  }
}

const iso = (d: Date | null) => (d ? d.toISOString() : null);

function buyerView(row: { buyer: repo.BuyerRow; saleCount: number }): BuyerView {
  const { id, name, email, phone, address, notes } = row.buyer;
  return { id, name, email, phone, address, notes, saleCount: Number(row.saleCount) };
}

function settingsView(row: repo.SettingsRow | undefined): SalesSettings {
  if (!row) return DEFAULT_SALES_SETTINGS;
  return {
    currency: row.currency,
    taxRateBp: row.taxRateBp,
    taxRounding: row.taxRounding as TaxRounding,
    sellerDetails: row.sellerDetails,
    holdDays: row.holdDays,
    safeMinC: row.safeMinC,
    safeMaxC: row.safeMaxC,
  };
}

function invoiceView(row: repo.InvoiceRow, lines: repo.InvoiceLineRow[]): InvoiceView {
  return {
    id: row.id,
    saleId: row.saleId,
    number: row.number,
    status: row.status,
    currency: row.currency,
    taxRateBp: row.taxRateBp,
    taxRounding: row.taxRounding as TaxRounding,
    shippingMinor: row.shippingMinor,
    subtotalMinor: row.subtotalMinor,
    taxMinor: row.taxMinor,
    totalMinor: row.totalMinor,
    paidMinor: row.paidMinor,
    refundedMinor: row.refundedMinor,
    issuedOn: row.issuedOn,
    dueOn: row.dueOn,
    emailedAt: iso(row.emailedAt),
    lines: lines.map((l) => ({
      position: l.position,
      animalId: l.animalId,
      description: l.description,
      quantity: l.quantity,
      unitMinor: l.unitMinor,
      netMinor: l.netMinor,
      taxMinor: l.taxMinor,
    })),
  };
}

/**
 * Sales (issue 21, part S): settings, buyers, reservations and their expiry, invoices,
 * shipping and the hand-over that retires animals as sold. Owners and keepers only: the routes
 * are mounted behind `member('keeper')`.
 */
export function createSalesService(db: Db, deps: SalesDeps) {
  const { now } = deps;
  const today = (c: Collection) => localDateOf(now(), c.timeZone);

  async function loadSettings(tx: Db, collectionId: string) {
    return settingsView(await repo.findSettings(tx, collectionId));
  }

  async function saleOrThrow(tx: Db, c: Collection, saleId: string, lock = false) {
    const sale = await repo.findSale(tx, c.collectionId, saleId, lock);
    if (!sale) throw saleNotFound();
    return sale;
  }

  async function detail(c: Collection, saleId: string): Promise<SaleDetail> {
    const sale = await saleOrThrow(db, c, saleId);
    const [buyer, animals, invoice, settings] = await Promise.all([
      repo.findBuyer(db, c.collectionId, sale.buyerId),
      repo.saleAnimalsOf(db, sale.id),
      repo.liveInvoiceOf(db, sale.id),
      loadSettings(db, c.collectionId),
    ]);
    const lines = invoice ? await repo.linesOf(db, invoice.id) : [];
    const held = animals.filter((a) => !a.releasedAt);
    const concerns =
      sale.shipOn && sale.forecastLowC !== null && sale.forecastHighC !== null
        ? shippingConcerns(
            sale.shipOn,
            { lowC: sale.forecastLowC, highC: sale.forecastHighC },
            { minC: settings.safeMinC, maxC: settings.safeMaxC },
          )
        : null;
    return {
      id: sale.id,
      status: sale.status,
      buyer: buyerView(buyer!),
      reservedUntil: sale.reservedUntil,
      animalCount: animals.length,
      priceMinor: (sale.status === 'reserved' || sale.status === 'shipped' ? held : animals).reduce(
        (sum, a) => sum + a.priceMinor,
        0,
      ),
      currency: animals[0]?.currency ?? settings.currency,
      invoiceStatus: invoice?.status ?? null,
      shipOn: sale.shipOn,
      createdAt: sale.createdAt.toISOString(),
      note: sale.note,
      animals: animals.map((a) => ({
        id: a.id,
        labelCode: a.labelCode,
        name: a.name,
        scientificName: a.scientificName,
        lifeStage: a.lifeStage,
        sex: a.sex,
        sizeMm: a.sizeMm,
        status: a.status,
        priceMinor: a.priceMinor,
        currency: a.currency,
        released: a.releasedAt !== null,
      })),
      invoice: invoice ? invoiceView(invoice, lines) : null,
      shipping: {
        shipOn: sale.shipOn,
        shipRoute: sale.shipRoute,
        forecastLowC: sale.forecastLowC,
        forecastHighC: sale.forecastHighC,
        carrier: sale.carrier,
        tracking: sale.tracking,
        safeMinC: settings.safeMinC,
        safeMaxC: settings.safeMaxC,
        concerns,
        packing: packingChecklist(concerns ?? [], sale.packing as Record<string, boolean>),
        confirmedAt: iso(sale.shipCheckConfirmedAt),
        confirmedOver: sale.shipCheckConfirmedAt
          ? ((sale.shipCheckConcerns as ShippingConcern[] | null) ?? [])
          : null,
        caution: SHIPPING_CAUTION,
      },
      shippedAt: iso(sale.shippedAt),
      endedAt: iso(sale.endedAt),
    };
  }

  /** Releases a reserved sale's animals and cancels its unpaid invoice, in `tx`. */
  async function endReservation(
    tx: Db,
    saleId: string,
    status: 'expired' | 'cancelled',
  ): Promise<boolean> {
    const at = now();
    const invoice = await repo.liveInvoiceOf(tx, saleId, true);
    if (invoice && invoice.paidMinor - invoice.refundedMinor > 0) return false;
    if (!(await repo.endReservedSale(tx, saleId, status, at))) return false;
    await repo.releaseAnimals(tx, saleId, at);
    if (invoice) await repo.cancelInvoiceRow(tx, invoice.id, at);
    return true;
  }

  /** Before a cancel or an expiry: the live invoice's checkout, if it has one, is closed. */
  async function closeCheckoutOf(collectionId: string, saleId: string) {
    const invoice = await repo.liveInvoiceOf(db, saleId);
    if (invoice?.checkoutSessionId) await deps.closeCheckout(collectionId, invoice.id);
  }

  async function invoiceOrThrow(tx: Db, c: Collection, invoiceId: string, lock = false) {
    const invoice = await repo.findInvoice(tx, c.collectionId, invoiceId, lock);
    if (!invoice) throw invoiceNotFound();
    return invoice;
  }

  async function invoicePdfOf(c: Collection, invoiceId: string) {
    const invoice = await invoiceOrThrow(db, c, invoiceId);
    const sale = await saleOrThrow(db, c, invoice.saleId);
    const [lines, buyer, settings] = await Promise.all([
      repo.linesOf(db, invoice.id),
      repo.findBuyer(db, c.collectionId, sale.buyerId),
      loadSettings(db, c.collectionId),
    ]);
    const pdf = await invoicePdf({
      invoice: invoiceView(invoice, lines),
      sellerDetails: settings.sellerDetails,
      collectionName: c.collectionName,
      buyer: buyer!.buyer,
    });
    return { invoice, buyer: buyer!.buyer, pdf };
  }

  return {
    // ---- Settings ---------------------------------------------------------------------
    settings: (c: Collection) => loadSettings(db, c.collectionId),

    async saveSettings(c: Collection, body: z.infer<typeof salesSettingsBody>) {
      return settingsView(await repo.upsertSettings(db, c.collectionId, body, now()));
    },

    // ---- Buyers -----------------------------------------------------------------------
    async buyers(c: Collection) {
      return { buyers: (await repo.listBuyers(db, c.collectionId)).map(buyerView) };
    },

    async buyer(c: Collection, buyerId: string) {
      const row = await repo.findBuyer(db, c.collectionId, buyerId);
      if (!row) throw buyerNotFound();
      return buyerView(row);
    },

    async addBuyer(c: Collection, body: z.infer<typeof buyerBody>) {
      const id = await repo.insertBuyer(db, c.collectionId, body);
      return this.buyer(c, id);
    },

    async editBuyer(c: Collection, buyerId: string, body: z.infer<typeof buyerPatchBody>) {
      const current = await repo.findBuyer(db, c.collectionId, buyerId);
      if (!current) throw buyerNotFound();
      const { name, email, phone, address, notes } = current.buyer;
      const changed = Object.fromEntries(Object.entries(body).filter(([, v]) => v !== undefined));
      await repo.updateBuyer(
        db,
        c.collectionId,
        buyerId,
        { name, email, phone, address, notes, ...changed },
        now(),
      );
      return this.buyer(c, buyerId);
    },

    async removeBuyer(c: Collection, buyerId: string) {
      const row = await repo.findBuyer(db, c.collectionId, buyerId);
      if (!row) throw buyerNotFound();
      if (Number(row.saleCount) > 0)
        throw conflict(
          'buyer_has_sales',
          `${row.buyer.name} has ${row.saleCount} sale(s) on record, so they stay in your buyers: the sales' history needs them.`,
        );
      try {
        await repo.deleteBuyer(db, c.collectionId, buyerId);
      } catch (err) {
        // A sale made for them between the check and the delete (the foreign key restricts).
        if (isForeignKeyViolation(err))
          throw conflict('buyer_has_sales', `${row.buyer.name} now has a sale, so they stay.`);
        throw err;
      }
    },

    // ---- Reservations -----------------------------------------------------------------
    async available(c: Collection): Promise<{ animals: AvailableAnimal[] }> {
      const rows = await repo.availableAnimals(db, c.collectionId);
      return { animals: rows.map(({ status: _status, ...a }) => a) };
    },

    async list(c: Collection): Promise<SalesResponse> {
      const rows = await repo.listSales(db, c.collectionId);
      const counts = { reserved: 0, shipped: 0, expired: 0, cancelled: 0 };
      const settings = await loadSettings(db, c.collectionId);
      const sales = rows.map((r) => {
        counts[r.sale.status]++;
        return {
          id: r.sale.id,
          status: r.sale.status,
          buyer: { id: r.sale.buyerId, name: r.buyerName },
          reservedUntil: r.sale.reservedUntil,
          animalCount: Number(r.animalCount),
          priceMinor: Number(r.priceMinor),
          currency: r.currency ?? settings.currency,
          invoiceStatus: r.invoiceStatus ?? null,
          shipOn: r.sale.shipOn,
          createdAt: r.sale.createdAt.toISOString(),
        };
      });
      return { sales, counts };
    },

    async reserve(c: Collection, userId: string, body: z.infer<typeof reserveBody>) {
      const buyer = await repo.findBuyer(db, c.collectionId, body.buyerId);
      if (!buyer) throw buyerNotFound();
      const settings = await loadSettings(db, c.collectionId);
      const day = today(c);
      const reservedUntil = body.reservedUntil ?? defaultReservedUntil(day, settings.holdDays);
      const problem = holdDateProblem(reservedUntil, day);
      if (problem)
        throw new HttpError(422, 'invalid', problem, [{ path: 'reservedUntil', message: problem }]);
      const listed = await repo.listedAnimals(db, c.collectionId, body.animalIds);
      const missing = body.animalIds.length - listed.length;
      if (missing > 0)
        throw conflict(
          'not_listed',
          `${missing === 1 ? 'One of the animals is' : `${missing} of the animals are`} not listed for sale. List them on the stock page first.`,
        );
      const gone = listed.filter((a) => a.status !== 'active');
      if (gone.length)
        throw conflict(
          'not_active',
          `${gone.map((a) => a.labelCode).join(', ')} no longer in the collection (${gone[0]!.status.replace('_', ' ')}).`,
        );
      const currencies = new Set(listed.map((a) => a.currency));
      if (currencies.size > 1)
        throw conflict(
          'mixed_currencies',
          `These animals are priced in ${[...currencies].join(' and ')}: one sale takes one currency.`,
        );
      try {
        const id = await db.transaction(async (tx) => {
          const saleId = await repo.insertSale(
            tx,
            {
              collectionId: c.collectionId,
              buyerId: body.buyerId,
              reservedUntil,
              note: body.note,
              createdBy: userId,
            },
            now(),
          );
          await repo.insertSaleAnimals(
            tx,
            listed.map((a) => ({
              saleId,
              animalId: a.id,
              priceMinor: a.priceMinor,
              currency: a.currency,
            })),
          );
          return saleId;
        });
        return detail(c, id);
      } catch (err) {
        // The partial unique index (one unreleased sale per animal) settles a race.
        if (isUniqueViolation(err))
          throw conflict(
            'already_reserved',
            'One of these animals is already reserved in another sale. Choose again from what is available.',
          );
        throw err;
      }
    },

    detail,

    async patch(c: Collection, saleId: string, body: z.infer<typeof salePatchBody>) {
      await db.transaction(async (tx) => {
        const sale = await saleOrThrow(tx, c, saleId, true);
        mustBeReserved(sale, 'its hold cannot change.');
        if (body.reservedUntil !== undefined) {
          const problem = holdDateProblem(body.reservedUntil, today(c));
          if (problem)
            throw new HttpError(422, 'invalid', problem, [
              { path: 'reservedUntil', message: problem },
            ]);
        }
        await repo.updateSale(tx, saleId, {
          ...(body.reservedUntil !== undefined ? { reservedUntil: body.reservedUntil } : {}),
          ...(body.note !== undefined ? { note: body.note } : {}),
          updatedAt: now(),
        });
      });
      return detail(c, saleId);
    },

    async cancel(c: Collection, saleId: string) {
      await saleOrThrow(db, c, saleId);
      await closeCheckoutOf(c.collectionId, saleId);
      await db.transaction(async (tx) => {
        const sale = await saleOrThrow(tx, c, saleId, true);
        mustBeReserved(sale, 'there is nothing to cancel.');
        if (!(await endReservation(tx, saleId, 'cancelled')))
          throw conflict(
            'money_received',
            'Money was received for this sale. Refund it first, then cancel the sale.',
          );
      });
      return detail(c, saleId);
    },

    /**
     * The expiry job's work (pg-boss `expire-reservations`): every reserved sale whose hold
     * ended before its collection's local today, with nothing paid, expires — its animals are
     * released and its open invoice cancelled. Safe to run again: an ended sale is skipped.
     */
    async expireReservations(): Promise<number> {
      const at = now();
      const due = (await repo.reservedSales(db)).filter((s) =>
        reservationExpired(
          { status: 'reserved', reservedUntil: s.reservedUntil, paidMinor: Number(s.paidMinor) },
          localDateOf(at, s.timeZone),
        ),
      );
      let expired = 0;
      for (const sale of due) {
        // One sale that cannot end now (the buyer paying this minute, the service out of
        // reach) is logged and tried again on the next run; the others still expire.
        try {
          await closeCheckoutOf(sale.collectionId, sale.id);
          const done = await db.transaction(async (tx) => {
            const locked = await repo.findSale(tx, sale.collectionId, sale.id, true);
            if (!locked || locked.status !== 'reserved') return false;
            return endReservation(tx, sale.id, 'expired');
          });
          if (done) expired++;
        } catch (err) {
          deps.logger.warn({ err, saleId: sale.id }, 'a hold could not expire this run');
        }
      }
      return expired;
    },

    /**
     * The animals feature's guard before an animal's status changes other than by shipping it
     * (deceased, rehomed, on loan; or a sold animal put back). A reserved animal with no live
     * invoice leaves its sale (the sale ends cancelled when it was the last); one on a live
     * invoice is refused in words, since the invoice would be wrong; an animal sold and put
     * back leaves its shipped sale's hold, so it can be offered again (the sale keeps it).
     */
    async animalStatusChanging(
      tx: Db,
      collectionId: string,
      animalId: string,
      change: { from: string; to: string },
    ): Promise<void> {
      const live = await repo.liveSaleOfAnimal(tx, collectionId, animalId);
      if (!live) return;
      const at = now();
      if (live.status === 'shipped') {
        if (change.from === 'sold') await repo.releaseAnimal(tx, live.saleId, animalId, at);
        return;
      }
      if (live.status !== 'reserved') return;
      const invoice = await repo.liveInvoiceOf(tx, live.saleId, true);
      if (invoice)
        throw conflict(
          'on_invoice',
          `${live.labelCode} is on invoice ${invoice.number} for ${live.buyerName}. Cancel that invoice (refund any money first), then record the change; the sale can be invoiced again without it.`,
        );
      await repo.releaseAnimal(tx, live.saleId, animalId, at);
      if ((await repo.heldCount(tx, live.saleId)) === 0)
        await repo.endReservedSale(tx, live.saleId, 'cancelled', at);
    },

    // ---- Invoices ---------------------------------------------------------------------
    async createInvoice(
      c: Collection,
      userId: string,
      saleId: string,
      body: z.infer<typeof invoiceBody>,
    ): Promise<InvoiceView> {
      const id = await db.transaction(async (tx) => {
        const sale = await saleOrThrow(tx, c, saleId, true);
        mustBeReserved(sale, 'it cannot get a new invoice.');
        const live = await repo.liveInvoiceOf(tx, saleId);
        if (live)
          throw conflict(
            'invoice_exists',
            `This sale has invoice ${live.number} already. Cancel it first to issue a new one.`,
          );
        const settings = await loadSettings(tx, c.collectionId);
        const animals = (await repo.saleAnimalsOf(tx, saleId)).filter((a) => !a.releasedAt);
        const currency = animals[0]?.currency ?? settings.currency;
        const rate = settings.taxRateBp;
        const inputs = [
          ...animals.map((a) => ({
            animalId: a.id,
            description: `${a.scientificName}, ${stageLabel(a.group, a.lifeStage).toLowerCase()} (${a.labelCode})`,
            quantity: 1,
            unitMinor: a.priceMinor,
          })),
          ...(body.shippingMinor > 0
            ? [
                {
                  animalId: null,
                  description: 'Shipping',
                  quantity: 1,
                  unitMinor: body.shippingMinor,
                },
              ]
            : []),
          ...body.extraLines.map((l) => ({ animalId: null, ...l })),
        ];
        // Far beyond any sale, but the sums must stay exact integers (MAX_MINOR < 2^53).
        const gross = inputs.reduce((sum, l) => sum + l.unitMinor * l.quantity, 0);
        if (gross > MAX_MINOR)
          throw new HttpError(
            422,
            'total_too_large',
            'This invoice would be larger than any amount Rackside keeps. Check the prices and quantities.',
          );
        const totals = invoiceTotals(
          inputs.map((l) => ({
            unitPrice: l.unitMinor,
            quantity: l.quantity,
            taxBasisPoints: rate,
          })),
          settings.taxRounding,
        );
        const issuedOn = today(c);
        const values = (number: string) => ({
          collectionId: c.collectionId,
          saleId,
          number,
          currency,
          taxRateBp: rate,
          taxRounding: settings.taxRounding,
          shippingMinor: body.shippingMinor,
          subtotalMinor: totals.net,
          taxMinor: totals.tax,
          totalMinor: totals.gross,
          // A zero invoice (animals given away) is paid as it stands (invoice-state.ts).
          status: invoiceStatus({
            totalMinor: totals.gross,
            paidMinor: 0,
            refundedMinor: 0,
            cancelled: false,
          }),
          issuedOn,
          dueOn: body.dueOn,
          createdBy: userId,
          createdAt: now(),
          updatedAt: now(),
        });
        const lines = inputs.map((l, i) => ({
          position: i + 1,
          animalId: l.animalId,
          description: l.description,
          quantity: l.quantity,
          unitMinor: l.unitMinor,
          netMinor: totals.lines[i]!.net,
          taxMinor: totals.lines[i]!.tax,
        }));
        // The running number may already be taken (a restored backup's invoices): take the next,
        // each try in a savepoint so the transaction survives the clash.
        for (let attempt = 0; ; attempt++) {
          const n = await repo.takeInvoiceNumber(tx, c.collectionId);
          const number = `${issuedOn.slice(0, 4)}-${String(n).padStart(4, '0')}`;
          try {
            const row = await tx.transaction((sp) => repo.insertInvoice(sp, values(number), lines));
            return row.id;
          } catch (err) {
            const clash = err as { constraint?: string; cause?: { constraint?: string } };
            const numberTaken =
              isUniqueViolation(err) &&
              (clash.cause?.constraint ?? clash.constraint) === 'invoices_collection_number';
            if (!numberTaken || attempt >= 50) throw err;
          }
        }
      });
      return this.invoice(c, id);
    },

    async invoice(c: Collection, invoiceId: string): Promise<InvoiceView> {
      const row = await invoiceOrThrow(db, c, invoiceId);
      return invoiceView(row, await repo.linesOf(db, row.id));
    },

    async invoicePdf(c: Collection, invoiceId: string) {
      const { invoice, pdf } = await invoicePdfOf(c, invoiceId);
      return { number: invoice.number, pdf };
    },

    async emailInvoice(c: Collection, invoiceId: string): Promise<InvoiceView> {
      const { invoice, buyer, pdf } = await invoicePdfOf(c, invoiceId);
      if (invoice.cancelledAt)
        throw conflict('invoice_cancelled', 'This invoice was cancelled: it is not sent.');
      if (!buyer.email)
        throw new HttpError(
          422,
          'no_email',
          `${buyer.name} has no e-mail address. Add one on the Buyers page, then send again.`,
        );
      const total = formatMoney(invoice.totalMinor, invoice.currency as CurrencyCode, 'en-GB');
      // The card link is a convenience: when the payment service is out of reach, the invoice
      // still goes, and the keeper can send the link from the sale's page later.
      const link = await deps.paymentLink(c.collectionId, invoiceId).catch((err: unknown) => {
        deps.logger.warn({ err, invoiceId }, 'no card payment link for the invoice e-mail');
        return null;
      });
      try {
        await deps.mailer.send({
          to: buyer.email,
          subject: `Invoice ${invoice.number} from ${c.collectionName}`,
          text: [
            `Hello ${buyer.name},`,
            '',
            `Please find invoice ${invoice.number} for ${total} attached.${invoice.dueOn ? ` It is due on ${invoice.dueOn}.` : ''}`,
            '',
            ...(link ? [`Pay by card on the payment service's secure page: ${link}`, ''] : []),
            `${c.collectionName}`,
          ].join('\n'),
          attachments: [
            {
              filename: `invoice-${invoice.number}.pdf`,
              content: pdf,
              contentType: 'application/pdf',
            },
          ],
        });
      } catch (err) {
        deps.logger.error({ err, invoiceId }, 'invoice e-mail refused');
        throw new HttpError(
          503,
          'mail_failed',
          'The mail server did not take the e-mail. Try again in a few minutes.',
        );
      }
      await repo.markEmailed(db, invoice.id, now());
      return this.invoice(c, invoiceId);
    },

    async cancelInvoice(c: Collection, invoiceId: string): Promise<InvoiceView> {
      const found = await invoiceOrThrow(db, c, invoiceId);
      if (found.checkoutSessionId && !found.cancelledAt)
        await deps.closeCheckout(c.collectionId, invoiceId);
      await db.transaction(async (tx) => {
        const invoice = await invoiceOrThrow(tx, c, invoiceId, true);
        if (invoice.cancelledAt)
          throw conflict('invoice_cancelled', 'This invoice is cancelled already.');
        if (invoice.paidMinor - invoice.refundedMinor > 0)
          throw conflict(
            'money_received',
            'Money was received for this invoice. Refund it first, then cancel the invoice.',
          );
        const sale = await saleOrThrow(tx, c, invoice.saleId);
        if (sale.status === 'shipped')
          throw conflict('sale_ended', 'The animals were shipped: this invoice stays.');
        await repo.cancelInvoiceRow(tx, invoiceId, now());
      });
      return this.invoice(c, invoiceId);
    },

    // ---- Shipping ---------------------------------------------------------------------
    async saveShipping(c: Collection, saleId: string, body: z.infer<typeof shippingBody>) {
      await db.transaction(async (tx) => {
        const sale = await saleOrThrow(tx, c, saleId, true);
        mustBeReserved(sale, 'its shipping cannot change.');
        // A confirmed check holds only for the day and forecast it was made on.
        const sameCheck =
          sale.shipOn === body.shipOn &&
          sale.forecastLowC === body.forecastLowC &&
          sale.forecastHighC === body.forecastHighC;
        await repo.updateSale(tx, saleId, {
          shipOn: body.shipOn,
          shipRoute: body.shipRoute,
          forecastLowC: body.forecastLowC,
          forecastHighC: body.forecastHighC,
          packing: body.packing,
          carrier: body.carrier,
          tracking: body.tracking,
          ...(sameCheck
            ? {}
            : { shipCheckConfirmedAt: null, shipCheckConfirmedBy: null, shipCheckConcerns: null }),
          updatedAt: now(),
        });
      });
      return detail(c, saleId);
    },

    async confirmShipping(
      c: Collection,
      userId: string,
      saleId: string,
      body: z.infer<typeof confirmShippingBody>,
    ) {
      await db.transaction(async (tx) => {
        const sale = await saleOrThrow(tx, c, saleId, true);
        mustBeReserved(sale, 'there is nothing to check.');
        if (!sale.shipOn || sale.forecastLowC === null || sale.forecastHighC === null)
          throw conflict(
            'no_forecast',
            'Type in the day you ship and the forecast low and high along the route first.',
          );
        const settings = await loadSettings(tx, c.collectionId);
        const concerns = shippingConcerns(
          sale.shipOn,
          { lowC: sale.forecastLowC, highC: sale.forecastHighC },
          { minC: settings.safeMinC, maxC: settings.safeMaxC },
        );
        if (concerns.length && !body.shipAnyway)
          throw conflict(
            'shipping_concerns',
            `${concerns.map(concernWords).join(' ')} Choose another day, or confirm that you ship anyway.`,
          );
        await repo.updateSale(tx, saleId, {
          shipCheckConfirmedAt: now(),
          shipCheckConfirmedBy: userId,
          shipCheckConcerns: concerns,
          updatedAt: now(),
        });
      });
      return detail(c, saleId);
    },

    /**
     * The hand-over: only a paid sale whose check is confirmed. In one transaction the sale is
     * shipped and each animal retired as sold (a `status_changed` event naming the sale, never
     * the buyer), its listing kept for the care sheet (no longer offered). The buyer's shipping note goes out afterwards.
     */
    async ship(c: Collection, userId: string, saleId: string) {
      const shipped = await db.transaction(async (tx) => {
        const sale = await saleOrThrow(tx, c, saleId, true);
        mustBeReserved(sale, 'it cannot be shipped.');
        const invoice = await repo.liveInvoiceOf(tx, saleId, true);
        if (!invoice)
          throw conflict('no_invoice', 'Issue the invoice first: a sale ships once it is paid.');
        if (invoice.status !== 'paid')
          throw conflict(
            'not_paid',
            `Invoice ${invoice.number} is ${invoice.status.replace('_', ' ')}: ship once it is paid in full.`,
          );
        if (!sale.shipCheckConfirmedAt)
          throw conflict(
            'check_not_confirmed',
            'Confirm the shipping check (the day and the route’s forecast) before you ship.',
          );
        const animals = (await repo.saleAnimalsOf(tx, saleId)).filter((a) => !a.releasedAt);
        const gone = animals.filter((a) => a.status !== 'active');
        if (gone.length)
          throw conflict(
            'not_active',
            `${gone.map((a) => a.labelCode).join(', ')} is no longer active (${gone[0]!.status.replace('_', ' ')}). Talk to the buyer and cancel or re-invoice the sale.`,
          );
        const day = today(c);
        for (const a of animals)
          await deps.retireAsSold(tx, c, a.id, userId, { status: 'sold', date: day, saleId });
        const at = now();
        await repo.updateSale(tx, saleId, {
          status: 'shipped',
          shippedAt: at,
          endedAt: at,
          updatedAt: at,
        });
        return animals;
      });
      const result = await detail(c, saleId);
      deps.background.run('shipping note', () => sendShippingNote(c, result, shipped));
      return result;
    },

    async animalSale(c: Collection, animalId: string): Promise<AnimalSaleResponse> {
      const row = await repo.soldWith(db, c.collectionId, animalId);
      if (!row) return { sale: null };
      return {
        sale: {
          saleId: row.saleId,
          buyerName: row.buyerName,
          shippedOn: row.shippedAt ? localDateOf(row.shippedAt, c.timeZone) : null,
          status: row.status,
        },
      };
    },
  };

  /** The e-mail that travels with a shipped parcel: what was sent and each care sheet. */
  async function sendShippingNote(
    c: Collection,
    sale: SaleDetail,
    animals: { id: string; labelCode: string; scientificName: string }[],
  ) {
    const email = sale.buyer.email;
    if (!email) return;
    const attachments = await shippingNoteCareSheets(c, animals);
    await deps.mailer.send({
      to: email,
      subject: `Your animals from ${c.collectionName} are on their way`,
      text: [
        `Hello ${sale.buyer.name},`,
        '',
        `We shipped your parcel on ${sale.shipping.shipOn ?? today(c)}${sale.shipping.carrier ? ` with ${sale.shipping.carrier}` : ''}${sale.shipping.tracking ? ` (tracking ${sale.shipping.tracking})` : ''}.`,
        '',
        ...animals.map((a) => `- ${a.scientificName} (${a.labelCode})`),
        '',
        'Open the parcel as soon as it arrives, somewhere calm and escape-proof, and let each animal settle before you offer food.',
        attachments.length ? 'A care sheet for each animal is attached.' : '',
        '',
        c.collectionName,
      ].join('\n'),
      attachments,
    });
  }

  /** Care sheets for the shipping note, one PDF per animal. */
  async function shippingNoteCareSheets(
    c: Collection,
    animals: { id: string; labelCode: string }[],
  ) {
    const sheets = [];
    for (const a of animals)
      sheets.push({
        filename: `care-sheet-${a.labelCode}.pdf`,
        content: await deps.careSheetPdf(c, a.id),
        contentType: 'application/pdf',
      });
    return sheets;
  }
}

export type SalesService = ReturnType<typeof createSalesService>;
