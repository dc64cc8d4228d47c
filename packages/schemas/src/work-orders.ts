import { z } from 'zod';
import { isoDate, listQuery, version } from './common';

// Contracts for inspection plans, work orders and their transitions. State names are Varden's
// own; docs/glossary.md says what each means.

export const workOrderStates = ['queued', 'dispatched', 'on-site', 'awaiting-review', 'sent-back', 'sealed', 'withdrawn'] as const;
export type WorkOrderState = (typeof workOrderStates)[number];
export const workOrderKinds = ['inspection', 'corrective', 'baseline'] as const;
export type WorkOrderKind = (typeof workOrderKinds)[number];
export const priorities = ['low', 'normal', 'high', 'urgent'] as const;

/** What a checklist may ask the technician to record. */
export const checklistItems = [
  'capacitance',
  'visual',
  'case-temperature',
  'discharge-resistor',
  'insulation-resistance',
  'contactor',
  'reactor',
  'fuses',
  'bank',
  'photos',
] as const;
export type ChecklistItem = (typeof checklistItems)[number];

/**
 * The allowed moves between states, and who makes them. The API's work-order service enforces
 * this table; the web reads it to offer only the moves a user can make.
 */
export const workOrderTransitions = {
  queued: { dispatched: 'planner', withdrawn: 'planner' },
  dispatched: { queued: 'planner', 'on-site': 'assignee', withdrawn: 'planner' },
  'on-site': { 'awaiting-review': 'assignee', withdrawn: 'planner' },
  'awaiting-review': { 'sent-back': 'supervisor', sealed: 'supervisor' },
  'sent-back': { 'on-site': 'assignee', withdrawn: 'planner' },
  sealed: {},
  withdrawn: {},
} as const satisfies Record<WorkOrderState, Partial<Record<WorkOrderState, 'planner' | 'assignee' | 'supervisor'>>>;

const text = (max: number) => z.string().trim().max(max, `At most ${max} characters`);

export const inspectionPlanCreate = z
  .object({
    bankId: z.number().int().positive(),
    name: text(120).min(1, 'Required'),
    intervalMonths: z.number().int().min(1, 'At least 1 month').max(120, 'At most 120 months'),
    leadDays: z.number().int().min(0).max(120).default(14),
    checklist: z.array(z.enum(checklistItems)).min(1, 'Choose at least one reading').max(checklistItems.length),
    nextDueOn: isoDate,
    active: z.boolean().default(true),
  })
  .strict();
export const inspectionPlanUpdate = z
  .object({
    name: text(120).min(1).optional(),
    intervalMonths: z.number().int().min(1).max(120).optional(),
    leadDays: z.number().int().min(0).max(120).optional(),
    checklist: z.array(z.enum(checklistItems)).min(1).optional(),
    nextDueOn: isoDate.optional(),
    active: z.boolean().optional(),
    version,
  })
  .strict();
export const inspectionPlan = z.object({
  id: z.number(),
  bankId: z.number(),
  name: z.string(),
  intervalMonths: z.number(),
  leadDays: z.number(),
  checklist: z.array(z.enum(checklistItems)),
  nextDueOn: z.string(),
  active: z.boolean(),
  version: z.number(),
});
export type InspectionPlan = z.infer<typeof inspectionPlan>;
export const inspectionPlanListQuery = listQuery(['nextDueOn', '-nextDueOn'] as const, 'nextDueOn').extend({
  bankId: z.coerce.number().int().positive().optional(),
});

export const workOrderCreate = z
  .object({
    kind: z.enum(workOrderKinds),
    bankId: z.number().int().positive(),
    title: text(200).min(1, 'Required'),
    instructions: text(4000).default(''),
    checklist: z.array(z.enum(checklistItems)).min(1, 'Choose at least one reading'),
    dueOn: isoDate,
    priority: z.enum(priorities).default('normal'),
    assigneeId: z.number().int().positive().nullable().default(null),
  })
  .strict();
export type WorkOrderCreate = z.input<typeof workOrderCreate>;

/** Reschedule, reassign or edit; a stale version gets 409, a sealed order 409 (locked). */
export const workOrderUpdate = z
  .object({
    title: text(200).min(1).optional(),
    instructions: text(4000).optional(),
    checklist: z.array(z.enum(checklistItems)).min(1).optional(),
    dueOn: isoDate.optional(),
    priority: z.enum(priorities).optional(),
    assigneeId: z.number().int().positive().nullable().optional(),
    version,
  })
  .strict();

export const workOrderTransitionRequest = z
  .object({
    to: z.enum(workOrderStates),
    version,
    comment: text(1000).default(''),
    /** Sealing only: what the signer attests, recorded with their name and the time. */
    signatureMeaning: text(400).optional(),
  })
  .strict();

export const transitionRecord = z.object({
  fromState: z.enum(workOrderStates).nullable(),
  toState: z.enum(workOrderStates),
  actorName: z.string().nullable(),
  comment: z.string(),
  at: z.string(),
});

export const workOrder = z.object({
  id: z.number(),
  kind: z.enum(workOrderKinds),
  siteId: z.number(),
  siteName: z.string(),
  bankId: z.number(),
  bankName: z.string(),
  planId: z.number().nullable(),
  flagId: z.number().nullable(),
  title: z.string(),
  instructions: z.string(),
  checklist: z.array(z.enum(checklistItems)),
  dueOn: z.string(),
  priority: z.enum(priorities),
  assigneeId: z.number().nullable(),
  assigneeName: z.string().nullable(),
  state: z.enum(workOrderStates),
  locked: z.boolean(),
  overdue: z.boolean(),
  safetyAcknowledgedAt: z.string().nullable(),
  submittedAt: z.string().nullable(),
  signedAt: z.string().nullable(),
  signedByName: z.string().nullable(),
  signatureMeaning: z.string().nullable(),
  version: z.number(),
  createdAt: z.string(),
});
export type WorkOrder = z.infer<typeof workOrder>;

export const workOrderListQuery = listQuery(['dueOn', '-dueOn', 'priority', '-priority', 'state', 'createdAt', '-createdAt'] as const, 'dueOn').extend({
  state: z
    .union([z.enum(workOrderStates), z.string().regex(/^[a-z-]+(,[a-z-]+)+$/)])
    .optional()
    .describe('one state, or several separated by commas'),
  siteId: z.coerce.number().int().positive().optional(),
  bankId: z.coerce.number().int().positive().optional(),
  assigneeId: z.union([z.coerce.number().int().positive(), z.literal('me'), z.literal('none')]).optional(),
  dueFrom: isoDate.optional(),
  dueTo: isoDate.optional(),
  kind: z.enum(workOrderKinds).optional(),
});

/** The default meaning of a supervisor's signature; the signer may word it for the site. */
export const defaultSignatureMeaning =
  'I have reviewed the readings, results, flags and photos of this order and accept them as the maintenance record.';
