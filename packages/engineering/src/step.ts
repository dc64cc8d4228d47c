import type { Nameplate, Triple } from './types.js';
import { CHARACTERISTIC_HARMONICS, nearestHarmonic } from './harmonics.js';
import { checkNameplate, omega } from './rating.js';
import { detuning, fail, failWith, positive, positiveArray, positiveTriple } from './validate.js';

/** One capacitor unit in a step, with its measured capacitance if known. */
export interface StepCapacitor {
  nameplate: Nameplate;
  /** As in assessCapacitor: one element (single-phase) or three delta-equivalent legs, µF. Omitted: nameplate values. */
  measuredUF?: number[];
}

/** Input of {@link evaluateStep}. */
export interface StepInput {
  /** Network line-to-line voltage, V. */
  networkVoltageV: number;
  /** Network frequency, Hz. */
  networkFrequencyHz: number;
  /** Units connected in parallel in the step (at least one). */
  capacitors: StepCapacitor[];
  /** Present for a detuned step: the bank's design detuning factor and, if recorded, the reactor inductance per line. */
  detuning?: { designFactor: number; reactorInductanceMH?: number };
  /** Step line currents measured at network voltage, A (optional). */
  lineCurrentsA?: Triple;
  /** Flag a step current this far from expected, % (default 15, common practice). */
  currentTolerancePct?: number;
  /** Flag a tuning frequency this far above design, % (default 5, common practice). */
  tuningShiftLimitPct?: number;
  /** Flag a tuning frequency within this distance of a characteristic harmonic, % (default 10, common practice). */
  harmonicMarginPct?: number;
}

/** Tuning of a detuned step, part of {@link StepEvaluation}. */
export interface StepTuning {
  /** The bank's design detuning factor. */
  designFactor: number;
  /** p from the reactor and the nameplate capacitance (= designFactor when no inductance is recorded). */
  asBuiltFactor: number;
  /** p from the reactor and the measured capacitance. */
  actualFactor: number;
  /** f / √designFactor, Hz. */
  designTuningHz: number;
  /** f / √actualFactor, Hz. */
  tuningHz: number;
  shiftHz: number;
  /** 100·(tuningHz/designTuningHz − 1). */
  shiftPct: number;
  /** Nearest characteristic harmonic order (5, 7, 11, 13; also 3 for banks with p ≥ 10 %). */
  nearestHarmonic: number;
  nearestHarmonicHz: number;
  /** 100·|tuningHz − nearestHarmonicHz| / nearestHarmonicHz. */
  distancePct: number;
  /** U_N / (1 − actualFactor), V. */
  capacitorVoltageV: number;
  /** Tuning more than tuningShiftLimitPct above design. */
  tuningShifted: boolean;
  /** Tuning within harmonicMarginPct of a characteristic harmonic. */
  nearHarmonic: boolean;
  /** Tuning at or above the lowest harmonic the step is meant to block (3rd for p ≥ 10 %, else 5th): the step now amplifies it. */
  aboveLowestHarmonic: boolean;
  /** Capacitor voltage above the lowest rated voltage among the step's units. */
  capacitorOverRatedVoltage: boolean;
}

/** Result of {@link evaluateStep}. */
export interface StepEvaluation {
  /** Sum of the units' nameplate kvar. */
  nameplateKvar: number;
  /** Output at network voltage and frequency with nameplate capacitance (and the reactor), kvar. */
  installedKvar: number;
  /** Output at network voltage and frequency with measured capacitance (and the reactor), kvar. */
  effectiveKvar: number;
  /** 100·effectiveKvar/installedKvar. */
  effectivePct: number;
  /** k = measured / rated capacitance of the step. */
  capacitanceRatio: number;
  tuning: StepTuning | null;
  current: { expectedA: number; measuredMeanA: number; deviationPct: number; flag: boolean } | null;
  /** Plain-language findings; empty when nothing needs attention. */
  reasons: string[];
}

