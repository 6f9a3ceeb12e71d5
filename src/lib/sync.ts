import { SYNC_BATCH_SIZE } from '#shared/domain/sync-limits';
import type { ChoreBatchBody } from '#shared/schemas/chores';
import type { EventBatchBody } from '#shared/schemas/events';
import { readErrorBody } from './api-client';
import { nextChoreBatch, settleChores, waitingChoreCount } from './chores';
import { deviceIdOf, type RacksideDb } from './db';
import { nextBatch, settleBatch } from './outbox';

/** Sends one batch; throws when no answer came back (no signal, dropped, timed out). */
export type SyncTransport = (
  collectionId: string,
  body: EventBatchBody,
) => Promise<{ status: number; body: unknown }>;

/** Sends one batch of chores (decision 020); throws when no answer came back. */
export type ChoreTransport = (
  collectionId: string,
  body: ChoreBatchBody,
) => Promise<{ status: number; body: unknown }>;

/** `starting`: the outbox has not been counted yet, so nothing can be said about the taps. */
export type SyncPhase = 'starting' | 'idle' | 'saving' | 'offline' | 'failing' | 'signed_out';

export interface SyncStatus {
  phase: SyncPhase;
  waiting: number;
  attention: number;
  /** Taps sent so far in the running flush, out of those waiting when it started. */
  progress: { sent: number; total: number } | null;
  lastSavedAt: string | null;
  failures: number;
  /** Why taps are still waiting after the last try, in plain words; null when nothing failed. */
  reason: string | null;
}

export interface FlushResult {
  ok: boolean;
  acknowledged: number;
  refused: number;
}

/** Nothing waiting, nothing known yet. */
export const IDLE_STATUS: SyncStatus = {
  phase: 'idle',
  waiting: 0,
  attention: 0,
  progress: null,
  lastSavedAt: null,
  failures: 0,
  reason: null,
};

/** Before the outbox is counted: never "All saved" while taps may still be waiting. */
export const STARTING_STATUS: SyncStatus = { ...IDLE_STATUS, phase: 'starting' };

const BASE_DELAY_MS = 2_000;
const MAX_DELAY_MS = 5 * 60_000;

/**
 * Exponential backoff with full jitter: a random wait between 0 and base·2^(n−1), capped, so
 * phones that lost signal together do not all retry together when it comes back.
 */
export function backoffDelay(failures: number, random: () => number = Math.random): number {
  if (failures <= 0) return 0;
  return Math.floor(random() * Math.min(MAX_DELAY_MS, BASE_DELAY_MS * 2 ** (failures - 1)));
}

interface EngineOptions {
  db: () => Promise<RacksideDb>;
  userId: string;
  send: SyncTransport;
  /** Chores ride the same flush after the taps; without it only taps are sent. */
  sendChores?: ChoreTransport;
  now?: () => Date;
  batchSize?: number;
  onStatus?: (status: SyncStatus) => void;
}

const NO_ANSWER = 'No answer from Rackside: no signal, or the server cannot be reached.';

/**
 * Why an answer without verdicts left the taps waiting. Such an answer says nothing about the
 * taps themselves — a proxy's HTML 404 during a deploy, a CSRF 403 after a proxy rewrote the
 * Host, a 5xx — so the words describe the trouble, never the taps.
 */
export function waitingReason(status: number, body: unknown): string {
  if (status >= 500) return `Rackside’s server had a problem (error ${status}).`;
  const said = readErrorBody(body)?.message;
  return said
    ? `The server did not take the taps (error ${status}): ${said}`
    : `The server did not take the taps (error ${status}).`;
}

/**
 * Empties one person's outbox through the server. A tap leaves the outbox only with the
 * server's verdict on that very tap: accepted or duplicate taps are done, rejected ones move to
 * "needs attention". Any answer without verdicts (network failure, 401, 403, 404, 5xx, an
 * unreadable body) keeps the whole batch for the next try, however often it happens.
 */
