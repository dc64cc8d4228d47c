import { useMutation, useQueries, useQueryClient, useSuspenseQuery, type QueryClient } from '@tanstack/react-query';
import type { Bank, Site } from '@varden/schemas';
import { createColumnHelper } from '@tanstack/react-table';
import { Link, useNavigate, useParams, type LoaderFunctionArgs } from 'react-router-dom';
import { PageHeader } from '../../../components/page-header';
import { Quantity } from '../../../components/quantity';
import { bankQueries, fetchAllBanks, type BankListParams, type BankSort } from '../../../features/register/api/bank-queries';
import { siteMutations, siteQueries } from '../../../features/register/api/site-queries';
import { stepQueries } from '../../../features/register/api/step-queries';
import { unitQueries } from '../../../features/register/api/unit-queries';
import { CsvExportButton } from '../../../features/register/components/csv-export-button';
import { DataTable } from '../../../features/register/components/data-table';
import { formatDate, formatDetuning, formatRatio, tariffBasisLabels } from '../../../features/register/components/formats';
import { LinkButton } from '../../../features/register/components/link-button';
import { readListParams, useListSearch } from '../../../features/register/components/list-search';
import { PanelSection } from '../../../features/register/components/panel-section';
import { RecordFacts } from '../../../features/register/components/record-facts';
import { RetirePanel } from '../../../features/register/components/retire-panel';
import { RegisterWriteOnly } from '../../../features/register/components/write-gate';
import { fileNameOf, tableToCsv, type CsvColumn } from '../../../features/register/csv/table-csv';
import { paths } from '../../../config/paths';
import { allowed, idParam, orNotFound } from './route-helpers';

const sorts = ['name', '-name', 'createdAt', '-createdAt'] as const satisfies readonly BankSort[];
const bankListOptions = { prefix: 'banks.', sorts, defaultSort: 'name' as const, defaultPageSize: 10 };

const bankTableParams = (siteId: number, search: URLSearchParams): BankListParams => ({ ...readListParams(search, bankListOptions), siteId });
/** Every bank of the site, for the summary (a site has far fewer than 200). */
const allBanksOf = (siteId: number) => bankQueries.list({ siteId, page: 1, pageSize: 200, sort: 'name', q: '' });

export const clientLoader =
  (queryClient: QueryClient) =>
  async ({ request, params }: LoaderFunctionArgs) => {
    await allowed(queryClient, request);
    const siteId = idParam(params, 'siteId');
    await orNotFound(queryClient.ensureQueryData(siteQueries.detail(siteId)));
    await Promise.all([
      queryClient.ensureQueryData(bankQueries.list(bankTableParams(siteId, new URL(request.url).searchParams))),
      queryClient.ensureQueryData(allBanksOf(siteId)),
    ]);
    return null;
  };

const column = createColumnHelper<Bank>();
const columns = [
  column.accessor((bank): unknown => bank.name, {
    id: 'name',
    header: 'Bank',
    cell: ({ row }) => (
      <span className="grid">
        <Link to={paths.register.bank.getHref(row.original.id)} className="font-medium">
          {row.original.name}
        </Link>
        {row.original.location && <span className="text-base text-ink-muted desk:text-sm">{row.original.location}</span>}
      </span>
    ),
  }),
  column.display({
    id: 'detuning',
    header: 'Detuning',
    cell: ({ row }) => (row.original.detuned ? `Detuned, p ${formatDetuning(row.original.detuningFactor)}` : 'Not detuned'),
  }),
  column.display({
    id: 'stepCount',
    header: 'Steps',
    meta: { align: 'end' },
    cell: ({ row }) => <span className="numeric">{row.original.stepCount}</span>,
  }),
  column.display({
    id: 'controllerTargetPf',
    header: 'Controller target',
    meta: { align: 'end' },
    cell: ({ row }) => <span className="numeric">{formatRatio(row.original.controllerTargetPf)}</span>,
  }),
  column.display({
    id: 'commissionedOn',
    header: 'Commissioned',
    cell: ({ row }) => <span className="numeric whitespace-nowrap">{formatDate(row.original.commissionedOn)}</span>,
  }),
];

const csvColumns: CsvColumn<Bank>[] = [
  { header: 'bank', value: (bank) => bank.name },
  { header: 'location', value: (bank) => bank.location },
  { header: 'detuned', value: (bank) => (bank.detuned ? 'yes' : 'no') },
  { header: 'detuning_factor', value: (bank) => bank.detuningFactor },
  { header: 'steps', value: (bank) => bank.stepCount },
  { header: 'controller_target_pf', value: (bank) => bank.controllerTargetPf },
  { header: 'commissioned_on', value: (bank) => bank.commissionedOn },
];

function SupplyFacts({ site }: { site: Site }) {
  return (
    <RecordFacts
      facts={[
        { label: 'Network', value: <><Quantity value={site.voltageV} unit="V" />, <Quantity value={site.frequencyHz} unit="Hz" /></> },
        {
          label: 'Supply transformer',
          value: (
            <>
              <Quantity value={site.transformerKva} unit="kVA" />, impedance <Quantity value={site.transformerImpedancePct} unit="%" />
            </>
          ),
        },
        site.utilityShortCircuitKva !== null && { label: 'Utility short-circuit power', value: <Quantity value={site.utilityShortCircuitKva} unit="kVA" /> },
        { label: 'PF target', value: <span className="numeric">{formatRatio(site.targetPf)}</span> },
        {
          label: 'Tariff',
          value: (
            <>
              {tariffBasisLabels[site.tariffBasis]} <span className="numeric">{formatRatio(site.tariffLimit)}</span>
            </>
          ),
        },
        { label: 'Price of reactive energy', value: <Quantity value={site.pricePerKvarh} unit={`${site.currency}/kvarh`} maximumFractionDigits={4} /> },
        site.plannedLoadKw !== null && {
          label: 'Planned load',
          value: (
            <>
              <Quantity value={site.plannedLoadKw} unit="kW" />
              {site.plannedLoadPf !== null && <> at PF <span className="numeric">{formatRatio(site.plannedLoadPf)}</span></>}
            </>
          ),
        },
        { label: 'Time zone', value: site.timeZone },
      ]}
    />
  );
}

