import { useQuery, useSuspenseQuery, type QueryClient } from '@tanstack/react-query';
import { Link, useParams, type LoaderFunctionArgs } from 'react-router-dom';
import { buttonClassName } from '../../../components/button';
import { PageHeader } from '../../../components/page-header';
import { session } from '../../../features/auth/api/session-queries';
import { requirePermission } from '../../../features/auth/lib/route-guards';
import { workOrders } from '../../../features/work-orders/api/work-order-queries';
import { Panel } from '../../../features/work-orders/components/form-controls';
import { OrderCommandPanel } from '../../../features/work-orders/components/order-command-panel';
import { Checklist, OrderFacts } from '../../../features/work-orders/components/order-facts';
import { OrderLog } from '../../../features/work-orders/components/order-log';
import { SealedNotice } from '../../../features/work-orders/components/sealed-notice';
import { flagsOfOrder } from '../../../features/work-orders/lib/order-results';
import { kindLabels, stateMeanings } from '../../../features/work-orders/lib/work-order-words';
import { paths } from '../../../config/paths';
import { idParam, orNotFound } from './route-helpers';

export const clientLoader =
  (queryClient: QueryClient) =>
  async ({ request, params }: LoaderFunctionArgs) => {
    await requirePermission(queryClient, request, 'work-orders:read');
    await orNotFound(queryClient.ensureQueryData(workOrders.detail(idParam(params, 'orderId'))));
    return null;
  };

/** An order's own page: what it is, where it stands, who moved it when, and what can be done next. */
export default function WorkOrderPage() {
  const id = idParam(useParams(), 'orderId');
  const { data: order } = useSuspenseQuery(workOrders.detail(id));
  const { data: me } = useQuery(session);
  const flagCount = flagsOfOrder(order).length;
  const showResults = order.readings.length > 0 || order.photos.length > 0;

  return (
    <>
      <PageHeader
        eyebrow={`Work order #${order.id} · ${kindLabels[order.kind]}`}
        title={order.title}
        documentTitle={`#${order.id} ${order.title}`}
        lead={stateMeanings[order.state]}
        actions={
          <>
            {order.locked && (
              <Link to={paths.workOrders.record.getHref(order.id)} className={buttonClassName('primary')}>
                Signed record
              </Link>
            )}
            <Link to={paths.workOrders.list.getHref()} className={buttonClassName('secondary')}>
              All work orders
            </Link>
          </>
        }
      />
      {order.locked && <SealedNotice order={order} />}
      <div className="grid gap-6 desk:grid-cols-[minmax(0,3fr)_minmax(0,2fr)] desk:items-start">
        <div className="grid min-w-0 gap-6">
          <Panel title="Order">
            <OrderFacts order={order} />
          </Panel>
          <Panel title="What to do">
            {order.instructions ? <p className="mb-4 whitespace-pre-line">{order.instructions}</p> : <p className="mb-4 text-ink-muted">No instructions beyond the checklist.</p>}
            <h3 className="mb-2 font-semibold">Readings to record</h3>
            <Checklist items={order.checklist} />
          </Panel>
          {showResults && (
            <Panel
              title="Results"
              actions={
                <Link to={paths.workOrders.review.getHref(order.id)} className={buttonClassName('secondary')}>
                  Results side by side
                </Link>
              }
            >
              <p>
                <span className="numeric font-medium">{order.readings.length}</span> {order.readings.length === 1 ? 'reading' : 'readings'},{' '}
                <span className="numeric font-medium">{flagCount}</span> {flagCount === 1 ? 'flag' : 'flags'},{' '}
                <span className="numeric font-medium">{order.photos.length}</span> {order.photos.length === 1 ? 'photo' : 'photos'}.
              </p>
            </Panel>
          )}
        </div>
        <OrderCommandPanel order={order} me={me} />
      </div>
      <section aria-labelledby="order-log-heading" className="mt-8">
        <h2 id="order-log-heading" className="mb-3 text-lg font-semibold">
          Order log
        </h2>
        <OrderLog transitions={order.transitions} />
      </section>
    </>
  );
}
