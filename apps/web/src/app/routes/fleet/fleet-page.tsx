import { useQuery, type QueryClient } from '@tanstack/react-query';
import type { LoaderFunctionArgs } from 'react-router-dom';
import { buttonClassName } from '../../../components/button';
import { PageHeader } from '../../../components/page-header';
import { requirePermission } from '../../../features/auth/lib/route-guards';
import { fleetCsvHref, fleetQueries } from '../../../features/fleet/api/fleet-queries';
import { FleetDashboard } from '../../../features/fleet/components/fleet-dashboard';

export const clientLoader =
  (queryClient: QueryClient) =>
  async ({ request }: LoaderFunctionArgs) => {
    await requirePermission(queryClient, request, 'reports:read');
    await queryClient.ensureQueryData(fleetQueries.overview());
    return null;
  };

/** "Fleet health": every site the reader may see, ranked by risk, with what is due. */
export default function FleetPage() {
  const fleet = useQuery(fleetQueries.overview());
  return (
    <>
      <PageHeader
        title="Fleet health"
        lead="Which sites need attention first, how their capacitor units stand, and what must be replaced when."
      />
      {fleet.data ? (
        <FleetDashboard
          fleet={fleet.data}
          emptySites="No sites in the register yet: sites appear here once a planner adds them."
          exportAction={
            <a href={fleetCsvHref} download className={buttonClassName('secondary')}>
              Export CSV
            </a>
          }
        />
      ) : fleet.isError ? (
        <p role="alert">Could not load the fleet: {fleet.error.message}</p>
      ) : (
        <p className="text-ink-muted">Loading the fleet…</p>
      )}
    </>
  );
}
