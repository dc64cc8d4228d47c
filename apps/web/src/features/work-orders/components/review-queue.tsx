import { useQuery, type QueryClient } from '@tanstack/react-query';
import { useSearchParams } from 'react-router-dom';
import { session } from '../../auth/api/session-queries';
import { workOrders } from '../api/work-order-queries';
import { readWorkOrderSearch, writeWorkOrderSearch, type WorkOrderSearch } from '../lib/work-order-search';
import { OrderDigest } from './order-digest';
import { ReviewQueueTable } from './review-queue-table';

/** The queue's list: submitted orders only, paged and sorted as the URL says. */
export function reviewQueueSearch(params: URLSearchParams): WorkOrderSearch {
  const { page, pageSize, sort } = readWorkOrderSearch(params);
  return { page, pageSize, sort, state: 'awaiting-review' };
}

/** For the review queue's loader: the first page before the page draws. */
export function prefetchReviewQueue(queryClient: QueryClient, url: URL) {
  return queryClient.ensureQueryData(workOrders.list(reviewQueueSearch(url.searchParams)));
}

/** The review queue: what waits for a supervisor, what went back to the field, what is sealed. */
export function ReviewQueue() {
  const [params, setParams] = useSearchParams();
  const search = reviewQueueSearch(params);
  const list = useQuery(workOrders.list(search));
  const { data: me } = useQuery(session);
  const onSearchChange = (next: WorkOrderSearch) => {
    const out = writeWorkOrderSearch(next);
    out.delete('state');
    setParams(out, { preventScrollReset: true });
  };
  return (
    <div className="grid gap-8">
      <section aria-labelledby="awaiting-review-heading">
        <h2 id="awaiting-review-heading" className="mb-3 text-lg font-semibold">
          Awaiting review
        </h2>
        {list.isError && !list.data ? (
          <p role="alert">Could not load the orders awaiting review: {list.error.message}</p>
        ) : (
          <ReviewQueueTable search={search} onSearchChange={onSearchChange} list={list.data} isFetching={list.isFetching} userId={me?.user.id} />
        )}
      </section>
      <div className="grid gap-6 desk:grid-cols-2 desk:items-start">
        <OrderDigest title="Sent back, with the technician" filters={{ state: 'sent-back' }} empty="No order is back in the field." />
        <OrderDigest title="Sealed, latest due first" filters={{ state: 'sealed', sort: '-dueOn' }} empty="No order has been sealed yet." />
      </div>
    </div>
  );
}
