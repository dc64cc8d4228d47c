import * as z from 'zod/mini';
import { isoDate } from './common';
import { openWorkOrderStates } from './work-orders';

// Workload per technician.

export const workloadQuery = z
  .object({ from: isoDate, to: isoDate })
  .check(z.refine((v) => v.from <= v.to, { path: ['to'], error: 'The end is on or after the start' }));
const openCounts = z.object(Object.fromEntries(openWorkOrderStates.map((s) => [s, z.number()])) as Record<(typeof openWorkOrderStates)[number], z.ZodMiniNumber>);
export const workloadRow = z.object({
  /** Null for the row of orders nobody is assigned to. */
  userId: z.nullable(z.number()),
  name: z.string(),
  openByState: openCounts,
  openTotal: z.number(),
  /** Open orders due between from and to, inclusive. */
  dueInRange: z.number(),
  overdue: z.number(),
});
export const workload = z.object({ from: z.string(), to: z.string(), technicians: z.array(workloadRow), unassigned: workloadRow });
export type Workload = z.infer<typeof workload>;
