import { choresToLoad, judgeChores, screenChores } from '#shared/domain/chore-verdicts';
import { localDateOf, type LocalDate } from '#shared/domain/local-dates';
import { MAX_BATCH_EVENTS } from '#shared/domain/sync-limits';
import type { ChoreBatchBody, ChoreBatchResponse, ChoreSubjectKind } from '#shared/schemas/chores';
import type { Membership } from '../../access/memberships';
import type { Db } from '../../db/client';
import { HttpError } from '../../middleware/errors';
import { deleteChoresOf, insertChores, lastDoneOf, storedChores } from './chores.repository';

/** Which of these ids of one subject kind are in the collection (wired in server/app.ts). */
export type SubjectLookup = (collectionId: string, ids: string[]) => Promise<ReadonlySet<string>>;

/** A chore this batch stored for the first time, as a subject kind's hook receives it. */
export interface StoredChoreFact {
  id: string;
  subjectId: string;
  kind: string;
  payload: Record<string, unknown>;
  effectiveAt: Date;
  recordedBy: string;
}

/**
 * What must follow a newly stored chore of one subject kind elsewhere (a room's reading into
 * the climate readings), in the chores' own transaction: the chore and what follows it are
 * stored together or not at all, so a re-send (a duplicate) never needs to redo it.
 */
export type ChoreStoredHook = (
  tx: Db,
  collectionId: string,
  chores: StoredChoreFact[],
) => Promise<void>;

/**
 * Chores (decision 020): care of things that are not animals, synced like the round's taps —
 * a verdict per chore, stored once by its phone-made id. Each subject kind brings its own
 * look-up; this feature knows none of them.
 */
export function createChoresService(
  db: Db,
  {
    now,
    subjects,
    onStored = {},
  }: {
    now: () => Date;
    subjects: Record<ChoreSubjectKind, SubjectLookup>;
    onStored?: Partial<Record<ChoreSubjectKind, ChoreStoredHook>>;
  },
) {
  async function recordBatch(
    member: Membership,
    userId: string,
    body: ChoreBatchBody,
  ): Promise<ChoreBatchResponse> {
    if (body.chores.length > MAX_BATCH_EVENTS)
      throw new HttpError(
        413,
        'batch_too_large',
        `Send at most ${MAX_BATCH_EVENTS} chores at a time; this batch had ${body.chores.length}.`,
      );
    const received = now();
    const screened = screenChores(body.chores, new Date(body.clientSentAt), received);
    const wanted = choresToLoad(screened.candidates);
    const known = new Set<string>();
    for (const [kind, ids] of wanted.subjects) {
      const found = await subjects[kind as ChoreSubjectKind](member.collectionId, [...ids]);
      for (const id of found) known.add(`${kind}:${id}`);
    }
    const stored = await storedChores(db, wanted.choreIds);
    const { results, accepted } = judgeChores(
      { ...member, userId },
      screened,
      { subjects: known, stored },
      received,
    );
    const inserted = await db.transaction(async (tx) => {
      const ids = await insertChores(
        tx,
        accepted.map(({ chore, effectiveAt }) => ({
          id: chore.id,
          collectionId: member.collectionId,
          subjectKind: chore.subjectKind,
          subjectId: chore.subjectId,
          kind: chore.kind,
          payload: chore.payload,
          recordedBy: userId,
          deviceId: body.deviceId ?? null,
          clientRecordedAt: new Date(chore.clientRecordedAt),
          serverReceivedAt: received,
          effectiveAt,
        })),
      );
      for (const [kind, hook] of Object.entries(onStored)) {
        const facts = accepted
          .filter((c) => c.chore.subjectKind === kind && ids.has(c.chore.id))
          .map(({ chore, effectiveAt }) => ({
            id: chore.id,
            subjectId: chore.subjectId,
            kind: chore.kind,
            payload: chore.payload,
            effectiveAt,
            recordedBy: userId,
          }));
        if (facts.length) await hook(tx, member.collectionId, facts);
      }
      return ids;
    });
    // Two requests carrying the same new chore at once: the one that lost the insert reports a
    // duplicate, as a re-send would.
    for (const { chore, index } of accepted)
      if (!inserted.has(chore.id)) results[index] = { id: chore.id, status: 'duplicate' };
    return { serverReceivedAt: received.toISOString(), results };
  }

  /** Per subject, the last local date each care kind was done. */
  async function lastDone(
    collection: { collectionId: string; timeZone: string },
    subjectKind: ChoreSubjectKind,
    subjectIds: string[],
  ): Promise<Map<string, Record<string, LocalDate>>> {
    const out = new Map<string, Record<string, LocalDate>>();
    for (const row of await lastDoneOf(db, collection.collectionId, subjectKind, subjectIds)) {
      if (!row.last) continue;
      const per = out.get(row.subjectId) ?? {};
      per[row.kind] = localDateOf(new Date(row.last), collection.timeZone);
      out.set(row.subjectId, per);
    }
    return out;
  }

  return {
    recordBatch,
    lastDone,
    forget: (collectionId: string, subjectKind: ChoreSubjectKind, subjectId: string) =>
      deleteChoresOf(db, collectionId, subjectKind, subjectId),
  };
}
export type ChoresService = ReturnType<typeof createChoresService>;
