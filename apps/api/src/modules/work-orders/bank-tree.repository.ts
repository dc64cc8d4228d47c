import type { WalkthroughBank } from '@varden/schemas';
import { and, asc, eq, inArray, isNull } from 'drizzle-orm';
import type { Database } from '../../db/client';
import { banks, capacitorUnits, contactors, fuseSets, reactors, sites, steps } from '../../db/schema/index';

/**
 * A bank as built today, for the walk through it: steps in order, each with its units in
 * service, its contactor, detuning reactor and fuse set. Six queries, whatever the bank's size.
 */
export async function walkthroughBankOf(db: Database, bankId: number): Promise<WalkthroughBank | undefined> {
  const [head] = await db
    .select({ bank: banks, siteName: sites.name, siteVoltageV: sites.voltageV, siteFrequencyHz: sites.frequencyHz })
    .from(banks)
    .innerJoin(sites, eq(sites.id, banks.siteId))
    .where(eq(banks.id, bankId));
  if (!head) return undefined;
  const stepRows = await db
    .select()
    .from(steps)
    .where(and(eq(steps.bankId, bankId), isNull(steps.retiredAt)))
    .orderBy(asc(steps.number));
  const stepIds = stepRows.map((s) => s.id);
  const none = stepIds.length === 0;
  const [unitRows, contactorRows, reactorRows, fuseRows] = none
    ? [[], [], [], []]
    : await Promise.all([
        db
          .select()
          .from(capacitorUnits)
          .where(and(inArray(capacitorUnits.stepId, stepIds), isNull(capacitorUnits.removedOn)))
          .orderBy(asc(capacitorUnits.position)),
        db.select().from(contactors).where(and(inArray(contactors.stepId, stepIds), isNull(contactors.removedOn))).orderBy(asc(contactors.id)),
        db.select().from(reactors).where(and(inArray(reactors.stepId, stepIds), isNull(reactors.removedOn))).orderBy(asc(reactors.id)),
        db.select().from(fuseSets).where(and(inArray(fuseSets.stepId, stepIds), isNull(fuseSets.removedOn))).orderBy(asc(fuseSets.id)),
      ]);
  return {
    id: head.bank.id,
    name: head.bank.name,
    location: head.bank.location,
    detuned: head.bank.detuned,
    detuningFactor: head.bank.detuningFactor,
    siteId: head.bank.siteId,
    siteName: head.siteName,
    siteVoltageV: head.siteVoltageV,
    siteFrequencyHz: head.siteFrequencyHz,
    steps: stepRows.map((s) => {
      const contactor = contactorRows.find((c) => c.stepId === s.id);
      const reactor = reactorRows.find((r) => r.stepId === s.id);
      const fuseSet = fuseRows.find((f) => f.stepId === s.id);
      return {
        id: s.id,
        number: s.number,
        ratedKvar: s.ratedKvar,
        units: unitRows
          .filter((u) => u.stepId === s.id)
          .map((u) => ({
            id: u.id,
            position: u.position,
            nameplateKvar: u.nameplateKvar,
            nameplateVoltageV: u.nameplateVoltageV,
            nameplateFrequencyHz: u.nameplateFrequencyHz,
            connection: u.connection,
            capacitanceUF: u.capacitanceUF,
            toleranceMinusPct: u.toleranceMinusPct,
            tolerancePlusPct: u.tolerancePlusPct,
            dischargeTimeS: u.dischargeTimeS,
            serial: u.serial,
            maker: u.maker,
            model: u.model,
            installedOn: u.installedOn,
          })),
        contactor: contactor
          ? { id: contactor.id, ratedOperations: contactor.ratedOperations, counterAtInstall: contactor.counterAtInstall, maker: contactor.maker, model: contactor.model }
          : null,
        reactor: reactor
          ? {
              id: reactor.id,
              inductanceMH: reactor.inductanceMH,
              ratedCurrentA: reactor.ratedCurrentA,
              detuningFactor: reactor.detuningFactor,
              maker: reactor.maker,
              model: reactor.model,
            }
          : null,
        fuseSet: fuseSet ? { id: fuseSet.id, ratedCurrentA: fuseSet.ratedCurrentA, type: fuseSet.type } : null,
      };
    }),
  };
}
