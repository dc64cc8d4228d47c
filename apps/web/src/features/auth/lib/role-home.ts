import type { Role } from '@varden/schemas';
import { paths } from '../../../config/paths';

/** Each role's own home: where a person lands after signing in. */
export const roleHomes: Readonly<Record<Role, string>> = {
  planner: paths.planningDesk.getHref(),
  technician: paths.todaysOrders.getHref(),
  supervisor: paths.reviewQueue.getHref(),
  viewer: paths.siteHealth.getHref(),
  admin: paths.people.getHref(),
};

/**
 * For a person with several roles, the one whose home comes first: the maintenance work before
 * administration, and the read-only viewer last.
 */
export const homePrecedence: readonly Role[] = ['planner', 'supervisor', 'technician', 'admin', 'viewer'];

/** Where this person lands after signing in; their account page when they hold no role yet. */
export function homeFor(roles: readonly Role[]): string {
  const role = homePrecedence.find((candidate) => roles.includes(candidate));
  return role ? roleHomes[role] : paths.account.getHref();
}
