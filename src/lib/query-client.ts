import { notifyManager, QueryClient } from '@tanstack/react-query';
import { ApiError } from './api-client';

/**
 * Query results reach React in a microtask rather than TanStack's default `setTimeout(0)`: a tap
 * writes the round's query data, and its card can then change in the same render as the undo bar
 * instead of a task later (P1).
 */
notifyManager.setScheduler(queueMicrotask);

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
