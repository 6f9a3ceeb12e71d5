export const roundKeys = {
  all: (collectionId: string) => ['rounds', collectionId] as const,
  today: (collectionId: string) => [...roundKeys.all(collectionId), 'today'] as const,
  tomorrow: (collectionId: string) => [...roundKeys.all(collectionId), 'tomorrow'] as const,
  rules: (collectionId: string) => [...roundKeys.all(collectionId), 'rules'] as const,
  schedule: (collectionId: string, animalId: string) => [...roundKeys.all(collectionId), 'schedule', animalId] as const,
};
