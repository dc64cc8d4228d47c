import type { WorkOrderState } from '@varden/schemas';

/** A work order's state as the technician reads it: a short word for lists, a sentence for the order. */
export const stateWords: Record<WorkOrderState, { short: string; long: string }> = {
  queued: { short: 'Queued', long: 'Not dispatched to you yet.' },
  dispatched: { short: 'To start', long: 'Dispatched to you: read and acknowledge the safety card to start.' },
  'on-site': { short: 'On site', long: 'You are on site recording readings.' },
  'awaiting-review': { short: 'Submitted', long: 'Submitted: it waits for a supervisor’s review.' },
  'sent-back': { short: 'Sent back', long: 'Sent back to you by a supervisor: see the reason, then resume.' },
  sealed: { short: 'Sealed', long: 'Signed off by a supervisor: the record is sealed.' },
  withdrawn: { short: 'Withdrawn', long: 'Withdrawn: no work is wanted on it.' },
};
