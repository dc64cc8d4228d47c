import { createColumnHelper, getCoreRowModel, getSortedRowModel, useReactTable, type SortingState } from '@tanstack/react-table';
import type { FleetOverview } from '@varden/schemas';
import { useState, type ReactNode } from 'react';
import { Link } from 'react-router-dom';
import { ConditionGlyph } from '../../../components/condition-glyph';
import { DataTable } from '../../../components/data-table';
import { fleetLinks } from '../lib/fleet-links';
import { BandCounts } from './band-counts';

type FleetSite = FleetOverview['sites'][number];

const column = createColumnHelper<FleetSite>();
/** A header in two lines (the table keeps header text on one line), so eleven columns fit a desk. */
const twoLines = (first: ReactNode, second: ReactNode) => (
  <span className="inline-flex flex-col items-end leading-tight">
    <span>{first}</span>
    <span>{second}</span>
  </span>
);
const count = (n: number) => <span className={n > 0 ? 'numeric font-semibold' : 'numeric text-ink-muted'}>{n}</span>;

const columns = [
  column.accessor('siteName', {
    header: 'Site',
    cell: ({ row }) => (
      <span className="grid min-w-[9rem] gap-1 desk:min-w-[11rem]">
        <Link to={fleetLinks.siteHealth(row.original.siteId)} className="font-medium">
          {row.original.siteName}
        </Link>
        {/* On a phone the band columns are left out and every count shows here; on a desk, those without risk. */}
        <BandCounts bands={row.original.bands} className="gap-x-3 text-base desk:hidden" />
        <BandCounts bands={row.original.bands} only={['healthy', 'noReading']} className="hidden gap-x-3 text-sm text-ink-muted desk:flex" />
      </span>
    ),
  }),
  column.accessor('risk', {
    header: () => twoLines('Risk', 'points'),
    meta: { align: 'end' },
    sortDescFirst: true,
    cell: ({ getValue }) => <span className="numeric text-lg font-semibold">{getValue()}</span>,
  }),
  column.accessor((site) => site.bands.replace, {
    id: 'replace',
    header: () => <ConditionGlyph band="replace" className="flex-col gap-0.5 leading-tight" />,
    meta: { align: 'end', show: 'desk' },
    sortDescFirst: true,
    cell: ({ getValue }) => count(getValue()),
  }),
  column.accessor((site) => site.bands.remeasure, {
    id: 'remeasure',
    header: () => <ConditionGlyph band="remeasure" className="flex-col gap-0.5 leading-tight" />,
    meta: { align: 'end', show: 'desk' },
    sortDescFirst: true,
    cell: ({ getValue }) => count(getValue()),
  }),
  column.accessor((site) => site.bands.watch, {
    id: 'watch',
    header: () => <ConditionGlyph band="watch" className="flex-col gap-0.5 leading-tight" />,
    meta: { align: 'end', show: 'desk' },
    sortDescFirst: true,
    cell: ({ getValue }) => count(getValue()),
  }),
  column.accessor('openActionFlags', { header: () => twoLines('Action', 'flags'), meta: { align: 'end' }, sortDescFirst: true, cell: ({ getValue }) => count(getValue()) }),
  column.accessor('stepsNearHarmonic', { header: () => twoLines('Steps near', 'a harmonic'), meta: { align: 'end' }, sortDescFirst: true, cell: ({ getValue }) => count(getValue()) }),
  column.accessor('overdueOrders', { header: () => twoLines('Overdue', 'orders'), meta: { align: 'end' }, sortDescFirst: true, cell: ({ getValue }) => count(getValue()) }),
  column.accessor('projectedReplacements', { header: () => twoLines('To replace', 'in 12 months'), meta: { align: 'end' }, sortDescFirst: true, cell: ({ getValue }) => count(getValue()) }),
];

/** "Sites by risk": every site the reader may see, ranked by the server; any column re-sorts it here. */
export function FleetSiteTable({ sites, empty }: { sites: FleetOverview['sites']; empty: string }) {
  const [sorting, setSorting] = useState<SortingState>([]);
  // TanStack Table's instance is not memoisable by the React Compiler; the table redraws with its state.
  // eslint-disable-next-line react-hooks/incompatible-library
  const table = useReactTable({
    data: sites,
    columns,
    state: { sorting },
    onSortingChange: setSorting,
    getCoreRowModel: getCoreRowModel(),
    getSortedRowModel: getSortedRowModel(),
    getRowId: (site) => String(site.siteId),
  });
  return <DataTable table={table} caption="Sites ranked by risk" empty={empty} />;
}
