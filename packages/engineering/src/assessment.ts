import type { Nameplate } from './types.js';
import { checkNameplate, omega } from './rating.js';
import { fail, finite, isPositive, positiveArray } from './validate.js';
import {
  ELEMENT_FROM_MEAN,
  ELEMENT_REMEASURE,
  ELEMENT_REPLACE,
  ELEMENT_WATCH,
  HEALTHY_RATIO,
  OUTPUT_HEALTHY,
  OUTPUT_REMEASURE,
  OUTPUT_REPLACE,
  OUTPUT_WATCH,
  UNBALANCED,
  limitTexts,
  reasonText,
} from './assessment-text.js';

/**
 * Field condition policy for a capacitor unit. All deviations are signed percentages of
 * nameplate (negative = below). Defaults are common practice [COMMON]
 * (engineering-reference.md §3) and every value is editable per organisation.
 */
export interface Policy {
  /** Watch when a leg or the total is below this deviation, % (default −5). */
  watchBelowPct: number;
  /** Replace when a leg or the total is below this deviation, % (default −10). Must be ≤ watchBelowPct. */
  replaceBelowPct: number;
  /** Re-measure when a leg or the total is above this deviation, % (default +10): a wrong nameplate, method or meter. */
  remeasureAbovePct: number;
  /** Watch when max/min of the legs exceeds this ratio (default 1.08; IEC 60871-1 from memory). */
  maxUnbalanceRatio: number;
  /** Watch when a leg deviates from the legs' mean by more than this, % (default 5). */
  maxLegFromMeanPct: number;
}

/**
 * Default field policy [COMMON] engineering-reference.md §3 (common practice): watch below
 * −5 %, replace below −10 %, re-measure above +10 %, unbalance max/min 1.08 (the IEC 60871-1
 * ratio between terminal pairs, [STD-memory]) or a leg more than 5 % from the legs' mean.
 */
export const defaultPolicy: Readonly<Policy> = Object.freeze({
  watchBelowPct: -5,
  replaceBelowPct: -10,
  remeasureAbovePct: 10,
  maxUnbalanceRatio: 1.08,
  maxLegFromMeanPct: 5,
});

/** Condition bands, from best to worst; 'remeasure' means the reading cannot be trusted. */
export type Band = 'healthy' | 'watch' | 'replace' | 'remeasure';

/** Result of {@link assessCapacitor}. */
export interface CapacitorAssessment {
  /** Output at rated voltage and frequency from the measured capacitance, kvar. */
  kvarAtRated: number;
  /** 100·(kvarAtRated / nameplate kvar − 1), %. */
  deviationPct: number;
  /**
   * Per element against its rated value, %: the three delta legs (order 1-2, 2-3, 3-1) for a
   * delta unit, the three star phases C1, C2, C3 (recovered from the legs) for a star unit,
   * the single element for a single-phase unit.
   */
  legDeviationsPct: number[];
  /** max/min of the same elements (1 for a single-phase unit). */
  unbalanceRatio: number;
  band: Band;
  /** Plain-language reasons for the band. */
  reasons: string[];
}

/** Comparisons allow this much (in % points) so that a value exactly on a limit stays on the good side. */
const EPS_PCT = 1e-9;

function resolvePolicy(fn: string, p: Partial<Policy> | undefined): Readonly<Policy> {
  if (p === undefined) return defaultPolicy;
  if (p === null || typeof p !== 'object') fail(fn, 'policy', 'must be an object', p);
  const r: Policy = {
    watchBelowPct: p.watchBelowPct ?? defaultPolicy.watchBelowPct,
    replaceBelowPct: p.replaceBelowPct ?? defaultPolicy.replaceBelowPct,
    remeasureAbovePct: p.remeasureAbovePct ?? defaultPolicy.remeasureAbovePct,
    maxUnbalanceRatio: p.maxUnbalanceRatio ?? defaultPolicy.maxUnbalanceRatio,
    maxLegFromMeanPct: p.maxLegFromMeanPct ?? defaultPolicy.maxLegFromMeanPct,
  };
  finite(fn, 'policy.watchBelowPct', r.watchBelowPct);
  finite(fn, 'policy.replaceBelowPct', r.replaceBelowPct);
  finite(fn, 'policy.remeasureAbovePct', r.remeasureAbovePct);
  finite(fn, 'policy.maxUnbalanceRatio', r.maxUnbalanceRatio);
  finite(fn, 'policy.maxLegFromMeanPct', r.maxLegFromMeanPct);
  if (r.replaceBelowPct > r.watchBelowPct) {
    fail(fn, 'policy.replaceBelowPct', `must be ≤ policy.watchBelowPct (${r.watchBelowPct})`, r.replaceBelowPct);
  }
  if (r.remeasureAbovePct < r.watchBelowPct) {
    fail(fn, 'policy.remeasureAbovePct', `must be ≥ policy.watchBelowPct (${r.watchBelowPct})`, r.remeasureAbovePct);
  }
  if (!(r.maxUnbalanceRatio >= 1)) fail(fn, 'policy.maxUnbalanceRatio', 'must be ≥ 1', r.maxUnbalanceRatio);
  if (!(r.maxLegFromMeanPct >= 0)) fail(fn, 'policy.maxLegFromMeanPct', 'must be ≥ 0', r.maxLegFromMeanPct);
  return r;
}

