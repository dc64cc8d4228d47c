import type { SiteHealth } from '@varden/schemas';
import { useState } from 'react';
import { Link } from 'react-router-dom';
import { formatDate, formatDateTime } from '../../../lib/date-format';
import { fleetLinks } from '../lib/fleet-links';
import { nextSteps } from '../lib/next-steps';
import { tuningRows } from '../lib/tuning-rows';
import { CorrectionGlance } from './correction-glance';
import { CostEstimatePanel } from './cost-estimate-panel';
import { HarmonicAxisFigure } from './harmonic-axis-figure';
import { HealthPanel } from './health-panel';
import { NextStepsList } from './next-steps-list';
import { PowerTriangleFigure } from './power-triangle-figure';
import { SiteFlagsTable } from './site-flags-table';
import { StepOutputTables } from './step-output-table';
import { TuningDriftChart } from './tuning-drift-chart';

const costPanelId = 'cost-of-lost-correction';

type SiteHealthViewProps = {
  health: SiteHealth;
  onHoursChange: (hours: number) => void;
  /** True while figures for other hours are on their way. */
  busy: boolean;
};

/** The site health page's content: everything below the page header, also its printed report. */
export function SiteHealthView({ health, onHoursChange, busy }: SiteHealthViewProps) {
  const steps = nextSteps({
    health,
    links: fleetLinks,
    formatDate,
  });
  const hasTuning = tuningRows(health).length > 0;
  // When these figures were shown, fixed on first draw (for the printed report).
  const [shownAt] = useState(() => new Date().toISOString());
  return (
    <div className="grid gap-6 print:gap-4" aria-busy={busy}>
      <HealthPanel title="Correction at a glance" lead="What the banks deliver, what is lost and the power factor the site reaches at its load.">
        <CorrectionGlance health={health} costHref={`#${costPanelId}`} />
      </HealthPanel>

      <HealthPanel title="What to do next" lead="Built from the figures on this page, the most urgent first.">
        <NextStepsList steps={steps} />
      </HealthPanel>

      <HealthPanel
        title="Open flags"
        lead="Findings of this site’s readings not yet cleared, newest first."
        actions={
          <Link to={fleetLinks.flagQueue(health.siteId)} data-print="hide" className="font-medium">
            Open the flag queue
          </Link>
        }
      >
        <SiteFlagsTable flags={health.openFlags} />
      </HealthPanel>

      <HealthPanel
        title="Power triangle"
        lead="P along the ground, Q rising, S closing the triangle, φ at the origin: as installed and now, over each other."
      >
        {health.triangle ? (
          <PowerTriangleFigure triangles={health.triangle} targetPf={health.targetPf} lostKvar={health.lostKvar} />
        ) : (
          <p className="text-ink-muted">
            The triangle needs the site’s load: a controller reading with the load, or a planned load on the{' '}
            <Link to={fleetLinks.siteRecord(health.siteId)}>site record</Link>.
          </p>
        )}
      </HealthPanel>

      <HealthPanel id={costPanelId} title="Cost of lost correction" lead="An estimate of the reactive-energy charge the lost kvar add to a month’s bill.">
        {health.cost ? (
          <CostEstimatePanel cost={health.cost} lostKvar={health.lostKvar} onHoursChange={onHoursChange} busy={busy} />
        ) : (
          <p className="text-ink-muted">An estimate needs the site’s load (and its tariff on the site record).</p>
        )}
      </HealthPanel>

      <HealthPanel
        title="Harmonic axis"
        lead="Where each switched combination of undetuned steps resonates with the supply, and where each detuned step is tuned, against the characteristic harmonics."
      >
        <HarmonicAxisFigure health={health} />
      </HealthPanel>

      {hasTuning && (
        <HealthPanel title="Tuning drift" lead="As a detuned step’s capacitors lose capacitance its tuning frequency rises from its design towards the 5th harmonic.">
          <TuningDriftChart health={health} />
        </HealthPanel>
      )}

      <HealthPanel title="Steps and their output" lead="Each bank’s steps at network voltage, with the bands of their units’ latest readings.">
        {health.banks.length === 0 ? <p className="text-ink-muted">No bank is registered at this site yet.</p> : <StepOutputTables banks={health.banks} />}
      </HealthPanel>

      <p className="text-base text-ink-muted desk:text-sm">
        Figures from each unit’s stored latest evaluation (engineering {health.engineeringVersion}),{' '}
        {health.newestReadingAt ? <>the newest reading taken {formatDateTime(health.newestReadingAt)}</> : 'no reading recorded yet'}; shown{' '}
        {formatDateTime(shownAt)}.
      </p>
    </div>
  );
}
