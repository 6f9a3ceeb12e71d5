// A chore batch's verdicts, in the style of the event sync (event-verdicts.ts): one per chore,
// in the order sent. Pure: the server looks up the subjects and stored chores named by
// `choresToLoad` and hands them in; storing the accepted chores is its business.
import {
  CHORE_SUBJECTS,
  recordedChore,
  type ChoreResult,
  type RecordedChore,
} from '../schemas/chores';
import { effectiveTime } from './clock';
import { helperRefusal, type BatchWriter } from './event-verdicts';
import { judgeHelperWrite } from './helper-writes';

export interface ChoreCandidate {
  index: number;
  chore: RecordedChore;
  effectiveAt: Date;
}

/** A stored chore, as far as telling a re-send from a clash of ids needs it. */
export interface StoredChore {
  collectionId: string;
  subjectKind: string;
  subjectId: string;
  kind: string;
}

const rawId = (raw: unknown): string => {
  const id = (raw as { id?: unknown } | null)?.id;
  return typeof id === 'string' ? id.slice(0, 64) : '';
};

/** Parses each chore on its own and files it at the server's time; a repeated id is a duplicate. */
export function screenChores(raw: readonly unknown[], sentAt: Date, received: Date) {
  const results: ChoreResult[] = [];
  const candidates: ChoreCandidate[] = [];
  const seen = new Set<string>();
  raw.forEach((item, index) => {
    const parsed = recordedChore.safeParse(item);
    if (!parsed.success) {
      const issue = parsed.error.issues[0]!;
      const where = issue.path.length ? `${issue.path.join('.')}: ` : '';
      results[index] = {
        id: rawId(item),
        status: 'rejected',
        reason: 'invalid',
        message: `${where}${issue.message}`,
      };
      return;
    }
    if (seen.has(parsed.data.id)) {
      results[index] = { id: parsed.data.id, status: 'duplicate' };
      return;
    }
    seen.add(parsed.data.id);
    const { effectiveAt } = effectiveTime(new Date(parsed.data.clientRecordedAt), sentAt, received);
    candidates.push({ index, chore: parsed.data, effectiveAt });
  });
  return { results, candidates };
}

/** What the server must look up: subject ids per kind, and the chore ids already stored. */
export function choresToLoad(candidates: readonly ChoreCandidate[]) {
  const subjects = new Map<string, Set<string>>();
  for (const { chore } of candidates) {
    const set = subjects.get(chore.subjectKind) ?? new Set<string>();
    set.add(chore.subjectId);
    subjects.set(chore.subjectKind, set);
  }
  return { subjects, choreIds: candidates.map((c) => c.chore.id) };
}

/**
 * The verdicts. A helper's chore of a kind helpers may not record (`CHORE_SUBJECTS[…].helpers`)
 * is refused before anything else, and a new one made outside their cover as their taps are. A
 * chore already stored is a duplicate when it is the same chore (a re-send), and refused when another
 * collection or subject holds that id; a subject not in the collection is refused. The rest
 * are accepted, in the order sent.
 */
export function judgeChores(
  w: BatchWriter,
  screened: ReturnType<typeof screenChores>,
  facts: {
    /** `${subjectKind}:${subjectId}` of the subjects in the collection. */
    subjects: ReadonlySet<string>;
    stored: ReadonlyMap<string, StoredChore>;
  },
  received: Date,
): { results: ChoreResult[]; accepted: ChoreCandidate[] } {
  const { collectionId } = w;
  const results = [...screened.results];
  const accepted: ChoreCandidate[] = [];
  for (const c of screened.candidates) {
    const { chore } = c;
    if (w.role === 'helper' && !CHORE_SUBJECTS[chore.subjectKind].helpers) {
      results[c.index] = {
        id: chore.id,
        status: 'rejected',
        reason: 'not_for_helpers',
        message: `Helpers do not record ${chore.subjectKind} care; ask a keeper to record this.`,
      };
      continue;
    }
    const stored = facts.stored.get(chore.id);
    if (stored) {
      const same =
        stored.collectionId === collectionId &&
        stored.subjectKind === chore.subjectKind &&
        stored.subjectId === chore.subjectId &&
        stored.kind === chore.kind;
      results[c.index] = same
        ? { id: chore.id, status: 'duplicate' }
        : {
            id: chore.id,
            status: 'rejected',
            reason: 'id_conflict',
            message: 'Another record already has this id. Discard this one and tap again.',
          };
      continue;
    }
    // After the look-up of stored chores: a reading saved during the cover stays a duplicate
    // when its phone re-sends it after the cover ended.
    const verdict = w.role === 'helper' ? judgeHelperWrite(w, c.effectiveAt, received) : 'ok';
    if (verdict !== 'ok') {
      results[c.index] = {
        id: chore.id,
        status: 'rejected',
        reason: 'outside_cover',
        message: helperRefusal(w, verdict, received),
      };
      continue;
    }
    if (!facts.subjects.has(`${chore.subjectKind}:${chore.subjectId}`)) {
      results[c.index] = {
        id: chore.id,
        status: 'rejected',
        reason: 'unknown_subject',
        message: CHORE_SUBJECTS[chore.subjectKind].unknown(chore.subjectId),
      };
      continue;
    }
    results[c.index] = { id: chore.id, status: 'accepted' };
    accepted.push(c);
  }
  return { results, accepted };
}
