import { z } from 'zod';
import { ANIMAL_STATUSES } from '../domain/animal-facts';
import { EVENT_KINDS, type EventKind } from '../domain/event-kinds';
import { uuid } from './common';

const note = z
  .string()
  .trim()
  .max(2000, { message: 'Keep notes under 2,000 characters.' })
  .optional();
const prey = {
  preyType: z.string().trim().min(1).max(40).optional(),
  preySize: z.string().trim().min(1).max(20).optional(),
  count: z.number().int().min(1).max(50).optional(),
};
const empty = z.object({ note }).strict();
/** Facts written from a breeding record (`egg_sacs`): its id, so editing its dates finds them. */
const breedingRecord = z.object({ sacId: uuid.optional(), note }).strict();

/** What a molt showed: given with the tap, or added to the same molt later (molt_details). */
const moltFacts = {
  sizeMm: z
    .number()
    .positive({ message: 'The size must be more than 0 mm.' })
    .max(400, { message: 'No invertebrate we keep is over 400 mm across.' })
    .optional(),
  exuviaeKept: z.boolean().optional(),
  sexFromExuviae: z.enum(['female', 'male', 'unknown']).optional(),
  maturing: z.boolean().optional(),
  note,
};

/** mm inside the new enclosure; each optional (a keeper may rehouse without measuring). */
const enclosureSide = (what: string) =>
  z
    .number()
    .int({ message: `Give the ${what} in whole millimetres.` })
    .min(10, { message: `The ${what} must be at least 10 mm.` })
    .max(3000, { message: `The ${what} must be under 3,000 mm.` })
    .optional();
/** A rehouse may give the new enclosure's inside size: the animal record takes it. */
const enclosureFacts = {
  lengthMm: enclosureSide('length'),
  widthMm: enclosureSide('width'),
  heightMm: enclosureSide('height'),
};

/** Each event kind's payload: what the engine and the history need, nothing else. */
export const EVENT_PAYLOADS = {
  ate: z.object({ ...prey, note }).strict(),
  refused: z.object({ ...prey, note }).strict(),
  prey_left_in: z.object({ ...prey, note }).strict(),
  prey_removed: empty,
  watered: empty,
  misted: empty,
  substrate_moistened: empty,
  spot_cleaned: empty,
  rehoused: z.object({ ...enclosureFacts, note }).strict(),
  molted: z.object(moltFacts).strict(),
  molt_details: z.object({ targetId: uuid, ...moltFacts }).strict(),
  premolt_seen: empty,
  premolt_cleared: empty,
  molting_now: empty,
  sac_laid: breedingRecord,
  sac_pulled: breedingRecord
    .extend({ eggCount: z.number().int().min(0).max(5000).optional() })
    .strict(),
  sac_hatched: breedingRecord,
  case_laid: breedingRecord,
  brood_started: breedingRecord
    .extend({ count: z.number().int().min(0).max(5000).optional() })
    .strict(),
  brood_dispersed: breedingRecord,
  paired: z
    .object({
      maleId: uuid.optional(),
      outsideMale: z.string().trim().max(120).optional(),
      outcome: z.enum(['accepted', 'no_interest', 'incident']).optional(),
      note,
    })
    .strict(),
  rebuild_started: empty,
  rebuild_ended: empty,
  skipped: empty,
  void: z.object({ targetId: uuid, note }).strict(),
  note: z
    .object({
      text: z.string().trim().min(1, { message: 'Write something in the note.' }).max(2000),
    })
    .strict(),
  moved: z
    .object({
      fromLocationId: uuid.nullable().optional(),
      toLocationId: uuid,
      rehoused: z.boolean().optional(),
      note,
    })
    .strict(),
  status_changed: z
    .object({
      from: z.enum(ANIMAL_STATUSES),
      to: z.enum(ANIMAL_STATUSES),
      note,
      // Sales — S: sold with a sale links it by id only; the buyer's name is never in history.
      saleId: z.uuid().optional(),
    })
    .strict(),
} satisfies Record<(typeof EVENT_KINDS)[number], z.ZodType>;

