import * as z from 'zod/mini';
import { workOrderDetail } from './work-orders';

// The supervisor's review of an order: each capacitor unit's result beside its previous one.

/** One capacitor unit's result on this order beside its previous one, for the supervisor. */
export const unitResult = z.object({
  readingId: z.number(),
  workOrderId: z.number(),
  recordedAt: z.string(),
  band: z.nullable(z.enum(['healthy', 'watch', 'replace', 'remeasure'])),
  deviationPct: z.nullable(z.number()),
  kvarAtRated: z.nullable(z.number()),
  legsUF: z.nullable(z.array(z.number())),
});
export const unitComparison = z.object({
  unitId: z.number(),
  stepNumber: z.number(),
  position: z.number(),
  serial: z.string(),
  current: z.nullable(unitResult),
  previous: z.nullable(unitResult),
  /** Change of the deviation from nameplate since the previous reading, % points. */
  deviationChangePct: z.nullable(z.number()),
});
export const workOrderReview = z.extend(workOrderDetail, { comparisons: z.array(unitComparison) });
export type WorkOrderReview = z.infer<typeof workOrderReview>;
