export const memberKeys = {
  list: (collectionId: string) => ['members', collectionId] as const,
};
