import type { FieldValues, Path, UseFormSetError } from 'react-hook-form';
import { ApiError } from '@/lib/api-client';

/** Puts the server's field messages ("body.email") on the matching form fields; returns the rest. */
export function applyServerErrors<T extends FieldValues>(error: unknown, setError: UseFormSetError<T>): string | null {
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
