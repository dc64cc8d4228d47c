import { useMutation, useQueryClient, useSuspenseQuery, type QueryClient } from '@tanstack/react-query';
import { useState } from 'react';
import { useNavigate, useParams, type LoaderFunctionArgs } from 'react-router-dom';
import { Button } from '../../../components/button';
import { PageHeader } from '../../../components/page-header';
import { Quantity } from '../../../components/quantity';
import {
  componentMutations,
  componentQueries,
  type ComponentKind,
  type ComponentRecord,
  type Contactor,
  type FuseSet,
  type Reactor,
} from '../../../features/register/api/component-queries';
import { Breadcrumbs } from '../../../features/register/components/breadcrumbs';
import { formatDate, formatDetuning } from '../../../features/register/components/formats';
import { NoReadingGlyph } from '../../../features/register/components/no-reading-glyph';
import { PanelSection } from '../../../features/register/components/panel-section';
import { RecordFacts, type Fact } from '../../../features/register/components/record-facts';
import { RegisterWriteOnly } from '../../../features/register/components/write-gate';
import { ContactorForm, FuseSetForm, ReactorForm } from '../../../features/register/forms/component-forms';
import { controlClass } from '../../../features/register/forms/form-field';
import { EmptyState } from '../../../features/register/components/empty-state';
import { paths } from '../../../config/paths';
import { isApiError } from '../../../lib/api-client';
import { allowed, ensureStepContext, idParam, orNotFound, stepTrail, useStepContext } from './route-helpers';
import { readerLocale } from '../../../lib/reader-format';

const names: Record<ComponentKind, string> = { contactors: 'Contactor', reactors: 'Detuning reactor', 'fuse-sets': 'Fuse set' };

function factsOf(kind: ComponentKind, record: ComponentRecord[ComponentKind]): Fact[] {
  if (kind === 'contactors') {
    const c = record as Contactor;
    return [
      { label: 'Rated electrical endurance', value: <Quantity value={c.ratedOperations} unit="operations" /> },
      { label: 'Counter at installation', value: <span className="numeric">{c.counterAtInstall.toLocaleString(readerLocale())}</span> },
      { label: 'Maker and model', value: [c.maker, c.model].filter(Boolean).join(' · ') || '—' },
    ];
  }
  if (kind === 'reactors') {
    const r = record as Reactor;
    return [
      { label: 'Inductance per phase', value: <Quantity value={r.inductanceMH} unit="mH" maximumFractionDigits={3} /> },
      { label: 'Rated current', value: <Quantity value={r.ratedCurrentA} unit="A" /> },
      { label: 'Detuning factor', value: `p ${formatDetuning(r.detuningFactor)}` },
      { label: 'Maker and model', value: [r.maker, r.model].filter(Boolean).join(' · ') || '—' },
    ];
  }
  const f = record as FuseSet;
  return [
    { label: 'Rated current', value: <Quantity value={f.ratedCurrentA} unit="A" /> },
    { label: 'Fuse type', value: f.type },
  ];
}

function today(): string {
  const now = new Date();
  return `${now.getFullYear()}-${String(now.getMonth() + 1).padStart(2, '0')}-${String(now.getDate()).padStart(2, '0')}`;
}

