// A sync batch's verdicts: every event gets its own (accepted, duplicate or rejected, and why),
// so one bad event never holds back the rest. Pure: the server looks up the facts named in
// `factsToLoad` and hands them in; storing the accepted events is its business.
import { recordedEvent, type EventResult, type RecordedEvent } from '../schemas/events';
import { breedingRefusal } from './breeding';
import { effectiveTime } from './clock';
import { HELPER_EVENT_KINDS } from './event-kinds';
import {
  HELPER_SYNC_GRACE_HOURS,
  judgeHelperWrite,
  type HelperWriteVerdict,
} from './helper-writes';
import { describeLocalDate, localDateOf } from './local-dates';
import { coverWindowMessage, type Role } from './roles';
import { shortDate } from './rounds/reason-words';

/** A well-formed event of the batch, with its position and its time on the server's clock. */
export interface Candidate {
  index: number;
  event: RecordedEvent;
  effectiveAt: Date;
  flags: string[];
}

export interface ScreenedBatch {
  /** Verdicts known from the batch alone (malformed, repeated ids), by position. */
  results: EventResult[];
  candidates: Candidate[];
}

/** Who sends the batch, in which collection: the request's membership and account. */
export interface BatchWriter {
  collectionId: string;
  collectionName: string;
  timeZone: string;
  role: Role;
  userId: string;
  startsAt: Date | null;
  endsAt: Date | null;
  writesClosedAt: Date | null;
}

/** A stored (or just accepted) event, as far as a duplicate or an undo needs it. */
export interface StoredFact {
  collectionId: string;
  animalId: string;
  kind: string;
  recordedBy: string | null;
}

/** What the server looked up for the batch (see `factsToLoad`). */
export interface BatchFacts {
  /** Of the batch's animals, those in the collection. */
  animals: ReadonlySet<string>;
  /** Stored events among the ids asked for. */
  stored: ReadonlyMap<string, StoredFact>;
  /** Name, sex and group of animals the batch pairs. */
  breeders: ReadonlyMap<string, Parameters<typeof breedingRefusal>[0]>;
  /** When each molting animal molted before, molts undone by a void left out. */
  moltTimes: ReadonlyMap<string, readonly Date[]>;
}

const rawId = (raw: unknown): string => {
  const id = (raw as { id?: unknown } | null)?.id;
  return typeof id === 'string' ? id.slice(0, 64) : '';
};

const rejected = (id: string, reason: EventResult['reason'], message: string): EventResult => ({
  id,
  status: 'rejected',
  reason,
  message,
});

/** Parses each event on its own and files it at the server's time; a repeated id is a duplicate. */
export function screenBatch(
  events: readonly unknown[],
  sentAt: Date,
  received: Date,
): ScreenedBatch {
  const results: EventResult[] = [];
  const candidates: Candidate[] = [];
  const seen = new Set<string>();
  events.forEach((raw, index) => {
    const parsed = recordedEvent.safeParse(raw);
    if (!parsed.success) {
      const issue = parsed.error.issues[0]!;
      const where = issue.path.length ? `${issue.path.join('.')}: ` : '';
      results[index] = rejected(rawId(raw), 'invalid', `${where}${issue.message}`);
      return;
    }
    const event = parsed.data;
    if (seen.has(event.id)) {
      results[index] = { id: event.id, status: 'duplicate' };
      return;
    }
    seen.add(event.id);
    candidates.push({
      index,
      event,
      ...effectiveTime(new Date(event.clientRecordedAt), sentAt, received),
    });
  });
  return { results, candidates };
}

/** The event an undo or molt details point at. */
const targetOf = (e: RecordedEvent) =>
  e.kind === 'void' || e.kind === 'molt_details' ? (e.payload.targetId as string) : null;

/** What the server must look up before judging the batch. */
export function factsToLoad({ candidates }: ScreenedBatch, role: Role) {
  const targets = candidates.map((c) => targetOf(c.event)).filter((t): t is string => !!t);
  const ids = (kind?: string) => [
    ...new Set(
      candidates.filter((c) => !kind || c.event.kind === kind).map((c) => c.event.animalId),
    ),
  ];
  return {
    animalIds: ids(),
    // A helper's re-sent events are looked up first, so a tap saved during the cover stays a
    // duplicate after it ends; for keepers the insert itself finds duplicates (ON CONFLICT),
    // which saves a query per batch.
    eventIds: role === 'helper' ? [...candidates.map((c) => c.event.id), ...targets] : targets,
    // A pairing is only for a female of a group that breeds (breedingModeOf).
    pairedIds: ids('paired'),
    moltingIds: ids('molted'),
  };
}

