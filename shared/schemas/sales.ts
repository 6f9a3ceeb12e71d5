import { z } from 'zod';
import { ANIMAL_STATUSES, LIFE_STAGES, SEXES } from '../domain/animal-facts';
import { CURRENCY_CODES, MAX_MINOR } from '../domain/sales/money';
import { PACKING_KEYS } from '../domain/sales/packing';
import { localDate, uuid } from './common';
import { celsius } from './measures';
import './messages';

/**
 * Sales at the API edge (issue 21, part S: settings, buyers, reservations, invoices, shipping).
 * Money in whole minor units beside its ISO 4217 code; temperatures in °C (the client converts
 * from the person's unit, as for room climate).
 */

const text = (max: number, what: string) =>
  z
    .string()
    .trim()
    .max(max, { message: `Keep ${what} under ${max} characters.` });
const optionalText = (max: number, what: string) =>
  text(max, what)
    .nullish()
    .transform((v) => (v ? v : null));

export const currencyCode = z.enum(CURRENCY_CODES as [string, ...string[]], {
  message: 'Choose a currency from the list.',
});
export const minorAmount = z
  .number({ message: 'Give the amount as a whole number of minor units.' })
  .int({ message: 'Give the amount as a whole number of minor units.' })
  .min(0, { message: 'An amount cannot be negative.' })
  .max(MAX_MINOR, { message: 'That amount is too large.' });

export const TAX_ROUNDINGS = ['per_invoice', 'per_line'] as const;

// ---- Settings ---------------------------------------------------------------------------

export const salesSettingsBody = z
  .object({
    currency: currencyCode,
    taxRateBp: z
      .number({ message: 'Give the tax rate as a percent.' })
      .int({ message: 'Give the tax rate to a hundredth of a percent at most.' })
      .min(0, { message: 'The tax rate is from 0 to 100 %.' })
      .max(10_000, { message: 'The tax rate is from 0 to 100 %.' }),
    taxRounding: z.enum(TAX_ROUNDINGS, { message: 'Choose per invoice or per line.' }),
    sellerDetails: text(1000, 'the seller details'),
    holdDays: z
      .number({ message: 'Give the hold in days.' })
      .int({ message: 'Give the hold in whole days.' })
      .min(1, { message: 'Hold animals for at least a day.' })
      .max(365, { message: 'Hold animals for 365 days at most.' }),
    safeMinC: celsius,
    safeMaxC: celsius,
  })
  .refine((s) => s.safeMinC < s.safeMaxC, {
    message: 'The lowest safe temperature must be below the highest.',
    path: ['safeMaxC'],
  });
export type SalesSettingsBody = z.infer<typeof salesSettingsBody>;
export const salesSettingsResponse = z.object({
  currency: currencyCode,
  taxRateBp: z.number(),
  taxRounding: z.enum(TAX_ROUNDINGS),
  sellerDetails: z.string(),
  holdDays: z.number(),
  safeMinC: z.number(),
  safeMaxC: z.number(),
});
export type SalesSettings = z.infer<typeof salesSettingsResponse>;

// ---- Buyers -----------------------------------------------------------------------------

export const buyerBody = z.object({
  name: z
    .string({ message: 'Give the buyer’s name.' })
    .trim()
    .min(1, { message: 'Give the buyer’s name.' })
    .max(120, { message: 'Keep the name under 120 characters.' }),
  email: z
    .union([z.literal(''), z.email({ message: 'This e-mail address is not valid.' }).max(254)])
    .nullish()
    .transform((v) => (v ? v.toLowerCase() : null)),
  phone: optionalText(40, 'the phone number'),
  address: optionalText(500, 'the address'),
  notes: optionalText(1000, 'the notes'),
});
export type BuyerBody = z.input<typeof buyerBody>;
/** A change to a buyer: the fields sent change, the rest stay; an empty string clears one. */
export const buyerPatchBody = buyerBody
  .partial()
  .refine((b) => Object.values(b).some((v) => v !== undefined), {
    message: 'Say what to change about the buyer.',
  });
export type BuyerPatchBody = z.input<typeof buyerPatchBody>;
export const buyerParams = z.object({ collectionId: uuid, buyerId: uuid });

