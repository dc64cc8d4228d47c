import { useSuspenseQuery, type QueryClient } from '@tanstack/react-query';
import { useState } from 'react';
import { Link, useParams, type LoaderFunctionArgs } from 'react-router-dom';
import { PageHeader } from '../../../components/page-header';
import { unitQueries, type UnitReplacement } from '../../../features/register/api/unit-queries';
import { Breadcrumbs } from '../../../features/register/components/breadcrumbs';
import { formatDate } from '../../../features/register/components/formats';
import { PanelSection } from '../../../features/register/components/panel-section';
import { ReplaceUnitForm } from '../../../features/register/forms/replace-unit-form';
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

/** What a replacement did, and the baseline inspection it calls for. */
function Replaced({ result }: { result: UnitReplacement }) {
  const { removed, installed } = result;
  return (
    <div className="grid gap-6">
      <div role="status" className="rounded-md border-2 border-healthy bg-surface p-4">
        <h2 className="text-lg font-semibold">Unit replaced</h2>
        <p className="mt-1">
          {removed.serial || `Unit ${removed.id}`} left service on {formatDate(removed.removedOn)}; {installed.serial || `unit ${installed.id}`} now stands at
          position {installed.position}, installed on {formatDate(installed.installedOn)}. The position's history continues on the new unit's page.
        </p>
        <p className="mt-3 flex flex-wrap gap-4">
          <Link to={paths.register.unit.getHref(installed.id)}>Open the new unit</Link>
          <Link to={paths.register.unit.getHref(removed.id)}>Open the removed unit</Link>
        </p>
      </div>
      <PanelSection title="Suggested next: a baseline inspection">
        <p className="max-w-measure">
          Plan a baseline inspection for the new unit: its first readings become the reference every later reading is compared with. Work
          orders arrive in a later release of Varden; until then, note it in your planning.
        </p>
      </PanelSection>
    </div>
  );
}

export default function UnitReplacePage() {
  const unitId = idParam(useParams(), 'unitId');
  const { data: unit } = useSuspenseQuery(unitQueries.detail(unitId));
  const context = useStepContext(unit.stepId);
  const [result, setResult] = useState<UnitReplacement | null>(null);
  const back = paths.register.unit.getHref(unit.id);
  return (
    <>
      <Breadcrumbs trail={stepTrail(context, `Position ${unit.position}`)} />
      <PageHeader
        eyebrow={`Capacitor unit · ${context.bank.name}`}
        title={`Replace the unit at position ${unit.position}`}
        documentTitle={`Replace unit ${unit.serial || unit.id}`}
        lead={`Step ${context.step.number} of ${context.bank.name}. The unit leaves service with a date and a reason; the new one takes its position.`}
      />
      {result ? (
        <Replaced result={result} />
      ) : unit.removedOn ? (
        <p role="status">
          This unit already left service on {formatDate(unit.removedOn)}. <Link to={back}>Back to the unit</Link>
        </p>
      ) : (
        <ReplaceUnitForm unit={unit} onReplaced={setResult} cancel={<Link to={back}>Cancel</Link>} />
      )}
    </>
  );
}
