import { keepPreviousData, mutationOptions, queryOptions, type QueryClient } from '@tanstack/react-query';
import {
  listResponse,
  workload,
  workOrder,
  workOrderDetail,
  workOrderReview,
  type WorkOrder,
  type WorkOrderCreate,
  type workOrderTransitionRequest,
  type workOrderUpdate,
  type WorkOrderState,
} from '@varden/schemas';
import type { z } from 'zod';
import { apiRequest } from '../../../lib/api-client';
import { monthRange } from '../lib/month-grid';
import { writeWorkOrderSearch, type WorkOrderSearch } from '../lib/work-order-search';

export type WorkOrderUpdate = z.input<typeof workOrderUpdate>;
export type TransitionRequest = z.input<typeof workOrderTransitionRequest>;

const workOrderList = listResponse(workOrder);

function listWorkOrders(search: Partial<WorkOrderSearch>, signal: AbortSignal) {
  const query = writeWorkOrderSearch(search).toString();
  return apiRequest(`/api/work-orders${query ? `?${query}` : ''}`, { parse: (json) => workOrderList.parse(json), signal });
}

/** The largest page the list endpoint serves: the calendar asks for a month's orders at once. */
export const calendarPageSize = 200;

export const workOrders = {
  all: ['work-orders'] as const,
  lists: () => [...workOrders.all, 'list'] as const,
  list: (search: WorkOrderSearch) =>
    queryOptions({
      queryKey: [...workOrders.lists(), search] as const,
      queryFn: ({ signal }) => listWorkOrders(search, signal),
      placeholderData: keepPreviousData,
      meta: { subject: 'list of work orders' },
    }),
  /** Orders due in a month (open and closed), for the due calendar. */
  month: (month: string) => {
    const { from, to } = monthRange(month);
    const search = { page: 1, pageSize: calendarPageSize, sort: 'dueOn', dueFrom: from, dueTo: to } as const;
    return queryOptions({
      queryKey: [...workOrders.lists(), search] as const,
      queryFn: ({ signal }) => listWorkOrders(search, signal),
      placeholderData: keepPreviousData,
      meta: { subject: 'due calendar' },
    });
  },
  details: () => [...workOrders.all, 'detail'] as const,
  detail: (id: number) =>
    queryOptions({
      queryKey: [...workOrders.details(), id] as const,
      queryFn: ({ signal }) => apiRequest(`/api/work-orders/${id}`, { parse: (json) => workOrderDetail.parse(json), signal }),
      meta: { subject: 'work order' },
    }),
  reviews: () => [...workOrders.all, 'review'] as const,
  review: (id: number) =>
    queryOptions({
      queryKey: [...workOrders.reviews(), id] as const,
      queryFn: ({ signal }) => apiRequest(`/api/work-orders/${id}/review`, { parse: (json) => workOrderReview.parse(json), signal }),
      meta: { subject: 'review of the work order' },
    }),
  workloads: () => [...workOrders.all, 'workload'] as const,
  workload: (range: { from: string; to: string }) =>
    queryOptions({
      queryKey: [...workOrders.workloads(), range] as const,
      queryFn: ({ signal }) =>
        apiRequest(`/api/work-orders/workload?${new URLSearchParams(range).toString()}`, { parse: (json) => workload.parse(json), signal }),
      placeholderData: keepPreviousData,
      meta: { subject: 'technician load' },
    }),
};

/** The CSV export of the table's filters (all pages), served by the API. */
export function exportHref(search: URLSearchParams): string {
  const query = search.toString();
  return `/api/work-orders/export.csv${query ? `?${query}` : ''}`;
}

/** The signed record as PDF, served by the API. */
export const recordPdfHref = (id: number) => `/api/work-orders/${id}/record.pdf`;

function createWorkOrder(body: WorkOrderCreate): Promise<WorkOrder> {
  return apiRequest('/api/work-orders', { method: 'POST', body, parse: (json) => workOrder.parse(json) });
}

function updateWorkOrder({ id, body }: { id: number; body: WorkOrderUpdate }): Promise<WorkOrder> {
  return apiRequest(`/api/work-orders/${id}`, { method: 'PATCH', body, parse: (json) => workOrder.parse(json) });
}

function transitionWorkOrder({ id, body }: { id: number; body: TransitionRequest & { to: WorkOrderState } }): Promise<WorkOrder> {
  return apiRequest(`/api/work-orders/${id}/transitions`, { method: 'POST', body, parse: (json) => workOrder.parse(json) });
}

/**
 * After any write, every list, calendar, board panel and load count may read differently, and
 * the order's own pages too; flags change when a corrective order moves.
 */
function refreshAfterWrite(queryClient: QueryClient) {
  return Promise.all([queryClient.invalidateQueries({ queryKey: workOrders.all }), queryClient.invalidateQueries({ queryKey: ['flags'] })]);
}

export const workOrderMutations = {
  create: (queryClient: QueryClient) =>
    mutationOptions({ mutationFn: createWorkOrder, onSuccess: () => refreshAfterWrite(queryClient), meta: { handlesErrors: true } }),
  update: (queryClient: QueryClient) =>
    mutationOptions({ mutationFn: updateWorkOrder, onSuccess: () => refreshAfterWrite(queryClient), meta: { handlesErrors: true } }),
  transition: (queryClient: QueryClient) =>
    mutationOptions({ mutationFn: transitionWorkOrder, onSuccess: () => refreshAfterWrite(queryClient), meta: { handlesErrors: true } }),
};
