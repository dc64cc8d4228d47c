import * as z from 'zod/mini';
import { isoDate, listQuery, queryId, recordId, required, text, version } from './common';
import { checklist, checklistItems } from './work-orders';

// Contracts for inspection plans: the schedules that create inspection orders when they fall due.

export const inspectionPlanCreate = z.strictObject({
  bankId: recordId,
  name: required(120),
  intervalMonths: z.number().check(z.int(), z.gte(1, 'At least 1 month'), z.lte(120, 'At most 120 months')),
  leadDays: z._default(z.number().check(z.int(), z.gte(0), z.lte(120)), 14),
  checklist: checklist.check(z.minLength(1, 'Choose at least one reading'), z.maxLength(checklistItems.length)),
  nextDueOn: isoDate,
  active: z._default(z.boolean(), true),
});
export const inspectionPlanUpdate = z.strictObject({
  name: z.optional(text(120).check(z.minLength(1))),
  intervalMonths: z.optional(z.number().check(z.int(), z.gte(1), z.lte(120))),
  leadDays: z.optional(z.number().check(z.int(), z.gte(0), z.lte(120))),
  checklist: z.optional(checklist.check(z.minLength(1))),
  nextDueOn: z.optional(isoDate),
  active: z.optional(z.boolean()),
  version,
});
export const inspectionPlan = z.object({
  id: z.number(),
  bankId: z.number(),
  bankName: z.string(),
  siteId: z.number(),
  siteName: z.string(),
  name: z.string(),
  intervalMonths: z.number(),
  leadDays: z.number(),
  checklist,
  nextDueOn: z.string(),
  active: z.boolean(),
  version: z.number(),
});
export type InspectionPlan = z.infer<typeof inspectionPlan>;
export const inspectionPlanListQuery = z.extend(listQuery(['nextDueOn', '-nextDueOn'] as const, 'nextDueOn'), {
  bankId: z.optional(queryId),
  siteId: z.optional(queryId),
  active: z.optional(z.enum(['true', 'false'])),
});

// Inspection interval helper (NETA MTS Appendix B: a base interval times a factor for the
// reliability the site needs and the condition of the equipment).

export const reliabilityNeeds = ['low', 'medium', 'high'] as const;
export const equipmentConditions = ['poor', 'average', 'good'] as const;

export const inspectionIntervalQuery = z.object({
  baseIntervalMonths: z.coerce.number().check(z.int(), z.gte(1, 'At least 1 month'), z.lte(120, 'At most 120 months')),
  reliability: z.enum(reliabilityNeeds, { error: 'Reliability need is low, medium or high' }),
  condition: z.enum(equipmentConditions, { error: 'Condition is poor, average or good' }),
});
export const inspectionInterval = z.object({
  baseIntervalMonths: z.number(),
  reliability: z.enum(reliabilityNeeds),
  condition: z.enum(equipmentConditions),
  factor: z.number(),
  /** base × factor, unrounded. */
  exactMonths: z.number(),
  /** The whole number of months (at least 1) to put in a plan's intervalMonths. */
  intervalMonths: z.number(),
  source: z.string(),
});
export type InspectionInterval = z.infer<typeof inspectionInterval>;
