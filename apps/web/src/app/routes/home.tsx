import type { QueryClient } from '@tanstack/react-query';
import { ConditionKey } from '../../components/condition-key';
import { PageHeader } from '../../components/page-header';
import { healthQueries } from '../../features/health/api/health-queries';
import { ServiceHealthPanel } from '../../features/health/components/service-health-panel';

// Starts the health check while the page renders; never awaited, so a server that does not
// answer shows in the panel instead of failing the route.
export const clientLoader = (queryClient: QueryClient) => () => {
  void queryClient.prefetchQuery(healthQueries.report());
  return null;
};

export default function HomeRoute() {
  return (
    <>
      <PageHeader
        eyebrow="Overview"
        title="Varden"
        documentTitle="Overview"
        lead="Keeps power-factor-correction capacitor banks healthy: inspections planned, readings taken in the switch-room, records signed off."
      />
      <div className="grid gap-6 desk:grid-cols-2 desk:items-start">
        <ServiceHealthPanel />
        <ConditionKey />
      </div>
    </>
  );
}
