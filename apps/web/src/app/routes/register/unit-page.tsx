import { useQuery, useSuspenseQuery, type QueryClient } from '@tanstack/react-query';
import type { Unit } from '@varden/schemas';
import { Link, useParams, type LoaderFunctionArgs } from 'react-router-dom';
import { PageHeader } from '../../../components/page-header';
import { Quantity } from '../../../components/quantity';
import { unitQueries } from '../../../features/register/api/unit-queries';
import { Breadcrumbs } from '../../../features/register/components/breadcrumbs';
import { formatDate } from '../../../features/register/components/formats';
import { LinkButton } from '../../../features/register/components/link-button';
import { ConditionGlyph } from '../../../components/condition-glyph';
import { NoReadingGlyph } from '../../../features/register/components/no-reading-glyph';
import { PanelSection } from '../../../features/register/components/panel-section';
import { RecordFacts } from '../../../features/register/components/record-facts';
import { RegisterWriteOnly } from '../../../features/register/components/write-gate';
import { connectionLabels, tolerancePresetLabels } from '../../../features/register/forms/unit-fields';
import { DeviationTrendChart } from '../../../features/register/history/deviation-trend-chart';
import { positionHistory } from '../../../features/register/history/position-history';
import { PositionHistoryTable } from '../../../features/register/history/position-history-table';
import { ReadingHistoryTable } from '../../../features/register/history/reading-history';
import { capacitanceBasis } from '../../../features/register/nameplate/capacitance-preview';
import { paths } from '../../../config/paths';
import { allowed, ensureStepContext, idParam, orNotFound, stepTrail, useStepContext } from './route-helpers';

export const clientLoader =
  (queryClient: QueryClient) =>
  async ({ request, params }: LoaderFunctionArgs) => {
    await allowed(queryClient, request);
    const unit = await orNotFound(queryClient.ensureQueryData(unitQueries.detail(idParam(params, 'unitId'))));
    void queryClient.prefetchQuery(unitQueries.list({ stepId: unit.stepId, includeRemoved: true }));
    void queryClient.prefetchQuery(unitQueries.readings(unit.id));
    await ensureStepContext(queryClient, unit.stepId);
    return null;
  };

function signedPct(value: number): string {
  return `${value > 0 ? '+' : value < 0 ? '−' : ''}${Math.abs(value)} %`;
}

function Warnings({ warnings }: { warnings: readonly string[] }) {
  if (warnings.length === 0) return null;
  return (
    <section aria-label="Warnings" className="rounded-md border-2 border-watch bg-surface p-4">
      <h2 className="flex items-center gap-2 font-semibold">
        <svg aria-hidden="true" focusable="false" viewBox="0 0 16 16" className="size-4 fill-none stroke-current stroke-2">
          <rect x="1.5" y="1.5" width="13" height="13" rx="3" />
          <path d="M8 4.5v4.5M8 11.5v.2" strokeLinecap="round" />
        </svg>
        Check this record
      </h2>
      <ul className="mt-2 grid list-disc gap-1 pl-6">
        {warnings.map((warning) => (
          <li key={warning}>{warning}</li>
        ))}
      </ul>
    </section>
  );
}

function NameplateFacts({ unit }: { unit: Unit }) {
  return (
    <RecordFacts
      facts={[
        { label: 'Rated output', value: <Quantity value={unit.nameplateKvar} unit="kvar" /> },
        { label: 'Rated voltage', value: <Quantity value={unit.nameplateVoltageV} unit="V" /> },
        { label: 'Rated frequency', value: <Quantity value={unit.nameplateFrequencyHz} unit="Hz" /> },
        { label: 'Connection', value: connectionLabels[unit.connection] },
        {
          label: 'Rated capacitance',
          testId: 'rated-capacitance',
          value: (
            <>
              <Quantity value={unit.ratedCapacitanceUF} unit="µF" /> <span className="text-ink-muted">{capacitanceBasis(unit.connection)}</span>
            </>
          ),
        },
        {
          label: 'Capacitance in the record',
          value: unit.capacitanceGiven ? (
            <>
              <Quantity value={unit.capacitanceUF} unit="µF" /> <span className="text-ink-muted">as marked</span>
            </>
          ) : (
            <span className="text-ink-muted">Worked out from the nameplate</span>
          ),
        },
        {
          label: 'Tolerance',
          value: (
            <>
              <span className="numeric">
                {signedPct(unit.toleranceMinusPct)} to {signedPct(unit.tolerancePlusPct)}
              </span>{' '}
              <span className="text-ink-muted">({tolerancePresetLabels[unit.tolerancePreset].split(':')[0]})</span>
            </>
          ),
        },
        unit.temperatureCategory !== '' && { label: 'Temperature category', value: unit.temperatureCategory },
        { label: 'Discharge time', value: <Quantity value={unit.dischargeTimeS} unit="s" maximumFractionDigits={0} /> },
      ]}
    />
  );
}

