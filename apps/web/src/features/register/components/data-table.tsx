import type { ColumnDef } from '@tanstack/react-table';
import type { ReactNode } from 'react';
import { DataTable as TableView } from '../../../components/data-table';
import { Pager } from '../../../components/pager';
import { useServerTable } from '../../../lib/use-server-table';
import type { ListParams } from '../api/list-params';
import { pageSizes } from './list-search';

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

const columnId = <T,>(column: ColumnDef<T, unknown>) => column.id ?? ('accessorKey' in column ? String(column.accessorKey) : undefined);

/**
 * A register list the server pages and sorts, its page, page size and sort in the URL: the
 * shared table and pager, with sorting offered only on the columns the API sorts by.
 */
export function DataTable<T, S extends string>({ caption, columns, data, total, params, sorts, onParamsChange, getRowId, noun, isFetching = false, empty }: DataTableProps<T, S>) {
  const sortable = (id: string | undefined) => id !== undefined && (sorts as readonly string[]).includes(id);
  const table = useServerTable({
    data,
    total,
    columns: columns.map((column) => ({ ...column, enableSorting: sortable(columnId(column)) })),
    getRowId,
    search: params,
    sorts,
    fallbackSort: params.sort,
    onSort: (sort) => onParamsChange({ sort }),
  });
  return (
    <div className="grid min-w-0 gap-3">
      <TableView table={table} caption={caption} busy={isFetching} empty={empty ?? `No ${noun} match.`} />
      <Pager
        page={params.page}
        pageSize={params.pageSize}
        total={total}
        noun={noun}
        pageSizes={pageSizes}
        onPage={(page) => onParamsChange({ page })}
        onPageSize={(pageSize) => onParamsChange({ pageSize })}
      />
    </div>
  );
}
