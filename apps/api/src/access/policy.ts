import { permissions, roles, type Permission, type Role } from '@varden/schemas';

export type { Permission, Role };

/** Who holds a permission: nobody needs to sign in, any signed-in role, or the roles listed. */
type Holders = 'anyone' | 'signed-in' | readonly Role[];

const everyRole = roles;

/**
 * The one place that says which role may do what (roles as in product.md). Routes declare a
 * permission with allow(); services add the finer rules (a viewer's sites, a technician's own
 * orders). Separation of duties: the people who plan and perform work do not sign it off, and
 * administrators manage people, settings and the register, but do not plan, perform or sign
 * off work.
 */
export const policy: Readonly<Record<Permission, Holders>> = {
  public: 'anyone',
  'signed-in': 'signed-in',
  'users:manage': ['admin'],
  'audit-log:read': ['admin'],
  'settings:manage': ['admin'],
  /** Viewers read only the sites granted to them (siteScope). */
  'register:read': everyRole,
  /** Administrators too: product.md has them keep PF targets and tariff bases, which live on sites. */
  'register:write': ['planner', 'admin'],
  'plans:manage': ['planner'],
  'work-orders:read': everyRole,
  'work-orders:schedule': ['planner'],
  'work-orders:perform': ['technician'],
  'work-orders:review': ['supervisor'],
  'reports:read': everyRole,
};

/** Whether someone with these roles (none when signed out) holds the permission. */
export function can(userRoles: readonly Role[] | undefined, permission: Permission): boolean {
  const holders = policy[permission];
  if (holders === 'anyone') return true;
  if (!userRoles || userRoles.length === 0) return false;
  if (holders === 'signed-in') return true;
  return userRoles.some((role) => holders.includes(role));
}

/** Whether a permission needs a signed-in user at all. */
export function needsSignIn(permission: Permission): boolean {
  return policy[permission] !== 'anyone';
}

/** Everything a user with these roles may do; /api/auth/me sends it to the web. */
export function permissionsOf(userRoles: readonly Role[]): Permission[] {
  return permissions.filter((permission) => can(userRoles, permission));
}
