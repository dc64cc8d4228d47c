import { useSuspenseQuery, type QueryClient } from '@tanstack/react-query';
import { Link, useNavigate, useParams, type LoaderFunctionArgs } from 'react-router-dom';
import { PageHeader } from '../../../components/page-header';
import { unitQueries } from '../../../features/register/api/unit-queries';
import { Breadcrumbs } from '../../../features/register/components/breadcrumbs';
import { UnitForm, unitDefaults } from '../../../features/register/forms/unit-form';
import { paths } from '../../../config/paths';
import { allowed, ensureStepContext, idParam, orNotFound, stepTrail, useStepContext } from './route-helpers';

export const clientLoader =
  (queryClient: QueryClient) =>
  async ({ request, params }: LoaderFunctionArgs) => {
    await allowed(queryClient, request, 'register:write');
    const unit = await orNotFound(queryClient.ensureQueryData(unitQueries.detail(idParam(params, 'unitId'))));
    await ensureStepContext(queryClient, unit.stepId);
    return null;
  };

export default function UnitEditPage() {
  const unitId = idParam(useParams(), 'unitId');
  const { data: unit } = useSuspenseQuery(unitQueries.detail(unitId));
  const context = useStepContext(unit.stepId);
  const navigate = useNavigate();
  const back = paths.register.unit.getHref(unit.id);
  return (
    <>
      <Breadcrumbs trail={stepTrail(context, `Position ${unit.position}`)} />
      <PageHeader eyebrow={`Capacitor unit · ${context.bank.name}`} title="Change the unit" documentTitle={`Change unit ${unit.serial || unit.id}`} />
      {unit.removedOn ? (
        <p role="status">This unit left service on {unit.removedOn}; its record no longer changes.</p>
      ) : (
        <UnitForm unit={unit} defaults={unitDefaults(unit)} onSaved={() => navigate(back)} cancel={<Link to={back}>Cancel</Link>} />
      )}
    </>
  );
}
