import { z } from 'zod';
import { COLONY_CARE_KINDS } from '../domain/colonies/care';
import { uuid } from './common';

// Chores: care of things that are not animals (decision 020). A chore names its subject by
// kind and id, says which care it was, when, and carries a payload whose shape belongs to its
// subject kind. A new subject kind is one entry in CHORE_SUBJECTS (its care kinds and payload
// schema) and one look-up on the server that says which of its ids are in the collection.

const note = z
  .string()
  .trim()
  .max(500, { message: 'Keep a chore’s note under 500 characters.' })
  .optional();

export const CHORE_SUBJECTS = {
  colony: {
    kinds: COLONY_CARE_KINDS,
    payload: z.object({ note }).strict(),
  },
} as const;
export type ChoreSubjectKind = keyof typeof CHORE_SUBJECTS;
export const CHORE_SUBJECT_KINDS = Object.keys(CHORE_SUBJECTS) as ChoreSubjectKind[];

/** One chore as a phone records it; the id is made on the phone and is the sync's key. */
export const recordedChore = z
  .object({
    id: uuid,
    subjectKind: z.enum(CHORE_SUBJECT_KINDS as [ChoreSubjectKind, ...ChoreSubjectKind[]], {
      message: `A chore is for one of: ${CHORE_SUBJECT_KINDS.join(', ')}.`,
    }),
    subjectId: uuid,
    kind: z.string().min(1).max(40),
    clientRecordedAt: z.iso.datetime({
      offset: true,
      message: 'The time of the chore (clientRecordedAt) must be an ISO 8601 date-time.',
    }),
    payload: z.record(z.string(), z.unknown()).default({}),
  })
  .superRefine((chore, ctx) => {
    const subject = CHORE_SUBJECTS[chore.subjectKind];
    if (!(subject.kinds as readonly string[]).includes(chore.kind)) {
      ctx.addIssue({
        code: 'custom',
        path: ['kind'],
        message: `A ${chore.subjectKind}’s chore is one of: ${subject.kinds.join(', ')}.`,
      });
      return;
    }
    const result = subject.payload.safeParse(chore.payload);
    if (!result.success)
      for (const issue of result.error.issues)
        ctx.addIssue({
          code: 'custom',
          path: ['payload', ...issue.path.map(String)],
          message: issue.message,
        });
  });
export type RecordedChore = z.infer<typeof recordedChore>;

/** A batch from a phone: each chore is parsed on its own, so one bad chore holds none back. */
export const choreBatchBody = z.object({
  deviceId: z.string().trim().min(1).max(100).optional(),
  clientSentAt: z.iso.datetime({
    offset: true,
    message: 'The time the phone sent this (clientSentAt) must be an ISO 8601 date-time.',
  }),
  chores: z.array(z.unknown()),
});
export type ChoreBatchBody = z.infer<typeof choreBatchBody>;

export const CHORE_REJECT_REASONS = ['invalid', 'unknown_subject', 'id_conflict'] as const;
export const choreResult = z.object({
  id: z.string(),
  status: z.enum(['accepted', 'duplicate', 'rejected']),
  reason: z.enum(CHORE_REJECT_REASONS).optional(),
  message: z.string().optional(),
});
export type ChoreResult = z.infer<typeof choreResult>;

export const choreBatchResponse = z.object({
  serverReceivedAt: z.string(),
  results: z.array(choreResult),
});
export type ChoreBatchResponse = z.infer<typeof choreBatchResponse>;
