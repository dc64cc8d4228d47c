import type { Triple } from './types.js';
import { omega } from './rating.js';
import { failWith, nonNegative, positive, positiveTriple } from './validate.js';

/**
 * Field methods: turning what a technician reads at the three terminals of a three-phase unit
 * into its delta-equivalent legs C12, C23, C31 (µF). Any three-terminal unit, star or delta
 * inside, behaves from its terminals as such a delta [DERIVED] engineering-reference.md §1–2.
 * Thresholds belong on the back-calculated legs or the total, never on raw readings.
 */

const LEG_NAMES = ['C12', 'C23', 'C31'] as const;

function listOf(t: readonly number[]): string {
  return `[${t[0]}, ${t[1]}, ${t[2]}]`;
}

function impossible(fn: string, name: string, input: readonly number[], leg: number, value: number, unit: string): never {
  failWith(
    fn,
    `${name} ${listOf(input)} cannot come from a real unit: back-calculated leg ${LEG_NAMES[leg]} = ${value} ${unit} is not positive`,
  );
}

/**
 * Forward model of the open-pair method: what a capacitance meter reads between two terminals
 * with the third terminal open, µF:
 * M12 = C12 + C23·C31/(C23 + C31), M23 = C23 + C31·C12/(C31 + C12), M31 = C31 + C12·C23/(C12 + C23).
 * Balanced: M = 1.5·C_Δ. Source: [DERIVED] engineering-reference.md §2(a).
 */
export function openPairReadingsFromLegs(legsUF: Triple): Triple {
  positiveTriple('openPairReadingsFromLegs', 'legsUF', legsUF);
  const [c12, c23, c31] = legsUF;
  return [c12 + (c23 * c31) / (c23 + c31), c23 + (c31 * c12) / (c31 + c12), c31 + (c12 * c23) / (c12 + c23)];
}

/**
 * Legs C12, C23, C31 from open-pair readings M12, M23, M31 (third terminal open), µF.
 *
 * Closed form: a = 1/M12, b = 1/M23, c = 1/M31; u = (b + c − a)/2, v = (a + c − b)/2,
 * w = (a + b − c)/2; P = 1/(u·v + v·w + w·u); C12 = P·u, C23 = P·v, C31 = P·w.
 * Why: M_ij = ΣCC/(S − C_ij) with ΣCC = C12·C23 + C23·C31 + C31·C12 and S = C12 + C23 + C31,
 * so a = (C23 + C31)/ΣCC, …, hence u = C12/ΣCC, v = C23/ΣCC, w = C31/ΣCC and P = ΣCC
 * (mapping verified against the forward model {@link openPairReadingsFromLegs}).
 * Source: [DERIVED] engineering-reference.md §2(a).
 *
 * This method dilutes a fault (10 % loss in one leg reads about −6.7 % on one pair and −1.75 %
 * on the other two), which is why assessments use the legs.
 *
 * @throws RangeError when a reading is not a finite number > 0, or when the readings imply a
 *   leg that is not positive (no real unit produces them).
 */
export function legsFromOpenPairs(readingsUF: Triple): Triple {
  const fn = 'legsFromOpenPairs';
  positiveTriple(fn, 'readingsUF', readingsUF);
  const a = 1 / readingsUF[0];
  const b = 1 / readingsUF[1];
  const c = 1 / readingsUF[2];
  const u = (b + c - a) / 2;
  const v = (a + c - b) / 2;
  const w = (a + b - c) / 2;
  const p = 1 / (u * v + v * w + w * u);
  const c12 = p * u;
  const c23 = p * v;
  const c31 = p * w;
  if (!(c12 > 0) || !Number.isFinite(c12)) impossible(fn, 'readingsUF', readingsUF, 0, c12, 'µF');
  if (!(c23 > 0) || !Number.isFinite(c23)) impossible(fn, 'readingsUF', readingsUF, 1, c23, 'µF');
  if (!(c31 > 0) || !Number.isFinite(c31)) impossible(fn, 'readingsUF', readingsUF, 2, c31, 'µF');
  return [c12, c23, c31];
}

/**
 * Forward model of the shorted method: terminal 1, 2, 3 each against the other two shorted, µF:
 * M1 = C12 + C31, M2 = C12 + C23, M3 = C23 + C31 (balanced: 2·C_Δ).
 * Source: [DERIVED] engineering-reference.md §2(b).
 */
export function shortedReadingsFromLegs(legsUF: Triple): Triple {
  positiveTriple('shortedReadingsFromLegs', 'legsUF', legsUF);
  const [c12, c23, c31] = legsUF;
  return [c12 + c31, c12 + c23, c23 + c31];
}

