import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  legsFromLineCurrents,
  legsFromOpenPairs,
  legsFromShortedPairs,
  lineCurrentsFromLegs,
  openPairReadingsFromLegs,
  shortedReadingsFromLegs,
} from './field-methods.js';
import { ratedCapacitanceUF } from './rating.js';
import type { Triple } from './types.js';
import { deltaLineCurrentsPhasor, detunedDeltaLineCurrentsPhasor, relDiff } from '../test-support/phasor-models.js';

// Forward models written here from the reference text, independent of src/.
// [DERIVED] engineering-reference.md §2(a): M12 = C12 + C23·C31/(C23 + C31), cyclic.
const openPairs = ([c12, c23, c31]: Triple): Triple => [
  c12 + (c23 * c31) / (c23 + c31),
  c23 + (c31 * c12) / (c31 + c12),
  c31 + (c12 * c23) / (c12 + c23),
];
// [DERIVED] engineering-reference.md §2(b): M1 = C12 + C31, M2 = C12 + C23, M3 = C23 + C31.
const shorted = ([c12, c23, c31]: Triple): Triple => [c12 + c31, c12 + c23, c23 + c31];

const leg = fc.double({ min: 1, max: 5000, noNaN: true });
const legs = fc.tuple(leg, leg, leg) as fc.Arbitrary<Triple>;
// Realistic unbalance for a unit: legs within a factor 3 of a base value.
const unitLegs = fc
  .tuple(fc.double({ min: 5, max: 3000, noNaN: true }), fc.double({ min: 0.33, max: 1, noNaN: true }), fc.double({ min: 0.33, max: 1, noNaN: true }), fc.double({ min: 0.33, max: 1, noNaN: true }))
  .map(([b, x, y, z]) => [b * x, b * y, b * z] as Triple);

const expectLegs = (got: Triple, want: Triple, tol: number): void => {
  for (let i = 0; i < 3; i++) expect(relDiff(got[i] as number, want[i] as number)).toBeLessThan(tol);
};

const C50 = ratedCapacitanceUF({ kvar: 50, voltageV: 400, frequencyHz: 50, connection: 'delta' });

describe('open pairs, third terminal open', () => {
  it('balanced unit reads 1.5·C_Δ', () => {
    // [DERIVED] engineering-reference.md §2(a): balanced M = 1.5·C_Δ (331.57 µF → 497.36 µF)
    const m = openPairReadingsFromLegs([331.57, 331.57, 331.57]);
    expect(m[0]).toBeCloseTo(497.355, 3);
    expectLegs(legsFromOpenPairs([497.355, 497.355, 497.355]), [331.57, 331.57, 331.57], 1e-12);
  });

  it('a 10 % loss in one leg is diluted in the readings', () => {
    // [DERIVED] engineering-reference.md §2(a): 10 % loss in one leg shows ≈ −6.7 % on one reading and −1.75 % on the other two
    const m = openPairReadingsFromLegs([0.9 * C50, C50, C50]);
    const full = 1.5 * C50;
    expect((m[0] / full - 1) * 100).toBeCloseTo(-6.7, 1);
    expect((m[1] / full - 1) * 100).toBeCloseTo(-1.75, 2);
    expect((m[2] / full - 1) * 100).toBeCloseTo(-1.75, 2);
    // …and the inverse restores the full 10 % on that leg. [DERIVED] round trip
    const back = legsFromOpenPairs(m);
    expect((back[0] / C50 - 1) * 100).toBeCloseTo(-10, 9);
    expect((back[1] / C50 - 1) * 100).toBeCloseTo(0, 9);
  });

  it('the reference closed-form mapping u→C12, v→C23, w→C31 agrees with the forward model', () => {
    // [DERIVED] engineering-reference.md §2(a): u = (b + c − a)/2 → C12 (checked with distinct legs so a wrong mapping shows)
    expectLegs(legsFromOpenPairs(openPairs([100, 200, 400])), [100, 200, 400], 1e-12);
    expectLegs(openPairReadingsFromLegs([100, 200, 400]), openPairs([100, 200, 400]), 1e-15);
  });

  it('property: forward model → inverse recovers random positive legs', () => {
    // [DERIVED] engineering-reference.md §2(a), round trip
    fc.assert(fc.property(legs, (l) => expectLegs(legsFromOpenPairs(openPairs(l)), l, 1e-9)), { numRuns: 1000 });
  });

  it('rejects readings no real unit produces', () => {
    // 1/M12 > 1/M23 + 1/M31 makes u < 0: C12 would be negative.
    expect(() => legsFromOpenPairs([40, 100, 100])).toThrow(RangeError);
    expect(() => legsFromOpenPairs([40, 100, 100])).toThrow(/legsFromOpenPairs: readingsUF \[40, 100, 100\] cannot come from a real unit: back-calculated leg C12 = -[\d.]+ µF is not positive/);
    // Equality puts a leg at exactly zero: also rejected.
    expect(() => legsFromOpenPairs([50, 100, 100])).toThrow(/back-calculated leg C12 = 0 µF is not positive/);
  });
});

