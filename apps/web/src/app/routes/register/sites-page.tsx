import { useSuspenseQuery, type QueryClient } from '@tanstack/react-query';
import type { Site } from '@varden/schemas';
import { createColumnHelper } from '@tanstack/react-table';
import { useCallback } from 'react';
import { Link, type LoaderFunctionArgs } from 'react-router-dom';
import { PageHeader } from '../../../components/page-header';
import { Quantity } from '../../../components/quantity';
import { fetchAllSites, siteQueries, type SiteListParams, type SiteSort } from '../../../features/register/api/site-queries';
import { CsvExportButton } from '../../../features/register/components/csv-export-button';
import { DataTable } from '../../../features/register/components/data-table';
import { formatRatio } from '../../../features/register/components/formats';
import { LinkButton } from '../../../features/register/components/link-button';
import { readListParams, useListSearch } from '../../../features/register/components/list-search';
import { SearchBox } from '../../../features/register/components/search-box';
import { RegisterWriteOnly } from '../../../features/register/components/write-gate';
import { tableToCsv, type CsvColumn } from '../../../features/register/csv/table-csv';
import { paths } from '../../../config/paths';
import { allowed } from './route-helpers';

const sorts = ['name', '-name', 'voltageV', '-voltageV', 'createdAt', '-createdAt'] as const satisfies readonly SiteSort[];
const listOptions = { sorts, defaultSort: 'name' as const };

export const clientLoader =
  (queryClient: QueryClient) =>
  async ({ request }: LoaderFunctionArgs) => {
    await allowed(queryClient, request);
    const params: SiteListParams = readListParams(new URL(request.url).searchParams, listOptions);
    await queryClient.ensureQueryData(siteQueries.list(params));
    return null;
  };

const column = createColumnHelper<Site>();
const columns = [
  column.accessor((site): unknown => site.name, {
    id: 'name',
    header: 'Site',
    cell: ({ row }) => (
      <span className="grid">
        <Link to={paths.register.site.getHref(row.original.id)} className="font-medium">
          {row.original.name}
        </Link>
        {row.original.address && <span className="text-base text-ink-muted desk:text-sm">{row.original.address}</span>}
      </span>
    ),
  }),
  column.accessor((site): unknown => site.voltageV, {
    id: 'voltageV',
    header: 'Voltage',
    meta: { align: 'end' },
    cell: ({ row }) => <Quantity value={row.original.voltageV} unit="V" />,
  }),
  column.display({
    id: 'frequencyHz',
    header: 'Frequency',
    meta: { align: 'end' },
    cell: ({ row }) => <Quantity value={row.original.frequencyHz} unit="Hz" />,
  }),
  column.display({
    id: 'transformerKva',
    header: 'Transformer',
    meta: { align: 'end' },
    cell: ({ row }) => <Quantity value={row.original.transformerKva} unit="kVA" />,
  }),
  column.display({
    id: 'targetPf',
    header: 'PF target',
    meta: { align: 'end' },
    cell: ({ row }) => <span className="numeric">{formatRatio(row.original.targetPf)}</span>,
  }),
  column.display({
    id: 'bankCount',
    header: 'Banks',
    meta: { align: 'end' },
    cell: ({ row }) => <span className="numeric">{row.original.bankCount}</span>,
  }),
];

const csvColumns: CsvColumn<Site>[] = [
  { header: 'site', value: (site) => site.name },
  { header: 'address', value: (site) => site.address },
  { header: 'voltage_v', value: (site) => site.voltageV },
  { header: 'frequency_hz', value: (site) => site.frequencyHz },
  { header: 'transformer_kva', value: (site) => site.transformerKva },
  { header: 'transformer_impedance_pct', value: (site) => site.transformerImpedancePct },
  { header: 'pf_target', value: (site) => site.targetPf },
  { header: 'banks', value: (site) => site.bankCount },
];

/** Site register: every site the person may see, searched, sorted and paged by the server. */
export default function SitesPage() {
  const [params, setParams] = useListSearch(listOptions);
  // The loader has the page in the cache before this renders, for every change of the URL.
  const sites = useSuspenseQuery(siteQueries.list(params));
  const page = sites.data;
  const onSearch = useCallback((q: string) => setParams({ q }), [setParams]);

  return (
    <>
      <PageHeader
        eyebrow="Register"
        title="Sites"
        lead="Each site with its network and supply; open one for its banks."
        actions={
          <>
            <CsvExportButton
              fileName={params.q ? `sites-${params.q}` : 'sites'}
              build={async () => tableToCsv(csvColumns, (await fetchAllSites({ sort: params.sort, q: params.q })).items)}
            />
            <RegisterWriteOnly>
              <LinkButton to={paths.register.newSite.getHref()} variant="primary">
                New site
              </LinkButton>
            </RegisterWriteOnly>
          </>
        }
      />
      <div className="grid gap-4">
        <SearchBox label="Search sites by name" value={params.q} onSearch={onSearch} />
        <DataTable
          caption="Sites in the register"
          columns={columns}
          data={page.items}
          total={page.total}
          params={params}
          sorts={sorts}
          onParamsChange={setParams}
          getRowId={(site) => String(site.id)}
          noun="sites"
          isFetching={sites.isFetching}
          empty={params.q ? `No site matches “${params.q}”.` : 'No sites yet.'}
        />
      </div>
    </>
  );
}
