import { useQuery, useSuspenseQuery, type QueryClient } from '@tanstack/react-query';
import { Link, useParams, type LoaderFunctionArgs } from 'react-router-dom';
import { buttonClassName } from '../../../components/button';
import { PageHeader } from '../../../components/page-header';
import { session } from '../../../features/auth/api/session-queries';
import { requirePermission } from '../../../features/auth/lib/route-guards';
import { workOrders } from '../../../features/work-orders/api/work-order-queries';
import { Panel } from '../../../features/work-orders/components/form-controls';
import { OrderFacts } from '../../../features/work-orders/components/order-facts';
import { OrderFlags, OtherReadings, TechnicianNotes } from '../../../features/work-orders/components/order-findings';
import { PhotoStrip } from '../../../features/work-orders/components/photo-strip';
import { ReviewDecision } from '../../../features/work-orders/components/review-decision';
import { SealedNotice } from '../../../features/work-orders/components/sealed-notice';
import { SignatureBlock } from '../../../features/work-orders/components/signature-block';
import { UnitResults } from '../../../features/work-orders/components/unit-results';
import { unitResultRows } from '../../../features/work-orders/lib/order-results';
import { paths } from '../../../config/paths';
import { idParam, orNotFound } from './route-helpers';

export const clientLoader =
  (queryClient: QueryClient) =>
  async ({ request, params }: LoaderFunctionArgs) => {
    await requirePermission(queryClient, request, 'work-orders:read');
    await orNotFound(queryClient.ensureQueryData(workOrders.review(idParam(params, 'orderId'))));
    return null;
  };

/**
 * The review bench: every unit's result beside its previous reading, the flags, photos and the
 * technician's notes, and the supervisor's decision (seal or send back).
 */
export default function ReviewPage() {
  const id = idParam(useParams(), 'orderId');
  const { data: order } = useSuspenseQuery(workOrders.review(id));
  const { data: me } = useQuery(session);
  const rows = unitResultRows(order);

  return (
    <>
      <PageHeader
        eyebrow={`Review · work order #${order.id}`}
        title={order.title}
        documentTitle={`Review #${order.id} ${order.title}`}
        lead={`${order.siteName} · ${order.bankName}${order.assigneeName ? ` · measured by ${order.assigneeName}` : ''}`}
        actions={
          <>
            {order.locked && (
              <Link to={paths.workOrders.record.getHref(order.id)} className={buttonClassName('primary')}>
                Signed record
              </Link>
            )}
            <Link to={paths.workOrders.detail.getHref(order.id)} className={buttonClassName('secondary')}>
              Order page
            </Link>
          </>
        }
      />
      {order.locked && <SealedNotice order={order} />}
      {order.state === 'sent-back' && (
        <p role="status" className="mb-6 rounded border border-line-strong bg-sunken p-3">
          Sent back to the field; it returns here when the technician submits it again.
        </p>
      )}
      <div className="grid gap-6">
        <Panel title="Unit results beside their previous readings">
          <UnitResults rows={rows} withPrevious caption="Each capacitor unit’s result on this order beside its previous reading" />
        </Panel>
        <div className="grid gap-6 desk:grid-cols-2 desk:items-start">
          <Panel title="Flags">
            <OrderFlags order={order} />
          </Panel>
          <Panel title="Contactors, reactors, fuses and the bank">
            <OtherReadings order={order} />
          </Panel>
        </div>
        <Panel title="Photos">
          <PhotoStrip photos={order.photos} />
        </Panel>
        <div className="grid gap-6 desk:grid-cols-2 desk:items-start">
          <Panel title="Technician’s notes">
            <TechnicianNotes order={order} />
          </Panel>
          <Panel title="Order">
            <OrderFacts order={order} />
          </Panel>
        </div>
        {me && !order.locked && order.state === 'awaiting-review' && <ReviewDecision order={order} me={me} />}
        {order.locked && (
          <Panel title="Signature">
            <SignatureBlock order={order} />
          </Panel>
        )}
      </div>
    </>
  );
}
