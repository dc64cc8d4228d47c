import { registerImportColumns, stepCreate, unitCreate } from '@varden/schemas';
import Papa from 'papaparse';

/**
 * The browser's own check of a bank's register file, before anything is sent: the same columns
 * and the same shared schemas (stepCreate, unitCreate) as the server's import, so a planner sees
 * each row's errors at once. The server's preview (dryRun) stays the authority.
 */
export type RegisterColumn = (typeof registerImportColumns)[number];

/** Columns every file must have; capacitance_uf, serial, maker, model and installed_on may be left out. */
export const requiredColumns = ['step', 'step_kvar', 'position', 'kvar', 'voltage_v', 'frequency_hz', 'connection'] as const satisfies readonly RegisterColumn[];

const numberColumns = ['step', 'step_kvar', 'position', 'kvar', 'voltage_v', 'frequency_hz', 'capacitance_uf'] as const satisfies readonly RegisterColumn[];

/** What each column holds, for the page that documents the format. */
export const columnMeanings: Record<RegisterColumn, string> = {
  step: 'Step number in the bank, from 1',
  step_kvar: 'The step’s rated output at network voltage, kvar',
  position: 'Position of the unit in its step, from 1',
  kvar: 'Nameplate output of the unit, kvar',
  voltage_v: 'Nameplate rated voltage, V',
  frequency_hz: 'Nameplate frequency: 50 or 60, Hz',
  connection: 'delta, star or single-phase',
  capacitance_uf: 'Optional: capacitance per delta leg, star phase or element, µF (computed from the nameplate when empty)',
  serial: 'Optional: serial number',
  maker: 'Optional: maker',
  model: 'Optional: model',
  installed_on: 'Optional: date installed, YYYY-MM-DD',
};

export type RegisterCsvContext = {
  bankId: number;
  /** Steps of the bank in service. */
  steps: ReadonlyArray<{ number: number; ratedKvar: number }>;
  /** Positions already holding a unit in service, by step number. */
  occupied: ReadonlyArray<{ stepNumber: number; position: number }>;
};

export type RegisterCsvRow = {
  /** Line in the file; line 1 is the header. */
  line: number;
  cells: Partial<Record<RegisterColumn, string>>;
  errors: string[];
};

export type RegisterCsvCheck = {
  missingColumns: RegisterColumn[];
  /** Columns the import does not know; they are ignored. */
  ignoredColumns: string[];
  /** Problems with the file as a whole (no header, no rows). */
  fileErrors: string[];
  rows: RegisterCsvRow[];
  /** What an import would add: step numbers new to the bank and the number of units. */
  plan: { newSteps: number[]; units: number };
  /** True when there is nothing to fix: the file may go to the server. */
  ok: boolean;
};

type Cells = Partial<Record<string, string>>;

/** '' → undefined; a number (a decimal comma allowed) → the number; anything else → NaN. */
function numberOf(raw: string | undefined): number | undefined {
  if (raw === undefined || raw.trim() === '') return undefined;
  const value = Number(raw.trim().replace(',', '.'));
  return Number.isFinite(value) ? value : Number.NaN;
}

const textOf = (raw: string | undefined) => raw?.trim() ?? '';

const fieldColumn: Record<string, RegisterColumn> = {
  position: 'position',
  nameplateKvar: 'kvar',
  nameplateVoltageV: 'voltage_v',
  nameplateFrequencyHz: 'frequency_hz',
  connection: 'connection',
  capacitanceUF: 'capacitance_uf',
  serial: 'serial',
  maker: 'maker',
  model: 'model',
  installedOn: 'installed_on',
};

/** Parses the text as papaparse does on the server: header row, trimmed lower-case names, blank lines skipped. */
export function parseRegisterCsv(csv: string) {
  return Papa.parse<Cells>(csv.replace(/^\uFEFF/, ''), {
    header: true,
    skipEmptyLines: 'greedy',
    transformHeader: (header) => header.trim().toLowerCase(),
  });
}

