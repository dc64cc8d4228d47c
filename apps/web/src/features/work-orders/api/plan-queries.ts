import { keepPreviousData, mutationOptions, queryOptions, type QueryClient } from '@tanstack/react-query';
import { inspectionPlan, listResponse, type InspectionPlan, type inspectionPlanCreate, type inspectionPlanUpdate } from '@varden/schemas';
import type { z } from 'zod';
import { apiRequest } from '../../../lib/api-client';

export type PlanCreate = z.input<typeof inspectionPlanCreate>;
export type PlanUpdate = z.input<typeof inspectionPlanUpdate>;
export type PlanListParams = { bankId?: number; page: number; pageSize: number; sort: 'nextDueOn' | '-nextDueOn' };

const planList = listResponse(inspectionPlan);

function listPlans(params: PlanListParams, signal: AbortSignal) {
  const search = new URLSearchParams({ page: String(params.page), pageSize: String(params.pageSize), sort: params.sort });
  if (params.bankId) search.set('bankId', String(params.bankId));
  return apiRequest(`/api/inspection-plans?${search.toString()}`, { parse: (json) => planList.parse(json), signal });
}

export const plans = {
  all: ['inspection-plans'] as const,
  lists: () => [...plans.all, 'list'] as const,
  list: (params: PlanListParams) =>
    queryOptions({
      queryKey: [...plans.lists(), params] as const,
      queryFn: ({ signal }) => listPlans(params, signal),
      placeholderData: keepPreviousData,
      meta: { subject: 'list of inspection plans' },
    }),
  details: () => [...plans.all, 'detail'] as const,
  detail: (id: number) =>
    queryOptions({
      queryKey: [...plans.details(), id] as const,
      queryFn: ({ signal }) => apiRequest(`/api/inspection-plans/${id}`, { parse: (json) => inspectionPlan.parse(json), signal }),
      meta: { subject: 'inspection plan' },
    }),
};

function createPlan(body: PlanCreate): Promise<InspectionPlan> {
  return apiRequest('/api/inspection-plans', { method: 'POST', body, parse: (json) => inspectionPlan.parse(json) });
}

function updatePlan({ id, body }: { id: number; body: PlanUpdate }): Promise<InspectionPlan> {
  return apiRequest(`/api/inspection-plans/${id}`, { method: 'PATCH', body, parse: (json) => inspectionPlan.parse(json) });
}

function deletePlan(id: number): Promise<void> {
  return apiRequest(`/api/inspection-plans/${id}`, { method: 'DELETE', parse: () => undefined });
}

export const planMutations = {
  create: (queryClient: QueryClient) =>
    mutationOptions({ mutationFn: createPlan, onSuccess: () => queryClient.invalidateQueries({ queryKey: plans.lists() }), meta: { handlesErrors: true } }),
  update: (queryClient: QueryClient) =>
    mutationOptions({
      mutationFn: updatePlan,
      onSuccess: (saved) => {
        queryClient.setQueryData(plans.detail(saved.id).queryKey, saved);
        return queryClient.invalidateQueries({ queryKey: plans.lists() });
      },
      meta: { handlesErrors: true },
    }),
  remove: (queryClient: QueryClient) =>
    mutationOptions({
      mutationFn: deletePlan,
      onSuccess: (_nothing, id) => {
        queryClient.removeQueries({ queryKey: plans.detail(id).queryKey });
        return queryClient.invalidateQueries({ queryKey: plans.lists() });
      },
      meta: { handlesErrors: true },
    }),
};
