import { keepPreviousData, mutationOptions, queryOptions, type QueryClient } from '@tanstack/react-query';
import { correctiveOrderResponse, flag, flagListQuery, listResponse, type correctiveOrderRequest } from '@varden/schemas';
import type { z } from 'zod';
import { apiRequest } from '../../../lib/api-client';
import { readListSearch, writeListSearch } from '../../../lib/server-table';
import { workOrders } from './work-order-queries';

/** The flag queue's state as the URL holds it and GET /api/flags takes it. */
export type FlagSearch = z.output<typeof flagListQuery>;
export type CorrectiveOrderRequest = z.input<typeof correctiveOrderRequest>;

const flagSearchKeys = ['page', 'pageSize', 'sort', 'state', 'siteId', 'bankId', 'kind', 'severity'] as const;
const flagSearchDefaults = { page: 1, pageSize: 25, sort: '-raisedAt' } as const;

/** The queue opens on the open flags; `state=any` in the URL lists every state. */
export function readFlagSearch(params: URLSearchParams): FlagSearch {
  const search = readListSearch(flagListQuery, params, flagSearchKeys);
  if (!params.has('state')) return { ...search, state: 'open' };
  return search;
}

export function writeFlagSearch(search: FlagSearch): URLSearchParams {
  const params = writeListSearch({ ...search, state: search.state === 'open' ? undefined : (search.state ?? 'any') }, flagSearchDefaults);
  return params;
}

const flagList = listResponse(flag);

function listFlags(search: FlagSearch, signal: AbortSignal) {
  const query = writeListSearch(search, flagSearchDefaults).toString();
  return apiRequest(`/api/flags${query ? `?${query}` : ''}`, { parse: (json) => flagList.parse(json), signal });
}

export const flags = {
  all: ['flags'] as const,
  lists: () => [...flags.all, 'list'] as const,
  list: (search: FlagSearch) =>
    queryOptions({
      queryKey: [...flags.lists(), search] as const,
      queryFn: ({ signal }) => listFlags(search, signal),
      placeholderData: keepPreviousData,
      meta: { subject: 'flag queue' },
    }),
};

function openCorrectiveOrder({ flagId, body }: { flagId: number; body: CorrectiveOrderRequest }) {
  return apiRequest(`/api/flags/${flagId}/corrective-order`, { method: 'POST', body, parse: (json) => correctiveOrderResponse.parse(json) });
}

export const flagMutations = {
  /** One action: the order is made from the flag, the flag moves in hand. */
  openCorrectiveOrder: (queryClient: QueryClient) =>
    mutationOptions({
      mutationFn: openCorrectiveOrder,
      onSuccess: () => Promise.all([queryClient.invalidateQueries({ queryKey: flags.all }), queryClient.invalidateQueries({ queryKey: workOrders.all })]),
      meta: { handlesErrors: true },
    }),
};
