import { fail, finite } from './validate.js';

/** Tolerance of a new unit's output against its nameplate, signed %. */
export interface TolerancePreset {
  id: string;
  label: string;
  minPct: number;
  maxPct: number;
  /** Source label as in engineering-reference.md. */
  source: string;
}

/**
 * Tolerance presets for new units (editable by the administrator), engineering-reference.md §3:
 * IEC 60831-1 low-voltage self-healing −5 % … +10 % [STD-memory, from memory];
 * IEEE 18 (2002 and later) 0 … +10 % of rated kvar [STD-memory, from memory];
 * IEEE 18-1992 100 … 115 % [STD-summary].
 */
export const TOLERANCE_PRESETS: readonly TolerancePreset[] = Object.freeze([
  Object.freeze({ id: 'iec-60831-1', label: 'IEC 60831-1 (low-voltage self-healing)', minPct: -5, maxPct: 10, source: '[STD-memory] IEC 60831-1' }),
  Object.freeze({ id: 'ieee-18', label: 'IEEE 18 (2002 and later)', minPct: 0, maxPct: 10, source: '[STD-memory] IEEE 18' }),
  Object.freeze({ id: 'ieee-18-1992', label: 'IEEE 18-1992', minPct: 0, maxPct: 15, source: '[STD-summary] IEEE 18-1992' }),
]);

/**
 * Whether a new unit's deviation from nameplate (e.g. assessCapacitor().deviationPct) lies
 * within a tolerance preset: minPct ≤ deviationPct ≤ maxPct (1e-9 % slack on both ends).
 */
export function withinTolerance(a: { deviationPct: number; preset: Pick<TolerancePreset, 'minPct' | 'maxPct'> }): boolean {
  const fn = 'withinTolerance';
  finite(fn, 'deviationPct', a.deviationPct);
  finite(fn, 'preset.minPct', a.preset.minPct);
  finite(fn, 'preset.maxPct', a.preset.maxPct);
  if (a.preset.minPct > a.preset.maxPct) fail(fn, 'preset.minPct', `must be ≤ preset.maxPct (${a.preset.maxPct})`, a.preset.minPct);
  return a.deviationPct >= a.preset.minPct - 1e-9 && a.deviationPct <= a.preset.maxPct + 1e-9;
}

/** Maximum ratio between terminal-pair values of a three-phase unit: 1.08 [STD-memory, IEC 60871-1, from memory]. */
export const MAX_TERMINAL_PAIR_RATIO = 1.08;

/**
 * Permissible operating levels as multiples of rated values, engineering-reference.md §3.
 * IEC 60831-1 [STD-memory, from memory]: voltage 1.10·U_N 8 h in 24 h, 1.15·U_N 30 min,
 * 1.20·U_N 5 min, 1.30·U_N 1 min; current 1.30·I_N continuous.
 * IEEE 18 [STD-summary]: 110 % rms voltage, 120 % peak voltage, 135 % current, 135 % kvar.
 */
export const OPERATING_LIMITS = Object.freeze({
  iec60831: Object.freeze({
    source: '[STD-memory] IEC 60831-1',
    voltage: Object.freeze([
      Object.freeze({ factor: 1.1, duration: '8 h in every 24 h' }),
      Object.freeze({ factor: 1.15, duration: '30 min' }),
      Object.freeze({ factor: 1.2, duration: '5 min' }),
      Object.freeze({ factor: 1.3, duration: '1 min' }),
    ]),
    currentFactor: 1.3,
  }),
  ieee18: Object.freeze({
    source: '[STD-summary] IEEE 18',
    rmsVoltageFactor: 1.1,
    peakVoltageFactor: 1.2,
    currentFactor: 1.35,
    kvarFactor: 1.35,
  }),
});

/** Case temperature level of a capacitor in service. */
export type CaseTemperatureLevel = 'normal' | 'investigate' | 'over-limit';

/**
 * Case temperature check: investigate above 55 °C, never above 65 °C
 * [STD, a US facilities maintenance manual for capacitors] engineering-reference.md §3.
 */
export function caseTemperatureLevel(caseTemperatureC: number): CaseTemperatureLevel {
  finite('caseTemperatureLevel', 'caseTemperatureC', caseTemperatureC);
  if (caseTemperatureC > 65) return 'over-limit';
  if (caseTemperatureC > 55) return 'investigate';
  return 'normal';
}

/**
 * Ambient temperature categories (upper limit letter), °C: maximum, highest 24 h mean, highest
 * annual mean. Only D is given in the reference: 55 / 45 / 35 [STD-memory, IEC 60831-1, from memory].
 */
export const TEMPERATURE_CATEGORIES = Object.freeze({
  D: Object.freeze({ maxC: 55, max24hMeanC: 45, maxAnnualMeanC: 35 }),
});
