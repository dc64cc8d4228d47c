import { useQuery, type QueryClient } from '@tanstack/react-query';
import { Link, useSearchParams, type LoaderFunctionArgs } from 'react-router-dom';
import { buttonClassName } from '../../../components/button';
import { PageHeader } from '../../../components/page-header';
import { Pager } from '../../../components/pager';
import { requirePermission } from '../../../features/auth/lib/route-guards';
import { bankQueries } from '../../../features/register/api/bank-queries';
import { plans, type PlanListParams } from '../../../features/work-orders/api/plan-queries';
import { PlansTable } from '../../../features/work-orders/components/plans-table';
import { paths } from '../../../config/paths';

function paramsFrom(search: URLSearchParams): PlanListParams {
  const bankId = Number(search.get('bankId'));
  const page = Number(search.get('page'));
  const pageSize = Number(search.get('pageSize'));
  return {
    ...(Number.isInteger(bankId) && bankId > 0 ? { bankId } : {}),
    page: Number.isInteger(page) && page > 0 ? page : 1,
    pageSize: [25, 50, 100].includes(pageSize) ? pageSize : 25,
    sort: search.get('sort') === '-nextDueOn' ? '-nextDueOn' : 'nextDueOn',
  };
}

export const clientLoader =
  (queryClient: QueryClient) =>
  async ({ request }: LoaderFunctionArgs) => {
    await requirePermission(queryClient, request, 'plans:manage');
    const params = paramsFrom(new URL(request.url).searchParams);
    await queryClient.ensureQueryData(plans.list(params));
    if (params.bankId) void queryClient.prefetchQuery(bankQueries.detail(params.bankId));
    return null;
  };

/** Inspection plans: every bank's schedule of inspections, or one bank's with ?bankId=. */
export default function PlansPage() {
  const [search, setSearch] = useSearchParams();
  const params = paramsFrom(search);
  const list = useQuery(plans.list(params));
  const bank = useQuery({ ...bankQueries.detail(params.bankId ?? 0), enabled: params.bankId !== undefined });
  const go = (changes: Partial<PlanListParams>) => {
    const next = { ...params, ...changes };
    const out = new URLSearchParams();
    if (next.bankId) out.set('bankId', String(next.bankId));
    if (next.page > 1) out.set('page', String(next.page));
    if (next.pageSize !== 25) out.set('pageSize', String(next.pageSize));
    if (next.sort !== 'nextDueOn') out.set('sort', next.sort);
    setSearch(out, { preventScrollReset: true });
  };

  return (
    <>
      <PageHeader
        title="Inspection plans"
        eyebrow={bank.data ? `${bank.data.siteName} · ${bank.data.name}` : undefined}
        lead="Each plan makes the next inspection order of its bank once, a lead time before it falls due."
        actions={
          <>
            <Link to={paths.plans.create.getHref(params.bankId)} className={buttonClassName('primary')}>
              New plan
            </Link>
            {params.bankId && (
              <Link to={paths.plans.list.getHref()} className={buttonClassName('secondary')}>
                All banks
              </Link>
            )}
          </>
        }
      />
      {list.isError && !list.data ? (
        <p role="alert">Could not load the inspection plans: {list.error.message}</p>
      ) : (
        <>
          <div className="mb-3 flex flex-wrap items-center gap-2">
            <button type="button" onClick={() => go({ sort: params.sort === 'nextDueOn' ? '-nextDueOn' : 'nextDueOn', page: 1 })} className={buttonClassName('quiet')}>
              {params.sort === 'nextDueOn' ? 'Latest due first' : 'Soonest due first'}
            </button>
          </div>
          <PlansTable items={list.data?.items ?? []} busy={list.isFetching} />
          <Pager
            page={params.page}
            pageSize={params.pageSize}
            total={list.data?.total ?? 0}
            noun="plans"
            onPage={(page) => go({ page })}
            onPageSize={(pageSize) => go({ pageSize, page: 1 })}
          />
        </>
      )}
    </>
  );
}
