import { QueryClient } from '@tanstack/react-query';
import { ApiError } from './api-client';

export function createQueryClient() {
  return new QueryClient({
    defaultOptions: {
      queries: {
        staleTime: 30_000,
        // Retrying a refusal (signed out, not allowed, not found) or an answer this app cannot
        // read cannot help.
        retry: (count, error) =>
          !(
            error instanceof ApiError &&
            ((error.status >= 400 && error.status < 500) || error.code === 'bad_response')
          ) && count < 2,
      },
    },
  });
}
