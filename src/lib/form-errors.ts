import type { FieldValues, Path, UseFormSetError } from 'react-hook-form';
import { ApiError } from './api-client';

/**
 * Sorts a failed submission's messages: each 400 detail that names one of `fields` ("body.email"
 * → email) goes beside that field; anything else is one sentence for the whole form.
 */
export function serverFieldErrors<F extends string>(
  error: unknown,
  fields: readonly F[],
): { fields: Partial<Record<F, string>>; form: string | null } {
  const found: Partial<Record<F, string>> = {};
  let placed = false;
  if (error instanceof ApiError) {
    for (const issue of error.details) {
      const field = issue.path.replace(/^body\./, '') as F;
      if (fields.includes(field)) {
        found[field] = issue.message;
        placed = true;
      }
    }
  }
  return { fields: found, form: placed ? null : describeError(error) };
}

/**
 * Puts a failed submission's messages where the person looks: each 400 detail beside its field
 * ("body.email" → the email field), anything else in the form's root error.
 */
export function showServerErrors<T extends FieldValues>(
  error: unknown,
  setError: UseFormSetError<T>,
  fields: readonly Path<T>[],
): void {
  const sorted = serverFieldErrors(error, fields);
  for (const [field, message] of Object.entries(sorted.fields) as Array<[Path<T>, string]>) {
    setError(field, { type: 'server', message });
  }
  if (sorted.form) setError('root.server', { type: 'server', message: sorted.form });
}

/** A person-readable sentence for any failure. */
export function describeError(error: unknown): string {
  if (error instanceof ApiError || error instanceof Error) return error.message;
  return 'An unexpected problem occurred.';
}
