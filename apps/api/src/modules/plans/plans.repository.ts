import { and, count, eq, isNull, like, lte, sql, type SQL } from 'drizzle-orm';
import type { ResultSetHeader } from 'mysql2';
import type { Executor } from '../../access/executor';
import type { SiteScope } from '../../access/site-scope';
import type { Database } from '../../db/client';
import { banks, inspectionPlans, sites } from '../../db/schema/index';
import { offset, orderBy } from '../../db/versioned';
import { inScope } from '../register/scope-filter';

export type PlanRow = typeof inspectionPlans.$inferSelect;
export interface PlanView {
  plan: PlanRow;
  bankName: string;
  siteId: number;
  siteName: string;
}

const viewColumns = { plan: inspectionPlans, bankName: banks.name, siteId: banks.siteId, siteName: sites.name };
const viewFrom = (db: Executor) =>
  db.select(viewColumns).from(inspectionPlans).innerJoin(banks, eq(banks.id, inspectionPlans.bankId)).innerJoin(sites, eq(sites.id, banks.siteId));

export interface PlanFilter {
  scope: SiteScope;
  bankId?: number | undefined;
  siteId?: number | undefined;
  active?: boolean | undefined;
  q?: string | undefined;
}

export async function listPlanViews(
  db: Database,
  f: PlanFilter,
  page: { sort: string; page: number; pageSize: number },
): Promise<{ rows: PlanView[]; total: number }> {
  const where: SQL | undefined = and(
    inScope(f.scope, banks.siteId),
    f.bankId ? eq(inspectionPlans.bankId, f.bankId) : undefined,
    f.siteId ? eq(banks.siteId, f.siteId) : undefined,
    f.active === undefined ? undefined : eq(inspectionPlans.active, f.active),
    f.q ? like(inspectionPlans.name, `%${f.q.replace(/[\\%_]/g, '\\$&')}%`) : undefined,
  );
  const [rows, [total]] = await Promise.all([
    viewFrom(db)
      .where(where)
      .orderBy(orderBy(page.sort, { nextDueOn: inspectionPlans.nextDueOn }), inspectionPlans.id)
      .limit(page.pageSize)
      .offset(offset(page.page, page.pageSize)),
    db
      .select({ n: count() })
      .from(inspectionPlans)
      .innerJoin(banks, eq(banks.id, inspectionPlans.bankId))
      .where(where),
  ]);
  return { rows, total: total?.n ?? 0 };
}

export async function findPlanView(db: Executor, id: number): Promise<PlanView | undefined> {
  const [row] = await viewFrom(db).where(eq(inspectionPlans.id, id));
  return row;
}

export async function insertPlan(db: Executor, values: typeof inspectionPlans.$inferInsert): Promise<number> {
  const [created] = await db.insert(inspectionPlans).values(values).$returningId();
  return created!.id;
}

/** Ids of active plans on banks in service whose next order is due by `today` (next due − lead days ≤ today). */
export async function duePlanIds(db: Database, today: string): Promise<number[]> {
  const rows = await db
    .select({ id: inspectionPlans.id })
    .from(inspectionPlans)
    .innerJoin(banks, eq(banks.id, inspectionPlans.bankId))
    .where(
      and(
        eq(inspectionPlans.active, true),
        isNull(banks.retiredAt),
        lte(sql`DATE_SUB(${inspectionPlans.nextDueOn}, INTERVAL ${inspectionPlans.leadDays} DAY)`, today),
      ),
    )
    .orderBy(inspectionPlans.id);
  return rows.map((r) => r.id);
}

/** The plan row locked for this transaction (SELECT … FOR UPDATE): one scheduler at a time per plan. */
export async function lockPlan(db: Executor, id: number): Promise<PlanView | undefined> {
  const [row] = await viewFrom(db).where(eq(inspectionPlans.id, id)).for('update');
  return row;
}

export async function advancePlan(db: Executor, id: number, version: number, nextDueOn: string): Promise<boolean> {
  const result = (await db
    .update(inspectionPlans)
    .set({ nextDueOn, version: sql`${inspectionPlans.version} + 1` })
    .where(and(eq(inspectionPlans.id, id), eq(inspectionPlans.version, version)))) as unknown as [ResultSetHeader];
  return result[0].affectedRows === 1;
}
