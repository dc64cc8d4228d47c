import { and, asc, desc, eq, inArray, isNull, lt, ne, notInArray } from 'drizzle-orm';
import type { Database } from '../../db/client';
import { banks, capacitorUnits, flags, reactors, readings, sites, steps, unitLatestEvaluations, workOrders } from '../../db/schema/index';

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

/** The site's flags not yet cleared, newest first, with their bank's name. */
export async function openFlagsOfSite(db: Database, siteId: number) {
  return db
    .select({
      id: flags.id,
      kind: flags.kind,
      severity: flags.severity,
      bankId: flags.bankId,
      bankName: banks.name,
      target: flags.target,
      targetId: flags.targetId,
      message: flags.message,
      state: flags.state,
      correctiveOrderId: flags.correctiveOrderId,
      raisedAt: flags.raisedAt,
    })
    .from(flags)
    .innerJoin(banks, eq(banks.id, flags.bankId))
    .where(and(eq(flags.siteId, siteId), ne(flags.state, 'cleared')))
    .orderBy(desc(flags.raisedAt), desc(flags.id));
}

/** Orders of the site whose due date has passed and that are neither sealed nor withdrawn, oldest due first. */
export async function overdueOrdersOfSite(db: Database, siteId: number, todayIso: string) {
  return db
    .select({ id: workOrders.id, title: workOrders.title, dueOn: workOrders.dueOn, state: workOrders.state })
    .from(workOrders)
    .where(and(eq(workOrders.siteId, siteId), lt(workOrders.dueOn, todayIso), notInArray(workOrders.state, ['sealed', 'withdrawn'])))
    .orderBy(asc(workOrders.dueOn), asc(workOrders.id));
}
