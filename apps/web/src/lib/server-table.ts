import { getCoreRowModel, useReactTable, type SortingState, type Table, type TableOptions, type Updater } from '@tanstack/react-table';
import type { z } from 'zod';

/**
 * Server-side tables keep their state (page, pageSize, sort, filters) in the URL. These read the
 * URL with the list endpoint's own query schema and write it back without the defaults, so a
 * shared link says only what differs from the first page.
 */

/**
 * Reads a list's state from URL search parameters with the endpoint's query schema. A value the
 * schema refuses (a typo, an old link) falls back to its default instead of failing the page.
 */
export function readListSearch<S extends z.ZodType<object>>(schema: S, params: URLSearchParams, keys: readonly string[]): z.output<S> {
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

type ServerTableOptions<T, S extends string> = {
  /** This page's rows (undefined while the first page loads). */
  data: readonly T[] | undefined;
  /** Every row the server has for the filters, across pages. */
  total: number | undefined;
  columns: TableOptions<T>['columns'];
  getRowId: (row: T) => string;
  /** The list's state as the URL holds it. */
  search: { sort?: S; page: number; pageSize: number };
  /** The sort keys the API accepts ('name', '-name' …); a sort outside them falls back. */
  sorts?: readonly S[];
  fallbackSort?: S;
  onSort?: (sort: S) => void;
};

/**
 * TanStack Table in manual mode for a list the API pages and sorts: the table only draws the
 * page it is given, and a click on a sortable header asks for a sort the API accepts.
 */
export function useServerTable<T, S extends string>({ data, total, columns, getRowId, search, sorts, fallbackSort, onSort }: ServerTableOptions<T, S>): Table<T> {
  const sorting = search.sort ? sortToSorting(search.sort) : [];
  const sortable = onSort !== undefined && sorts !== undefined && fallbackSort !== undefined;
  // TanStack Table's instance is not memoisable; the React Compiler leaves its caller as written.
  // eslint-disable-next-line react-hooks/incompatible-library
  return useReactTable<T>({
    data: (data ?? []) as T[],
    columns,
    getCoreRowModel: getCoreRowModel(),
    getRowId,
    manualPagination: true,
    manualSorting: true,
    enableSorting: sortable,
    enableMultiSort: false,
    enableSortingRemoval: false,
    rowCount: total ?? 0,
    state: { sorting, pagination: { pageIndex: search.page - 1, pageSize: search.pageSize } },
    onSortingChange: (updater: Updater<SortingState>) => {
      if (!sortable) return;
      const next = sortingToSort(typeof updater === 'function' ? updater(sorting) : updater, fallbackSort);
      onSort(sorts.find((s) => s === next) ?? fallbackSort);
    },
  });
}
