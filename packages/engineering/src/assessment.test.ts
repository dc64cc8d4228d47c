import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { assessCapacitor, bandRank, defaultPolicy, type Band } from './assessment.js';
import { legsFromOpenPairs, openPairReadingsFromLegs } from './field-methods.js';
import { legsFromStarPhases } from './rating.js';
import type { Nameplate, Triple } from './types.js';

const NP: Nameplate = { kvar: 50, voltageV: 400, frequencyHz: 50, connection: 'delta' };
// Rated leg written out from the formula, not from the package: C_Δ = Q/(3ωU²). [DERIVED] engineering-reference.md §1
const C = 50_000 / (3 * 2 * Math.PI * 50 * 400 * 400) * 1e6;
const CY = 3 * C;

const legsAt = (k0: number, k1: number, k2: number): Triple => [C * k0, C * k1, C * k2];

describe('assessCapacitor: values', () => {
  it('a unit exactly at nameplate', () => {
    // [DERIVED] engineering-reference.md §1: 3 × 331.57 µF → 50 kvar
    const r = assessCapacitor({ nameplate: NP, measuredUF: legsAt(1, 1, 1) });
    expect(r.kvarAtRated).toBeCloseTo(50, 9);
    expect(r.deviationPct).toBeCloseTo(0, 9);
    expect(r.unbalanceRatio).toBeCloseTo(1, 12);
    expect(r.band).toBe('healthy');
    expect(r.reasons).toHaveLength(1);
  });

  it('deviationPct is the total output against nameplate kvar', () => {
    // [DERIVED] §1: Q = ω·U²·ΣC; legs at 96 %, 97 %, 98 % → total 97 % → −3 %
    const r = assessCapacitor({ nameplate: NP, measuredUF: legsAt(0.96, 0.97, 0.98) });
    expect(r.deviationPct).toBeCloseTo(-3, 9);
    expect(r.kvarAtRated).toBeCloseTo(48.5, 9);
    expect(r.legDeviationsPct.map((d) => Math.round(d * 1e6) / 1e6)).toEqual([-4, -3, -2]);
    expect(r.unbalanceRatio).toBeCloseTo(0.98 / 0.96, 12);
    expect(r.band).toBe('healthy');
  });

  it('the total drives the band: 12.3 % below nameplate → replace, reason in words', () => {
    // [COMMON] engineering-reference.md §3 (common practice): replace when more than 10 % below
    const r = assessCapacitor({ nameplate: NP, measuredUF: legsAt(0.877, 0.877, 0.877) });
    expect(r.band).toBe('replace');
    expect(r.reasons).toContain('total output 12.3 % below nameplate (replace below −10 %)');
    expect(r.reasons).toContain('leg 1-2 12.3 % below nameplate (replace below −10 %)');
  });

  it('one leg 7 % down → watch', () => {
    // [COMMON] §3 (common practice): watch when a leg is more than 5 % below
    const r = assessCapacitor({ nameplate: NP, measuredUF: legsAt(1, 0.93, 1) });
    expect(r.band).toBe('watch');
    expect(r.reasons).toContain('leg 2-3 7.0 % below nameplate (watch below −5 %)');
  });

  it('unbalance alone → watch (max/min 1.09 > 1.08)', () => {
    // [STD-memory] IEC 60871-1 ratio 1.08 between terminal pairs, from memory; [COMMON] §3 unbalance rule (common practice)
    const r = assessCapacitor({ nameplate: NP, measuredUF: legsAt(1.04, 0.955, 1.0) });
    expect(r.unbalanceRatio).toBeCloseTo(1.04 / 0.955, 12);
    expect(r.band).toBe('watch');
    expect(r.reasons.some((s) => s.startsWith('legs unbalanced: max/min 1.089 (watch above 1.08)'))).toBe(true);
  });

  it('a leg more than 5 % from the mean → watch even with max/min ≤ 1.08', () => {
    // [COMMON] §3 (common practice): a leg deviating from the mean by more than 5 %
    const policy = { maxUnbalanceRatio: 1.2 };
    const r = assessCapacitor({ nameplate: NP, measuredUF: legsAt(1.07, 0.98, 0.98), policy });
    // mean = 1.01; 1.07/1.01 − 1 = 5.94 %
    expect(r.band).toBe('watch');
    expect(r.reasons).toContain('leg 1-2 5.9 % above the mean of the legs (watch beyond ±5 %)');
  });

  it('more than 10 % above → remeasure, which takes precedence over replace', () => {
    // [COMMON] §3 (common practice): > 10 % above means a wrong nameplate, method or meter
    const r = assessCapacitor({ nameplate: NP, measuredUF: legsAt(1.15, 0.85, 1) });
    expect(r.band).toBe('remeasure');
    expect(r.reasons[0]).toMatch(/^leg 1-2 15\.0 % above nameplate \(re-measure above \+10 %\)/);
    expect(r.reasons).toContain('leg 2-3 15.0 % below nameplate (replace below −10 %)');
    const t = assessCapacitor({ nameplate: NP, measuredUF: legsAt(1.11, 1.11, 1.11) });
    expect(t.band).toBe('remeasure');
  });

  it('values exactly on a limit pass', () => {
    // [COMMON] §3: "more than 5 % below" — exactly 5 % below is not more
    expect(assessCapacitor({ nameplate: NP, measuredUF: legsAt(0.95, 0.95, 0.95) }).band).toBe('healthy');
    expect(assessCapacitor({ nameplate: NP, measuredUF: legsAt(0.9, 0.9, 0.9) }).band).toBe('watch');
    expect(assessCapacitor({ nameplate: NP, measuredUF: legsAt(1.1, 1.1, 1.1) }).band).toBe('healthy');
  });

  it('star unit: a 10 % loss in one phase is seen in full on that phase', () => {
    // [DERIVED] engineering-reference.md §1: star phases from legs; the legs of a star with C1 = 0.9·C_Y read −6.9/+3.4/−6.9 %
    const np: Nameplate = { ...NP, connection: 'star' };
    const legs = legsFromStarPhases([0.89 * CY, CY, CY]);
    const r = assessCapacitor({ nameplate: np, measuredUF: legs });
    expect(r.legDeviationsPct[0]).toBeCloseTo(-11, 9);
    expect(r.legDeviationsPct[1]).toBeCloseTo(0, 9);
    expect(r.band).toBe('replace');
    expect(r.reasons).toContain('phase 1 11.0 % below nameplate (replace below −10 %)');
    // Total: Q = ω·U²·ΣC_leg of the equivalent delta. [DERIVED] §1: ΣC_leg = (C1C2 + C2C3 + C3C1)/ΣC_i
    const sumLegs = ((0.89 + 1 + 0.89) * CY * CY) / (2.89 * CY);
    expect(r.kvarAtRated).toBeCloseTo(2 * Math.PI * 50 * 400 * 400 * sumLegs * 1e-9, 9);
  });

  it('single-phase unit', () => {
    // [DERIVED] §1: single element C = Q/(ωU²); 10 kvar 230 V 50 Hz
    const np: Nameplate = { kvar: 10, voltageV: 230, frequencyHz: 50, connection: 'single-phase' };
    const c = 10_000 / (2 * Math.PI * 50 * 230 * 230) * 1e6;
    const r = assessCapacitor({ nameplate: np, measuredUF: [0.92 * c] });
    expect(r.deviationPct).toBeCloseTo(-8, 9);
    expect(r.legDeviationsPct).toHaveLength(1);
    expect(r.unbalanceRatio).toBe(1);
    expect(r.band).toBe('watch');
    expect(r.reasons).toEqual(['output 8.0 % below nameplate (watch below −5 %)']);
  });

  it('policy overrides (e.g. an IEEE-style 0 % watch limit)', () => {
    const r = assessCapacitor({ nameplate: NP, measuredUF: legsAt(0.98, 0.98, 0.98), policy: { watchBelowPct: 0 } });
    expect(r.band).toBe('watch');
    expect(r.reasons).toContain('total output 2.0 % below nameplate (watch below 0 %)');
    expect(defaultPolicy).toEqual({ watchBelowPct: -5, replaceBelowPct: -10, remeasureAbovePct: 10, maxUnbalanceRatio: 1.08, maxLegFromMeanPct: 5 });
  });

  it('pipeline: 10 % loss in one leg of a delta, measured by open pairs, is caught although the readings drop ≤ 6.7 %', () => {
    // [DERIVED] engineering-reference.md §2(a): apply thresholds to back-calculated legs, never to raw readings
    const readings = openPairReadingsFromLegs(legsAt(0.89, 1, 1));
    for (const m of readings) expect(m / (1.5 * C)).toBeGreaterThan(0.925);
    const r = assessCapacitor({ nameplate: NP, measuredUF: legsFromOpenPairs(readings) });
    expect(r.band).toBe('replace');
  });
});

