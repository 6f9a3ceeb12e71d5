import type { AnimalSummary } from '#shared/schemas/animals';
import type { RacksideDb, StoredDirectory } from './db';

/** Keeps the server's animal list on the phone (one record per collection). */
export async function storeDirectory(
  db: RacksideDb,
  collectionId: string,
  animals: AnimalSummary[],
  now: Date,
): Promise<StoredDirectory> {
  const stored = { collectionId, animals, fetchedAt: now.toISOString() };
  await db.put('directory', stored);
  return stored;
}

export const cachedDirectory = (db: RacksideDb, collectionId: string) =>
  db.get('directory', collectionId);
