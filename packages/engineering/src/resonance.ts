import { CHARACTERISTIC_HARMONICS, nearestHarmonic } from './harmonics.js';
import { fail, positive } from './validate.js';

/**
 * Parallel resonance of undetuned capacitors with the supply. Source for this module:
 * [rule of thumb; printed in IEEE harmonic guides, clause from memory] engineering-reference.md §5.
 */

/**
 * Short-circuit power at the bank's bus, kVA: S_T' = S_T / z_T (z_T = impedancePct/100); with
 * the utility's short-circuit power S_util in series: 1/S = 1/S_T' + 1/S_util.
 * 1000 kVA at 6 % → 16 667 kVA. Source: engineering-reference.md §5.
 */
export function shortCircuitKva(a: { transformerKva: number; impedancePct: number; utilityShortCircuitKva?: number }): number {
  return sscFor('shortCircuitKva', a);
}

function sscFor(fn: string, a: { transformerKva: number; impedancePct: number; utilityShortCircuitKva?: number }): number {
  positive(fn, 'transformerKva', a.transformerKva);
  positive(fn, 'impedancePct', a.impedancePct);
  const st = a.transformerKva / (a.impedancePct / 100);
  if (a.utilityShortCircuitKva === undefined) return st;
  positive(fn, 'utilityShortCircuitKva', a.utilityShortCircuitKva);
  return 1 / (1 / st + 1 / a.utilityShortCircuitKva);
}

/**
 * Resonance order of a capacitor bank with the supply: h_r = √(S_sc / Q_c), S_sc from
 * {@link shortCircuitKva}. 1000 kVA, 6 %, 300 kvar → 7.45; 666.7 kvar lands on the 5th.
 * Source: [rule of thumb, IEEE harmonic guides, from memory] engineering-reference.md §5.
 */
export function resonanceOrder(a: {
  transformerKva: number;
  impedancePct: number;
  kvar: number;
  utilityShortCircuitKva?: number;
}): number {
  const s = sscFor('resonanceOrder', a);
  positive('resonanceOrder', 'kvar', a.kvar);
  return Math.sqrt(s / a.kvar);
}

/**
 * Voltage rise at the bus when the bank is switched in, %: ΔU ≈ Q_c·z_T% / S_T.
 * Source: [COMMON] engineering-reference.md §5 (common practice).
 */
export function voltageRisePct(a: { kvar: number; transformerKva: number; impedancePct: number }): number {
  const fn = 'voltageRisePct';
  positive(fn, 'kvar', a.kvar);
  positive(fn, 'transformerKva', a.transformerKva);
  positive(fn, 'impedancePct', a.impedancePct);
  return (a.kvar * a.impedancePct) / a.transformerKva;
}

/** One switchable combination of undetuned steps and its resonance with the supply. */
export interface ResonanceCase {
  /** Indices (into stepsKvar) of the steps switched in. */
  stepsOn: number[];
  kvar: number;
  /** h_r = √(S_sc / Q_c). */
  order: number;
  nearestHarmonic: number;
  /** 100·|h_r − n|/n for the nearest characteristic harmonic n. */
  distancePct: number;
  /** True when h_r lies within marginPct of 5, 7, 11 or 13 [COMMON]. */
  warning: boolean;
}

/**
 * Resonance order for each switchable combination of a bank's undetuned steps.
 * `combinations: 'cumulative'` (default) takes steps 1, 1+2, 1+2+3, … in order, as a
 * controller usually switches them; `'all'` takes every non-empty subset with a distinct total
 * (up to 16 steps). Each case warns when h_r is within `marginPct` (default 10 %) of a
 * characteristic harmonic 5, 7, 11, 13 [COMMON, common practice].
 * Source: engineering-reference.md §5.
 */
export function bankResonance(a: {
  transformerKva: number;
  impedancePct: number;
  utilityShortCircuitKva?: number;
  stepsKvar: number[];
  combinations?: 'cumulative' | 'all';
  marginPct?: number;
}): ResonanceCase[] {
  const fn = 'bankResonance';
  const ssc = sscFor(fn, a);
  if (!Array.isArray(a.stepsKvar)) fail(fn, 'stepsKvar', 'must be an array', a.stepsKvar);
  const n = a.stepsKvar.length;
  for (let i = 0; i < n; i++) positive(fn, 'stepsKvar', a.stepsKvar[i] as number, i);
  const margin = a.marginPct ?? 10;
  positive(fn, 'marginPct', margin);
  const mode = a.combinations ?? 'cumulative';
  const out: ResonanceCase[] = [];
  const push = (stepsOn: number[], kvar: number): void => {
    const order = Math.sqrt(ssc / kvar);
    const near = nearestHarmonic(order, CHARACTERISTIC_HARMONICS);
    out.push({ stepsOn, kvar, order, nearestHarmonic: near.order, distancePct: near.distancePct, warning: near.distancePct <= margin });
  };
  if (mode === 'cumulative') {
    let sum = 0;
    const on: number[] = [];
    for (let i = 0; i < n; i++) {
      sum += a.stepsKvar[i] as number;
      on.push(i);
      push(on.slice(), sum);
    }
    return out;
  }
  if (mode !== 'all') fail(fn, 'combinations', "must be 'cumulative' or 'all'", mode);
  if (n > 16) fail(fn, 'stepsKvar', "must hold at most 16 steps with combinations 'all'", a.stepsKvar);
  const seen = new Set<number>();
  for (let mask = 1; mask < 1 << n; mask++) {
    let sum = 0;
    const on: number[] = [];
    for (let i = 0; i < n; i++) {
      if (mask & (1 << i)) {
        sum += a.stepsKvar[i] as number;
        on.push(i);
      }
    }
    const key = Math.round(sum * 1e6);
    if (seen.has(key)) continue;
    seen.add(key);
    push(on, sum);
  }
  out.sort((x, y) => x.kvar - y.kvar);
  return out;
}
