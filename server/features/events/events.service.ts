import type { NodePgDatabase } from 'drizzle-orm/node-postgres';
import { breedingRefusal } from '../../../shared/domain/breeding';
import { clockOffsetMs, effectiveTime } from '../../../shared/domain/clock';
import { FED_WHILE_HELD, HELPER_EVENT_KINDS, type EventKind } from '../../../shared/domain/event-kinds';
import { mergeMoltDetails } from '../../../shared/domain/growth';
import { HELPER_SYNC_GRACE_HOURS, judgeHelperWrite } from '../../../shared/domain/helper-writes';
import { describeLocalDate, localDateOf } from '../../../shared/domain/local-dates';
import { coverWindowMessage } from '../../../shared/domain/roles';
import { shortDate } from '../../../shared/domain/rounds/build-round';
import { MAX_BATCH_EVENTS } from '../../../shared/domain/sync-limits';
import {
  recordedEvent,
  type EventBatchBody,
  type EventBatchResponse,
  type EventResult,
  type HistoryEvent,
  type RecordedEvent,
} from '../../../shared/schemas/events';
import { HttpError } from '../../middleware/errors';
import type { Membership } from '../collections/collections.repository';
import { applyNewEvents } from '../rounds/projection';
import { SAME_DAY_TRIGGERS, type RoundsService } from '../rounds/rounds.service';
import {
  animalIdsInCollection,
  breedersAmong,
  insertEventsOnce,
  liveMoltTimes,
  recentEventsOf,
  storedEvents,
  type NewEvent,
} from './events.repository';
import { applyMoltFacts } from './molt-facts';

export interface IncomingEvent {
  id: string;
  animalId: string;
  kind: EventKind;
  payload: Record<string, unknown>;
  recordedBy: string | null;
  deviceId: string | null;
  clientRecordedAt: Date;
  clientSentAt: Date | null;
  effectiveAt: Date;
  flags?: string[];
}

/**
 * Stores facts exactly once (the client's id is the key) and, in the same transaction,
 * brings each animal's projected state up to date; then adds any urgent task to today's round.
 */
