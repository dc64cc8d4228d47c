import type { QueryClient } from '@tanstack/react-query';
import { Link, useNavigate, type LoaderFunctionArgs } from 'react-router-dom';
import { PageHeader } from '../../../components/page-header';
import { SiteForm } from '../../../features/register/forms/site-form';
import { paths } from '../../../config/paths';
import { allowed } from './route-helpers';

export const clientLoader =
  (queryClient: QueryClient) =>
  async ({ request }: LoaderFunctionArgs) => {
    await allowed(queryClient, request, 'register:write');
    return null;
  };

export default function SiteNewPage() {
  const navigate = useNavigate();
  return (
    <>
      <PageHeader eyebrow="Register" title="New site" lead="The site's network and supply: every bank, reading and cost estimate refers to them." />
      <SiteForm
        onSaved={(site) => navigate(paths.register.site.getHref(site.id))}
        cancel={<Link to={paths.register.sites.getHref()}>Cancel</Link>}
      />
    </>
  );
}
