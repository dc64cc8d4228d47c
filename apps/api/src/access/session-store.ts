import { and, eq, inArray, lt, ne, or, sql } from 'drizzle-orm';
import type { Executor } from './executor';
import type { Database } from '../db/client';
import { perDatabase } from '../db/prepared';
import { numberedPlaceholders, perCount } from '../db/statement-batch';
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

/** Distinct tokens looked up in one query at most; more wait for the next. */
const lookupsPerQuery = 32;

const sessionColumns = {
  tokenHash: sessions.tokenHash,
  sessionId: sessions.id,
  lastSeenAt: sessions.lastSeenAt,
  expiresAt: sessions.expiresAt,
  userId: users.id,
  email: users.email,
  name: users.name,
  active: users.active,
  roles: sql<string | null>`(SELECT GROUP_CONCAT(${userRoles.role}) FROM ${userRoles} WHERE ${userRoles.userId} = ${users.id})`,
};

/** The lookup of `n` tokens at once, prepared once per database and count. */
const sessionLookups = perDatabase((db) =>
  perCount((n) =>
    db
      .select(sessionColumns)
      .from(sessions)
      .innerJoin(users, eq(users.id, sessions.userId))
      .where(inArray(sessions.tokenHash, numberedPlaceholders('h', n)))
      .prepare(),
  ),
);

type SessionRow = Awaited<ReturnType<ReturnType<ReturnType<typeof sessionLookups>>['execute']>>[number];
type Waiter = { resolve: (row: SessionRow | undefined) => void; reject: (error: unknown) => void };

/**
 * The lookups asked for in one turn of the event loop, sent together once the turn's callbacks
 * have run (setImmediate): every request a poll of the sockets brought in costs one query
 * between them, not one each. Each caller's tokens are looked up by a query sent after it
 * asked, as a lookup of its own would be.
 */
const pendingLookups = perDatabase((db) => {
  const waiting = new Map<string, Waiter[]>();
  let scheduled = false;
  const send = () => {
    scheduled = false;
    const hashes = [...waiting.keys()].slice(0, lookupsPerQuery);
    const waiters = hashes.map((h) => [h, waiting.get(h)!] as const);
    for (const h of hashes) waiting.delete(h);
    if (waiting.size > 0) schedule();
    const values = Object.fromEntries(hashes.map((h, i) => [`h${i}`, h]));
    sessionLookups(db)(hashes.length)
      .execute(values)
      .then(
        (rows) => {
          for (const [hash, list] of waiters) {
            const row = rows.find((r) => r.tokenHash === hash);
            for (const w of list) w.resolve(row);
          }
        },
        (error: unknown) => {
          for (const [, list] of waiters) for (const w of list) w.reject(error);
        },
      );
  };
  const schedule = () => {
    if (scheduled) return;
    scheduled = true;
    setImmediate(send);
  };
  return (tokenHash: string) =>
    new Promise<SessionRow | undefined>((resolve, reject) => {
      const list = waiting.get(tokenHash);
      if (list) list.push({ resolve, reject });
      else waiting.set(tokenHash, [{ resolve, reject }]);
      schedule();
    });
});

/** The session with its user and roles (one query for all the lookups of a turn of the event loop). */
export async function findSession(db: Database, tokenHash: string): Promise<SessionRecord | undefined> {
  const row = await pendingLookups(db)(tokenHash);
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
