import { clockOffsetMs } from '#shared/domain/clock';
import { FED_WHILE_HELD, type EventKind } from '#shared/domain/event-kinds';
import {
  factsToLoad,
  judgeBatch,
  screenBatch,
  settleLostRaces,
} from '#shared/domain/event-verdicts';
import { mergeMoltDetails } from '#shared/domain/growth';
import { localDateOf, type LocalDate } from '#shared/domain/local-dates';
import { MAX_BATCH_EVENTS } from '#shared/domain/sync-limits';
import type { EventBatchBody, EventBatchResponse, HistoryEvent } from '#shared/schemas/events';
import type { Membership } from '../../access/memberships';
import { batchMemo, type BatchMemo } from '../../batch-memo';
import type { Db } from '../../db/client';
import { isRetryableConflict } from '../../db/errors';
import { HttpError } from '../../middleware/errors';
import {
  animalIdsInCollection,
  breedersAmong,
  liveMoltTimes,
  recentEventsOf,
  storedEvents,
} from './events.repository';
import { recordEvents, type DeviceEvent, type EventCollection } from './record-events';

export type OnRecorded = (
  collection: EventCollection,
  recorded: {
    id: string;
    animalId: string;
    kind: EventKind;
    payload: Record<string, unknown>;
    effectiveAt: Date;
  }[],
  /** Loads the batch's checks share (feed holds, these hooks): each made once per batch. */
  batch: BatchMemo,
) => Promise<void>;

export interface EventsServiceOptions {
  now: () => Date;
  /** Whether food is withheld from these animals on a date, and why: a meal then is flagged. */
  feedHolds: (
    collectionId: string,
    animalIds: string[],
    date: LocalDate,
    batch: BatchMemo,
  ) => Promise<ReadonlyMap<string, unknown>>;
  /** Run in order after each device batch is committed. */
  onRecorded?: readonly OnRecorded[];
}

/**
 * Phones' taps: each judged on its own (shared/domain/event-verdicts.ts), stored exactly once
 * (the client's id is the key) through `recordEvents`, then handed to the `onRecorded` hooks.
 */
export function createEventsService(
  db: Db,
  { now, feedHolds, onRecorded = [] }: EventsServiceOptions,
) {
  /** Stores judged taps in one transaction, then runs the hooks on the ones that are new. */
  async function ingest(
    collectionId: string,
    zone: string,
    incoming: DeviceEvent[],
    received = now(),
    batch = batchMemo(),
  ) {
    const collection = { collectionId, timeZone: zone };
    // Batches sharing animals lock them in the same order, but a first event of an animal, or
    // a restore running beside a sync, can still meet another transaction the other way round:
    // PostgreSQL then aborts one, which runs again (nothing of it was kept).
    let inserted!: Set<string>;
    for (let attempt = 1; ; attempt++) {
      try {
        inserted = await db.transaction((tx) =>
          recordEvents(tx, collection, incoming, { from: 'device', receivedAt: received }),
        );
        break;
      } catch (err) {
        if (attempt >= 3 || !isRetryableConflict(err)) throw err;
      }
    }
    const recorded = incoming
      .filter((e) => inserted.has(e.id))
      .map(({ id, animalId, kind, payload, effectiveAt }) => ({
        id,
        animalId,
        kind,
        payload,
        effectiveAt,
      }));
    for (const hook of onRecorded) await hook(collection, recorded, batch);
    return { inserted };
  }

  /**
   * A meal recorded while the engine withholds food (a molt hold, premolt, a do-not-feed note…)
   * is stored — it happened — but flagged for the owner (R18). Judged before the batch lands,
   * for every meal in it (the verdicts are not known yet): only accepted ones are flagged.
   */
  async function holdsOfMeals(
    member: Membership,
    meals: readonly { event: { animalId: string }; effectiveAt: Date }[],
    batch: BatchMemo,
  ): Promise<Map<string, ReadonlyMap<string, unknown>>> {
    const byDate = new Map<string, Set<string>>();
    for (const { event, effectiveAt } of meals) {
      const date = localDateOf(effectiveAt, member.timeZone);
      byDate.set(date, (byDate.get(date) ?? new Set()).add(event.animalId));
    }
    return new Map(
      await Promise.all(
        [...byDate].map(
          async ([date, ids]) =>
            [date, await feedHolds(member.collectionId, [...ids], date, batch)] as const,
        ),
      ),
    );
  }

  /** One sync request from a device: a verdict per event, a re-sent event a duplicate. */
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
    const screened = screenBatch(body.events, sentAt, received);
    const wanted = factsToLoad(screened, member.role);
    const batch = batchMemo();
    const [animals, stored, breeders, moltTimes, holds] = await Promise.all([
      animalIdsInCollection(db, member.collectionId, wanted.animalIds),
      storedEvents(db, wanted.eventIds),
      breedersAmong(db, member.collectionId, wanted.pairedIds),
      liveMoltTimes(db, wanted.moltingIds),
      holdsOfMeals(
        member,
        screened.candidates.filter((c) => c.event.kind === 'ate'),
        batch,
      ),
    ]);
    const { results, accepted } = judgeBatch(
      screened,
      { ...member, userId },
      { animals, stored, breeders, moltTimes },
      received,
    );
    const toInsert: DeviceEvent[] = accepted.map(({ event, effectiveAt, flags }) => ({
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
    }));

    for (const e of toInsert)
      if (
        e.kind === 'ate' &&
        holds.get(localDateOf(e.effectiveAt, member.timeZone))?.has(e.animalId)
      )
        e.flags = [...(e.flags ?? []), FED_WHILE_HELD];
    const { inserted } = toInsert.length
      ? await ingest(member.collectionId, member.timeZone, toInsert, received, batch)
      : { inserted: new Set<string>() };
    const lost = new Set(toInsert.filter((e) => !inserted.has(e.id)).map((e) => e.id));
    return {
      serverReceivedAt: received.toISOString(),
      offsetMs: clockOffsetMs(sentAt, received),
      results: lost.size
        ? settleLostRaces(results, lost, await storedEvents(db, [...lost]), member.collectionId)
        : results,
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
          .map((r) => ({
            id: r.id,
            kind: r.kind,
            payload: r.payload as Record<string, unknown>,
            at: r.effectiveAt.toISOString(),
          })),
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

export type EventsService = ReturnType<typeof createEventsService>;