/**
 * Evaluates one switched step at network voltage.
 *
 * - Capacitance: each unit counts with its star-equivalent capacitance C_Y = C12 + C23 + C31
 *   (three-phase, delta-equivalent legs; = Q/(ωU²)) or its element (single-phase). The units
 *   are taken to see the network voltage (three-phase units line-to-line).
 * - Undetuned: Q = ω·U_N²·ΣC_Y [DERIVED] §1.
 * - Detuned: Q_eff = ω·U_N²·ΣC_Y / (1 − p), which equals Q_CR·(U_N/U_CR)²/(1 − p) for the
 *   rated capacitance; with measured capacitance k·C the factor becomes p' = ω²·L·C_Y,measured
 *   (or k·p_design when no inductance is recorded), giving Q'/Q = k(1 − p)/(1 − kp)
 *   [DERIVED] engineering-reference.md §4.
 * - Tuning f_r = f/√p', its shift from f/√p_design, the nearest characteristic harmonic and
 *   flags: shift > 5 % above design; within 10 % of a characteristic harmonic (5, 7, 11, 13,
 *   and 3 for p ≥ 10 %, i.e. 14 % banks); at or above the lowest blocked harmonic [COMMON] §4.
 * - Optional step currents: expected I = installedKvar/(√3·U_N); flag when the mean measured
 *   current is more than 15 % from it [COMMON] §3.
 */
