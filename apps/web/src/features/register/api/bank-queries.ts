import { keepPreviousData, mutationOptions, queryOptions, type QueryClient } from '@tanstack/react-query';
import { bank, listResponse, type Bank, type BankCreate, type bankListQuery, type bankUpdate } from '@varden/schemas';
import type { z } from 'zod';
import { apiRequest } from '../../../lib/api-client';
import { fetchAllPages, searchOf, type ListParams, type Page } from './list-params';
import { registerKey } from './register-keys';
import { siteQueries } from './site-queries';

export type BankSort = z.output<typeof bankListQuery>['sort'];
export type BankListParams = ListParams<BankSort> & { siteId?: number };
export type BankUpdate = z.input<typeof bankUpdate>;

const bankList = listResponse(bank);

export function fetchBanks(params: BankListParams, signal?: AbortSignal): Promise<Page<Bank>> {
  return apiRequest(`/api/banks${searchOf(params)}`, { parse: (json) => bankList.parse(json), ...(signal ? { signal } : {}) });
}

export function fetchAllBanks(params: Omit<BankListParams, 'page' | 'pageSize'>): Promise<Page<Bank>> {
  return fetchAllPages((page, pageSize) => fetchBanks({ ...params, page, pageSize }));
}

export function fetchBank(id: number, signal?: AbortSignal): Promise<Bank> {
  return apiRequest(`/api/banks/${id}`, { parse: (json) => bank.parse(json), ...(signal ? { signal } : {}) });
}

export function createBank(body: BankCreate): Promise<Bank> {
  return apiRequest('/api/banks', { method: 'POST', body, parse: (json) => bank.parse(json) });
}

export function updateBank({ id, body }: { id: number; body: BankUpdate }): Promise<Bank> {
  return apiRequest(`/api/banks/${id}`, { method: 'PATCH', body, parse: (json) => bank.parse(json) });
}

export function deleteBank(id: number): Promise<void> {
  return apiRequest(`/api/banks/${id}`, { method: 'DELETE', parse: () => undefined });
}

export const bankQueries = {
  all: [...registerKey, 'banks'] as const,
  lists: () => [...bankQueries.all, 'list'] as const,
  list: (params: BankListParams) =>
    queryOptions({
      queryKey: [...bankQueries.lists(), params] as const,
      queryFn: ({ signal }) => fetchBanks(params, signal),
      placeholderData: keepPreviousData,
      meta: { subject: 'bank list' },
    }),
  details: () => [...bankQueries.all, 'detail'] as const,
  detail: (id: number) =>
    queryOptions({
      queryKey: [...bankQueries.details(), id] as const,
      queryFn: ({ signal }) => fetchBank(id, signal),
      meta: { subject: 'bank' },
    }),
};

/** A bank's write changes its site's bank count too. */
const refreshAfterBankWrite = (queryClient: QueryClient, siteId: number) =>
  Promise.all([
    queryClient.invalidateQueries({ queryKey: bankQueries.lists() }),
    queryClient.invalidateQueries({ queryKey: siteQueries.detail(siteId).queryKey }),
    queryClient.invalidateQueries({ queryKey: siteQueries.lists() }),
  ]);

export const bankMutations = {
  create: (queryClient: QueryClient) =>
    mutationOptions({
      mutationFn: createBank,
      onSuccess: (created) => refreshAfterBankWrite(queryClient, created.siteId),
      meta: { handlesErrors: true },
    }),
  update: (queryClient: QueryClient) =>
    mutationOptions({
      mutationFn: updateBank,
      onSuccess: (updated) => {
        queryClient.setQueryData(bankQueries.detail(updated.id).queryKey, updated);
        return refreshAfterBankWrite(queryClient, updated.siteId);
      },
      meta: { handlesErrors: true },
    }),
  remove: (queryClient: QueryClient) =>
    mutationOptions({
      mutationFn: ({ id }: { id: number; siteId: number }) => deleteBank(id),
      onSuccess: (_nothing, { id, siteId }) => {
        queryClient.removeQueries({ queryKey: bankQueries.detail(id).queryKey });
        return refreshAfterBankWrite(queryClient, siteId);
      },
      meta: { handlesErrors: true },
    }),
};
