import { z } from 'zod';
import { email, newPassword } from './auth';
import { localDate, uuid } from './common';

/** The longest cover one invite gives (common practice: a holiday; longer needs a keeper). */
export const MAX_COVER_DAYS = 60;

const days = z
  .object({ firstDay: localDate, lastDay: localDate })
  .refine((d) => d.lastDay >= d.firstDay, { message: 'The last day comes on or after the first day.', path: ['lastDay'] })
  .refine((d) => (Date.parse(d.lastDay) - Date.parse(d.firstDay)) / 86_400_000 < MAX_COVER_DAYS, {
    message: `A cover lasts at most ${MAX_COVER_DAYS} days.`,
    path: ['lastDay'],
  });
const message = z.string().trim().max(1000, { message: 'Keep the message under 1,000 characters.' }).default('');

export const coverBody = z.intersection(z.object({ email, message }), days);
export type CoverBody = z.input<typeof coverBody>;
export const coverChangeBody = z.intersection(z.object({ message }), days);
export type CoverChangeBody = z.input<typeof coverChangeBody>;

export const inviteToken = z.string().min(20, { message: 'This invite link is not valid.' }).max(200, { message: 'This invite link is not valid.' });
export const acceptBody = z.object({
  token: inviteToken,
  /** Only for someone new to Rackside: the account the invite makes. */
  account: z.object({ displayName: z.string().trim().min(1, { message: 'Tell us what to call you.' }).max(80), password: newPassword }).optional(),
});
export type AcceptBody = z.input<typeof acceptBody>;

export const handoverNoteBody = z.object({
  animalId: uuid,
  text: z.string().trim().min(1, { message: 'Write the note.' }).max(500, { message: 'Keep the note under 500 characters.' }),
  until: localDate,
  doNotFeed: z.boolean().default(false),
});
export type HandoverNoteBody = z.input<typeof handoverNoteBody>;

export const generalNoteBody = z.object({ text: z.string().trim().max(4000, { message: 'Keep the note under 4,000 characters.' }) });

export const COVER_STATES = ['invited', 'upcoming', 'running', 'ended'] as const;
export type CoverState = (typeof COVER_STATES)[number];

export interface CoverSummary {
  id: string;
  email: string;
  helperName: string | null;
  firstDay: string;
  lastDay: string;
  message: string | null;
  state: CoverState;
  inviteExpired: boolean;
  safetyAcknowledgedAt: string | null;
}

export interface HandoverNote {
  id: string;
  animalId: string;
  animalName: string;
  text: string;
  until: string;
  doNotFeed: boolean;
}

/** What a helper's phone keeps for the cover: enough to do the round with no signal. */
export interface HelperCoverView {
  collectionName: string;
  firstDay: string;
  lastDay: string;
  message: string | null;
  safetyAcknowledgedAt: string | null;
  generalNote: string | null;
  notes: HandoverNote[];
  /** The last 14 days of each round animal's facts, newest first. */
  recent: Record<string, { kind: string; at: string; by: string | null }[]>;
}

/** An invite link's page: a cover for a helper, or an invite to keep the collection. */
export interface InvitePreview {
  role: 'helper' | 'keeper';
  collectionName: string;
  /** The name of whoever sent the invite. */
  invitedBy: string | null;
  email: string;
  /** The cover's days; null for a keeper's invite. */
  firstDay: string | null;
  lastDay: string | null;
  message: string | null;
  hasAccount: boolean;
}
