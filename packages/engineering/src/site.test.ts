import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { correctionKvar, evaluateSite, pfFromTanPhi, powerTriangle, tanPhiFromPf } from './site.js';
import { lostCorrectionCost, reactiveEnergyCharge } from './tariff.js';

describe('correction sizing Q_c = P·(tan φ1 − tan φ2)', () => {
  it('kW multipliers', () => {
    // [STD-summary] IEEE 141 ch. 8 kW multiplier table, engineering-reference.md §6 (±0.001): 0.70→0.95 = 0.692
    expect(Math.abs(correctionKvar({ kw: 1, pfFrom: 0.7, pfTo: 0.95 }) - 0.692)).toBeLessThanOrEqual(0.001);
    // [STD-summary] IEEE 141 ch. 8: 0.80→0.95 = 0.421
    expect(Math.abs(correctionKvar({ kw: 1, pfFrom: 0.8, pfTo: 0.95 }) - 0.421)).toBeLessThanOrEqual(0.001);
    // [STD-summary] IEEE 141 ch. 8: 0.85→0.95 = 0.291
    expect(Math.abs(correctionKvar({ kw: 1, pfFrom: 0.85, pfTo: 0.95 }) - 0.291)).toBeLessThanOrEqual(0.001);
    // [STD-summary] IEEE 141 ch. 8: 0.80→1.00 = 0.750
    expect(Math.abs(correctionKvar({ kw: 1, pfFrom: 0.8, pfTo: 1 }) - 0.75)).toBeLessThanOrEqual(0.001);
  });

  it('scales with kW and is negative when already above target', () => {
    // [DERIVED] 500 kW 0.8 → 0.95: 500·(0.75 − 0.32868) kvar; 3-4-5 triangle gives tan φ1 = 0.75 exactly
    expect(correctionKvar({ kw: 500, pfFrom: 0.8, pfTo: 0.95 })).toBeCloseTo(500 * (0.75 - Math.sqrt(1 - 0.95 ** 2) / 0.95), 9);
    expect(correctionKvar({ kw: 100, pfFrom: 0.98, pfTo: 0.95 })).toBeLessThan(0);
  });

  it('property: after correction the load reaches pfTo', () => {
    // [DERIVED] power triangle: P/√(P² + (Q_load − Q_c)²) = pfTo
    fc.assert(
      fc.property(fc.double({ min: 1, max: 1e4, noNaN: true }), fc.double({ min: 0.3, max: 0.9, noNaN: true }), fc.double({ min: 0.9, max: 1, noNaN: true }), (kw, from, to) => {
        const qLoad = (kw * Math.sqrt(1 - from * from)) / from;
        const qc = correctionKvar({ kw, pfFrom: from, pfTo: to });
        expect(kw / Math.hypot(kw, qLoad - qc)).toBeCloseTo(to, 9);
      }),
    );
  });
});

describe('power triangle', () => {
  it('3-4-5: P 400 kW, Q 300 kvar', () => {
    // [DERIVED] engineering-reference.md §6: S² = P² + Q², PF = P/S, tan φ = Q/P
    const t = powerTriangle({ kw: 400, kvar: 300 });
    expect(t.kva).toBeCloseTo(500, 12);
    expect(t.powerFactor).toBeCloseTo(0.8, 12);
    expect(t.tanPhi).toBeCloseTo(0.75, 12);
    expect(t.phiDeg).toBeCloseTo((Math.acos(0.8) * 180) / Math.PI, 10); // 36.87°
    expect(t.leading).toBe(false);
    expect(powerTriangle({ kw: 400, kvar: -300 }).leading).toBe(true);
  });

  it('tan φ 0.4 ↔ cos φ 0.9285', () => {
    // [COMMON] engineering-reference.md §6 (common practice billing threshold): tan φ 0.4 ↔ cos φ 0.9285
    expect(pfFromTanPhi(0.4)).toBeCloseTo(0.9285, 4);
    expect(tanPhiFromPf(0.9285)).toBeCloseTo(0.4, 3);
  });
});

