import {
  flexRender,
  getCoreRowModel,
  useReactTable,
  type ColumnDef,
  type PaginationState,
  type SortingState,
  type Updater,
} from '@tanstack/react-table';
import { useId, type ReactNode } from 'react';
import { Button } from '../../../components/button';
import { classNames } from '../../../lib/class-names';
import type { ListParams } from '../api/list-params';
import { pageSizes } from './list-search';

declare module '@tanstack/react-table' {
  interface ColumnMeta<TData, TValue> {
    /** Right-aligned, tabular: for measured values. */
    numeric?: boolean;
    /** For the phantom type parameters TanStack requires on the interface. */
    _types?: [TData, TValue];
  }
}

/** A sort key such as '-name' as TanStack's sorting state, and back. */
export function sortingOf(sort: string): SortingState {
  return sort.startsWith('-') ? [{ id: sort.slice(1), desc: true }] : [{ id: sort, desc: false }];
}
export function sortOf(sorting: SortingState): string | undefined {
  const first = sorting[0];
  return first ? `${first.desc ? '-' : ''}${first.id}` : undefined;
}

const resolve = <T,>(updater: Updater<T>, current: T): T => (typeof updater === 'function' ? (updater as (old: T) => T)(current) : updater);

type DataTableProps<T, S extends string> = {
  caption: string;
  columns: ColumnDef<T, unknown>[];
  data: T[];
  /** Every row the server has for this filter, across pages. */
  total: number;
  params: ListParams<S>;
  /** Sort keys the API accepts ('name', '-name' …); only those columns sort. */
  sorts: readonly S[];
  onParamsChange: (changes: Partial<ListParams<S>>) => void;
  getRowId: (row: T) => string;
  /** What one row is called, plural: "sites". */
  noun: string;
  isFetching?: boolean;
  empty?: ReactNode;
};

/**
 * A server-paged, server-sorted table (TanStack Table in manual mode): the page, page size and
 * sort live in the URL and in the query key; the API does the work.
 */