/** Takes a component out of service on a date (its record stays), or deletes one entered by mistake. */
function RemovalPanel({ kind, record, onDeleted }: { kind: ComponentKind; record: ComponentRecord[ComponentKind]; onDeleted: () => void }) {
  const queryClient = useQueryClient();
  const update = useMutation(componentMutations.update(queryClient, kind));
  const remove = useMutation(componentMutations.remove(queryClient, kind));
  const [date, setDate] = useState(today);
  const [message, setMessage] = useState<string | null>(null);
  const noun = names[kind].toLowerCase();
  const run = async (action: () => Promise<unknown>) => {
    setMessage(null);
    try {
      await action();
    } catch (error) {
      setMessage(isApiError(error) && error.status === 409 ? `${error.message}` : error instanceof Error ? error.message : 'The change failed.');
    }
  };
  if (record.removedOn) {
    return (
      <PanelSection title="Out of service">
        <p className="text-ink-muted">Removed on {formatDate(record.removedOn)}; the record stays for the step's history.</p>
      </PanelSection>
    );
  }
  return (
    <PanelSection title="Take out of service" data-print="hide">
      <div className="grid max-w-measure gap-4">
        <p className="text-ink-muted">Give the date the {noun} left the step. Delete only a record entered by mistake.</p>
        <div className="flex flex-wrap items-end gap-3">
          <label className="grid gap-1 text-base font-medium desk:text-sm">
            Removed on
            <input type="date" value={date} onChange={(event) => setDate(event.target.value)} className={controlClass} />
          </label>
          <Button
            disabled={update.isPending || date === ''}
            onClick={() => void run(() => update.mutateAsync({ id: record.id, body: { version: record.version, removedOn: date } }))}
          >
            Take it out of service
          </Button>
          <Button
            disabled={remove.isPending}
            onClick={() =>
              void run(async () => {
                await remove.mutateAsync(record.id);
                onDeleted();
              })
            }
          >
            Delete the record
          </Button>
        </div>
        {message && (
          <p role="alert" className="rounded border-2 border-replace p-3">
            {message}
          </p>
        )}
      </div>
    </PanelSection>
  );
}

/** A contactor's, reactor's or fuse set's page: one factory for the three kinds. */
export function componentRecordRoute(kind: ComponentKind) {
  const clientLoader =
    (queryClient: QueryClient) =>
    async ({ request, params }: LoaderFunctionArgs) => {
      await allowed(queryClient, request);
      const record = await orNotFound(queryClient.ensureQueryData(componentQueries.detail(kind, idParam(params, 'componentId'))));
      await ensureStepContext(queryClient, record.stepId);
      return null;
    };

  function ComponentRecordPage() {
    const id = idParam(useParams(), 'componentId');
    const { data: record } = useSuspenseQuery(componentQueries.detail(kind, id));
    const context = useStepContext(record.stepId);
    const [editing, setEditing] = useState(false);
    const navigate = useNavigate();
    const name = names[kind];
    const close = () => setEditing(false);
    const common = { stepId: record.stepId, onSaved: close, cancel: <Button onClick={close}>Cancel</Button> };

    return (
      <>
        <Breadcrumbs trail={stepTrail(context, name)} />
        <PageHeader
          eyebrow={`${name} · ${context.bank.name}`}
          title={`${name} of step ${context.step.number}`}
          documentTitle={`${name} · step ${context.step.number} · ${context.bank.name}`}
          actions={
            record.removedOn === null && (
              <RegisterWriteOnly>
                <Button onClick={() => setEditing((open) => !open)} aria-expanded={editing}>
                  Change the record
                </Button>
              </RegisterWriteOnly>
            )
          }
        />
        <div className="grid gap-6">
          {editing && (
            <PanelSection title="Change the record">
              {kind === 'contactors' && <ContactorForm {...common} record={record as Contactor} />}
              {kind === 'reactors' && <ReactorForm {...common} record={record as Reactor} />}
              {kind === 'fuse-sets' && <FuseSetForm {...common} record={record as FuseSet} />}
            </PanelSection>
          )}
          <PanelSection title={name}>
            <RecordFacts
              facts={[
                { label: 'Condition', value: <NoReadingGlyph /> },
                ...factsOf(kind, record),
                { label: 'Installed on', value: formatDate(record.installedOn) },
                { label: 'Removed on', value: record.removedOn ? formatDate(record.removedOn) : 'In service' },
              ]}
            />
          </PanelSection>
          <PanelSection title="Reading history">
            <EmptyState title="No readings recorded yet">Checks of this {name.toLowerCase()} on inspections will be listed here.</EmptyState>
          </PanelSection>
          <RegisterWriteOnly>
            <RemovalPanel kind={kind} record={record} onDeleted={() => navigate(paths.register.step.getHref(record.stepId))} />
          </RegisterWriteOnly>
        </div>
      </>
    );
  }

  return { clientLoader, ComponentRecordPage };
}
