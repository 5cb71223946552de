import type { FieldValues, Path, UseFormSetError } from 'react-hook-form';
import { ApiError } from './api-client';

/**
 * Puts a failed submission's messages where the person looks: each 400 detail beside its field
 * ("body.email" → the email field), anything else in the form's root error.
 */
export function showServerErrors<T extends FieldValues>(
  error: unknown,
  setError: UseFormSetError<T>,
  fields: readonly Path<T>[],
): void {
  let placed = false;
  if (error instanceof ApiError) {
    for (const issue of error.details) {
      const field = issue.path.replace(/^body\./, '') as Path<T>;
      if (fields.includes(field)) {
        setError(field, { type: 'server', message: issue.message });
        placed = true;
      }
    }
  }
  if (!placed) setError('root.server', { type: 'server', message: describeError(error) });
}

/** A person-readable sentence for any failure. */
export function describeError(error: unknown): string {
  if (error instanceof ApiError || error instanceof Error) return error.message;
  return 'An unexpected problem occurred.';
}
