import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  kvarFromElement,
  kvarFromLegs,
  kvarFromStarPhases,
  legsFromStarPhases,
  ratedCapacitanceUF,
  ratedCurrentA,
  ratedLegUF,
  rescaleKvar,
  starPhasesFromLegs,
} from './rating.js';
import type { Triple } from './types.js';
import { relDiff, starKvarPhasor } from '../test-support/phasor-models.js';

const legUF = fc.double({ min: 1, max: 5000, noNaN: true });
const triple = fc.tuple(legUF, legUF, legUF) as fc.Arbitrary<Triple>;

describe('rated capacitance and current', () => {
  it('50 kvar 400 V 50 Hz', () => {
    // [DERIVED] engineering-reference.md §1: 50 kvar 400 V 50 Hz → C_Δ = 331.57 µF per leg ("3 × 331.6 µF" nameplate)
    expect(ratedCapacitanceUF({ kvar: 50, voltageV: 400, frequencyHz: 50, connection: 'delta' })).toBeCloseTo(331.57, 2);
    // [DERIVED] engineering-reference.md §1: same unit built in star → C_Y = 994.72 µF
    expect(ratedCapacitanceUF({ kvar: 50, voltageV: 400, frequencyHz: 50, connection: 'star' })).toBeCloseTo(994.72, 2);
    // [DERIVED] engineering-reference.md §1: I_L = 72.17 A
    expect(ratedCurrentA({ kvar: 50, voltageV: 400, frequencyHz: 50, connection: 'delta' })).toBeCloseTo(72.17, 2);
  });

  it('25 kvar 480 V 60 Hz', () => {
    // [DERIVED] engineering-reference.md §1: 25 kvar 480 V 60 Hz → C_Δ = 95.94 µF
    expect(ratedCapacitanceUF({ kvar: 25, voltageV: 480, frequencyHz: 60, connection: 'delta' })).toBeCloseTo(95.94, 2);
  });

  it('single-phase element equals the star phase formula Q/(ωU²)', () => {
    // [DERIVED] engineering-reference.md §1: single-phase C = Q/(ωU²); 10 kvar 400 V 50 Hz = 10000/(2π·50·400²)
    const expected = 10_000 / (2 * Math.PI * 50 * 400 * 400) * 1e6;
    expect(ratedCapacitanceUF({ kvar: 10, voltageV: 400, frequencyHz: 50, connection: 'single-phase' })).toBeCloseTo(expected, 9);
    // single-phase current I = Q/U
    expect(ratedCurrentA({ kvar: 10, voltageV: 400, frequencyHz: 50, connection: 'single-phase' })).toBeCloseTo(25, 12);
  });

  it('C_Y = 3·C_Δ and the delta-equivalent leg of a star unit is C_Δ', () => {
    // [DERIVED] engineering-reference.md §1: C_Y = Q/(ωU²) = 3·C_Δ
    const d = ratedCapacitanceUF({ kvar: 37.5, voltageV: 415, frequencyHz: 50, connection: 'delta' });
    const y = ratedCapacitanceUF({ kvar: 37.5, voltageV: 415, frequencyHz: 50, connection: 'star' });
    expect(y / d).toBeCloseTo(3, 12);
    expect(ratedLegUF({ kvar: 37.5, voltageV: 415, frequencyHz: 50, connection: 'star' })).toBeCloseTo(d, 9);
  });

  it('leg current ω·C_Δ·U equals I_L/√3', () => {
    // [DERIVED] engineering-reference.md §1: delta leg current = I_L/√3 = ω·C_Δ·U
    const n = { kvar: 50, voltageV: 400, frequencyHz: 50, connection: 'delta' as const };
    const legA = 2 * Math.PI * 50 * ratedCapacitanceUF(n) * 1e-6 * 400;
    expect(legA * Math.sqrt(3)).toBeCloseTo(ratedCurrentA(n), 9);
  });
});

