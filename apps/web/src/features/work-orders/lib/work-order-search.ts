import { openWorkOrderStates, workOrderListQuery, workOrderStates, type WorkOrderState } from '@varden/schemas';
import type { z } from 'zod';
import { readListSearch, writeListSearch } from '../../../lib/server-table';

/** The work-order table's state as the URL holds it and GET /api/work-orders takes it. */
export type WorkOrderSearch = z.output<typeof workOrderListQuery>;

export const workOrderSearchKeys = ['page', 'pageSize', 'sort', 'q', 'state', 'siteId', 'bankId', 'assigneeId', 'dueFrom', 'dueTo', 'kind'] as const;
export const workOrderSearchDefaults = { page: 1, pageSize: 25, sort: 'dueOn' } as const satisfies Partial<WorkOrderSearch>;

/** The state filter's value for "every open order" (not sealed, not withdrawn). */
export const openStatesFilter = openWorkOrderStates.join(',');

export function readWorkOrderSearch(params: URLSearchParams): WorkOrderSearch {
  return readListSearch(workOrderListQuery, params, workOrderSearchKeys);
}

/** The search as URL parameters, leaving out the defaults: for the page's URL and the API's query. */
export function writeWorkOrderSearch(search: Partial<WorkOrderSearch>): URLSearchParams {
  const { assigneeId, ...rest } = search;
  return writeListSearch({ ...rest, assigneeId: assigneeId === undefined ? undefined : String(assigneeId) }, workOrderSearchDefaults);
}

/** The same filters for the CSV export: everything but paging. */
export function exportSearch(search: WorkOrderSearch): URLSearchParams {
  const params = writeWorkOrderSearch({ ...search, page: 1, pageSize: workOrderSearchDefaults.pageSize });
  return params;
}

/** The states a filter value names: one, several (comma list) or none (any state). */
export function statesOf(filter: string | undefined): WorkOrderState[] {
  if (!filter) return [];
  return filter.split(',').filter((s): s is WorkOrderState => (workOrderStates as readonly string[]).includes(s));
}

/** A count of filters that narrow the list, for the empty-table message. */
export function isFiltered(search: WorkOrderSearch): boolean {
  return Boolean(search.q || search.state || search.siteId || search.bankId || search.assigneeId || search.dueFrom || search.dueTo || search.kind);
}