/**
 * Facts the server records itself, never sent by a phone: moves and status changes, and the
 * breeding facts written from a sac, case or brood record (its dates are the truth for them).
 */
export const SERVER_EVENT_KINDS: readonly EventKind[] = [
  'moved',
  'status_changed',
  'sac_laid',
  'sac_pulled',
  'sac_hatched',
  'case_laid',
  'brood_started',
  'brood_dispersed',
];
const BREEDING_RECORD_KINDS: readonly EventKind[] = [
  'sac_laid',
  'sac_pulled',
  'sac_hatched',
  'case_laid',
  'brood_started',
  'brood_dispersed',
];

export const eventKind = z.enum(EVENT_KINDS);

/** One recorded fact as a device sends it; the id is made on the device (a UUID). */
export const recordedEvent = z
  .object({
    id: uuid,
    animalId: uuid,
    kind: eventKind,
    payload: z.record(z.string(), z.unknown()).default({}),
    clientRecordedAt: z.iso.datetime({
      offset: true,
      message: 'The time of the tap (clientRecordedAt) must be an ISO 8601 date-time.',
    }),
  })
  .superRefine((event, ctx) => {
    if (SERVER_EVENT_KINDS.includes(event.kind)) {
      const message = BREEDING_RECORD_KINDS.includes(event.kind)
        ? 'Egg sacs, egg cases and broods are recorded on the Breeding page, not as taps.'
        : 'Moves and status changes are made on the animal’s page, not recorded as taps.';
      ctx.addIssue({ code: 'custom', path: ['kind'], message });
      return;
    }
    const result = EVENT_PAYLOADS[event.kind].safeParse(event.payload);
    if (!result.success) {
      for (const issue of result.error.issues)
        ctx.addIssue({
          code: 'custom',
          path: ['payload', ...issue.path.map(String)],
          message: issue.message,
        });
    }
  });
export type RecordedEvent = z.infer<typeof recordedEvent>;

/**
 * A sync request. Events are checked one by one on the server (a bad one is rejected on its
 * own), so the envelope accepts any array and only counts it.
 */
export const eventBatchBody = z.object({
  deviceId: z.string().trim().min(1).max(64, { message: 'The device id is too long.' }),
  clientSentAt: z.iso.datetime({
    offset: true,
    message: 'The time the phone sent this (clientSentAt) must be an ISO 8601 date-time.',
  }),
  events: z.array(z.unknown()),
});
export type EventBatchBody = z.infer<typeof eventBatchBody>;

export const EVENT_STATUSES = ['accepted', 'duplicate', 'rejected'] as const;
export const REJECT_REASONS = [
  'invalid',
  'unknown_animal',
  'outside_cover',
  'not_for_helpers',
  'target_unknown',
  'bad_target',
  'id_conflict',
] as const;
export type RejectReason = (typeof REJECT_REASONS)[number];

export const eventResult = z.object({
  id: z.string(),
  status: z.enum(EVENT_STATUSES),
  reason: z.enum(REJECT_REASONS).optional(),
  message: z.string().optional(),
});
export type EventResult = z.infer<typeof eventResult>;

export const eventBatchResponse = z.object({
  serverReceivedAt: z.string(),
  /** server_received_at − client_sent_at, the correction applied to every event's time. */
  offsetMs: z.number(),
  results: z.array(eventResult),
});
export type EventBatchResponse = z.infer<typeof eventBatchResponse>;

export const historyEvent = z.object({
  id: z.string(),
  kind: eventKind,
  at: z.string(),
  by: z.string().nullable(),
  payload: z.record(z.string(), z.unknown()),
  flags: z.array(z.string()),
  /** The id of the void that cancelled this event, if any. */
  voidedBy: z.string().nullable(),
  /** Set when a photo goes with the fact (a molt's exuviae); changes with the photo. */
  photoVersion: z.string().nullable(),
});
export type HistoryEvent = z.infer<typeof historyEvent>;
export const historyResponse = z.object({ events: z.array(historyEvent) });
