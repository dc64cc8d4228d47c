import { useQuery, type QueryClient } from '@tanstack/react-query';
import { data, Link, useNavigation, useParams, useSearchParams, type LoaderFunctionArgs } from 'react-router-dom';
import { Button, buttonClassName } from '../../../components/button';
import { PageHeader } from '../../../components/page-header';
import { requirePermission } from '../../../features/auth/lib/route-guards';
import { defaultHoursPerMonth, fleetQueries, hoursPerMonthOf } from '../../../features/fleet/api/fleet-queries';
import { SiteHealthView } from '../../../features/fleet/components/site-health-view';
import { fleetLinks } from '../../../features/fleet/lib/fleet-links';
import { formatNumber, nbsp, targetPfText } from '../../../features/fleet/lib/number-format';
import { isApiError } from '../../../lib/api-client';
import { formatDate } from '../../../lib/date-format';

function siteIdOf(value: string | undefined): number {
  const id = Number(value);
  if (!Number.isInteger(id) || id < 1) throw data({ message: 'This address does not lead to a site.' }, { status: 404 });
  return id;
}

export const clientLoader =
  (queryClient: QueryClient) =>
  async ({ request, params }: LoaderFunctionArgs) => {
    await requirePermission(queryClient, request, 'reports:read');
    const siteId = siteIdOf(params.siteId);
    const hours = hoursPerMonthOf(new URL(request.url).searchParams);
    try {
      await queryClient.ensureQueryData(fleetQueries.siteHealth(siteId, hours));
    } catch (error) {
      // Missing, or a site the person is not granted: the API answers 404 for both.
      if (isApiError(error) && error.status === 404) throw data({ message: error.message }, { status: 404 });
      throw error;
    }
    return null;
  };

/** The site health page: what is lost, what it costs and what to do next, with its pictures; prints as the site health report. */
export default function SiteHealthPage() {
  const siteId = siteIdOf(useParams().siteId);
  const [search, setSearch] = useSearchParams();
  const navigation = useNavigation();
  const hours = hoursPerMonthOf(search);
  const health = useQuery(fleetQueries.siteHealth(siteId, hours));

  if (!health.data) {
    return health.isError ? <p role="alert">Could not load the site’s health: {health.error.message}</p> : <p className="text-ink-muted">Loading the site’s health…</p>;
  }
  const site = health.data;
  const setHours = (next: number) =>
    setSearch(
      (current) => {
        const updated = new URLSearchParams(current);
        if (next === defaultHoursPerMonth) updated.delete('hoursPerMonth');
        else updated.set('hoursPerMonth', String(next));
        return updated;
      },
      { replace: true, preventScrollReset: true },
    );

  return (
    <article className="site-health-report">
      <p className="mb-2 hidden text-sm text-ink-muted print:block">Varden · Site health report</p>
      <PageHeader
        eyebrow="Site health"
        title={site.siteName}
        documentTitle={`${site.siteName}: site health`}
        lead={
          <>
            <span className="numeric">
              {formatNumber(site.voltageV, 0)}
              {nbsp}V, {formatNumber(site.frequencyHz, 0)}
              {nbsp}Hz
            </span>{' '}
            · PF target <span className="numeric">{targetPfText(site.targetPf)}</span> ·{' '}
            {site.newestReadingAt ? <>readings up to {formatDate(site.newestReadingAt)}</> : 'no reading yet'}
          </>
        }
        actions={
          <span data-print="hide" className="flex flex-wrap gap-2">
            <Button variant="primary" onClick={() => window.print()}>
              Print report
            </Button>
            <Link to={fleetLinks.siteRecord(site.siteId)} className={buttonClassName('secondary')}>
              Site record
            </Link>
            <Link to={fleetLinks.fleet} className={buttonClassName('quiet')}>
              Fleet health
            </Link>
          </span>
        }
      />
      <SiteHealthView
        health={site}
        onHoursChange={setHours}
        busy={health.isFetching || navigation.state === 'loading'}
      />
    </article>
  );
}
