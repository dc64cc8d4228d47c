import * as z from 'zod/mini';
import { isoDate, listQuery, queryId } from './common';
import { photo, reading } from './readings';

// Contracts for work orders as they are read: their states and moves, the list, and an order opened
// for the walkthrough. State names are Varden's own; docs/glossary.md says what each means. What
// planners and supervisors send and read besides lives in plans.ts, work-order-requests.ts,
// order-review.ts, workload.ts and flag-queue.ts, so a technician's phone loads none of it.

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


/** The readings a checklist asks for. */
export const checklist = z.array(z.enum(checklistItems));

export const transitionRecord = z.object({
  fromState: z.nullable(z.enum(workOrderStates)),
  toState: z.enum(workOrderStates),
  actorName: z.nullable(z.string()),
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
  planId: z.nullable(z.number()),
  flagId: z.nullable(z.number()),
  title: z.string(),
  instructions: z.string(),
  checklist,
  dueOn: z.string(),
  priority: z.enum(priorities),
  assigneeId: z.nullable(z.number()),
  assigneeName: z.nullable(z.string()),
  state: z.enum(workOrderStates),
  /** Why a supervisor last sent the order back (the comment of its latest move to sent-back), or null when never sent back. */
  returnReason: z.nullable(z.string()),
  locked: z.boolean(),
  overdue: z.boolean(),
  safetyAcknowledgedAt: z.nullable(z.string()),
  submittedAt: z.nullable(z.string()),
  signedAt: z.nullable(z.string()),
  signedByName: z.nullable(z.string()),
  signatureMeaning: z.nullable(z.string()),
  version: z.number(),
  createdAt: z.string(),
});
export type WorkOrder = z.infer<typeof workOrder>;

export const workOrderSorts = ['dueOn', '-dueOn', 'priority', '-priority', 'state', 'createdAt', '-createdAt'] as const;
export const workOrderListQuery = z.extend(listQuery(workOrderSorts, 'dueOn'), {
  /** One state, or several separated by commas. */
  state: z.optional(z.union([z.enum(workOrderStates), z.string().check(z.regex(/^[a-z-]+(,[a-z-]+)+$/))])),
  siteId: z.optional(queryId),
  bankId: z.optional(queryId),
  assigneeId: z.optional(z.union([queryId, z.literal('me'), z.literal('none')])),
  dueFrom: z.optional(isoDate),
  dueTo: z.optional(isoDate),
  kind: z.optional(z.enum(workOrderKinds)),
});


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
  installedOn: z.nullable(z.string()),
});
export const walkthroughStep = z.object({
  id: z.number(),
  number: z.number(),
  ratedKvar: z.number(),
  units: z.array(walkthroughUnit),
  contactor: z.nullable(z.object({ id: z.number(), ratedOperations: z.number(), counterAtInstall: z.number(), maker: z.string(), model: z.string() })),
  reactor: z.nullable(
    z.object({ id: z.number(), inductanceMH: z.number(), ratedCurrentA: z.number(), detuningFactor: z.number(), maker: z.string(), model: z.string() }),
  ),
  fuseSet: z.nullable(z.object({ id: z.number(), ratedCurrentA: z.number(), type: z.string() })),
});
export const walkthroughBank = z.object({
  id: z.number(),
  name: z.string(),
  location: z.string(),
  detuned: z.boolean(),
  detuningFactor: z.nullable(z.number()),
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
  maxStoredEnergyJ: z.nullable(z.number()),
  steps: z.array(z.object({ title: z.string(), text: z.string() })),
  ppeNote: z.string(),
  deferral: z.string(),
  acknowledgedAt: z.nullable(z.string()),
  acknowledgedByName: z.nullable(z.string()),
});
export type SafetyCard = z.infer<typeof safetyCard>;

export const workOrderDetail = z.extend(workOrder, {
  createdByName: z.nullable(z.string()),
  signedById: z.nullable(z.number()),
  bank: walkthroughBank,
  safetyCard,
  readings: z.array(reading),
  photos: z.array(photo),
  transitions: z.array(transitionRecord),
});
export type WorkOrderDetail = z.infer<typeof workOrderDetail>;

/** The open states, for filters and the workload. */
export const openWorkOrderStates = ['queued', 'dispatched', 'on-site', 'awaiting-review', 'sent-back'] as const;
