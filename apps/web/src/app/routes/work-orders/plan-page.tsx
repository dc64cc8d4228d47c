import { useMutation, useQueryClient, useSuspenseQuery, type QueryClient } from '@tanstack/react-query';
import { useState } from 'react';
import { Link, useNavigate, useParams, type LoaderFunctionArgs } from 'react-router-dom';
import { Button, buttonClassName } from '../../../components/button';
import { FormAlert, FormSuccess } from '../../../components/form/form-alert';
import { PageHeader } from '../../../components/page-header';
import { requirePermission } from '../../../features/auth/lib/route-guards';
import { planMutations, plans } from '../../../features/work-orders/api/plan-queries';
import { Panel } from '../../../features/work-orders/components/form-controls';
import { PlanForm } from '../../../features/work-orders/components/plan-form';
import { paths } from '../../../config/paths';
import { idParam, orNotFound } from './route-helpers';

export const clientLoader =
  (queryClient: QueryClient) =>
  async ({ request, params }: LoaderFunctionArgs) => {
    await requirePermission(queryClient, request, 'plans:manage');
    await orNotFound(queryClient.ensureQueryData(plans.detail(idParam(params, 'planId'))));
    return null;
  };

/** One inspection plan: change it, pause it, or delete it. */
export default function PlanPage() {
  const id = idParam(useParams(), 'planId');
  const { data: plan } = useSuspenseQuery(plans.detail(id));
  const queryClient = useQueryClient();
  const remove = useMutation(planMutations.remove(queryClient));
  const navigate = useNavigate();
  const [saved, setSaved] = useState(false);
  const [confirming, setConfirming] = useState(false);

  return (
    <>
      <PageHeader eyebrow={`Inspection plan · ${plan.siteName} · ${plan.bankName}`} title={plan.name} documentTitle={`${plan.name} · ${plan.bankName}`} />
      {saved && <FormSuccess className="mb-4 max-w-measure">The plan is saved.</FormSuccess>}
      <PlanForm
        plan={plan}
        onSaved={() => setSaved(true)}
        cancel={
          <Link to={paths.plans.list.getHref(plan.bankId)} className={buttonClassName('secondary')}>
            Back to the plans
          </Link>
        }
      />
      <Panel title="Delete the plan" className="mt-8 max-w-measure">
        <p className="mb-3 text-ink-muted">Orders the plan already made stay as they are; it makes no more. Pausing it (untick Active) keeps it for later.</p>
        {remove.isError && <FormAlert className="mb-3">{remove.error.message}</FormAlert>}
        {confirming ? (
          <div className="flex flex-wrap gap-3">
            <Button
              variant="primary"
              disabled={remove.isPending}
              onClick={() => remove.mutate(plan.id, { onSuccess: () => navigate(paths.plans.list.getHref(plan.bankId)) })}
            >
              Yes, delete “{plan.name}”
            </Button>
            <Button onClick={() => setConfirming(false)}>Keep it</Button>
          </div>
        ) : (
          <Button onClick={() => setConfirming(true)}>Delete this plan</Button>
        )}
      </Panel>
    </>
  );
}
