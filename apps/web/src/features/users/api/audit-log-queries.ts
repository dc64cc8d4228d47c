import { keepPreviousData, queryOptions } from '@tanstack/react-query';
import { auditLog as auditLogResponse, type AuditLog } from '@varden/schemas';
import { apiRequest } from '../../../lib/api-client';
import { writeAuditLogSearch, type AuditLogSearch } from '../lib/audit-log-search';

function listAuditLog(search: AuditLogSearch, signal: AbortSignal): Promise<AuditLog> {
  // The defaults left out are the API's own, so the request means the same as the URL.
  const query = writeAuditLogSearch(search);
  return apiRequest(`/api/audit-log?${query.toString()}`, { parse: (json) => auditLogResponse.parse(json), signal });
}

/** The audit log (GET /api/audit-log): who changed what about people and access, newest first. */
export const auditLog = {
  all: ['audit-log'] as const,
  lists: () => [...auditLog.all, 'list'] as const,
  list: (search: AuditLogSearch) =>
    queryOptions({
      queryKey: [...auditLog.lists(), search] as const,
      queryFn: ({ signal }) => listAuditLog(search, signal),
      placeholderData: keepPreviousData,
      meta: { subject: 'audit log' },
    }),
};
