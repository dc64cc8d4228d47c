import type { Role, WorkOrderKind, WorkOrderState } from '@varden/schemas';
import { and, asc, count, desc, eq, gte, inArray, isNull, like, lte, or, sql, type SQL } from 'drizzle-orm';
import { alias } from 'drizzle-orm/mysql-core';
import type { ResultSetHeader } from 'mysql2';
import type { Executor } from '../../access/executor';
import type { SiteScope } from '../../access/site-scope';
import type { Database } from '../../db/client';
import { banks, readings, sites, userRoles, users, workOrders, workOrderTransitions } from '../../db/schema/index';
import { offset, orderBy } from '../../db/versioned';
import { inScope } from '../register/scope-filter';

export type WorkOrderRow = typeof workOrders.$inferSelect;

/** An order with the names a list or a page shows beside it. */
export interface WorkOrderView {
  order: WorkOrderRow;
  siteName: string;
  siteTimeZone: string;
  bankName: string;
  assigneeName: string | null;
  /** The comment of the order's latest move to sent-back, or null when it was never sent back. */
  returnReason: string | null;
}

const assignee = alias(users, 'assignee');

const viewColumns = {
  order: workOrders,
  siteName: sites.name,
  siteTimeZone: sites.timeZone,
  bankName: banks.name,
  assigneeName: assignee.name,
  returnReason: sql<string | null>`(select ${workOrderTransitions.comment} from ${workOrderTransitions} where ${workOrderTransitions.workOrderId} = ${workOrders.id} and ${workOrderTransitions.toState} = 'sent-back' order by ${workOrderTransitions.at} desc, ${workOrderTransitions.id} desc limit 1)`,
};

const viewFrom = (db: Executor) =>
  db
    .select(viewColumns)
    .from(workOrders)
    .innerJoin(sites, eq(sites.id, workOrders.siteId))
    .innerJoin(banks, eq(banks.id, workOrders.bankId))
    .leftJoin(assignee, eq(assignee.id, workOrders.assigneeId));

/** What a list of orders may be narrowed by; every field is optional. */
export interface WorkOrderFilter {
  scope: SiteScope;
  states?: WorkOrderState[] | undefined;
  siteId?: number | undefined;
  bankId?: number | undefined;
  /** A user id, or null for orders nobody is assigned to. */
  assigneeId?: number | null | undefined;
  dueFrom?: string | undefined;
  dueTo?: string | undefined;
  kind?: WorkOrderKind | undefined;
  planId?: number | undefined;
  q?: string | undefined;
}

function whereOf(f: WorkOrderFilter): SQL | undefined {
  const pattern = f.q ? `%${f.q.replace(/[\\%_]/g, '\\$&')}%` : undefined;
  return and(
    inScope(f.scope, workOrders.siteId),
    f.states && f.states.length > 0 ? inArray(workOrders.state, f.states) : undefined,
    f.siteId ? eq(workOrders.siteId, f.siteId) : undefined,
    f.bankId ? eq(workOrders.bankId, f.bankId) : undefined,
    f.assigneeId === null ? isNull(workOrders.assigneeId) : f.assigneeId ? eq(workOrders.assigneeId, f.assigneeId) : undefined,
    f.dueFrom ? gte(workOrders.dueOn, f.dueFrom) : undefined,
    f.dueTo ? lte(workOrders.dueOn, f.dueTo) : undefined,
    f.kind ? eq(workOrders.kind, f.kind) : undefined,
    f.planId ? eq(workOrders.planId, f.planId) : undefined,
    pattern ? or(like(workOrders.title, pattern), like(banks.name, pattern), like(sites.name, pattern)) : undefined,
  );
}

const sortable = { dueOn: workOrders.dueOn, priority: workOrders.priority, state: workOrders.state, createdAt: workOrders.createdAt };

export async function listOrderViews(
  db: Database,
  f: WorkOrderFilter,
  page: { sort: string; page: number; pageSize: number },
): Promise<{ rows: WorkOrderView[]; total: number }> {
  const where = whereOf(f);
  const [rows, [total]] = await Promise.all([
    viewFrom(db)
      .where(where)
      .orderBy(orderBy(page.sort, sortable), page.sort.startsWith('-') ? desc(workOrders.id) : asc(workOrders.id))
      .limit(page.pageSize)
      .offset(offset(page.page, page.pageSize)),
    db
      .select({ n: count() })
      .from(workOrders)
      .innerJoin(sites, eq(sites.id, workOrders.siteId))
      .innerJoin(banks, eq(banks.id, workOrders.bankId))
      .where(where),
  ]);
  return { rows, total: total?.n ?? 0 };
}

