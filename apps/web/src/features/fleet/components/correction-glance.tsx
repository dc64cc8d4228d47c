import type { SiteHealth } from '@varden/schemas';
import type { ReactNode } from 'react';
import { Quantity } from '../../../components/quantity';
import { formatDate } from '../../../lib/date-format';
import { formatNumber, pfText, targetPfText } from '../lib/number-format';
import { BandCounts } from './band-counts';
import { StatusWord } from './status-word';

function Figure({ term, value, children, testId }: { term: string; value: ReactNode; children?: ReactNode; testId?: string }) {
  return (
    <div data-testid={testId} className="grid min-w-0 content-start gap-1 rounded border border-line bg-paper p-3 print:bg-surface">
      <dt className="text-base text-ink-muted desk:text-sm">{term}</dt>
      <dd className="text-xl leading-tight">{value}</dd>
      {children && <dd className="text-base text-ink-muted desk:text-sm">{children}</dd>}
    </div>
  );
}

/** Effective against installed kvar as a bar: the delivered part solid, the lost part hatched. */
function CorrectionBar({ installedKvar, effectiveKvar }: { installedKvar: number; effectiveKvar: number }) {
  if (installedKvar <= 0) return null;
  const share = Math.max(0, Math.min(1, effectiveKvar / installedKvar));
  return (
    <div aria-hidden="true" className="mt-1 flex h-3 w-full overflow-hidden rounded-sm border border-line-strong">
      <div className="h-full bg-ink" style={{ width: `${share * 100}%` }} />
      <div
        className="h-full flex-1"
        style={{ backgroundImage: 'repeating-linear-gradient(135deg, var(--v-replace) 0 2px, transparent 2px 6px)' }}
      />
    </div>
  );
}

function PfStanding({ health }: { health: SiteHealth }) {
  if (health.reachedPf === null) return null;
  if (health.leading) return <StatusWord standing="fault">Leading: over-corrected, a fault</StatusWord>;
  return health.targetMet ? <StatusWord standing="met">Target met</StatusWord> : <StatusWord standing="short">Below the target</StatusWord>;
}

function LoadSource({ load }: { load: NonNullable<SiteHealth['load']> }) {
  return (
    <>
      <span className="block font-medium text-ink">
        {load.source === 'controller-reading'
          ? `From the controller reading${load.recordedAt ? ` of ${formatDate(load.recordedAt)}` : ''}`
          : 'As the planner entered it'}
      </span>
      <span className="block">{load.note}</span>
    </>
  );
}

/** "Correction at a glance": what the bank delivers, what is lost, the PF it reaches and what that costs. */
export function CorrectionGlance({ health, costHref }: { health: SiteHealth; costHref: string }) {
  const noReadings = health.bands.noReading > 0 && health.bands.noReading === Object.values(health.bands).reduce((a, b) => a + b, 0);
  return (
    <div className="grid gap-4">
      <dl className="grid gap-3 desk:grid-cols-2 min-[1100px]:grid-cols-3 print:grid-cols-3">
        <Figure
          testId="figure-effective"
          term="Effective correction"
          value={<Quantity value={health.effectiveKvar} unit="kvar" maximumFractionDigits={1} minimumFractionDigits={1} />}
        >
          of <Quantity value={health.installedKvar} unit="kvar" maximumFractionDigits={1} minimumFractionDigits={1} className="text-ink" /> installed
          {noReadings && ' (no reading yet: taken at nameplate)'}
          <CorrectionBar installedKvar={health.installedKvar} effectiveKvar={health.effectiveKvar} />
        </Figure>
        <Figure
          testId="figure-lost"
          term="Lost correction"
          value={<Quantity value={health.lostKvar} unit="kvar" maximumFractionDigits={1} minimumFractionDigits={1} />}
        >
          <span className="numeric">{formatNumber(health.lostPct, 1)}&nbsp;%</span> of the installed kvar
        </Figure>
        <Figure
          testId="figure-pf"
          term="Power factor reached"
          value={
            health.reachedPf === null ? (
              <span className="text-ink-muted">No load known</span>
            ) : (
              <span className="numeric font-medium">
                {pfText(health.reachedPf)}
                {health.leading && <span className="text-base font-normal text-ink-muted"> leading</span>}
              </span>
            )
          }
        >
          <span className="flex flex-wrap items-center gap-x-3 gap-y-1">
            <span>
              target <span className="numeric font-medium text-ink">{targetPfText(health.targetPf)}</span>
            </span>
            <PfStanding health={health} />
          </span>
        </Figure>
        <Figure
          testId="figure-missing"
          term="Missing to the target"
          value={
            health.missingKvar === null ? (
              <span className="text-ink-muted">No load known</span>
            ) : (
              <Quantity value={Math.max(0, health.missingKvar)} unit="kvar" maximumFractionDigits={1} minimumFractionDigits={1} />
            )
          }
        >
          {health.requiredKvar !== null && (
            <>
              <Quantity value={health.requiredKvar} unit="kvar" maximumFractionDigits={1} minimumFractionDigits={1} className="text-ink" /> of
              correction reach the target at this load
            </>
          )}
        </Figure>
        <Figure
          testId="figure-load"
          term="Load"
          value={
            health.load === null ? (
              <span className="text-ink-muted">Not known yet</span>
            ) : (
              <span>
                <Quantity value={health.load.kw} unit="kW" maximumFractionDigits={0} />{' '}
                <span className="text-base text-ink-muted">
                  at PF <span className="numeric font-medium text-ink">{formatNumber(health.load.loadPf, 2)}</span>
                </span>
              </span>
            )
          }
        >
          {health.load === null ? 'Record a controller reading with the load, or enter a planned load on the site record.' : <LoadSource load={health.load} />}
        </Figure>
        <Figure
          testId="figure-cost"
          term="Cost of lost correction (estimate)"
          value={
            health.cost === null ? (
              <span className="text-ink-muted">Needs a known load</span>
            ) : (
              <span>
                <span className="text-base text-ink-muted">about </span>
                <Quantity value={health.cost.lostMonthlyCost} unit={`${health.cost.currency} a month`} maximumFractionDigits={0} />
              </span>
            )
          }
        >
          {health.cost && (
            <>
              {health.cost.lostMonthlyCost <= 0 ? 'Nothing extra within the tariff’s allowance. ' : ''}An estimate at{' '}
              <span className="numeric">{formatNumber(health.cost.hoursPerMonth, 0)}</span> hours a month: <a href={costHref}>its assumptions</a>
            </>
          )}
        </Figure>
      </dl>
      <div className="grid gap-1">
        <p className="text-base text-ink-muted desk:text-sm">Capacitor units by their latest reading</p>
        <BandCounts bands={health.bands} />
      </div>
    </div>
  );
}