/**
 * Legs from readings of terminal 1, 2, 3 each against the other two shorted, µF:
 * C12 = (M1 + M2 − M3)/2, C23 = (M2 + M3 − M1)/2, C31 = (M1 + M3 − M2)/2.
 * Source: [DERIVED] engineering-reference.md §2(b).
 *
 * @throws RangeError when a reading is not a finite number > 0 or a back-calculated leg is not
 *   positive.
 */
export function legsFromShortedPairs(readingsUF: Triple): Triple {
  const fn = 'legsFromShortedPairs';
  positiveTriple(fn, 'readingsUF', readingsUF);
  const m1 = readingsUF[0];
  const m2 = readingsUF[1];
  const m3 = readingsUF[2];
  const c12 = (m1 + m2 - m3) / 2;
  const c23 = (m2 + m3 - m1) / 2;
  const c31 = (m1 + m3 - m2) / 2;
  if (!(c12 > 0)) impossible(fn, 'readingsUF', readingsUF, 0, c12, 'µF');
  if (!(c23 > 0)) impossible(fn, 'readingsUF', readingsUF, 1, c23, 'µF');
  if (!(c31 > 0)) impossible(fn, 'readingsUF', readingsUF, 2, c31, 'µF');
  return [c12, c23, c31];
}

/**
 * Forward model of the line-current method for a capacitive delta at balanced line voltages
 * (no series reactor), A: leg currents I_ij = ω·C_ij·U and
 * |I1|² = I12² + I31² + I12·I31, |I2|² = I12² + I23² + I12·I23, |I3|² = I23² + I31² + I23·I31.
 * Source: [DERIVED] engineering-reference.md §2(c).
 */
export function lineCurrentsFromLegs(a: { legsUF: Triple; voltageV: number; frequencyHz: number }): Triple {
  const fn = 'lineCurrentsFromLegs';
  positiveTriple(fn, 'legsUF', a.legsUF);
  positive(fn, 'voltageV', a.voltageV);
  positive(fn, 'frequencyHz', a.frequencyHz);
  const k = omega(a.frequencyHz) * a.voltageV * 1e-6;
  const x = a.legsUF[0] * k;
  const y = a.legsUF[1] * k;
  const z = a.legsUF[2] * k;
  return [Math.sqrt(x * x + z * z + x * z), Math.sqrt(x * x + y * y + x * y), Math.sqrt(y * y + z * z + y * z)];
}

const HALF_SQRT3 = Math.sqrt(3) / 2;

/**
 * Solves |I1|² = x² + z² + x·z, |I2|² = x² + y² + x·y, |I3|² = y² + z² + y·z for the leg
 * currents x = I12, y = I23, z = I31 (A) and writes them to `out`.
 *
 * The leg-current phasors of a capacitive delta at balanced voltages are 120° apart, so the
 * line currents are the sides of a triangle and x, y, z are the distances from its Fermat
 * point to the vertices. That gives a closed form: with A, B, C the squared line currents and
 * 16·Δ² = 2(AB + BC + CA) − (A² + B² + C²) (Heron), s = x + y + z = √((A + B + C)/2 + 2√3·Δ),
 * z − y = (A − B)/s, x − z = (B − C)/s, y − x = (C − A)/s. One Newton step on the three
 * equations (the reference's method) then polishes the result to about 1e-12 relative for leg
 * ratios up to 10⁴. Being exact, the closed form needs no iteration count and cannot stall.
 * Returns 0 when solved, 1 when the currents form no triangle (`out` untouched), 2 when a leg
 * comes out ≤ 0 (`out` holds the closed-form values).
 * Source: [DERIVED] engineering-reference.md §2(c); Fermat–Torricelli point geometry.
 */
export function solveLegCurrents(i1: number, i2: number, i3: number, out: number[]): 0 | 1 | 2 {
  const A = i1 * i1;
  const B = i2 * i2;
  const C = i3 * i3;
  const d16 = 2 * (A * B + B * C + C * A) - (A * A + B * B + C * C);
  if (!(d16 > 0)) return 1;
  const s = Math.sqrt((A + B + C) / 2 + HALF_SQRT3 * Math.sqrt(d16));
  const zy = (A - B) / s;
  const xz = (B - C) / s;
  const yx = (C - A) / s;
  let x = (s + xz - yx) / 3;
  let y = (s + yx - zy) / 3;
  let z = (s + zy - xz) / 3;
  if (!(x > 0 && y > 0 && z > 0)) {
    out[0] = x;
    out[1] = y;
    out[2] = z;
    return 2;
  }
  // One Newton step. Jacobian [[2x+z, 0, 2z+x], [2x+y, 2y+x, 0], [0, 2y+z, 2z+y]].
  const f1 = x * x + z * z + x * z - A;
  const f2 = x * x + y * y + x * y - B;
  const f3 = y * y + z * z + y * z - C;
  const a11 = 2 * x + z;
  const a13 = 2 * z + x;
  const a21 = 2 * x + y;
  const a22 = 2 * y + x;
  const a32 = 2 * y + z;
  const a33 = 2 * z + y;
  const det = a11 * a22 * a33 + a13 * a21 * a32;
  const dx = (f1 * a22 * a33 + a13 * (f2 * a32 - a22 * f3)) / det;
  const dy = (a11 * f2 * a33 - f1 * a21 * a33 + a13 * a21 * f3) / det;
  const dz = (a11 * (a22 * f3 - f2 * a32) + f1 * a21 * a32) / det;
  const nx = x - dx;
  const ny = y - dy;
  const nz = z - dz;
  if (nx > 0 && ny > 0 && nz > 0) {
    x = nx;
    y = ny;
    z = nz;
  }
  out[0] = x;
  out[1] = y;
  out[2] = z;
  return 0;
}

