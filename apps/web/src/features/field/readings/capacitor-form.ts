import type { ChecklistItem, FieldMethod, ReadingInput } from '@varden/schemas';
import { parseDecimal } from './decimal';
import type { CapacitorValues, WalkthroughUnit } from './live-capacitor-result';

export type Triplet = [string, string, string];

/** A capacitor unit's reading as typed: every number still text, so a half-typed "248," is kept. */
export type CapacitorForm = {
  method: FieldMethod;
  readings: Triplet;
  elements: Triplet;
  currents: Triplet;
  voltage: string;
  frequency: string;
  thd: string;
  caseTemperature: string;
  ambientTemperature: string;
  dischargeResistor: string;
  insulation: string;
  bulging: boolean;
  disconnectorOperated: boolean;
  leakage: boolean;
  discoloration: boolean;
  hotTerminals: boolean;
  notes: string;
};

export const visualFindings = [
  { name: 'bulging', label: 'Case bulging' },
  { name: 'disconnectorOperated', label: 'Over-pressure disconnector operated' },
  { name: 'leakage', label: 'Leakage' },
  { name: 'discoloration', label: 'Discoloration' },
  { name: 'hotTerminals', label: 'Hot terminals' },
] as const;

export function emptyCapacitorForm(method: FieldMethod): CapacitorForm {
  return {
    method,
    readings: ['', '', ''],
    elements: ['', '', ''],
    currents: ['', '', ''],
    voltage: '',
    frequency: '',
    thd: '',
    caseTemperature: '',
    ambientTemperature: '',
    dischargeResistor: '',
    insulation: '',
    bulging: false,
    disconnectorOperated: false,
    leakage: false,
    discoloration: false,
    hotTerminals: false,
    notes: '',
  };
}

const text = (v: unknown) => (typeof v === 'number' ? String(v) : '');
const triplet = (v: unknown): Triplet => (Array.isArray(v) ? [text(v[0]), text(v[1]), text(v[2])] : ['', '', '']);

/** The form filled from what was recorded before (an input stored by the server or waiting in the outbox). */
export function capacitorFormFrom(input: Record<string, unknown>, fallbackMethod: FieldMethod): CapacitorForm {
  const visual = typeof input.visual === 'object' && input.visual !== null ? (input.visual as Record<string, unknown>) : {};
  const method = typeof input.method === 'string' ? (input.method as FieldMethod) : fallbackMethod;
  return {
    ...emptyCapacitorForm(method),
    readings: triplet(input.readingsUF),
    elements: triplet(input.elementsUF),
    currents: triplet(input.currentsA),
    voltage: text(input.measuredVoltageV),
    frequency: text(input.measuredFrequencyHz),
    thd: text(input.voltageThdPct),
    caseTemperature: text(input.caseTemperatureC),
    ambientTemperature: text(input.ambientTemperatureC),
    dischargeResistor: text(input.dischargeResistorOhm),
    insulation: text(input.insulationResistanceMOhm),
    bulging: visual.bulging === true,
    disconnectorOperated: visual.disconnectorOperated === true,
    leakage: visual.leakage === true,
    discoloration: visual.discoloration === true,
    hotTerminals: visual.hotTerminals === true,
    notes: typeof input.notes === 'string' ? input.notes : '',
  };
}

/** The typed values as numbers, for the live result. */
export function capacitorValuesOf(form: CapacitorForm): CapacitorValues {
  return {
    method: form.method,
    readingsUF: form.readings.map(parseDecimal),
    elementsUF: form.elements.map(parseDecimal),
    currentsA: form.currents.map(parseDecimal),
    measuredVoltageV: parseDecimal(form.voltage),
    measuredFrequencyHz: parseDecimal(form.frequency),
    caseTemperatureC: parseDecimal(form.caseTemperature),
    bulging: form.bulging,
    disconnectorOperated: form.disconnectorOperated,
  };
}

const defined = <T extends object>(entries: T) =>
  Object.fromEntries(Object.entries(entries).filter(([, value]) => value !== undefined)) as Partial<T>;

/**
 * The contract's capacitorReadingInput from the form: only the values of the chosen method and
 * of what the checklist asks for. NaN (not a number) is passed on so the shared schema says so.
 */
export function capacitorInputOf(
  form: CapacitorForm,
  unit: Pick<WalkthroughUnit, 'id' | 'connection'>,
  checklist: readonly ChecklistItem[],
  meta: { idempotencyKey: string; recordedAt: string },
): ReadingInput {
  const asks = (item: ChecklistItem) => checklist.includes(item);
  const numbers = (values: readonly string[]) => values.map((v) => parseDecimal(v) ?? Number.NaN);
  const single = unit.connection === 'single-phase';
  return {
    idempotencyKey: meta.idempotencyKey,
    recordedAt: meta.recordedAt,
    target: 'capacitor-unit',
    targetId: unit.id,
    method: form.method,
    notes: form.notes.trim(),
    ...(form.method === 'open-pairs' || form.method === 'shorted' ? { readingsUF: numbers(form.readings) as [number, number, number] } : {}),
    ...(form.method === 'per-element' ? { elementsUF: numbers(single ? form.elements.slice(0, 1) : form.elements) } : {}),
    ...(form.method === 'line-currents'
      ? defined({
          currentsA: numbers(form.currents) as [number, number, number],
          measuredVoltageV: parseDecimal(form.voltage),
          measuredFrequencyHz: parseDecimal(form.frequency),
          voltageThdPct: parseDecimal(form.thd),
        })
      : {}),
    ...(asks('case-temperature') ? defined({ caseTemperatureC: parseDecimal(form.caseTemperature), ambientTemperatureC: parseDecimal(form.ambientTemperature) }) : {}),
    ...(asks('discharge-resistor') ? defined({ dischargeResistorOhm: parseDecimal(form.dischargeResistor) }) : {}),
    ...(asks('insulation-resistance') ? defined({ insulationResistanceMOhm: parseDecimal(form.insulation) }) : {}),
    visual: {
      bulging: form.bulging,
      disconnectorOperated: form.disconnectorOperated,
      leakage: form.leakage,
      discoloration: form.discoloration,
      hotTerminals: form.hotTerminals,
    },
  };
}

const pathFields: Record<string, string> = {
  readingsUF: 'readings',
  elementsUF: 'elements',
  currentsA: 'currents',
  measuredVoltageV: 'voltage',
  measuredFrequencyHz: 'frequency',
  voltageThdPct: 'thd',
  caseTemperatureC: 'caseTemperature',
  ambientTemperatureC: 'ambientTemperature',
  dischargeResistorOhm: 'dischargeResistor',
  insulationResistanceMOhm: 'insulation',
  notes: 'notes',
  method: 'method',
};

/** The form field a contract path ("readingsUF.1", or the server's "readingsUF") belongs to; undefined for the whole form. */
export function capacitorFieldOf(path: ReadonlyArray<PropertyKey> | string): string | undefined {
  const parts = typeof path === 'string' ? path.split('.') : path.map(String);
  const [head, index] = parts;
  const field = head === undefined ? undefined : pathFields[head];
  if (!field) return undefined;
  if (field === 'readings' || field === 'elements' || field === 'currents') return `${field}.${index && /^\d$/.test(index) ? index : '0'}`;
  return field;
}
