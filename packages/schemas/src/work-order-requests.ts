import * as z from 'zod/mini';
import { isoDate, recordId, required, text, version } from './common';
import { checklist, priorities, workOrderKinds, workOrderStates } from './work-orders';

// Contracts for what planners and supervisors send about an order: creating it, changing it, and
// moving it from one state to the next.

export const workOrderCreate = z.strictObject({
  kind: z.enum(workOrderKinds),
  bankId: recordId,
  title: required(200),
  instructions: z._default(text(4000), ''),
  checklist: checklist.check(z.minLength(1, 'Choose at least one reading')),
  dueOn: isoDate,
  priority: z._default(z.enum(priorities), 'normal'),
  assigneeId: z._default(z.nullable(recordId), null),
});
export type WorkOrderCreate = z.input<typeof workOrderCreate>;

/** Reschedule, reassign or edit; a stale version gets 409, a sealed order 409 (locked). */
export const workOrderUpdate = z.strictObject({
  title: z.optional(text(200).check(z.minLength(1))),
  instructions: z.optional(text(4000)),
  checklist: z.optional(checklist.check(z.minLength(1))),
  dueOn: z.optional(isoDate),
  priority: z.optional(z.enum(priorities)),
  assigneeId: z.optional(z.nullable(recordId)),
  version,
});

export const workOrderTransitionRequest = z.strictObject({
  to: z.enum(workOrderStates),
  version,
  comment: z._default(text(1000), ''),
  /** Sealing only: what the signer attests, recorded with their name and the time. */
  signatureMeaning: z.optional(text(400)),
  /** Dispatching only: the technician to dispatch to, when not already set on the order. */
  assigneeId: z.optional(recordId),
});

/** The default meaning of a supervisor's signature; the signer may word it for the site. */
export const defaultSignatureMeaning =
  'I have reviewed the readings, results, flags and photos of this order and accept them as the maintenance record.';