export const buyerView = z.object({
  id: z.string(),
  name: z.string(),
  email: z.string().nullable(),
  phone: z.string().nullable(),
  address: z.string().nullable(),
  notes: z.string().nullable(),
  saleCount: z.number(),
});
export type BuyerView = z.infer<typeof buyerView>;
export const buyersResponse = z.object({ buyers: z.array(buyerView) });

// ---- Reservations and sales -------------------------------------------------------------

export const SALE_STATUSES = ['reserved', 'shipped', 'expired', 'cancelled'] as const;
export type SaleStatus = (typeof SALE_STATUSES)[number];

export const reserveBody = z.object({
  buyerId: uuid,
  animalIds: z
    .array(uuid)
    .min(1, { message: 'Choose at least one animal.' })
    .max(200, { message: 'Reserve 200 animals at most in one sale.' })
    .refine((ids) => new Set(ids).size === ids.length, {
      message: 'An animal is chosen twice.',
    }),
  /** The hold's last day; without it, today plus the settings' hold days. */
  reservedUntil: localDate.optional(),
  note: optionalText(500, 'the note'),
});
export type ReserveBody = z.input<typeof reserveBody>;

export const salePatchBody = z
  .object({ reservedUntil: localDate.optional(), note: optionalText(500, 'the note').optional() })
  .refine((b) => b.reservedUntil !== undefined || b.note !== undefined, {
    message: 'Say what to change: the hold’s last day or the note.',
  });
export type SalePatchBody = z.input<typeof salePatchBody>;
export const saleParams = z.object({ collectionId: uuid, saleId: uuid });
export const invoiceParams = z.object({ collectionId: uuid, invoiceId: uuid });
export const animalSaleParams = z.object({ collectionId: uuid, animalId: uuid });

export const INVOICE_STATUSES = ['open', 'part_paid', 'paid', 'refunded', 'cancelled'] as const;

export const saleSummary = z.object({
  id: z.string(),
  status: z.enum(SALE_STATUSES),
  buyer: z.object({ id: z.string(), name: z.string() }),
  reservedUntil: z.string(),
  animalCount: z.number(),
  priceMinor: z.number(),
  currency: z.string(),
  invoiceStatus: z.enum(INVOICE_STATUSES).nullable(),
  shipOn: z.string().nullable(),
  createdAt: z.string(),
});
export type SaleSummary = z.infer<typeof saleSummary>;
export const salesResponse = z.object({
  sales: z.array(saleSummary),
  counts: z.object({
    reserved: z.number(),
    shipped: z.number(),
    expired: z.number(),
    cancelled: z.number(),
  }),
});
export type SalesResponse = z.infer<typeof salesResponse>;

/** Listed animals a keeper may reserve now, with their clutch for "take N from this clutch". */
export const availableAnimal = z.object({
  id: z.string(),
  labelCode: z.string(),
  name: z.string(),
  scientificName: z.string(),
  lifeStage: z.enum(LIFE_STAGES),
  sex: z.enum(SEXES),
  sizeMm: z.number().nullable(),
  clutch: z.string().nullable(),
  priceMinor: z.number(),
  currency: z.string(),
});
export type AvailableAnimal = z.infer<typeof availableAnimal>;
export const availableResponse = z.object({ animals: z.array(availableAnimal) });

export const invoiceLineView = z.object({
  position: z.number(),
  animalId: z.string().nullable(),
  description: z.string(),
  quantity: z.number(),
  unitMinor: z.number(),
  netMinor: z.number(),
  taxMinor: z.number(),
});
export const invoiceView = z.object({
  id: z.string(),
  saleId: z.string(),
  number: z.string(),
  status: z.enum(INVOICE_STATUSES),
  currency: z.string(),
  taxRateBp: z.number(),
  taxRounding: z.enum(TAX_ROUNDINGS),
  shippingMinor: z.number(),
  subtotalMinor: z.number(),
  taxMinor: z.number(),
  totalMinor: z.number(),
  paidMinor: z.number(),
  refundedMinor: z.number(),
  issuedOn: z.string(),
  dueOn: z.string().nullable(),
  emailedAt: z.string().nullable(),
  lines: z.array(invoiceLineView),
});
export type InvoiceView = z.infer<typeof invoiceView>;

