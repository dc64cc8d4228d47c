import type { Nameplate, Triple } from './types.js';
import { CONNECTIONS } from './types.js';
import { fail, isPositive, oneOf, positive, positiveTriple } from './validate.js';

/** 2π with full-precision Math.PI (printed examples using 3.14 differ in the 3rd or 4th digit), engineering-reference.md conventions. */
export const TWO_PI = 2 * Math.PI;

/** Angular frequency ω = 2πf, rad/s [DERIVED]. */
export function omega(frequencyHz: number): number {
  return TWO_PI * frequencyHz;
}

/** Validates a nameplate; `name` is how the caller calls it (default 'nameplate'). */
export function checkNameplate(fn: string, n: Nameplate, name = 'nameplate'): void {
  if (n === null || typeof n !== 'object') fail(fn, name, 'must be an object', n);
  // Names are built only on failure: this runs on every assessment.
  if (!isPositive(n.kvar)) positive(fn, `${name}.kvar`, n.kvar);
  if (!isPositive(n.voltageV)) positive(fn, `${name}.voltageV`, n.voltageV);
  if (!isPositive(n.frequencyHz)) positive(fn, `${name}.frequencyHz`, n.frequencyHz);
  const c = n.connection;
  if (c !== 'delta' && c !== 'star' && c !== 'single-phase') oneOf(fn, `${name}.connection`, c, CONNECTIONS);
}

/**
 * Rated capacitance of one delta leg, one star phase, or the single element, µF.
 *
 * - delta: C_Δ = Q / (3·ω·U²)
 * - star: C_Y = Q / (ω·U²) = 3·C_Δ
 * - single-phase: C = Q / (ω·U²)
 *
 * with Q in var, U the rated (line-to-line) voltage and ω = 2πf.
 * Source: [DERIVED] engineering-reference.md §1 (same formulas in manufacturer catalogues).
 * Example: 50 kvar 400 V 50 Hz delta → 331.57 µF per leg.
 */
export function ratedCapacitanceUF(n: Nameplate): number {
  checkNameplate('ratedCapacitanceUF', n);
  const perElementUF = (n.kvar * 1e9) / (omega(n.frequencyHz) * n.voltageV * n.voltageV);
  return n.connection === 'delta' ? perElementUF / 3 : perElementUF;
}

/**
 * Rated capacitance of each delta-equivalent leg seen from the terminals, µF:
 * C_leg = Q / (3·ω·U²) for any three-phase unit (star or delta inside), or the element for a
 * single-phase unit. Source: [DERIVED] engineering-reference.md §1.
 */
export function ratedLegUF(n: Nameplate): number {
  checkNameplate('ratedLegUF', n);
  const perElementUF = (n.kvar * 1e9) / (omega(n.frequencyHz) * n.voltageV * n.voltageV);
  return n.connection === 'single-phase' ? perElementUF : perElementUF / 3;
}

/**
 * Three-phase reactive power of a unit from its delta-equivalent legs, kvar:
 * Q = ω·U²·(C12 + C23 + C31), whatever the inside (star or delta).
 * Source: [DERIVED] engineering-reference.md §1.
 */
export function kvarFromLegs(a: { legsUF: Triple; voltageV: number; frequencyHz: number }): number {
  const fn = 'kvarFromLegs';
  positiveTriple(fn, 'legsUF', a.legsUF);
  positive(fn, 'voltageV', a.voltageV);
  positive(fn, 'frequencyHz', a.frequencyHz);
  const l = a.legsUF;
  return omega(a.frequencyHz) * a.voltageV * a.voltageV * (l[0] + l[1] + l[2]) * 1e-9;
}

/**
 * Reactive power of one element at voltage U across it, kvar: Q = ω·C·U².
 * Source: [DERIVED] engineering-reference.md §1.
 */
export function kvarFromElement(a: { capacitanceUF: number; voltageV: number; frequencyHz: number }): number {
  const fn = 'kvarFromElement';
  positive(fn, 'capacitanceUF', a.capacitanceUF);
  positive(fn, 'voltageV', a.voltageV);
  positive(fn, 'frequencyHz', a.frequencyHz);
  return omega(a.frequencyHz) * a.capacitanceUF * a.voltageV * a.voltageV * 1e-9;
}

