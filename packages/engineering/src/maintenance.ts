import { fail, finite, oneOf, positive } from './validate.js';

/** How much the site depends on the equipment (NETA MTS Appendix B). */
export type ReliabilityNeed = 'low' | 'medium' | 'high';
/** Condition of the equipment (NETA MTS Appendix B). */
export type EquipmentCondition = 'poor' | 'average' | 'good';

const RELIABILITY: readonly ReliabilityNeed[] = ['low', 'medium', 'high'];
const CONDITION: readonly EquipmentCondition[] = ['poor', 'average', 'good'];

/**
 * Maintenance interval multipliers, NETA MTS Appendix B [STD] engineering-reference.md §7:
 * rows reliability need, columns condition.
 */
export const NETA_INTERVAL_FACTORS: Readonly<Record<ReliabilityNeed, Readonly<Record<EquipmentCondition, number>>>> = Object.freeze({
  low: Object.freeze({ poor: 1.0, average: 2.0, good: 2.5 }),
  medium: Object.freeze({ poor: 0.5, average: 1.0, good: 1.5 }),
  high: Object.freeze({ poor: 0.25, average: 0.5, good: 0.75 }),
});

/**
 * Maintenance interval, months: base interval × NETA MTS Appendix B factor [STD] §7.
 * E.g. a 12-month base, high reliability need, poor condition → 3 months.
 */
export function maintenanceIntervalMonths(a: { baseIntervalMonths: number; reliability: ReliabilityNeed; condition: EquipmentCondition }): number {
  const fn = 'maintenanceIntervalMonths';
  positive(fn, 'baseIntervalMonths', a.baseIntervalMonths);
  oneOf(fn, 'reliability', a.reliability, RELIABILITY);
  oneOf(fn, 'condition', a.condition, CONDITION);
  return a.baseIntervalMonths * NETA_INTERVAL_FACTORS[a.reliability][a.condition];
}

/** Thermography severity classes by temperature rise over ambient. */
export type ThermographySeverity = 'none' | 'possible' | 'probable' | 'monitor' | 'immediate';

/**
 * Thermography severity from the temperature rise over ambient ΔT, °C
 * [STD-summary, NETA] engineering-reference.md §7: 1–10 °C possible deficiency, 11–20 °C
 * probable, 21–40 °C monitor until corrected, > 40 °C repair immediately. The printed bands are whole degrees; between them a reading belongs to the
 * lower band up to its upper bound (10.5 °C → probable, 10 °C → possible). Below 1 °C: none.
 */
export function thermographySeverity(deltaTC: number): { severity: ThermographySeverity; action: string } {
  finite('thermographySeverity', 'deltaTC', deltaTC);
  if (deltaTC > 40) return { severity: 'immediate', action: 'serious fault: repair at once' };
  if (deltaTC > 20) return { severity: 'monitor', action: 'fault: keep it under watch until it is corrected' };
  if (deltaTC > 10) return { severity: 'probable', action: 'probable fault: plan a repair' };
  if (deltaTC >= 1) return { severity: 'possible', action: 'possible fault: look into it' };
  return { severity: 'none', action: 'no meaningful rise over ambient' };
}

/** One row of the insulation-resistance table. */
export interface InsulationResistanceRow {
  /** Equipment voltage rating up to which the row applies, V. */
  ratingV: number;
  testVoltageVdc: number;
  minimumMOhm: number;
}

/**
 * Insulation resistance, terminals joined to case, ANSI/NETA MTS Table 100.1 [STD]
 * engineering-reference.md §3 (rows given there): 600 V → 1000 V DC test, 100 MΩ;
 * 1000 V → 1000 V, 100 MΩ; 5 kV → 2500 V, 1500 MΩ; 15 kV → 2500 V, 5000 MΩ.
 */
export const INSULATION_RESISTANCE_TABLE: readonly InsulationResistanceRow[] = Object.freeze([
  Object.freeze({ ratingV: 600, testVoltageVdc: 1000, minimumMOhm: 100 }),
  Object.freeze({ ratingV: 1000, testVoltageVdc: 1000, minimumMOhm: 100 }),
  Object.freeze({ ratingV: 5000, testVoltageVdc: 2500, minimumMOhm: 1500 }),
  Object.freeze({ ratingV: 15000, testVoltageVdc: 2500, minimumMOhm: 5000 }),
]);

/**
 * Test voltage and minimum insulation resistance for a rated voltage: the first row of
 * {@link INSULATION_RESISTANCE_TABLE} whose rating is ≥ the unit's rated voltage. Returns null
 * above 15 kV (beyond the rows held here). Trend results against the unit's own baseline.
 */
export function insulationResistanceMinimum(ratedVoltageV: number): InsulationResistanceRow | null {
  positive('insulationResistanceMinimum', 'ratedVoltageV', ratedVoltageV);
  for (const row of INSULATION_RESISTANCE_TABLE) if (ratedVoltageV <= row.ratingV) return row;
  return null;
}

/**
 * Whether a measured insulation resistance meets the table minimum for the rating
 * (null when the rating is beyond the table).
 */
export function insulationResistanceOk(a: { ratedVoltageV: number; measuredMOhm: number }): boolean | null {
  const fn = 'insulationResistanceOk';
  positive(fn, 'ratedVoltageV', a.ratedVoltageV);
  if (typeof a.measuredMOhm !== 'number' || !(a.measuredMOhm >= 0)) fail(fn, 'measuredMOhm', 'must be a finite number ≥ 0', a.measuredMOhm);
  const row = insulationResistanceMinimum(a.ratedVoltageV);
  return row === null ? null : a.measuredMOhm >= row.minimumMOhm;
}

/**
 * Typical low-voltage bank cadence [COMMON, common practice] engineering-reference.md §7.
 * Intervals in months; the organisation's plans override them.
 */
export const COMMON_LV_CADENCE = Object.freeze([
  Object.freeze({ task: 'visual inspection and controller alarms', intervalMonths: 3 }),
  Object.freeze({ task: 'step currents', intervalMonths: 6 }),
  Object.freeze({ task: 'de-energised capacitance, contactors, pre-charge resistors, fuses, discharge resistors, reactor thermal switch, cleaning', intervalMonths: 12 }),
  Object.freeze({ task: 'thermography (NFPA 70B-2023: at least every 12 months, at ≥ 40 % of normal load or with the load recorded)', intervalMonths: 12 }),
]);
