import { useQuery, useQueryClient } from '@tanstack/react-query';
import type { ChoreSubjectKind } from '#shared/schemas/chores';
import { choresOn, discardChore, recordChore } from './chores';
import { withDb } from './db';
import { queryKeys } from './query-keys';
import { tapRecorded } from './sync-driver';

// The chores outbox as screens use it (decision 020): one query of the day's chores on this
// phone, shared by every subject kind's screen, and one way to record and discard them.

/** This phone's chores of a collection on a local date, waiting, sent or refused. */
export const useChoresOn = (collectionId: string, localDate: string) =>
  useQuery({
    queryKey: queryKeys.chores.on(collectionId, localDate),
    networkMode: 'always',
    queryFn: () => withDb((db) => choresOn(db, collectionId, localDate)),
  });

/** One tap: the chore is stored on the phone at once and sent by the sync engine. */
export function useChoreRecorder(userId: string, collectionId: string, localDate: string) {
  const queryClient = useQueryClient();
  const key = queryKeys.chores.on(collectionId, localDate);
  return {
    record: async (
      subjectKind: ChoreSubjectKind,
      subjectId: string,
      kind: string,
      payload: Record<string, unknown> = {},
    ) => {
      const id = crypto.randomUUID();
      await withDb((db) =>
        recordChore(db, {
          id,
          userId,
          collectionId,
          localDate,
          chore: {
            id,
            subjectKind,
            subjectId,
            kind,
            clientRecordedAt: new Date().toISOString(),
            payload,
          },
        }),
      );
      tapRecorded();
      await queryClient.invalidateQueries({ queryKey: key });
    },
    discard: async (id: string) => {
      await withDb((db) => discardChore(db, id));
      await queryClient.invalidateQueries({ queryKey: key });
    },
  };
}
