import { z } from 'zod';
import { email, meResponse, newPassword } from './auth';
import { localDate, uuid } from './common';

/** The longest cover one invite gives (common practice: a holiday; longer needs a keeper). */
export const MAX_COVER_DAYS = 60;

const days = z
  .object({ firstDay: localDate, lastDay: localDate })
  .refine((d) => d.lastDay >= d.firstDay, {
    message: 'The last day comes on or after the first day.',
    path: ['lastDay'],
  })
  .refine((d) => (Date.parse(d.lastDay) - Date.parse(d.firstDay)) / 86_400_000 < MAX_COVER_DAYS, {
    message: `A cover lasts at most ${MAX_COVER_DAYS} days.`,
    path: ['lastDay'],
  });
const message = z
  .string()
  .trim()
  .max(1000, { message: 'Keep the message under 1,000 characters.' })
  .default('');

export const coverBody = z.intersection(z.object({ email, message }), days);
export type CoverBody = z.input<typeof coverBody>;
export const coverChangeBody = z.intersection(z.object({ message }), days);
export type CoverChangeBody = z.input<typeof coverChangeBody>;

export const inviteToken = z
  .string()
  .min(20, { message: 'This invite link is not valid.' })
  .max(200, { message: 'This invite link is not valid.' });
export const acceptBody = z.object({
  token: inviteToken,
  /** Only for someone new to Rackside: the account the invite makes. */
  account: z
    .object({
      displayName: z.string().trim().min(1, { message: 'Tell us what to call you.' }).max(80),
      password: newPassword,
    })
    .optional(),
});
export type AcceptBody = z.input<typeof acceptBody>;

export const handoverNoteBody = z.object({
  animalId: uuid,
  text: z
    .string()
    .trim()
    .min(1, { message: 'Write the note.' })
    .max(500, { message: 'Keep the note under 500 characters.' }),
  until: localDate,
  doNotFeed: z.boolean().default(false),
});
export type HandoverNoteBody = z.input<typeof handoverNoteBody>;

export const generalNoteBody = z.object({
  text: z.string().trim().max(4000, { message: 'Keep the note under 4,000 characters.' }),
});

export const COVER_STATES = ['invited', 'upcoming', 'running', 'ended'] as const;
export type CoverState = (typeof COVER_STATES)[number];

export const coverSummary = z.object({
  id: z.string(),
  email: z.string(),
  helperName: z.string().nullable(),
  firstDay: z.string(),
  lastDay: z.string(),
  message: z.string().nullable(),
  state: z.enum(COVER_STATES),
  inviteExpired: z.boolean(),
  /** The cover's end summary has been made (it is in the reports list under this cover's id). */
  hasSummary: z.boolean(),
  safetyAcknowledgedAt: z.string().nullable(),
});
export type CoverSummary = z.infer<typeof coverSummary>;
export const coverListResponse = z.object({ covers: z.array(coverSummary) });

export const handoverNote = z.object({
  id: z.string(),
  animalId: z.string(),
  animalName: z.string(),
  text: z.string(),
  until: z.string(),
  doNotFeed: z.boolean(),
});
export type HandoverNote = z.infer<typeof handoverNote>;
export const handoverResponse = z.object({
  generalNote: z.string().nullable(),
  notes: z.array(handoverNote),
});

/** What a helper's phone keeps for the cover: enough to do the round with no signal. */
export const helperCoverView = z.object({
  collectionName: z.string(),
  firstDay: z.string(),
  lastDay: z.string(),
  message: z.string().nullable(),
  safetyAcknowledgedAt: z.string().nullable(),
  generalNote: z.string().nullable(),
  notes: z.array(handoverNote),
  /** The last 14 days of each round animal's facts, newest first. */
  recent: z.record(
    z.string(),
    z.array(z.object({ kind: z.string(), at: z.string(), by: z.string().nullable() })),
  ),
});
export type HelperCoverView = z.infer<typeof helperCoverView>;

/** An invite link's page: a cover for a helper, or an invite to keep (or co-own) the collection. */
export const invitePreview = z.object({
  role: z.enum(['helper', 'keeper', 'owner']),
  collectionName: z.string(),
  /** The name of whoever sent the invite. */
  invitedBy: z.string().nullable(),
  email: z.string(),
  /** The cover's days; null for a keeper's invite. */
  firstDay: z.string().nullable(),
  lastDay: z.string().nullable(),
  message: z.string().nullable(),
  hasAccount: z.boolean(),
});
export type InvitePreview = z.infer<typeof invitePreview>;

/** Accepting signs the person in: the collection to open, and who they now are. */
export const acceptResponse = z.object({ collectionId: z.string(), me: meResponse });

/** The daily reports and end-of-cover summaries e-mailed to the owners, kept for the app. */
export const coverReportsResponse = z.object({
  reports: z.array(
    z.object({
      id: z.string(),
      /** The cover a summary is about; null for a day's report. */
      coverId: z.string().nullable(),
      localDate: z.string(),
      subject: z.string(),
      body: z.string(),
      createdAt: z.string(),
    }),
  ),
});