describe('evaluateSite', () => {
  it('PF reached, kvar missing to the target', () => {
    // [DERIVED] 500 kW at PF 0.8 (375 kvar) with 200 kvar effective: Q_net 175 kvar → PF 500/√(500² + 175²)
    const r = evaluateSite({ kw: 500, loadPf: 0.8, correctionKvar: 200, pfTarget: 0.95 });
    expect(r.loadKvar).toBeCloseTo(375, 9);
    expect(r.pfReached).toBeCloseTo(500 / Math.hypot(500, 175), 12);
    // [STD-summary] IEEE 141 ch. 8: required = 500 × 0.421 (±0.001 per kW)
    expect(Math.abs((r.requiredKvar as number) / 500 - 0.421)).toBeLessThanOrEqual(0.001);
    expect(r.missingKvar).toBeCloseTo((r.requiredKvar as number) - 200, 9);
    expect(r.targetMet).toBe(false);
    expect(r.overCorrected).toBe(false);
  });

  it('leading PF at light load is flagged as over-correction', () => {
    // [COMMON] engineering-reference.md §6: over-correction (leading PF at light load) is also a fault
    const r = evaluateSite({ kw: 100, loadKvar: 60, correctionKvar: 150, pfTarget: 0.95 });
    expect(r.netKvar).toBeCloseTo(-90, 12);
    expect(r.leading).toBe(true);
    expect(r.overCorrected).toBe(true);
    expect(r.targetMet).toBe(false);
    expect(r.missingKvar).toBe(0);
  });

  it('exact compensation is unity and not leading', () => {
    const r = evaluateSite({ kw: 400, loadKvar: 300, correctionKvar: 300, pfTarget: 1 });
    expect(r.pfReached).toBe(1);
    expect(r.leading).toBe(false);
    expect(r.targetMet).toBe(true);
  });
});

describe('cost of reactive energy (estimate)', () => {
  it('kvarh above the tan φ allowance times price', () => {
    // [COMMON] engineering-reference.md §6 tariff basis, hand calculation: 400 kW, 250 kvar, tan φ limit 0.4 → allowance
    // 160 kvar, billable 90 kvar × 600 h = 54 000 kvarh × 0.02 = 1080
    const c = reactiveEnergyCharge({ kw: 400, kvar: 250, hoursPerMonth: 600, pricePerKvarh: 0.02, tanPhiLimit: 0.4 });
    expect(c.allowedKvar).toBeCloseTo(160, 12);
    expect(c.billableKvarhPerMonth).toBeCloseTo(54_000, 9);
    expect(c.monthlyCost).toBeCloseTo(1080, 9);
    // A PF threshold converts to tan φ: PF 0.9285 ≈ tan φ 0.4
    const p = reactiveEnergyCharge({ kw: 400, kvar: 250, hoursPerMonth: 600, pricePerKvarh: 0.02, pfLimit: 0.9285 });
    expect(p.allowedKvar).toBeCloseTo(160, 0);
    // Under the allowance nothing is billed.
    expect(reactiveEnergyCharge({ kw: 400, kvar: 100, hoursPerMonth: 600, pricePerKvarh: 0.02, tanPhiLimit: 0.4 }).monthlyCost).toBe(0);
  });

  it('lost correction: difference between effective and installed kvar', () => {
    // Hand calculation: load 400 kW 400 kvar; installed 250 kvar → 150 kvar net, allowance 160 → 0 billed;
    // effective 200 kvar → 200 net → 40 kvar × 600 h = 24 000 kvarh × 0.02 = 480 per month
    const r = lostCorrectionCost({ kw: 400, loadKvar: 400, installedKvar: 250, effectiveKvar: 200, hoursPerMonth: 600, pricePerKvarh: 0.02, tanPhiLimit: 0.4 });
    expect(r.asInstalled.monthlyCost).toBe(0);
    expect(r.extraKvarhPerMonth).toBeCloseTo(24_000, 9);
    expect(r.lostMonthlyCost).toBeCloseTo(480, 9);
  });
});
