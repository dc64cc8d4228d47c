import { createColumnHelper } from '@tanstack/react-table';
import { roles, userSorts, userStatuses, type User, type UserList } from '@varden/schemas';
import { useId, useRef, useState, type FormEvent } from 'react';
import { Link } from 'react-router-dom';
import { DataTable } from '../../../components/data-table';
import { controlClass } from '../../../components/form/field-parts';
import { Pager } from '../../../components/pager';
import { paths } from '../../../config/paths';
import { classNames } from '../../../lib/class-names';
import { formatDate, formatDateTime } from '../../../lib/date-format';
import { useServerTable } from '../../../lib/use-server-table';
import { roleLabels, roleList } from '../../auth/lib/role-labels';
import { peopleSearchDefaults, type PeopleSearch } from '../lib/people-search';
import { AccountStatus, accountStatusLabels } from './account-status';

const column = createColumnHelper<User>();

/** An address that, when it must wrap, wraps after the @ rather than anywhere. */
function Email({ address, className }: { address: string; className?: string }) {
  const at = address.indexOf('@');
  if (at < 0) return <span className={classNames('break-all', className)}>{address}</span>;
  return (
    <span className={classNames('[overflow-wrap:anywhere]', className)}>
      {address.slice(0, at)}
      <wbr />
      {address.slice(at)}
    </span>
  );
}

/** The member of a list of literals that equals the value, typed as that literal; undefined for "any". */
const pick = <T extends string>(options: readonly T[], value: string): T | undefined => options.find((option) => option === value);

const columns = [
  column.accessor('name', {
    header: 'Name',
    cell: ({ row }) => {
      const person = row.original;
      return (
        <>
          <Link to={paths.person.getHref(person.id)} className="font-medium">
            {person.name}
          </Link>
          {/* On a phone the row is one column: the other facts stack under the name. */}
          <span className="mt-1 grid gap-1 text-base desk:hidden">
            <Email address={person.email} className="text-ink-muted" />
            <span>{roleList(person.roles) || 'No role'}</span>
            <AccountStatus status={person.status} />
          </span>
        </>
      );
    },
  }),
  column.accessor('email', { header: 'E-mail', meta: { show: 'desk' }, cell: ({ getValue }) => <Email address={getValue()} /> }),
  column.accessor('roles', { header: 'Roles', enableSorting: false, meta: { show: 'desk' }, cell: ({ getValue }) => roleList(getValue()) || '—' }),
  column.accessor('status', {
    header: 'Sign-in',
    enableSorting: false,
    meta: { show: 'desk' },
    cell: ({ getValue }) => <AccountStatus status={getValue()} />,
  }),
  column.accessor('lastSignInAt', {
    header: 'Last signed in',
    sortDescFirst: true,
    meta: { show: 'desk' },
    cell: ({ getValue }) => {
      const at = getValue();
      return at ? (
        <time dateTime={at} title={formatDateTime(at)} className="numeric whitespace-nowrap">
          {formatDate(at)}
        </time>
      ) : (
        <span className="text-ink-muted">Never</span>
      );
    },
  }),
  column.accessor('createdAt', {
    header: 'Added',
    sortDescFirst: true,
    meta: { show: 'desk' },
    cell: ({ getValue }) => (
      <time dateTime={getValue()} className="numeric whitespace-nowrap">
        {formatDate(getValue())}
      </time>
    ),
  }),
];

type PeopleTableProps = {
  search: PeopleSearch;
  /** `replace`: typing in the search box replaces the history entry instead of adding one. */
  onSearchChange: (next: PeopleSearch, options?: { replace?: boolean }) => void;
  list: UserList | undefined;
  isFetching: boolean;
};

const selectClass = classNames(controlClass, 'border-line-strong desk:w-auto desk:text-sm');

function SearchBox({ value, onSearch }: { value: string; onSearch: (q: string, replace: boolean) => void }) {
  const id = useId();
  const [draft, setDraft] = useState(value);
  const [shown, setShown] = useState(value);
  const [sent, setSent] = useState(value);
  const timer = useRef<number | undefined>(undefined);
  // The URL's search changed. When it is not the one typed here (back button, a link), show it;
  // when it is, keep the box as it is, since typing may have gone on while the page loaded.
  if (value !== shown) {
    setShown(value);
    if (value !== sent) setDraft(value);
  }
  const search = (q: string, replace: boolean) => {
    setSent(q.trim());
    onSearch(q, replace);
  };
  const submit = (event: FormEvent) => {
    event.preventDefault();
    window.clearTimeout(timer.current);
    search(draft, false);
  };
  return (
    <form role="search" onSubmit={submit} className="col-span-2 grid min-w-0 gap-1 desk:col-span-1 desk:flex-1">
      <label htmlFor={id} className="font-medium">
        Search
      </label>
      <input
        id={id}
        type="search"
        value={draft}
        placeholder="Name or e-mail"
        autoComplete="off"
        onChange={(event) => {
          const q = event.target.value;
          setDraft(q);
          window.clearTimeout(timer.current);
          timer.current = window.setTimeout(() => search(q, true), 350);
        }}
        className={classNames(controlClass, 'border-line-strong')}
      />
    </form>
  );
}

/** The people table: search, filters, sorting and pages all on the server, all in the URL. */
export function PeopleTable({ search, onSearchChange, list, isFetching }: PeopleTableProps) {
  const roleId = useId();
  const statusId = useId();
  const table = useServerTable({
    data: list?.items,
    total: list?.total,
    columns,
    getRowId: (person) => String(person.id),
    search,
    sorts: userSorts,
    fallbackSort: peopleSearchDefaults.sort,
    onSort: (sort) => onSearchChange({ ...search, sort, page: 1 }),
  });

  return (
    <div className="grid gap-3">
      <div className="grid grid-cols-2 items-end gap-3 desk:flex">
        <SearchBox value={search.q ?? ''} onSearch={(q, replace) => onSearchChange({ ...search, q: q.trim() || undefined, page: 1 }, { replace })} />
        <div className="grid gap-1">
          <label htmlFor={roleId} className="font-medium">
            Role
          </label>
          <select
            id={roleId}
            value={search.role ?? ''}
            onChange={(event) => onSearchChange({ ...search, role: pick(roles, event.target.value), page: 1 })}
            className={selectClass}
          >
            <option value="">Any role</option>
            {roles.map((role) => (
              <option key={role} value={role}>
                {roleLabels[role]}
              </option>
            ))}
          </select>
        </div>
        <div className="grid gap-1">
          <label htmlFor={statusId} className="font-medium">
            Sign-in
          </label>
          <select
            id={statusId}
            value={search.status ?? ''}
            onChange={(event) => onSearchChange({ ...search, status: pick(userStatuses, event.target.value), page: 1 })}
            className={selectClass}
          >
            <option value="">Any state</option>
            {userStatuses.map((status) => (
              <option key={status} value={status}>
                {accountStatusLabels[status]}
              </option>
            ))}
          </select>
        </div>
      </div>
      <DataTable
        table={table}
        caption="People who can use Varden, with their roles and whether they may sign in"
        busy={isFetching}
        empty={list === undefined ? 'Loading people…' : search.q || search.role || search.status ? 'Nobody matches this search.' : 'Nobody yet.'}
      />
      <Pager
        page={search.page}
        pageSize={search.pageSize}
        total={list?.total ?? 0}
        noun="people"
        onPage={(page) => onSearchChange({ ...search, page })}
        onPageSize={(pageSize) => onSearchChange({ ...search, pageSize, page: 1 })}
      />
    </div>
  );
}
