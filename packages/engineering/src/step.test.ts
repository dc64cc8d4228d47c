import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { bankSummary } from './bank.js';
import { evaluateStep } from './step.js';
import type { Nameplate, Triple } from './types.js';
import { detunedDeltaLineCurrentsPhasor, relDiff } from '../test-support/phasor-models.js';

const W50 = 2 * Math.PI * 50;
// A 28.2 kvar 440 V capacitor: C_Δ = Q/(3ωU²) written out. [DERIVED] engineering-reference.md §1
const CAP: Nameplate = { kvar: 28.2, voltageV: 440, frequencyHz: 50, connection: 'delta' };
const C_CAP = 28_200 / (3 * W50 * 440 * 440) * 1e6;
const legs = (k: number): Triple => [k * C_CAP, k * C_CAP, k * C_CAP];

describe('evaluateStep: detuned', () => {
  it('7 % step, nameplate capacitance: Q_eff = Q_CR·(U_N/U_CR)²/(1 − p), tuning 189 Hz', () => {
    // [DERIVED] engineering-reference.md §4: Q_eff = Q_CR·(U_N/U_CR)²/(1 − p); 7 % → 189.0 Hz; U_C = 430.1 V
    const r = evaluateStep({ networkVoltageV: 400, networkFrequencyHz: 50, capacitors: [{ nameplate: CAP }], detuning: { designFactor: 0.07 } });
    expect(r.installedKvar).toBeCloseTo((28.2 * (400 / 440) ** 2) / 0.93, 9);
    expect(r.effectiveKvar).toBeCloseTo(r.installedKvar, 12);
    expect(r.tuning?.tuningHz).toBeCloseTo(189.0, 1);
    expect(r.tuning?.shiftPct).toBeCloseTo(0, 9);
    expect(r.tuning?.capacitorVoltageV).toBeCloseTo(430.1, 1);
    expect(r.tuning?.nearestHarmonic).toBe(5);
    expect(r.tuning?.distancePct).toBeCloseTo(((250 - 188.982) / 250) * 100, 2);
    expect(r.reasons).toEqual([]);
  });

  it('20 % capacitance loss: tuning 211.3 Hz (+11.8 %, flagged), output k(1 − p)/(1 − kp)', () => {
    // [DERIVED] engineering-reference.md §4: 20 % loss → 211.3 Hz; Q'/Q = k·(1 − p)/(1 − k·p); [COMMON] flag > 5 % above design
    const r = evaluateStep({ networkVoltageV: 400, networkFrequencyHz: 50, capacitors: [{ nameplate: CAP, measuredUF: legs(0.8) }], detuning: { designFactor: 0.07 } });
    expect(r.tuning?.tuningHz).toBeCloseTo(211.3, 1);
    expect(r.tuning?.shiftHz).toBeCloseTo(211.289 - 188.982, 2);
    expect(r.tuning?.tuningShifted).toBe(true);
    expect(r.tuning?.nearHarmonic).toBe(false); // 15.5 % from 250 Hz
    expect(r.effectiveKvar / r.installedKvar).toBeCloseTo((0.8 * 0.93) / (1 - 0.8 * 0.07), 12);
    expect(r.capacitanceRatio).toBeCloseTo(0.8, 12);
    expect(r.reasons.some((s) => s.includes('above design'))).toBe(true);
  });

  it('10 % loss: 199.2 Hz, shift 5.4 % → flagged', () => {
    // [DERIVED] engineering-reference.md §4: 10 % loss → 199.2 Hz; (1/√0.9 − 1) = 5.41 % > 5 % [COMMON]
    const r = evaluateStep({ networkVoltageV: 400, networkFrequencyHz: 50, capacitors: [{ nameplate: CAP, measuredUF: legs(0.9) }], detuning: { designFactor: 0.07 } });
    expect(r.tuning?.tuningHz).toBeCloseTo(199.2, 1);
    expect(r.tuning?.shiftPct).toBeCloseTo((1 / Math.sqrt(0.9) - 1) * 100, 9);
    expect(r.tuning?.tuningShifted).toBe(true);
  });

  it('a step that lost 43 % is tuned onto the 5th', () => {
    // [DERIVED] §4: f_r = 189/√0.57 = 250.3 Hz; [COMMON] within 10 % of a characteristic harmonic, at/above the blocked 5th
    const r = evaluateStep({ networkVoltageV: 400, networkFrequencyHz: 50, capacitors: [{ nameplate: CAP, measuredUF: legs(0.57) }], detuning: { designFactor: 0.07 } });
    expect(r.tuning?.tuningHz).toBeCloseTo(250.3, 1);
    expect(r.tuning?.nearHarmonic).toBe(true);
    expect(r.tuning?.aboveLowestHarmonic).toBe(true);
    expect(r.reasons[0]).toMatch(/at or above the 5th harmonic \(250 Hz\)/);
  });

  it('14 % bank: the 3rd harmonic counts', () => {
    // [COMMON] §4: 14 % (133.6 Hz) where a 3rd is present; 3 % loss → 135.7 Hz, 9.5 % from 150 Hz → flagged (within 10 %)
    const r = evaluateStep({ networkVoltageV: 400, networkFrequencyHz: 50, capacitors: [{ nameplate: CAP, measuredUF: legs(0.97) }], detuning: { designFactor: 0.14 } });
    expect(r.tuning?.designTuningHz).toBeCloseTo(133.6, 1);
    expect(r.tuning?.nearestHarmonic).toBe(3);
    expect(r.tuning?.distancePct).toBeCloseTo(((150 - 50 / Math.sqrt(0.14 * 0.97)) / 150) * 100, 9);
    expect(r.tuning?.nearHarmonic).toBe(true);
  });

  it('property: with the reactor recorded, effective kvar equals √3·U·I of the mathjs nodal model', () => {
    // [DERIVED] engineering-reference.md §2(c): in a detuned step √3·U·I is the step's effective kvar (balanced).
    fc.assert(
      fc.property(fc.double({ min: 0.6, max: 1.05, noNaN: true }), fc.double({ min: 0.05, max: 0.14, noNaN: true }), (k, p) => {
        const lMH = (p / (W50 * W50 * 3 * C_CAP * 1e-6)) * 1e3;
        const r = evaluateStep({
          networkVoltageV: 400,
          networkFrequencyHz: 50,
          capacitors: [{ nameplate: CAP, measuredUF: legs(k) }],
          detuning: { designFactor: p, reactorInductanceMH: lMH },
        });
        const i = detunedDeltaLineCurrentsPhasor(legs(k), lMH, 400, 50);
        expect(relDiff(r.effectiveKvar, (Math.sqrt(3) * 400 * (i[0] as number)) / 1000)).toBeLessThan(1e-9);
        expect(relDiff(r.tuning?.actualFactor as number, k * p)).toBeLessThan(1e-12);
        expect(relDiff(r.tuning?.asBuiltFactor as number, p)).toBeLessThan(1e-12);
      }),
      { numRuns: 100 },
    );
  });

  it('step current check: more than 15 % from expected is flagged', () => {
    // [COMMON] engineering-reference.md §3 (common practice): step current more than 15 % from expected: investigate
    const base = { networkVoltageV: 400, networkFrequencyHz: 50, capacitors: [{ nameplate: CAP }], detuning: { designFactor: 0.07 } };
    const expectedA = (((28.2 * (400 / 440) ** 2) / 0.93) * 1000) / (Math.sqrt(3) * 400);
    const ok = evaluateStep({ ...base, lineCurrentsA: [expectedA * 0.9, expectedA * 0.9, expectedA * 0.9] });
    expect(ok.current?.expectedA).toBeCloseTo(expectedA, 9);
    expect(ok.current?.flag).toBe(false);
    const low = evaluateStep({ ...base, lineCurrentsA: [expectedA * 0.8, expectedA * 0.8, expectedA * 0.8] });
    expect(low.current?.deviationPct).toBeCloseTo(-20, 9);
    expect(low.current?.flag).toBe(true);
  });
});

