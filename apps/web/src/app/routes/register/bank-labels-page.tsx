import { useSuspenseQuery, type QueryClient } from '@tanstack/react-query';
import { useParams, type LoaderFunctionArgs } from 'react-router-dom';
import { Button } from '../../../components/button';
import { PageHeader } from '../../../components/page-header';
import { bankQueries } from '../../../features/register/api/bank-queries';
import { siteQueries } from '../../../features/register/api/site-queries';
import { stepQueries } from '../../../features/register/api/step-queries';
import { unitQueries } from '../../../features/register/api/unit-queries';
import { Breadcrumbs } from '../../../features/register/components/breadcrumbs';
import { LabelSheet, labelsOf } from '../../../features/register/labels/label-sheet';
import { paths } from '../../../config/paths';
import { allowed, idParam, orNotFound } from './route-helpers';

export const clientLoader =
  (queryClient: QueryClient) =>
  async ({ request, params }: LoaderFunctionArgs) => {
    await allowed(queryClient, request);
    const bankId = idParam(params, 'bankId');
    const bank = await orNotFound(queryClient.ensureQueryData(bankQueries.detail(bankId)));
    await Promise.all([
      queryClient.ensureQueryData(siteQueries.detail(bank.siteId)),
      queryClient.ensureQueryData(stepQueries.ofBank(bankId)),
      queryClient.ensureQueryData(unitQueries.list({ bankId, includeRemoved: false })),
    ]);
    return null;
  };

/** Label sheet: QR labels for a bank and its capacitor units, to print on A4 or Letter. */
export default function BankLabelsPage() {
  const bankId = idParam(useParams(), 'bankId');
  const { data: bank } = useSuspenseQuery(bankQueries.detail(bankId));
  const { data: site } = useSuspenseQuery(siteQueries.detail(bank.siteId));
  const steps = useSuspenseQuery(stepQueries.ofBank(bankId)).data.items;
  const units = useSuspenseQuery(unitQueries.list({ bankId, includeRemoved: false })).data.items;
  const labels = labelsOf(site, bank, steps, units);

  return (
    <>
      <div data-print="hide">
        <Breadcrumbs
          trail={[
            { label: 'Sites', href: paths.register.sites.getHref() },
            { label: site.name, href: paths.register.site.getHref(site.id) },
            { label: bank.name, href: paths.register.bank.getHref(bank.id) },
            { label: 'Labels' },
          ]}
        />
        <PageHeader
          eyebrow={`Bank · ${site.name}`}
          title={`Labels for ${bank.name}`}
          documentTitle={`Labels · ${bank.name}`}
          lead={`${labels.length} label${labels.length === 1 ? '' : 's'}: the bank and each capacitor unit in service. Scanned with a phone, a label opens its page in Varden.`}
          actions={
            <Button variant="primary" onClick={() => window.print()}>
              Print the labels
            </Button>
          }
        />
        <p className="mb-6 max-w-measure text-base text-ink-muted desk:text-sm">
          Prints 18 labels of 60 × 40 mm on each A4 or US Letter sheet (margins 10 mm; choose “Actual size” in the print dialog). Fix each label on
          or beside what it names.
        </p>
      </div>
      <LabelSheet labels={labels} origin={window.location.origin} />
    </>
  );
}
