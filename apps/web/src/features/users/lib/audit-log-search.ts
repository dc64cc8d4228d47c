import { auditLogQuery } from '@varden/schemas';
import type { z } from 'zod';
import { readListSearch, writeListSearch } from '../../../lib/server-table';

/** The audit log's state as the URL holds it and GET /api/audit-log takes it. */
export type AuditLogSearch = z.output<typeof auditLogQuery>;

const keys = ['page', 'pageSize', 'actorId', 'targetType', 'targetId', 'action'] as const;
export const auditLogSearchDefaults = { page: 1, pageSize: 50 } as const satisfies Partial<AuditLogSearch>;

export function readAuditLogSearch(params: URLSearchParams): AuditLogSearch {
  return readListSearch(auditLogQuery, params, keys);
}

export function writeAuditLogSearch(search: AuditLogSearch): URLSearchParams {
  return writeListSearch(search, auditLogSearchDefaults);
}
