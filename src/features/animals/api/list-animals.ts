import { queryOptions, useQuery } from '@tanstack/react-query';
import { animalListResponse } from '#shared/schemas/animals';
import { apiRequest } from '@/lib/api-client';

export const animalKeys = {
  all: (collectionId: string) => ['animals', collectionId] as const,
  list: (collectionId: string) => [...animalKeys.all(collectionId), 'list'] as const,
};

export const listAnimals = (collectionId: string) =>
  apiRequest(`/collections/${collectionId}/animals`, { schema: animalListResponse });

export const animalListQueryOptions = (collectionId: string) =>
  queryOptions({ queryKey: animalKeys.list(collectionId), queryFn: () => listAnimals(collectionId) });

export const useAnimalList = (collectionId: string) => useQuery(animalListQueryOptions(collectionId));
