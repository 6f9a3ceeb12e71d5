import { useCallback, useState } from 'react';
import type { FieldValues, Path, UseFormSetError } from 'react-hook-form';
import { ApiError } from '@/lib/api-client';

/** Puts the server's field messages ("body.email") on the matching form fields; returns the rest. */
export function applyServerErrors<T extends FieldValues>(
  error: unknown,
  setError: UseFormSetError<T>,
): string | null {
  if (!(error instanceof ApiError)) return 'Something went wrong. Try again.';
  let placed = false;
  for (const issue of error.issues ?? []) {
    const field = issue.path.replace(/^body\./, '');
    if (field) {
      setError(field as Path<T>, { message: issue.message });
      placed = true;
    }
  }
  return placed ? null : error.message;
}

/**
 * Runs a form's server call: field messages go onto the fields, anything else becomes the
 * form's `problem` to show above it.
 */
export function useServerProblem<T extends FieldValues>(setError: UseFormSetError<T>) {
  const [problem, setProblem] = useState<string | null>(null);
  const attempt = useCallback(
    async (work: () => Promise<unknown>) => {
      setProblem(null);
      try {
        await work();
      } catch (err) {
        setProblem(applyServerErrors(err, setError));
      }
    },
    [setError],
  );
  return { problem, attempt };
}
