import { queryOptions } from '@tanstack/react-query';
import { listResponse, workOrder, workOrderDetail, type WorkOrder, type WorkOrderDetail, type WorkOrderState } from '@varden/schemas';
import { createStore, get, set } from 'idb-keyval';
import { apiRequest, isApiError } from '../../../lib/api-client';

/** The states a technician has work in: to start, recording, or returned to them. */
export const fieldStates = ['dispatched', 'on-site', 'sent-back'] as const satisfies readonly WorkOrderState[];

const orderList = listResponse(workOrder);
type OrderList = { items: WorkOrder[]; total: number };

/**
 * The last copy of what the phone read, in IndexedDB, so an order opened with signal still
 * opens after a reload in a switch-room without it. Only used when the server cannot be reached.
 */
let copies: ReturnType<typeof createStore> | null = null;
const copyStore = () => (copies ??= createStore('varden-field-copies', 'copies'));

async function withOfflineCopy<T>(key: string, load: () => Promise<T>, parse: (json: unknown) => T): Promise<T> {
  try {
    const fresh = await load();
    if (typeof indexedDB !== 'undefined') void set(key, fresh, copyStore()).catch(() => undefined);
    return fresh;
  } catch (error) {
    if (!isApiError(error) || !error.isUnreachable || typeof indexedDB === 'undefined') throw error;
    const copy: unknown = await get(key, copyStore()).catch(() => undefined);
    if (copy === undefined) throw error;
    return parse(copy);
  }
}

export function fetchMyOrders(signal?: AbortSignal): Promise<OrderList> {
  const search = new URLSearchParams({ assigneeId: 'me', state: fieldStates.join(','), sort: 'dueOn', pageSize: '100' });
  return withOfflineCopy(
    'my-orders',
    () => apiRequest(`/api/work-orders?${search.toString()}`, { parse: (json) => orderList.parse(json), ...(signal ? { signal } : {}) }),
    (json) => orderList.parse(json),
  );
}

export function fetchFieldOrder(id: number, signal?: AbortSignal): Promise<WorkOrderDetail> {
  return withOfflineCopy(
    `order:${id}`,
    () => apiRequest(`/api/work-orders/${id}`, { parse: (json) => workOrderDetail.parse(json), ...(signal ? { signal } : {}) }),
    (json) => workOrderDetail.parse(json),
  );
}

export function transitionOrder({ id, to, version, comment = '' }: { id: number; to: WorkOrderState; version: number; comment?: string }): Promise<WorkOrder> {
  return apiRequest(`/api/work-orders/${id}/transitions`, { method: 'POST', body: { to, version, comment }, parse: (json) => workOrder.parse(json) });
}

/** Query factory of the technician's side of work orders. */
export const fieldQueries = {
  all: ['field'] as const,
  myOrders: () =>
    queryOptions({
      queryKey: [...fieldQueries.all, 'my-orders'] as const,
      queryFn: ({ signal }) => fetchMyOrders(signal),
      meta: { subject: 'list of your orders' },
    }),
  orders: () => [...fieldQueries.all, 'order'] as const,
  order: (id: number) =>
    queryOptions({
      queryKey: [...fieldQueries.orders(), id] as const,
      queryFn: ({ signal }) => fetchFieldOrder(id, signal),
      meta: { subject: 'work order' },
    }),
};

/** The supervisor's reason on the latest return of the order to the field, if it was returned. */
export function sentBackReason(order: Pick<WorkOrderDetail, 'transitions'>): { comment: string; by: string | null; at: string } | null {
  const last = [...order.transitions].reverse().find((t) => t.toState === 'sent-back');
  return last ? { comment: last.comment, by: last.actorName, at: last.at } : null;
}
