import { mutationOptions, queryOptions, type QueryClient } from '@tanstack/react-query';
import { listResponse, step, type Step, type stepCreate, type stepUpdate } from '@varden/schemas';
import type { z } from 'zod';
import { apiRequest } from '../../../lib/api-client';
import { bankQueries } from './bank-queries';
import { fetchAllPages, searchOf, type Page } from './list-params';
import { registerKey } from './register-keys';

export type StepCreate = z.input<typeof stepCreate>;
export type StepUpdate = z.input<typeof stepUpdate>;

const stepList = listResponse(step);

/** Every step of a bank in service, by number (a bank has at most 64). */
export function fetchStepsOfBank(bankId: number, signal?: AbortSignal): Promise<Page<Step>> {
  return fetchAllPages((page, pageSize) =>
    apiRequest(`/api/steps${searchOf({ bankId, page, pageSize, sort: 'number' })}`, {
      parse: (json) => stepList.parse(json),
      ...(signal ? { signal } : {}),
    }),
  );
}

export function fetchStep(id: number, signal?: AbortSignal): Promise<Step> {
  return apiRequest(`/api/steps/${id}`, { parse: (json) => step.parse(json), ...(signal ? { signal } : {}) });
}

export function createStep(body: StepCreate): Promise<Step> {
  return apiRequest('/api/steps', { method: 'POST', body, parse: (json) => step.parse(json) });
}

export function updateStep({ id, body }: { id: number; body: StepUpdate }): Promise<Step> {
  return apiRequest(`/api/steps/${id}`, { method: 'PATCH', body, parse: (json) => step.parse(json) });
}

export function deleteStep(id: number): Promise<void> {
  return apiRequest(`/api/steps/${id}`, { method: 'DELETE', parse: () => undefined });
}

export const stepQueries = {
  all: [...registerKey, 'steps'] as const,
  lists: () => [...stepQueries.all, 'list'] as const,
  ofBank: (bankId: number) =>
    queryOptions({
      queryKey: [...stepQueries.lists(), { bankId }] as const,
      queryFn: ({ signal }) => fetchStepsOfBank(bankId, signal),
      meta: { subject: 'steps of the bank' },
    }),
  details: () => [...stepQueries.all, 'detail'] as const,
  detail: (id: number) =>
    queryOptions({
      queryKey: [...stepQueries.details(), id] as const,
      queryFn: ({ signal }) => fetchStep(id, signal),
      meta: { subject: 'step' },
    }),
};

/** A step's write changes its bank's step count and the site summary's installed kvar. */
const refreshAfterStepWrite = (queryClient: QueryClient, bankId: number) =>
  Promise.all([
    queryClient.invalidateQueries({ queryKey: stepQueries.lists() }),
    queryClient.invalidateQueries({ queryKey: bankQueries.detail(bankId).queryKey }),
    queryClient.invalidateQueries({ queryKey: bankQueries.lists() }),
  ]);

export const stepMutations = {
  create: (queryClient: QueryClient) =>
    mutationOptions({
      mutationFn: createStep,
      onSuccess: (created) => refreshAfterStepWrite(queryClient, created.bankId),
      meta: { handlesErrors: true },
    }),
  update: (queryClient: QueryClient) =>
    mutationOptions({
      mutationFn: updateStep,
      onSuccess: (updated) => {
        queryClient.setQueryData(stepQueries.detail(updated.id).queryKey, updated);
        return refreshAfterStepWrite(queryClient, updated.bankId);
      },
      meta: { handlesErrors: true },
    }),
  remove: (queryClient: QueryClient) =>
    mutationOptions({
      mutationFn: ({ id }: { id: number; bankId: number }) => deleteStep(id),
      onSuccess: (_nothing, { id, bankId }) => {
        queryClient.removeQueries({ queryKey: stepQueries.detail(id).queryKey });
        return refreshAfterStepWrite(queryClient, bankId);
      },
      meta: { handlesErrors: true },
    }),
};
