import { useQuery } from '@tanstack/react-query';
import { createColumnHelper } from '@tanstack/react-table';
import { workOrderKinds, workOrderSorts, workOrderStates, type WorkOrder } from '@varden/schemas';
import { useId, useRef, useState, type FormEvent, type ReactNode } from 'react';
import { Link } from 'react-router-dom';
import { DataTable } from '../../../components/data-table';
import { controlClass } from '../../../components/form/field-parts';
import { Pager } from '../../../components/pager';
import { classNames } from '../../../lib/class-names';
import { useServerTable } from '../../../lib/use-server-table';
import { siteQueries } from '../../register/api/site-queries';
import { technicians } from '../api/technician-queries';
import { formatCalendarDate } from '../lib/calendar-date';
import { isFiltered, openStatesFilter, workOrderSearchDefaults, type WorkOrderSearch } from '../lib/work-order-search';
import { kindLabels, priorityLabels, stateLabels } from '../lib/work-order-words';
import { paths } from '../../../config/paths';
import { OverdueMark, StateMark } from './state-mark';

const column = createColumnHelper<WorkOrder>();

const sorts = workOrderSorts;

export function DueDate({ order }: { order: Pick<WorkOrder, 'dueOn' | 'overdue'> }) {
  return (
    <span className="inline-flex flex-wrap items-baseline gap-x-2">
      <time dateTime={order.dueOn} className="numeric whitespace-nowrap">
        {formatCalendarDate(order.dueOn)}
      </time>
      {order.overdue && <OverdueMark />}
    </span>
  );
}

/** Why a supervisor sent the order back, under its state while it waits in sent-back. */
function ReturnReason({ order }: { order: WorkOrder }) {
  if (order.state !== 'sent-back') return null;
  return (
    <span className="mt-1 block max-w-[22rem] text-base text-ink-muted desk:text-sm" data-testid="return-reason">
      <span className="font-medium text-ink">Why: </span>
      {order.returnReason || 'no reason given'}
    </span>
  );
}

function Assignee({ name }: { name: string | null }) {
  return name ? <span>{name}</span> : <span className="text-ink-muted">Not assigned</span>;
}

const columns = [
  column.accessor('title', {
    id: 'title',
    header: 'Order',
    enableSorting: false,
    cell: ({ row }) => {
      const order = row.original;
      return (
        <>
          <Link to={paths.workOrders.detail.getHref(order.id)} className="font-medium">
            <span className="numeric text-ink-muted">#{order.id}</span> {order.title}
          </Link>
          {/* On a phone the row is one column: the other facts stack under the title. */}
          <span className="mt-1 grid gap-1 text-base desk:hidden">
            <StateMark state={order.state} />
            <ReturnReason order={order} />
            <span>
              Due <DueDate order={order} />
            </span>
            <span className="text-ink-muted">
              {order.siteName} · {order.bankName}
            </span>
            <span>
              {kindLabels[order.kind]} · {priorityLabels[order.priority]} priority · <Assignee name={order.assigneeName} />
            </span>
          </span>
        </>
      );
    },
  }),
  column.accessor('state', {
    header: 'State',
    enableSorting: false,
    meta: { show: 'desk' },
    cell: ({ row }) => (
      <>
        <StateMark state={row.original.state} />
        <ReturnReason order={row.original} />
      </>
    ),
  }),
  column.accessor('dueOn', { header: 'Due', meta: { show: 'desk' }, cell: ({ row }) => <DueDate order={row.original} /> }),
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
  column.accessor('kind', { header: 'Kind', enableSorting: false, meta: { show: 'desk' }, cell: ({ getValue }) => kindLabels[getValue()] }),
  column.accessor('priority', { header: 'Priority', sortDescFirst: true, meta: { show: 'desk' }, cell: ({ getValue }) => priorityLabels[getValue()] }),
  column.accessor('assigneeName', { header: 'Technician', enableSorting: false, meta: { show: 'desk' }, cell: ({ getValue }) => <Assignee name={getValue()} /> }),
];

type WorkOrderTableProps = {
  search: WorkOrderSearch;
  onSearchChange: (next: WorkOrderSearch, options?: { replace?: boolean }) => void;
  list: { items: WorkOrder[]; total: number } | undefined;
  isFetching: boolean;
  /** Planners pick technicians by name; others filter by "me" or "not assigned". */
  canPickTechnician: boolean;
  /** Technicians filter their own orders. */
  canFilterMine: boolean;
};

const filterClass = classNames(controlClass, 'border-line-strong desk:text-sm');

function SearchBox({ value, onSearch }: { value: string; onSearch: (q: string, replace: boolean) => void }) {
  const id = useId();
  const [draft, setDraft] = useState(value);
  const [shown, setShown] = useState(value);
  const timer = useRef<number | undefined>(undefined);
  if (value !== shown) {
    setShown(value);
    setDraft(value);
  }
  const submit = (event: FormEvent) => {
    event.preventDefault();
    window.clearTimeout(timer.current);
    onSearch(draft, false);
  };
  return (
    <form role="search" onSubmit={submit} className="col-span-2 grid min-w-0 gap-1">
      <label htmlFor={id} className="font-medium">
        Search
      </label>
      <input
        id={id}
        type="search"
        value={draft}
        placeholder="Title or order number"
        autoComplete="off"
        onChange={(event) => {
          const q = event.target.value;
          setDraft(q);
          window.clearTimeout(timer.current);
          timer.current = window.setTimeout(() => onSearch(q, true), 350);
        }}
        className={filterClass}
      />
    </form>
  );
}

