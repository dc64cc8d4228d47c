import { describe, expect, it } from 'vitest';
import { CHARACTERISTIC_HARMONICS, currentMethodHarmonicBiasPct, nearestHarmonic } from './harmonics.js';

describe('harmonics', () => {
  it('a 5 % 5th harmonic voltage adds about 3 % to the apparent capacitance', () => {
    // [DERIVED] engineering-reference.md §2(c): I_5 = 5·0.05·I_1 → √(1 + 0.25²)/√(1 + 0.05²) − 1 ≈ 2.95 % ("about 3 %")
    const bias = currentMethodHarmonicBiasPct([{ order: 5, voltagePct: 5 }]);
    expect(bias).toBeCloseTo((Math.sqrt(1 + 0.0625) / Math.sqrt(1 + 0.0025) - 1) * 100, 12);
    expect(bias).toBeCloseTo(3, 0);
    expect(currentMethodHarmonicBiasPct([])).toBe(0);
  });

  it('nearest characteristic harmonic and distance', () => {
    // [COMMON] engineering-reference.md §5 (common practice): characteristic harmonics 5, 7, 11, 13
    expect(CHARACTERISTIC_HARMONICS).toEqual([5, 7, 11, 13]);
    const n = nearestHarmonic(7.45);
    expect(n.order).toBe(7);
    expect(n.distancePct).toBeCloseTo((0.45 / 7) * 100, 12);
    expect(nearestHarmonic(2.9, [3, 5, 7]).order).toBe(3);
  });
});
