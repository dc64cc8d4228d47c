import type { FleetOverview } from '@varden/schemas';
import type { ReactNode } from 'react';
import { ConditionGlyph } from '../../../components/condition-glyph';
import { countOf } from '../lib/number-format';
import { BandTotalsChart } from './band-totals-chart';
import { FleetSiteTable } from './fleet-site-table';
import { HealthPanel } from './health-panel';
import { OverdueOrdersTable } from './overdue-orders-table';
import { ReplacementsTable } from './replacements-table';

function Headline({ term, value, children }: { term: ReactNode; value: number; children?: ReactNode }) {
  return (
    <div className="grid content-start gap-0.5 rounded border border-line bg-surface p-3">
      <dt className="text-base text-ink-muted desk:text-sm">{term}</dt>
      <dd className="numeric text-2xl font-semibold">{value}</dd>
      {children && <dd className="text-base text-ink-muted desk:text-sm">{children}</dd>}
    </div>
  );
}

/** Where the dashboard's figures stand, as one line each: the fleet in a glance. */
function FleetHeadlines({ fleet }: { fleet: FleetOverview }) {
  const actionFlags = fleet.sites.reduce((n, s) => n + s.openActionFlags, 0);
  const nearHarmonic = fleet.sites.reduce((n, s) => n + s.stepsNearHarmonic, 0);
  const { overdue, replacements } = fleetListTotals(fleet);
  return (
    <dl className="grid grid-cols-2 gap-3 desk:grid-cols-4" aria-label="The fleet in figures">
      <Headline term={<ConditionGlyph band="replace" />} value={fleet.totals.replace}>
        {fleet.totals.replace === 1 ? 'unit to replace' : 'units to replace'}
      </Headline>
      <Headline term="Action flags" value={actionFlags}>
        open{nearHarmonic > 0 ? `, ${countOf(nearHarmonic, 'step')} near a harmonic` : ''}
      </Headline>
      <Headline term="Overdue orders" value={overdue}>
        past their due date
      </Headline>
      <Headline term="Replacements" value={replacements}>
        due in the next 12 months
      </Headline>
    </dl>
  );
}

type FleetDashboardProps = {
  fleet: FleetOverview;
  /** What to say when there are no sites: the register is empty, or none is granted to a viewer. */
  emptySites: string;
  /** The CSV export of the sites table, shown beside its heading. */
  exportAction?: ReactNode;
};

/**
 * The fleet's lists hold their most urgent entries only; each site's row counts all of its
 * own, so the whole number is the sum over the sites.
 */
function fleetListTotals(fleet: FleetOverview) {
  return {
    overdue: fleet.sites.reduce((n, s) => n + s.overdueOrders, 0),
    replacements: fleet.sites.reduce((n, s) => n + s.projectedReplacements, 0),
  };
}

/** "the 100 most urgent of 553" when a list is cut short, else nothing. */
const shownOf = (shown: number, all: number, what: string) => (shown < all ? ` Showing the ${shown} most urgent of ${all} ${what}.` : '');

/** The fleet dashboard: sites by risk, units by condition, replacements due within a year, overdue orders. */
export function FleetDashboard({ fleet, emptySites, exportAction }: FleetDashboardProps) {
  const { overdue, replacements } = fleetListTotals(fleet);
  return (
    <div className="grid gap-6">
      <FleetHeadlines fleet={fleet} />
      <HealthPanel
        title="Sites by risk"
        lead="Risk points: 10 for each unit to replace, 5 for each open action flag, 3 for each overdue order, 2 for each unit to remeasure and 1 for each to watch (common practice). Each site leads to its health page."
        actions={exportAction}
      >
        <FleetSiteTable sites={fleet.sites} empty={emptySites} />
      </HealthPanel>
      <div className="grid gap-6 min-[1100px]:grid-cols-[minmax(0,2fr)_minmax(0,3fr)]">
        <HealthPanel title="Units by condition" lead="Every capacitor unit of these sites, by the band of its latest reading.">
          <BandTotalsChart totals={fleet.totals} />
        </HealthPanel>
        <HealthPanel title="Overdue orders" lead={`Open work orders past their due date, longest overdue first.${shownOf(fleet.overdueOrders.length, overdue, 'overdue orders')}`}>
          <OverdueOrdersTable orders={fleet.overdueOrders} />
        </HealthPanel>
      </div>
      <HealthPanel title="Replacements due in 12 months" lead={`Units whose loss of capacitance, fitted over their readings, crosses the replace threshold (−10 %) within a year; soonest first.${shownOf(fleet.projectedReplacements.length, replacements, 'units')}`}>
        <ReplacementsTable projected={fleet.projectedReplacements} />
      </HealthPanel>
    </div>
  );
}