export const shippingConcernView = z.discriminatedUnion('kind', [
  z.object({ kind: z.literal('too_cold'), lowC: z.number(), minC: z.number() }),
  z.object({ kind: z.literal('too_hot'), highC: z.number(), maxC: z.number() }),
  z.object({ kind: z.literal('weekend_risk'), weekday: z.number() }),
]);
export const packingLineView = z.object({
  key: z.enum(PACKING_KEYS as [string, ...string[]]),
  words: z.string(),
  needed: z.boolean(),
  done: z.boolean(),
});

export const saleDetail = saleSummary.extend({
  note: z.string().nullable(),
  buyer: buyerView,
  animals: z.array(
    z.object({
      id: z.string(),
      labelCode: z.string(),
      name: z.string(),
      scientificName: z.string(),
      lifeStage: z.enum(LIFE_STAGES),
      sex: z.enum(SEXES),
      sizeMm: z.number().nullable(),
      status: z.enum(ANIMAL_STATUSES),
      priceMinor: z.number(),
      currency: z.string(),
      released: z.boolean(),
    }),
  ),
  invoice: invoiceView.nullable(),
  shipping: z.object({
    shipOn: z.string().nullable(),
    shipRoute: z.string().nullable(),
    forecastLowC: z.number().nullable(),
    forecastHighC: z.number().nullable(),
    carrier: z.string().nullable(),
    tracking: z.string().nullable(),
    safeMinC: z.number(),
    safeMaxC: z.number(),
    /** Null until a day and forecast are typed in. */
    concerns: z.array(shippingConcernView).nullable(),
    packing: z.array(packingLineView),
    confirmedAt: z.string().nullable(),
    /** The concerns the keeper shipped anyway over, as they stood when confirmed. */
    confirmedOver: z.array(shippingConcernView).nullable(),
    caution: z.string(),
  }),
  shippedAt: z.string().nullable(),
  endedAt: z.string().nullable(),
});
export type SaleDetail = z.infer<typeof saleDetail>;

// ---- Invoices ---------------------------------------------------------------------------

export const invoiceBody = z.object({
  shippingMinor: minorAmount.default(0),
  dueOn: localDate.nullish().transform((v) => v ?? null),
  extraLines: z
    .array(
      z.object({
        description: z
          .string()
          .trim()
          .min(1, { message: 'Say what the line is for.' })
          .max(200, { message: 'Keep a line under 200 characters.' }),
        quantity: z
          .number()
          .int({ message: 'Give a whole quantity.' })
          .min(1, { message: 'The quantity is at least 1.' })
          .max(1000, { message: 'The quantity is 1000 at most.' }),
        unitMinor: minorAmount,
      }),
    )
    .max(20, { message: 'Add 20 extra lines at most.' })
    .default([]),
});
export type InvoiceBody = z.input<typeof invoiceBody>;

// ---- Shipping ---------------------------------------------------------------------------

export const shippingBody = z
  .object({
    shipOn: localDate,
    shipRoute: text(200, 'the route').min(1, { message: 'Say where the parcel goes (the route).' }),
    forecastLowC: celsius,
    forecastHighC: celsius,
    packing: z
      .record(z.string(), z.boolean())
      .refine((p) => Object.keys(p).every((k) => (PACKING_KEYS as string[]).includes(k)), {
        message: 'An item of the packing list is not known.',
      })
      .default({}),
    carrier: optionalText(80, 'the carrier'),
    tracking: optionalText(120, 'the tracking number'),
  })
  .refine((s) => s.forecastLowC <= s.forecastHighC, {
    message: 'The forecast’s low must not be above its high.',
    path: ['forecastHighC'],
  });
export type ShippingBody = z.input<typeof shippingBody>;

export const confirmShippingBody = z.object({
  /** Needed when the check found concerns: the keeper ships over them on purpose. */
  shipAnyway: z.boolean().default(false),
});

/** How an animal left with a sale: for owners and keepers only (helpers never see buyers). */
export const animalSaleResponse = z.object({
  sale: z
    .object({
      saleId: z.string(),
      buyerName: z.string(),
      shippedOn: z.string().nullable(),
      status: z.enum(SALE_STATUSES),
    })
    .nullable(),
});
export type AnimalSaleResponse = z.infer<typeof animalSaleResponse>;
