import type { Executor } from './executor';
import type { Database } from '../db/client';
import type { Config } from '../config';
import { generateSecretToken, hashSecretToken } from '../security/secret-token';
import type { CurrentSession } from './current-user';
import {
  deleteSession,
  deleteSessionsOfUser,
  findSession,
  grantedSiteIds,
  insertSession,
  touchSession,
} from './session-store';

/** last_seen_at is written at most this often, so busy sessions do not write on every request. */
export const touchIntervalMs = 60_000;

export interface ClientInfo {
  ip: string | null;
  userAgent: string | null;
}

/** A new session with a fresh token; the token itself goes only into the cookie. */
export async function startSession(
  db: Executor,
  config: Config,
  userId: number,
  client: ClientInfo,
  now = new Date(),
): Promise<{ token: string; expiresAt: Date; sessionId: number }> {
  const token = generateSecretToken();
  const expiresAt = new Date(now.getTime() + config.SESSION_ABSOLUTE_HOURS * 3_600_000);
  const sessionId = await insertSession(db, { tokenHash: hashSecretToken(token), userId, now, expiresAt, ...client });
  return { token, expiresAt, sessionId };
}

/**
 * The session a cookie token stands for, or undefined when it is unknown, past its absolute or
 * idle expiry, or its user was deactivated. An expired session is deleted on sight.
 */
export async function resumeSession(db: Database, config: Config, token: string, now = new Date()): Promise<CurrentSession | undefined> {
  const record = await findSession(db, hashSecretToken(token));
  if (!record) return undefined;
  const idleDeadline = record.lastSeenAt.getTime() + config.SESSION_IDLE_MINUTES * 60_000;
  if (record.expiresAt.getTime() <= now.getTime() || idleDeadline <= now.getTime() || !record.user.active) {
    await deleteSession(db, record.sessionId);
    return undefined;
  }
  if (now.getTime() - record.lastSeenAt.getTime() >= touchIntervalMs) await touchSession(db, record.sessionId, now);
  const { active: _active, ...user } = record.user;
  const siteIds = user.roles.includes('viewer') ? await grantedSiteIds(db, user.id) : [];
  return { sessionId: record.sessionId, user: { ...user, siteIds } };
}

export const endSession = deleteSession;

/** After a password change or deactivation: nobody holding an old cookie stays signed in. */
export const endAllSessionsOf = deleteSessionsOfUser;
