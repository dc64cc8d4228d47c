import { useSuspenseQuery, type QueryClient } from '@tanstack/react-query';
import type { Bank, Permission, Site, Step } from '@varden/schemas';
import { data, type Params } from 'react-router-dom';
import { requirePermission } from '../../../features/auth/lib/route-guards';
import { isApiError } from '../../../lib/api-client';
import { bankQueries } from '../../../features/register/api/bank-queries';
import { siteQueries } from '../../../features/register/api/site-queries';
import { stepQueries } from '../../../features/register/api/step-queries';
import { paths } from '../../../config/paths';

/** A record id from the URL; anything else is a page that does not exist. */
export function idParam(params: Params, name: string): number {
  const id = Number(params[name]);
  if (!Number.isInteger(id) || id < 1) throw data({ message: 'This address does not lead to a record.' }, { status: 404 });
  return id;
}

/**
 * Awaits a record for a loader; a 404 from the API (missing, or on a site the person is not
 * granted, which the API also answers 404) becomes the section's "Nothing here".
 */
export async function orNotFound<T>(load: Promise<T>): Promise<T> {
  try {
    return await load;
  } catch (error) {
    if (isApiError(error) && error.status === 404) throw data({ message: error.message }, { status: 404 });
    throw error;
  }
}

/** Signed in with the permission, or the sign-in page / 403 (the auth work's guard). */
export function allowed(queryClient: QueryClient, request: Request, permission: Permission = 'register:read') {
  return requirePermission(queryClient, request, permission);
}

/** A step with its bank and site, for the pages below a step (breadcrumbs, site defaults). */
export async function ensureStepContext(queryClient: QueryClient, stepId: number) {
  const step = await orNotFound(queryClient.ensureQueryData(stepQueries.detail(stepId)));
  const bank = await orNotFound(queryClient.ensureQueryData(bankQueries.detail(step.bankId)));
  const site = await orNotFound(queryClient.ensureQueryData(siteQueries.detail(bank.siteId)));
  return { step, bank, site };
}

/** The same from the cache the loader filled. */
export function useStepContext(stepId: number) {
  const step = useSuspenseQuery(stepQueries.detail(stepId)).data;
  const bank = useSuspenseQuery(bankQueries.detail(step.bankId)).data;
  const site = useSuspenseQuery(siteQueries.detail(bank.siteId)).data;
  return { step, bank, site };
}

/** Sites › site › bank › step …, for a page below a step. */
export function stepTrail(context: { site: Site; bank: Bank; step: Step }, last?: string) {
  return [
    { label: 'Sites', href: paths.register.sites.getHref() },
    { label: context.site.name, href: paths.register.site.getHref(context.site.id) },
    { label: context.bank.name, href: paths.register.bank.getHref(context.bank.id) },
    last === undefined ? { label: `Step ${context.step.number}` } : { label: `Step ${context.step.number}`, href: paths.register.step.getHref(context.step.id) },
    ...(last === undefined ? [] : [{ label: last }]),
  ];
}
