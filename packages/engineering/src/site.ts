import { fail, finite, nonNegative, positive, powerFactor } from './validate.js';

/**
 * Site-level power: the power triangle, correction sizing and the power factor a site reaches.
 * Source for this module: engineering-reference.md §6.
 */

const RAD_TO_DEG = 180 / Math.PI;

/** Result of {@link powerTriangle}. */
export interface PowerTriangle {
  /** S = √(P² + Q²), kVA. */
  kva: number;
  /** PF = cos φ = P/S (always positive; see `leading`). */
  powerFactor: number;
  /** φ = atan2(Q, P) in degrees; negative when leading. */
  phiDeg: number;
  /** tan φ = Q/P. */
  tanPhi: number;
  /** True when Q < 0 (capacitive, leading current). */
  leading: boolean;
}

/**
 * Power triangle from active power P (kW, > 0) and reactive power Q (kvar, negative when
 * leading): S = √(P² + Q²), PF = cos φ = P/S, tan φ = Q/P.
 * Source: [DERIVED] engineering-reference.md §6.
 */
export function powerTriangle(a: { kw: number; kvar: number }): PowerTriangle {
  const fn = 'powerTriangle';
  positive(fn, 'kw', a.kw);
  finite(fn, 'kvar', a.kvar);
  const kva = Math.hypot(a.kw, a.kvar);
  return { kva, powerFactor: a.kw / kva, phiDeg: Math.atan2(a.kvar, a.kw) * RAD_TO_DEG, tanPhi: a.kvar / a.kw, leading: a.kvar < 0 };
}

/** tan φ of a power factor cos φ: √(1 − PF²)/PF. */
export function tanPhiFromPf(pf: number): number {
  powerFactor('tanPhiFromPf', 'pf', pf);
  return Math.sqrt(1 - pf * pf) / pf;
}

/** cos φ of tan φ: 1/√(1 + tan²φ). tan φ 0.4 ↔ cos φ 0.9285 [COMMON] §6. */
export function pfFromTanPhi(tanPhi: number): number {
  nonNegative('pfFromTanPhi', 'tanPhi', tanPhi);
  return 1 / Math.sqrt(1 + tanPhi * tanPhi);
}

/**
 * Reactive power needed to raise a load's power factor, kvar: Q_c = P·(tan φ1 − tan φ2),
 * φ1 = acos(pfFrom), φ2 = acos(pfTo). The bracket is the printed "kW multiplier"
 * (0.80 → 0.95: 0.421). Negative when pfFrom is already above pfTo (that much could be removed).
 * Source: [STD-summary] IEEE 141 chapter 8, engineering-reference.md §6.
 */
export function correctionKvar(a: { kw: number; pfFrom: number; pfTo: number }): number {
  const fn = 'correctionKvar';
  positive(fn, 'kw', a.kw);
  powerFactor(fn, 'pfFrom', a.pfFrom);
  powerFactor(fn, 'pfTo', a.pfTo);
  const t1 = Math.sqrt(1 - a.pfFrom * a.pfFrom) / a.pfFrom;
  const t2 = Math.sqrt(1 - a.pfTo * a.pfTo) / a.pfTo;
  return a.kw * (t1 - t2);
}

/** The load as a site records it: active power and either its own kvar or its uncorrected PF (lagging). */
export interface SiteLoad {
  kw: number;
  /** The load's own (uncorrected) reactive power, kvar ≥ 0. */
  loadKvar?: number;
  /** The load's own (uncorrected, lagging) power factor in (0, 1]. */
  loadPf?: number;
}

function loadKvarOf(fn: string, a: SiteLoad): number {
  positive(fn, 'kw', a.kw);
  if (a.loadKvar !== undefined && a.loadPf !== undefined) fail(fn, 'loadPf', 'must not be given together with loadKvar', a.loadPf);
  if (a.loadKvar !== undefined) return nonNegative(fn, 'loadKvar', a.loadKvar);
  if (a.loadPf !== undefined) {
    powerFactor(fn, 'loadPf', a.loadPf);
    return (a.kw * Math.sqrt(1 - a.loadPf * a.loadPf)) / a.loadPf;
  }
  return fail(fn, 'loadKvar', 'or loadPf must be given', undefined);
}

/** Result of {@link evaluateSite}. */
export interface SiteEvaluation {
  /** The load's own reactive power, kvar. */
  loadKvar: number;
  /** PF of the load without correction. */
  pfUncorrected: number;
  /** Q_net = Q_load − Q_correction, kvar (negative = leading). */
  netKvar: number;
  /** PF reached with the effective correction. */
  pfReached: number;
  /** True when the reached PF is leading (net kvar < 0). */
  leading: boolean;
  /** Leading PF is over-correction: a fault too (§6). Same as `leading`. */
  overCorrected: boolean;
  /** PF target of the site (if given). */
  pfTarget: number | null;
  /** Correction needed from the uncorrected load to the target, P·(tan φ1 − tan φ2), ≥ 0, kvar. */
  requiredKvar: number | null;
  /** max(0, requiredKvar − effective correction), kvar. */
  missingKvar: number | null;
  /** True when the reached PF is lagging and ≥ target (or exactly unity). */
  targetMet: boolean | null;
}

/**
 * Power factor a site reaches at a given load with a given effective correction, and the kvar
 * missing to reach its target. Q_net = Q_load − Q_c; PF = P/√(P² + Q_net²); leading PF
 * (Q_net < 0) is flagged as over-correction. requiredKvar = max(0, correctionKvar(kW, PF_load,
 * PF_target)); missingKvar = max(0, requiredKvar − Q_c).
 * Source: engineering-reference.md §6 ([DERIVED] triangle; [STD-summary] IEEE 141 ch. 8 sizing).
 */
export function evaluateSite(a: SiteLoad & { correctionKvar: number; pfTarget?: number }): SiteEvaluation {
  const fn = 'evaluateSite';
  const qLoad = loadKvarOf(fn, a);
  nonNegative(fn, 'correctionKvar', a.correctionKvar);
  const target = a.pfTarget;
  if (target !== undefined) powerFactor(fn, 'pfTarget', target);
  const kw = a.kw;
  const pfUncorrected = kw / Math.hypot(kw, qLoad);
  // Treat a remainder within 1e-9 of P as zero so that exact correction does not read as leading.
  let net = qLoad - a.correctionKvar;
  if (Math.abs(net) < 1e-9 * kw) net = 0;
  const pfReached = kw / Math.hypot(kw, net);
  const leading = net < 0;
  if (target === undefined) {
    return { loadKvar: qLoad, pfUncorrected, netKvar: net, pfReached, leading, overCorrected: leading, pfTarget: null, requiredKvar: null, missingKvar: null, targetMet: null };
  }
  const tTarget = Math.sqrt(1 - target * target) / target;
  const required = Math.max(0, qLoad - kw * tTarget);
  const missing = Math.max(0, required - a.correctionKvar);
  const targetMet = !leading && pfReached >= target - 1e-12;
  return { loadKvar: qLoad, pfUncorrected, netKvar: net, pfReached, leading, overCorrected: leading, pfTarget: target, requiredKvar: required, missingKvar: missing, targetMet };
}
