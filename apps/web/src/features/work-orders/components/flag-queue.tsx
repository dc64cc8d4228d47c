import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { createColumnHelper } from '@tanstack/react-table';
import { flagSorts, flagStates, type Flag, type WorkOrder } from '@varden/schemas';
import { useId, useState, type ReactNode } from 'react';
import { Link } from 'react-router-dom';
import { Button } from '../../../components/button';
import { DataTable } from '../../../components/data-table';
import { controlClass } from '../../../components/form/field-parts';
import { FormAlert, FormSuccess } from '../../../components/form/form-alert';
import { Pager } from '../../../components/pager';
import { classNames } from '../../../lib/class-names';
import { formatDateTime } from '../../../lib/date-format';
import { useServerTable } from '../../../lib/use-server-table';
import { siteQueries } from '../../register/api/site-queries';
import { flagMutations, type FlagSearch } from '../api/flag-queries';
import { targetLabel } from '../lib/work-order-words';
import { paths } from '../../../config/paths';
import { FlagKind, Severity } from './flag-mark';

const column = createColumnHelper<Flag>();
const sorts = flagSorts;
const stateWords: Record<(typeof flagStates)[number], string> = { open: 'Open', 'in-hand': 'In hand', cleared: 'Cleared' };

function Raised({ at }: { at: string }) {
  return (
    <time dateTime={at} className="numeric whitespace-nowrap">
      {formatDateTime(at)}
    </time>
  );
}

type Opening = { flagId: number | null; opened: { flag: Flag; order: WorkOrder } | null; failure: string | null };

function FlagAction({ flag, canOpen, pendingId, onOpen }: { flag: Flag; canOpen: boolean; pendingId: number | null; onOpen: (flag: Flag) => void }) {
  if (flag.correctiveOrderId) {
    return (
      <Link to={paths.workOrders.detail.getHref(flag.correctiveOrderId)} className="inline-flex min-h-touch items-center whitespace-nowrap desk:min-h-0">
        Work order #{flag.correctiveOrderId}
      </Link>
    );
  }
  if (!canOpen || flag.state !== 'open') return <span className="text-ink-muted">—</span>;
  return (
    <Button variant="primary" className="whitespace-nowrap" disabled={pendingId !== null} onClick={() => onOpen(flag)} aria-label={`Open corrective order for: ${flag.message}`}>
      {pendingId === flag.id ? 'Opening…' : 'Open corrective order'}
    </Button>
  );
}

type FlagQueueProps = {
  search: FlagSearch;
  onSearchChange: (next: FlagSearch) => void;
  list: { items: Flag[]; total: number } | undefined;
  isFetching: boolean;
  canOpen: boolean;
};

function Filter({ label, value, onChange, children }: { label: string; value: string; onChange: (value: string) => void; children: ReactNode }) {
  const id = useId();
  return (
    <div className="grid min-w-0 content-start gap-1">
      <label htmlFor={id} className="font-medium">
        {label}
      </label>
      <select id={id} value={value} onChange={(e) => onChange(e.target.value)} className={classNames(controlClass, 'border-line-strong desk:text-sm')}>
        {children}
      </select>
    </div>
  );
}

