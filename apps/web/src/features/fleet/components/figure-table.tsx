import type { ReactNode } from 'react';
import { classNames } from '../../../lib/class-names';

export type FigureColumn<T> = {
  header: ReactNode;
  cell: (row: T) => ReactNode;
  /** Numbers and dates sit to the right. */
  align?: 'end';
  /** A row header (th scope="row"). */
  rowHeader?: boolean;
};

type FigureTableProps<T> = {
  caption: string;
  columns: readonly FigureColumn<T>[];
  rows: readonly T[];
  rowKey: (row: T, index: number) => string;
  empty?: ReactNode;
};

/** A small static table of a chart's figures, scrolling sideways in its own region on a phone. */
export function FigureTable<T>({ caption, columns, rows, rowKey, empty = 'Nothing to show.' }: FigureTableProps<T>) {
  return (
    <div role="region" aria-label={caption} tabIndex={0} className="overflow-x-auto rounded-md border border-line bg-surface">
      <table className="w-full border-collapse text-left text-base desk:text-sm">
        <caption className="sr-only">{caption}</caption>
        <thead className="bg-sunken">
          <tr>
            {columns.map((column, i) => (
              <th
                key={i}
                scope="col"
                className={classNames('border-b border-line-strong px-3 py-2 font-medium whitespace-nowrap text-ink-muted', column.align === 'end' && 'text-right')}
              >
                {column.header}
              </th>
            ))}
          </tr>
        </thead>
        <tbody>
          {rows.length === 0 ? (
            <tr>
              <td colSpan={columns.length} className="px-3 py-4 text-ink-muted">
                {empty}
              </td>
            </tr>
          ) : (
            rows.map((row, index) => (
              <tr key={rowKey(row, index)} className="border-b border-line last:border-b-0">
                {columns.map((column, i) => {
                  const className = classNames('px-3 py-2 align-top', column.align === 'end' && 'numeric text-right whitespace-nowrap');
                  return column.rowHeader ? (
                    <th key={i} scope="row" className={classNames(className, 'font-medium')}>
                      {column.cell(row)}
                    </th>
                  ) : (
                    <td key={i} className={className}>
                      {column.cell(row)}
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
