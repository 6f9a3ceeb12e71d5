import { z } from 'zod';
import { COLONY_CARE_KINDS } from '../domain/colonies/care';
import { roomName, roomReadingPayload } from './climate';
import { uuid } from './common';

// Chores: care of things that are not animals (decision 020). A chore names its subject by
// kind and id, says which care it was, when, and carries a payload whose shape belongs to its
// subject kind. A new subject kind is one entry in CHORE_SUBJECTS (its id, care kinds, payload
// schema and whether a covering helper may record it) and one look-up on the server that says
// which of its ids are in the collection.

const note = z
  .string()
  .trim()
  .max(500, { message: 'Keep a chore’s note under 500 characters.' })
  .optional();

export const CHORE_SUBJECTS = {
  colony: {
    id: uuid,
    kinds: COLONY_CARE_KINDS,
    payload: z.object({ note }).strict(),
    helpers: false,
    unknown: () => 'That colony is not in this collection any more.',
  },
  // Rooms have no id of their own: a room is the places' name for it (decision 019). A
  // covering helper is in the room, so they may record its reading.
  room: {
    id: roomName,
    kinds: ['reading'],
    payload: roomReadingPayload,
    helpers: true,
    unknown: (name: string) => `There is no room called “${name}” among your places.`,
  },
} as const;
export type ChoreSubjectKind = keyof typeof CHORE_SUBJECTS;
export const CHORE_SUBJECT_KINDS = Object.keys(CHORE_SUBJECTS) as ChoreSubjectKind[];

/** A chore's care kind is its subject kind's, and its payload fits that kind (sync and backup). */
export function checkChoreCare(
  chore: { subjectKind: ChoreSubjectKind; kind: string; payload: unknown },
  ctx: z.RefinementCtx,
) {
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
}

/** One chore as a phone records it; the id is made on the phone and is the sync's key. */
export const recordedChore = z
  .object({
    id: uuid,
    subjectKind: z.enum(CHORE_SUBJECT_KINDS as [ChoreSubjectKind, ...ChoreSubjectKind[]], {
      message: `A chore is for one of: ${CHORE_SUBJECT_KINDS.join(', ')}.`,
    }),
    // Checked against the subject kind's own id schema below.
    subjectId: z.string({ message: 'Say which thing this chore is for (subjectId).' }).max(100),
    kind: z.string().min(1).max(40),
    clientRecordedAt: z.iso.datetime({
      offset: true,
      message: 'The time of the chore (clientRecordedAt) must be an ISO 8601 date-time.',
    }),
    payload: z.record(z.string(), z.unknown()).default({}),
  })
  .superRefine((chore, ctx) => {
    const subject = CHORE_SUBJECTS[chore.subjectKind];
    const id = subject.id.safeParse(chore.subjectId);
    if (!id.success)
      ctx.addIssue({ code: 'custom', path: ['subjectId'], message: id.error.issues[0]!.message });
    checkChoreCare(chore, ctx);
  })
  // What is stored is what the subject kind's schemas made of it (a room's name trimmed).
  .transform((chore) => ({
    ...chore,
    subjectId: CHORE_SUBJECTS[chore.subjectKind].id.parse(chore.subjectId),
    payload: CHORE_SUBJECTS[chore.subjectKind].payload.parse(chore.payload) as Record<
      string,
      unknown
    >,
  }));
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

export const CHORE_REJECT_REASONS = [
  'invalid',
  'unknown_subject',
  'id_conflict',
  'not_for_helpers',
  'outside_cover',
] as const;
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