/** Unit page: nameplate and rated capacitance, warnings, readings and their trend, photos, and the position's history. */
export default function UnitPage() {
  const unitId = idParam(useParams(), 'unitId');
  const { data: unit } = useSuspenseQuery(unitQueries.detail(unitId));
  const context = useStepContext(unit.stepId);
  const atStep = useQuery(unitQueries.list({ stepId: unit.stepId, includeRemoved: true }));
  const history = positionHistory(atStep.data?.items ?? [unit], unit);
  const readings = useQuery(unitQueries.readings(unitId));
  const newest = readings.data?.items[0];
  const trend = [...(readings.data?.items ?? [])].reverse().map((r) => ({ date: r.recordedAt, deviationPct: r.deviationPct }));
  const place = `step ${context.step.number}, position ${unit.position}`;
  const title = `Capacitor unit at ${place}`;
  const successor = unit.replacedById;

  return (
    <>
      <Breadcrumbs trail={stepTrail(context, `Position ${unit.position}`)} />
      <PageHeader
        eyebrow={`Capacitor unit · ${context.bank.name}`}
        title={unit.serial ? `Unit ${unit.serial}` : title}
        documentTitle={`Unit ${unit.serial || place} · ${context.bank.name}`}
        lead={unit.serial ? `At ${place} of ${context.bank.name}, ${context.site.name}.` : `${context.bank.name}, ${context.site.name}.`}
        actions={
          unit.removedOn === null && (
            <RegisterWriteOnly>
              <LinkButton to={paths.register.editUnit.getHref(unit.id)}>Change the unit</LinkButton>
              <LinkButton to={paths.register.replaceUnit.getHref(unit.id)} variant="primary">
                Replace the unit
              </LinkButton>
            </RegisterWriteOnly>
          )
        }
      />

      <div className="grid gap-6">
        {unit.removedOn !== null && (
          <p role="status" className="rounded border border-line-strong bg-sunken p-3">
            Removed from service on {formatDate(unit.removedOn)}
            {unit.removalReason ? `: ${unit.removalReason}` : ''}.{' '}
            {successor !== null && <Link to={paths.register.unit.getHref(successor)}>Open the unit that replaced it</Link>}
          </p>
        )}
        <Warnings warnings={unit.warnings} />

        <div className="grid gap-6 desk:grid-cols-[3fr_2fr] desk:items-start">
          <PanelSection title="Nameplate">
            <NameplateFacts unit={unit} />
          </PanelSection>
          <PanelSection title="Record">
            <RecordFacts
              facts={[
                {
                  label: 'Condition',
                  value: newest ? (
                    <span>
                      <ConditionGlyph band={newest.band} className="font-medium" />{' '}
                      <span className="text-ink-muted">on {formatDate(newest.recordedAt)}</span>
                    </span>
                  ) : readings.isPending ? (
                    <span className="text-ink-muted">Loading…</span>
                  ) : (
                    <NoReadingGlyph />
                  ),
                },
                { label: 'Serial number', value: unit.serial || '—' },
                { label: 'Maker', value: unit.maker || '—' },
                { label: 'Model', value: unit.model || '—' },
                { label: 'Installed on', value: formatDate(unit.installedOn) },
                { label: 'Removed on', value: unit.removedOn ? formatDate(unit.removedOn) : 'In service' },
              ]}
            />
          </PanelSection>
        </div>

        <PanelSection title="Deviation trend">
          <DeviationTrendChart points={trend} from={unit.installedOn} />
        </PanelSection>

        <PanelSection title="Reading history">
          {readings.isError ? (
            <p role="alert">Could not load the readings: {readings.error.message}</p>
          ) : (
            <ReadingHistoryTable readings={readings.data?.items ?? []} />
          )}
        </PanelSection>

        <PanelSection title="Photos">
          <p className="text-ink-muted">Photos are kept with the order they were taken on: open an order from the reading history to see them.</p>
        </PanelSection>

        <PositionHistoryTable history={history} current={unit} label={`${context.bank.name} ${place}`} />
      </div>
    </>
  );
}
