import { useQuery, type QueryClient } from '@tanstack/react-query';
import { Link, useSearchParams, type LoaderFunctionArgs } from 'react-router-dom';
import { buttonClassName } from '../../../components/button';
import { PageHeader } from '../../../components/page-header';
import { requirePermission } from '../../../features/auth/lib/route-guards';
import { calendarPageSize, workOrders } from '../../../features/work-orders/api/work-order-queries';
import { DueCalendar } from '../../../features/work-orders/components/due-calendar';
import { localToday, monthOf, monthRange, monthTitle, parseMonth, shiftMonth } from '../../../features/work-orders/lib/month-grid';
import { paths } from '../../../config/paths';

const monthFrom = (params: URLSearchParams) => parseMonth(params.get('month')) ?? monthOf(new Date());

export const clientLoader =
  (queryClient: QueryClient) =>
  async ({ request }: LoaderFunctionArgs) => {
    await requirePermission(queryClient, request, 'work-orders:read');
    await queryClient.ensureQueryData(workOrders.month(monthFrom(new URL(request.url).searchParams)));
    return null;
  };

/** The due calendar: a month of due dates, each order a link to its page. */
export default function DueCalendarPage() {
  const [params] = useSearchParams();
  const month = monthFrom(params);
  const list = useQuery(workOrders.month(month));
  const title = monthTitle(month);
  const thisMonth = monthOf(new Date());

  return (
    <>
      <PageHeader
        eyebrow="Work orders"
        title={`Due calendar: ${title}`}
        documentTitle={`Due calendar, ${title}`}
        lead="Every order due this month, open or closed, on the day it falls due."
        actions={
          <Link to={paths.workOrders.list.getHref()} className={buttonClassName('secondary')}>
            Work order table
          </Link>
        }
      />
      <nav aria-label="Months" className="mb-4 flex flex-wrap items-center gap-2">
        <Link to={paths.workOrders.calendar.getHref(shiftMonth(month, -1))} className={buttonClassName('secondary')}>
          <span aria-hidden="true">←</span> {monthTitle(shiftMonth(month, -1))}
        </Link>
        {month !== thisMonth && (
          <Link to={paths.workOrders.calendar.getHref(thisMonth)} className={buttonClassName('quiet')}>
            This month
          </Link>
        )}
        <Link to={paths.workOrders.calendar.getHref(shiftMonth(month, 1))} className={buttonClassName('secondary')}>
          {monthTitle(shiftMonth(month, 1))} <span aria-hidden="true">→</span>
        </Link>
      </nav>
      {list.isError && !list.data ? (
        <p role="alert">Could not load the orders of {title}: {list.error.message}</p>
      ) : (
        <div aria-busy={list.isFetching} className="grid gap-3">
          <p className="numeric text-ink-muted" aria-live="polite">
            {list.data ? `${list.data.total} ${list.data.total === 1 ? 'order' : 'orders'} due in ${title}` : 'Loading…'}
          </p>
          {list.data && list.data.total > calendarPageSize && (
            <p role="status" className="rounded border border-line-strong bg-sunken p-3">
              This month has more than {calendarPageSize} orders; the calendar shows the first {calendarPageSize}.{' '}
              <Link to={paths.workOrders.list.getHref(new URLSearchParams({ dueFrom: monthRange(month).from, dueTo: monthRange(month).to }))}>See them all in the table</Link>.
            </p>
          )}
          <DueCalendar month={month} orders={list.data?.items ?? []} today={localToday()} />
        </div>
      )}
    </>
  );
}
