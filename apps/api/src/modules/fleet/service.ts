import type { FleetOverview } from '@varden/schemas';
import { and, asc, count, eq, inArray, isNull, lt, lte, notInArray } from 'drizzle-orm';
import type { SiteScope } from '../../access/site-scope';
import type { Database } from '../../db/client';
import { banks, capacitorUnits, flags, sites, steps, unitLatestEvaluations, workOrders } from '../../db/schema/index';
import { inScope } from '../register/scope-filter';

const closedStates = ['sealed', 'withdrawn'] as const;

/** Points of risk per finding; a site's rank is their sum (common practice: replace first). */
export const riskWeights = { replace: 10, actionFlag: 5, overdueOrder: 3, remeasure: 2, watch: 1 } as const;

const isoDay = (d: Date) => d.toISOString().slice(0, 10);

/**
 * The fleet's lists carry their most urgent entries only (soonest replacement, longest overdue);
 * every site's row counts all of its own, so the totals are the sums over the sites.
 */
export const fleetListLimit = 100;

/**
 * The fleet at a glance for the sites a user may read: sites ranked by risk (units to replace,
 * open action flags such as tuning drift towards a harmonic, overdue orders), counts per band,
 * replacements projected for the next 12 months from each unit's drift, and overdue orders
 * (each list the first `fleetListLimit`, most urgent first).
 */
export async function fleetOverview(db: Database, scope: SiteScope, today = new Date()): Promise<FleetOverview> {
  const siteRows = await db
    .select({ id: sites.id, name: sites.name })
    .from(sites)
    .where(and(inScope(scope, sites.id), isNull(sites.retiredAt)))
    .orderBy(sites.name);
  const siteIds = siteRows.map((s) => s.id);
  const empty = { healthy: 0, watch: 0, replace: 0, remeasure: 0, noReading: 0 };
  if (siteIds.length === 0) return { sites: [], totals: { ...empty }, projectedReplacements: [], overdueOrders: [] };
  const todayIso = isoDay(today);

  const unitScope = and(inArray(banks.siteId, siteIds), isNull(banks.retiredAt), isNull(steps.retiredAt), isNull(capacitorUnits.removedOn));
  const horizon = isoDay(new Date(today.getTime() + 365 * 86_400_000));
  const [bandRows, flagRows, overdueRows, projectionRows] = await Promise.all([
    db
      .select({ siteId: banks.siteId, band: unitLatestEvaluations.band, n: count() })
      .from(capacitorUnits)
      .innerJoin(steps, eq(steps.id, capacitorUnits.stepId))
      .innerJoin(banks, eq(banks.id, steps.bankId))
      .leftJoin(unitLatestEvaluations, eq(unitLatestEvaluations.unitId, capacitorUnits.id))
      .where(unitScope)
      .groupBy(banks.siteId, unitLatestEvaluations.band),
    db
      .select({ siteId: flags.siteId, severity: flags.severity, kind: flags.kind, n: count() })
      .from(flags)
      .where(and(inArray(flags.siteId, siteIds), notInArray(flags.state, ['cleared'])))
      .groupBy(flags.siteId, flags.severity, flags.kind),
    db
      .select({
        id: workOrders.id,
        title: workOrders.title,
        siteId: workOrders.siteId,
        dueOn: workOrders.dueOn,
        state: workOrders.state,
      })
      .from(workOrders)
      .where(and(inArray(workOrders.siteId, siteIds), lt(workOrders.dueOn, todayIso), notInArray(workOrders.state, [...closedStates])))
      .orderBy(asc(workOrders.dueOn), asc(workOrders.id)),
    // Each unit's drift is fitted when its reading is stored (readings.service, unitDrift): one row per unit, never the history.
    db
      .select({
        unitId: capacitorUnits.id,
        siteId: banks.siteId,
        bankId: banks.id,
        bankName: banks.name,
        stepId: steps.id,
        stepNumber: steps.number,
        position: capacitorUnits.position,
        serial: capacitorUnits.serial,
        ratePctPerYear: unitLatestEvaluations.driftRatePctPerYear,
        replaceBy: unitLatestEvaluations.replaceBy,
        latestDeviationPct: unitLatestEvaluations.deviationPct,
      })
      .from(unitLatestEvaluations)
      .innerJoin(capacitorUnits, eq(capacitorUnits.id, unitLatestEvaluations.unitId))
      .innerJoin(steps, eq(steps.id, capacitorUnits.stepId))
      .innerJoin(banks, eq(banks.id, steps.bankId))
      .where(and(unitScope, lte(unitLatestEvaluations.replaceBy, horizon)))
      .orderBy(asc(unitLatestEvaluations.replaceBy), asc(capacitorUnits.id)),
  ]);

  const siteName = new Map(siteRows.map((s) => [s.id, s.name]));
  const projected: FleetOverview['projectedReplacements'] = projectionRows.map((row) => ({
    ...row,
    siteName: siteName.get(row.siteId) ?? '',
    ratePctPerYear: row.ratePctPerYear ?? 0,
    replaceBy: row.replaceBy!,
  }));

  const totals = { ...empty };
  const items = siteRows.map((site) => {
    const bands = { ...empty };
    for (const row of bandRows) {
      if (row.siteId !== site.id) continue;
      bands[row.band ?? 'noReading'] += row.n;
    }
    for (const key of Object.keys(totals) as Array<keyof typeof totals>) totals[key] += bands[key];
    const siteFlags = flagRows.filter((f) => f.siteId === site.id);
    const actionFlags = siteFlags.filter((f) => f.severity === 'action').reduce((n, f) => n + f.n, 0);
    const tuningFlags = siteFlags.filter((f) => f.kind === 'tuning-drift').reduce((n, f) => n + f.n, 0);
    const overdueOrders = overdueRows.filter((o) => o.siteId === site.id).length;
    const projectedReplacements = projected.filter((p) => p.siteId === site.id).length;
    const risk =
      bands.replace * riskWeights.replace +
      actionFlags * riskWeights.actionFlag +
      overdueOrders * riskWeights.overdueOrder +
      bands.remeasure * riskWeights.remeasure +
      bands.watch * riskWeights.watch;
    return {
      siteId: site.id,
      siteName: site.name,
      bands,
      openActionFlags: actionFlags,
      openAdvisoryFlags: siteFlags.filter((f) => f.severity === 'advisory').reduce((n, f) => n + f.n, 0),
      stepsNearHarmonic: tuningFlags,
      overdueOrders,
      projectedReplacements,
      risk,
    };
  });
  items.sort((a, b) => b.risk - a.risk || a.siteName.localeCompare(b.siteName));

  return {
    sites: items,
    totals,
    projectedReplacements: projected.slice(0, fleetListLimit),
    overdueOrders: overdueRows.slice(0, fleetListLimit).map((o) => ({ ...o, siteName: siteName.get(o.siteId) ?? '' })),
  };
}
