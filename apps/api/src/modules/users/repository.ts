import { and, asc, count, desc, eq, exists, inArray, isNotNull, isNull, like, or, sql, type SQL } from 'drizzle-orm';
import type { Role, UserStatus } from '@varden/schemas';
import type { Database } from '../../db/client';
import { sites, userRoles, users, viewerSiteGrants } from '../../db/schema/index';
import { AppError } from '../../http/app-error';
import { offset, orderBy } from '../../db/versioned';
import type { Executor } from '../../access/executor';

export type { Executor };

export type UserRow = typeof users.$inferSelect;
export type UserRecord = UserRow & { roles: Role[]; siteIds: number[] };

const roleOrder: Record<Role, number> = { admin: 0, planner: 1, technician: 2, supervisor: 3, viewer: 4 };

export async function findUserRowByEmail(db: Executor, email: string): Promise<UserRow | undefined> {
  const [row] = await db.select().from(users).where(eq(users.email, email));
  return row;
}

export async function findUserRecord(db: Executor, id: number): Promise<UserRecord | undefined> {
  const [row] = await db.select().from(users).where(eq(users.id, id));
  if (!row) return undefined;
  const [record] = await withAccess(db, [row]);
  return record;
}

/** Adds roles and site grants to user rows with two queries, whatever the number of rows. */
export async function withAccess(db: Executor, rows: UserRow[]): Promise<UserRecord[]> {
  if (rows.length === 0) return [];
  const ids = rows.map((r) => r.id);
  const [roleRows, grantRows] = await Promise.all([
    db.select().from(userRoles).where(inArray(userRoles.userId, ids)),
    db
      .select({ userId: viewerSiteGrants.userId, siteId: viewerSiteGrants.siteId })
      .from(viewerSiteGrants)
      .where(inArray(viewerSiteGrants.userId, ids))
      .orderBy(viewerSiteGrants.siteId),
  ]);
  return rows.map((row) => ({
    ...row,
    roles: roleRows
      .filter((r) => r.userId === row.id)
      .map((r) => r.role)
      .sort((a, b) => roleOrder[a] - roleOrder[b]),
    siteIds: grantRows.filter((g) => g.userId === row.id).map((g) => g.siteId),
  }));
}

export async function insertUser(db: Executor, values: typeof users.$inferInsert): Promise<number> {
  const [created] = await db.insert(users).values(values).$returningId();
  return created!.id;
}

export async function updateUserRow(db: Executor, id: number, values: Partial<typeof users.$inferInsert>): Promise<void> {
  await db.update(users).set(values).where(eq(users.id, id));
}

// Both replace functions touch only rows that change: a blanket DELETE of a user's rows takes
// gap locks in InnoDB, and two transactions creating users at once then deadlock on the insert.

export async function replaceRoles(db: Executor, userId: number, roles: readonly Role[]): Promise<void> {
  const current = (await db.select({ role: userRoles.role }).from(userRoles).where(eq(userRoles.userId, userId))).map((r) => r.role);
  const gone = current.filter((role) => !roles.includes(role));
  const added = roles.filter((role) => !current.includes(role));
  if (gone.length > 0) await db.delete(userRoles).where(and(eq(userRoles.userId, userId), inArray(userRoles.role, gone)));
  if (added.length > 0) await db.insert(userRoles).values(added.map((role) => ({ userId, role })));
}

export async function replaceSiteGrants(db: Executor, userId: number, siteIds: readonly number[]): Promise<void> {
  const current = (
    await db.select({ siteId: viewerSiteGrants.siteId }).from(viewerSiteGrants).where(eq(viewerSiteGrants.userId, userId))
  ).map((g) => g.siteId);
  const gone = current.filter((id) => !siteIds.includes(id));
  const added = siteIds.filter((id) => !current.includes(id));
  if (gone.length > 0) {
    await db.delete(viewerSiteGrants).where(and(eq(viewerSiteGrants.userId, userId), inArray(viewerSiteGrants.siteId, gone)));
  }
  if (added.length > 0) {
    const known = new Set((await db.select({ id: sites.id }).from(sites).where(inArray(sites.id, added))).map((s) => s.id));
    const unknown = added.filter((id) => !known.has(id));
    if (unknown.length > 0) {
      throw new AppError('invalid', `No site has the id ${unknown.join(', ')}.`, { siteIds: `Unknown site: ${unknown.join(', ')}` });
    }
    await db.insert(viewerSiteGrants).values(added.map((siteId) => ({ userId, siteId })));
  }
}

const statusCondition: Record<UserStatus, SQL | undefined> = {
  active: eq(users.active, true),
  invited: and(eq(users.active, false), isNull(users.deactivatedAt)),
  deactivated: and(eq(users.active, false), isNotNull(users.deactivatedAt)),
};

const sortable = { name: users.name, email: users.email, createdAt: users.createdAt, lastSignInAt: users.lastSignInAt };

export interface UserListFilter {
  page: number;
  pageSize: number;
  sort: string;
  q?: string | undefined;
  role?: Role | undefined;
  status?: UserStatus | undefined;
}

export async function listUserRecords(db: Database, f: UserListFilter): Promise<{ records: UserRecord[]; total: number }> {
  const pattern = f.q ? `%${f.q.replace(/[\\%_]/g, '\\$&')}%` : undefined;
  const where = and(
    pattern ? or(like(users.name, pattern), like(users.email, pattern)) : undefined,
    f.role
      ? exists(
          db
            .select({ one: sql`1` })
            .from(userRoles)
            .where(and(eq(userRoles.userId, users.id), eq(userRoles.role, f.role))),
        )
      : undefined,
    f.status ? statusCondition[f.status] : undefined,
  );
  const [rows, [totalRow]] = await Promise.all([
    db
      .select()
      .from(users)
      .where(where)
      .orderBy(orderBy(f.sort, sortable), f.sort.startsWith('-') ? desc(users.id) : asc(users.id))
      .limit(f.pageSize)
      .offset(offset(f.page, f.pageSize)),
    db.select({ n: count() }).from(users).where(where),
  ]);
  return { records: await withAccess(db, rows), total: totalRow?.n ?? 0 };
}