function Filter({ label, value, onChange, children }: { label: string; value: string; onChange: (value: string) => void; children: ReactNode }) {
  const id = useId();
  return (
    <div className="grid min-w-0 content-start gap-1">
      <label htmlFor={id} className="font-medium">
        {label}
      </label>
      <select id={id} value={value} onChange={(event) => onChange(event.target.value)} className={filterClass}>
        {children}
      </select>
    </div>
  );
}

function DateFilter({ label, value, onChange }: { label: string; value: string; onChange: (value: string | undefined) => void }) {
  const id = useId();
  return (
    <div className="grid min-w-0 content-start gap-1">
      <label htmlFor={id} className="font-medium">
        {label}
      </label>
      <input id={id} type="date" value={value} onChange={(event) => onChange(event.target.value || undefined)} className={filterClass} />
    </div>
  );
}

/** Filters above the table, each a URL parameter of the list endpoint. */
function WorkOrderFilters({ search, onSearchChange, canPickTechnician, canFilterMine }: Omit<WorkOrderTableProps, 'list' | 'isFetching'>) {
  const sites = useQuery(siteQueries.list({ page: 1, pageSize: 200, sort: 'name', q: '' }));
  const people = useQuery({ ...technicians.list(), enabled: canPickTechnician });
  const set = (changes: Partial<WorkOrderSearch>) => onSearchChange({ ...search, ...changes, page: 1 });
  const stateChoice = search.state ?? '';
  const knownStateChoice = stateChoice === '' || stateChoice === openStatesFilter || (workOrderStates as readonly string[]).includes(stateChoice);

  return (
    <div className="grid grid-cols-2 items-end gap-3 desk:grid-cols-4">
      <SearchBox value={search.q ?? ''} onSearch={(q, replace) => onSearchChange({ ...search, q: q.trim() || undefined, page: 1 }, { replace })} />
      <Filter label="State" value={stateChoice} onChange={(value) => set({ state: value || undefined })}>
        <option value="">Any state</option>
        <option value={openStatesFilter}>Open (not sealed or withdrawn)</option>
        {workOrderStates.map((state) => (
          <option key={state} value={state}>
            {stateLabels[state]}
          </option>
        ))}
        {!knownStateChoice && <option value={stateChoice}>{stateChoice.split(',').length} chosen states</option>}
      </Filter>
      <Filter label="Site" value={search.siteId ? String(search.siteId) : ''} onChange={(value) => set({ siteId: value ? Number(value) : undefined, bankId: undefined })}>
        <option value="">Any site</option>
        {(sites.data?.items ?? []).map((site) => (
          <option key={site.id} value={site.id}>
            {site.name}
          </option>
        ))}
      </Filter>
      <Filter
        label="Technician"
        value={search.assigneeId === undefined ? '' : String(search.assigneeId)}
        onChange={(value) => set({ assigneeId: value === '' ? undefined : value === 'me' || value === 'none' ? value : Number(value) })}
      >
        <option value="">Anyone</option>
        <option value="none">Not assigned</option>
        {canFilterMine && <option value="me">Assigned to me</option>}
        {(people.data ?? []).map((person) => (
          <option key={person.id} value={person.id}>
            {person.name}
          </option>
        ))}
      </Filter>
      <Filter label="Kind" value={search.kind ?? ''} onChange={(value) => set({ kind: workOrderKinds.find((k) => k === value) })}>
        <option value="">Any kind</option>
        {workOrderKinds.map((kind) => (
          <option key={kind} value={kind}>
            {kindLabels[kind]}
          </option>
        ))}
      </Filter>
      <DateFilter label="Due from" value={search.dueFrom ?? ''} onChange={(dueFrom) => set({ dueFrom })} />
      <DateFilter label="Due to" value={search.dueTo ?? ''} onChange={(dueTo) => set({ dueTo })} />
    </div>
  );
}

/** The work-order table: filters, sorting and pages on the server, all in the URL. */
export function WorkOrderTable({ search, onSearchChange, list, isFetching, canPickTechnician, canFilterMine }: WorkOrderTableProps) {
  const table = useServerTable({
    data: list?.items,
    total: list?.total,
    columns,
    getRowId: (order) => String(order.id),
    search,
    sorts: sorts,
    fallbackSort: workOrderSearchDefaults.sort,
    onSort: (sort) => onSearchChange({ ...search, sort, page: 1 }),
  });

  return (
    <div className="grid gap-3">
      <WorkOrderFilters search={search} onSearchChange={onSearchChange} canPickTechnician={canPickTechnician} canFilterMine={canFilterMine} />
      <DataTable
        table={table}
        caption="Work orders with their state, due date, site and bank, kind, priority and technician"
        busy={isFetching}
        empty={list === undefined ? 'Loading work orders…' : isFiltered(search) ? 'No work order matches these filters.' : 'No work orders yet.'}
      />
      <Pager
        page={search.page}
        pageSize={search.pageSize}
        total={list?.total ?? 0}
        noun="work orders"
        onPage={(page) => onSearchChange({ ...search, page })}
        onPageSize={(pageSize) => onSearchChange({ ...search, pageSize, page: 1 })}
      />
    </div>
  );
}
