import { and, asc, desc, eq, inArray, isNull, lt, ne, notInArray } from 'drizzle-orm';
import type { Database } from '../../db/client';
import { banks, capacitorUnits, flags, reactors, readings, sites, steps, unitLatestEvaluations, workOrders } from '../../db/schema/index';

/**
 * Everything a site's health needs, in one round of five queries at once: the site, its banks,
 * its steps, the units in service with their stored latest evaluation (only the columns the
 * health reads: the nameplate, the band, the legs) and the reactors. Never the reading history.
 */
export async function loadSiteForHealth(db: Database, siteId: number) {
  const bankInService = and(eq(banks.siteId, siteId), isNull(banks.retiredAt));
  const stepInService = and(bankInService, isNull(steps.retiredAt));
  const [[site], bankRows, stepRows, unitRows, reactorRows] = await Promise.all([
    db.select().from(sites).where(eq(sites.id, siteId)),
    db.select().from(banks).where(bankInService).orderBy(banks.name),
    db
      .select({ step: steps })
      .from(steps)
      .innerJoin(banks, eq(banks.id, steps.bankId))
      .where(stepInService)
      .orderBy(steps.bankId, steps.number),
    db
      .select({
        unit: {
          id: capacitorUnits.id,
          stepId: capacitorUnits.stepId,
          nameplateKvar: capacitorUnits.nameplateKvar,
          nameplateVoltageV: capacitorUnits.nameplateVoltageV,
          nameplateFrequencyHz: capacitorUnits.nameplateFrequencyHz,
          connection: capacitorUnits.connection,
        },
        latest: { band: unitLatestEvaluations.band, legsUF: unitLatestEvaluations.legsUF, recordedAt: unitLatestEvaluations.recordedAt },
      })
      .from(capacitorUnits)
      .innerJoin(steps, eq(steps.id, capacitorUnits.stepId))
      .innerJoin(banks, eq(banks.id, steps.bankId))
      .leftJoin(unitLatestEvaluations, eq(unitLatestEvaluations.unitId, capacitorUnits.id))
      .where(and(stepInService, isNull(capacitorUnits.removedOn))),
    db
      .select({ reactor: reactors })
      .from(reactors)
      .innerJoin(steps, eq(steps.id, reactors.stepId))
      .innerJoin(banks, eq(banks.id, steps.bankId))
      .where(and(stepInService, isNull(reactors.removedOn))),
  ]);
  if (!site) return undefined;
  return { site, banks: bankRows, steps: stepRows.map((r) => r.step), units: unitRows, reactors: reactorRows.map((r) => r.reactor) };
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
