import { and, desc, eq, inArray, isNull } from 'drizzle-orm';
import type { Database } from '../../db/client';
import { banks, capacitorUnits, reactors, readings, sites, steps, unitLatestEvaluations } from '../../db/schema/index';

/**
 * Everything a site's health needs, in four queries: the site, its banks and steps, the units
 * in service with their stored latest evaluation, and the reactors. Never the reading history.
 */
export async function loadSiteForHealth(db: Database, siteId: number) {
  const [site] = await db.select().from(sites).where(eq(sites.id, siteId));
  if (!site) return undefined;
  const bankRows = await db
    .select()
    .from(banks)
    .where(and(eq(banks.siteId, siteId), isNull(banks.retiredAt)))
    .orderBy(banks.name);
  const bankIds = bankRows.map((b) => b.id);
  if (bankIds.length === 0) return { site, banks: [], steps: [], units: [], reactors: [] };
  const stepRows = await db
    .select()
    .from(steps)
    .where(and(inArray(steps.bankId, bankIds), isNull(steps.retiredAt)))
    .orderBy(steps.bankId, steps.number);
  const stepIds = stepRows.map((s) => s.id);
  if (stepIds.length === 0) return { site, banks: bankRows, steps: [], units: [], reactors: [] };
  const [unitRows, reactorRows] = await Promise.all([
    db
      .select({ unit: capacitorUnits, latest: unitLatestEvaluations })
      .from(capacitorUnits)
      .leftJoin(unitLatestEvaluations, eq(unitLatestEvaluations.unitId, capacitorUnits.id))
      .where(and(inArray(capacitorUnits.stepId, stepIds), isNull(capacitorUnits.removedOn))),
    db
      .select()
      .from(reactors)
      .where(and(inArray(reactors.stepId, stepIds), isNull(reactors.removedOn))),
  ]);
  return { site, banks: bankRows, steps: stepRows, units: unitRows, reactors: reactorRows };
}

/** The newest bank reading of the site that carries the controller's PF and the load. */
export async function latestControllerReading(db: Database, bankIds: number[]) {
  if (bankIds.length === 0) return undefined;
  const rows = await db
    .select({ input: readings.input, recordedAt: readings.recordedAt, bankId: readings.targetId })
    .from(readings)
    .where(and(eq(readings.target, 'bank'), inArray(readings.targetId, bankIds)))
    .orderBy(desc(readings.recordedAt))
    .limit(20);
  return rows.find((r) => typeof r.input.controllerPf === 'number' && typeof r.input.loadKw === 'number');
}
