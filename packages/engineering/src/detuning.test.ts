import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { capacitorVoltageV, detunedStepKvar, detunedStepWithLoss, detuningFactor, reactorInductanceMH, tuningFrequencyHz } from './detuning.js';
import { ratedCapacitanceUF } from './rating.js';
import { relDiff } from '../test-support/phasor-models.js';

describe('tuning frequency f_r = f/√p', () => {
  it('common detuning factors', () => {
    // [COMMON] engineering-reference.md §4 (common practice): 7 % → 189 Hz at 50 Hz, 226.8 Hz at 60 Hz
    expect(tuningFrequencyHz({ detuningFactor: 0.07, frequencyHz: 50 })).toBeCloseTo(189.0, 1);
    expect(tuningFrequencyHz({ detuningFactor: 0.07, frequencyHz: 60 })).toBeCloseTo(226.8, 1);
    // [COMMON] §4: 5.67 % → 210 Hz at 50 Hz, 252 Hz at 60 Hz
    expect(tuningFrequencyHz({ detuningFactor: 0.0567, frequencyHz: 50 })).toBeCloseTo(210, 0);
    expect(tuningFrequencyHz({ detuningFactor: 0.0567, frequencyHz: 60 })).toBeCloseTo(252, 0);
    // [COMMON] §4: 14 % → 133.6 Hz at 50 Hz, 160.4 Hz at 60 Hz
    expect(tuningFrequencyHz({ detuningFactor: 0.14, frequencyHz: 50 })).toBeCloseTo(133.6, 1);
    expect(tuningFrequencyHz({ detuningFactor: 0.14, frequencyHz: 60 })).toBeCloseTo(160.4, 1);
  });

  it('property: p = (f/f_r)²', () => {
    // [DERIVED] engineering-reference.md §4: p = (f1/fr)²
    fc.assert(
      fc.property(fc.double({ min: 0.01, max: 0.49, noNaN: true }), fc.constantFrom(50, 60), (p, f) => {
        const fr = tuningFrequencyHz({ detuningFactor: p, frequencyHz: f });
        expect(relDiff((f / fr) ** 2, p)).toBeLessThan(1e-12);
      }),
    );
  });
});

describe('detuning factor from a reactor and delta legs', () => {
  it('p = ω²·L·C_star with C_star = 3·C_Δ', () => {
    // [DERIVED] engineering-reference.md §4, hand calculation: 3 × 154.5 µF, 2.0 mH, 50 Hz → (2π·50)²·2e-3·463.5e-6
    const expected = (2 * Math.PI * 50) ** 2 * 2e-3 * 3 * 154.5e-6;
    expect(detuningFactor({ inductanceMH: 2, legsUF: [154.5, 154.5, 154.5], frequencyHz: 50 })).toBeCloseTo(expected, 12);
  });

  it('uses the mean leg for an unbalanced delta', () => {
    // [DERIVED] engineering-reference.md §4: "use the mean leg"
    const a = detuningFactor({ inductanceMH: 2, legsUF: [140, 154.5, 169], frequencyHz: 50 });
    const b = detuningFactor({ inductanceMH: 2, legsUF: [154.5, 154.5, 154.5], frequencyHz: 50 });
    expect(a).toBeCloseTo(b, 12);
  });

  it('property: reactorInductanceMH is its inverse, and the series L–C resonance is at f_r', () => {
    // [DERIVED] §4: a star phase of L and C_star resonates at 1/(2π√(L·C_star)) = f/√p
    fc.assert(
      fc.property(fc.double({ min: 10, max: 2000, noNaN: true }), fc.double({ min: 0.02, max: 0.3, noNaN: true }), fc.constantFrom(50, 60), (c, p, f) => {
        const lMH = reactorInductanceMH({ detuningFactor: p, legsUF: [c, c, c], frequencyHz: f });
        expect(relDiff(detuningFactor({ inductanceMH: lMH, legsUF: [c, c, c], frequencyHz: f }), p)).toBeLessThan(1e-12);
        const fr = 1 / (2 * Math.PI * Math.sqrt(lMH * 1e-3 * 3 * c * 1e-6));
        expect(relDiff(fr, tuningFrequencyHz({ detuningFactor: p, frequencyHz: f }))).toBeLessThan(1e-12);
      }),
    );
  });
});

