import { describe, expect, test } from 'vitest';
import { formatWait, parseDecimal } from './decimal';
import { blownFuses, liveContactorResult, liveReactorResult } from './live-component-results';
import { differsFromServer, liveCapacitorResult, methodsFor, type CapacitorValues, type UnitPlace, type WalkthroughUnit } from './live-capacitor-result';

const unit: WalkthroughUnit = {
  id: 1,
  position: 1,
  nameplateKvar: 25,
  nameplateVoltageV: 400,
  nameplateFrequencyHz: 50,
  connection: 'delta',
  capacitanceUF: 165.79,
  toleranceMinusPct: -5,
  tolerancePlusPct: 10,
  dischargeTimeS: 180,
  serial: 'S1',
  maker: '',
  model: '',
  installedOn: null,
};
const place: UnitPlace = { detuned: false, detuningFactor: null, siteFrequencyHz: 50, reactorInductanceMH: null, unitsInStep: 1 };
const values = (v: Partial<CapacitorValues>): CapacitorValues => ({
  method: 'open-pairs',
  readingsUF: [],
  elementsUF: [],
  currentsA: [],
  measuredVoltageV: undefined,
  measuredFrequencyHz: undefined,
  ...v,
});

// 25 kvar 400 V 50 Hz delta: C_Δ = Q/(3·ω·U²) = 25000/(3·2π·50·400²) = 165.79 µF per leg,
// and a balanced unit reads 1.5·C_Δ = 248.68 µF on each terminal pair with the third open.
// Source: [DERIVED] engineering-reference.md §1 and §2(a).
const cDelta = (25_000 / (3 * 2 * Math.PI * 50 * 400 ** 2)) * 1e6;

describe('the live result of a capacitor reading', () => {
  test('a balanced unit on open pairs is healthy at its nameplate', () => {
    expect(cDelta).toBeCloseTo(165.79, 2);
    const result = liveCapacitorResult(unit, place, values({ readingsUF: [248.7, 248.7, 248.7] }));
    expect(result.kind).toBe('result');
    if (result.kind !== 'result') return;
    for (const leg of result.legsUF) expect(leg).toBeCloseTo(165.8, 1);
    expect(result.kvarAtRated).toBeCloseTo(25, 1);
    expect(Math.abs(result.deviationPct)).toBeLessThan(0.1);
    expect(result.band).toBe('healthy');
  });

  test('one against two shorted: a balanced unit reads 2·C_Δ; 8 % low is watch, 12 % low is replace', () => {
    // Shorted method, balanced delta: M = 2·C_Δ [DERIVED] engineering-reference.md §2(b).
    const at = (k: number) => liveCapacitorResult(unit, place, values({ method: 'shorted', readingsUF: [2 * cDelta * k, 2 * cDelta * k, 2 * cDelta * k] }));
    expect(at(1)).toMatchObject({ kind: 'result', band: 'healthy' });
    expect(at(0.92)).toMatchObject({ kind: 'result', band: 'watch' });
    expect(at(0.88)).toMatchObject({ kind: 'result', band: 'replace' });
    expect(at(1.15)).toMatchObject({ kind: 'result', band: 'remeasure' });
  });

  test('line currents: a balanced 25 kvar unit at 400 V draws 36.08 A per line', () => {
    // I_L = Q/(√3·U) = 25000/(√3·400) = 36.08 A [DERIVED] engineering-reference.md §1.
    const current = 25_000 / (Math.sqrt(3) * 400);
    const result = liveCapacitorResult(unit, place, values({ method: 'line-currents', currentsA: [current, current, current], measuredVoltageV: 400, measuredFrequencyHz: 50 }));
    expect(result).toMatchObject({ kind: 'result', band: 'healthy' });
    if (result.kind === 'result') expect(result.kvarAtRated).toBeCloseTo(25, 6);
  });

  test('says what is missing, and why impossible values are not accepted', () => {
    expect(liveCapacitorResult(unit, place, values({ readingsUF: [248.7, undefined, 248.7] }))).toEqual({ kind: 'incomplete', missing: 'Enter the three readings.' });
    const impossible = liveCapacitorResult(unit, place, values({ method: 'shorted', readingsUF: [100, 100, 500] }));
    expect(impossible.kind).toBe('not-accepted');
    if (impossible.kind === 'not-accepted') expect(impossible.reason).toMatch(/^The readings \[100, 100, 500\] cannot come from a real unit/);
    const currents = liveCapacitorResult(unit, place, values({ method: 'line-currents', currentsA: [10, 10, 30], measuredVoltageV: 400, measuredFrequencyHz: 50 }));
    expect(currents.kind).toBe('not-accepted');
  });

  test('a bulging case makes it replace whatever the capacitance; a hot case adds its reason', () => {
    const result = liveCapacitorResult(unit, place, values({ readingsUF: [248.7, 248.7, 248.7], bulging: true, caseTemperatureC: 60 }));
    expect(result).toMatchObject({ kind: 'result', band: 'replace' });
    if (result.kind === 'result') {
      expect(result.reasons).toContain('the case is bulging: replace the unit');
      expect(result.reasons).toContain('case temperature 60 °C is above 55 °C: investigate');
    }
  });

  test('methods: single-phase per element only; a detuned step of several units not by its currents', () => {
    expect(methodsFor({ ...unit, connection: 'single-phase' }, place)).toEqual(['per-element']);
    expect(methodsFor(unit, { ...place, detuned: true, unitsInStep: 2 })).not.toContain('line-currents');
    expect(methodsFor(unit, place)).toHaveLength(4);
  });

  test("the server's result differs when its band or its deviation does", () => {
    const live = liveCapacitorResult(unit, place, values({ readingsUF: [248.7, 248.7, 248.7] }));
    if (live.kind !== 'result') throw new Error('expected a result');
    const same = { band: 'healthy' as const, deviationPct: live.deviationPct + 0.04, kvarAtRated: 25, legsUF: null, reasons: [] };
    expect(differsFromServer(live, same)).toBe(false);
    expect(differsFromServer(live, { ...same, band: 'watch' })).toBe(true);
    expect(differsFromServer(live, { ...same, deviationPct: live.deviationPct - 0.5 })).toBe(true);
  });
});

