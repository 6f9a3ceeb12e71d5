import { queryOptions, useQuery } from '@tanstack/react-query';
import type { AnimalSummary } from '#shared/schemas/animals';
import { ApiError, apiRequest } from '@/lib/api-client';
import { withDb } from '@/lib/db';
import { cachedDirectory, storeDirectory } from '@/lib/directory';
import { queryKeys } from '@/lib/query-keys';

export interface AnimalDirectory {
  animals: AnimalSummary[];
  /** Set when the list is this phone's copy because the server could not be reached (ISO). */
  offlineSince: string | null;
}

/**
 * The collection's animals from the server, kept on the phone as they arrive; with no signal,
 * the phone's last copy, so labels print and scans resolve in a back room.
 */
export async function loadAnimals(collectionId: string): Promise<AnimalDirectory> {
  try {
    // The schema loads with the first answer, not with the first screen (P4).
    const { animals } = await apiRequest(`/collections/${collectionId}/animals`, {
      schema: async () => (await import('#shared/schemas/animals')).animalListResponse,
    });
    void withDb((db) => storeDirectory(db, collectionId, animals, new Date())).catch(
      () => undefined,
    );
    return { animals, offlineSince: null };
  } catch (err) {
    if (!(err instanceof ApiError) || err.status !== 0) throw err;
    const cached = await withDb((db) => cachedDirectory(db, collectionId)).catch(() => undefined);
    if (!cached) throw err;
    return { animals: cached.animals, offlineSince: cached.fetchedAt };
  }
}

export const animalListQueryOptions = (collectionId: string) =>
  queryOptions({
    queryKey: queryKeys.animals.list(collectionId),
    queryFn: () => loadAnimals(collectionId),
    networkMode: 'always',
  });

export const useAnimalList = (collectionId: string, enabled = true) =>
  useQuery({ ...animalListQueryOptions(collectionId), enabled });
