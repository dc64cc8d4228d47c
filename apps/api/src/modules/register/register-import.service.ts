import { registerImportColumns, stepCreate, unitCreate, type RegisterImportResponse } from '@varden/schemas';
import { and, eq, isNull } from 'drizzle-orm';
import Papa from 'papaparse';
import type { Database } from '../../db/client';
import { banks, capacitorUnits, steps } from '../../db/schema/index';
import { isDuplicateKey } from '../../db/versioned';
import { AppError } from '../../http/app-error';
import { prepareUnitValues } from './units.service';

type CsvRow = Partial<Record<(typeof registerImportColumns)[number], string>>;
const required = ['step', 'step_kvar', 'position', 'kvar', 'voltage_v', 'frequency_hz', 'connection'] as const;

const number = (raw: string | undefined): number | undefined => {
  if (raw === undefined || raw.trim() === '') return undefined;
  const value = Number(raw.trim().replace(',', '.'));
  return Number.isFinite(value) ? value : Number.NaN;
};

interface PlannedUnit {
  line: number;
  stepNumber: number;
  unit: ReturnType<typeof unitCreate.parse>;
}

/**
 * Imports a bank's steps and capacitor units from CSV, all or nothing. Every row is checked
 * first (missing column, bad number, unknown connection, duplicate position in the file or
 * against units in service); with any error, nothing is written and each row's errors come back.
 */