/** Every order matching the filter, up to `limit`, for exports. */
export async function allOrderViews(db: Database, f: WorkOrderFilter, sort: string, limit: number): Promise<WorkOrderView[]> {
  return viewFrom(db)
    .where(whereOf(f))
    .orderBy(orderBy(sort, sortable), asc(workOrders.id))
    .limit(limit);
}

export async function findOrderView(db: Executor, id: number): Promise<WorkOrderView | undefined> {
  const [row] = await viewFrom(db).where(eq(workOrders.id, id));
  return row;
}

export async function insertOrder(db: Executor, values: typeof workOrders.$inferInsert): Promise<number> {
  const [created] = await db.insert(workOrders).values(values).$returningId();
  return created!.id;
}

export async function insertTransition(db: Executor, values: typeof workOrderTransitions.$inferInsert): Promise<void> {
  await db.insert(workOrderTransitions).values(values);
}

/**
 * Moves an order from one state to another with its changes, only if nobody changed it since
 * `version` was read and it is not locked: returns false when the row did not match.
 */
export async function updateOrderIfCurrent(
  db: Executor,
  id: number,
  expected: { version: number; state: WorkOrderState },
  values: Partial<typeof workOrders.$inferInsert>,
): Promise<boolean> {
  const result = (await db
    .update(workOrders)
    .set({ ...values, version: sql`${workOrders.version} + 1` })
    .where(
      and(eq(workOrders.id, id), eq(workOrders.version, expected.version), eq(workOrders.state, expected.state), eq(workOrders.locked, false)),
    )) as unknown as [ResultSetHeader];
  return result[0].affectedRows === 1;
}

export async function findOrderRow(db: Executor, id: number): Promise<WorkOrderRow | undefined> {
  const [row] = await db.select().from(workOrders).where(eq(workOrders.id, id));
  return row;
}

export interface TransitionView {
  fromState: WorkOrderState | null;
  toState: WorkOrderState;
  actorId: number | null;
  actorName: string | null;
  comment: string;
  at: Date;
}

export async function listTransitions(db: Database, orderId: number): Promise<TransitionView[]> {
  return db
    .select({
      fromState: workOrderTransitions.fromState,
      toState: workOrderTransitions.toState,
      actorId: workOrderTransitions.actorId,
      actorName: users.name,
      comment: workOrderTransitions.comment,
      at: workOrderTransitions.at,
    })
    .from(workOrderTransitions)
    .leftJoin(users, eq(users.id, workOrderTransitions.actorId))
    .where(eq(workOrderTransitions.workOrderId, orderId))
    .orderBy(asc(workOrderTransitions.at), asc(workOrderTransitions.id));
}

export async function countReadings(db: Executor, orderId: number): Promise<number> {
  const [row] = await db.select({ n: count() }).from(readings).where(eq(readings.workOrderId, orderId));
  return row?.n ?? 0;
}

export interface Person {
  id: number;
  name: string;
  email: string;
}

/** Active people holding a role, by name. */
export async function activePeopleWithRole(db: Executor, role: Role): Promise<Person[]> {
  return db
    .select({ id: users.id, name: users.name, email: users.email })
    .from(users)
    .innerJoin(userRoles, and(eq(userRoles.userId, users.id), eq(userRoles.role, role)))
    .where(eq(users.active, true))
    .orderBy(asc(users.name), asc(users.id));
}

/** A person with their roles, or undefined; inactive people are returned too (active tells). */
export async function findPerson(db: Executor, id: number): Promise<(Person & { active: boolean; roles: Role[] }) | undefined> {
  const [row] = await db.select({ id: users.id, name: users.name, email: users.email, active: users.active }).from(users).where(eq(users.id, id));
  if (!row) return undefined;
  const roles = (await db.select({ role: userRoles.role }).from(userRoles).where(eq(userRoles.userId, id))).map((r) => r.role);
  return { ...row, roles };
}
