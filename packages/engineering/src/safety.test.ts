import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { DISCHARGE_REQUIREMENTS, dischargeTimeS, maxDischargeResistanceOhm, storedEnergyJ } from './safety.js';
import { relDiff } from '../test-support/phasor-models.js';

describe('stored energy ½·C·(√2·U)²', () => {
  it('about 53 J per leg in a 50 kvar 400 V unit', () => {
    // [DERIVED] engineering-reference.md §8: ½·C·(√2·U)² ≈ 53 J per leg (C_Δ = 331.57 µF at 400 V)
    expect(storedEnergyJ({ capacitanceUF: 331.57, voltageV: 400 })).toBeCloseTo(53, 0);
    expect(storedEnergyJ({ capacitanceUF: 331.57, voltageV: 400 })).toBeCloseTo(331.57e-6 * 400 * 400, 9);
  });
});

describe('discharge resistance R ≤ t/(C·ln(√2·U/U_R))', () => {
  it('IEC 60831-1: 331.57 µF at 400 V to 75 V in 3 min', () => {
    // [STD-summary] IEC 60831-1 from √2·U_N to ≤ 75 V within 3 min; [DERIVED] R = 180/(331.57e-6·ln(565.69/75))
    const r = maxDischargeResistanceOhm({ capacitanceUF: 331.57, voltageV: 400, seconds: 180, residualV: 75 });
    expect(r).toBeCloseTo(180 / (331.57e-6 * Math.log((Math.SQRT2 * 400) / 75)), 6);
    expect(r / 1000).toBeCloseTo(268.7, 1); // ≈ 269 kΩ: ln(565.69/75) = 2.0206, 180/(331.57e-6 × 2.0206)
    const iec = DISCHARGE_REQUIREMENTS.find((d) => d.id === 'iec-60831-1');
    expect(iec).toMatchObject({ residualV: 75, seconds: 180 });
  });

  it('property: an RC discharge through R_max ends exactly at the residual voltage after t', () => {
    // [DERIVED] u(t) = √2·U·exp(−t/(R·C)); integrate the ODE du/dt = −u/(RC) numerically (RK4) as an independent check
    fc.assert(
      fc.property(
        fc.double({ min: 10, max: 2000, noNaN: true }),
        fc.double({ min: 200, max: 1000, noNaN: true }),
        fc.double({ min: 10, max: 600, noNaN: true }),
        fc.double({ min: 10, max: 100, noNaN: true }),
        (cUF, u, t, ur) => {
          const r = maxDischargeResistanceOhm({ capacitanceUF: cUF, voltageV: u, seconds: t, residualV: ur });
          const tau = r * cUF * 1e-6;
          let v = Math.SQRT2 * u;
          const n = 2000;
          const h = t / n;
          for (let i = 0; i < n; i++) {
            const k1 = -v / tau;
            const k2 = -(v + (h / 2) * k1) / tau;
            const k3 = -(v + (h / 2) * k2) / tau;
            const k4 = -(v + h * k3) / tau;
            v += (h / 6) * (k1 + 2 * k2 + 2 * k3 + k4);
          }
          expect(relDiff(v, ur)).toBeLessThan(1e-8);
          expect(relDiff(dischargeTimeS({ resistanceOhm: r, capacitanceUF: cUF, voltageV: u, residualV: ur }), t)).toBeLessThan(1e-12);
        },
      ),
      { numRuns: 50 },
    );
  });
});