/**
 * Three-phase reactive power of a star of phases C1, C2, C3 with an isolated star point, at
 * line voltage U, kvar: Q = ω·U²·(C1·C2 + C2·C3 + C3·C1)/(C1 + C2 + C3), i.e. the kvar of
 * the equivalent delta legs (balanced: Q = ω·C_Y·U²).
 * Source: [DERIVED] engineering-reference.md §1 (star–delta transformation).
 */
export function kvarFromStarPhases(a: { phasesUF: Triple; voltageV: number; frequencyHz: number }): number {
  const fn = 'kvarFromStarPhases';
  positiveTriple(fn, 'phasesUF', a.phasesUF);
  positive(fn, 'voltageV', a.voltageV);
  positive(fn, 'frequencyHz', a.frequencyHz);
  const [c1, c2, c3] = a.phasesUF;
  return (omega(a.frequencyHz) * a.voltageV * a.voltageV * ((c1 * c2 + c2 * c3 + c3 * c1) / (c1 + c2 + c3))) * 1e-9;
}

/**
 * Star phases C1, C2, C3 of a star unit from its delta-equivalent legs, µF:
 * P = C12·C23 + C23·C31 + C31·C12; C1 = P/C23, C2 = P/C31, C3 = P/C12
 * (phase i sits at terminal i; C23 is the leg opposite terminal 1).
 * Source: [DERIVED] engineering-reference.md §1 (delta–star transformation of admittances).
 */
export function starPhasesFromLegs(legsUF: Triple): Triple {
  positiveTriple('starPhasesFromLegs', 'legsUF', legsUF);
  const c12 = legsUF[0];
  const c23 = legsUF[1];
  const c31 = legsUF[2];
  const p = c12 * c23 + c23 * c31 + c31 * c12;
  return [p / c23, p / c31, p / c12];
}

/**
 * Delta-equivalent legs of a star of phases C1, C2, C3 (isolated star point), µF:
 * C12 = C1·C2/ΣC, C23 = C2·C3/ΣC, C31 = C3·C1/ΣC with ΣC = C1 + C2 + C3.
 * Inverse of {@link starPhasesFromLegs}. Source: [DERIVED] star–delta transformation.
 */
export function legsFromStarPhases(phasesUF: Triple): Triple {
  positiveTriple('legsFromStarPhases', 'phasesUF', phasesUF);
  const [c1, c2, c3] = phasesUF;
  const s = c1 + c2 + c3;
  return [(c1 * c2) / s, (c2 * c3) / s, (c3 * c1) / s];
}

/**
 * Reactive power at another voltage or frequency with the capacitance unchanged, kvar:
 * Q' = Q·(U'/U)²·(f'/f). Source: [DERIVED] engineering-reference.md §1.
 */
export function rescaleKvar(a: {
  kvar: number;
  fromVoltageV: number;
  fromFrequencyHz: number;
  toVoltageV: number;
  toFrequencyHz: number;
}): number {
  const fn = 'rescaleKvar';
  positive(fn, 'kvar', a.kvar);
  positive(fn, 'fromVoltageV', a.fromVoltageV);
  positive(fn, 'fromFrequencyHz', a.fromFrequencyHz);
  positive(fn, 'toVoltageV', a.toVoltageV);
  positive(fn, 'toFrequencyHz', a.toFrequencyHz);
  const r = a.toVoltageV / a.fromVoltageV;
  return a.kvar * r * r * (a.toFrequencyHz / a.fromFrequencyHz);
}

/**
 * Rated line current of a three-phase unit, A: I_L = Q / (√3·U); the delta leg current is
 * I_L/√3 = ω·C_Δ·U. For a single-phase unit: I = Q / U.
 * Source: [DERIVED] engineering-reference.md §1. Example: 50 kvar 400 V → 72.17 A.
 */
export function ratedCurrentA(n: Nameplate): number {
  checkNameplate('ratedCurrentA', n);
  const q = n.kvar * 1e3;
  return n.connection === 'single-phase' ? q / n.voltageV : q / (Math.sqrt(3) * n.voltageV);
}
