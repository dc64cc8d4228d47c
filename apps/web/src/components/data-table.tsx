import { flexRender, type RowData, type Table } from '@tanstack/react-table';
import type { ReactNode } from 'react';
import { classNames } from '../lib/class-names';

declare module '@tanstack/react-table' {
  interface ColumnMeta<TData extends RowData, TValue> {
    /** 'desk': the column is left out on a phone, where its content shows elsewhere in the row. */
    show?: 'desk';
    /** Right-aligned, for numbers and dates. */
    align?: 'end';
    /** For the phantom type parameters TanStack requires on the interface. */
    _types?: [TData, TValue];
  }
}

type DataTableProps<T> = {
  table: Table<T>;
  /** Read by screen readers before the table; also names the scrollable region. */
  caption: string;
  /** Shown in place of the rows when there are none. */
  empty: ReactNode;
  /** True while newer rows are loading; the older ones stay on screen. */
  busy?: boolean;
};

function SortGlyph({ direction }: { direction: false | 'asc' | 'desc' }) {
  return (
    <svg aria-hidden="true" focusable="false" viewBox="0 0 12 16" className="size-4 shrink-0 fill-current">
      <path d="M6 2 10 7H2Z" className={direction === 'asc' ? 'opacity-100' : 'opacity-30'} />
      <path d="M6 14 2 9h8Z" className={direction === 'desc' ? 'opacity-100' : 'opacity-30'} />
    </svg>
  );
}

/**
 * A TanStack table drawn Varden's way: sortable headers are buttons with aria-sort on their
 * column, and the table scrolls sideways inside its own region rather than widening the page.
 * Sorting and paging themselves happen on the server (manualSorting, manualPagination).
 */
export function DataTable<T>({ table, caption, empty, busy = false }: DataTableProps<T>) {
  const rows = table.getRowModel().rows;
  const columnCount = table.getVisibleLeafColumns().length;
  return (
    <div role="region" aria-label={caption} tabIndex={0} className="overflow-x-auto rounded-md border border-line bg-surface">
      <table aria-busy={busy} className={classNames('w-full border-collapse text-left', busy && 'opacity-70')}>
        <caption className="sr-only">{caption}</caption>
        <thead className="bg-sunken">
          {table.getHeaderGroups().map((group) => (
            <tr key={group.id}>
              {group.headers.map((header) => {
                const { meta } = header.column.columnDef;
                const sorted = header.column.getIsSorted();
                const label = header.isPlaceholder ? null : flexRender(header.column.columnDef.header, header.getContext());
                return (
                  <th
                    key={header.id}
                    scope="col"
                    aria-sort={sorted === 'asc' ? 'ascending' : sorted === 'desc' ? 'descending' : undefined}
                    className={classNames(
                      'border-b border-line-strong px-3 py-2 align-middle text-base font-medium whitespace-nowrap text-ink-muted desk:text-sm',
                      meta?.show === 'desk' && 'hidden desk:table-cell',
                      meta?.align === 'end' && 'text-right',
                    )}
                  >
                    {header.column.getCanSort() ? (
                      <button
                        type="button"
                        onClick={header.column.getToggleSortingHandler()}
                        className={classNames(
                          '-mx-2 inline-flex min-h-touch items-center gap-1 rounded px-2 font-medium text-ink hover:bg-surface desk:min-h-control',
                          meta?.align === 'end' && 'flex-row-reverse',
                        )}
                      >
                        {label}
                        <SortGlyph direction={sorted} />
                      </button>
                    ) : (
                      label
                    )}
                  </th>
                );
              })}
            </tr>
          ))}
        </thead>
        <tbody>
          {rows.length === 0 ? (
            <tr>
              <td colSpan={columnCount} className="px-3 py-6 text-ink-muted">
                {empty}
              </td>
            </tr>
          ) : (
            rows.map((row) => (
              <tr key={row.id} className="border-b border-line last:border-b-0">
                {row.getVisibleCells().map((cell) => {
                  const { meta } = cell.column.columnDef;
                  return (
                    <td
                      key={cell.id}
                      className={classNames(
                        'px-3 py-3 align-top',
                        meta?.show === 'desk' && 'hidden desk:table-cell',
                        meta?.align === 'end' && 'text-right',
                      )}
                    >
                      {flexRender(cell.column.columnDef.cell, cell.getContext())}
                    </td>
                  );
                })}
              </tr>
            ))
          )}
        </tbody>
      </table>
    </div>
  );
}
