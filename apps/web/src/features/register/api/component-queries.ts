import { mutationOptions, queryOptions, type QueryClient } from '@tanstack/react-query';
import {
  contactor,
  fuseSet,
  listResponse,
  reactor,
  type contactorCreate,
  type contactorUpdate,
  type fuseSetCreate,
  type fuseSetUpdate,
  type reactorCreate,
  type reactorUpdate,
} from '@varden/schemas';
import type { z } from 'zod';
import { apiRequest } from '../../../lib/api-client';
import { fetchAllPages, searchOf, type Page } from './list-params';
import { registerKey } from './register-keys';

/** A step's other components, each under its own endpoint: /api/contactors, /api/reactors, /api/fuse-sets. */
export const componentKinds = ['contactors', 'reactors', 'fuse-sets'] as const;
export type ComponentKind = (typeof componentKinds)[number];

export type Contactor = z.infer<typeof contactor>;
export type Reactor = z.infer<typeof reactor>;
export type FuseSet = z.infer<typeof fuseSet>;

/** Each kind's record, create body and update body, from the shared contracts. */
export type ComponentRecord = { contactors: Contactor; reactors: Reactor; 'fuse-sets': FuseSet };
export type ComponentCreate = {
  contactors: z.input<typeof contactorCreate>;
  reactors: z.input<typeof reactorCreate>;
  'fuse-sets': z.input<typeof fuseSetCreate>;
};
export type ComponentUpdate = {
  contactors: z.input<typeof contactorUpdate>;
  reactors: z.input<typeof reactorUpdate>;
  'fuse-sets': z.input<typeof fuseSetUpdate>;
};

const recordSchemas = { contactors: contactor, reactors: reactor, 'fuse-sets': fuseSet } as const;

function parserOf<K extends ComponentKind>(kind: K): (json: unknown) => ComponentRecord[K] {
  return (json) => recordSchemas[kind].parse(json) as ComponentRecord[K];
}

function listParserOf<K extends ComponentKind>(kind: K): (json: unknown) => Page<ComponentRecord[K]> {
  const schema = listResponse(recordSchemas[kind]);
  return (json) => schema.parse(json) as Page<ComponentRecord[K]>;
}

/** The components of one kind in service in a bank (those with a removal date are left out by the API). */
export function fetchComponentsOfBank<K extends ComponentKind>(kind: K, bankId: number, signal?: AbortSignal) {
  const parse = listParserOf(kind);
  return fetchAllPages((page, pageSize) =>
    apiRequest(`/api/${kind}${searchOf({ bankId, page, pageSize })}`, { parse, ...(signal ? { signal } : {}) }),
  );
}

export function fetchComponent<K extends ComponentKind>(kind: K, id: number, signal?: AbortSignal) {
  return apiRequest(`/api/${kind}/${id}`, { parse: parserOf(kind), ...(signal ? { signal } : {}) });
}

export function createComponent<K extends ComponentKind>(kind: K, body: ComponentCreate[K]) {
  return apiRequest(`/api/${kind}`, { method: 'POST', body, parse: parserOf(kind) });
}

export function updateComponent<K extends ComponentKind>(kind: K, id: number, body: ComponentUpdate[K]) {
  return apiRequest(`/api/${kind}/${id}`, { method: 'PATCH', body, parse: parserOf(kind) });
}

export function deleteComponent(kind: ComponentKind, id: number): Promise<void> {
  return apiRequest(`/api/${kind}/${id}`, { method: 'DELETE', parse: () => undefined });
}

export const componentQueries = {
  all: (kind: ComponentKind) => [...registerKey, kind] as const,
  lists: (kind: ComponentKind) => [...componentQueries.all(kind), 'list'] as const,
  ofBank: <K extends ComponentKind>(kind: K, bankId: number) =>
    queryOptions({
      queryKey: [...componentQueries.lists(kind), { bankId }] as const,
      queryFn: ({ signal }) => fetchComponentsOfBank(kind, bankId, signal),
      meta: { subject: `${kind.replace('-', ' ')} of the bank` },
    }),
  details: (kind: ComponentKind) => [...componentQueries.all(kind), 'detail'] as const,
  detail: <K extends ComponentKind>(kind: K, id: number) =>
    queryOptions({
      queryKey: [...componentQueries.details(kind), id] as const,
      queryFn: ({ signal }) => fetchComponent(kind, id, signal),
      meta: { subject: kind.replace('-', ' ').replace(/s$/, '') },
    }),
};

export const componentMutations = {
  create: <K extends ComponentKind>(queryClient: QueryClient, kind: K) =>
    mutationOptions({
      mutationFn: (body: ComponentCreate[K]) => createComponent(kind, body),
      onSuccess: () => queryClient.invalidateQueries({ queryKey: componentQueries.lists(kind) }),
      meta: { handlesErrors: true },
    }),
  update: <K extends ComponentKind>(queryClient: QueryClient, kind: K) =>
    mutationOptions({
      mutationFn: ({ id, body }: { id: number; body: ComponentUpdate[K] }) => updateComponent(kind, id, body),
      onSuccess: (updated) => {
        queryClient.setQueryData(componentQueries.detail(kind, updated.id).queryKey, updated);
        return queryClient.invalidateQueries({ queryKey: componentQueries.lists(kind) });
      },
      meta: { handlesErrors: true },
    }),
  remove: (queryClient: QueryClient, kind: ComponentKind) =>
    mutationOptions({
      mutationFn: (id: number) => deleteComponent(kind, id),
      onSuccess: (_nothing, id) => {
        queryClient.removeQueries({ queryKey: componentQueries.detail(kind, id).queryKey });
        return queryClient.invalidateQueries({ queryKey: componentQueries.lists(kind) });
      },
      meta: { handlesErrors: true },
    }),
};
