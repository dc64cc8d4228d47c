import { fail, positive } from './validate.js';

/**
 * Energy stored in a capacitance charged to the peak of an rms voltage U, J:
 * W = ½·C·(√2·U)² = C·U². About 53 J per leg in a 50 kvar 400 V delta unit (331.57 µF).
 * Source: [DERIVED] engineering-reference.md §8.
 */
export function storedEnergyJ(a: { capacitanceUF: number; voltageV: number }): number {
  const fn = 'storedEnergyJ';
  positive(fn, 'capacitanceUF', a.capacitanceUF);
  positive(fn, 'voltageV', a.voltageV);
  const peak = Math.SQRT2 * a.voltageV;
  return 0.5 * a.capacitanceUF * 1e-6 * peak * peak;
}

/**
 * Largest discharge resistance across one element that brings it from √2·U to the residual
 * voltage U_R within t seconds, Ω: R ≤ t / (C·ln(√2·U / U_R)).
 * Source: [DERIVED] engineering-reference.md §3 (exponential RC discharge).
 *
 * @throws RangeError unless 0 < residualV < √2·voltageV.
 */
export function maxDischargeResistanceOhm(a: { capacitanceUF: number; voltageV: number; seconds: number; residualV: number }): number {
  const fn = 'maxDischargeResistanceOhm';
  positive(fn, 'capacitanceUF', a.capacitanceUF);
  positive(fn, 'voltageV', a.voltageV);
  positive(fn, 'seconds', a.seconds);
  positive(fn, 'residualV', a.residualV);
  const peak = Math.SQRT2 * a.voltageV;
  if (!(a.residualV < peak)) fail(fn, 'residualV', `must be below the peak voltage √2·voltageV = ${peak.toFixed(1)} V`, a.residualV);
  return a.seconds / (a.capacitanceUF * 1e-6 * Math.log(peak / a.residualV));
}

/**
 * Time a discharge resistance R takes to bring an element from √2·U to U_R, s:
 * t = R·C·ln(√2·U / U_R). Inverse of {@link maxDischargeResistanceOhm}. Source: [DERIVED].
 */
export function dischargeTimeS(a: { resistanceOhm: number; capacitanceUF: number; voltageV: number; residualV: number }): number {
  const fn = 'dischargeTimeS';
  positive(fn, 'resistanceOhm', a.resistanceOhm);
  positive(fn, 'capacitanceUF', a.capacitanceUF);
  positive(fn, 'voltageV', a.voltageV);
  positive(fn, 'residualV', a.residualV);
  const peak = Math.SQRT2 * a.voltageV;
  if (!(a.residualV < peak)) fail(fn, 'residualV', `must be below the peak voltage √2·voltageV = ${peak.toFixed(1)} V`, a.residualV);
  return a.resistanceOhm * a.capacitanceUF * 1e-6 * Math.log(peak / a.residualV);
}

/** A discharge requirement: from √2·U_N to residualV within seconds. */
export interface DischargeRequirement {
  id: string;
  label: string;
  residualV: number;
  seconds: number;
  source: string;
}

/**
 * Discharge requirements, engineering-reference.md §3: IEC 60831-1 75 V within 3 min
 * [STD-summary]; NEC 460 (≤ 600 V) 50 V within 1 min [STD-summary]; NEC over 600 V 50 V within
 * 5 min [STD-memory, from memory]. Local codes prevail.
 */
export const DISCHARGE_REQUIREMENTS: readonly DischargeRequirement[] = Object.freeze([
  Object.freeze({ id: 'iec-60831-1', label: 'IEC 60831-1 (low voltage)', residualV: 75, seconds: 180, source: '[STD-summary] IEC 60831-1' }),
  Object.freeze({ id: 'nec-460-lv', label: 'NEC 460, 600 V and below', residualV: 50, seconds: 60, source: '[STD-summary] NEC 460' }),
  Object.freeze({ id: 'nec-460-mv', label: 'NEC 460, over 600 V', residualV: 50, seconds: 300, source: '[STD-memory] NEC 460' }),
]);
