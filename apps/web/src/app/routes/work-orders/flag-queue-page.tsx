import { useQuery, type QueryClient } from '@tanstack/react-query';
import { useSearchParams, type LoaderFunctionArgs } from 'react-router-dom';
import { PageHeader } from '../../../components/page-header';
import { hasPermission, session } from '../../../features/auth/api/session-queries';
import { requirePermission } from '../../../features/auth/lib/route-guards';
import { flags, readFlagSearch, writeFlagSearch } from '../../../features/work-orders/api/flag-queries';
import { FlagQueue } from '../../../features/work-orders/components/flag-queue';

export const clientLoader =
  (queryClient: QueryClient) =>
  async ({ request }: LoaderFunctionArgs) => {
    await requirePermission(queryClient, request, 'work-orders:read');
    await queryClient.ensureQueryData(flags.list(readFlagSearch(new URL(request.url).searchParams)));
    return null;
  };

/** The flag queue: open flags first; a planner opens a corrective order from a flag in one action. */
export default function FlagQueuePage() {
  const [params, setParams] = useSearchParams();
  const search = readFlagSearch(params);
  const list = useQuery(flags.list(search));
  const { data: me } = useQuery(session);
  return (
    <>
      <PageHeader
        title="Flag queue"
        lead="What the readings found that needs a person: units to replace or watch, remeasures, tuning drift, worn contactors, hot cases, blown fuses."
      />
      {list.isError && !list.data ? (
        <p role="alert">Could not load the flags: {list.error.message}</p>
      ) : (
        <FlagQueue
          search={search}
          onSearchChange={(next) => setParams(writeFlagSearch(next), { preventScrollReset: true })}
          list={list.data}
          isFetching={list.isFetching}
          canOpen={hasPermission(me, 'work-orders:schedule')}
        />
      )}
    </>
  );
}
