import type { QueryClient } from '@tanstack/react-query';
import type { LoaderFunctionArgs } from 'react-router-dom';
import { PageHeader } from '../../components/page-header';
import { requirePermission } from '../../features/auth/lib/route-guards';
import { healthQueries } from '../../features/health/api/health-queries';
import { ServiceHealthPanel } from '../../features/health/components/service-health-panel';

// Starts the health check while the page renders; never awaited, so a server that does not
// answer shows in the panel instead of failing the route.
export const clientLoader =
  (queryClient: QueryClient) =>
  async ({ request }: LoaderFunctionArgs) => {
    await requirePermission(queryClient, request, 'settings:manage');
    void queryClient.prefetchQuery(healthQueries.report());
    return null;
  };

export default function ServiceHealthRoute() {
  return (
    <>
      <PageHeader title="Service health" lead="Whether the database, file storage and mail that Varden depends on are answering." />
      <div className="max-w-measure">
        <ServiceHealthPanel />
      </div>
    </>
  );
}
