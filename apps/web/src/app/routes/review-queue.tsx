import type { QueryClient } from '@tanstack/react-query';
import type { LoaderFunctionArgs } from 'react-router-dom';
import { PageHeader } from '../../components/page-header';
import { requirePermission } from '../../features/auth/lib/route-guards';
import { prefetchReviewQueue, ReviewQueue } from '../../features/work-orders/components/review-queue';

export const clientLoader =
  (queryClient: QueryClient) =>
  async ({ request }: LoaderFunctionArgs) => {
    await requirePermission(queryClient, request, 'work-orders:review');
    await prefetchReviewQueue(queryClient, new URL(request.url));
    return null;
  };

/** The supervisor's home: submitted work orders waiting to be signed off or returned. */
export default function ReviewQueueRoute() {
  return (
    <>
      <PageHeader
        title="Review queue"
        lead="Work orders that technicians have submitted wait here, with their results, flags and photos, for you to sign off or return."
      />
      <ReviewQueue />
    </>
  );
}
