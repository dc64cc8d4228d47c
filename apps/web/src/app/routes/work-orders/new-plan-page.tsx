import { useQuery, type QueryClient } from '@tanstack/react-query';
import { Link, useNavigate, useSearchParams, type LoaderFunctionArgs } from 'react-router-dom';
import { buttonClassName } from '../../../components/button';
import { PageHeader } from '../../../components/page-header';
import { requirePermission } from '../../../features/auth/lib/route-guards';
import { bankQueries } from '../../../features/register/api/bank-queries';
import { PlanForm } from '../../../features/work-orders/components/plan-form';
import { paths } from '../../../config/paths';

const bankIdFrom = (params: URLSearchParams) => {
  const id = Number(params.get('bankId'));
  return Number.isInteger(id) && id > 0 ? id : undefined;
};

export const clientLoader =
  (queryClient: QueryClient) =>
  async ({ request }: LoaderFunctionArgs) => {
    await requirePermission(queryClient, request, 'plans:manage');
    const bankId = bankIdFrom(new URL(request.url).searchParams);
    if (bankId) await queryClient.prefetchQuery(bankQueries.detail(bankId));
    return null;
  };

/** A new inspection plan; a bank's page or the plan list can preselect the bank with ?bankId=. */
export default function NewPlanPage() {
  const [params] = useSearchParams();
  const navigate = useNavigate();
  const bankId = bankIdFrom(params);
  const bank = useQuery({ ...bankQueries.detail(bankId ?? 0), enabled: bankId !== undefined });
  const ready = bankId === undefined || !bank.isPending;
  return (
    <>
      <PageHeader eyebrow="Inspection plans" title="New inspection plan" lead="How often the bank is inspected, what each inspection records, and how early its order is made." />
      {ready ? (
        <PlanForm
          prefill={bank.data ? { siteId: bank.data.siteId, bankId: bank.data.id } : {}}
          onSaved={(plan) => navigate(paths.plans.list.getHref(plan.bankId))}
          cancel={
            <Link to={paths.plans.list.getHref(bankId)} className={buttonClassName('secondary')}>
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