/** Installed kvar, steps and units over every bank of the site, from the register alone. */
function SiteSummary({ siteId }: { siteId: number }) {
  const { data: banks } = useSuspenseQuery(allBanksOf(siteId));
  const steps = useQueries({ queries: banks.items.map((bank) => stepQueries.ofBank(bank.id)) });
  const units = useQueries({ queries: banks.items.map((bank) => unitQueries.list({ bankId: bank.id, includeRemoved: false })) });
  const loading = steps.some((q) => q.isPending) || units.some((q) => q.isPending);
  const failed = steps.some((q) => q.isError) || units.some((q) => q.isError);
  const installedKvar = steps.reduce((sum, q) => sum + (q.data?.items.reduce((s, step) => s + step.ratedKvar, 0) ?? 0), 0);
  const stepCount = steps.reduce((sum, q) => sum + (q.data?.total ?? 0), 0);
  const unitCount = units.reduce((sum, q) => sum + (q.data?.total ?? 0), 0);

  if (failed) return <p role="alert">The summary could not be worked out: a bank's steps or units did not load.</p>;
  return (
    <dl aria-busy={loading} className="grid grid-cols-2 gap-3">
      {[
        { label: 'Installed', value: <Quantity value={loading ? null : installedKvar} unit="kvar" />, testId: 'site-installed-kvar' },
        { label: 'Banks', value: <span className="numeric">{banks.total}</span> },
        { label: 'Steps', value: <span className="numeric">{loading ? '…' : stepCount}</span> },
        { label: 'Capacitor units', value: <span className="numeric">{loading ? '…' : unitCount}</span> },
      ].map((fact) => (
        <div key={fact.label} className="rounded border border-line bg-paper p-3">
          <dt className="text-base text-ink-muted desk:text-sm">{fact.label}</dt>
          <dd data-testid={fact.testId} className="text-xl font-medium">
            {fact.value}
          </dd>
        </div>
      ))}
    </dl>
  );
}

export default function SitePage() {
  const siteId = idParam(useParams(), 'siteId');
  const { data: site } = useSuspenseQuery(siteQueries.detail(siteId));
  const [listParams, setListParams] = useListSearch(bankListOptions);
  const bankParams: BankListParams = { ...listParams, siteId };
  const banks = useSuspenseQuery(bankQueries.list(bankParams));
  const queryClient = useQueryClient();
  const update = useMutation(siteMutations.update(queryClient));
  const remove = useMutation(siteMutations.remove(queryClient));
  const navigate = useNavigate();

  return (
    <>
      <PageHeader
        eyebrow="Site"
        title={site.name}
        lead={site.address || undefined}
        actions={
          <RegisterWriteOnly>
            <LinkButton to={paths.register.editSite.getHref(site.id)}>Change the site</LinkButton>
            <LinkButton to={paths.register.newBank.getHref(site.id)} variant="primary">
              New bank
            </LinkButton>
          </RegisterWriteOnly>
        }
      />
      {site.retiredAt && (
        <p role="status" className="mb-6 rounded border border-line-strong bg-sunken p-3">
          Retired on {formatDate(site.retiredAt)}: kept in the records, left out of the lists.
        </p>
      )}
      <div className="grid gap-6">
        <div className="grid gap-6 desk:grid-cols-[3fr_2fr] desk:items-start">
          <PanelSection title="Supply">
            <SupplyFacts site={site} />
          </PanelSection>
          <PanelSection title="Summary">
            <SiteSummary siteId={site.id} />
            <p className="mt-3 text-base text-ink-muted desk:text-sm">Installed kvar is the sum of the steps' ratings. What the banks deliver comes with readings.</p>
          </PanelSection>
        </div>

        <PanelSection
          title="Banks"
          actions={
            <CsvExportButton
              fileName={fileNameOf(site.name, 'banks')}
              build={async () => tableToCsv(csvColumns, (await fetchAllBanks({ siteId, sort: listParams.sort, q: listParams.q })).items)}
            />
          }
        >
          <DataTable
            caption={`Banks of ${site.name}`}
            columns={columns}
            data={banks.data.items}
            total={banks.data.total}
            params={listParams}
            sorts={sorts}
            onParamsChange={setListParams}
            getRowId={(bank) => String(bank.id)}
            noun="banks"
            isFetching={banks.isFetching}
            empty="No banks yet."
          />
        </PanelSection>

        <RegisterWriteOnly>
          <RetirePanel
            noun="site"
            retired={site.retiredAt !== null}
            onRetire={(retired) => update.mutateAsync({ id: site.id, body: { version: site.version, retired } })}
            onDelete={async () => {
              await remove.mutateAsync(site.id);
              navigate(paths.register.sites.getHref());
            }}
          />
        </RegisterWriteOnly>
      </div>
    </>
  );
}
