import { mutationOptions, queryOptions, type QueryClient } from '@tanstack/react-query';
import { listResponse, unit, unitReading, type Unit, type UnitCreate, type UnitReading, type unitReplace, type unitUpdate } from '@varden/schemas';
import * as z from 'zod/mini';
import { apiRequest } from '../../../lib/api-client';
import { fetchAllPages, searchOf, type Page } from './list-params';
import { registerKey } from './register-keys';

export type UnitUpdate = z.input<typeof unitUpdate>;
export type UnitReplace = z.input<typeof unitReplace>;

/** Which units: those of a step or of a bank, with or without the ones removed from service. */
export type UnitScope = ({ stepId: number; bankId?: never } | { bankId: number; stepId?: never }) & { includeRemoved: boolean };

const unitList = listResponse(unit);
const unitReadingList = listResponse(unitReading);
// The replacement's answer has no shared schema yet (reported to the lead); same shape as the service returns.
const unitReplacement = z.object({ removed: unit, installed: unit });
export type UnitReplacement = z.infer<typeof unitReplacement>;

/** Every unit in the scope, by position: a step holds at most 32 in service, a bank many more. */
export function fetchUnits(scope: UnitScope, signal?: AbortSignal): Promise<Page<Unit>> {
  return fetchAllPages((page, pageSize) =>
    apiRequest(
      `/api/capacitor-units${searchOf({
        stepId: scope.stepId,
        bankId: scope.bankId,
        includeRemoved: scope.includeRemoved ? 'true' : undefined,
        sort: 'position',
        page,
        pageSize,
      })}`,
      { parse: (json) => unitList.parse(json), ...(signal ? { signal } : {}) },
    ),
  );
}

/** Every reading of a unit, newest first: its history table and the points of its trend. */
export function fetchUnitReadings(id: number, signal?: AbortSignal): Promise<Page<UnitReading>> {
  return fetchAllPages((page, pageSize) =>
    apiRequest(`/api/capacitor-units/${id}/readings${searchOf({ sort: '-recordedAt', page, pageSize })}`, {
      parse: (json) => unitReadingList.parse(json),
      ...(signal ? { signal } : {}),
    }),
  );
}

export function fetchUnit(id: number, signal?: AbortSignal): Promise<Unit> {
  return apiRequest(`/api/capacitor-units/${id}`, { parse: (json) => unit.parse(json), ...(signal ? { signal } : {}) });
}

export function createUnit(body: UnitCreate): Promise<Unit> {
  return apiRequest('/api/capacitor-units', { method: 'POST', body, parse: (json) => unit.parse(json) });
}

export function updateUnit({ id, body }: { id: number; body: UnitUpdate }): Promise<Unit> {
  return apiRequest(`/api/capacitor-units/${id}`, { method: 'PATCH', body, parse: (json) => unit.parse(json) });
}

export function replaceUnit({ id, body }: { id: number; body: UnitReplace }): Promise<UnitReplacement> {
  return apiRequest(`/api/capacitor-units/${id}/replacement`, { method: 'POST', body, parse: (json) => unitReplacement.parse(json) });
}

export const unitQueries = {
  all: [...registerKey, 'capacitor-units'] as const,
  lists: () => [...unitQueries.all, 'list'] as const,
  list: (scope: UnitScope) =>
    queryOptions({
      queryKey: [...unitQueries.lists(), scope] as const,
      queryFn: ({ signal }) => fetchUnits(scope, signal),
      meta: { subject: 'capacitor units' },
    }),
  details: () => [...unitQueries.all, 'detail'] as const,
  detail: (id: number) =>
    queryOptions({
      queryKey: [...unitQueries.details(), id] as const,
      queryFn: ({ signal }) => fetchUnit(id, signal),
      meta: { subject: 'capacitor unit' },
    }),
  readings: (id: number) =>
    queryOptions({
      queryKey: [...unitQueries.all, 'readings', id] as const,
      queryFn: ({ signal }) => fetchUnitReadings(id, signal),
      meta: { subject: 'readings of the capacitor unit' },
    }),
};

export const unitMutations = {
  create: (queryClient: QueryClient) =>
    mutationOptions({
      mutationFn: createUnit,
      onSuccess: () => queryClient.invalidateQueries({ queryKey: unitQueries.lists() }),
      meta: { handlesErrors: true },
    }),
  update: (queryClient: QueryClient) =>
    mutationOptions({
      mutationFn: updateUnit,
      onSuccess: (updated) => {
        queryClient.setQueryData(unitQueries.detail(updated.id).queryKey, updated);
        return queryClient.invalidateQueries({ queryKey: unitQueries.lists() });
      },
      meta: { handlesErrors: true },
    }),
  /** The old unit leaves service and the new one takes its position: both records and every list change. */
  replace: (queryClient: QueryClient) =>
    mutationOptions({
      mutationFn: replaceUnit,
      onSuccess: ({ removed, installed }) => {
        queryClient.setQueryData(unitQueries.detail(removed.id).queryKey, removed);
        queryClient.setQueryData(unitQueries.detail(installed.id).queryKey, installed);
        return queryClient.invalidateQueries({ queryKey: unitQueries.lists() });
      },
      meta: { handlesErrors: true },
    }),
};
