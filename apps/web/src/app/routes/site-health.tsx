import type { QueryClient } from '@tanstack/react-query';
import { useQuery } from '@tanstack/react-query';
import type { LoaderFunctionArgs } from 'react-router-dom';
import { buttonClassName } from '../../components/button';
import { PageHeader } from '../../components/page-header';
import { session } from '../../features/auth/api/session-queries';
import { requirePermission } from '../../features/auth/lib/route-guards';
import { fleetCsvHref, fleetQueries } from '../../features/fleet/api/fleet-queries';
import { FleetDashboard } from '../../features/fleet/components/fleet-dashboard';
import { SiteHealthCards, siteCardLimit } from '../../features/fleet/components/site-health-cards';

export const clientLoader =
  (queryClient: QueryClient) =>
  async ({ request }: LoaderFunctionArgs) => {
    await requirePermission(queryClient, request, 'reports:read');
    // Not awaited: a fleet overview that does not answer shows in place, the page still opens.
    void queryClient.prefetchQuery(fleetQueries.overview());
    return null;
  };

/**
 * The viewer's home: the fleet dashboard of the sites granted to them (the API limits the
 * overview to a viewer's sites; everyone else sees every site), each site with a card of its own.
 */
export default function SiteHealthRoute() {
  const { data: me } = useQuery(session);
  const fleet = useQuery(fleetQueries.overview());
  // A viewer without another role reads only granted sites (the server's site scope).
  const grantedOnly = me?.user.roles.every((role) => role === 'viewer') ?? false;
  return (
    <>
      <PageHeader
        title="Site health"
        lead={
          grantedOnly
            ? 'The sites you have been granted: what their correction banks have lost, what needs doing and what is due.'
            : 'Every site in the register: what their correction banks have lost, what needs doing and what is due.'
        }
      />
      {fleet.isPending ? (
        <p className="text-ink-muted">Loading the sites…</p>
      ) : fleet.isError ? (
        <p role="alert">Could not load the sites: {fleet.error.message}</p>
      ) : fleet.data.sites.length === 0 ? (
        <div className="max-w-measure rounded-md border border-line bg-surface p-4 desk:p-6">
          <h2 className="text-lg font-semibold">{grantedOnly ? 'No sites granted to you yet' : 'No sites in the register yet'}</h2>
          <p className="mt-1 text-ink-muted">
            {grantedOnly ? 'Ask your administrator to grant you the sites you look after.' : 'Sites appear here once a planner adds them to the register.'}
          </p>
        </div>
      ) : (
        <div className="grid gap-6">
          {fleet.data.sites.length <= siteCardLimit && <SiteHealthCards sites={fleet.data.sites} />}
          <FleetDashboard
            fleet={fleet.data}
            emptySites="No sites yet."
            exportAction={
              <a href={fleetCsvHref} download className={buttonClassName('secondary')}>
                Export CSV
              </a>
            }
          />
        </div>
      )}
    </>
  );
}
