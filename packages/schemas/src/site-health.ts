import * as z from 'zod/mini';
import { workOrderStates } from './work-orders';

// Contracts for what the readings mean for a site: lost correction, reached PF, resonance,
// tuning of detuned steps and the estimated cost.

const triangle = z.object({ kw: z.number(), kvar: z.number(), kva: z.number(), pf: z.number(), phiDeg: z.number(), leading: z.boolean() });

export const bandCounts = z.object({
  healthy: z.number(),
  watch: z.number(),
  replace: z.number(),
  remeasure: z.number(),
  noReading: z.number(),
});

export const stepHealth = z.object({
  id: z.number(),
  number: z.number(),
  ratedKvar: z.number(),
  installedKvar: z.number(),
  effectiveKvar: z.number(),
  effectivePct: z.number(),
  bands: bandCounts,
  tuning: z.nullable(
    z.object({
      designTuningHz: z.number(),
      tuningHz: z.number(),
      shiftPct: z.number(),
      nearestHarmonic: z.number(),
      nearestHarmonicHz: z.number(),
      distancePct: z.number(),
      fifthHarmonicHz: z.number(),
      tuningShifted: z.boolean(),
      nearHarmonic: z.boolean(),
    }),
  ),
  reasons: z.array(z.string()),
});

export const resonanceCase = z.object({
  /** The numbers of the steps switched in (step 1, 1+2, …, counting only steps that still deliver kvar). */
  stepNumbers: z.array(z.number()),
  kvar: z.number(),
  order: z.number(),
  nearestHarmonic: z.number(),
  distancePct: z.number(),
  warning: z.boolean(),
});

/** A flag of the site not yet cleared, as the site health page lists it. */
export const siteFlag = z.object({
  id: z.number(),
  kind: z.string(),
  severity: z.enum(['advisory', 'action']),
  bankId: z.number(),
  bankName: z.string(),
  target: z.string(),
  targetId: z.number(),
  message: z.string(),
  state: z.enum(['open', 'in-hand']),
  correctiveOrderId: z.nullable(z.number()),
  raisedAt: z.string(),
});

export const bankHealth = z.object({
  id: z.number(),
  name: z.string(),
  detuned: z.boolean(),
  detuningFactor: z.nullable(z.number()),
  installedKvar: z.number(),
  effectiveKvar: z.number(),
  steps: z.array(stepHealth),
  /** For undetuned steps only: step 1, 1+2, … switched in, with the transformer. */
  resonance: z.array(resonanceCase),
});

export const siteHealth = z.object({
  siteId: z.number(),
  siteName: z.string(),
  voltageV: z.number(),
  frequencyHz: z.number(),
  targetPf: z.number(),
  installedKvar: z.number(),
  effectiveKvar: z.number(),
  lostKvar: z.number(),
  lostPct: z.number(),
  bands: bandCounts,
  /** Where the load came from: the latest controller reading, the planner's entry, or nowhere. */
  load: z.nullable(
    z.object({
      source: z.enum(['controller-reading', 'planned-load']),
      kw: z.number(),
      loadKvar: z.number(),
      loadPf: z.number(),
      recordedAt: z.nullable(z.string()),
      note: z.string(),
    }),
  ),
  reachedPf: z.nullable(z.number()),
  leading: z.nullable(z.boolean()),
  requiredKvar: z.nullable(z.number()),
  missingKvar: z.nullable(z.number()),
  targetMet: z.nullable(z.boolean()),
  triangle: z.nullable(z.object({ asInstalled: triangle, now: triangle })),
  cost: z.nullable(
    z.object({
      estimate: z.literal(true),
      currency: z.string(),
      pricePerKvarh: z.number(),
      hoursPerMonth: z.number(),
      basis: z.string(),
      extraKvarhPerMonth: z.number(),
      lostMonthlyCost: z.number(),
      assumptions: z.array(z.string()),
    }),
  ),
  banks: z.array(bankHealth),
  /** When the newest reading these figures rest on was taken (a unit's latest evaluation or the controller reading), or null before any. */
  newestReadingAt: z.nullable(z.string()),
  /** The site's flags not yet cleared, newest first. */
  openFlags: z.array(siteFlag),
  /** The site's orders past their due date and neither sealed nor withdrawn, oldest due first. */
  overdueOrders: z.array(z.object({ id: z.number(), title: z.string(), dueOn: z.string(), state: z.enum(workOrderStates) })),
  engineeringVersion: z.string(),
});
export type SiteHealth = z.infer<typeof siteHealth>;

export const siteHealthQuery = z.object({
  hoursPerMonth: z._default(z.coerce.number().check(z.gte(1, 'At least 1 hour'), z.lte(744, 'At most 744 hours in a month')), 500),
});


export const fleetSite = z.object({
  siteId: z.number(),
  siteName: z.string(),
  bands: bandCounts,
  openActionFlags: z.number(),
  openAdvisoryFlags: z.number(),
  /** Open tuning-drift flags: detuned steps whose tuning has crept towards a harmonic. */
  stepsNearHarmonic: z.number(),
  overdueOrders: z.number(),
  projectedReplacements: z.number(),
  /** Points: replace 10, open action flag 5, overdue order 3, remeasure 2, watch 1 (common practice). */
  risk: z.number(),
});

export const fleetOverview = z.object({
  sites: z.array(fleetSite),
  totals: bandCounts,
  /** The 100 soonest replacements within 12 months (each site row counts all of its own). */
  projectedReplacements: z.array(
    z.object({
      unitId: z.number(),
      siteId: z.number(),
      siteName: z.string(),
      bankId: z.number(),
      bankName: z.string(),
      stepId: z.number(),
      stepNumber: z.number(),
      position: z.number(),
      serial: z.string(),
      ratePctPerYear: z.number(),
      replaceBy: z.string(),
      latestDeviationPct: z.number(),
    }),
  ),
  /** The 100 longest overdue orders (each site row counts all of its own). */
  overdueOrders: z.array(z.object({ id: z.number(), title: z.string(), siteId: z.number(), siteName: z.string(), dueOn: z.string(), state: z.enum(workOrderStates) })),
});
export type FleetOverview = z.infer<typeof fleetOverview>;
