import { useSyncExternalStore } from 'react';
import { ApiError } from '@/lib/api-client';
import { withDb } from '@/lib/db';
import { syncNow } from '@/lib/sync-driver';
import { uploadPhoto } from '@/lib/upload-photo';

/**
 * A photo taken with a round outcome. The outcome itself (and its note) is queued on the phone
 * and works with no signal; the photo is not queued: it is held by this page and sent once the
 * outcome has reached the server, so it needs a signal and the page left open until then.
 */
export type PhotoPhase = 'waiting' | 'sending' | 'sent' | 'failed';
export interface OutcomePhoto {
  eventId: string;
  animalId: string;
  /** "Ate", the outcome the photo goes with. */
  word: string;
  phase: PhotoPhase;
  message?: string;
}

/** Again soon when the phone believes it is online (a sync was already under way), else rarely. */
const retryDelay = () => (navigator.onLine ? 2_000 : 15_000);
let photos: readonly OutcomePhoto[] = [];
const listeners = new Set<() => void>();

function update(eventId: string, change: Partial<OutcomePhoto>) {
  photos = photos.map((p) => (p.eventId === eventId ? { ...p, ...change } : p));
  listeners.forEach((l) => l());
}

const stillQueued = (eventId: string) =>
  withDb((db) => db.getKeyFromIndex('outbox', 'byEventId', eventId)).then((k) => k !== undefined);

/** Sends the photo when the outcome is on the server: now if it can, else when the signal returns. */
export function sendOutcomePhoto(
  collectionId: string,
  outcome: { eventId: string; animalId: string; word: string },
  file: File,
) {
  photos = [
    ...photos.filter((p) => p.eventId !== outcome.eventId),
    { ...outcome, phase: 'waiting' },
  ];
  listeners.forEach((l) => l());
  const url = `/collections/${collectionId}/animals/${outcome.animalId}/events/${outcome.eventId}/photo`;
  let timer: ReturnType<typeof setTimeout> | undefined;
  const later = () => {
    update(outcome.eventId, { phase: 'waiting' });
    clearTimeout(timer);
    timer = setTimeout(() => void attempt(), retryDelay());
  };
  const onOnline = () => void attempt();
  window.addEventListener('online', onOnline);
  const finish = (change: Partial<OutcomePhoto>) => {
    clearTimeout(timer);
    window.removeEventListener('online', onOnline);
    update(outcome.eventId, change);
  };
  let busy = false;
  async function attempt() {
    if (busy) return;
    busy = true;
    try {
      await syncNow();
      if (await stillQueued(outcome.eventId)) return later();
      update(outcome.eventId, { phase: 'sending' });
      // The schema (and zod with it) loads with the first photo, not with the first screen (P4).
      const { noContent } = await import('#shared/schemas/common');
      await uploadPhoto(url, file, noContent);
      finish({ phase: 'sent' });
    } catch (err) {
      if (err instanceof ApiError && err.status === 0) later();
      else finish({ phase: 'failed', message: (err as Error).message });
    } finally {
      busy = false;
    }
  }
  void attempt();
}

/** The photos taken with this animal's outcomes while this page has been open. */
export function useOutcomePhotos(animalId: string): OutcomePhoto[] {
  const all = useSyncExternalStore(
    (l) => {
      listeners.add(l);
      return () => listeners.delete(l);
    },
    () => photos,
  );
  return all.filter((p) => p.animalId === animalId);
}
