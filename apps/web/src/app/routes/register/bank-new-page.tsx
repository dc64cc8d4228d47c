import { useSuspenseQuery, type QueryClient } from '@tanstack/react-query';
import { Link, useNavigate, useParams, type LoaderFunctionArgs } from 'react-router-dom';
import { PageHeader } from '../../../components/page-header';
import { siteQueries } from '../../../features/register/api/site-queries';
import { BankForm } from '../../../features/register/forms/bank-form';
import { paths } from '../../../config/paths';
import { allowed, idParam, orNotFound } from './route-helpers';

export const clientLoader =
  (queryClient: QueryClient) =>
  async ({ request, params }: LoaderFunctionArgs) => {
    await allowed(queryClient, request, 'register:write');
    await orNotFound(queryClient.ensureQueryData(siteQueries.detail(idParam(params, 'siteId'))));
    return null;
  };

export default function BankNewPage() {
  const siteId = idParam(useParams(), 'siteId');
  const { data: site } = useSuspenseQuery(siteQueries.detail(siteId));
  const navigate = useNavigate();
  return (
    <>
      <PageHeader eyebrow={site.name} title="New bank" documentTitle={`New bank · ${site.name}`} lead="A correction panel of this site. Its steps and components follow on the bank's page." />
      <BankForm
        siteId={site.id}
        onSaved={(bank) => navigate(paths.register.bank.getHref(bank.id))}
        cancel={<Link to={paths.register.site.getHref(site.id)}>Cancel</Link>}
      />
    </>
  );
}
