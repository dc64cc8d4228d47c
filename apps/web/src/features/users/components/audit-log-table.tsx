import { createColumnHelper } from '@tanstack/react-table';
import type { AuditEntry, AuditLog } from '@varden/schemas';
import { useMemo } from 'react';
import { Link } from 'react-router-dom';
import { DataTable } from '../../../components/data-table';
import { Pager } from '../../../components/pager';
import { paths } from '../../../config/paths';
import { formatDateTime } from '../../../lib/date-format';
import { useServerTable } from '../../../lib/use-server-table';
import type { AuditLogSearch } from '../lib/audit-log-search';
import { describeAuditEntry, type SiteNamer } from '../lib/describe-audit-entry';

const column = createColumnHelper<AuditEntry>();

function Target({ entry }: { entry: AuditEntry }) {
  if (entry.targetType === 'user' && entry.targetId !== null) {
    return (
      <Link to={paths.person.getHref(entry.targetId)} className="whitespace-nowrap">
        Person {entry.targetId}
      </Link>
    );
  }
  return (
    <span>
      {entry.targetType}
      {entry.targetId !== null ? ` ${entry.targetId}` : ''}
    </span>
  );
}

function columnsFor(siteName: SiteNamer) {
  return [
    column.accessor('at', {
      header: 'When',
      cell: ({ getValue }) => <span className="numeric whitespace-nowrap">{formatDateTime(getValue())}</span>,
    }),
    column.accessor('actor', {
      header: 'Who',
      cell: ({ getValue }) => {
        const actor = getValue();
        return actor ? <Link to={paths.person.getHref(actor.id)}>{actor.name}</Link> : <span className="text-ink-muted">Varden</span>;
      },
    }),
    column.display({
      id: 'what',
      header: 'What',
      cell: ({ row }) => {
        const { what, lines } = describeAuditEntry(row.original, siteName);
        return (
          <>
            <span className="font-medium">{what}</span>
            {lines.length > 0 && (
              <ul className="mt-0.5 text-base text-ink-muted desk:text-sm">
                {lines.map((line) => (
                  <li key={line} className="break-words">
                    {line}
                  </li>
                ))}
              </ul>
            )}
          </>
        );
      },
    }),
    column.display({ id: 'target', header: 'Changed', meta: { show: 'desk' }, cell: ({ row }) => <Target entry={row.original} /> }),
  ];
}

type AuditLogTableProps = {
  search: AuditLogSearch;
  onSearchChange: (next: AuditLogSearch) => void;
  log: AuditLog | undefined;
  isFetching: boolean;
  siteName: SiteNamer;
};

/** The audit log, newest first, a page at a time from the server. */
export function AuditLogTable({ search, onSearchChange, log, isFetching, siteName }: AuditLogTableProps) {
  const columns = useMemo(() => columnsFor(siteName), [siteName]);
   
  const table = useServerTable({ data: log?.items, total: log?.total, columns, getRowId: (entry) => String(entry.id), search });
  return (
    <>
      <DataTable
        table={table}
        caption="Changes to people and their access, newest first"
        busy={isFetching}
        empty={log === undefined ? 'Loading the audit log…' : 'No changes recorded here yet.'}
      />
      <Pager
        page={search.page}
        pageSize={search.pageSize}
        total={log?.total ?? 0}
        noun="entries"
        pageSizes={[50, 100, 200]}
        onPage={(page) => onSearchChange({ ...search, page })}
        onPageSize={(pageSize) => onSearchChange({ ...search, pageSize, page: 1 })}
      />
    </>
  );
}
