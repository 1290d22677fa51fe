import type { FieldValues, Path, UseFormSetError } from 'react-hook-form';
import { ApiRequestError } from './api-client';

/**
 * Which form field shows a server field path: a list of the form's fields (a
 * server path shows under the first listed field it equals or lies inside, e.g.
 * `priorityZones.0.ring.3` under `priorityZones.0.ring`), or a function.
 */
export type ServerFieldMap<T extends FieldValues> = readonly Path<T>[] | ((serverPath: string) => Path<T> | undefined);

function placeOf<T extends FieldValues>(map: ServerFieldMap<T>, path: string): Path<T> | undefined {
  if (typeof map === 'function') return map(path);
  let best: Path<T> | undefined;
  for (const field of map) {
    if (path === field || path.startsWith(`${field}.`)) {
      if (!best || field.length > best.length) best = field;
    }
  }
  return best;
}

/**
 * The one way forms show a failed save: copies the API's field errors under
 * their fields (react-hook-form `setError`, which screen readers hear through
 * each field's alert) and returns the message to show above the form — the
 * server's message when some reason has no field here or there are no field
 * reasons, else ''. The form's values are left as typed.
 *
 * @example
 * onError: (e) => setFormError(applyServerErrors(e, setError, ['name', 'email']))
 */
export function applyServerErrors<T extends FieldValues>(
  error: unknown,
  setError: UseFormSetError<T>,
  fields: ServerFieldMap<T>,
): string {
  if (error instanceof ApiRequestError) {
    let unplaced = false;
    for (const [path, message] of Object.entries(error.fields)) {
      const field = placeOf(fields, path);
      if (field) setError(field, { type: 'server', message }, { shouldFocus: !unplaced });
      else unplaced = true;
    }
    return Object.keys(error.fields).length === 0 || unplaced ? error.message : '';
  }
  return error instanceof Error ? error.message : 'Something went wrong.';
}

/**
 * The one way a form with a versioned record handles a failed save: a stale
 * version (someone else saved first) calls `onStale`, so the form can offer to
 * reload; anything else goes through `applyServerErrors` and its message to
 * `onMessage`.
 *
 * @example
 * onError: (e) => handleSaveError(e, setError, FIELDS, { onStale: () => setStale(true), onMessage: setFormError })
 */
export function handleSaveError<T extends FieldValues>(
  error: unknown,
  setError: UseFormSetError<T>,
  fields: ServerFieldMap<T>,
  { onStale, onMessage }: { onStale: () => void; onMessage: (message: string) => void },
): void {
  if (error instanceof ApiRequestError && error.code === 'stale_version') onStale();
  else onMessage(applyServerErrors(error, setError, fields));
}
