import type { FleetOverview } from '@varden/schemas';
import { Link } from 'react-router-dom';
import { countOf } from '../lib/number-format';
import { fleetLinks } from '../lib/fleet-links';
import { BandCounts } from './band-counts';

/** Up to this many sites get a card of their own; a longer list reads better as the table alone. */
export const siteCardLimit = 12;

/** "Your sites": one card per site, named by its heading, with its risk and units by condition, leading to its health page. */
export function SiteHealthCards({ sites }: { sites: FleetOverview['sites'] }) {
  return (
    <ul className="grid gap-4 desk:grid-cols-2 min-[1100px]:grid-cols-3" aria-label="Your sites">
      {sites.slice(0, siteCardLimit).map((site) => (
        <li key={site.siteId} className="grid content-start gap-3 rounded-md border border-line bg-surface p-4">
          <h2 className="text-lg font-semibold">
            <Link to={fleetLinks.siteHealth(site.siteId)}>{site.siteName}</Link>
          </h2>
          <p className="flex flex-wrap items-baseline gap-x-4 gap-y-1 text-base text-ink-muted desk:text-sm">
            <span>
              <span className="numeric text-lg font-semibold text-ink">{site.risk}</span> risk points
            </span>
            {site.openActionFlags > 0 && <span>{countOf(site.openActionFlags, 'action flag')}</span>}
            {site.overdueOrders > 0 && <span>{countOf(site.overdueOrders, 'overdue order')}</span>}
            {site.projectedReplacements > 0 && <span>{countOf(site.projectedReplacements, 'replacement')} due in 12 months</span>}
          </p>
          <BandCounts bands={site.bands} className="gap-x-4" />
        </li>
      ))}
    </ul>
  );
}
