import { useMutation, useQuery, useQueryClient, type QueryClient } from '@tanstack/react-query';
import { useState } from 'react';
import { Link, useNavigate, useParams, type LoaderFunctionArgs } from 'react-router-dom';
import { Button } from '../../../components/button';
import { PageHeader } from '../../../components/page-header';
import { Quantity } from '../../../components/quantity';
import { componentQueries } from '../../../features/register/api/component-queries';
import { stepMutations } from '../../../features/register/api/step-queries';
import { unitQueries } from '../../../features/register/api/unit-queries';
import { Breadcrumbs } from '../../../features/register/components/breadcrumbs';
import { formatDetuning } from '../../../features/register/components/formats';
import { LinkButton } from '../../../features/register/components/link-button';
import { NoReadingGlyph } from '../../../features/register/components/no-reading-glyph';
import { PanelSection } from '../../../features/register/components/panel-section';
import { RetirePanel } from '../../../features/register/components/retire-panel';
import { RegisterWriteOnly } from '../../../features/register/components/write-gate';
import { StepForm } from '../../../features/register/forms/step-form';
import { buildSearch } from '../../../features/register/panel/bank-build-panel';
import { paths } from '../../../config/paths';
import { allowed, ensureStepContext, idParam, stepTrail, useStepContext } from './route-helpers';

export const clientLoader =
  (queryClient: QueryClient) =>
  async ({ request, params }: LoaderFunctionArgs) => {
    await allowed(queryClient, request);
    const { bank } = await ensureStepContext(queryClient, idParam(params, 'stepId'));
    void queryClient.prefetchQuery(unitQueries.list({ bankId: bank.id, includeRemoved: false }));
    return null;
  };

/** Step page: its rating, its components in service, and changing or retiring it. */
export default function StepPage() {
  const stepId = idParam(useParams(), 'stepId');
  const context = useStepContext(stepId);
  const { step, bank } = context;
  const units = useQuery(unitQueries.list({ stepId, includeRemoved: false }));
  const contactors = useQuery(componentQueries.ofBank('contactors', bank.id));
  const reactors = useQuery(componentQueries.ofBank('reactors', bank.id));
  const fuseSets = useQuery(componentQueries.ofBank('fuse-sets', bank.id));
  const [editing, setEditing] = useState(false);
  const queryClient = useQueryClient();
  const update = useMutation(stepMutations.update(queryClient));
  const remove = useMutation(stepMutations.remove(queryClient));
  const navigate = useNavigate();
  const bankHref = paths.register.bank.getHref(bank.id);

  const components = [
    ...(fuseSets.data?.items.filter((c) => c.stepId === stepId) ?? []).map((c) => ({
      key: `f${c.id}`,
      href: paths.register.fuseSet.getHref(c.id),
      label: 'Fuse set',
      detail: <><Quantity value={c.ratedCurrentA} unit="A" /> {c.type}</>,
    })),
    ...(contactors.data?.items.filter((c) => c.stepId === stepId) ?? []).map((c) => ({
      key: `c${c.id}`,
      href: paths.register.contactor.getHref(c.id),
      label: 'Contactor',
      detail: <Quantity value={c.ratedOperations} unit="operations rated" />,
    })),
    ...(reactors.data?.items.filter((c) => c.stepId === stepId) ?? []).map((c) => ({
      key: `r${c.id}`,
      href: paths.register.reactor.getHref(c.id),
      label: 'Detuning reactor',
      detail: <><Quantity value={c.inductanceMH} unit="mH" />, p {formatDetuning(c.detuningFactor)}</>,
    })),
    ...(units.data?.items ?? []).map((u) => ({
      key: `u${u.id}`,
      href: paths.register.unit.getHref(u.id),
      label: `Capacitor unit, position ${u.position}`,
      detail: <><Quantity value={u.nameplateKvar} unit="kvar" />{u.serial ? `, serial ${u.serial}` : ''}</>,
    })),
  ];
  const loading = [units, contactors, reactors, fuseSets].some((q) => q.isPending);

  return (
    <>
      <Breadcrumbs trail={stepTrail(context)} />
      <PageHeader
        eyebrow={`Step · ${bank.name}`}
        title={`Step ${step.number}`}
        documentTitle={`Step ${step.number} · ${bank.name}`}
        lead={<><Quantity value={step.ratedKvar} unit="kvar" /> rated at network voltage.</>}
        actions={
          <RegisterWriteOnly>
            <Button onClick={() => setEditing((open) => !open)} aria-expanded={editing}>
              Change the step
            </Button>
            <LinkButton to={`${bankHref}${buildSearch('unit', step)}`} variant="primary">
              Add a component
            </LinkButton>
          </RegisterWriteOnly>
        }
      />
      <div className="grid gap-6">
        {editing && (
          <PanelSection title="Change the step">
            <StepForm bankId={bank.id} step={step} onSaved={() => setEditing(false)} cancel={<Button onClick={() => setEditing(false)}>Cancel</Button>} />
          </PanelSection>
        )}
        <PanelSection title="Components">
          {loading ? (
            <p className="text-ink-muted">Loading the components…</p>
          ) : components.length === 0 ? (
            <p className="text-ink-muted">No components in the register for this step yet.</p>
          ) : (
            <ul className="grid divide-y divide-line">
              {components.map((c) => (
                <li key={c.key} className="flex flex-wrap items-center justify-between gap-x-4 gap-y-1 py-3">
                  <span className="grid">
                    <Link to={c.href} className="font-medium">
                      {c.label}
                    </Link>
                    <span className="text-ink-muted">{c.detail}</span>
                  </span>
                  <NoReadingGlyph />
                </li>
              ))}
            </ul>
          )}
        </PanelSection>
        <RegisterWriteOnly>
          <RetirePanel
            noun="step"
            retired={step.retiredAt !== null}
            onRetire={(retired) => update.mutateAsync({ id: step.id, body: { version: step.version, retired } })}
            onDelete={async () => {
              await remove.mutateAsync({ id: step.id, bankId: bank.id });
              navigate(bankHref);
            }}
          />
        </RegisterWriteOnly>
      </div>
    </>
  );
}