describe('one terminal against the other two shorted', () => {
  it('balanced unit reads 2·C_Δ', () => {
    // [DERIVED] engineering-reference.md §2(b): balanced delta M = 2·C_Δ
    expect(shortedReadingsFromLegs([331.57, 331.57, 331.57])[0]).toBeCloseTo(663.14, 2);
    expectLegs(legsFromShortedPairs([663.14, 663.14, 663.14]), [331.57, 331.57, 331.57], 1e-12);
  });

  it('distinct legs map to the right terminals', () => {
    // [DERIVED] engineering-reference.md §2(b): C12 = (M1 + M2 − M3)/2, C23 = (M2 + M3 − M1)/2, C31 = (M1 + M3 − M2)/2
    expectLegs(legsFromShortedPairs(shorted([100, 200, 400])), [100, 200, 400], 1e-14);
  });

  it('property: forward model → inverse recovers random positive legs', () => {
    // [DERIVED] engineering-reference.md §2(b), round trip
    fc.assert(fc.property(legs, (l) => expectLegs(legsFromShortedPairs(shorted(l)), l, 1e-9)), { numRuns: 1000 });
  });

  it('rejects readings no real unit produces', () => {
    expect(() => legsFromShortedPairs([100, 100, 300])).toThrow(/legsFromShortedPairs: readingsUF \[100, 100, 300\] cannot come from a real unit: back-calculated leg C12 = -50 µF is not positive/);
  });
});

