import type { ChecklistItem } from '@varden/schemas';
import type { AppContext } from '../../context';
import { bumpReadRevision } from '../../db/read-cache';
import { isDuplicateKey } from '../../db/versioned';
import { addDays, addMonths, utcDate } from '../work-orders/calendar';
import { fromJson } from '../work-orders/to-work-order';
import { insertQueuedOrder } from '../work-orders/work-orders.service';
import { advancePlan, duePlanIds, lockPlan } from './plans.repository';

const checklistWords: Record<ChecklistItem, string> = {
  capacitance: 'the capacitance of every unit',
  visual: 'the visual checks',
  'case-temperature': 'case temperatures',
  'discharge-resistor': 'discharge resistors',
  'insulation-resistance': 'insulation resistance',
  contactor: 'contactors',
  reactor: 'detuning reactors',
  fuses: 'fuses',
  bank: "the controller's PF and cleaning",
  photos: 'photos',
};

export const inspectionInstructions = (checklist: ChecklistItem[]) =>
  `Scheduled inspection. Record ${checklist.map((c) => checklistWords[c]).join(', ')}, as the checklist asks.`;

export interface DueInspectionsResult {
  /** Ids of the orders this call created. */
  created: number[];
  /** Plans that another instance had already handled. */
  skipped: number;
}

/**
 * Creates the next inspection order of every plan that is due (today ≥ next due − lead days),
 * exactly once however many instances run this at the same moment: each plan is handled in its
 * own transaction holding the plan's row lock, the re-read under the lock sees whether another
 * instance moved the plan on, and the unique key work_orders(plan_id, due_on) refuses a second
 * order for the same due date. The plan then moves on by its interval, past today: missed
 * dates are not made up one by one, the overdue order stands for them.
 */
export async function createDueInspectionOrders(ctx: AppContext, today: string = utcDate()): Promise<DueInspectionsResult> {
  const result: DueInspectionsResult = { created: [], skipped: 0 };
  try {
    await createDueOrders(ctx, today, result);
  } finally {
    // Outside the API, so the revision moves on here: the new orders show in every stored list at once.
    if (result.created.length > 0) await bumpReadRevision(ctx.db);
  }
  return result;
}

async function createDueOrders(ctx: AppContext, today: string, result: DueInspectionsResult): Promise<void> {
  for (const planId of await duePlanIds(ctx.db, today)) {
    try {
      const created = await ctx.db.transaction(async (tx) => {
        const view = await lockPlan(tx, planId);
        if (!view || !view.plan.active) return undefined;
        const { plan } = view;
        if (addDays(plan.nextDueOn, -plan.leadDays) > today) return undefined;
        const checklist = fromJson<ChecklistItem[]>(plan.checklist as ChecklistItem[] | string);
        const orderId = await insertQueuedOrder(
          tx,
          {
            kind: 'inspection',
            siteId: view.siteId,
            bankId: plan.bankId,
            planId: plan.id,
            title: plan.name,
            instructions: inspectionInstructions(checklist),
            checklist,
            dueOn: plan.nextDueOn,
            priority: 'normal',
            assigneeId: null,
            createdById: null,
          },
          null,
          `Created from the inspection plan “${plan.name}”`,
        );
        let next = addMonths(plan.nextDueOn, plan.intervalMonths);
        while (next <= today) next = addMonths(next, plan.intervalMonths);
        await advancePlan(tx, plan.id, plan.version, next);
        return orderId;
      });
      if (created === undefined) result.skipped += 1;
      else result.created.push(created);
    } catch (error) {
      // The unique key: another instance made this order between our read and our insert.
      if (isDuplicateKey(error)) result.skipped += 1;
      else throw error;
    }
  }
  if (result.created.length > 0) ctx.log.info({ created: result.created }, 'inspection orders created from plans');
}