/** The flag queue: what readings found, newest first, each turned into a corrective order in one action. */
export function FlagQueue({ search, onSearchChange, list, isFetching, canOpen }: FlagQueueProps) {
  const queryClient = useQueryClient();
  const open = useMutation(flagMutations.openCorrectiveOrder(queryClient));
  const sites = useQuery(siteQueries.list({ page: 1, pageSize: 200, sort: 'name', q: '' }));
  const [opening, setOpening] = useState<Opening>({ flagId: null, opened: null, failure: null });

  const onOpen = (flag: Flag) => {
    setOpening({ flagId: flag.id, opened: null, failure: null });
    open.mutate(
      { flagId: flag.id, body: {} },
      {
        onSuccess: (result) => setOpening({ flagId: null, opened: { flag: result.flag, order: result.workOrder }, failure: null }),
        onError: (error) => setOpening({ flagId: null, opened: null, failure: error.message }),
      },
    );
  };

  const columns = [
    column.accessor('kind', {
      header: 'Flag',
      enableSorting: false,
      cell: ({ row }) => {
        const flag = row.original;
        return (
          <>
            <FlagKind kind={flag.kind} />
            <span className="mt-1 grid gap-1 text-base desk:hidden">
              <Severity severity={flag.severity} />
              <span className="[overflow-wrap:anywhere]">{flag.message}</span>
              <span className="text-ink-muted">
                {flag.siteName} · {flag.bankName} · {targetLabel(flag.target)}
              </span>
              <span className="text-ink-muted">
                Raised <Raised at={flag.raisedAt} />
              </span>
              <span>
                <FlagAction flag={flag} canOpen={canOpen} pendingId={opening.flagId} onOpen={onOpen} />
              </span>
            </span>
          </>
        );
      },
    }),
    column.accessor('severity', { header: 'Severity', sortDescFirst: false, meta: { show: 'desk' }, cell: ({ getValue }) => <Severity severity={getValue()} /> }),
    column.accessor('siteName', {
      header: 'Site and bank',
      enableSorting: false,
      meta: { show: 'desk' },
      cell: ({ row }) => (
        <span className="grid">
          <span>{row.original.siteName}</span>
          <span className="text-sm text-ink-muted">{row.original.bankName}</span>
        </span>
      ),
    }),
    column.accessor('target', { header: 'Target', enableSorting: false, meta: { show: 'desk' }, cell: ({ getValue }) => targetLabel(getValue()) }),
    column.accessor('message', { header: 'Message', enableSorting: false, meta: { show: 'desk' }, cell: ({ getValue }) => <span className="[overflow-wrap:anywhere]">{getValue()}</span> }),
    column.accessor('raisedAt', { header: 'Raised', sortDescFirst: true, meta: { show: 'desk' }, cell: ({ getValue }) => <Raised at={getValue()} /> }),
    column.display({
      id: 'action',
      header: 'Corrective order',
      meta: { show: 'desk' },
      cell: ({ row }) => <FlagAction flag={row.original} canOpen={canOpen} pendingId={opening.flagId} onOpen={onOpen} />,
    }),
  ];

  const table = useServerTable({
    data: list?.items,
    total: list?.total,
    columns,
    getRowId: (flag) => String(flag.id),
    search,
    sorts: sorts,
    fallbackSort: '-raisedAt',
    onSort: (sort) => onSearchChange({ ...search, sort, page: 1 }),
  });

  const set = (changes: Partial<FlagSearch>) => onSearchChange({ ...search, ...changes, page: 1 });

  return (
    <div className="grid gap-3">
      <div className="grid grid-cols-2 items-end gap-3 desk:grid-cols-4">
        <Filter label="State" value={search.state ?? 'any'} onChange={(v) => set({ state: flagStates.find((s) => s === v) })}>
          {flagStates.map((state) => (
            <option key={state} value={state}>
              {stateWords[state]}
            </option>
          ))}
          <option value="any">Any state</option>
        </Filter>
        <Filter label="Severity" value={search.severity ?? ''} onChange={(v) => set({ severity: v === 'action' || v === 'advisory' ? v : undefined })}>
          <option value="">Any severity</option>
          <option value="action">Action</option>
          <option value="advisory">Advisory</option>
        </Filter>
        <Filter label="Site" value={search.siteId ? String(search.siteId) : ''} onChange={(v) => set({ siteId: v ? Number(v) : undefined, bankId: undefined })}>
          <option value="">Any site</option>
          {(sites.data?.items ?? []).map((site) => (
            <option key={site.id} value={site.id}>
              {site.name}
            </option>
          ))}
        </Filter>
      </div>
      {opening.opened && (
        <FormSuccess>
          Corrective order{' '}
          <Link to={paths.workOrders.detail.getHref(opening.opened.order.id)}>
            #{opening.opened.order.id} {opening.opened.order.title}
          </Link>{' '}
          is open and queued for {opening.opened.order.bankName}. Dispatch it from its page.
        </FormSuccess>
      )}
      {opening.failure && <FormAlert>Could not open the corrective order: {opening.failure}</FormAlert>}
      <DataTable
        table={table}
        caption="Flags raised by readings, with severity, site, bank, target, message and when they were raised"
        busy={isFetching}
        empty={list === undefined ? 'Loading flags…' : search.state === 'open' ? 'No open flags: nothing waits for a corrective order.' : 'No flag matches these filters.'}
      />
      <Pager
        page={search.page}
        pageSize={search.pageSize}
        total={list?.total ?? 0}
        noun="flags"
        onPage={(page) => onSearchChange({ ...search, page })}
        onPageSize={(pageSize) => onSearchChange({ ...search, pageSize, page: 1 })}
      />
    </div>
  );
}
