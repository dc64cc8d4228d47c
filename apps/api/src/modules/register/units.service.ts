import { ratedCapacitanceUF, TOLERANCE_PRESETS } from '@varden/engineering';
import type { Unit, unitCreate, unitListQuery, unitReplace, unitUpdate } from '@varden/schemas';
import { and, count, eq, isNull } from 'drizzle-orm';
import type { z } from 'zod';
import type { Database } from '../../db/client';
import { banks, capacitorUnits, steps } from '../../db/schema/index';
import { deleteUnreferenced, isDuplicateKey, offset, orderBy, updateVersioned } from '../../db/versioned';
import { AppError } from '../../http/app-error';
import { findStepWithSite } from './steps.service';
import { assertInScope, inScope, type SiteScope } from './scope-filter';

type UnitRow = typeof capacitorUnits.$inferSelect;
type Nameplated = Pick<UnitRow, 'nameplateKvar' | 'nameplateVoltageV' | 'nameplateFrequencyHz' | 'connection'>;

/** A given capacitance further than this from the nameplate's gets a warning. */
export const capacitanceWarningPct = 2;

const rated = (u: Nameplated) =>
  ratedCapacitanceUF({ kvar: u.nameplateKvar, voltageV: u.nameplateVoltageV, frequencyHz: u.nameplateFrequencyHz, connection: u.connection });

export function capacitanceWarnings(u: Nameplated & { capacitanceUF: number }): string[] {
  const expected = rated(u);
  const differencePct = ((u.capacitanceUF - expected) / expected) * 100;
  if (Math.abs(differencePct) <= capacitanceWarningPct) return [];
  const per = u.connection === 'delta' ? 'per delta leg' : u.connection === 'star' ? 'per star phase' : 'for the element';
  return [
    `The capacitance given (${u.capacitanceUF.toFixed(2)} µF) differs by ${differencePct.toFixed(1)} % from the ${expected.toFixed(2)} µF ${per} that the nameplate gives: check the nameplate and the connection.`,
  ];
}

function toUnit(row: UnitRow): Unit {
  return {
    id: row.id,
    stepId: row.stepId,
    position: row.position,
    nameplateKvar: row.nameplateKvar,
    nameplateVoltageV: row.nameplateVoltageV,
    nameplateFrequencyHz: row.nameplateFrequencyHz as 50 | 60,
    connection: row.connection,
    capacitanceUF: row.capacitanceUF,
    capacitanceGiven: row.capacitanceGiven,
    ratedCapacitanceUF: rated(row),
    tolerancePreset: row.tolerancePreset,
    toleranceMinusPct: row.toleranceMinusPct,
    tolerancePlusPct: row.tolerancePlusPct,
    temperatureCategory: row.temperatureCategory,
    dischargeTimeS: row.dischargeTimeS,
    serial: row.serial,
    maker: row.maker,
    model: row.model,
    installedOn: row.installedOn,
    removedOn: row.removedOn,
    removalReason: row.removalReason,
    replacedById: row.replacedById,
    warnings: row.capacitanceGiven ? capacitanceWarnings(row) : [],
    version: row.version,
  };
}

/** Tolerance limits from the preset (IEC 60831-1 −5/+10 or IEEE 18 0/+10, both from memory) or given by hand. */
function tolerance(input: { tolerancePreset?: 'iec' | 'ieee' | 'custom'; toleranceMinusPct?: number | undefined; tolerancePlusPct?: number | undefined }) {
  if (input.tolerancePreset === undefined) return {};
  if (input.tolerancePreset === 'custom') {
    const fields: Record<string, string> = {};
    if (input.toleranceMinusPct === undefined) fields.toleranceMinusPct = 'A custom tolerance needs its lower limit';
    if (input.tolerancePlusPct === undefined) fields.tolerancePlusPct = 'A custom tolerance needs its upper limit';
    if (Object.keys(fields).length) throw new AppError('invalid', 'Some fields are not valid.', fields);
    return { tolerancePreset: 'custom' as const, toleranceMinusPct: input.toleranceMinusPct!, tolerancePlusPct: input.tolerancePlusPct! };
  }
  const presetId = input.tolerancePreset === 'iec' ? 'iec-60831-1' : 'ieee-18';
  const preset = TOLERANCE_PRESETS.find((p) => p.id === presetId);
  if (!preset) throw new AppError('invalid', `Unknown tolerance preset ${input.tolerancePreset}.`);
  return { tolerancePreset: input.tolerancePreset, toleranceMinusPct: preset.minPct, tolerancePlusPct: preset.maxPct };
}

export async function listUnits(db: Database, scope: SiteScope, q: z.output<typeof unitListQuery>) {
  const where = and(
    inScope(scope, banks.siteId),
    q.includeRemoved === 'true' ? undefined : isNull(capacitorUnits.removedOn),
    q.stepId ? eq(capacitorUnits.stepId, q.stepId) : undefined,
    q.bankId ? eq(steps.bankId, q.bankId) : undefined,
  );
  const base = () => db.select({ unit: capacitorUnits }).from(capacitorUnits).innerJoin(steps, eq(steps.id, capacitorUnits.stepId)).innerJoin(banks, eq(banks.id, steps.bankId));
  const [rows, [total]] = await Promise.all([
    base()
      .where(where)
      .orderBy(orderBy(q.sort, { position: capacitorUnits.position, serial: capacitorUnits.serial, installedOn: capacitorUnits.installedOn }), capacitorUnits.id)
      .limit(q.pageSize)
      .offset(offset(q.page, q.pageSize)),
    db
      .select({ n: count() })
      .from(capacitorUnits)
      .innerJoin(steps, eq(steps.id, capacitorUnits.stepId))
      .innerJoin(banks, eq(banks.id, steps.bankId))
      .where(where),
  ]);
  return { items: rows.map((r) => toUnit(r.unit)), total: total?.n ?? 0 };
}