const DEFAULT_TEXTS = limitTexts(defaultPolicy, true);

/**
 * Condition of one capacitor unit from its measured capacitance.
 *
 * - kvarAtRated = ω_N·U_N²·(C12 + C23 + C31) for a three-phase unit (delta-equivalent legs,
 *   star or delta inside), ω_N·U_N²·C for a single-phase unit; [DERIVED] §1.
 * - deviationPct = 100·(kvarAtRated/kvar − 1); per-element deviations against the rated
 *   element (C_Δ = Q/(3ωU²) per delta leg; C_Y = Q/(ωU²) per star phase, the phases being
 *   recovered from the legs with starPhasesFromLegs, so a loss in one star phase is seen at
 *   full size instead of diluted over two legs); [DERIVED] §1.
 * - bands per `policy` (default {@link defaultPolicy}, common practice §3): 'watch' when a leg
 *   or the total is below watchBelowPct, max/min exceeds maxUnbalanceRatio or a leg is more
 *   than maxLegFromMeanPct from the legs' mean; 'replace' below replaceBelowPct; 'remeasure'
 *   above remeasureAbovePct. A value exactly on a limit passes.
 * - precedence remeasure > replace > watch > healthy: a reading far above nameplate means the
 *   nameplate, method or meter is wrong, so nothing else it says can be relied on until it is
 *   measured again; every triggered condition is still listed in `reasons`.
 *
 * @param a.measuredUF one value for a single-phase unit, three delta-equivalent legs
 *   (terminal order 1-2, 2-3, 3-1) for a three-phase unit, µF.
 * @throws RangeError for an invalid nameplate, wrong-length or non-positive measuredUF, or an
 *   inconsistent policy.
 */
