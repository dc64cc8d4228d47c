import { useQuery, type QueryClient } from '@tanstack/react-query';
import { Link, useSearchParams, type LoaderFunctionArgs } from 'react-router-dom';
import { buttonClassName } from '../../../components/button';
import { PageHeader } from '../../../components/page-header';
import { hasPermission, session } from '../../../features/auth/api/session-queries';
import { requirePermission } from '../../../features/auth/lib/route-guards';
import { exportHref, workOrders } from '../../../features/work-orders/api/work-order-queries';
import { WorkOrderTable } from '../../../features/work-orders/components/work-order-table';
import { exportSearch, readWorkOrderSearch, writeWorkOrderSearch, type WorkOrderSearch } from '../../../features/work-orders/lib/work-order-search';
import { paths } from '../../../config/paths';

export const clientLoader =
  (queryClient: QueryClient) =>
  async ({ request }: LoaderFunctionArgs) => {
    await requirePermission(queryClient, request, 'work-orders:read');
    await queryClient.ensureQueryData(workOrders.list(readWorkOrderSearch(new URL(request.url).searchParams)));
    return null;
  };

/** Every work order the person may see, filtered, sorted and paged on the server. */
export default function WorkOrdersPage() {
  const [params, setParams] = useSearchParams();
  const search = readWorkOrderSearch(params);
  const list = useQuery(workOrders.list(search));
  const { data: me } = useQuery(session);
  const planner = hasPermission(me, 'work-orders:schedule');
  const onSearchChange = (next: WorkOrderSearch, options?: { replace?: boolean }) =>
    setParams(writeWorkOrderSearch(next), { replace: options?.replace ?? false, preventScrollReset: true });

  return (
    <>
      <PageHeader
        title="Work orders"
        lead="Inspections, corrective and baseline orders: filter by state, site, technician and due date. Every filter is part of the address, so a link shows the same list."
        actions={
          <>
            {planner && (
              <Link to={paths.workOrders.create.getHref()} className={buttonClassName('primary')}>
                New work order
              </Link>
            )}
            <Link to={paths.workOrders.calendar.getHref()} className={buttonClassName('secondary')}>
              Due calendar
            </Link>
            {planner && (
              <Link to={paths.workOrders.workload.getHref()} className={buttonClassName('secondary')}>
                Technician load
              </Link>
            )}
            {/* A download from the API, not a page of the app. */}
            <a href={exportHref(exportSearch(search))} download className={buttonClassName('secondary')}>
              Export CSV
            </a>
          </>
        }
      />
      {list.isError && !list.data ? (
        <p role="alert">Could not load the work orders: {list.error.message}</p>
      ) : (
        <WorkOrderTable
          search={search}
          onSearchChange={onSearchChange}
          list={list.data}
          isFetching={list.isFetching}
          canPickTechnician={planner}
          canFilterMine={hasPermission(me, 'work-orders:perform')}
        />
      )}
    </>
  );
}
