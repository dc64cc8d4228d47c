import type { SiteHealth } from '@varden/schemas';

// Site health answers for the unit tests, shaped like GET /api/sites/:id/health. Values are
// worked by hand from engineering-reference.md; each comment gives the working.

type Bank = SiteHealth['banks'][number];
type Step = Bank['steps'][number];
type Bands = SiteHealth['bands'];

export const noBands = (): Bands => ({ healthy: 0, watch: 0, replace: 0, remeasure: 0, noReading: 0 });

export function step(values: Partial<Step> & Pick<Step, 'id' | 'number'>): Step {
  return {
    ratedKvar: 25,
    installedKvar: 25,
    effectiveKvar: 25,
    effectivePct: 100,
    bands: { ...noBands(), noReading: 1 },
    tuning: null,
    reasons: [],
    ...values,
  };
}

/**
 * A 7 % detuned step at 50 Hz [COMMON] §4: design fr = 50/√0.07 = 189.0 Hz. With capacitance
 * at k of rated, fr = 189.0/√k: k = 0.88 gives 201.5 Hz (+6.6 %), order 4.03, 19.4 % from the 5th.
 */
export function detunedTuning(k: number): NonNullable<Step['tuning']> {
  const designTuningHz = 50 / Math.sqrt(0.07);
  const tuningHz = designTuningHz / Math.sqrt(k);
  const shiftPct = 100 * (tuningHz / designTuningHz - 1);
  const distancePct = (100 * Math.abs(tuningHz - 250)) / 250;
  return {
    designTuningHz,
    tuningHz,
    shiftPct,
    nearestHarmonic: 5,
    nearestHarmonicHz: 250,
    distancePct,
    fifthHarmonicHz: 250,
    tuningShifted: shiftPct > 5,
    nearHarmonic: distancePct <= 10,
  };
}

/**
 * An undetuned bank of four 25 kvar steps on a 1000 kVA, 6 % transformer [DERIVED] §5:
 * S_sc = 1000/0.06 = 16 667 kVA, h = √(16 667/Q): 25 → 25.82, 50 → 18.26, 75 → 14.91,
 * 100 → 12.91 (0.7 % from the 13th: warning).
 */
export function undetunedBank(values: Partial<Bank> = {}): Bank {
  const ssc = 1000 / 0.06;
  const steps = [1, 2, 3, 4].map((n) => step({ id: 100 + n, number: n }));
  return {
    id: 10,
    name: 'Bank B',
    detuned: false,
    detuningFactor: null,
    installedKvar: 100,
    effectiveKvar: 100,
    steps,
    resonance: [25, 50, 75, 100].map((kvar, i) => {
      const order = Math.sqrt(ssc / kvar);
      const nearest = [5, 7, 11, 13].reduce((best, n) => (Math.abs(order - n) / n < Math.abs(order - best) / best ? n : best));
      const distancePct = (100 * Math.abs(order - nearest)) / nearest;
      return { stepNumbers: Array.from({ length: i + 1 }, (_, j) => j + 1), kvar, order, nearestHarmonic: nearest, distancePct, warning: distancePct <= 10 };
    }),
    ...values,
  };
}

/** A 7 % detuned bank of six 50 kvar steps; step 6's capacitors at `k` of rated. */
export function detunedBank(k = 1): Bank {
  const steps = [1, 2, 3, 4, 5, 6].map((n) =>
    step({
      id: 200 + n,
      number: n,
      ratedKvar: 50,
      installedKvar: 50,
      // Q'/Q = k(1 − p)/(1 − kp) [DERIVED] §4.
      effectiveKvar: n === 6 ? (50 * k * 0.93) / (1 - k * 0.07) : 50,
      tuning: detunedTuning(n === 6 ? k : 1),
    }),
  );
  const effectiveKvar = steps.reduce((sum, s) => sum + s.effectiveKvar, 0);
  return { id: 20, name: 'Bank A', detuned: true, detuningFactor: 0.07, installedKvar: 300, effectiveKvar, steps, resonance: [] };
}

/**
 * A 400 V, 50 Hz site with a planned load of 500 kW at PF 0.80 [DERIVED] §6: the load's own
 * Q = 500·tan(acos 0.8) = 375 kvar; with 100 kvar in, Q = 275 kvar and PF = 500/√(500² + 275²)
 * = 0.8762; the target 0.95 needs 500·0.421 = 210.7 kvar, 110.7 missing.
 */
export function siteHealthFixture(values: Partial<SiteHealth> = {}): SiteHealth {
  return {
    siteId: 7,
    siteName: 'Alder Quay Cold Store',
    voltageV: 400,
    frequencyHz: 50,
    targetPf: 0.95,
    installedKvar: 100,
    effectiveKvar: 100,
    lostKvar: 0,
    lostPct: 0,
    bands: { ...noBands(), noReading: 4 },
    load: { source: 'planned-load', kw: 500, loadKvar: 375, loadPf: 0.8, recordedAt: null, note: 'The load a planner entered for this site.' },
    reachedPf: 500 / Math.hypot(500, 275),
    leading: false,
    requiredKvar: 210.68,
    missingKvar: 110.68,
    targetMet: false,
    triangle: {
      asInstalled: { kw: 500, kvar: 275, kva: Math.hypot(500, 275), pf: 500 / Math.hypot(500, 275), phiDeg: (Math.atan2(275, 500) * 180) / Math.PI, leading: false },
      now: { kw: 500, kvar: 275, kva: Math.hypot(500, 275), pf: 500 / Math.hypot(500, 275), phiDeg: (Math.atan2(275, 500) * 180) / Math.PI, leading: false },
    },
    cost: {
      estimate: true,
      currency: 'EUR',
      pricePerKvarh: 0.02,
      hoursPerMonth: 500,
      basis: 'reactive energy beyond PF 0.9 is charged',
      extraKvarhPerMonth: 0,
      lostMonthlyCost: 0,
      assumptions: ['The load of 500 kW at PF 0.80 (as entered by the planner) lasts 500 hours a month.'],
    },
    banks: [undetunedBank()],
    newestReadingAt: null,
    openFlags: [],
    overdueOrders: [],
    engineeringVersion: 'test',
    ...values,
  };
}