export function DataTable<T, S extends string>({
  caption,
  columns,
  data,
  total,
  params,
  sorts,
  onParamsChange,
  getRowId,
  noun,
  isFetching = false,
  empty,
}: DataTableProps<T, S>) {
  const regionId = useId();
  const sorting = sortingOf(params.sort);
  const pagination: PaginationState = { pageIndex: params.page - 1, pageSize: params.pageSize };
  const pageCount = Math.max(1, Math.ceil(total / params.pageSize));

  // TanStack Table's instance is not memoisable; the compiler leaves this component as written.
  // eslint-disable-next-line react-hooks/incompatible-library
  const table = useReactTable({
    data,
    columns,
    getRowId,
    getCoreRowModel: getCoreRowModel(),
    manualPagination: true,
    manualSorting: true,
    enableSortingRemoval: false,
    enableMultiSort: false,
    pageCount,
    rowCount: total,
    state: { sorting, pagination },
    onSortingChange: (updater) => {
      const sort = sortOf(resolve(updater, sorting));
      if (sort && (sorts as readonly string[]).includes(sort)) onParamsChange({ sort: sort as S });
    },
    onPaginationChange: (updater) => {
      const next = resolve(updater, pagination);
      if (next.pageSize !== params.pageSize) onParamsChange({ pageSize: next.pageSize });
      else onParamsChange({ page: next.pageIndex + 1 });
    },
  });

  const canSortBy = (id: string) => (sorts as readonly string[]).includes(id);
  const first = total === 0 ? 0 : (params.page - 1) * params.pageSize + 1;
  const last = Math.min(total, params.page * params.pageSize);

  return (
    <div className="grid min-w-0 gap-3">
      <div
        role="region"
        aria-labelledby={`${regionId}-caption`}
        tabIndex={0}
        className="min-w-0 overflow-x-auto rounded-md border border-line bg-surface"
      >
        <table aria-busy={isFetching} className="w-full border-collapse text-left">
          <caption id={`${regionId}-caption`} className="sr-only">
            {caption}
          </caption>
          <thead className="bg-sunken">
            {table.getHeaderGroups().map((group) => (
              <tr key={group.id}>
                {group.headers.map((header) => {
                  const sortable = header.column.getCanSort() && canSortBy(header.column.id);
                  const direction = header.column.getIsSorted();
                  const numeric = header.column.columnDef.meta?.numeric;
                  return (
                    <th
                      key={header.id}
                      scope="col"
                      aria-sort={direction === 'asc' ? 'ascending' : direction === 'desc' ? 'descending' : undefined}
                      className={classNames(
                        'border-b border-line-strong px-3 py-2 align-bottom text-base font-medium whitespace-nowrap desk:text-sm',
                        numeric && 'text-right',
                      )}
                    >
                      {sortable ? (
                        <button
                          type="button"
                          onClick={header.column.getToggleSortingHandler()}
                          className={classNames(
                            'inline-flex min-h-touch items-center gap-1 rounded font-medium desk:min-h-control',
                            numeric && 'flex-row-reverse',
                          )}
                        >
                          {flexRender(header.column.columnDef.header, header.getContext())}
                          <SortArrow direction={direction} />
                        </button>
                      ) : (
                        flexRender(header.column.columnDef.header, header.getContext())
                      )}
                    </th>
                  );
                })}
              </tr>
            ))}
          </thead>
          <tbody>
            {table.getRowModel().rows.map((row) => (
              <tr key={row.id} className="border-b border-line last:border-b-0">
                {row.getVisibleCells().map((cell) => (
                  <td
                    key={cell.id}
                    className={classNames('px-3 py-3 align-top', cell.column.columnDef.meta?.numeric && 'text-right whitespace-nowrap')}
                  >
                    {flexRender(cell.column.columnDef.cell, cell.getContext())}
                  </td>
                ))}
              </tr>
            ))}
            {data.length === 0 && (
              <tr>
                <td colSpan={columns.length} className="px-3 py-6 text-center text-ink-muted">
                  {empty ?? `No ${noun} match.`}
                </td>
              </tr>
            )}
          </tbody>
        </table>
      </div>

      <div className="flex flex-wrap items-center justify-between gap-3">
        <p className="numeric text-base text-ink-muted desk:text-sm" aria-live="polite">
          {total === 0 ? `No ${noun}` : `${first}–${last} of ${total} ${noun}`}
        </p>
        <div className="flex flex-wrap items-center gap-2">
          <label className="flex items-center gap-2 text-base desk:text-sm">
            Rows per page
            <select
              value={params.pageSize}
              onChange={(event) => table.setPageSize(Number(event.target.value))}
              className="min-h-touch rounded border border-line-strong bg-surface px-2 desk:min-h-control"
            >
              {pageSizes.map((size) => (
                <option key={size} value={size}>
                  {size}
                </option>
              ))}
            </select>
          </label>
          <Button onClick={() => table.previousPage()} disabled={!table.getCanPreviousPage()}>
            Previous
          </Button>
          <span className="numeric px-1 text-base desk:text-sm">
            Page {params.page} of {pageCount}
          </span>
          <Button onClick={() => table.nextPage()} disabled={!table.getCanNextPage()}>
            Next
          </Button>
        </div>
      </div>
    </div>
  );
}

function SortArrow({ direction }: { direction: false | 'asc' | 'desc' }) {
  return (
    <svg aria-hidden="true" focusable="false" viewBox="0 0 12 12" className={classNames('size-3 fill-current', !direction && 'opacity-40')}>
      {direction === 'desc' ? <path d="M6 10 1.5 3h9Z" /> : direction === 'asc' ? <path d="M6 2 10.5 9h-9Z" /> : <path d="M6 1 9.5 5h-7ZM6 11 2.5 7h7Z" />}
    </svg>
  );
}
