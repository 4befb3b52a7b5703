import type { FieldValues, Path, UseFormSetError } from 'react-hook-form';
import { ApiError } from './api-client';

/**
 * Puts the server's per-field messages (400 `fields`) on the form's own fields and focuses the
 * first. Returns false when none of them belongs to this form, so the caller shows an alert.
 */
export function applyFieldErrors<T extends FieldValues>(
  error: unknown,
  setError: UseFormSetError<T>,
  names: readonly Path<T>[],
): boolean {
  if (!(error instanceof ApiError) || !error.fields) return false;
  let applied = false;
  for (const name of names) {
    const message = error.fields[name];
    if (!message) continue;
    setError(name, { type: 'server', message }, { shouldFocus: !applied });
    applied = true;
  }
  return applied;
}
