import type { FieldValues, Path, UseFormSetError } from 'react-hook-form';
import { isApiError } from '../../../lib/api-client';

/** What a refused save means for its form: messages under fields, and one for the whole form. */
export type FormFailure = {
  /** For the alert above the buttons; null when every message found its field. */
  message: string | null;
  /** True for 409: someone changed the record first, or it clashes with another one. */
  conflict: boolean;
};

/**
 * Puts a 400's (or 409's) field messages back under their fields with setError, focusing the
 * first, and words the rest for the form's alert. Field paths are the API's ("replacement.serial"),
 * which are the form's own when the form holds the request body.
 */
export function applyServerErrors<T extends FieldValues>(
  error: unknown,
  setError: UseFormSetError<T>,
  fieldNames: readonly string[],
): FormFailure {
  if (!isApiError(error)) return { message: 'The save failed because of a fault in Varden. Try again.', conflict: false };
  const unplaced: string[] = [];
  let first = true;
  for (const [path, message] of Object.entries(error.fields)) {
    if (fieldNames.includes(path)) {
      setError(path as Path<T>, { type: 'server', message }, { shouldFocus: first });
      first = false;
    } else unplaced.push(message);
  }
  const conflict = error.status === 409;
  if (error.status === 400 && unplaced.length === 0 && !first) return { message: null, conflict };
  // A 409 without fields is a stale version: say how to get the current one.
  const staleHint = conflict && first && !/reload/i.test(error.message) ? ' Reload the page to see the current record.' : '';
  const message = [error.message + staleHint, ...unplaced].join(' ');
  return { message, conflict };
}
