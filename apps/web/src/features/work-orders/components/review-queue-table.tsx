import { createColumnHelper } from '@tanstack/react-table';
import { workOrderSorts, type WorkOrder } from '@varden/schemas';
import { Link } from 'react-router-dom';
import { buttonClassName } from '../../../components/button';
import { DataTable } from '../../../components/data-table';
import { Pager } from '../../../components/pager';
import { formatDateTime } from '../../../lib/date-format';
import { useServerTable } from '../../../lib/use-server-table';
import type { WorkOrderSearch } from '../lib/work-order-search';
import { kindLabels } from '../lib/work-order-words';
import { paths } from '../../../config/paths';
import { DueDate } from './work-order-table';

const column = createColumnHelper<WorkOrder>();
const sorts = workOrderSorts;

function Submitted({ at }: { at: string | null }) {
  return at ? (
    <time dateTime={at} className="numeric whitespace-nowrap">
      {formatDateTime(at)}
    </time>
  ) : (
    <span className="text-ink-muted">—</span>
  );
}

type ReviewQueueTableProps = {
  search: WorkOrderSearch;
  onSearchChange: (next: WorkOrderSearch) => void;
  list: { items: WorkOrder[]; total: number } | undefined;
  isFetching: boolean;
  /** The signed-in supervisor: an order they performed is reviewed by another. */
  userId: number | undefined;
};

/** Submitted orders waiting for a supervisor, soonest due first; each opens its review. */
export function ReviewQueueTable({ search, onSearchChange, list, isFetching, userId }: ReviewQueueTableProps) {
  const ownWork = (order: WorkOrder) => userId !== undefined && order.assigneeId === userId;
  const reviewAction = (order: WorkOrder) =>
    ownWork(order) ? (
      <span className="text-ink-muted">You performed it; another supervisor reviews it.</span>
    ) : (
      <Link to={paths.workOrders.review.getHref(order.id)} className={buttonClassName('primary')} aria-label={`Review #${order.id} ${order.title}`}>
        Review
      </Link>
    );
  const columns = [
    column.accessor('title', {
      header: 'Order',
      enableSorting: false,
      cell: ({ row }) => {
        const order = row.original;
        return (
          <>
            <Link to={paths.workOrders.review.getHref(order.id)} className="font-medium">
              <span className="numeric text-ink-muted">#{order.id}</span> {order.title}
            </Link>
            <span className="block text-base text-ink-muted desk:text-sm">{kindLabels[order.kind]}</span>
            <span className="mt-1 grid gap-1 text-base desk:hidden">
              <span>
                {order.siteName} · {order.bankName}
              </span>
              <span>
                {order.assigneeName ?? 'Nobody'} · submitted <Submitted at={order.submittedAt} />
              </span>
              <span>
                Due <DueDate order={order} />
              </span>
              <span className="mt-1">
                {reviewAction(order)}
              </span>
            </span>
          </>
        );
      },
    }),
    column.accessor('siteName', {
      header: 'Site and bank',
      enableSorting: false,
      meta: { show: 'desk' },
      cell: ({ row }) => (
        <span className="grid">
          <span>{row.original.siteName}</span>
          <span className="text-sm text-ink-muted">{row.original.bankName}</span>
        </span>
      ),
    }),
    column.accessor('assigneeName', { header: 'Technician', enableSorting: false, meta: { show: 'desk' }, cell: ({ getValue }) => getValue() ?? '—' }),
    column.accessor('submittedAt', { header: 'Submitted', enableSorting: false, meta: { show: 'desk' }, cell: ({ getValue }) => <Submitted at={getValue()} /> }),
    column.accessor('dueOn', { header: 'Due', meta: { show: 'desk' }, cell: ({ row }) => <DueDate order={row.original} /> }),
    column.display({ id: 'review', header: 'Decision', meta: { show: 'desk' }, cell: ({ row }) => reviewAction(row.original) }),
  ];
  const table = useServerTable({
    data: list?.items,
    total: list?.total,
    columns,
    getRowId: (order) => String(order.id),
    search,
    sorts: sorts,
    fallbackSort: 'dueOn',
    onSort: (sort) => onSearchChange({ ...search, sort, page: 1 }),
  });
  return (
    <div className="grid gap-3">
      <DataTable
        table={table}
        caption="Work orders submitted for review, with their site, bank, technician and when they were submitted"
        busy={isFetching}
        empty={list === undefined ? 'Loading…' : 'Nothing is waiting for a review.'}
      />
      <Pager
        page={search.page}
        pageSize={search.pageSize}
        total={list?.total ?? 0}
        noun="orders"
        onPage={(page) => onSearchChange({ ...search, page })}
        onPageSize={(pageSize) => onSearchChange({ ...search, pageSize, page: 1 })}
      />
    </div>
  );
}
