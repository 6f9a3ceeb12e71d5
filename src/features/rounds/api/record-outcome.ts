import { useQueryClient } from '@tanstack/react-query';
import { useCallback } from 'react';
import type { EventKind } from '#shared/domain/event-kinds';
import type { RecordedEvent } from '#shared/schemas/events';
import { withDb, type CachedRound } from '@/lib/db';
import { recordTap, recordTaps } from '@/lib/outbox';
import { queryKeys } from '@/lib/query-keys';
import { applyTapEffect } from '@/lib/round-cache';
import { askToKeepStorageOnce } from '@/lib/storage';
import { tapRecorded } from '@/lib/sync-driver';

export interface Recorder {
  userId: string;
  byName: string;
  collectionId: string;
}

/**
 * One tap: the event and its effect on today's round are written to the phone in one
 * transaction and the screen updates from that write. Sending happens later, on its own.
 */
export function useRecordOutcome({ userId, byName, collectionId }: Recorder) {
  const queryClient = useQueryClient();
  return useCallback(
    async (
      animal: { id: string; name: string },
      kind: EventKind,
      payload: Record<string, unknown> = {},
      at?: Date,
    ): Promise<RecordedEvent> => {
      const started = performance.now();
      // `at`: a fact recorded afterwards (a molt found this morning, entered tonight).
      const event: RecordedEvent = {
        id: crypto.randomUUID(),
        animalId: animal.id,
        kind,
        payload,
        clientRecordedAt: (at ?? new Date()).toISOString(),
      };
      const effect = await withDb((db) =>
        recordTap(db, { userId, byName, collectionId, animalName: animal.name, event }),
      );
      // User Timing, read by the P1 benchmark: how much of a tap is the IndexedDB commit.
      performance.measure('rackside:tap-committed', { start: started });
      if (effect) {
        queryClient.setQueryData<CachedRound | null>(
          queryKeys.rounds.local(collectionId, 'today', userId),
          (prev) => (prev ? applyTapEffect(prev, effect) : prev),
        );
      }
      tapRecorded();
      void askToKeepStorageOnce();
      return event;
    },
    [queryClient, userId, byName, collectionId],
  );
}

/** Many outcomes in one go (a tray of slings), written in one transaction, sent later. */
export function useRecordMany({ userId, byName, collectionId }: Recorder) {
  const queryClient = useQueryClient();
  return useCallback(
    async (
      list: {
        animal: { id: string; name: string };
        kind: EventKind;
        payload?: Record<string, unknown>;
      }[],
    ) => {
      const at = new Date().toISOString();
      const taps = list.map(({ animal, kind, payload = {} }) => ({
        userId,
        byName,
        collectionId,
        animalName: animal.name,
        event: {
          id: crypto.randomUUID(),
          animalId: animal.id,
          kind,
          payload,
          clientRecordedAt: at,
        } satisfies RecordedEvent,
      }));
      const effects = await withDb((db) => recordTaps(db, taps));
      queryClient.setQueryData<CachedRound | null>(
        queryKeys.rounds.local(collectionId, 'today', userId),
        (prev) => (prev ? effects.reduce(applyTapEffect, prev) : prev),
      );
      tapRecorded();
      void askToKeepStorageOnce();
      return taps.map((t) => t.event);
    },
    [queryClient, userId, byName, collectionId],
  );
}
