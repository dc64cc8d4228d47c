import { useQuery } from '@tanstack/react-query';
import type { WorkOrder } from '@varden/schemas';
import { useId } from 'react';
import { Link } from 'react-router-dom';
import { Button } from '../../../components/button';
import { FormAlert } from '../../../components/form/form-alert';
import { paths } from '../../../config/paths';
import { formatDate } from '../../../lib/date-format';
import { classNames } from '../../../lib/class-names';
import { fieldQueries } from '../api/field-queries';
import { stateWords } from '../api/state-words';
import { countFor } from '../outbox/outbox';
import { useOutboxSnapshot } from '../outbox/use-field-outbox';
import { SyncState } from './sync-state';

const todayIso = () => {
  const now = new Date();
  return `${now.getFullYear()}-${String(now.getMonth() + 1).padStart(2, '0')}-${String(now.getDate()).padStart(2, '0')}`;
};

function dueWords(order: WorkOrder, today: string): { words: string; late: boolean } {
  if (order.dueOn === today) return { words: 'Due today', late: false };
  if (order.overdue || order.dueOn < today) return { words: `Overdue — due ${formatDate(order.dueOn)}`, late: true };
  return { words: `Due ${formatDate(order.dueOn)}`, late: false };
}

/** The state as a small outlined glyph and its word, never colour alone. */
function StateTag({ order }: { order: WorkOrder }) {
  const returned = order.state === 'sent-back';
  return (
    <span className={classNames('inline-flex items-center gap-1.5 rounded-full border px-2 text-base font-medium', returned ? 'border-watch text-watch' : 'border-line-strong text-ink')}>
      <svg aria-hidden="true" focusable="false" viewBox="0 0 16 16" className="size-4 shrink-0 fill-none stroke-current stroke-2">
        {order.state === 'dispatched' && <path d="M5 3l6 5-6 5" strokeLinecap="round" strokeLinejoin="round" />}
        {order.state === 'on-site' && <circle cx="8" cy="8" r="5" className="fill-current" />}
        {returned && <path d="M6 4 2 8l4 4M2.5 8H11a3 3 0 0 1 0 6" strokeLinecap="round" strokeLinejoin="round" />}
      </svg>
      {stateWords[order.state].short}
    </span>
  );
}

function OrderRow({ order, today }: { order: WorkOrder; today: string }) {
  const { items } = useOutboxSnapshot();
  const { waiting, refused } = countFor(items, order.id);
  const due = dueWords(order, today);
  return (
    <li>
      <Link
        to={paths.fieldOrder.getHref(order.id)}
        data-testid="field-order"
        className="grid min-h-touch gap-2 rounded-md border border-line-strong bg-surface p-4 text-ink no-underline hover:bg-sunken"
      >
        <span className="flex flex-wrap items-center justify-between gap-2">
          <span className="text-lg font-semibold text-copper underline underline-offset-4">{order.title}</span>
          <StateTag order={order} />
        </span>
        <span className="text-base">
          {order.siteName} · {order.bankName}
        </span>
        <span className={classNames('text-base', due.late ? 'font-semibold text-replace' : 'text-ink-muted')}>
          {due.words}
          {(order.priority === 'high' || order.priority === 'urgent') && <> · {order.priority === 'urgent' ? 'Urgent' : 'High priority'}</>}
        </span>
        {order.state === 'sent-back' && (
          <span className="rounded border-l-4 border-watch bg-sunken px-3 py-2 text-base" data-testid="sent-back-reason">
            <span className="font-semibold">Supervisor’s reason: </span>
            {order.returnReason || 'none given'}
          </span>
        )}
        {(waiting > 0 || refused > 0) && (
          <span className="text-base font-medium">
            {refused > 0 && `${refused} not accepted · `}
            {waiting > 0 && `${waiting} waiting to send`}
          </span>
        )}
      </Link>
    </li>
  );
}

/**
 * Today's orders: the technician's open orders (dispatched, on site, sent back), soonest due
 * first, each one large tap target with its site and bank, due date and state in words; a
 * returned one shows the supervisor's reason.
 */
export function TodaysOrdersList() {
  const headingId = useId();
  const list = useQuery(fieldQueries.myOrders());
  const orders = list.data?.items ?? [];
  const today = todayIso();

  return (
    <section aria-labelledby={headingId} className="grid gap-3">
      <div className="flex flex-wrap items-center justify-between gap-2">
        <h2 id={headingId} className="text-lg font-semibold">
          {list.isSuccess ? (orders.length === 0 ? 'No orders assigned to you for today' : `Your orders (${orders.length})`) : 'Your orders'}
        </h2>
        <SyncState />
      </div>
      {list.isPending && <p className="text-ink-muted">Loading your orders…</p>}
      {list.isError && (
        <FormAlert>
          <p>Could not load your orders: {list.error.message}</p>
          <Button className="mt-2" onClick={() => void list.refetch()}>
            Try again
          </Button>
        </FormAlert>
      )}
      {list.isSuccess && orders.length === 0 && <p className="text-ink-muted">When a planner dispatches an order to you, it is listed here.</p>}
      {orders.length > 0 && (
        <ul className="grid gap-3">
          {orders.map((order) => (
            <OrderRow key={order.id} order={order} today={today} />
          ))}
        </ul>
      )}
    </section>
  );
}
