import { useQuery, useSuspenseQuery, type QueryClient } from '@tanstack/react-query';
import { useParams, type LoaderFunctionArgs } from 'react-router-dom';
import { PageHeader } from '../../../components/page-header';
import { bankQueries } from '../../../features/register/api/bank-queries';
import { stepQueries } from '../../../features/register/api/step-queries';
import { unitQueries } from '../../../features/register/api/unit-queries';
import { Breadcrumbs } from '../../../features/register/components/breadcrumbs';
import { RegisterImportPanel } from '../../../features/register/csv/register-import-panel';
import { paths } from '../../../config/paths';
import { allowed, idParam, orNotFound } from './route-helpers';

export const clientLoader =
  (queryClient: QueryClient) =>
  async ({ request, params }: LoaderFunctionArgs) => {
    await allowed(queryClient, request, 'register:write');
    const bankId = idParam(params, 'bankId');
    await orNotFound(queryClient.ensureQueryData(bankQueries.detail(bankId)));
    await Promise.all([
      queryClient.ensureQueryData(stepQueries.ofBank(bankId)),
      queryClient.ensureQueryData(unitQueries.list({ bankId, includeRemoved: false })),
    ]);
    return null;
  };

/** Register import page: a bank's steps and units from a CSV file, previewed before anything is written. */
export default function BankImportPage() {
  const bankId = idParam(useParams(), 'bankId');
  const { data: bank } = useSuspenseQuery(bankQueries.detail(bankId));
  const steps = useSuspenseQuery(stepQueries.ofBank(bankId)).data.items;
  // Kept fresh after an import, so a second preview checks against what is now in service.
  const units = useQuery(unitQueries.list({ bankId, includeRemoved: false })).data?.items ?? [];
  return (
    <>
      <Breadcrumbs
        trail={[
          { label: 'Sites', href: paths.register.sites.getHref() },
          { label: bank.siteName, href: paths.register.site.getHref(bank.siteId) },
          { label: bank.name, href: paths.register.bank.getHref(bank.id) },
          { label: 'Import' },
        ]}
      />
      <PageHeader
        eyebrow={`Bank · ${bank.siteName}`}
        title={`Import a register into ${bank.name}`}
        documentTitle={`Import · ${bank.name}`}
        lead="Paste or choose a CSV file of the bank's steps and capacitor units. Every row is checked first; the import adds all rows or none."
      />
      <RegisterImportPanel bank={bank} steps={steps} units={units} />
    </>
  );
}
