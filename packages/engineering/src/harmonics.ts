import { fail, finite, nonNegative } from './validate.js';

/** Characteristic harmonic orders of six-pulse loads checked against tuning and resonance [COMMON]. */
export const CHARACTERISTIC_HARMONICS: readonly number[] = [5, 7, 11, 13];

/**
 * Nearest order in `orders` to a (possibly fractional) order h, with the distance in % of that
 * order: distancePct = 100·|h − n|/n. Used for the "within about 10 % of a characteristic
 * harmonic" checks [COMMON] engineering-reference.md §4–5.
 */
export function nearestHarmonic(order: number, orders: readonly number[] = CHARACTERISTIC_HARMONICS): { order: number; distancePct: number } {
  let best = orders[0] ?? 5;
  let bestDist = Infinity;
  for (let i = 0; i < orders.length; i++) {
    const n = orders[i] as number;
    const d = Math.abs(order - n) / n;
    if (d < bestDist) {
      bestDist = d;
      best = n;
    }
  }
  return { order: best, distancePct: bestDist * 100 };
}

/**
 * How much harmonic voltage biases the line-current method upward, %.
 * A capacitor draws I_h = h·U_h·ω·C at harmonic h, so an rms current over rms voltage
 * reading gives C_apparent/C = √(1 + Σ(h·u_h)²) / √(1 + Σu_h²), u_h the harmonic voltage as a
 * fraction of the fundamental. A 5 % 5th gives about +3 %.
 * Source: [DERIVED] engineering-reference.md §2(c).
 */
export function currentMethodHarmonicBiasPct(harmonics: ReadonlyArray<{ order: number; voltagePct: number }>): number {
  const fn = 'currentMethodHarmonicBiasPct';
  if (!Array.isArray(harmonics)) fail(fn, 'harmonics', 'must be an array', harmonics);
  let num = 1;
  let den = 1;
  for (let i = 0; i < harmonics.length; i++) {
    const h = harmonics[i] as { order: number; voltagePct: number };
    finite(fn, `harmonics[${i}].order`, h.order);
    if (!(h.order >= 1)) fail(fn, `harmonics[${i}].order`, 'must be ≥ 1', h.order);
    nonNegative(fn, `harmonics[${i}].voltagePct`, h.voltagePct);
    const u = h.voltagePct / 100;
    num += h.order * h.order * u * u;
    den += u * u;
  }
  return (Math.sqrt(num / den) - 1) * 100;
}
