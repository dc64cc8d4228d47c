import { and, eq, lt, ne, or, sql } from 'drizzle-orm';
import type { Executor } from './executor';
import type { Database } from '../db/client';
import { perDatabase } from '../db/prepared';
import { sessions, userRoles, users, viewerSiteGrants } from '../db/schema/index';
import type { Role } from './policy';

/** The SQL side of sessions. Only token hashes reach this file. */

export interface NewSession {
  tokenHash: string;
  userId: number;
  now: Date;
  expiresAt: Date;
  ip: string | null;
  userAgent: string | null;
}

export async function insertSession(db: Executor, s: NewSession): Promise<number> {
  const [created] = await db
    .insert(sessions)
    .values({
      tokenHash: s.tokenHash,
      userId: s.userId,
      createdAt: s.now,
      lastSeenAt: s.now,
      expiresAt: s.expiresAt,
      ip: s.ip?.slice(0, 45) ?? null,
      userAgent: s.userAgent?.slice(0, 300) ?? null,
    })
    .$returningId();
  return created!.id;
}

export interface SessionRecord {
  sessionId: number;
  lastSeenAt: Date;
  expiresAt: Date;
  user: { id: number; email: string; name: string; active: boolean; roles: Role[] };
}

const sessionLookup = perDatabase((db) =>
  db
    .select({
      sessionId: sessions.id,
      lastSeenAt: sessions.lastSeenAt,
      expiresAt: sessions.expiresAt,
      userId: users.id,
      email: users.email,
      name: users.name,
      active: users.active,
      roles: sql<string | null>`(SELECT GROUP_CONCAT(${userRoles.role}) FROM ${userRoles} WHERE ${userRoles.userId} = ${users.id})`,
    })
    .from(sessions)
    .innerJoin(users, eq(users.id, sessions.userId))
    .where(eq(sessions.tokenHash, sql.placeholder('tokenHash')))
    .prepare(),
);

/** The session with its user and roles in one round trip. */
export async function findSession(db: Database, tokenHash: string): Promise<SessionRecord | undefined> {
  const [row] = await sessionLookup(db).execute({ tokenHash });
  if (!row) return undefined;
  return {
    sessionId: row.sessionId,
    lastSeenAt: row.lastSeenAt,
    expiresAt: row.expiresAt,
    user: {
      id: row.userId,
      email: row.email,
      name: row.name,
      active: row.active,
      roles: row.roles ? (row.roles.split(',') as Role[]) : [],
    },
  };
}

export async function grantedSiteIds(db: Executor, userId: number): Promise<number[]> {
  const rows = await db
    .select({ siteId: viewerSiteGrants.siteId })
    .from(viewerSiteGrants)
    .where(eq(viewerSiteGrants.userId, userId))
    .orderBy(viewerSiteGrants.siteId);
  return rows.map((r) => r.siteId);
}

export async function touchSession(db: Executor, sessionId: number, now: Date): Promise<void> {
  await db.update(sessions).set({ lastSeenAt: now }).where(eq(sessions.id, sessionId));
}

export async function deleteSession(db: Executor, sessionId: number): Promise<void> {
  await db.delete(sessions).where(eq(sessions.id, sessionId));
}

/** Ends every session of a user, or every other one when `exceptSessionId` is given. */
export async function deleteSessionsOfUser(db: Executor, userId: number, exceptSessionId?: number): Promise<void> {
  await db
    .delete(sessions)
    .where(and(eq(sessions.userId, userId), exceptSessionId === undefined ? undefined : ne(sessions.id, exceptSessionId)));
}

/** Removes sessions past their absolute or idle expiry; for a periodic job. */
export async function deleteExpiredSessions(db: Executor, now: Date, idleMinutes: number): Promise<void> {
  const idleSince = new Date(now.getTime() - idleMinutes * 60_000);
  await db.delete(sessions).where(or(lt(sessions.expiresAt, now), lt(sessions.lastSeenAt, idleSince)));
}
