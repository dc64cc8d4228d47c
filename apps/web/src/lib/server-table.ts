import type { SortingState } from '@tanstack/react-table';
import type * as z from 'zod/mini';

/**
 * Server-side tables keep their state (page, pageSize, sort, filters) in the URL. These read the
 * URL with the list endpoint's own query schema and write it back without the defaults, so a
 * shared link says only what differs from the first page.
 */

/**
 * Reads a list's state from URL search parameters with the endpoint's query schema. A value the
 * schema refuses (a typo, an old link) falls back to its default instead of failing the page.
 */
export function readListSearch<S extends z.ZodMiniType<object>>(schema: S, params: URLSearchParams, keys: readonly string[]): z.output<S> {
  const raw: Record<string, string> = {};
  for (const key of keys) {
    const value = params.get(key)?.trim();
    if (value) raw[key] = value;
  }
  const first = schema.safeParse(raw);
  if (first.success) return first.data;
  const refused = new Set(first.error.issues.map((issue) => String(issue.path[0])));
  for (const key of refused) delete raw[key];
  return schema.parse(raw);
}

/** Writes a list's state as URL search parameters, leaving out what equals the default. */
export function writeListSearch(state: Readonly<Record<string, string | number | undefined>>, defaults: Readonly<Record<string, string | number>>): URLSearchParams {
  const params = new URLSearchParams();
  for (const [key, value] of Object.entries(state)) {
    if (value === undefined || value === '' || defaults[key] === value) continue;
    params.set(key, String(value));
  }
  return params;
}

/** The API's sort ("name", "-createdAt") as TanStack Table's sorting state. */
export function sortToSorting(sort: string): SortingState {
  return sort.startsWith('-') ? [{ id: sort.slice(1), desc: true }] : [{ id: sort, desc: false }];
}

/** TanStack Table's sorting state as the API's sort; the fallback when nothing is sorted. */
export function sortingToSort(sorting: SortingState, fallback: string): string {
  const [first] = sorting;
  if (!first) return fallback;
  return first.desc ? `-${first.id}` : first.id;
}

/** How many pages `total` rows fill, at least one so "page 1 of 1" reads right for an empty list. */
export function pageCount(total: number, pageSize: number): number {
  return Math.max(1, Math.ceil(total / pageSize));
}