export function checkRegisterCsv(csv: string, context: RegisterCsvContext): RegisterCsvCheck {
  const parsed = parseRegisterCsv(csv);
  const header = (parsed.meta.fields ?? []).filter((field) => field !== '');
  const known: readonly string[] = registerImportColumns;
  const missingColumns = requiredColumns.filter((column) => !header.includes(column));
  const ignoredColumns = header.filter((field) => !known.includes(field));
  const empty: RegisterCsvCheck = {
    missingColumns,
    ignoredColumns,
    fileErrors: [],
    rows: [],
    plan: { newSteps: [], units: 0 },
    ok: false,
  };

  if (csv.trim() === '') return { ...empty, fileErrors: ['The file is empty.'] };
  if (missingColumns.length > 0) {
    const plural = missingColumns.length > 1 ? 's' : '';
    return { ...empty, fileErrors: [`The header lacks the column${plural} ${missingColumns.join(', ')}.`] };
  }
  if (parsed.data.length === 0) return { ...empty, fileErrors: ['The file has a header but no rows.'] };

  const stepKvar = new Map(context.steps.map((step) => [step.number, step.ratedKvar]));
  const existingSteps = new Set(stepKvar.keys());
  const occupied = new Set(context.occupied.map((unit) => `${unit.stepNumber}/${unit.position}`));
  const firstLineOf = new Map<string, number>();
  const shapeErrors = new Map<number, string>();
  for (const error of parsed.errors) {
    if (error.row !== undefined && error.type === 'FieldMismatch') shapeErrors.set(error.row, error.message);
  }

  const newSteps = new Set<number>();
  let units = 0;
  const rows = parsed.data.map((cells, index): RegisterCsvRow => {
    const line = index + 2;
    const errors: string[] = [];
    const shapeError = shapeErrors.get(index);
    if (shapeError) errors.push(`The row does not match the header: ${shapeError}`);
    for (const column of requiredColumns) if (textOf(cells[column]) === '') errors.push(`${column} is empty`);
    const numbers: Partial<Record<RegisterColumn, number>> = {};
    for (const column of numberColumns) {
      const value = numberOf(cells[column]);
      if (Number.isNaN(value)) errors.push(`${column} “${textOf(cells[column])}” is not a number`);
      else if (value !== undefined) numbers[column] = value;
    }

    const stepNumber = numbers.step;
    const ratedKvar = numbers.step_kvar;
    if (errors.length === 0 && stepNumber !== undefined && ratedKvar !== undefined) {
      const stepCheck = stepCreate.safeParse({ bankId: context.bankId, number: stepNumber, ratedKvar });
      if (!stepCheck.success) errors.push(...stepCheck.error.issues.map((issue) => `step: ${issue.message}`));
      const earlier = stepKvar.get(stepNumber);
      if (earlier !== undefined && Math.abs(earlier - ratedKvar) > 1e-9) {
        errors.push(`step_kvar ${ratedKvar} differs from step ${stepNumber}’s ${earlier} kvar`);
      }
      if (earlier === undefined) stepKvar.set(stepNumber, ratedKvar);

      const unitCheck = unitCreate.safeParse({
        // The step may not exist yet; the row is checked for its shape only.
        stepId: 1,
        position: numbers.position,
        nameplateKvar: numbers.kvar,
        nameplateVoltageV: numbers.voltage_v,
        nameplateFrequencyHz: numbers.frequency_hz,
        connection: textOf(cells.connection).toLowerCase(),
        capacitanceUF: numbers.capacitance_uf ?? null,
        serial: textOf(cells.serial),
        maker: textOf(cells.maker),
        model: textOf(cells.model),
        installedOn: textOf(cells.installed_on) === '' ? null : textOf(cells.installed_on),
      });
      if (!unitCheck.success) {
        for (const issue of unitCheck.error.issues) {
          const field = String(issue.path[0] ?? '');
          errors.push(`${fieldColumn[field] ?? field}: ${issue.message}`);
        }
      } else {
        const key = `${stepNumber}/${unitCheck.data.position}`;
        const first = firstLineOf.get(key);
        if (first !== undefined) errors.push(`step ${stepNumber} position ${unitCheck.data.position} is also on line ${first}`);
        else if (occupied.has(key)) {
          errors.push(`step ${stepNumber} position ${unitCheck.data.position} already holds a unit in service`);
        } else firstLineOf.set(key, line);
      }
      if (errors.length === 0) {
        units++;
        if (!existingSteps.has(stepNumber)) newSteps.add(stepNumber);
      }
    }
    const kept: Partial<Record<RegisterColumn, string>> = {};
    for (const column of registerImportColumns) if (cells[column] !== undefined) kept[column] = textOf(cells[column]);
    return { line, cells: kept, errors };
  });

  const ok = rows.every((row) => row.errors.length === 0);
  return {
    missingColumns,
    ignoredColumns,
    fileErrors: [],
    rows,
    plan: { newSteps: [...newSteps].sort((a, b) => a - b), units },
    ok,
  };
}

/** A file to start from: the header and two invented rows of a 50 kvar step of two 25 kvar units. */
export function registerCsvTemplate(): string {
  return Papa.unparse({
    fields: [...registerImportColumns],
    data: [
      ['1', '50', '1', '25', '400', '50', 'delta', '', 'SER-0001', '', '', '2024-03-01'],
      ['1', '50', '2', '25', '400', '50', 'delta', '', 'SER-0002', '', '', '2024-03-01'],
    ],
  });
}
