import { useQuery } from '@tanstack/react-query';
import { Link } from 'react-router-dom';
import { buttonClassName } from '../../../components/button';
import { formatDateTime } from '../../../lib/date-format';
import { flags, readFlagSearch } from '../api/flag-queries';
import { workOrders } from '../api/work-order-queries';
import { addDays, localToday, monthOf, monthRange, monthTitle } from '../lib/month-grid';
import { openStatesFilter } from '../lib/work-order-search';
import { paths } from '../../../config/paths';
import { FlagKind, Severity } from './flag-mark';
import { Panel } from './form-controls';
import { OrderDigest } from './order-digest';
import { TechnicianLoad } from './technician-load';

function OpenFlags() {
  const list = useQuery(flags.list({ ...readFlagSearch(new URLSearchParams()), pageSize: 5 }));
  return (
    <Panel
      title="Open flags"
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
        <p role="alert">Could not load the flags: {list.error.message}</p>
      ) : list.data.items.length === 0 ? (
        <p className="text-ink-muted">No open flags: nothing waits for a corrective order.</p>
      ) : (
        <>
          <ul className="grid">
            {list.data.items.map((flag) => (
              <li key={flag.id} className="grid gap-1 border-b border-line py-2 last:border-b-0">
                <span className="flex flex-wrap gap-x-3">
                  <FlagKind kind={flag.kind} />
                  <Severity severity={flag.severity} />
                </span>
                <span className="[overflow-wrap:anywhere]">{flag.message}</span>
                <span className="text-base text-ink-muted desk:text-sm">
                  {flag.siteName} · {flag.bankName} · raised {formatDateTime(flag.raisedAt)}
                </span>
              </li>
            ))}
          </ul>
          <p className="mt-3">
            <Link to={paths.flagQueue.getHref()} className="inline-flex min-h-touch items-center font-medium desk:min-h-control">
              Open the flag queue
            </Link>
          </p>
        </>
      )}
    </Panel>
  );
}

function LoadPanel({ range, label }: { range: { from: string; to: string }; label: string }) {
  const load = useQuery(workOrders.workload(range));
  return (
    <Panel
      title="Technician load"
      actions={
        <Link to={paths.workOrders.workload.getHref()} className="inline-flex min-h-touch items-center font-medium desk:min-h-control">
          By state
        </Link>
      }
    >
      {load.isPending ? (
        <p className="text-ink-muted">Loading…</p>
      ) : load.isError ? (
        <p role="alert">Could not load the technician load: {load.error.message}</p>
      ) : (
        <TechnicianLoad load={load.data} compact rangeLabel={label} />
      )}
    </Panel>
  );
}

/**
 * The planning board: what falls due this month, what is past due, what nobody is assigned
 * to, the open flags, and who carries how much.
 */
export function PlanningBoard() {
  const today = localToday();
  const month = monthOf(new Date());
  const range = monthRange(month);
  const title = monthTitle(month);
  return (
    <div className="grid gap-6">
      <div className="flex flex-wrap gap-2">
        <Link to={paths.workOrders.create.getHref()} className={buttonClassName('primary')}>
          New work order
        </Link>
        <Link to={paths.workOrders.calendar.getHref()} className={buttonClassName('secondary')}>
          Due calendar
        </Link>
        <Link to={paths.plans.list.getHref()} className={buttonClassName('secondary')}>
          Inspection plans
        </Link>
      </div>
      <div className="grid gap-6 desk:grid-cols-2 desk:items-start">
        <OrderDigest title={`Due in ${title}`} filters={{ state: openStatesFilter, dueFrom: range.from, dueTo: range.to }} empty={`Nothing open falls due in ${title}.`} />
        <OrderDigest title="Past due" filters={{ state: openStatesFilter, dueTo: addDays(today, -1) }} empty="Nothing open is past its due date." />
        <OrderDigest title="Not yet assigned" filters={{ state: openStatesFilter, assigneeId: 'none' }} empty="Every open order has a technician." />
        <OpenFlags />
      </div>
      <LoadPanel range={range} label={`in ${title}`} />
    </div>
  );
}
