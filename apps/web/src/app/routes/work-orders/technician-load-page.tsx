import { useQuery, type QueryClient } from '@tanstack/react-query';
import { workloadQuery } from '@varden/schemas';
import { useId } from 'react';
import { Link, useSearchParams, type LoaderFunctionArgs } from 'react-router-dom';
import { buttonClassName } from '../../../components/button';
import { controlClass } from '../../../components/form/field-parts';
import { PageHeader } from '../../../components/page-header';
import { requirePermission } from '../../../features/auth/lib/route-guards';
import { workOrders } from '../../../features/work-orders/api/work-order-queries';
import { TechnicianLoad } from '../../../features/work-orders/components/technician-load';
import { formatCalendarDate } from '../../../features/work-orders/lib/calendar-date';
import { monthOf, monthRange } from '../../../features/work-orders/lib/month-grid';
import { paths } from '../../../config/paths';
import { classNames } from '../../../lib/class-names';

/** The range from the URL, this month when it is missing or refused. */
function rangeFrom(params: URLSearchParams): { from: string; to: string } {
  const parsed = workloadQuery.safeParse({ from: params.get('from'), to: params.get('to') });
  return parsed.success ? parsed.data : monthRange(monthOf(new Date()));
}

export const clientLoader =
  (queryClient: QueryClient) =>
  async ({ request }: LoaderFunctionArgs) => {
    await requirePermission(queryClient, request, 'work-orders:schedule');
    await queryClient.ensureQueryData(workOrders.workload(rangeFrom(new URL(request.url).searchParams)));
    return null;
  };

/** Technician load: who carries how many open orders, and how many fall due in the range. */
export default function TechnicianLoadPage() {
  const [params, setParams] = useSearchParams();
  const range = rangeFrom(params);
  const load = useQuery(workOrders.workload(range));
  const fromId = useId();
  const toId = useId();
  const rangeLabel = `${formatCalendarDate(range.from)} – ${formatCalendarDate(range.to)}`;
  const setRange = (next: { from: string; to: string }) => {
    if (next.from && next.to && next.from <= next.to) setParams(new URLSearchParams(next), { preventScrollReset: true });
  };

  return (
    <>
      <PageHeader
        eyebrow="Work orders"
        title="Technician load"
        lead="Open orders per technician, by state, with those due in the chosen range and those past due. A name opens that technician’s open orders."
        actions={
          <Link to={paths.workOrders.list.getHref()} className={buttonClassName('secondary')}>
            Work order table
          </Link>
        }
      />
      <div className="mb-4 flex flex-wrap items-end gap-3">
        <div className="grid gap-1">
          <label htmlFor={fromId} className="font-medium">
            Due from
          </label>
          <input id={fromId} type="date" value={range.from} onChange={(e) => setRange({ ...range, from: e.target.value })} className={classNames(controlClass, 'border-line-strong desk:w-auto')} />
        </div>
        <div className="grid gap-1">
          <label htmlFor={toId} className="font-medium">
            Due to
          </label>
          <input id={toId} type="date" value={range.to} onChange={(e) => setRange({ ...range, to: e.target.value })} className={classNames(controlClass, 'border-line-strong desk:w-auto')} />
        </div>
      </div>
      {load.isError && !load.data ? (
        <p role="alert">Could not load the technician load: {load.error.message}</p>
      ) : load.data ? (
        <div aria-busy={load.isFetching}>
          <TechnicianLoad load={load.data} rangeLabel={rangeLabel} />
          {load.data.technicians.length === 0 && <p className="mt-3 text-ink-muted">No active technicians yet. An administrator invites them under People.</p>}
        </div>
      ) : (
        <p className="text-ink-muted">Loading…</p>
      )}
    </>
  );
}
