import * as z from 'zod/mini';
import { listQuery } from './common';

// Contracts for what the server makes of a technician's readings: the stored reading with its
// evaluation and flags, a unit's history, photos and flags. What the phone sends is in
// reading-inputs.ts.

export const fieldMethods = ['open-pairs', 'shorted', 'line-currents', 'per-element'] as const;
export type FieldMethod = (typeof fieldMethods)[number];

export const bands = ['healthy', 'watch', 'replace', 'remeasure'] as const;

export const raisedFlag = z.object({
  kind: z.string(),
  severity: z.enum(['advisory', 'action']),
  message: z.string(),
  /** True when an open flag of this kind on this target already existed, so no new one was raised. */
  alreadyOpen: z.optional(z.boolean()),
});

export const reading = z.object({
  id: z.number(),
  workOrderId: z.number(),
  target: z.enum(['capacitor-unit', 'contactor', 'reactor', 'fuse-set', 'bank']),
  targetId: z.number(),
  /** The key the phone sent it with: a retry with the same key answers this same reading. */
  idempotencyKey: z.string(),
  input: z.record(z.string(), z.unknown()),
  /** For a capacitor: legsUF, kvarAtRated, deviationPct, legDeviationsPct, unbalanceRatio, band, reasons. */
  evaluation: z.record(z.string(), z.unknown()),
  band: z.nullable(z.enum(bands)),
  /** Capacitor units: deviation of kvar at rated conditions from nameplate, %. */
  deviationPct: z.nullable(z.number()),
  engineeringVersion: z.string(),
  flags: z.array(raisedFlag),
  recordedByName: z.string(),
  recordedAt: z.string(),
});
export type Reading = z.infer<typeof reading>;

/** One reading in a capacitor unit's history: the rows of its table and the points of its trend chart. */
export const unitReading = z.object({
  id: z.number(),
  recordedAt: z.string(),
  workOrderId: z.number(),
  workOrderState: z.string(),
  method: z.enum(fieldMethods),
  legsUF: z.array(z.number()),
  kvarAtRated: z.number(),
  deviationPct: z.number(),
  band: z.enum(bands),
});
export type UnitReading = z.infer<typeof unitReading>;
export const unitReadingListQuery = listQuery(['-recordedAt', 'recordedAt'] as const, '-recordedAt');

export const photo = z.object({
  id: z.number(),
  workOrderId: z.number(),
  readingId: z.nullable(z.number()),
  target: z.nullable(z.string()),
  targetId: z.nullable(z.number()),
  caption: z.string(),
  widthPx: z.number(),
  heightPx: z.number(),
  displayUrl: z.string(),
  thumbnailUrl: z.string(),
  createdAt: z.string(),
});
export type Photo = z.infer<typeof photo>;

export const flagStates = ['open', 'in-hand', 'cleared'] as const;
export const flag = z.object({
  id: z.number(),
  kind: z.string(),
  severity: z.enum(['advisory', 'action']),
  siteId: z.number(),
  siteName: z.string(),
  bankId: z.number(),
  bankName: z.string(),
  target: z.string(),
  targetId: z.number(),
  readingId: z.nullable(z.number()),
  message: z.string(),
  state: z.enum(flagStates),
  correctiveOrderId: z.nullable(z.number()),
  raisedAt: z.string(),
});
export type Flag = z.infer<typeof flag>;