describe('capacitor voltage and effective output', () => {
  it('7 % on 400 V puts 430.1 V on the capacitor', () => {
    // [DERIVED] engineering-reference.md §4: U_C = U_N/(1 − p); 7 % on 400 V → 430.1 V
    expect(capacitorVoltageV({ networkVoltageV: 400, detuningFactor: 0.07 })).toBeCloseTo(430.1, 1);
  });

  it('Q_eff = Q_CR·(U_N/U_CR)²/(1 − p), checked against the series L–C circuit', () => {
    // [DERIVED] engineering-reference.md §4. Independent: per star phase X_net = X_C − X_L, Q = U_N²/X_net.
    const capKvar = 28.2;
    const capV = 440;
    const p = 0.07;
    const q = detunedStepKvar({ capacitorKvar: capKvar, capacitorVoltageV: capV, networkVoltageV: 400, detuningFactor: p });
    const cStar = ratedCapacitanceUF({ kvar: capKvar, voltageV: capV, frequencyHz: 50, connection: 'star' }) * 1e-6;
    const xc = 1 / (2 * Math.PI * 50 * cStar);
    const xNet = xc * (1 - p);
    expect(q).toBeCloseTo((400 * 400) / xNet / 1000, 9);
    // A 28.2 kvar 440 V capacitor behind 7 % makes a ≈ 25 kvar step at 400 V. [DERIVED]
    expect(q).toBeCloseTo(25.06, 2);
  });

  it('capacitance loss moves the tuning: 7 % at 50 Hz, 0/10/20 % loss → 189.0/199.2/211.3 Hz', () => {
    // [DERIVED] engineering-reference.md §4: C → k·C gives f_r/√k; 0 % 189.0 Hz, 10 % 199.2 Hz, 20 % 211.3 Hz
    expect(detunedStepWithLoss({ detuningFactor: 0.07, frequencyHz: 50, capacitanceRatio: 1 }).tuningFrequencyHz).toBeCloseTo(189.0, 1);
    expect(detunedStepWithLoss({ detuningFactor: 0.07, frequencyHz: 50, capacitanceRatio: 0.9 }).tuningFrequencyHz).toBeCloseTo(199.2, 1);
    expect(detunedStepWithLoss({ detuningFactor: 0.07, frequencyHz: 50, capacitanceRatio: 0.8 }).tuningFrequencyHz).toBeCloseTo(211.3, 1);
  });

  it("property: output ratio k(1 − p)/(1 − kp) equals the ratio of detunedStepKvar at the capacitor's reduced rating and p' = k·p", () => {
    // [DERIVED] engineering-reference.md §4: Q'/Q = k·(1 − p)/(1 − k·p)
    fc.assert(
      fc.property(fc.double({ min: 0.5, max: 1.1, noNaN: true }), fc.double({ min: 0.04, max: 0.15, noNaN: true }), (k, p) => {
        const r = detunedStepWithLoss({ detuningFactor: p, frequencyHz: 50, capacitanceRatio: k });
        const q = detunedStepKvar({ capacitorKvar: 30, capacitorVoltageV: 440, networkVoltageV: 400, detuningFactor: p });
        const q2 = detunedStepKvar({ capacitorKvar: 30 * k, capacitorVoltageV: 440, networkVoltageV: 400, detuningFactor: k * p });
        expect(relDiff(r.outputRatio, q2 / q)).toBeLessThan(1e-12);
        expect(relDiff(r.detuningFactor, k * p)).toBeLessThan(1e-15);
      }),
    );
  });
});
