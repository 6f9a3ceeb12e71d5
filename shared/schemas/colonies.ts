import { z } from 'zod';
import { COLONY_CARE_KINDS } from '../domain/colonies/care';
import { localDate, uuid } from './common';

const sizeName = z
  .string()
  .trim()
  .min(1, { message: 'Name the size, as the feeder catalogue does.' })
  .max(20, { message: 'Keep a size name under 20 characters.' });
const estimate = z
  .number({ message: 'Give the count as a whole number.' })
  .int({ message: 'Give the count as a whole number: an estimate, not a fraction.' })
  .min(0, { message: 'A count cannot be below zero.' })
  .max(100_000, { message: 'Count at most 100,000 of one size.' });
const interval = z
  .number()
  .int({ message: 'Give the interval in whole days.' })
  .min(1, { message: 'An interval is at least 1 day.' })
  .max(365, { message: 'An interval is at most 365 days.' })
  .nullable();

export const colonyIntervals = z.object({
  feed: interval,
  water_gel: interval,
  clean: interval,
  split: interval,
});
export type ColonyIntervals = z.infer<typeof colonyIntervals>;

/** A colony as a keeper creates or edits it. Sizes come from the collection's feeder catalogue. */
export const colonyInput = z.object({
  name: z
    .string()
    .trim()
    .min(1, { message: 'Give the colony a name, such as “Dubia bin A”.' })
    .max(60, { message: 'Keep the name under 60 characters.' }),
  species: z
    .string()
    .trim()
    .max(80, { message: 'Keep the species under 80 characters.' })
    .default(''),
  preyType: z
    .string()
    .trim()
    .min(1, { message: 'Choose the prey type this colony breeds (as in the feeder catalogue).' })
    .max(40),
  sizes: z
    .array(sizeName)
    .min(1, { message: 'Choose at least one size the colony holds.' })
    .max(12, { message: 'Choose at most 12 sizes.' }),
  intervals: colonyIntervals,
});
export type ColonyInput = z.infer<typeof colonyInput>;

export const COUNT_REASONS = ['count', 'split', 'correction'] as const;
export const STOCK_REASONS = ['count', 'round', 'split', 'correction'] as const;
export type StockReason = (typeof STOCK_REASONS)[number];

/** A quick count after a colony check: the counts seen, per size. */
export const countUpdateBody = z.object({
  counts: z
    .array(z.object({ preySize: sizeName, count: estimate }))
    .min(1, { message: 'Give at least one size’s count.' })
    .max(12),
  reason: z.enum(COUNT_REASONS).default('count'),
  note: z.string().trim().max(300, { message: 'Keep the note under 300 characters.' }).optional(),
});
export type CountUpdateBody = z.infer<typeof countUpdateBody>;

export const colonyParams = z.object({ collectionId: uuid, colonyId: uuid });

export const colonyView = z.object({
  id: z.string(),
  name: z.string(),
  species: z.string(),
  preyType: z.string(),
  /** The sizes it holds, in the order the keeper chose, each with its estimated count. */
  stock: z.array(z.object({ preySize: z.string(), count: z.number().int() })),
  intervals: colonyIntervals,
  /** The last local date each care kind was done, null when never. */
  lastDone: z.record(z.enum(COLONY_CARE_KINDS), localDate.nullable()),
  updatedAt: z.string(),
});
export type ColonyView = z.infer<typeof colonyView>;

export const coloniesResponse = z.object({
  /** The collection's local date: care due is counted from it. */
  today: z.string(),
  colonies: z.array(colonyView),
});
export type ColoniesResponse = z.infer<typeof coloniesResponse>;

export const stockChange = z.object({
  at: z.string(),
  preySize: z.string(),
  delta: z.number().int(),
  /** The size's count after this change. */
  after: z.number().int(),
  reason: z.enum(STOCK_REASONS),
  note: z.string().nullable(),
});
export const stockHistoryResponse = z.object({ changes: z.array(stockChange) });
export type StockHistoryResponse = z.infer<typeof stockHistoryResponse>;
