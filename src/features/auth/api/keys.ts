export const authKeys = {
  me: () => ['auth', 'me'] as const,
  demo: () => ['auth', 'demo'] as const,
};