export function evaluateStep(a: StepInput): StepEvaluation {
  const fn = 'evaluateStep';
  positive(fn, 'networkVoltageV', a.networkVoltageV);
  positive(fn, 'networkFrequencyHz', a.networkFrequencyHz);
  if (!Array.isArray(a.capacitors) || a.capacitors.length === 0) fail(fn, 'capacitors', 'must be a non-empty array', a.capacitors);
  let nameplateKvar = 0;
  let ratedCyUF = 0;
  let measuredCyUF = 0;
  let minRatedV = Infinity;
  for (let i = 0; i < a.capacitors.length; i++) {
    const c = a.capacitors[i] as StepCapacitor;
    const n = c.nameplate;
    checkNameplate(fn, n, `capacitors[${i}].nameplate`);
    const w = omega(n.frequencyHz);
    const cy = (n.kvar * 1e9) / (w * n.voltageV * n.voltageV);
    nameplateKvar += n.kvar;
    ratedCyUF += cy;
    if (n.voltageV < minRatedV) minRatedV = n.voltageV;
    if (c.measuredUF === undefined) {
      measuredCyUF += cy;
    } else if (n.connection === 'single-phase') {
      positiveArray(fn, `capacitors[${i}].measuredUF`, c.measuredUF, 1, 'the element');
      measuredCyUF += c.measuredUF[0] as number;
    } else {
      positiveArray(fn, `capacitors[${i}].measuredUF`, c.measuredUF, 3, 'delta-equivalent legs in terminal order 1-2, 2-3, 3-1');
      measuredCyUF += (c.measuredUF[0] as number) + (c.measuredUF[1] as number) + (c.measuredUF[2] as number);
    }
  }
  const f = a.networkFrequencyHz;
  const u = a.networkVoltageV;
  const w = omega(f);
  const base = w * u * u * 1e-9; // kvar per µF of star-equivalent capacitance
  const k = measuredCyUF / ratedCyUF;
  const reasons: string[] = [];
  let installedKvar = base * ratedCyUF;
  let effectiveKvar = base * measuredCyUF;
  let tuning: StepTuning | null = null;

  if (a.detuning !== undefined) {
    const pDesign = detuning(fn, 'detuning.designFactor', a.detuning.designFactor);
    const lMH = a.detuning.reactorInductanceMH;
    let pBuilt = pDesign;
    let pActual = pDesign * k;
    if (lMH !== undefined) {
      positive(fn, 'detuning.reactorInductanceMH', lMH);
      pBuilt = w * w * lMH * 1e-3 * ratedCyUF * 1e-6;
      pActual = w * w * lMH * 1e-3 * measuredCyUF * 1e-6;
    }
    if (!(pActual < 0.5) || !(pBuilt < 0.5)) {
      failWith(
        fn,
        `detuning.reactorInductanceMH ${lMH} mH with the step's capacitance gives a detuning factor of ${Math.max(pActual, pBuilt).toFixed(3)}, outside (0, 0.5): check the units (mH) and the readings`,
      );
    }
    installedKvar /= 1 - pBuilt;
    effectiveKvar /= 1 - pActual;
    const designTuningHz = f / Math.sqrt(pDesign);
    const tuningHz = f / Math.sqrt(pActual);
    const shiftPct = (tuningHz / designTuningHz - 1) * 100;
    const orders = pDesign >= 0.1 ? [3, ...CHARACTERISTIC_HARMONICS] : CHARACTERISTIC_HARMONICS;
    const near = nearestHarmonic(tuningHz / f, orders);
    const lowest = orders[0] as number;
    const ucV = u / (1 - pActual);
    const shiftLimit = a.tuningShiftLimitPct ?? 5;
    positive(fn, 'tuningShiftLimitPct', shiftLimit);
    const margin = a.harmonicMarginPct ?? 10;
    positive(fn, 'harmonicMarginPct', margin);
    tuning = {
      designFactor: pDesign,
      asBuiltFactor: pBuilt,
      actualFactor: pActual,
      designTuningHz,
      tuningHz,
      shiftHz: tuningHz - designTuningHz,
      shiftPct,
      nearestHarmonic: near.order,
      nearestHarmonicHz: near.order * f,
      distancePct: near.distancePct,
      capacitorVoltageV: ucV,
      tuningShifted: shiftPct > shiftLimit + 1e-9,
      nearHarmonic: near.distancePct <= margin,
      aboveLowestHarmonic: tuningHz >= lowest * f,
      capacitorOverRatedVoltage: ucV > minRatedV,
    };
    if (tuning.aboveLowestHarmonic) {
      reasons.push(
        `tuning ${tuningHz.toFixed(1)} Hz is at or above the ${ordinal(lowest)} harmonic (${(lowest * f).toFixed(0)} Hz): the step no longer blocks it and can amplify it`,
      );
    }
    if (tuning.nearHarmonic) {
      reasons.push(
        `tuning ${tuningHz.toFixed(1)} Hz is ${near.distancePct.toFixed(1)} % from the ${ordinal(near.order)} harmonic (${(near.order * f).toFixed(0)} Hz; flag within ${margin} %)`,
      );
    }
    if (tuning.tuningShifted) {
      reasons.push(
        `tuning ${tuningHz.toFixed(1)} Hz is ${shiftPct.toFixed(1)} % above design ${designTuningHz.toFixed(1)} Hz (flag above ${shiftLimit} %): capacitance has fallen`,
      );
    }
    if (tuning.capacitorOverRatedVoltage) {
      reasons.push(`capacitor voltage ${ucV.toFixed(1)} V exceeds the rated ${minRatedV} V`);
    }
  }

  let current: StepEvaluation['current'] = null;
  if (a.lineCurrentsA !== undefined) {
    positiveTriple(fn, 'lineCurrentsA', a.lineCurrentsA);
    const tol = a.currentTolerancePct ?? 15;
    positive(fn, 'currentTolerancePct', tol);
    const expectedA = (installedKvar * 1e3) / (Math.sqrt(3) * u);
    const measuredMeanA = (a.lineCurrentsA[0] + a.lineCurrentsA[1] + a.lineCurrentsA[2]) / 3;
    const deviationPct = (measuredMeanA / expectedA - 1) * 100;
    const flag = Math.abs(deviationPct) > tol + 1e-9;
    current = { expectedA, measuredMeanA, deviationPct, flag };
    if (flag) {
      reasons.push(
        `step current ${measuredMeanA.toFixed(1)} A is ${Math.abs(deviationPct).toFixed(1)} % ${deviationPct < 0 ? 'below' : 'above'} the expected ${expectedA.toFixed(1)} A (investigate beyond ±${tol} %)`,
      );
    }
  }

  return { nameplateKvar, installedKvar, effectiveKvar, effectivePct: (effectiveKvar / installedKvar) * 100, capacitanceRatio: k, tuning, current, reasons };
}

function ordinal(n: number): string {
  const s = n % 100 >= 11 && n % 100 <= 13 ? 'th' : n % 10 === 1 ? 'st' : n % 10 === 2 ? 'nd' : n % 10 === 3 ? 'rd' : 'th';
  return `${n}${s}`;
}
