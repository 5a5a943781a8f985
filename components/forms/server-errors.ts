import type { FieldValues, Path, UseFormSetError } from 'react-hook-form';
import { ApiError } from '@/lib/api/client';

/**
 * Puts the server's field issues on the form's fields and returns the message for the form's
 * banner. The typed values stay in the form, so nothing is lost when the server refuses.
 */
export function applyServerErrors<T extends FieldValues>(error: unknown, setError: UseFormSetError<T>, fields: readonly string[]): string {
  if (!(error instanceof ApiError)) return 'Something went wrong. Nothing was saved.';
  for (const issue of error.issues) {
    if (fields.includes(issue.path)) setError(issue.path as Path<T>, { type: 'server', message: issue.message });
  }
  return error.message;
}
