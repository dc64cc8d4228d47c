/**
 * Independent reference models for the tests (not used by the package itself). Written from
 * the circuit equations with mathjs complex arithmetic so they share no code with src/.
 */
import { abs, add, complex, divide, lusolve, multiply, subtract, type Complex } from 'mathjs';

const W = (f: number): number => 2 * Math.PI * f;

/** Balanced star (phase-to-neutral) voltages of a system with line voltage U: V1 ∠0°, V2 ∠−120°, V3 ∠+120°. */
export function phaseVoltages(voltageV: number): [Complex, Complex, Complex] {
  const v = voltageV / Math.sqrt(3);
  const at = (deg: number): Complex => complex({ r: v, phi: (deg * Math.PI) / 180 });
  return [at(0), at(-120), at(120)];
}

/** Line-current magnitudes of a delta of capacitors C12, C23, C31 (µF) by phasor arithmetic. */
export function deltaLineCurrentsPhasor(legsUF: readonly [number, number, number], voltageV: number, frequencyHz: number): [number, number, number] {
  const [v1, v2, v3] = phaseVoltages(voltageV);
  const w = W(frequencyHz);
  const y = (cUF: number): Complex => complex(0, w * cUF * 1e-6);
  const i12 = multiply(subtract(v1, v2), y(legsUF[0])) as Complex;
  const i23 = multiply(subtract(v2, v3), y(legsUF[1])) as Complex;
  const i31 = multiply(subtract(v3, v1), y(legsUF[2])) as Complex;
  const i1 = subtract(i12, i31) as Complex;
  const i2 = subtract(i23, i12) as Complex;
  const i3 = subtract(i31, i23) as Complex;
  return [abs(i1) as unknown as number, abs(i2) as unknown as number, abs(i3) as unknown as number];
}

/**
 * Line-current magnitudes of a delta of capacitors fed through a series reactor L (mH) in each
 * line, by nodal analysis of the three internal nodes (mathjs lusolve on complex admittances).
 */
export function detunedDeltaLineCurrentsPhasor(
  legsUF: readonly [number, number, number],
  reactorMH: number,
  voltageV: number,
  frequencyHz: number,
): [number, number, number] {
  const [v1, v2, v3] = phaseVoltages(voltageV);
  const w = W(frequencyHz);
  const yl = complex(0, -1 / (w * reactorMH * 1e-3));
  const y12 = complex(0, w * legsUF[0] * 1e-6);
  const y23 = complex(0, w * legsUF[1] * 1e-6);
  const y31 = complex(0, w * legsUF[2] * 1e-6);
  const neg = (z: Complex): Complex => multiply(z, -1) as Complex;
  const A = [
    [add(add(yl, y12), y31), neg(y12), neg(y31)],
    [neg(y12), add(add(yl, y12), y23), neg(y23)],
    [neg(y31), neg(y23), add(add(yl, y23), y31)],
  ];
  const b = [[multiply(yl, v1)], [multiply(yl, v2)], [multiply(yl, v3)]];
  const x = lusolve(A as never, b as never) as unknown as Complex[][];
  const node = (i: number): Complex => (x[i] as Complex[])[0] as Complex;
  const cur = (v: Complex, i: number): number => abs(multiply(subtract(v, node(i)), yl) as Complex) as unknown as number;
  return [cur(v1, 0), cur(v2, 1), cur(v3, 2)];
}

/** Three-phase reactive power (kvar) of a star of capacitors with an isolated star point, by phasors. */
export function starKvarPhasor(phasesUF: readonly [number, number, number], voltageV: number, frequencyHz: number): number {
  const vs = phaseVoltages(voltageV);
  const w = W(frequencyHz);
  const ys = phasesUF.map((c) => complex(0, w * c * 1e-6));
  // Star-point voltage: V_N = Σ Y_i·V_i / Σ Y_i.
  let num: Complex = complex(0, 0);
  let den: Complex = complex(0, 0);
  for (let i = 0; i < 3; i++) {
    num = add(num, multiply(ys[i] as Complex, vs[i] as Complex)) as Complex;
    den = add(den, ys[i] as Complex) as Complex;
  }
  const vn = divide(num, den) as Complex;
  let q = 0;
  for (let i = 0; i < 3; i++) {
    const vi = abs(subtract(vs[i] as Complex, vn) as Complex) as unknown as number;
    q += w * (phasesUF[i] as number) * 1e-6 * vi * vi;
  }
  return q / 1000;
}

/** Relative difference |a/b − 1|. */
export function relDiff(a: number, b: number): number {
  return Math.abs(a / b - 1);
}