export function createSyncEngine({
  db,
  userId,
  send,
  sendChores,
  now = () => new Date(),
  batchSize = SYNC_BATCH_SIZE,
  onStatus,
}: EngineOptions) {
  let status: SyncStatus = STARTING_STATUS;
  let running: Promise<FlushResult> | null = null;

  const update = (patch: Partial<SyncStatus>) => {
    status = { ...status, ...patch };
    onStatus?.(status);
  };

  async function counts(d: RacksideDb) {
    const [taps, chores, attention] = await Promise.all([
      d.countFromIndex('outbox', 'byUser', userId),
      sendChores ? waitingChoreCount(d, userId) : 0,
      d.countFromIndex('attention', 'byUser', userId),
    ]);
    return { waiting: taps + chores, attention };
  }

  async function run(): Promise<FlushResult> {
    const d = await db();
    const deviceId = await deviceIdOf(d);
    const start = await counts(d);
    const result: FlushResult = { ok: true, acknowledged: 0, refused: 0 };
    if (!start.waiting) {
      update({ ...start, phase: 'idle', progress: null, failures: 0, reason: null });
      return result;
    }
    update({ ...start, phase: 'saving', progress: { sent: 0, total: start.waiting } });
    const fail = async (phase: SyncPhase, reason: string) => {
      update({
        ...(await counts(d)),
        phase,
        progress: null,
        failures: phase === 'signed_out' ? status.failures : status.failures + 1,
        reason,
      });
      return { ...result, ok: false };
    };

    /**
     * Sends one kind of waiting record batch by batch until none is left; a result on the way
     * out ends the flush there. Only a verdict on a record settles it.
     */
    const drain = async <E extends { collectionId: string }>(lane: {
      next: (size: number) => Promise<E[]>;
      send: (collectionId: string, batch: E[]) => Promise<{ status: number; body: unknown }>;
      /** Null when the answer could not be read. */
      settle: (
        batch: E[],
        body: unknown,
      ) => Promise<{ acknowledged: number; refused: number } | null>;
      what: string;
    }): Promise<FlushResult | null> => {
      for (let size = batchSize; ;) {
        const batch = await lane.next(size);
        if (!batch.length) return null;
        let answer: { status: number; body: unknown };
        try {
          answer = await lane.send(batch[0]!.collectionId, batch);
        } catch {
          return fail('offline', NO_ANSWER);
        }
        if (answer.status === 401)
          return fail('signed_out', 'Your sign-in has ended on this phone.');
        if (answer.status === 413 && size > 1) {
          size = Math.max(1, Math.floor(size / 2));
          continue;
        }
        if (answer.status !== 200)
          return fail('failing', waitingReason(answer.status, answer.body));
        const settled = await lane.settle(batch, answer.body);
        if (!settled) return fail('failing', 'The server’s answer could not be read.');
        result.acknowledged += settled.acknowledged;
        result.refused += settled.refused;
        // A well-formed answer that settled none of what was sent would loop forever.
        if (!settled.acknowledged && !settled.refused)
          return fail('failing', `The server answered without a word on these ${lane.what}.`);
        update({
          progress: {
            sent: result.acknowledged + result.refused,
            total: Math.max(start.waiting, result.acknowledged + result.refused),
          },
        });
      }
    };

    const taps = await drain({
      next: (size) => nextBatch(d, userId, size),
      send: (collectionId, batch) =>
        send(collectionId, {
          deviceId,
          clientSentAt: now().toISOString(),
          events: batch.map((e) => e.event),
        }),
      settle: async (batch, body) => {
        // The schema loads on the first answer, not with the first screen.
        const { eventBatchResponse } = await import('#shared/schemas/events');
        const parsed = eventBatchResponse.safeParse(body);
        return parsed.success ? settleBatch(d, batch, parsed.data.results, now()) : null;
      },
      what: 'taps',
    });
    if (taps) return taps;
    // Chores after the taps, by the same rule.
    const chores =
      sendChores &&
      (await drain({
        next: (size) => nextChoreBatch(d, userId, size),
        send: (collectionId, batch) =>
          sendChores(collectionId, {
            deviceId,
            clientSentAt: now().toISOString(),
            chores: batch.map((e) => e.chore),
          }),
        settle: async (batch, body) => {
          const { choreBatchResponse } = await import('#shared/schemas/chores');
          const parsed = choreBatchResponse.safeParse(body);
          return parsed.success ? settleChores(d, batch, parsed.data.results, now()) : null;
        },
        what: 'chores',
      }));
    if (chores) return chores;
    update({
      ...(await counts(d)),
      phase: 'idle',
      progress: null,
      failures: 0,
      reason: null,
      lastSavedAt: now().toISOString(),
    });
    return result;
  }

  return {
    /** Sends everything waiting; a call during a running flush joins it. */
    flush(): Promise<FlushResult> {
      running ??= run().finally(() => (running = null));
      return running;
    },
    /** A tap was queued: count it without reading storage (taps must stay cheap). */
    noteTap() {
      update({ waiting: status.waiting + 1 });
    },
    /** Re-reads the counts after a change to the lists without sending anything. */
    async refresh() {
      const known = await counts(await db());
      update(status.phase === 'starting' ? { ...known, phase: 'idle' } : known);
    },
    status: () => status,
  };
}
export type SyncEngine = ReturnType<typeof createSyncEngine>;