describe('evaluateStep: undetuned and bank summary', () => {
  it('two 25 kvar 400 V units, one at 95 %', () => {
    // [DERIVED] engineering-reference.md §1: Q = ω·U²·ΣC; 25 + 0.95·25 = 48.75 kvar
    const np: Nameplate = { kvar: 25, voltageV: 400, frequencyHz: 50, connection: 'delta' };
    const c = 25_000 / (3 * W50 * 400 * 400) * 1e6;
    const r = evaluateStep({
      networkVoltageV: 400,
      networkFrequencyHz: 50,
      capacitors: [{ nameplate: np }, { nameplate: np, measuredUF: [0.95 * c, 0.95 * c, 0.95 * c] }],
    });
    expect(r.nameplateKvar).toBe(50);
    expect(r.installedKvar).toBeCloseTo(50, 9);
    expect(r.effectiveKvar).toBeCloseTo(48.75, 9);
    expect(r.effectivePct).toBeCloseTo(97.5, 9);
    expect(r.tuning).toBeNull();
  });

  it('a 415 V unit on a 400 V network delivers (400/415)² of its rating', () => {
    // [DERIVED] engineering-reference.md §1: Q' = Q·(U'/U)²
    const r = evaluateStep({ networkVoltageV: 400, networkFrequencyHz: 50, capacitors: [{ nameplate: { kvar: 50, voltageV: 415, frequencyHz: 50, connection: 'star' } }] });
    expect(r.installedKvar).toBeCloseTo(50 * (400 / 415) ** 2, 9);
  });

  it('bankSummary adds the steps', () => {
    // [DERIVED] reactive powers of parallel steps add
    const s = bankSummary([
      { installedKvar: 25, effectiveKvar: 20 },
      { installedKvar: 50, effectiveKvar: 50 },
    ]);
    expect(s).toEqual({ stepCount: 2, installedKvar: 75, effectiveKvar: 70, lostKvar: 5, effectivePct: (70 / 75) * 100 });
    expect(bankSummary([]).effectivePct).toBe(100);
  });
});
