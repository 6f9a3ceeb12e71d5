import { SYNC_BATCH_SIZE } from '#shared/domain/sync-limits';
import type { EventBatchBody, EventResult } from '#shared/schemas/events';
import { readErrorBody } from './api-client';
import { deviceIdOf, type RacksideDb } from './db';
import { nextBatch, settleBatch } from './outbox';

/** Sends one batch; throws when no answer came back (no signal, dropped, timed out). */
export type SyncTransport = (
  collectionId: string,
  body: EventBatchBody,
) => Promise<{ status: number; body: unknown }>;

export type SyncPhase = 'idle' | 'saving' | 'offline' | 'failing' | 'signed_out';

export interface SyncStatus {
  phase: SyncPhase;
  waiting: number;
  attention: number;
  /** Taps sent so far in the running flush, out of those waiting when it started. */
  progress: { sent: number; total: number } | null;
  lastSavedAt: string | null;
  failures: number;
}

export interface FlushResult {
  ok: boolean;
  acknowledged: number;
  refused: number;
}

/** Nothing waiting, nothing known yet. */
export const IDLE_STATUS: SyncStatus = { phase: 'idle', waiting: 0, attention: 0, progress: null, lastSavedAt: null, failures: 0 };

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
  now?: () => Date;
  batchSize?: number;
  onStatus?: (status: SyncStatus) => void;
}

/**
 * Empties one person's outbox through the server. Only taps the server acknowledged leave the
 * outbox; refused ones move to "needs attention"; anything else stays for the next try.
 */
export function createSyncEngine({
  db,
  userId,
  send,
  now = () => new Date(),
  batchSize = SYNC_BATCH_SIZE,
  onStatus,
}: EngineOptions) {
  let status: SyncStatus = IDLE_STATUS;
  let running: Promise<FlushResult> | null = null;

  const update = (patch: Partial<SyncStatus>) => {
    status = { ...status, ...patch };
    onStatus?.(status);
  };

  async function counts(d: RacksideDb) {
    const [waiting, attention] = await Promise.all([
      d.countFromIndex('outbox', 'byUser', userId),
      d.countFromIndex('attention', 'byUser', userId),
    ]);
    return { waiting, attention };
  }

  async function run(): Promise<FlushResult> {
    const d = await db();
    const deviceId = await deviceIdOf(d);
    const start = await counts(d);
    const result: FlushResult = { ok: true, acknowledged: 0, refused: 0 };
    if (!start.waiting) {
      update({ ...start, phase: 'idle', progress: null, failures: 0 });
      return result;
    }
    update({ ...start, phase: 'saving', progress: { sent: 0, total: start.waiting } });
    let size = batchSize;
    const fail = async (phase: SyncPhase) => {
      update({
        ...(await counts(d)),
        phase,
        progress: null,
        failures: phase === 'signed_out' ? status.failures : status.failures + 1,
      });
      return { ...result, ok: false };
    };

    for (;;) {
      const batch = await nextBatch(d, userId, size);
      if (!batch.length) break;
      let answer: { status: number; body: unknown };
      try {
        answer = await send(batch[0]!.collectionId, {
          deviceId,
          clientSentAt: now().toISOString(),
          events: batch.map((e) => e.event),
        });
      } catch {
        return fail('offline');
      }
      if (answer.status === 401) return fail('signed_out');
      if (answer.status === 413 && size > 1) {
        size = Math.max(1, Math.floor(size / 2));
        continue;
      }
      let results: EventResult[];
      if (answer.status === 403 || answer.status === 404) {
        // The whole collection refused this person (cover over, removed): these taps can
        // never be saved as they are, so they are shown, not retried forever.
        const message =
          readErrorBody(answer.body)?.message ??
          'This collection refused your taps.';
        results = batch.map((e) => ({
          id: e.event.id,
          status: 'rejected',
          reason: 'invalid',
          message,
        }));
        const settled = await settleBatch(d, batch, results, now(), 'collection_refused');
        result.refused += settled.refused;
      } else {
        // The schema loads on the first answer, not with the first screen.
        const { eventBatchResponse } = await import('#shared/schemas/events');
        const parsed = answer.status === 200 ? eventBatchResponse.safeParse(answer.body) : null;
        if (!parsed?.success) return fail('failing');
        results = parsed.data.results;
        const settled = await settleBatch(d, batch, results, now());
        result.acknowledged += settled.acknowledged;
        result.refused += settled.refused;
        // A well-formed answer that settled none of what was sent would loop forever.
        if (!settled.acknowledged && !settled.refused) return fail('failing');
      }
      update({
        progress: {
          sent: result.acknowledged + result.refused,
          total: Math.max(start.waiting, result.acknowledged + result.refused),
        },
      });
    }
    update({
      ...(await counts(d)),
      phase: 'idle',
      progress: null,
      failures: 0,
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
    /** Re-reads the counts after a dismissal without sending anything. */
    async refresh() {
      update(await counts(await db()));
    },
    status: () => status,
  };
}
export type SyncEngine = ReturnType<typeof createSyncEngine>;
