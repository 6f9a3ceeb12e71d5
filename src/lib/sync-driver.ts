import { useSyncExternalStore } from 'react';
import type { ChoreBatchBody } from '#shared/schemas/chores';
import type { EventBatchBody } from '#shared/schemas/events';
import { apiRaw } from './api-client';
import { withDb } from './db';
import {
  backoffDelay,
  createSyncEngine,
  STARTING_STATUS,
  type SyncEngine,
  type ChoreTransport,
  type SyncStatus,
  type SyncTransport,
} from './sync';

const REQUEST_TIMEOUT_MS = 20_000;
/** A tap is sent shortly after, so a quick run of taps travels in one request. */
const AFTER_TAP_MS = 1_500;

/**
 * POSTs a batch through the API client's raw mode: the engine reads every status itself (only
 * per-event verdicts settle taps). No answer, or none within the timeout, throws.
 */
export const fetchTransport: SyncTransport = async (collectionId: string, body: EventBatchBody) => {
  const res = await apiRaw(`/collections/${collectionId}/events`, {
    method: 'POST',
    body,
    signal: AbortSignal.timeout(REQUEST_TIMEOUT_MS),
  });
  return { status: res.status, body: await res.json().catch(() => null) };
};

/** The same for a batch of chores (decision 020). */
export const fetchChoreTransport: ChoreTransport = async (
  collectionId: string,
  body: ChoreBatchBody,
) => {
  const res = await apiRaw(`/collections/${collectionId}/chores`, {
    method: 'POST',
    body,
    signal: AbortSignal.timeout(REQUEST_TIMEOUT_MS),
  });
  return { status: res.status, body: await res.json().catch(() => null) };
};

let engine: SyncEngine | null = null;
let current: SyncStatus = STARTING_STATUS;
const listeners = new Set<() => void>();
let retryTimer: ReturnType<typeof setTimeout> | undefined;
let retryPending = false;

function schedule(delayMs: number) {
  retryPending = true;
  retryTimer = setTimeout(() => {
    retryPending = false;
    void flushNow();
  }, delayMs);
}

let afterSaved: (() => void) | undefined;
let saves = 0;

/** How many flushes have had taps acknowledged or refused since the page loaded. */
export const timesSaved = () => saves;

function publish(status: SyncStatus) {
  current = status;
  for (const l of listeners) l();
}

async function flushNow() {
  if (!engine) return;
  clearTimeout(retryTimer);
  retryPending = false;
  const mine = engine;
  const result = await mine.flush();
  if (mine !== engine) return;
  if (result.acknowledged || result.refused) {
    saves += 1;
    afterSaved?.();
  }
  const { phase, failures } = mine.status();
  // Signed out waits for a sign-in; anything else that failed tries again later.
  if (!result.ok && phase !== 'signed_out') schedule(backoffDelay(failures));
}

const onOnline = () => void flushNow();
const onVisible = () => {
  if (document.visibilityState === 'visible') void flushNow();
};

/**
 * Starts syncing for the signed-in person (the page drives sync: at start, when the signal
 * returns, when the page is shown again, after taps, on "Sync now" and by a backoff timer).
 * Returns a stop function.
 */
export function startSync(userId: string, onSaved: () => void): () => void {
  stopSync();
  afterSaved = onSaved;
  engine = createSyncEngine({
    db: () => withDb(async (d) => d),
    userId,
    send: fetchTransport,
    sendChores: fetchChoreTransport,
    onStatus: publish,
  });
  window.addEventListener('online', onOnline);
  document.addEventListener('visibilitychange', onVisible);
  void flushNow();
  return stopSync;
}

function stopSync() {
  clearTimeout(retryTimer);
  retryPending = false;
  window.removeEventListener('online', onOnline);
  document.removeEventListener('visibilitychange', onVisible);
  engine = null;
  publish(STARTING_STATUS);
}

/**
 * After a tap: show the new count at once and send soon. While the server is out of reach the
 * backoff timer already set is left alone, so a run of taps does not hammer storage or network.
 */
export function tapRecorded() {
  engine?.noteTap();
  const unreachable = current.phase === 'offline' || current.phase === 'failing';
  if (unreachable && retryPending) return;
  clearTimeout(retryTimer);
  schedule(unreachable ? backoffDelay(current.failures) : AFTER_TAP_MS);
}

export const syncNow = () => flushNow();
export const refreshSyncCounts = () => void engine?.refresh();

export function useSyncStatus(): SyncStatus {
  return useSyncExternalStore(
    (listener) => {
      listeners.add(listener);
      return () => listeners.delete(listener);
    },
    () => current,
  );
}
