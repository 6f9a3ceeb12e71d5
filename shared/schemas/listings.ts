import { z } from 'zod';
import { ANIMAL_GROUPS, LIFE_STAGES, SEXES } from '../domain/animal-facts';
import { AVAILABILITY_COLUMNS } from '../domain/sales/availability';
import { CURRENCY_CODES, MAX_MINOR, type CurrencyCode } from '../domain/sales/money';
import { uuid } from './common';

// Sales — listings and the public availability list (helper L). Money is whole minor units.

export const currencyCode = z.enum(CURRENCY_CODES as [CurrencyCode, ...CurrencyCode[]], {
  message: 'Choose one of the currencies in the list.',
});

const priceMinor = z
  .number({ message: 'Type a price.' })
  .int('A price is a whole number of cents (or the currency’s smallest unit).')
  .min(0, 'A price cannot be below zero.')
  .max(MAX_MINOR, 'That price is too large.');

const description = z
  .string()
  .trim()
  .max(500, 'Keep the description under 500 characters.')
  .default('');

export const listingParams = z.object({ collectionId: uuid, animalId: uuid });

export const listingBody = z.object({
  priceMinor,
  currency: currencyCode,
  description,
  listedPublicly: z.boolean().default(true),
});
export type ListingBody = z.infer<typeof listingBody>;

export const bulkListingBody = z
  .object({
    clutch: z.string().trim().min(1, 'Name the clutch.').max(120).optional(),
    animalIds: z
      .array(uuid)
      .min(1, 'Choose at least one animal.')
      .max(500, 'Choose at most 500 animals at a time.')
      .optional(),
    priceMinor,
    currency: currencyCode,
    description,
    listedPublicly: z.boolean().default(true),
  })
  .refine((b) => (b.clutch === undefined) !== (b.animalIds === undefined), {
    message: 'Offer either a clutch or chosen animals, not both.',
    path: ['clutch'],
  });
export type BulkListingBody = z.infer<typeof bulkListingBody>;

export const LISTING_STATES = ['available', 'reserved'] as const;
export type ListingState = (typeof LISTING_STATES)[number];

export const listingRow = z.object({
  animalId: z.string(),
  name: z.string(),
  labelCode: z.string(),
  scientificName: z.string(),
  commonName: z.string().nullable(),
  group: z.enum(ANIMAL_GROUPS),
  lifeStage: z.enum(LIFE_STAGES),
  sex: z.enum(SEXES),
  sizeMm: z.number().nullable(),
  /** Only for animals from the collection's own egg sac: 1 + molts recorded since. */
  instar: z.number().int().nullable(),
  clutch: z.string().nullable(),
  priceMinor: z.number().int(),
  currency: currencyCode,
  description: z.string(),
  listedPublicly: z.boolean(),
  state: z.enum(LISTING_STATES),
});
export type ListingRow = z.infer<typeof listingRow>;

const range = z.object({ min: z.number(), max: z.number() }).nullable();

export const listingGroup = z.object({
  scientificName: z.string(),
  commonName: z.string().nullable(),
  group: z.enum(ANIMAL_GROUPS),
  lifeStage: z.enum(LIFE_STAGES),
  available: z.number().int(),
  reserved: z.number().int(),
  sexes: z.object({
    female: z.number().int(),
    male: z.number().int(),
    unknown: z.number().int(),
  }),
  sizeMm: range,
  instar: range,
  /** Null when the group's animals are priced in more than one currency. */
  price: z
    .object({ currency: currencyCode, min: z.number().int(), max: z.number().int() })
    .nullable(),
});
export type ListingGroup = z.infer<typeof listingGroup>;

export const listingsResponse = z.object({
  rows: z.array(listingRow),
  groups: z.array(listingGroup),
  /** Clutches with active animals not in a live sale: what "offer a clutch" can choose from. */
  clutches: z.array(z.object({ clutch: z.string(), animals: z.number().int() })),
});
export type ListingsResponse = z.infer<typeof listingsResponse>;

export const listingResponse = listingRow;

export const bulkListingResponse = z.object({
  listed: z.number().int(),
  /** Animals of the clutch left out: not active, or already reserved or sold. */
  skipped: z.number().int(),
});
export type BulkListingResponse = z.infer<typeof bulkListingResponse>;

// The public availability list.

export const availabilityColumn = z.enum(AVAILABILITY_COLUMNS);

export const availabilityBody = z.object({
  on: z.boolean(),
  columns: z
    .array(availabilityColumn)
    .min(1, 'Choose at least one column.')
    .max(AVAILABILITY_COLUMNS.length)
    .refine((c) => new Set(c).size === c.length, 'Choose each column once.'),
  note: z.string().trim().max(1000, 'Keep the note under 1000 characters.').default(''),
});
export type AvailabilityBody = z.infer<typeof availabilityBody>;

export const availabilitySettings = z.object({
  on: z.boolean(),
  columns: z.array(availabilityColumn),
  note: z.string(),
  /** The public page's path (`/available/<token>`); null until a link is made. */
  path: z.string().nullable(),
});
export type AvailabilitySettingsView = z.infer<typeof availabilitySettings>;

export const availableParams = z.object({
  token: z.string().regex(/^[A-Za-z0-9_-]{22,64}$/, 'This link is not valid.'),
});

/** A public row holds only the columns the keeper chose; every value is words or a count. */
export const publicAvailabilityRow = z
  .object({
    species: z.string(),
    commonName: z.string(),
    stage: z.string(),
    sex: z.string(),
    size: z.string(),
    price: z.string(),
    count: z.number().int(),
  })
  .partial()
  .strict();
export type PublicAvailabilityRow = z.infer<typeof publicAvailabilityRow>;

export const publicAvailability = z.object({
  collectionName: z.string(),
  note: z.string(),
  columns: z.array(availabilityColumn),
  rows: z.array(publicAvailabilityRow),
});
export type PublicAvailability = z.infer<typeof publicAvailability>;