export function assessCapacitor(a: { nameplate: Nameplate; measuredUF: number[]; policy?: Partial<Policy> }): CapacitorAssessment {
  const fn = 'assessCapacitor';
  const n = a.nameplate;
  checkNameplate(fn, n);
  const single = n.connection === 'single-phase';
  const m = a.measuredUF;
  // Fast path for valid input; positiveArray finds and reports what is wrong otherwise.
  if (
    !Array.isArray(m) ||
    (single ? !(m.length === 1 && isPositive(m[0])) : !(m.length === 3 && isPositive(m[0]) && isPositive(m[1]) && isPositive(m[2])))
  )
    positiveArray(fn, 'measuredUF', m, single ? 1 : 3, single ? 'the element' : 'delta-equivalent legs in terminal order 1-2, 2-3, 3-1');
  const policy = resolvePolicy(fn, a.policy);
  const txt = policy === defaultPolicy ? DEFAULT_TEXTS : limitTexts(policy);
  const w = omega(n.frequencyHz);
  const u2 = n.voltageV * n.voltageV;
  const ratedElementUF = (n.kvar * 1e9) / (w * u2); // single element or star phase
  let reasons: string[] | undefined;
  const watchLim = policy.watchBelowPct - EPS_PCT;
  const replaceLim = policy.replaceBelowPct - EPS_PCT;
  const remeasureLim = policy.remeasureAbovePct + EPS_PCT;
  let remeasure = false;
  let replace = false;
  let watch = false;

  if (single) {
    const c = m[0] as number;
    const kvarAtRated = w * u2 * c * 1e-9;
    const dev = (c / ratedElementUF - 1) * 100;
    if (dev > remeasureLim) {
      remeasure = true;
      reasons = add(reasons, reasonText(OUTPUT_REMEASURE, 0, dev, txt));
    } else if (dev < replaceLim) {
      replace = true;
      reasons = add(reasons, reasonText(OUTPUT_REPLACE, 0, dev, txt));
    } else if (dev < watchLim) {
      watch = true;
      reasons = add(reasons, reasonText(OUTPUT_WATCH, 0, dev, txt));
    }
    const band: Band = remeasure ? 'remeasure' : replace ? 'replace' : watch ? 'watch' : 'healthy';
    if (band === 'healthy') reasons = add(reasons, reasonText(OUTPUT_HEALTHY, 0, dev, txt));
    return { kvarAtRated, deviationPct: dev, legDeviationsPct: [dev], unbalanceRatio: 1, band, reasons: reasons ?? [] };
  }

  const c12 = m[0] as number;
  const c23 = m[1] as number;
  const c31 = m[2] as number;
  const sum = c12 + c23 + c31;
  const kvarAtRated = w * u2 * sum * 1e-9;
  const dev = (kvarAtRated / n.kvar - 1) * 100;
  let e0: number;
  let e1: number;
  let e2: number;
  let rated: number;
  const star = n.connection === 'star';
  if (star) {
    const p = c12 * c23 + c23 * c31 + c31 * c12;
    e0 = p / c23;
    e1 = p / c31;
    e2 = p / c12;
    rated = ratedElementUF;
  } else {
    e0 = c12;
    e1 = c23;
    e2 = c31;
    rated = ratedElementUF / 3;
  }
  const d0 = (e0 / rated - 1) * 100;
  const d1 = (e1 / rated - 1) * 100;
  const d2 = (e2 / rated - 1) * 100;
  const first = star ? 3 : 0; // subject index of the first element in the reason texts
  const outputSubject = star ? 2 : 1;

  // Total output.
  if (dev > remeasureLim) {
    remeasure = true;
    reasons = add(reasons, reasonText(OUTPUT_REMEASURE, outputSubject, dev, txt));
  } else if (dev < replaceLim) {
    replace = true;
    reasons = add(reasons, reasonText(OUTPUT_REPLACE, outputSubject, dev, txt));
  } else if (dev < watchLim) {
    watch = true;
    reasons = add(reasons, reasonText(OUTPUT_WATCH, outputSubject, dev, txt));
  }
  // Each element.
  for (let i = 0; i < 3; i++) {
    const d = i === 0 ? d0 : i === 1 ? d1 : d2;
    if (d > remeasureLim) {
      remeasure = true;
      reasons = add(reasons, reasonText(ELEMENT_REMEASURE, first + i, d, txt));
    } else if (d < replaceLim) {
      replace = true;
      reasons = add(reasons, reasonText(ELEMENT_REPLACE, first + i, d, txt));
    } else if (d < watchLim) {
      watch = true;
      reasons = add(reasons, reasonText(ELEMENT_WATCH, first + i, d, txt));
    }
  }
  // Balance.
  const max = e0 > e1 ? (e0 > e2 ? e0 : e2) : e1 > e2 ? e1 : e2;
  const min = e0 < e1 ? (e0 < e2 ? e0 : e2) : e1 < e2 ? e1 : e2;
  const ratio = max / min;
  if (ratio > policy.maxUnbalanceRatio + 1e-12) {
    watch = true;
    reasons = add(reasons, reasonText(UNBALANCED, star ? 1 : 0, ratio, txt));
  }
  const mean = (e0 + e1 + e2) / 3;
  const meanLim = policy.maxLegFromMeanPct + EPS_PCT;
  for (let i = 0; i < 3; i++) {
    const e = i === 0 ? e0 : i === 1 ? e1 : e2;
    const dm = (e / mean - 1) * 100;
    if (dm > meanLim || dm < -meanLim) {
      watch = true;
      reasons = add(reasons, reasonText(ELEMENT_FROM_MEAN, first + i, dm, txt));
    }
  }
  const band: Band = remeasure ? 'remeasure' : replace ? 'replace' : watch ? 'watch' : 'healthy';
  if (band === 'healthy') reasons = add(reasons, reasonText(OUTPUT_HEALTHY, outputSubject, dev, txt) + reasonText(HEALTHY_RATIO, 0, ratio, txt));
  return { kvarAtRated, deviationPct: dev, legDeviationsPct: [d0, d1, d2], unbalanceRatio: ratio, band, reasons: reasons ?? [] };
}

/** Appends a reason, creating the list at its first entry (an exact-size array: one per assessment). */
function add(list: string[] | undefined, text: string): string[] {
  if (list === undefined) return [text];
  list.push(text);
  return list;
}

/** Rank of a band for comparisons: healthy 0, watch 1, replace 2, remeasure 3. */
export function bandRank(band: Band): number {
  return band === 'healthy' ? 0 : band === 'watch' ? 1 : band === 'replace' ? 2 : 3;
}