describe('the other components', () => {
  test('contactor: share of its rated operations used, flagged above 80 % (common practice)', () => {
    const contactor = { ratedOperations: 100_000, counterAtInstall: 1_000 };
    expect(liveContactorResult(51_000, contactor)).toMatchObject({ kind: 'result', operations: 50_000, usedPct: 50, flag: false });
    expect(liveContactorResult(91_000, contactor)).toMatchObject({ kind: 'result', usedPct: 90, flag: true });
    expect(liveContactorResult(undefined, contactor)).toEqual({ kind: 'incomplete' });
    const reset = liveContactorResult(500, contactor);
    expect(reset.kind).toBe('not-accepted');
    if (reset.kind === 'not-accepted') expect(reset.reason).toMatch(/^The counter must be ≥ counterAtInstall \(1000\)/);
  });

  test('reactor: each phase against the register, ± 5 %', () => {
    expect(liveReactorResult([undefined, undefined, undefined], 1.2)).toEqual({ kind: 'none' });
    expect(liveReactorResult([1.2, 1.25, undefined], 1.2)).toEqual({ kind: 'incomplete' });
    expect(liveReactorResult([1.2, 1.25, 1.18], 1.2)).toMatchObject({ kind: 'result', within: true });
    expect(liveReactorResult([1.2, 1.4, 1.18], 1.2)).toMatchObject({ kind: 'result', within: false });
  });

  test('fuses without continuity', () => {
    expect(blownFuses([true, false, false])).toEqual([2, 3]);
    expect(blownFuses([true, true, true])).toEqual([]);
  });
});

describe('typing numbers on a phone', () => {
  test('a decimal point or comma; empty is no value; words are not numbers', () => {
    expect(parseDecimal('248.7')).toBe(248.7);
    expect(parseDecimal(' 248,7 ')).toBe(248.7);
    expect(parseDecimal('')).toBeUndefined();
    expect(parseDecimal('12a')).toBeNaN();
    expect(parseDecimal('1.2.3')).toBeNaN();
  });

  test('discharge waits in minutes and seconds', () => {
    expect(formatWait(180)).toBe('3 min');
    expect(formatWait(90)).toBe('1 min 30 s');
    expect(formatWait(45)).toBe('45 s');
  });
});
