import { queryOptions } from '@tanstack/react-query';
import { getHealth } from './get-health';

export const healthQueries = {
  all: ['health'] as const,
  report: () =>
    queryOptions({
      queryKey: healthQueries.all,
      queryFn: ({ signal }) => getHealth(signal),
      staleTime: 10_000,
      refetchInterval: 30_000,
      // Show "could not reach the server" at once; the interval keeps asking.
      retry: false,
      meta: { subject: 'service health' },
    }),
};
