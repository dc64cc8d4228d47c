import type { SessionUser } from './current-user';

/** Which sites a user may read: every site, or only those granted (ids). */
export type SiteScope = 'all' | readonly number[];

/**
 * A viewer (a site's facility manager, a client) reads only the sites granted to them; anyone
 * holding another role works across all sites, so a viewer who is also a planner sees all.
 */
export function siteScope(user: Pick<SessionUser, 'roles' | 'siteIds'>): SiteScope {
  if (user.roles.some((role) => role !== 'viewer')) return 'all';
  return user.roles.includes('viewer') ? [...user.siteIds] : [];
}
