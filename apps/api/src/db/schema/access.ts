import {
  boolean,
  char,
  customType,
  index,
  mysqlEnum,
  mysqlTable,
  primaryKey,
  uniqueIndex,
  varchar,
} from 'drizzle-orm/mysql-core';
import { at, createdAt, id, ref, updatedAt } from './columns';
import { sites } from './register';

/**
 * Access: people, their roles and viewer site grants, sessions, one-time tokens for invitations
 * and password resets, sign-in attempts for throttling, and the audit log.
 */

export const roleValues = ['admin', 'planner', 'technician', 'supervisor', 'viewer'] as const;

/**
 * MariaDB's JSON is LONGTEXT with a validity check, so the driver hands back a string: parse it
 * here so callers always see the object.
 */
const jsonObject = customType<{ data: Record<string, unknown>; driverData: string }>({
  dataType: () => 'json',
  toDriver: (value) => JSON.stringify(value),
  fromDriver: (value) => (typeof value === 'string' ? (JSON.parse(value) as Record<string, unknown>) : value),
});

export const users = mysqlTable(
  'users',
  {
    id: id(),
    /** Stored lower-case, so the unique index compares addresses the way people expect. */
    email: varchar('email', { length: 320 }).notNull(),
    name: varchar('name', { length: 200 }).notNull(),
    /** Argon2id PHC string; null until an invited person sets a password. */
    passwordHash: varchar('password_hash', { length: 255 }),
    /** May sign in. An invited person becomes active on accepting the invitation. */
    active: boolean('active').notNull().default(false),
    /** Set when an administrator deactivates the account; tells "deactivated" from "invited". */
    deactivatedAt: at('deactivated_at'),
    passwordChangedAt: at('password_changed_at'),
    lastSignInAt: at('last_sign_in_at'),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [uniqueIndex('users_email').on(t.email), index('users_name').on(t.name)],
);

export const userRoles = mysqlTable(
  'user_roles',
  {
    userId: ref('user_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    role: mysqlEnum('role', roleValues).notNull(),
  },
  (t) => [primaryKey({ columns: [t.userId, t.role] }), index('user_roles_role').on(t.role)],
);

/** The sites a viewer may read (a site's facility manager, a client). */
export const viewerSiteGrants = mysqlTable(
  'viewer_site_grants',
  {
    userId: ref('user_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    siteId: ref('site_id')
      .notNull()
      .references(() => sites.id),
    createdAt: createdAt(),
  },
  (t) => [primaryKey({ columns: [t.userId, t.siteId] }), index('viewer_site_grants_site').on(t.siteId)],
);

/**
 * Signed-in sessions. Only the SHA-256 of the cookie's token is stored, so a copy of this table
 * cannot be replayed. Idle expiry is last_seen_at plus the configured idle time.
 */
export const sessions = mysqlTable(
  'sessions',
  {
    id: id(),
    tokenHash: char('token_hash', { length: 64 }).notNull(),
    userId: ref('user_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    createdAt: createdAt(),
    lastSeenAt: at('last_seen_at').notNull(),
    expiresAt: at('expires_at').notNull(),
    ip: varchar('ip', { length: 45 }),
    userAgent: varchar('user_agent', { length: 300 }),
  },
  (t) => [uniqueIndex('sessions_token_hash').on(t.tokenHash), index('sessions_user').on(t.userId), index('sessions_expires').on(t.expiresAt)],
);

export const tokenPurposeValues = ['invitation', 'reset'] as const;

/** Single-use links for invitations and password resets, stored as the SHA-256 of the token. */
export const authTokens = mysqlTable(
  'auth_tokens',
  {
    id: id(),
    tokenHash: char('token_hash', { length: 64 }).notNull(),
    userId: ref('user_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    purpose: mysqlEnum('purpose', tokenPurposeValues).notNull(),
    expiresAt: at('expires_at').notNull(),
    usedAt: at('used_at'),
    createdAt: createdAt(),
  },
  (t) => [uniqueIndex('auth_tokens_token_hash').on(t.tokenHash), index('auth_tokens_user_purpose').on(t.userId, t.purpose, t.createdAt)],
);

/**
 * pending: recorded before the password is checked, so concurrent guesses count against each
 * other; throttled: refused without checking, and not counted as a failure.
 */
export const attemptOutcomeValues = ['pending', 'failed', 'succeeded', 'throttled'] as const;

/** Every sign-in attempt, per e-mail as typed (existing or not) and per client address. */
export const signInAttempts = mysqlTable(
  'sign_in_attempts',
  {
    id: id(),
    email: varchar('email', { length: 320 }).notNull(),
    ip: varchar('ip', { length: 45 }).notNull(),
    outcome: mysqlEnum('outcome', attemptOutcomeValues).notNull(),
    attemptedAt: at('attempted_at').notNull(),
  },
  (t) => [
    index('sign_in_attempts_email').on(t.email, t.attemptedAt),
    index('sign_in_attempts_ip').on(t.ip, t.attemptedAt),
  ],
);

/** Who changed what and when. Rows are only ever inserted. */
export const auditLog = mysqlTable(
  'audit_log',
  {
    id: id(),
    at: at('at').notNull(),
    /** Null for changes made by the system itself (the demo seed, a job). */
    actorUserId: ref('actor_user_id').references(() => users.id, { onDelete: 'set null' }),
    action: varchar('action', { length: 64 }).notNull(),
    targetType: varchar('target_type', { length: 32 }).notNull(),
    targetId: ref('target_id'),
    details: jsonObject('details').notNull(),
  },
  (t) => [
    index('audit_log_at').on(t.at),
    index('audit_log_target').on(t.targetType, t.targetId),
    index('audit_log_actor').on(t.actorUserId),
  ],
);
