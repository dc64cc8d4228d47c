import type { Database } from '../../db/client';
import type { Together } from '../../db/connection-transaction';
import { runStatement } from '../../db/statement-batch';
import { AppError } from '../../http/app-error';
import { evaluateCapacitorReading } from './evaluate-capacitor';
import { evaluateBankReading, evaluateContactorReading, evaluateFuseReading, evaluateReactorReading } from './evaluate-components';
import { evaluateStepTuning, type StepUnit } from './evaluate-step';
import type { InputFor, Outcome, ReactorRecord, ReadingInputValue } from './evaluation-types';
import {
  findBankPlace,
  findContactorPlace,
  findFuseSetPlace,
  findReactorPlace,
  findUnitPlace,
  latestReadingInput,
  reactorInServiceStatement,
  unitsOfStep,
  unitsOfStepStatement,
  type LockedOrder,
  type UnitPlaceForReading,
} from './readings.repository';

const notOnThisBank = (what: string, id: number, order: LockedOrder) =>
  new AppError('invalid', `${what} ${id} is not part of the bank of work order ${order.id}.`, { targetId: `Not a ${what.toLowerCase()} of this order's bank` });

const removed = (what: string, id: number, on: string) =>
  new AppError('invalid', `${what} ${id} was removed from service on ${on}; record readings on the component that replaced it.`, {
    targetId: `Removed from service on ${on}`,
  });

/**
 * Loads what a reading is judged against (the register: nameplate, step, bank, site, the step's
 * reactor and units) and evaluates it with packages/engineering. Runs inside the transaction
 * that stores the reading, after the bank is locked, so the step's latest evaluations are current.
 */
export async function evaluateReading(
  db: Database,
  order: LockedOrder,
  input: ReadingInputValue,
  recordedAt: Date,
  /**
   * Inside transactionOnConnection: its `together`, and a capacitor unit's place already read in
   * the transaction (unitPlaceForReadingStatement).
   */
  read?: { together: Together; unitPlace: UnitPlaceForReading | undefined },
): Promise<Outcome> {
  switch (input.target) {
    case 'capacitor-unit':
      return evaluateUnit(db, order, input, recordedAt, read ? read.unitPlace : await findUnitPlace(db, input.targetId), read?.together);
    case 'contactor': {
      const place = await findContactorPlace(db, input.targetId);
      if (!place || place.step.bankId !== order.bankId) throw notOnThisBank('Contactor', input.targetId, order);
      if (place.contactor.removedOn) throw removed('Contactor', input.targetId, place.contactor.removedOn);
      const previous = await latestReadingInput(db, 'contactor', input.targetId);
      const previousCounter = typeof previous?.input.operationsCounter === 'number' ? previous.input.operationsCounter : null;
      return evaluateContactorReading(input, { contactor: place.contactor, step: place.step, previousCounter });
    }
    case 'reactor':
      return evaluateReactor(db, order, input);
    case 'fuse-set': {
      const place = await findFuseSetPlace(db, input.targetId);
      if (!place || place.step.bankId !== order.bankId) throw notOnThisBank('Fuse set', input.targetId, order);
      if (place.fuseSet.removedOn) throw removed('Fuse set', input.targetId, place.fuseSet.removedOn);
      return evaluateFuseReading(input, { fuseSet: place.fuseSet, step: place.step });
    }
    case 'bank': {
      if (input.targetId !== order.bankId) throw notOnThisBank('Bank', input.targetId, order);
      const place = await findBankPlace(db, input.targetId);
      if (!place) throw notOnThisBank('Bank', input.targetId, order);
      return evaluateBankReading(input, place);
    }
  }
}

async function evaluateUnit(
  db: Database,
  order: LockedOrder,
  input: InputFor<'capacitor-unit'>,
  recordedAt: Date,
  place: UnitPlaceForReading | undefined,
  together?: Together,
): Promise<Outcome> {
  if (!place || place.step.bankId !== order.bankId) throw notOnThisBank('Capacitor unit', input.targetId, order);
  if (place.unit.removedOn) throw removed('Capacitor unit', input.targetId, place.unit.removedOn);
  // Only a detuned step needs its units and reactor (its tuning, and the count of units its line currents are split
  // between); a step that is not detuned reads neither.
  const [inService, stepUnits] = place.bank.detuned ? await stepOf(db, place.step.id, together) : [null, []];
  const reactor = inService?.reactor ?? null;
  const outcome = evaluateCapacitorReading(input, {
    unit: place.unit,
    step: place.step,
    bank: place.bank,
    site: place.site,
    reactor,
    unitsInStep: place.bank.detuned ? stepUnits.length : null,
    orderKind: order.kind,
  });
  outcome.unitHistory = { latestAt: place.latestRecordedAt, driftPoints: place.driftPoints };
  if (place.bank.detuned && outcome.unitResult) {
    const legs = outcome.unitResult.legsUF;
    // This reading counts for the step unless a reading taken later is already the unit's latest.
    const units: StepUnit[] = stepUnits.map((u) =>
      u.unit.id === place.unit.id && (!u.recordedAt || recordedAt >= u.recordedAt) ? { unit: u.unit, legsUF: legs } : u,
    );
    const measuredInductanceMH = measuredMean(inService?.latestInductanceMH);
    addStepTuning(outcome, evaluateStepTuning({ site: place.site, bank: place.bank, step: place.step, reactor, units, measuredInductanceMH }));
  }
  return outcome;
}

async function evaluateReactor(db: Database, order: LockedOrder, input: InputFor<'reactor'>): Promise<Outcome> {
  const place = await findReactorPlace(db, input.targetId);
  if (!place || place.step.bankId !== order.bankId) throw notOnThisBank('Reactor', input.targetId, order);
  if (place.reactor.removedOn) throw removed('Reactor', input.targetId, place.reactor.removedOn);
  const outcome = evaluateReactorReading(input, { reactor: place.reactor, step: place.step });
  if (place.bank.detuned) {
    const measuredInductanceMH = input.inductanceMH ? mean(input.inductanceMH) : await latestMeasuredInductance(db, place.reactor);
    const units = await unitsOfStep(db, place.step.id);
    addStepTuning(outcome, evaluateStepTuning({ site: place.site, bank: place.bank, step: place.step, reactor: place.reactor, units, measuredInductanceMH }));
  }
  return outcome;
}

/** A detuned step's reactor in service and its units, in one round trip when the transaction allows. */
async function stepOf(db: Database, stepId: number, together: Together | undefined) {
  const statements = [reactorInServiceStatement(db, stepId), unitsOfStepStatement(db, stepId)] as const;
  return together ? together(statements) : Promise.all([runStatement(statements[0]), runStatement(statements[1])]);
}

function addStepTuning(outcome: Outcome, tuning: ReturnType<typeof evaluateStepTuning>): void {
  if (!tuning) return;
  outcome.evaluation.step = tuning.evaluation;
  if (tuning.flag) outcome.flags.push(tuning.flag);
}

/** The mean inductance the reactor's latest reading measured, if it did; otherwise the register's counts. */
async function latestMeasuredInductance(db: Database, reactor: ReactorRecord): Promise<number | undefined> {
  return measuredMean((await latestReadingInput(db, 'reactor', reactor.id))?.input.inductanceMH);
}

/** The mean of three measured inductances, or undefined when a reading did not measure them. */
function measuredMean(values: unknown): number | undefined {
  if (!Array.isArray(values) || values.length !== 3 || !values.every((v): v is number => typeof v === 'number' && v > 0)) return undefined;
  return mean(values);
}

const mean = (values: readonly number[]) => values.reduce((s, v) => s + v, 0) / values.length;
