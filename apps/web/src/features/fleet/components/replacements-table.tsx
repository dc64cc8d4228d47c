import type { FleetOverview } from '@varden/schemas';
import { Link } from 'react-router-dom';
import { formatDate } from '../../../lib/date-format';
import { fleetLinks } from '../lib/fleet-links';
import { formatNumber, nbsp } from '../lib/number-format';
import { FigureTable, type FigureColumn } from './figure-table';

type Projected = FleetOverview['projectedReplacements'][number];

const todayIso = () => new Date().toISOString().slice(0, 10);
const signedPct = (v: number, digits: number) => `${v > 0 ? '+' : v < 0 ? '−' : ''}${formatNumber(Math.abs(v), digits)}${nbsp}%`;

const columns: FigureColumn<Projected>[] = [
  {
    header: 'Unit',
    rowHeader: true,
    cell: (p) => (
      <Link to={fleetLinks.capacitorUnit(p.unitId)} className="font-medium whitespace-nowrap">
        {p.serial || `Unit ${p.unitId}`}
      </Link>
    ),
  },
  { header: 'Site', cell: (p) => <Link to={fleetLinks.siteHealth(p.siteId)}>{p.siteName}</Link> },
  { header: 'Bank', cell: (p) => <Link to={fleetLinks.bank(p.bankId)}>{p.bankName}</Link> },
  { header: 'Step', align: 'end', cell: (p) => <Link to={fleetLinks.step(p.stepId)}>{p.stepNumber}</Link> },
  { header: 'Position', align: 'end', cell: (p) => p.position },
  { header: 'Loss rate', align: 'end', cell: (p) => `${signedPct(p.ratePctPerYear, 1)} a year` },
  { header: 'Latest deviation', align: 'end', cell: (p) => signedPct(p.latestDeviationPct, 1) },
  {
    header: 'Replace by',
    align: 'end',
    cell: (p) =>
      // A fitted crossing already behind us: the unit is due now, and the date says since when.
      p.replaceBy <= todayIso() ? (
        <span className="whitespace-nowrap">
          <span className="font-semibold">Now</span> <span className="text-ink-muted">(crossed {formatDate(p.replaceBy)})</span>
        </span>
      ) : (
        <span className="font-semibold">{formatDate(p.replaceBy)}</span>
      ),
  },
];

/** "Replacements due in 12 months": units whose drift crosses the replace threshold within a year, soonest first. */
export function ReplacementsTable({ projected }: { projected: FleetOverview['projectedReplacements'] }) {
  const rows = [...projected].sort((a, b) => a.replaceBy.localeCompare(b.replaceBy));
  return (
    <FigureTable
      caption="Units projected to need replacing in the next 12 months"
      columns={columns}
      rows={rows}
      rowKey={(p) => String(p.unitId)}
      empty="No unit is projected to cross the replace threshold in the next 12 months. A projection needs at least two readings of a unit."
    />
  );
}
