import { getCoreRowModel, useReactTable, type SortingState, type Table, type TableOptions, type Updater } from '@tanstack/react-table';
import { sortingToSort, sortToSorting } from './server-table';

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
