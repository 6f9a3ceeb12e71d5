export const authKeys = {
  me: () => ['auth', 'me'] as const,
  demo: () => ['auth', 'demo'] as const,
  signUpLink: (token: string) => ['auth', 'sign-up-link', token] as const,
};
