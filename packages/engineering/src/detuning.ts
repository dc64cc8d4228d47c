import type { Triple } from './types.js';
import { omega } from './rating.js';
import { detuning, positive, positiveTriple } from './validate.js';

/**
 * Detuned steps: a reactor in series with each capacitor line tunes the step below the lowest
 * harmonic present. Source for this module: [DERIVED; widely printed] engineering-reference.md §4.
 */

/**
 * Series tuning frequency of a detuned step, Hz: f_r = f / √p, with p = X_L/X_C at the
 * fundamental. Examples: 7 % → 189.0 Hz at 50 Hz, 226.8 Hz at 60 Hz; 5.67 % → 210 Hz;
 * 14 % → 133.6 Hz. Source: [DERIVED] engineering-reference.md §4.
 */
export function tuningFrequencyHz(a: { detuningFactor: number; frequencyHz: number }): number {
  const fn = 'tuningFrequencyHz';
  detuning(fn, 'detuningFactor', a.detuningFactor);
  positive(fn, 'frequencyHz', a.frequencyHz);
  return a.frequencyHz / Math.sqrt(a.detuningFactor);
}

/**
 * Detuning factor of a reactor L per line in series with a delta capacitor of legs C_Δ:
 * p = ω²·L·C_star with C_star = 3·C_Δ, C_Δ taken as the mean leg (so C_star = C12 + C23 + C31).
 * The result is returned as computed; values outside (0, 0.5) point at wrong units or readings.
 * Source: [DERIVED] engineering-reference.md §4.
 */
export function detuningFactor(a: { inductanceMH: number; legsUF: Triple; frequencyHz: number }): number {
  const fn = 'detuningFactor';
  positive(fn, 'inductanceMH', a.inductanceMH);
  positiveTriple(fn, 'legsUF', a.legsUF);
  positive(fn, 'frequencyHz', a.frequencyHz);
  const w = omega(a.frequencyHz);
  const l = a.legsUF;
  return w * w * a.inductanceMH * 1e-3 * (l[0] + l[1] + l[2]) * 1e-6;
}

/**
 * Reactor inductance per line that gives detuning factor p with delta legs C_Δ (mean leg), mH:
 * L = p / (ω²·3·C_Δ). Inverse of {@link detuningFactor}. Source: [DERIVED] §4.
 */
export function reactorInductanceMH(a: { detuningFactor: number; legsUF: Triple; frequencyHz: number }): number {
  const fn = 'reactorInductanceMH';
  detuning(fn, 'detuningFactor', a.detuningFactor);
  positiveTriple(fn, 'legsUF', a.legsUF);
  positive(fn, 'frequencyHz', a.frequencyHz);
  const w = omega(a.frequencyHz);
  const l = a.legsUF;
  return (a.detuningFactor / (w * w * (l[0] + l[1] + l[2]) * 1e-6)) * 1e3;
}

/**
 * Voltage across the capacitor of a detuned step at fundamental, V: U_C = U_N / (1 − p).
 * 7 % on 400 V → 430.1 V, hence 440 V or higher capacitors. Source: [DERIVED] §4.
 */
export function capacitorVoltageV(a: { networkVoltageV: number; detuningFactor: number }): number {
  const fn = 'capacitorVoltageV';
  positive(fn, 'networkVoltageV', a.networkVoltageV);
  detuning(fn, 'detuningFactor', a.detuningFactor);
  return a.networkVoltageV / (1 - a.detuningFactor);
}

/**
 * Effective output of a detuned step at network voltage, kvar:
 * Q_eff = Q_CR·(U_N/U_CR)² / (1 − p), Q_CR and U_CR being the capacitor's rating (at the
 * network frequency). Source: [DERIVED] engineering-reference.md §4.
 */
export function detunedStepKvar(a: {
  capacitorKvar: number;
  capacitorVoltageV: number;
  networkVoltageV: number;
  detuningFactor: number;
}): number {
  const fn = 'detunedStepKvar';
  positive(fn, 'capacitorKvar', a.capacitorKvar);
  positive(fn, 'capacitorVoltageV', a.capacitorVoltageV);
  positive(fn, 'networkVoltageV', a.networkVoltageV);
  detuning(fn, 'detuningFactor', a.detuningFactor);
  const r = a.networkVoltageV / a.capacitorVoltageV;
  return (a.capacitorKvar * r * r) / (1 - a.detuningFactor);
}

/**
 * How capacitance loss moves a detuned step: with C falling to k·C, p becomes k·p, the tuning
 * frequency f_r/√k and the fundamental output ratio Q'/Q = k·(1 − p)/(1 − k·p).
 * A 7 % step at 50 Hz: 10 % loss → 199.2 Hz, 20 % loss → 211.3 Hz.
 * Source: [DERIVED] engineering-reference.md §4.
 */
export function detunedStepWithLoss(a: { detuningFactor: number; frequencyHz: number; capacitanceRatio: number }): {
  detuningFactor: number;
  tuningFrequencyHz: number;
  outputRatio: number;
} {
  const fn = 'detunedStepWithLoss';
  detuning(fn, 'detuningFactor', a.detuningFactor);
  positive(fn, 'frequencyHz', a.frequencyHz);
  positive(fn, 'capacitanceRatio', a.capacitanceRatio);
  const p = a.detuningFactor;
  const k = a.capacitanceRatio;
  const pk = k * p;
  if (!(pk < 1)) throw new RangeError(`detunedStepWithLoss: capacitanceRatio × detuningFactor must be < 1, got ${pk}`);
  return { detuningFactor: pk, tuningFrequencyHz: a.frequencyHz / Math.sqrt(pk), outputRatio: (k * (1 - p)) / (1 - pk) };
}
