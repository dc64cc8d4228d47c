import type { FieldValues, Path, UseFormSetError } from 'react-hook-form';
import { isApiError } from './api-client';

export type SplitErrors<Name extends string> = {
  /** Messages that belong to a field of the form. */
  fields: Array<[Name, string]>;
  /** What to show above the form: everything no field shows. Undefined when the fields say it all. */
  formMessage: string | undefined;
};

/**
 * Sorts a failed request's messages between the form's fields and the form as a whole. A field
 * path the form does not have by its full name goes to its first segment ("roles.0" → "roles").
 * A 400 whose fields all found a place needs no message of its own; anything else (a 409 that
 * also names a field, a 429, no answer) keeps the server's message above the form.
 */
export function splitFieldErrors<Name extends string>(error: unknown, fieldNames: readonly Name[]): SplitErrors<Name> {
  if (!isApiError(error)) {
    return { fields: [], formMessage: error instanceof Error ? error.message : 'Something went wrong.' };
  }
  const known = new Set<string>(fieldNames);
  const fields: Array<[Name, string]> = [];
  let unplaced = false;
  for (const [path, message] of Object.entries(error.fields)) {
    const name = known.has(path) ? path : path.split('.')[0];
    if (name === undefined || !known.has(name)) {
      unplaced = true;
      continue;
    }
    if (!fields.some(([placed]) => placed === name)) fields.push([name as Name, message]);
  }
  const fieldsSayItAll = error.status === 400 && fields.length > 0 && !unplaced;
  return { fields, formMessage: fieldsSayItAll ? undefined : error.message };
}

/** Puts a refused request's field messages onto the form with setError; returns the message for above the form. */
export function applyFieldErrors<T extends FieldValues>(
  error: unknown,
  setError: UseFormSetError<T>,
  fieldNames: ReadonlyArray<Path<T>>,
): string | undefined {
  const { fields, formMessage } = splitFieldErrors(error, fieldNames);
  fields.forEach(([name, message], index) => setError(name, { type: 'server', message }, { shouldFocus: index === 0 }));
  return formMessage;
}