const scratch: number[] = [0, 0, 0];

/**
 * Legs C12, C23, C31 (µF) from the three line currents of a three-phase unit energised at a
 * measured line voltage U and frequency f.
 *
 * 1. Leg currents from line currents (balanced voltages): see {@link solveLegCurrents};
 *    C_ij = I_ij/(ω·U). Balanced: C_Δ = I_L/(√3·ω·U). [DERIVED] engineering-reference.md §2(c)
 * 2. With a series reactor L per line (a detuned step), the currents see X_C − X_L. Balanced,
 *    X_C = U/(√3·I) + X_L per phase (star equivalent), C_star = 1/(ω·X_C), C_Δ = C_star/3.
 *    Unbalanced, the apparent legs from step 1 are turned into their star equivalent
 *    (C_i = P/C_opposite), each star phase gets X_L added back (X_C,i = 1/(ω·C_i,app) + ω·L),
 *    and the result is turned back into delta legs (C12 = C1·C2/ΣC). This is exact for
 *    balanced sinusoidal voltages, equal lossless reactors and capacitors: a star of series
 *    L–C branches is a star of net reactances, whose delta equivalent is again purely
 *    capacitive, so step 1 applies to it. Harmonics, reactor tolerance between phases and
 *    losses are not modelled (a 5 % 5th harmonic voltage biases the result up by about 3 %,
 *    see currentMethodHarmonicBiasPct). Ignoring the reactor would overstate C by 1/(1 − p).
 *
 * The legs are the capacitance itself, so kvar at rated conditions follows from
 * kvarFromLegs at the nameplate voltage and frequency (Q_rated = Q_m·(U_N/U_m)²·(f_N/f_m)).
 *
 * @param a.reactorInductanceMH series reactor per line in mH; omit or 0 for none.
 * @throws RangeError for non-finite or non-positive inputs, and for currents no capacitive
 *   unit can draw (they form no triangle, or a back-calculated leg is not positive).
 */
export function legsFromLineCurrents(a: {
  currentsA: Triple;
  voltageV: number;
  frequencyHz: number;
  reactorInductanceMH?: number;
}): Triple {
  const fn = 'legsFromLineCurrents';
  positiveTriple(fn, 'currentsA', a.currentsA);
  positive(fn, 'voltageV', a.voltageV);
  positive(fn, 'frequencyHz', a.frequencyHz);
  const lMH = a.reactorInductanceMH;
  if (lMH !== undefined) nonNegative(fn, 'reactorInductanceMH', lMH);
  const i = a.currentsA;
  const status = solveLegCurrents(i[0], i[1], i[2], scratch);
  const w = omega(a.frequencyHz);
  const k = 1e6 / (w * a.voltageV); // A → µF
  if (status === 1) {
    failWith(
      fn,
      `currentsA ${listOf(i)} cannot come from a real unit: the largest line current is not less than the sum of the other two`,
    );
  }
  if (status === 2) {
    const leg = !((scratch[0] as number) > 0) ? 0 : !((scratch[1] as number) > 0) ? 1 : 2;
    impossible(fn, 'currentsA', i, leg, (scratch[leg] as number) * k, 'µF');
  }
  const c12 = (scratch[0] as number) * k;
  const c23 = (scratch[1] as number) * k;
  const c31 = (scratch[2] as number) * k;
  if (lMH === undefined || lMH === 0) return [c12, c23, c31];
  // Apparent star phases (µF), reactor added back per phase, then back to delta legs.
  const p = c12 * c23 + c23 * c31 + c31 * c12;
  const xl = w * lMH * 1e-3; // Ω
  const toUF = 1e6 / w;
  const c1 = toUF / (toUF / (p / c23) + xl);
  const c2 = toUF / (toUF / (p / c31) + xl);
  const c3 = toUF / (toUF / (p / c12) + xl);
  const s = c1 + c2 + c3;
  return [(c1 * c2) / s, (c2 * c3) / s, (c3 * c1) / s];
}