describe('line currents at measured voltage', () => {
  it('balanced 50 kvar 400 V 50 Hz unit: 72.17 A per line → 331.57 µF per leg', () => {
    // [DERIVED] engineering-reference.md §1–2(c): I_L = 72.17 A, C_Δ = I_L/(√3·ω·U) = 331.57 µF
    const l = legsFromLineCurrents({ currentsA: [72.17, 72.17, 72.17], voltageV: 400, frequencyHz: 50 });
    for (const c of l) expect(c).toBeCloseTo(331.57, 1);
    const i = lineCurrentsFromLegs({ legsUF: [C50, C50, C50], voltageV: 400, frequencyHz: 50 });
    expect(i[0]).toBeCloseTo(72.17, 2);
  });

  it('property: magnitude forward model agrees with mathjs phasors', () => {
    // [DERIVED] engineering-reference.md §2(c): |I1|² = I12² + I31² + I12·I31 etc., checked against complex phasor arithmetic
    fc.assert(
      fc.property(legs, (l) => {
        const a = lineCurrentsFromLegs({ legsUF: l, voltageV: 400, frequencyHz: 50 });
        const b = deltaLineCurrentsPhasor(l, 400, 50);
        expectLegs(a, b, 1e-12);
      }),
      { numRuns: 200 },
    );
  });

  it('property (independent cross-check): mathjs phasor line currents of random unbalanced deltas → legsFromLineCurrents recovers the legs', () => {
    // [DERIVED] engineering-reference.md §2(c). Currents from complex phasors: balanced line voltages 120° apart,
    // leg currents V_ij·jωC_ij, line currents I1 = I12 − I31 etc.
    fc.assert(
      fc.property(legs, fc.double({ min: 100, max: 1000, noNaN: true }), fc.constantFrom(50, 60), (l, u, f) => {
        const currentsA = deltaLineCurrentsPhasor(l, u, f);
        expectLegs(legsFromLineCurrents({ currentsA, voltageV: u, frequencyHz: f }), l, 1e-9);
      }),
      { numRuns: 1000 },
    );
  });

  it('an independent Newton solve from I_leg = mean/√3 (the reference method) gives the same legs', () => {
    // [DERIVED] engineering-reference.md §2(c): Newton on the three magnitude equations, started at mean(I_L)/√3.
    const newton = (i: Triple): Triple => {
      const [A, B, C] = i.map((x) => x * x) as Triple;
      const start = (i[0] + i[1] + i[2]) / 3 / Math.sqrt(3);
      let [x, y, z] = [start, start, start];
      for (let k = 0; k < 100; k++) {
        const f = [x * x + z * z + x * z - A, x * x + y * y + x * y - B, y * y + z * z + y * z - C];
        const J = [
          [2 * x + z, 0, 2 * z + x],
          [2 * x + y, 2 * y + x, 0],
          [0, 2 * y + z, 2 * z + y],
        ];
        // Gaussian elimination on the 3×3 system J·d = f.
        const M = J.map((row, r) => [...row, f[r] as number]);
        for (let c = 0; c < 3; c++) {
          const piv = (M[c] as number[])[c] as number;
          for (let r = c + 1; r < 3; r++) {
            const fac = ((M[r] as number[])[c] as number) / piv;
            for (let cc = c; cc < 4; cc++) (M[r] as number[])[cc] = ((M[r] as number[])[cc] as number) - fac * ((M[c] as number[])[cc] as number);
          }
        }
        const d = [0, 0, 0];
        for (let r = 2; r >= 0; r--) {
          let s = (M[r] as number[])[3] as number;
          for (let cc = r + 1; cc < 3; cc++) s -= ((M[r] as number[])[cc] as number) * (d[cc] as number);
          d[r] = s / ((M[r] as number[])[r] as number);
        }
        x -= d[0] as number;
        y -= d[1] as number;
        z -= d[2] as number;
      }
      return [x, y, z];
    };
    fc.assert(
      fc.property(unitLegs, (l) => {
        const currentsA = deltaLineCurrentsPhasor(l, 400, 50);
        const w = 2 * Math.PI * 50 * 400 * 1e-6;
        const byNewton = newton(currentsA).map((x) => x / w) as Triple;
        expectLegs(legsFromLineCurrents({ currentsA, voltageV: 400, frequencyHz: 50 }), byNewton, 1e-9);
      }),
      { numRuns: 300 },
    );
  });

  it('balanced detuned step: X_C = U/(√3·I) + X_L', () => {
    // [DERIVED] engineering-reference.md §2(c): in a detuned step X_C = U/(√3·I) + X_L (star-equivalent per phase),
    // C_star = 1/(ωX_C), C_Δ = C_star/3. Hand calculation for 400 V 50 Hz, I = 40 A, L = 2 mH.
    const xc = 400 / (Math.sqrt(3) * 40) + 2 * Math.PI * 50 * 2e-3;
    const cDelta = 1 / (2 * Math.PI * 50 * xc) / 3 * 1e6;
    const l = legsFromLineCurrents({ currentsA: [40, 40, 40], voltageV: 400, frequencyHz: 50, reactorInductanceMH: 2 });
    for (const c of l) expect(relDiff(c, cDelta)).toBeLessThan(1e-12);
  });

  it('ignoring the reactor overstates C by 1/(1 − p)', () => {
    // [DERIVED] engineering-reference.md §2(c): ignoring the reactor overstates C by 1/(1 − p). 7 % step, balanced.
    const cDelta = 154.5;
    const w = 2 * Math.PI * 50;
    const lMH = (0.07 / (w * w * 3 * cDelta * 1e-6)) * 1e3;
    const currentsA = detunedDeltaLineCurrentsPhasor([cDelta, cDelta, cDelta], lMH, 400, 50);
    const naive = legsFromLineCurrents({ currentsA, voltageV: 400, frequencyHz: 50 });
    expect(naive[0] / cDelta).toBeCloseTo(1 / 0.93, 9);
    const corrected = legsFromLineCurrents({ currentsA, voltageV: 400, frequencyHz: 50, reactorInductanceMH: lMH });
    expect(corrected[0]).toBeCloseTo(cDelta, 9);
  });

  it('property (independent cross-check): unbalanced detuned deltas by mathjs nodal analysis → reactor taken out exactly', () => {
    // [DERIVED] engineering-reference.md §2(c): series reactor per line taken out. Forward model: nodal analysis of the
    // three internal nodes with complex admittances (mathjs lusolve); detuning p between 4 % and 15 %.
    fc.assert(
      fc.property(unitLegs, fc.double({ min: 0.04, max: 0.15, noNaN: true }), fc.constantFrom(50, 60), (l, p, f) => {
        const w = 2 * Math.PI * f;
        const mean = (l[0] + l[1] + l[2]) / 3;
        const lMH = (p / (w * w * 3 * mean * 1e-6)) * 1e3;
        const currentsA = detunedDeltaLineCurrentsPhasor(l, lMH, 400, f);
        expectLegs(legsFromLineCurrents({ currentsA, voltageV: 400, frequencyHz: f, reactorInductanceMH: lMH }), l, 1e-8);
      }),
      { numRuns: 300 },
    );
  });

  it('rejects currents no capacitive unit can draw', () => {
    // Largest current equals the sum of the other two: no triangle.
    expect(() => legsFromLineCurrents({ currentsA: [10, 10, 20], voltageV: 400, frequencyHz: 50 })).toThrow(
      /legsFromLineCurrents: currentsA \[10, 10, 20\] cannot come from a real unit: the largest line current is not less than the sum of the other two/,
    );
    // A triangle with an angle over 120°: a leg would have to be negative.
    expect(() => legsFromLineCurrents({ currentsA: [10, 10, 19], voltageV: 400, frequencyHz: 50 })).toThrow(
      /legsFromLineCurrents: currentsA \[10, 10, 19\] cannot come from a real unit: back-calculated leg C\d\d = -[\d.e-]+ µF is not positive/,
    );
    // At exactly 120° one leg is zero: still rejected. |I|² = 1 + 1 + 1 for legs (1, 1, 0) currents: I1=1, I2=√3, I3=1.
    expect(() => legsFromLineCurrents({ currentsA: [10, 10 * Math.sqrt(3) * 1.0001, 10], voltageV: 400, frequencyHz: 50 })).toThrow(RangeError);
  });
});
