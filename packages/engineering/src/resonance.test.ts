import { describe, expect, it } from 'vitest';
import { bankResonance, resonanceOrder, shortCircuitKva, voltageRisePct } from './resonance.js';

describe('resonance with the supply', () => {
  it('1000 kVA at 6 %: S_sc 16.67 MVA, 300 kvar → h 7.45, 666.7 kvar → 5th', () => {
    // [rule of thumb, IEEE harmonic guides, clause from memory] engineering-reference.md §5: S_sc = S_T/z_T = 16.67 MVA
    expect(shortCircuitKva({ transformerKva: 1000, impedancePct: 6 })).toBeCloseTo(16_666.67, 2);
    // §5: 300 kvar → h = 7.45
    expect(resonanceOrder({ transformerKva: 1000, impedancePct: 6, kvar: 300 })).toBeCloseTo(7.45, 2);
    // §5: 666.7 kvar lands on the 5th
    expect(resonanceOrder({ transformerKva: 1000, impedancePct: 6, kvar: 666.7 })).toBeCloseTo(5, 3);
  });

  it('utility source impedance in series lowers S_sc and h', () => {
    // [DERIVED] engineering-reference.md §5: 1/S = 1/S_T' + 1/S_util; 16 667 kVA with 250 MVA → 15 625 kVA
    expect(shortCircuitKva({ transformerKva: 1000, impedancePct: 6, utilityShortCircuitKva: 250_000 })).toBeCloseTo(15_625, 6);
    expect(resonanceOrder({ transformerKva: 1000, impedancePct: 6, kvar: 300, utilityShortCircuitKva: 250_000 })).toBeCloseTo(Math.sqrt(15_625 / 300), 12);
  });

  it('voltage rise ΔU ≈ Q·z%/S_T', () => {
    // [COMMON] engineering-reference.md §5 (common practice): 300 kvar on 1000 kVA 6 % → 1.8 %
    expect(voltageRisePct({ kvar: 300, transformerKva: 1000, impedancePct: 6 })).toBeCloseTo(1.8, 12);
  });

  it('cumulative combinations warn within 10 % of 5, 7, 11, 13', () => {
    // [COMMON] engineering-reference.md §5 (common practice): warn when h is within about 10 % of 5, 7, 11 or 13.
    // Steps 100 + 200 + 366.7 kvar on 1000 kVA 6 %: 100 → h 12.91 (13th, 0.7 %), 300 → 7.45 (7th, 6.5 %), 666.7 → 5.00.
    const r = bankResonance({ transformerKva: 1000, impedancePct: 6, stepsKvar: [100, 200, 366.7] });
    expect(r.map((c) => c.kvar)).toEqual([100, 300, 666.7]);
    expect(r.map((c) => c.nearestHarmonic)).toEqual([13, 7, 5]);
    expect(r.map((c) => c.warning)).toEqual([true, true, true]);
    expect(r[0]?.order).toBeCloseTo(Math.sqrt(16_666.67 / 100), 3);
    expect(r[1]?.distancePct).toBeCloseTo(((7.4536 - 7) / 7) * 100, 2);
    // 50 kvar alone → h 18.26, 40 % from the 13th: no warning. 500 kvar → 5.77 is 15.5 % from the 5th: none either.
    const s = bankResonance({ transformerKva: 1000, impedancePct: 6, stepsKvar: [50, 450] });
    expect(s.map((c) => c.warning)).toEqual([false, false]);
  });

  it("'all' lists each distinct total once, sorted", () => {
    // [DERIVED] subsets of {50, 50, 100}: totals 50, 100, 150, 200
    const r = bankResonance({ transformerKva: 1000, impedancePct: 6, stepsKvar: [50, 50, 100], combinations: 'all' });
    expect(r.map((c) => c.kvar)).toEqual([50, 100, 150, 200]);
  });
});
