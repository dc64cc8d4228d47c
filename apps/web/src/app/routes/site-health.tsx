import type { QueryClient } from '@tanstack/react-query';
import { useQuery } from '@tanstack/react-query';
import type { Site } from '@varden/schemas';
import { Link, type LoaderFunctionArgs } from 'react-router-dom';
import { PageHeader } from '../../components/page-header';
import { Quantity } from '../../components/quantity';
import { paths } from '../../config/paths';
import { session } from '../../features/auth/api/session-queries';
import { requirePermission } from '../../features/auth/lib/route-guards';
import { siteChoiceLimit, siteChoices } from '../../features/users/api/site-choices-queries';

export const clientLoader =
  (queryClient: QueryClient) =>
  async ({ request }: LoaderFunctionArgs) => {
    await requirePermission(queryClient, request, 'reports:read');
    // Not awaited: a register that does not answer shows in place, the page still opens.
    void queryClient.prefetchQuery(siteChoices.list());
    return null;
  };

const pf = new Intl.NumberFormat(undefined, { minimumFractionDigits: 2, maximumFractionDigits: 2 });

function SiteCard({ site }: { site: Site }) {
  return (
    <li className="rounded-md border border-line bg-surface p-4">
      <h2 className="text-lg font-semibold">
        <Link to={paths.register.site.getHref(site.id)}>{site.name}</Link>
      </h2>
      {site.address && <p className="text-ink-muted">{site.address}</p>}
      <dl className="mt-3 grid grid-cols-[auto_1fr] gap-x-4 gap-y-1 text-base desk:text-sm">
        <dt className="text-ink-muted">Network</dt>
        <dd>
          <Quantity value={site.voltageV} unit="V" maximumFractionDigits={0} /> · <Quantity value={site.frequencyHz} unit="Hz" maximumFractionDigits={0} />
        </dd>
        <dt className="text-ink-muted">Transformer</dt>
        <dd>
          <Quantity value={site.transformerKva} unit="kVA" maximumFractionDigits={0} /> at{' '}
          <Quantity value={site.transformerImpedancePct} unit="%" maximumFractionDigits={1} />
        </dd>
        <dt className="text-ink-muted">PF target</dt>
        <dd className="numeric font-medium">{pf.format(site.targetPf)}</dd>
        <dt className="text-ink-muted">Banks</dt>
        <dd className="numeric font-medium">{site.bankCount}</dd>
      </dl>
    </li>
  );
}

/** The viewer's home: the sites granted to them (everyone else: every site), with their network and banks. */
export default function SiteHealthRoute() {
  const { data: me } = useQuery(session);
  const sites = useQuery(siteChoices.list());
  // A viewer without another role reads only granted sites (the server's site scope).
  const grantedOnly = me?.user.roles.every((role) => role === 'viewer') ?? false;
  return (
    <>
      <PageHeader
        title="Site health"
        lead={grantedOnly ? 'The sites you have been granted, with their network and correction banks.' : 'Every site in the register, with its network and correction banks.'}
      />
      {sites.isPending ? (
        <p className="text-ink-muted">Loading the sites…</p>
      ) : sites.isError ? (
        <p role="alert">Could not load the sites: {sites.error.message}</p>
      ) : sites.data.items.length === 0 ? (
        <div className="max-w-measure rounded-md border border-line bg-surface p-4 desk:p-6">
          <h2 className="text-lg font-semibold">{grantedOnly ? 'No sites granted to you yet' : 'No sites in the register yet'}</h2>
          <p className="mt-1 text-ink-muted">
            {grantedOnly ? 'Ask your administrator to grant you the sites you look after.' : 'Sites appear here once a planner adds them to the register.'}
          </p>
        </div>
      ) : (
        <>
          <ul className="grid gap-4 desk:grid-cols-2" aria-label="Sites">
            {sites.data.items.map((site) => (
              <SiteCard key={site.id} site={site} />
            ))}
          </ul>
          {sites.data.total > siteChoiceLimit && (
            <p className="mt-3 text-ink-muted">
              The first {siteChoiceLimit} of {sites.data.total} sites, by name.
            </p>
          )}
        </>
      )}
    </>
  );
}
