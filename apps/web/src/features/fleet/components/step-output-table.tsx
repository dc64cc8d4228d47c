import type { SiteHealth } from '@varden/schemas';
import { Link } from 'react-router-dom';
import { Quantity } from '../../../components/quantity';
import { fleetLinks } from '../lib/fleet-links';
import { formatNumber, nbsp } from '../lib/number-format';
import { BandCounts } from './band-counts';
import { FigureTable, type FigureColumn } from './figure-table';

type Bank = SiteHealth['banks'][number];
type Step = Bank['steps'][number];

const columns: FigureColumn<Step>[] = [
  {
    header: 'Step',
    rowHeader: true,
    cell: (step) => (
      <Link to={fleetLinks.step(step.id)} className="whitespace-nowrap">
        Step {step.number}
      </Link>
    ),
  },
  { header: 'Installed', align: 'end', cell: (step) => <Quantity value={step.installedKvar} unit="kvar" maximumFractionDigits={1} minimumFractionDigits={1} /> },
  { header: 'Effective', align: 'end', cell: (step) => <Quantity value={step.effectiveKvar} unit="kvar" maximumFractionDigits={1} minimumFractionDigits={1} /> },
  { header: 'Share', align: 'end', cell: (step) => `${formatNumber(step.effectivePct, 1)}${nbsp}%` },
  { header: 'Units', cell: (step) => <BandCounts bands={step.bands} className="gap-x-3" /> },
  {
    header: 'Tuning',
    align: 'end',
    cell: (step) => (step.tuning ? <Quantity value={step.tuning.tuningHz} unit="Hz" maximumFractionDigits={0} /> : <span className="text-ink-muted">not detuned</span>),
  },
  {
    header: 'Findings',
    cell: (step) =>
      step.reasons.length === 0 ? (
        <span className="text-ink-muted">None</span>
      ) : (
        <ul className="grid min-w-[16rem] gap-1">
          {step.reasons.map((reason) => (
            <li key={reason}>{reason}</li>
          ))}
        </ul>
      ),
  },
];

/** "Steps and their output": each bank's steps with installed and effective kvar, their units' bands and tuning. */
export function StepOutputTables({ banks }: { banks: SiteHealth['banks'] }) {
  return (
    <div className="grid gap-6">
      {banks.map((bank) => (
        <div key={bank.id} className="grid gap-2">
          <h3 className="flex flex-wrap items-baseline gap-x-3 font-semibold">
            <Link to={fleetLinks.bank(bank.id)}>{bank.name}</Link>
            <span className="text-base font-normal text-ink-muted desk:text-sm">
              {bank.detuned ? `detuned, p ${formatNumber(100 * (bank.detuningFactor ?? 0), 2)}${nbsp}%` : 'not detuned'} ·{' '}
              <Quantity value={bank.effectiveKvar} unit="kvar" maximumFractionDigits={1} minimumFractionDigits={1} /> of{' '}
              <Quantity value={bank.installedKvar} unit="kvar" maximumFractionDigits={1} minimumFractionDigits={1} />
            </span>
          </h3>
          <FigureTable caption={`Steps of ${bank.name}`} columns={bank.detuned ? columns : columns.filter((c) => c.header !== 'Tuning')} rows={bank.steps} rowKey={(step) => String(step.id)} empty="No steps with capacitor units." />
        </div>
      ))}
    </div>
  );
}