describe('kvar from capacitance', () => {
  it('3 × 331.57 µF at 400 V 50 Hz gives 50 kvar', () => {
    // [DERIVED] engineering-reference.md §1: Q = ω·U²·(C12 + C23 + C31), round trip of the 331.57 µF check value
    expect(kvarFromLegs({ legsUF: [331.57, 331.57, 331.57], voltageV: 400, frequencyHz: 50 })).toBeCloseTo(50, 2);
    // [DERIVED] engineering-reference.md §1: Q = ω·C·U², the star phase 994.72 µF as one element at 400 V gives 50 kvar
    expect(kvarFromElement({ capacitanceUF: 994.72, voltageV: 400, frequencyHz: 50 })).toBeCloseTo(50, 2);
  });

  it('rescale: 440 V capacitor on 400 V gives (400/440)² of its rating', () => {
    // [DERIVED] engineering-reference.md §1: Q' = Q·(U'/U)²·(f'/f)
    expect(rescaleKvar({ kvar: 50, fromVoltageV: 440, fromFrequencyHz: 50, toVoltageV: 400, toFrequencyHz: 50 })).toBeCloseTo(50 * (400 / 440) ** 2, 10);
    // 50 Hz unit at 60 Hz: × 1.2
    expect(rescaleKvar({ kvar: 50, fromVoltageV: 400, fromFrequencyHz: 50, toVoltageV: 400, toFrequencyHz: 60 })).toBeCloseTo(60, 10);
  });

  it('property: Q ∝ U²·f for fixed legs', () => {
    // [DERIVED] engineering-reference.md §1: Q' = Q·(U'/U)²·(f'/f)
    fc.assert(
      fc.property(
        triple,
        fc.double({ min: 100, max: 35_000, noNaN: true }),
        fc.double({ min: 100, max: 35_000, noNaN: true }),
        fc.double({ min: 16, max: 400, noNaN: true }),
        fc.double({ min: 16, max: 400, noNaN: true }),
        (legs, u1, u2, f1, f2) => {
          const q1 = kvarFromLegs({ legsUF: legs, voltageV: u1, frequencyHz: f1 });
          const q2 = kvarFromLegs({ legsUF: legs, voltageV: u2, frequencyHz: f2 });
          expect(relDiff(q2, q1 * (u2 / u1) ** 2 * (f2 / f1))).toBeLessThan(1e-12);
          expect(relDiff(rescaleKvar({ kvar: q1, fromVoltageV: u1, fromFrequencyHz: f1, toVoltageV: u2, toFrequencyHz: f2 }), q2)).toBeLessThan(1e-12);
        },
      ),
    );
  });
});

describe('star ↔ delta equivalence', () => {
  it('balanced: star phases 3·C_Δ', () => {
    // [DERIVED] engineering-reference.md §1: C_Y = 3·C_Δ
    const [c1, c2, c3] = starPhasesFromLegs([331.57, 331.57, 331.57]);
    expect(c1).toBeCloseTo(994.71, 2);
    expect(c2).toBeCloseTo(994.71, 2);
    expect(c3).toBeCloseTo(994.71, 2);
  });

  it('property: star phases → legs → star phases round trip', () => {
    // [DERIVED] engineering-reference.md §1: P = C12·C23 + C23·C31 + C31·C12, C1 = P/C23, C2 = P/C31, C3 = P/C12
    fc.assert(
      fc.property(triple, (phases) => {
        const back = starPhasesFromLegs(legsFromStarPhases(phases));
        for (let i = 0; i < 3; i++) expect(relDiff(back[i] as number, phases[i] as number)).toBeLessThan(1e-12);
      }),
    );
  });

  it('property: kvar of star phases (phasor model, floating star point) equals kvar of the equivalent legs', () => {
    // [DERIVED] engineering-reference.md §1: any three-terminal unit behaves as a delta of equivalent legs; Q = ω·U²·ΣC_leg.
    // Independent: star-point shift V_N = ΣY_i·V_i/ΣY_i and Q = Σ ω·C_i·|V_i − V_N|² computed with mathjs complex numbers.
    fc.assert(
      fc.property(triple, fc.double({ min: 200, max: 1000, noNaN: true }), fc.constantFrom(50, 60), (phases, u, f) => {
        const qPhasor = starKvarPhasor(phases, u, f);
        const qLegs = kvarFromLegs({ legsUF: legsFromStarPhases(phases), voltageV: u, frequencyHz: f });
        expect(relDiff(qLegs, qPhasor)).toBeLessThan(1e-9);
        expect(relDiff(kvarFromStarPhases({ phasesUF: phases, voltageV: u, frequencyHz: f }), qPhasor)).toBeLessThan(1e-9);
      }),
      { numRuns: 200 },
    );
  });

  it('a star unit from its legs: kvar of the phases equals kvar of the legs', () => {
    // [DERIVED] engineering-reference.md §1
    fc.assert(
      fc.property(triple, (legs) => {
        const phases = starPhasesFromLegs(legs);
        const a = kvarFromStarPhases({ phasesUF: phases, voltageV: 400, frequencyHz: 50 });
        const b = kvarFromLegs({ legsUF: legs, voltageV: 400, frequencyHz: 50 });
        expect(relDiff(a, b)).toBeLessThan(1e-12);
      }),
    );
  });
});
