import type { RoundDay } from '@/lib/db';

export const roundKeys = {
  all: (collectionId: string) => ['rounds', collectionId] as const,
  /** The phone's copy (IndexedDB), what the screen shows. */
  local: (collectionId: string, day: RoundDay, userId: string) => [...roundKeys.all(collectionId), 'local', day, userId] as const,
  /** Fetching the server's copy into IndexedDB. */
  server: (collectionId: string, day: RoundDay) => [...roundKeys.all(collectionId), 'server', day] as const,
  rules: (collectionId: string) => [...roundKeys.all(collectionId), 'rules'] as const,
  history: (collectionId: string, animalId: string) => [...roundKeys.all(collectionId), 'history', animalId] as const,
  schedule: (collectionId: string, animalId: string) => [...roundKeys.all(collectionId), 'schedule', animalId] as const,
};
