import type { FieldValues, Path, UseFormSetError } from 'react-hook-form';
import { ApiRequestError } from '@/components/data/api-client';

/**
 * Copies the server's field errors onto the form; returns the message to show
 * above the form for anything not tied to a field.
 */
export function applyServerErrors<T extends FieldValues>(
  error: unknown,
  setError: UseFormSetError<T>,
  fields: readonly Path<T>[],
): string {
  if (error instanceof ApiRequestError) {
    let unplaced = false;
    for (const [key, message] of Object.entries(error.fields)) {
      if ((fields as readonly string[]).includes(key)) setError(key as Path<T>, { type: 'server', message });
      else unplaced = true;
    }
    return Object.keys(error.fields).length === 0 || unplaced ? error.message : '';
  }
  return error instanceof Error ? error.message : 'Something went wrong.';
}
