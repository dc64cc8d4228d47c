import { maintenanceIntervalMonths, NETA_INTERVAL_FACTORS } from '@varden/engineering';
import type {
  ChecklistItem,
  InspectionInterval,
  InspectionPlan,
  inspectionIntervalQuery,
  inspectionPlanCreate,
  inspectionPlanListQuery,
  inspectionPlanUpdate,
} from '@varden/schemas';
import type { z } from 'zod';
import type { SessionUser } from '../../access/current-user';
import { siteScope } from '../../access/site-scope';
import type { Database } from '../../db/client';
import { inspectionPlans } from '../../db/schema/index';
import { deleteUnreferenced, updateVersioned } from '../../db/versioned';
import { AppError } from '../../http/app-error';
import { assertInScope } from '../register/scope-filter';
import { fromJson } from '../work-orders/to-work-order';
import { bankForNewOrder } from '../work-orders/work-orders.service';
import { findPlanView, insertPlan, listPlanViews, type PlanView } from './plans.repository';

export function toPlan({ plan, bankName, siteId, siteName }: PlanView): InspectionPlan {
  return {
    id: plan.id,
    bankId: plan.bankId,
    bankName,
    siteId,
    siteName,
    name: plan.name,
    intervalMonths: plan.intervalMonths,
    leadDays: plan.leadDays,
    checklist: fromJson<ChecklistItem[]>(plan.checklist as ChecklistItem[] | string),
    nextDueOn: plan.nextDueOn,
    active: plan.active,
    version: plan.version,
  };
}

export async function listPlans(db: Database, user: SessionUser, q: z.output<typeof inspectionPlanListQuery>) {
  const { rows, total } = await listPlanViews(
    db,
    { scope: siteScope(user), bankId: q.bankId, siteId: q.siteId, active: q.active === undefined ? undefined : q.active === 'true', q: q.q },
    q,
  );
  return { items: rows.map(toPlan), total };
}

export async function getPlan(db: Database, user: SessionUser, id: number): Promise<InspectionPlan> {
  const view = await findPlanView(db, id);
  if (!view) throw new AppError('not_found', `Inspection plan ${id} does not exist.`);
  assertInScope(siteScope(user), view.siteId, 'Inspection plan', id);
  return toPlan(view);
}

export async function createPlan(db: Database, input: z.output<typeof inspectionPlanCreate>): Promise<InspectionPlan> {
  await bankForNewOrder(db, input.bankId);
  const id = await insertPlan(db, input);
  return toPlan((await findPlanView(db, id))!);
}

export async function updatePlan(db: Database, id: number, input: z.output<typeof inspectionPlanUpdate>): Promise<InspectionPlan> {
  const { version, ...values } = input;
  await updateVersioned(db, inspectionPlans, id, version, values, 'Inspection plan');
  return toPlan((await findPlanView(db, id))!);
}

export async function deletePlan(db: Database, id: number): Promise<void> {
  await deleteUnreferenced(db, inspectionPlans, id, 'Inspection plan', 'Set it inactive instead: it stops making orders and keeps its history.');
}

/**
 * A plan's interval from NETA MTS Appendix B [STD] (engineering-reference.md §7): a base
 * interval times the factor for the site's reliability need and the equipment's condition,
 * rounded to whole months (at least one) for the plan.
 */
export function inspectionIntervalOf(q: z.output<typeof inspectionIntervalQuery>): InspectionInterval {
  const exactMonths = maintenanceIntervalMonths({ baseIntervalMonths: q.baseIntervalMonths, reliability: q.reliability, condition: q.condition });
  return {
    ...q,
    factor: NETA_INTERVAL_FACTORS[q.reliability][q.condition],
    exactMonths,
    intervalMonths: Math.max(1, Math.round(exactMonths)),
    source: 'NETA MTS Appendix B: base interval × factor for reliability need and equipment condition',
  };
}
