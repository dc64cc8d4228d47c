import { queryOptions } from '@tanstack/react-query';
import { fleetOverview, siteHealth, siteHealthQuery, type FleetOverview, type SiteHealth } from '@varden/schemas';
import { apiRequest } from '../../../lib/api-client';

/** The hours a month the cost estimate assumes unless the reader changes them (the API's default). */
export const defaultHoursPerMonth = siteHealthQuery.parse({}).hoursPerMonth;

/** `?hoursPerMonth=` of a page address, or the default when absent or out of range. */
export function hoursPerMonthOf(search: URLSearchParams): number {
  const parsed = siteHealthQuery.safeParse({ hoursPerMonth: search.get('hoursPerMonth') ?? undefined });
  return parsed.success ? parsed.data.hoursPerMonth : defaultHoursPerMonth;
}

export function fetchFleetOverview(signal?: AbortSignal): Promise<FleetOverview> {
  return apiRequest('/api/fleet', { parse: (json) => fleetOverview.parse(json), ...(signal ? { signal } : {}) });
}

export function fetchSiteHealth(siteId: number, hoursPerMonth: number, signal?: AbortSignal): Promise<SiteHealth> {
  const query = hoursPerMonth === defaultHoursPerMonth ? '' : `?hoursPerMonth=${encodeURIComponent(hoursPerMonth)}`;
  return apiRequest(`/api/sites/${siteId}/health${query}`, { parse: (json) => siteHealth.parse(json), ...(signal ? { signal } : {}) });
}

/** The CSV of the fleet table, straight from the API (a download, not a query). */
export const fleetCsvHref = '/api/fleet/export.csv';

export const fleetQueries = {
  all: ['fleet'] as const,
  /** The fleet at a glance for the signed-in person's sites (the API limits a viewer to theirs). */
  overview: () =>
    queryOptions({
      queryKey: [...fleetQueries.all, 'overview'] as const,
      queryFn: ({ signal }) => fetchFleetOverview(signal),
      meta: { subject: 'fleet overview' },
    }),
  siteHealths: () => [...fleetQueries.all, 'site-health'] as const,
  /** One site's health; the hours a month drive the cost estimate only, so the figures stay on screen while it refetches. */
  siteHealth: (siteId: number, hoursPerMonth: number) =>
    queryOptions({
      queryKey: [...fleetQueries.siteHealths(), siteId, { hoursPerMonth }] as const,
      queryFn: ({ signal }) => fetchSiteHealth(siteId, hoursPerMonth, signal),
      // The same site's figures at the old hours, never another site's.
      placeholderData: (previous, previousQuery) => (previousQuery?.queryKey[2] === siteId ? previous : undefined),
      meta: { subject: 'site health' },
    }),
};
