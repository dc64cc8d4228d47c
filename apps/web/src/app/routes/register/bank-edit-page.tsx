import { useSuspenseQuery, type QueryClient } from '@tanstack/react-query';
import { Link, useNavigate, useParams, type LoaderFunctionArgs } from 'react-router-dom';
import { PageHeader } from '../../../components/page-header';
import { bankQueries } from '../../../features/register/api/bank-queries';
import { BankForm } from '../../../features/register/forms/bank-form';
import { paths } from '../../../config/paths';
import { allowed, idParam, orNotFound } from './route-helpers';

export const clientLoader =
  (queryClient: QueryClient) =>
  async ({ request, params }: LoaderFunctionArgs) => {
    await allowed(queryClient, request, 'register:write');
    await orNotFound(queryClient.ensureQueryData(bankQueries.detail(idParam(params, 'bankId'))));
    return null;
  };

export default function BankEditPage() {
  const bankId = idParam(useParams(), 'bankId');
  const { data: bank } = useSuspenseQuery(bankQueries.detail(bankId));
  const navigate = useNavigate();
  const back = paths.register.bank.getHref(bank.id);
  return (
    <>
      <PageHeader eyebrow={`${bank.siteName} · ${bank.name}`} title="Change the bank" documentTitle={`Change ${bank.name}`} />
      <BankForm siteId={bank.siteId} bank={bank} onSaved={() => navigate(back)} cancel={<Link to={back}>Cancel</Link>} />
    </>
  );
}
