import * as z from 'zod/mini';
import { isoDate, listQuery, queryId, recordId } from './common';
import { flag } from './readings';
import { priorities, workOrder } from './work-orders';

// The flag queue and corrective orders raised from it.

export const flagSorts = ['raisedAt', '-raisedAt', 'severity', '-severity'] as const;
export const flagListQuery = z.extend(listQuery(flagSorts, '-raisedAt'), {
  state: z.optional(z.enum(['open', 'in-hand', 'cleared'])),
  siteId: z.optional(queryId),
  bankId: z.optional(queryId),
  kind: z.optional(z.string().check(z.regex(/^[a-z-]{1,40}$/))),
  severity: z.optional(z.enum(['advisory', 'action'])),
});

/** Everything is optional: title, instructions, checklist and due date come from the flag. */
export const correctiveOrderRequest = z.strictObject({
  assigneeId: z.optional(z.nullable(recordId)),
  dueOn: z.optional(isoDate),
  priority: z.optional(z.enum(priorities)),
});
export const correctiveOrderResponse = z.object({ flag, workOrder });