describe('assessCapacitor: reason texts', () => {
  it('property: the cached sentences of the default policy read exactly like freshly built ones', () => {
    // A copy of the default policy is not the default object, so its sentences are built each time.
    const copy = { ...defaultPolicy };
    const f = fc.double({ min: 0.5, max: 1.5, noNaN: true });
    fc.assert(
      fc.property(fc.constantFrom<'delta' | 'star' | 'single-phase'>('delta', 'star', 'single-phase'), fc.tuple(f, f, f), (conn, k) => {
        const np: Nameplate = { ...NP, connection: conn };
        const measuredUF = conn === 'single-phase' ? [k[0] * CY] : k.map((x) => x * C);
        const a = assessCapacitor({ nameplate: np, measuredUF });
        const b = assessCapacitor({ nameplate: np, measuredUF, policy: copy });
        expect(a.reasons).toEqual(b.reasons);
        expect(a.band).toBe(b.band);
      }),
      { numRuns: 500 },
    );
  });
});

describe('assessCapacitor: bands are monotone in loss (more loss never gives a healthier band)', () => {
  const rank = (b: Band): number => bandRank(b);
  const connection = fc.constantFrom<'delta' | 'star'>('delta', 'star');
  const elementsFor = (conn: 'delta' | 'star', e: Triple): Triple => (conn === 'delta' ? e : legsFromStarPhases(e));
  const rated = (conn: 'delta' | 'star'): number => (conn === 'delta' ? C : CY);
  const assess = (conn: 'delta' | 'star', factors: Triple): Band =>
    assessCapacitor({ nameplate: { ...NP, connection: conn }, measuredUF: elementsFor(conn, factors.map((f) => f * rated(conn)) as Triple) }).band;
  const factor = fc.double({ min: 0.85, max: 1.15, noNaN: true });
  const loss = fc.double({ min: 0, max: 0.5, noNaN: true });

  it('uniform loss of all elements', () => {
    fc.assert(
      fc.property(connection, fc.tuple(factor, factor, factor), loss, loss, (conn, start, l1, l2) => {
        const [small, big] = l1 <= l2 ? [l1, l2] : [l2, l1];
        const b1 = assess(conn, start.map((f) => f * (1 - small)) as Triple);
        const b2 = assess(conn, start.map((f) => f * (1 - big)) as Triple);
        if (b1 === 'remeasure') return; // an untrusted reading is not a health level
        expect(b2).not.toBe('remeasure');
        expect(rank(b2)).toBeGreaterThanOrEqual(rank(b1));
      }),
      { numRuns: 500 },
    );
  });

  it('loss of one element from a balanced start', () => {
    fc.assert(
      fc.property(connection, fc.double({ min: 0.85, max: 1.12, noNaN: true }), fc.integer({ min: 0, max: 2 }), loss, loss, (conn, level, i, l1, l2) => {
        const [small, big] = l1 <= l2 ? [l1, l2] : [l2, l1];
        const at = (l: number): Triple => [0, 1, 2].map((j) => (j === i ? level * (1 - l) : level)) as Triple;
        const b1 = assess(conn, at(small));
        const b2 = assess(conn, at(big));
        if (b1 === 'remeasure') return;
        expect(b2).not.toBe('remeasure');
        expect(rank(b2)).toBeGreaterThanOrEqual(rank(b1));
      }),
      { numRuns: 500 },
    );
  });

  it('further loss of the weakest element from any start', () => {
    fc.assert(
      fc.property(connection, fc.tuple(factor, factor, factor), loss, (conn, start, l) => {
        const i = start.indexOf(Math.min(...start));
        const after = start.map((f, j) => (j === i ? f * (1 - l) : f)) as Triple;
        const b1 = assess(conn, start);
        const b2 = assess(conn, after);
        if (b1 === 'remeasure') return;
        expect(b2).not.toBe('remeasure');
        expect(rank(b2)).toBeGreaterThanOrEqual(rank(b1));
      }),
      { numRuns: 500 },
    );
  });

  it('single-phase: monotone in loss', () => {
    const np: Nameplate = { kvar: 10, voltageV: 230, frequencyHz: 50, connection: 'single-phase' };
    const c = 10_000 / (2 * Math.PI * 50 * 230 * 230) * 1e6;
    fc.assert(
      fc.property(fc.double({ min: 0.5, max: 1.2, noNaN: true }), fc.double({ min: 0.5, max: 1.2, noNaN: true }), (x, y) => {
        const [lo, hi] = x <= y ? [x, y] : [y, x];
        const bHi = assessCapacitor({ nameplate: np, measuredUF: [hi * c] }).band;
        const bLo = assessCapacitor({ nameplate: np, measuredUF: [lo * c] }).band;
        if (bHi === 'remeasure') return;
        expect(rank(bLo)).toBeGreaterThanOrEqual(rank(bHi));
      }),
    );
  });
});
