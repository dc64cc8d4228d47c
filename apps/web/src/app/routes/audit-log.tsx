import type { QueryClient } from '@tanstack/react-query';
import { useQuery } from '@tanstack/react-query';
import { useCallback } from 'react';
import { Link, useSearchParams, type LoaderFunctionArgs } from 'react-router-dom';
import { PageHeader } from '../../components/page-header';
import { paths } from '../../config/paths';
import { requirePermission } from '../../features/auth/lib/route-guards';
import { auditLog } from '../../features/users/api/audit-log-queries';
import { siteChoices } from '../../features/users/api/site-choices-queries';
import { AuditLogTable } from '../../features/users/components/audit-log-table';
import { readAuditLogSearch, writeAuditLogSearch, type AuditLogSearch } from '../../features/users/lib/audit-log-search';

export const clientLoader =
  (queryClient: QueryClient) =>
  async ({ request }: LoaderFunctionArgs) => {
    await requirePermission(queryClient, request, 'audit-log:read');
    void queryClient.prefetchQuery(siteChoices.list());
    await queryClient.ensureQueryData(auditLog.list(readAuditLogSearch(new URL(request.url).searchParams)));
    return null;
  };

function filterText(search: AuditLogSearch): string | undefined {
  const parts = [
    search.targetType === 'user' && search.targetId !== undefined ? `changes to person ${search.targetId}` : undefined,
    search.targetType && search.targetType !== 'user' ? `changes to ${search.targetType} ${search.targetId ?? ''}`.trim() : undefined,
    search.actorId !== undefined ? `changes made by person ${search.actorId}` : undefined,
    search.action ? `action ${search.action}` : undefined,
  ].filter(Boolean);
  return parts.length > 0 ? parts.join(', ') : undefined;
}

/** Every change to people and their access: who made it, when, and what it was. */
export default function AuditLogRoute() {
  const [params, setParams] = useSearchParams();
  const search = readAuditLogSearch(params);
  const log = useQuery(auditLog.list(search));
  const sites = useQuery(siteChoices.list());
  const siteItems = sites.data?.items;
  const siteName = useCallback((id: number) => siteItems?.find((site) => site.id === id)?.name, [siteItems]);
  const filtered = filterText(search);

  return (
    <>
      <PageHeader title="Audit log" lead="Every change to people and their access: who made it, when, and what changed. Newest first." />
      {filtered && (
        <p className="mb-4 flex flex-wrap gap-x-3">
          <span>
            Showing only {filtered}.
          </span>
          <Link to={paths.auditLog.getHref()}>Show every change</Link>
        </p>
      )}
      {log.isError && !log.data ? (
        <p role="alert">Could not load the audit log: {log.error.message}</p>
      ) : (
        <AuditLogTable
          search={search}
          onSearchChange={(next) => setParams(writeAuditLogSearch(next), { preventScrollReset: true })}
          log={log.data}
          isFetching={log.isFetching}
          siteName={siteName}
        />
      )}
    </>
  );
}
