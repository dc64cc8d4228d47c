import { useSuspenseQuery, type QueryClient } from '@tanstack/react-query';
import { Link, useNavigate, useParams, type LoaderFunctionArgs } from 'react-router-dom';
import { PageHeader } from '../../../components/page-header';
import { siteQueries } from '../../../features/register/api/site-queries';
import { SiteForm } from '../../../features/register/forms/site-form';
import { paths } from '../../../config/paths';
import { allowed, idParam, orNotFound } from './route-helpers';

export const clientLoader =
  (queryClient: QueryClient) =>
  async ({ request, params }: LoaderFunctionArgs) => {
    await allowed(queryClient, request, 'register:write');
    await orNotFound(queryClient.ensureQueryData(siteQueries.detail(idParam(params, 'siteId'))));
    return null;
  };

export default function SiteEditPage() {
  const siteId = idParam(useParams(), 'siteId');
  const { data: site } = useSuspenseQuery(siteQueries.detail(siteId));
  const navigate = useNavigate();
  const back = paths.register.site.getHref(site.id);
  return (
    <>
      <PageHeader eyebrow={site.name} title="Change the site" documentTitle={`Change ${site.name}`} />
      <SiteForm site={site} onSaved={() => navigate(back)} cancel={<Link to={back}>Cancel</Link>} />
    </>
  );
}
