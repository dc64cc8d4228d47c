import { useQuery } from '@tanstack/react-query';
import type { WorkOrder } from '@varden/schemas';
import type { ReactNode } from 'react';
import { Link } from 'react-router-dom';
import { workOrders } from '../api/work-order-queries';
import { readWorkOrderSearch, writeWorkOrderSearch } from '../lib/work-order-search';
import { paths } from '../../../config/paths';
import { Panel } from './form-controls';
import { StateMark } from './state-mark';
import { DueDate } from './work-order-table';

/** One order as a short entry of a board panel: number and title, due, where, state. */
export function OrderDigestItem({ order, extra }: { order: WorkOrder; extra?: ReactNode }) {
  return (
    <li className="grid gap-1 border-b border-line py-2 last:border-b-0">
      <Link to={paths.workOrders.detail.getHref(order.id)} className="font-medium [overflow-wrap:anywhere]">
        <span className="numeric text-ink-muted">#{order.id}</span> {order.title}
      </Link>
      <span className="flex flex-wrap items-baseline gap-x-3 gap-y-1 text-base desk:text-sm">
        <span>
          Due <DueDate order={order} />
        </span>
        <StateMark state={order.state} />
      </span>
      <span className="text-base text-ink-muted desk:text-sm">
        {order.siteName} · {order.bankName}
        {order.assigneeName ? ` · ${order.assigneeName}` : ''}
      </span>
      {extra}
    </li>
  );
}

type OrderDigestProps = {
  title: string;
  /** The list endpoint's filters, as URL parameters (also the "see all" link's). */
  filters: Record<string, string>;
  /** Shown when the list is empty. */
  empty: string;
  shown?: number;
};

/** A board panel of orders: the first few matching a filter, their count, and the way to all of them. */
export function OrderDigest({ title, filters, empty, shown = 6 }: OrderDigestProps) {
  const search = readWorkOrderSearch(new URLSearchParams({ ...filters, pageSize: String(shown) }));
  const list = useQuery(workOrders.list(search));
  const allHref = paths.workOrders.list.getHref(writeWorkOrderSearch({ ...search, pageSize: 25 }));
  return (
    <Panel
      title={title}
      actions={
        list.data && list.data.total > 0 ? (
          <span className="numeric rounded-full border border-line-strong px-3 text-base font-semibold desk:text-sm" aria-label={`${list.data.total} in all`}>
            {list.data.total}
          </span>
        ) : undefined
      }
    >
      {list.isPending ? (
        <p className="text-ink-muted">Loading…</p>
      ) : list.isError ? (
        <p role="alert">Could not load these orders: {list.error.message}</p>
      ) : list.data.items.length === 0 ? (
        <p className="text-ink-muted">{empty}</p>
      ) : (
        <>
          <ul className="grid">
            {list.data.items.map((order) => (
              <OrderDigestItem key={order.id} order={order} />
            ))}
          </ul>
          <p className="mt-3">
            <Link to={allHref} className="inline-flex min-h-touch items-center font-medium desk:min-h-control">
              {list.data.total > list.data.items.length ? `All ${list.data.total} in the table` : 'Open in the table'}
            </Link>
          </p>
        </>
      )}
    </Panel>
  );
}
