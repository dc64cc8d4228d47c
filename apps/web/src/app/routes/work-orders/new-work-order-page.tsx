import type { QueryClient } from '@tanstack/react-query';
import { useQuery } from '@tanstack/react-query';
import { workOrderKinds } from '@varden/schemas';
import { Link, useNavigate, useSearchParams, type LoaderFunctionArgs } from 'react-router-dom';
import { buttonClassName } from '../../../components/button';
import { PageHeader } from '../../../components/page-header';
import { requirePermission } from '../../../features/auth/lib/route-guards';
import { bankQueries } from '../../../features/register/api/bank-queries';
import { technicians } from '../../../features/work-orders/api/technician-queries';
import { NewWorkOrderForm } from '../../../features/work-orders/components/new-work-order-form';
import { paths } from '../../../config/paths';

const bankIdFrom = (params: URLSearchParams) => {
  const id = Number(params.get('bankId'));
  return Number.isInteger(id) && id > 0 ? id : undefined;
};

export const clientLoader =
  (queryClient: QueryClient) =>
  async ({ request }: LoaderFunctionArgs) => {
    await requirePermission(queryClient, request, 'work-orders:schedule');
    const bankId = bankIdFrom(new URL(request.url).searchParams);
    void queryClient.prefetchQuery(technicians.list());
    // A bank from the address preselects its site; a bank that is gone just leaves both open.
    if (bankId) await queryClient.prefetchQuery(bankQueries.detail(bankId));
    return null;
  };

/** A new work order by hand; a bank's page can link here with ?bankId=. */
export default function NewWorkOrderPage() {
  const [params] = useSearchParams();
  const navigate = useNavigate();
  const bankId = bankIdFrom(params);
  const bank = useQuery({ ...bankQueries.detail(bankId ?? 0), enabled: bankId !== undefined });
  const kind = workOrderKinds.find((k) => k === params.get('kind'));
  const ready = bankId === undefined || !bank.isPending;

  return (
    <>
      <PageHeader eyebrow="Work orders" title="New work order" lead="Orders made here start queued; choose a technician to dispatch it to them straight away." />
      {ready ? (
        <NewWorkOrderForm
          prefill={{ ...(bank.data ? { siteId: bank.data.siteId, bankId: bank.data.id } : {}), ...(kind ? { kind } : {}) }}
          onCreated={(order) => navigate(paths.workOrders.detail.getHref(order.id))}
          cancel={
            <Link to={paths.workOrders.list.getHref()} className={buttonClassName('secondary')}>
              Cancel
            </Link>
          }
        />
      ) : (
        <p className="text-ink-muted">Loading the bank…</p>
      )}
    </>
  );
}