export async function importBankRegister(db: Database, bankId: number, csv: string, dryRun: boolean): Promise<RegisterImportResponse> {
  const [bank] = await db.select({ id: banks.id }).from(banks).where(eq(banks.id, bankId));
  if (!bank) throw new AppError('not_found', `Bank ${bankId} does not exist.`);

  const parsed = Papa.parse<CsvRow>(csv.replace(/^\uFEFF/, ''), {
    header: true,
    skipEmptyLines: 'greedy',
    transformHeader: (h) => h.trim().toLowerCase(),
  });
  const header = parsed.meta.fields ?? [];
  const missing = required.filter((c) => !header.includes(c));
  if (missing.length) {
    throw new AppError('invalid', `The file lacks the column${missing.length > 1 ? 's' : ''} ${missing.join(', ')}.`, {
      csv: `Missing column: ${missing.join(', ')}`,
    }, undefined, { rows: [], missingColumns: missing });
  }
  const unknown = header.filter((h) => !(registerImportColumns as readonly string[]).includes(h));

  const existingSteps = await db.select().from(steps).where(eq(steps.bankId, bankId));
  const stepByNumber = new Map(existingSteps.map((s) => [s.number, s]));
  const occupied = new Set(
    (
      await db
        .select({ number: steps.number, position: capacitorUnits.position })
        .from(capacitorUnits)
        .innerJoin(steps, eq(steps.id, capacitorUnits.stepId))
        .where(and(eq(steps.bankId, bankId), isNull(capacitorUnits.removedOn)))
    ).map((r) => `${r.number}/${r.position}`),
  );

  const rows: RegisterImportResponse['rows'] = [];
  const planned: PlannedUnit[] = [];
  const seen = new Map<string, number>();
  const stepKvarInFile = new Map<number, number>();

  parsed.data.forEach((raw, index) => {
    const line = index + 2; // line 1 is the header
    const errors: string[] = [];
    for (const c of required) if (!raw[c] || raw[c]!.trim() === '') errors.push(`${c} is empty`);
    const numbers: Record<string, number | undefined> = {};
    for (const c of ['step', 'step_kvar', 'position', 'kvar', 'voltage_v', 'frequency_hz', 'capacitance_uf'] as const) {
      numbers[c] = number(raw[c]);
      if (Number.isNaN(numbers[c])) errors.push(`${c} “${raw[c]}” is not a number`);
    }
    const stepNumber = numbers.step;
    const stepKvar = numbers.step_kvar;
    if (errors.length === 0 && stepNumber !== undefined && stepKvar !== undefined) {
      const stepCheck = stepCreate.safeParse({ bankId, number: stepNumber, ratedKvar: stepKvar });
      if (!stepCheck.success) errors.push(...stepCheck.error.issues.map((i) => `step: ${i.message}`));
      const earlier = stepKvarInFile.get(stepNumber) ?? stepByNumber.get(stepNumber)?.ratedKvar;
      if (earlier !== undefined && Math.abs(earlier - stepKvar) > 1e-9) {
        errors.push(`step_kvar ${stepKvar} differs from step ${stepNumber}'s ${earlier} kvar`);
      }
      stepKvarInFile.set(stepNumber, stepKvar);
      const candidate = unitCreate.safeParse({
        stepId: 1, // placeholder: the step may not exist yet; checked for shape only
        position: numbers.position,
        nameplateKvar: numbers.kvar,
        nameplateVoltageV: numbers.voltage_v,
        nameplateFrequencyHz: numbers.frequency_hz,
        connection: raw.connection?.trim().toLowerCase(),
        capacitanceUF: numbers.capacitance_uf ?? null,
        serial: raw.serial?.trim() ?? '',
        maker: raw.maker?.trim() ?? '',
        model: raw.model?.trim() ?? '',
        installedOn: raw.installed_on?.trim() ? raw.installed_on.trim() : null,
      });
      if (!candidate.success) {
        const label: Record<string, string> = {
          nameplateKvar: 'kvar',
          nameplateVoltageV: 'voltage_v',
          nameplateFrequencyHz: 'frequency_hz',
          capacitanceUF: 'capacitance_uf',
          installedOn: 'installed_on',
        };
        for (const issue of candidate.error.issues) {
          const field = String(issue.path[0] ?? '');
          errors.push(`${label[field] ?? field}: ${issue.message}`);
        }
      } else {
        const key = `${stepNumber}/${candidate.data.position}`;
        const first = seen.get(key);
        if (first !== undefined) errors.push(`step ${stepNumber} position ${candidate.data.position} is also on line ${first}`);
        else if (occupied.has(key)) errors.push(`step ${stepNumber} position ${candidate.data.position} already holds a unit in service`);
        seen.set(key, line);
        if (errors.length === 0) planned.push({ line, stepNumber, unit: candidate.data });
      }
    }
    rows.push({ line, errors });
  });
  if (parsed.data.length === 0) throw new AppError('invalid', 'The file has a header but no rows.', { csv: 'No rows' }, undefined, { rows });

  const newStepNumbers = [...new Set(planned.map((p) => p.stepNumber))].filter((n) => !stepByNumber.has(n));
  const failing = rows.filter((r) => r.errors.length > 0);
  if (failing.length > 0) {
    throw new AppError(
      'invalid',
      `${failing.length} of ${rows.length} rows have errors; nothing was imported.`,
      { csv: `Rows with errors: ${failing.map((r) => r.line).join(', ')}` },
      undefined,
      { rows, ignoredColumns: unknown },
    );
  }
  const created = { steps: newStepNumbers.length, units: planned.length };
  if (dryRun) return { rows, created, dryRun };

  try {
    await writeImport();
  } catch (error) {
    if (isDuplicateKey(error)) throw new AppError('conflict', 'Someone changed this bank while you imported; preview the file again.');
    throw error;
  }
  return { rows, created, dryRun };

  async function writeImport() {
    await db.transaction(async (tx) => {
      const stepIds = new Map(existingSteps.map((s) => [s.number, s.id]));
      for (const n of newStepNumbers) {
        const [step] = await tx.insert(steps).values({ bankId, number: n, ratedKvar: stepKvarInFile.get(n)! }).$returningId();
        stepIds.set(n, step!.id);
      }
      for (const p of planned) {
        const { stepId: _placeholder, position, ...rest } = p.unit;
        await tx.insert(capacitorUnits).values({ stepId: stepIds.get(p.stepNumber)!, position, ...prepareUnitValues(rest) });
      }
    });
  }
}