/** Helpers' writes are judged by the server's clock first (helper-writes.ts); chores too. */
export function helperRefusal(
  w: BatchWriter,
  verdict: Exclude<HelperWriteVerdict, 'ok'>,
  received: Date,
): string {
  const day = (at: Date | null) => (at ? describeLocalDate(localDateOf(at, w.timeZone), true) : '');
  if (verdict === 'closed_by_owner')
    return `Your cover for ${w.collectionName} was ended on ${day(w.writesClosedAt)}; taps that had not reached Rackside by then cannot be saved. Tell the keeper what you did.`;
  if (verdict === 'too_late')
    return `This reached Rackside more than ${HELPER_SYNC_GRACE_HOURS} hours after your cover for ${w.collectionName} ended on ${day(w.endsAt && new Date(w.endsAt.getTime() - 1))}, so it cannot be saved. Tell the keeper what you did.`;
  return `This was recorded outside your cover. ${coverWindowMessage(w, received)}`;
}

/**
 * Every event's verdict, in the order sent, and the events to store. Events are judged in
 * order, so an undo may point at a tap accepted earlier in the same batch, and a second molt of
 * an animal on one local day is refused (its details go on the first).
 */
export function judgeBatch(
  batch: ScreenedBatch,
  w: BatchWriter,
  facts: BatchFacts,
  received: Date,
): { results: EventResult[]; accepted: Candidate[] } {
  const results = [...batch.results];
  const accepted: Candidate[] = [];
  const acceptedFacts = new Map<string, StoredFact>();
  const helper = w.role === 'helper';
  const moltDays = new Map<string, Set<string>>();
  const moltDaysOf = (animalId: string) => {
    let days = moltDays.get(animalId);
    if (!days)
      moltDays.set(
        animalId,
        (days = new Set(
          (facts.moltTimes.get(animalId) ?? []).map((t) => localDateOf(t, w.timeZone)),
        )),
      );
    return days;
  };

  const refusal = ({ event, effectiveAt }: Candidate): [EventResult['reason'], string] | null => {
    const helperVerdict = helper ? judgeHelperWrite(w, effectiveAt, received) : 'ok';
    const targetId = targetOf(event);
    const target = targetId ? (facts.stored.get(targetId) ?? acceptedFacts.get(targetId)) : null;
    const breeder = event.kind === 'paired' ? facts.breeders.get(event.animalId) : undefined;
    const pairing = breeder ? breedingRefusal(breeder) : null;
    if (!facts.animals.has(event.animalId))
      return ['unknown_animal', 'This animal is not in this collection; it may have been removed.'];
    if (helper && !HELPER_EVENT_KINDS.includes(event.kind))
      return [
        'not_for_helpers',
        'Helpers record feeding, water, molts and notes; ask a keeper to record this.',
      ];
    if (helperVerdict !== 'ok') return ['outside_cover', helperRefusal(w, helperVerdict, received)];
    if (pairing) return ['invalid', `A pairing is not recorded: ${pairing}`];
    if (targetId && !target)
      return [
        'target_unknown',
        event.kind === 'void'
          ? 'The outcome this undoes was never saved.'
          : 'The molt these details belong to was never saved.',
      ];
    if (event.kind === 'molt_details' && target && target.kind !== 'molted')
      return ['bad_target', 'Molt details belong to a molt; this points at another kind of fact.'];
    const day = event.kind === 'molted' ? localDateOf(effectiveAt, w.timeZone) : null;
    if (day && moltDaysOf(event.animalId).has(day))
      return [
        'invalid',
        `A molt is already recorded for this animal on ${shortDate(day)}. Add its size or sex to that molt instead of recording a second one.`,
      ];
    if (target && (target.collectionId !== w.collectionId || target.animalId !== event.animalId))
      return ['bad_target', 'This undoes an outcome of another animal.'];
    if (target && helper && target.recordedBy !== w.userId)
      return ['not_for_helpers', 'Helpers can undo only their own taps.'];
    return null;
  };

  for (const candidate of batch.candidates) {
    const { index, event, effectiveAt } = candidate;
    const already = facts.stored.get(event.id);
    if (already) {
      results[index] =
        already.collectionId === w.collectionId
          ? { id: event.id, status: 'duplicate' }
          : rejected(event.id, 'id_conflict', 'This event id is already used elsewhere.');
      continue;
    }
    const refused = refusal(candidate);
    if (refused) {
      results[index] = rejected(event.id, ...refused);
      continue;
    }
    acceptedFacts.set(event.id, {
      collectionId: w.collectionId,
      animalId: event.animalId,
      kind: event.kind,
      recordedBy: w.userId,
    });
    if (event.kind === 'molted')
      moltDaysOf(event.animalId).add(localDateOf(effectiveAt, w.timeZone));
    accepted.push(candidate);
    results[index] = { id: event.id, status: 'accepted' };
  }
  return { results, accepted };
}

/**
 * Another request carrying the same ids may have committed first: theirs is the copy kept. An
 * accepted event that was not stored is a duplicate when the stored one is this collection's.
 */
export function settleLostRaces(
  results: readonly EventResult[],
  lost: ReadonlySet<string>,
  winners: ReadonlyMap<string, { collectionId: string }>,
  collectionId: string,
): EventResult[] {
  return results.map((r) => {
    if (!lost.has(r.id)) return r;
    return winners.get(r.id)?.collectionId === collectionId
      ? { id: r.id, status: 'duplicate' }
      : rejected(r.id, 'id_conflict', 'This event id is already used elsewhere.');
  });
}
