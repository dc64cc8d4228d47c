import { keepPreviousData, mutationOptions, queryOptions, type QueryClient } from '@tanstack/react-query';
import { listResponse, site, type Site, type SiteCreate, type SiteUpdate, type siteListQuery } from '@varden/schemas';
import type { z } from 'zod';
import { apiRequest } from '../../../lib/api-client';
import { fetchAllPages, searchOf, type ListParams, type Page } from './list-params';
import { registerKey } from './register-keys';

export type SiteSort = z.output<typeof siteListQuery>['sort'];
export type SiteListParams = ListParams<SiteSort>;

const siteList = listResponse(site);

export function fetchSites(params: SiteListParams, signal?: AbortSignal): Promise<Page<Site>> {
  return apiRequest(`/api/sites${searchOf(params)}`, { parse: (json) => siteList.parse(json), ...(signal ? { signal } : {}) });
}

export function fetchSite(id: number, signal?: AbortSignal): Promise<Site> {
  return apiRequest(`/api/sites/${id}`, { parse: (json) => site.parse(json), ...(signal ? { signal } : {}) });
}

/** Every site matching the filter, whatever the page size: for the CSV export. */
export function fetchAllSites(params: Omit<SiteListParams, 'page' | 'pageSize'>): Promise<Page<Site>> {
  return fetchAllPages((page, pageSize) => fetchSites({ ...params, page, pageSize }));
}

export function createSite(body: SiteCreate): Promise<Site> {
  return apiRequest('/api/sites', { method: 'POST', body, parse: (json) => site.parse(json) });
}

export function updateSite({ id, body }: { id: number; body: SiteUpdate }): Promise<Site> {
  return apiRequest(`/api/sites/${id}`, { method: 'PATCH', body, parse: (json) => site.parse(json) });
}

export function deleteSite(id: number): Promise<void> {
  return apiRequest(`/api/sites/${id}`, { method: 'DELETE', parse: () => undefined });
}

export const siteQueries = {
  all: [...registerKey, 'sites'] as const,
  lists: () => [...siteQueries.all, 'list'] as const,
  list: (params: SiteListParams) =>
    queryOptions({
      queryKey: [...siteQueries.lists(), params] as const,
      queryFn: ({ signal }) => fetchSites(params, signal),
      placeholderData: keepPreviousData,
      meta: { subject: 'site list' },
    }),
  details: () => [...siteQueries.all, 'detail'] as const,
  detail: (id: number) =>
    queryOptions({
      queryKey: [...siteQueries.details(), id] as const,
      queryFn: ({ signal }) => fetchSite(id, signal),
      meta: { subject: 'site' },
    }),
};

/** Writes to sites, each refreshing the queries whose answer it changes. */
export const siteMutations = {
  create: (queryClient: QueryClient) =>
    mutationOptions({
      mutationFn: createSite,
      onSuccess: () => queryClient.invalidateQueries({ queryKey: siteQueries.lists() }),
      meta: { handlesErrors: true },
    }),
  update: (queryClient: QueryClient) =>
    mutationOptions({
      mutationFn: updateSite,
      onSuccess: (updated) => {
        queryClient.setQueryData(siteQueries.detail(updated.id).queryKey, updated);
        return queryClient.invalidateQueries({ queryKey: siteQueries.all });
      },
      meta: { handlesErrors: true },
    }),
  remove: (queryClient: QueryClient) =>
    mutationOptions({
      mutationFn: deleteSite,
      onSuccess: (_nothing, id) => {
        // The record is gone: drop it rather than refetch it into a 404 under the open page.
        queryClient.removeQueries({ queryKey: siteQueries.detail(id).queryKey });
        return queryClient.invalidateQueries({ queryKey: siteQueries.lists() });
      },
      meta: { handlesErrors: true },
    }),
};
