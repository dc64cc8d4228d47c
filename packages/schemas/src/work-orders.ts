import { z } from 'zod';
import { isoDate, listQuery, version } from './common';
import { flag, photo, reading } from './readings';

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
  bankName: z.string(),
  siteId: z.number(),
  siteName: z.string(),
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
  siteId: z.coerce.number().int().positive().optional(),
  active: z.enum(['true', 'false']).optional(),
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
    /** Dispatching only: the technician to dispatch to, when not already set on the order. */
    assigneeId: z.number().int().positive().optional(),
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
  /** Why a supervisor last sent the order back (the comment of its latest move to sent-back), or null when never sent back. */
  returnReason: z.string().nullable(),
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

// ---------------------------------------------------------------------------------------------
// Inspection interval helper (NETA MTS Appendix B: a base interval times a factor for the
// reliability the site needs and the condition of the equipment).

export const reliabilityNeeds = ['low', 'medium', 'high'] as const;
export const equipmentConditions = ['poor', 'average', 'good'] as const;

export const inspectionIntervalQuery = z.object({
  baseIntervalMonths: z.coerce.number().int().min(1, 'At least 1 month').max(120, 'At most 120 months'),
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

// ---------------------------------------------------------------------------------------------
// An order opened for the walkthrough: its bank as built, the safety card, what was recorded.

export const walkthroughUnit = z.object({
  id: z.number(),
  position: z.number(),
  nameplateKvar: z.number(),
  nameplateVoltageV: z.number(),
  nameplateFrequencyHz: z.number(),
  connection: z.enum(['delta', 'star', 'single-phase']),
  capacitanceUF: z.number(),
  toleranceMinusPct: z.number(),
  tolerancePlusPct: z.number(),
  dischargeTimeS: z.number(),
  serial: z.string(),
  maker: z.string(),
  model: z.string(),
  installedOn: z.string().nullable(),
});
export const walkthroughStep = z.object({
  id: z.number(),
  number: z.number(),
  ratedKvar: z.number(),
  units: z.array(walkthroughUnit),
  contactor: z
    .object({ id: z.number(), ratedOperations: z.number(), counterAtInstall: z.number(), maker: z.string(), model: z.string() })
    .nullable(),
  reactor: z
    .object({ id: z.number(), inductanceMH: z.number(), ratedCurrentA: z.number(), detuningFactor: z.number(), maker: z.string(), model: z.string() })
    .nullable(),
  fuseSet: z.object({ id: z.number(), ratedCurrentA: z.number(), type: z.string() }).nullable(),
});
export const walkthroughBank = z.object({
  id: z.number(),
  name: z.string(),
  location: z.string(),
  detuned: z.boolean(),
  detuningFactor: z.number().nullable(),
  siteId: z.number(),
  siteName: z.string(),
  siteVoltageV: z.number(),
  siteFrequencyHz: z.number(),
  steps: z.array(walkthroughStep),
});
export type WalkthroughBank = z.infer<typeof walkthroughBank>;

/** The safety card every technician order opens with; acknowledging it moves the order on site. */
export const safetyCard = z.object({
  /** The longest rated discharge time on the bank's nameplates, s. */
  dischargeWaitS: z.number(),
  /** False when no unit of the bank has a registered discharge time and a cautious default is shown. */
  dischargeWaitFromNameplates: z.boolean(),
  /** The most energy one element of the bank's units stores at rated voltage, J (null without units). */
  maxStoredEnergyJ: z.number().nullable(),
  steps: z.array(z.object({ title: z.string(), text: z.string() })),
  ppeNote: z.string(),
  deferral: z.string(),
  acknowledgedAt: z.string().nullable(),
  acknowledgedByName: z.string().nullable(),
});
export type SafetyCard = z.infer<typeof safetyCard>;

export const workOrderDetail = workOrder.extend({
  createdByName: z.string().nullable(),
  signedById: z.number().nullable(),
  bank: walkthroughBank,
  safetyCard,
  readings: z.array(reading),
  photos: z.array(photo),
  transitions: z.array(transitionRecord),
});
export type WorkOrderDetail = z.infer<typeof workOrderDetail>;

/** One capacitor unit's result on this order beside its previous one, for the supervisor. */
export const unitResult = z.object({
  readingId: z.number(),
  workOrderId: z.number(),
  recordedAt: z.string(),
  band: z.enum(['healthy', 'watch', 'replace', 'remeasure']).nullable(),
  deviationPct: z.number().nullable(),
  kvarAtRated: z.number().nullable(),
  legsUF: z.array(z.number()).nullable(),
});
export const unitComparison = z.object({
  unitId: z.number(),
  stepNumber: z.number(),
  position: z.number(),
  serial: z.string(),
  current: unitResult.nullable(),
  previous: unitResult.nullable(),
  /** Change of the deviation from nameplate since the previous reading, % points. */
  deviationChangePct: z.number().nullable(),
});
export const workOrderReview = workOrderDetail.extend({ comparisons: z.array(unitComparison) });
export type WorkOrderReview = z.infer<typeof workOrderReview>;

// ---------------------------------------------------------------------------------------------
// Workload per technician.

export const workloadQuery = z
  .object({ from: isoDate, to: isoDate })
  .refine((v) => v.from <= v.to, { path: ['to'], message: 'The end is on or after the start' });
export const openWorkOrderStates = ['queued', 'dispatched', 'on-site', 'awaiting-review', 'sent-back'] as const;
const openCounts = z.object(Object.fromEntries(openWorkOrderStates.map((s) => [s, z.number()])) as Record<(typeof openWorkOrderStates)[number], z.ZodNumber>);
export const workloadRow = z.object({
  /** Null for the row of orders nobody is assigned to. */
  userId: z.number().nullable(),
  name: z.string(),
  openByState: openCounts,
  openTotal: z.number(),
  /** Open orders due between from and to, inclusive. */
  dueInRange: z.number(),
  overdue: z.number(),
});
export const workload = z.object({ from: z.string(), to: z.string(), technicians: z.array(workloadRow), unassigned: workloadRow });
export type Workload = z.infer<typeof workload>;

// ---------------------------------------------------------------------------------------------
// The flag queue and corrective orders raised from it.

export const flagListQuery = listQuery(['raisedAt', '-raisedAt', 'severity', '-severity'] as const, '-raisedAt').extend({
  state: z.enum(['open', 'in-hand', 'cleared']).optional(),
  siteId: z.coerce.number().int().positive().optional(),
  bankId: z.coerce.number().int().positive().optional(),
  kind: z.string().regex(/^[a-z-]{1,40}$/).optional(),
  severity: z.enum(['advisory', 'action']).optional(),
});

/** Everything is optional: title, instructions, checklist and due date come from the flag. */
export const correctiveOrderRequest = z
  .object({
    assigneeId: z.number().int().positive().nullable().optional(),
    dueOn: isoDate.optional(),
    priority: z.enum(priorities).optional(),
  })
  .strict();
export const correctiveOrderResponse = z.object({ flag, workOrder });
