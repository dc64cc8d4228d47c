import type { QueryClient } from '@tanstack/react-query';
import { useQuery } from '@tanstack/react-query';
import { useId } from 'react';
import { Link, type LoaderFunctionArgs } from 'react-router-dom';
import { PageHeader } from '../../components/page-header';
import { Quantity } from '../../components/quantity';
import { paths } from '../../config/paths';
import { session } from '../../features/auth/api/session-queries';
import { permitted } from '../../features/auth/lib/permitted';
import { requirePermission } from '../../features/auth/lib/route-guards';
import { siteChoices } from '../../features/users/api/site-choices-queries';
import { PlanningBoard } from '../../features/work-orders/components/planning-board';
import { sections } from './app-shell';

export const clientLoader =
  (queryClient: QueryClient) =>
  async ({ request }: LoaderFunctionArgs) => {
    await requirePermission(queryClient, request, 'work-orders:schedule');
    // Not awaited: a register that does not answer shows in its panel, the desk still opens.
    void queryClient.prefetchQuery(siteChoices.list());
    return null;
  };

const shownSites = 8;

function RegisterSummary() {
  const headingId = useId();
  const sites = useQuery(siteChoices.list());
  return (
    <section aria-labelledby={headingId} className="rounded-md border border-line bg-surface p-4 desk:p-6">
      <h2 id={headingId} className="mb-3 text-lg font-semibold">
        Sites in the register
      </h2>
      {sites.isPending ? (
        <p className="text-ink-muted">Loading the sites…</p>
      ) : sites.isError ? (
        <p role="alert">Could not load the sites: {sites.error.message}</p>
      ) : sites.data.total === 0 ? (
        <p className="text-ink-muted">The register has no sites yet. Add the first site, its banks and their steps to plan inspections.</p>
      ) : (
        <>
          <p className="mb-2 text-ink-muted">
            <span className="numeric font-medium text-ink">{sites.data.total}</span> {sites.data.total === 1 ? 'site' : 'sites'} in service.
          </p>
          <ul className="grid gap-1">
            {sites.data.items.slice(0, shownSites).map((site) => (
              <li key={site.id} className="flex flex-wrap items-baseline justify-between gap-x-3 border-b border-line py-2 last:border-b-0">
                <Link to={paths.register.site.getHref(site.id)} className="font-medium">
                  {site.name}
                </Link>
                <span className="text-base text-ink-muted desk:text-sm">
                  <Quantity value={site.bankCount} unit={site.bankCount === 1 ? 'bank' : 'banks'} maximumFractionDigits={0} /> ·{' '}
                  <Quantity value={site.voltageV} unit="V" maximumFractionDigits={0} /> ·{' '}
                  <Quantity value={site.frequencyHz} unit="Hz" maximumFractionDigits={0} />
                </span>
              </li>
            ))}
          </ul>
          <p className="mt-3">
            <Link to={paths.register.sites.getHref()}>
              {sites.data.total > shownSites ? `All ${sites.data.total} sites in the register` : 'Open the register'}
            </Link>
          </p>
        </>
      )}
    </section>
  );
}

function StartingPoints() {
  const headingId = useId();
  const { data: me } = useQuery(session);
  const others = permitted(sections, me).filter((section) => section.href !== paths.planningDesk.getHref());
  return (
    <section aria-labelledby={headingId} className="rounded-md border border-line bg-surface p-4 desk:p-6">
      <h2 id={headingId} className="mb-3 text-lg font-semibold">
        Where to go from here
      </h2>
      <ul className="grid gap-1">
        {others.map((section) => (
          <li key={section.href}>
            <Link to={section.href} className="flex min-h-touch items-center rounded px-2 font-medium hover:bg-sunken desk:min-h-control">
              {section.label}
            </Link>
          </li>
        ))}
      </ul>
    </section>
  );
}

/** The planner's home: the planning board, then the register at a glance and the sections a planner works in. */
export default function PlanningDeskRoute() {
  return (
    <>
      <PageHeader title="Planning desk" lead="What falls due this month, what is late or unassigned, the open flags and who carries how much; then the register and your sections." />
      <PlanningBoard />
      <div className="mt-6 grid gap-6 desk:grid-cols-2 desk:items-start">
        <RegisterSummary />
        <StartingPoints />
      </div>
    </>
  );
}