export async function findUnitWithSite(db: Database, id: number) {
  const [row] = await db
    .select({ unit: capacitorUnits, siteId: banks.siteId })
    .from(capacitorUnits)
    .innerJoin(steps, eq(steps.id, capacitorUnits.stepId))
    .innerJoin(banks, eq(banks.id, steps.bankId))
    .where(eq(capacitorUnits.id, id));
  return row;
}

export async function getUnit(db: Database, scope: SiteScope, id: number): Promise<Unit> {
  const row = await findUnitWithSite(db, id);
  if (!row) throw new AppError('not_found', `Capacitor unit ${id} does not exist.`);
  assertInScope(scope, row.siteId, 'Capacitor unit', id);
  return toUnit(row.unit);
}

const positionTaken = (position: number | undefined) =>
  new AppError('conflict', `Position ${position ?? ''} of this step already holds a unit in service. Replace that unit instead.`, {
    position: 'This position already holds a unit',
  });

export function prepareUnitValues(input: Omit<z.output<typeof unitCreate>, 'stepId' | 'position'>) {
  const { capacitanceUF, tolerancePreset, toleranceMinusPct, tolerancePlusPct, ...rest } = input;
  const given = capacitanceUF !== null && capacitanceUF !== undefined;
  return {
    ...rest,
    ...tolerance({ tolerancePreset, toleranceMinusPct, tolerancePlusPct }),
    capacitanceUF: given ? capacitanceUF : rated(input),
    capacitanceGiven: given,
  };
}

export async function createUnit(db: Database, input: z.output<typeof unitCreate>): Promise<Unit> {
  if (!(await findStepWithSite(db, input.stepId))) throw new AppError('invalid', `Step ${input.stepId} does not exist.`, { stepId: 'No such step' });
  try {
    const [created] = await db
      .insert(capacitorUnits)
      .values({ stepId: input.stepId, position: input.position, ...prepareUnitValues(input) })
      .$returningId();
    return getUnit(db, 'all', created!.id);
  } catch (error) {
    if (isDuplicateKey(error)) throw positionTaken(input.position);
    throw error;
  }
}

export async function updateUnit(db: Database, id: number, input: z.output<typeof unitUpdate>): Promise<Unit> {
  const current = await findUnitWithSite(db, id);
  if (!current) throw new AppError('not_found', `Capacitor unit ${id} does not exist.`);
  if (current.unit.removedOn) throw new AppError('conflict', `Capacitor unit ${id} was removed on ${current.unit.removedOn}; its record no longer changes.`);
  const { version, capacitanceUF, tolerancePreset, toleranceMinusPct, tolerancePlusPct, ...rest } = input;
  const merged = { ...current.unit, ...rest };
  const values: Record<string, unknown> = { ...rest, ...tolerance({ tolerancePreset, toleranceMinusPct, tolerancePlusPct }) };
  const nameplateChanged = ['nameplateKvar', 'nameplateVoltageV', 'nameplateFrequencyHz', 'connection'].some((k) => k in rest);
  if (capacitanceUF !== undefined) {
    values.capacitanceUF = capacitanceUF ?? rated(merged);
    values.capacitanceGiven = capacitanceUF !== null;
  } else if (nameplateChanged && !current.unit.capacitanceGiven) {
    values.capacitanceUF = rated(merged);
  }
  try {
    await updateVersioned(db, capacitorUnits, id, version, values, 'Capacitor unit');
  } catch (error) {
    if (isDuplicateKey(error)) throw positionTaken(rest.position);
    throw error;
  }
  return getUnit(db, 'all', id);
}

/**
 * Replacing a unit: the old one is removed with its date and reason, the new one takes the same
 * position in one transaction, and the old record points at its successor so the position's
 * history reads on.
 */
export async function replaceUnit(db: Database, id: number, input: z.output<typeof unitReplace>): Promise<{ removed: Unit; installed: Unit }> {
  const newId = await db.transaction(async (tx) => {
    const [old] = await tx.select().from(capacitorUnits).where(eq(capacitorUnits.id, id)).for('update');
    if (!old) throw new AppError('not_found', `Capacitor unit ${id} does not exist.`);
    if (old.removedOn) throw new AppError('conflict', `Capacitor unit ${id} was already removed on ${old.removedOn}.`);
    if (old.version !== input.version) {
      throw new AppError('conflict', `Capacitor unit ${id} was changed by someone else since you opened it. Reload and try again.`);
    }
    if (old.installedOn && input.removedOn < old.installedOn) {
      throw new AppError('invalid', 'The removal date is before the unit was installed.', { removedOn: `On or after ${old.installedOn}` });
    }
    await tx
      .update(capacitorUnits)
      .set({ removedOn: input.removedOn, removalReason: input.reason, version: old.version + 1 })
      .where(eq(capacitorUnits.id, id));
    const [created] = await tx
      .insert(capacitorUnits)
      .values({
        stepId: old.stepId,
        position: old.position,
        ...prepareUnitValues({ ...input.replacement, installedOn: input.replacement.installedOn ?? input.removedOn }),
      })
      .$returningId();
    await tx.update(capacitorUnits).set({ replacedById: created!.id }).where(eq(capacitorUnits.id, id));
    return created!.id;
  });
  return { removed: await getUnit(db, 'all', id), installed: await getUnit(db, 'all', newId) };
}

export async function deleteUnit(db: Database, id: number): Promise<void> {
  await deleteUnreferenced(db, capacitorUnits, id, 'Capacitor unit', 'Remove it from service (replace it) instead.');
}