export function createEventsService(db: NodePgDatabase, rounds: RoundsService, now: () => Date) {
  async function ingest(
    collectionId: string,
    zone: string,
    incoming: IncomingEvent[],
    received = now(),
  ) {
    const inserted = await db.transaction(async (tx) => {
      const rows: NewEvent[] = incoming.map((e) => ({
        ...e,
        collectionId,
        serverReceivedAt: received,
        flags: e.flags ?? [],
      }));
      const ids = await insertEventsOnce(tx, rows);
      const fresh = incoming
        .filter((e) => ids.has(e.id))
        .map((e) => ({
          id: e.id,
          animalId: e.animalId,
          kind: e.kind,
          payload: e.payload,
          effectiveAt: e.effectiveAt.toISOString(),
        }));
      await applyNewEvents(tx, collectionId, zone, fresh);
      await applyMoltFacts(tx, collectionId, zone, [...new Set(fresh.filter((e) => e.kind === 'molted' || e.kind === 'molt_details' || e.kind === 'void').map((e) => e.animalId))]);
      return ids;
    });
    const touched = [...new Set(incoming.filter((e) => inserted.has(e.id) && SAME_DAY_TRIGGERS.includes(e.kind)).map((e) => e.animalId))];
    await rounds.reconcileToday(collectionId, touched);
    return { inserted };
  }

  /**
   * A meal recorded while the engine withholds food (a molt hold, premolt, a do-not-feed note…)
   * is stored — it happened — but flagged for the owner (R18). Judged before the batch lands.
   */
  async function flagMealsWhileHeld(member: Membership, list: IncomingEvent[]) {
    const meals = list.filter((e) => e.kind === 'ate');
    const byDate = new Map<string, IncomingEvent[]>();
    for (const e of meals) {
      const date = localDateOf(e.effectiveAt, member.timeZone);
      byDate.set(date, [...(byDate.get(date) ?? []), e]);
    }
    for (const [date, group] of byDate) {
      const holds = await rounds.feedHolds(member.collectionId, [...new Set(group.map((e) => e.animalId))], date);
      for (const e of group) if (holds.has(e.animalId)) e.flags = [...(e.flags ?? []), FED_WHILE_HELD];
    }
  }

  /**
   * One sync request from a device: every event gets its own verdict, so one bad event never
   * holds back the rest, and a re-sent event is reported as a duplicate, not stored again.
   */
  async function recordBatch(
    member: Membership,
    userId: string,
    body: EventBatchBody,
  ): Promise<EventBatchResponse> {
    if (body.events.length > MAX_BATCH_EVENTS) {
      throw new HttpError(
        413,
        'batch_too_large',
        `Send at most ${MAX_BATCH_EVENTS} events at a time; this batch had ${body.events.length}.`,
      );
    }
    const received = now();
    const sentAt = new Date(body.clientSentAt);
    // One verdict per event, in the order they were sent.
    const results: EventResult[] = [];
    const reject = (index: number, id: string, reason: EventResult['reason'], message: string) => {
      results[index] = { id, status: 'rejected', reason, message };
    };
    const candidates: {
      index: number;
      event: RecordedEvent;
      effectiveAt: Date;
      flags: string[];
    }[] = [];
    const seen = new Set<string>();
    body.events.forEach((raw, index) => {
      const parsed = recordedEvent.safeParse(raw);
      if (!parsed.success) {
        const issue = parsed.error.issues[0]!;
        const where = issue.path.length ? `${issue.path.join('.')}: ` : '';
        reject(index, rawId(raw), 'invalid', `${where}${issue.message}`);
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

    // Helpers' writes are judged by the server's clock first (helper-writes.ts): the phone's
    // clocks only place an event inside the cover, they never extend it.
    const helperRefusal = (m: Membership, verdict: ReturnType<typeof judgeHelperWrite>) => {
      const day = (at: Date | null) => (at ? describeLocalDate(localDateOf(at, m.timeZone), true) : '');
      if (verdict === 'closed_by_owner')
        return `Your cover for ${m.collectionName} was ended on ${day(m.writesClosedAt)}; taps that had not reached Rackside by then cannot be saved. Tell the keeper what you did.`;
      if (verdict === 'too_late')
        return `This reached Rackside more than ${HELPER_SYNC_GRACE_HOURS} hours after your cover for ${m.collectionName} ended on ${day(m.endsAt && new Date(m.endsAt.getTime() - 1))}, so it cannot be saved. Tell the keeper what you did.`;
      return `This was recorded outside your cover. ${coverWindowMessage(m, received)}`;
    };
    const targetOf = (e: RecordedEvent) =>
      e.kind === 'void' || e.kind === 'molt_details' ? (e.payload.targetId as string) : null;
    const helper = member.role === 'helper';
    // Which animals are ours, and which undo targets are stored. A helper's re-sent events are
    // looked up first, so a tap saved during the cover stays a duplicate after it ends; for
    // keepers the insert itself finds duplicates (ON CONFLICT), which saves a query per batch.
    const targets = candidates.map((c) => targetOf(c.event)).filter((t): t is string => !!t);
    // A pairing is only for a female of a group that breeds (breedingModeOf).
    const paired = [...new Set(candidates.filter((c) => c.event.kind === 'paired').map((c) => c.event.animalId))];
    const [known, stored, breeders] = await Promise.all([
      animalIdsInCollection(db, member.collectionId, [...new Set(candidates.map((c) => c.event.animalId))]),
      storedEvents(db, helper ? [...seen, ...targets] : targets),
      breedersAmong(db, member.collectionId, paired),
    ]);
    const pairingRefusal = (e: RecordedEvent) => {
      const animal = e.kind === 'paired' ? breeders.get(e.animalId) : undefined;
      return animal ? breedingRefusal(animal) : null;
    };
    const accepted = new Map<
      string,
      { collectionId: string; animalId: string; kind: string; recordedBy: string | null }
    >();
    // One molt per animal per local day: a second is refused, its details go on the first.
    const moltTimes = await liveMoltTimes(db, [...new Set(candidates.filter((c) => c.event.kind === 'molted').map((c) => c.event.animalId))]);
    const moltDays = (animalId: string) => new Set((moltTimes.get(animalId) ?? []).map((t) => localDateOf(t, member.timeZone)));
    const toInsert: IncomingEvent[] = [];
    for (const { index, event, effectiveAt, flags } of candidates) {
      const helperVerdict = helper ? judgeHelperWrite(member, effectiveAt, received) : 'ok';
      const already = stored.get(event.id);
      const targetId = targetOf(event);
      const target = targetId ? (stored.get(targetId) ?? accepted.get(targetId)) : null;
      if (already) {
        if (already.collectionId === member.collectionId)
          results[index] = { id: event.id, status: 'duplicate' };
        else reject(index, event.id, 'id_conflict', 'This event id is already used elsewhere.');
      } else if (!known.has(event.animalId)) {
        reject(
          index,
          event.id,
          'unknown_animal',
          'This animal is not in this collection; it may have been removed.',
        );
      } else if (helper && !HELPER_EVENT_KINDS.includes(event.kind)) {
        reject(
          index,
          event.id,
          'not_for_helpers',
          'Helpers record feeding, water, molts and notes; ask a keeper to record this.',
        );
      } else if (helperVerdict !== 'ok') {
        reject(index, event.id, 'outside_cover', helperRefusal(member, helperVerdict));
      } else if (pairingRefusal(event)) {
        reject(index, event.id, 'invalid', `A pairing is not recorded: ${pairingRefusal(event)}`);
      } else if (targetId && !target) {
        reject(index, event.id, 'target_unknown', event.kind === 'void' ? 'The outcome this undoes was never saved.' : 'The molt these details belong to was never saved.');
      } else if (event.kind === 'molt_details' && target && target.kind !== 'molted') {
        reject(index, event.id, 'bad_target', 'Molt details belong to a molt; this points at another kind of fact.');
      } else if (event.kind === 'molted' && moltDays(event.animalId).has(localDateOf(effectiveAt, member.timeZone))) {
        reject(
          index,
          event.id,
          'invalid',
          `A molt is already recorded for this animal on ${shortDate(localDateOf(effectiveAt, member.timeZone))}. Add its size or sex to that molt instead of recording a second one.`,
        );
      } else if (
        target &&
        (target.collectionId !== member.collectionId || target.animalId !== event.animalId)
      ) {
        reject(index, event.id, 'bad_target', 'This undoes an outcome of another animal.');
      } else if (target && helper && target.recordedBy !== userId) {
        reject(index, event.id, 'not_for_helpers', 'Helpers can undo only their own taps.');
      } else {
        accepted.set(event.id, {
          collectionId: member.collectionId,
          animalId: event.animalId,
          kind: event.kind,
          recordedBy: userId,
        });
        if (event.kind === 'molted') moltTimes.get(event.animalId)?.push(effectiveAt);
        toInsert.push({
          id: event.id,
          animalId: event.animalId,
          kind: event.kind,
          payload: event.payload,
          recordedBy: userId,
          deviceId: body.deviceId,
          clientRecordedAt: new Date(event.clientRecordedAt),
          clientSentAt: sentAt,
          effectiveAt,
          flags,
        });
        results[index] = { id: event.id, status: 'accepted' };
      }
    }

    await flagMealsWhileHeld(member, toInsert);
    const { inserted } = toInsert.length
      ? await ingest(member.collectionId, member.timeZone, toInsert, received)
      : { inserted: new Set<string>() };
    // Another request carrying the same ids may have committed first: theirs is the copy kept.
    const lost = toInsert.filter((e) => !inserted.has(e.id)).map((e) => e.id);
    if (lost.length) {
      const winners = await storedEvents(db, lost);
      for (const r of results) {
        if (!lost.includes(r.id)) continue;
        if (winners.get(r.id)?.collectionId === member.collectionId) r.status = 'duplicate';
        else
          Object.assign(r, {
            status: 'rejected',
            reason: 'id_conflict',
            message: 'This event id is already used elsewhere.',
          });
      }
    }
    return {
      serverReceivedAt: received.toISOString(),
      offsetMs: clockOffsetMs(sentAt, received),
      results,
    };
  }

  /** An animal's recent facts for its history, each marked when a later void cancelled it. */
  async function history(
    collectionId: string,
    animalId: string,
    limit: number,
  ): Promise<HistoryEvent[]> {
    const rows = await recentEventsOf(db, collectionId, animalId, limit);
    const voidedBy = new Map<string, string>();
    for (const r of rows) {
      const target = (r.payload as { targetId?: unknown }).targetId;
      if (r.kind === 'void' && typeof target === 'string') voidedBy.set(target, r.id);
    }
    // A molt shows the details added to it later: one molt, one record (growth reads these).
    const merged = new Map(
      mergeMoltDetails(
        rows
          .filter((r) => (r.kind === 'molted' || r.kind === 'molt_details') && !voidedBy.has(r.id))
          .map((r) => ({ id: r.id, kind: r.kind, payload: r.payload as Record<string, unknown>, at: r.effectiveAt.toISOString() })),
      ).map((m) => [m.id, m.payload]),
    );
    return rows.map((r) => ({
      id: r.id,
      kind: r.kind as EventKind,
      at: r.effectiveAt.toISOString(),
      by: r.by,
      payload: merged.get(r.id) ?? (r.payload as Record<string, unknown>),
      flags: r.flags,
      voidedBy: voidedBy.get(r.id) ?? null,
      photoVersion: r.photo?.toISOString() ?? null,
    }));
  }

  return { ingest, recordBatch, history };
}

function rawId(raw: unknown): string {
  const id = (raw as { id?: unknown } | null)?.id;
  return typeof id === 'string' ? id.slice(0, 64) : '';
}
export type EventsService = ReturnType<typeof createEventsService>;
