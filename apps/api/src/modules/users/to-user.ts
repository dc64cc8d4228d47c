import type { User, UserStatus } from '@varden/schemas';
import type { UserRecord, UserRow } from './repository';

export function statusOf(row: Pick<UserRow, 'active' | 'deactivatedAt'>): UserStatus {
  if (row.active) return 'active';
  return row.deactivatedAt ? 'deactivated' : 'invited';
}

/** A user as the API answers it; never the password hash. */
export function toUser(record: UserRecord): User {
  return {
    id: record.id,
    email: record.email,
    name: record.name,
    active: record.active,
    status: statusOf(record),
    roles: record.roles,
    siteIds: record.siteIds,
    createdAt: record.createdAt.toISOString(),
    lastSignInAt: record.lastSignInAt ? record.lastSignInAt.toISOString() : null,
  };
}
