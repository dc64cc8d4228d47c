import { describe, expect, it } from 'vitest';
import * as E from './index.js';
import type { Nameplate, Triple } from './index.js';

const NP: Nameplate = { kvar: 50, voltageV: 400, frequencyHz: 50, connection: 'delta' };
const T = (a: number, b: number, c: number): Triple => [a, b, c];

// Each case: a call that must throw RangeError, and the message it must carry (names the parameter and the problem).
const cases: Array<[string, () => unknown, RegExp]> = [
  // non-finite numbers
  ['NaN reading', () => E.legsFromOpenPairs(T(1, NaN, 1)), /^legsFromOpenPairs: readingsUF\[1\] must be a finite number > 0, got NaN$/],
  ['Infinity reading', () => E.legsFromShortedPairs(T(1, 1, Infinity)), /^legsFromShortedPairs: readingsUF\[2\] must be a finite number > 0, got Infinity$/],
  ['NaN voltage', () => E.kvarFromLegs({ legsUF: T(1, 1, 1), voltageV: NaN, frequencyHz: 50 }), /^kvarFromLegs: voltageV must be a finite number > 0, got NaN$/],
  ['string as a number', () => E.kvarFromElement({ capacitanceUF: '10' as unknown as number, voltageV: 400, frequencyHz: 50 }), /^kvarFromElement: capacitanceUF must be a finite number > 0, got "10"$/],
  ['drift deviation NaN', () => E.projectDrift({ points: [{ date: '2024-01-01', deviationPct: NaN }], replaceBelowPct: -10 }), /^projectDrift: points\[0\]\.deviationPct must be a finite number, got NaN$/],
  ['drift limit NaN', () => E.projectDrift({ points: [], replaceBelowPct: NaN }), /^projectDrift: replaceBelowPct must be a finite number, got NaN$/],
  // non-positive physical quantities
  ['negative reading', () => E.legsFromOpenPairs(T(1, -3, 1)), /^legsFromOpenPairs: readingsUF\[1\] must be a finite number > 0, got -3$/],
  ['zero current', () => E.legsFromLineCurrents({ currentsA: T(0, 1, 1), voltageV: 400, frequencyHz: 50 }), /^legsFromLineCurrents: currentsA\[0\] must be a finite number > 0, got 0$/],
  ['negative reactor', () => E.legsFromLineCurrents({ currentsA: T(1, 1, 1), voltageV: 400, frequencyHz: 50, reactorInductanceMH: -1 }), /^legsFromLineCurrents: reactorInductanceMH must be a finite number ≥ 0, got -1$/],
  ['zero kvar nameplate', () => E.ratedCapacitanceUF({ ...NP, kvar: 0 }), /^ratedCapacitanceUF: nameplate\.kvar must be a finite number > 0, got 0$/],
  ['bad connection', () => E.ratedCapacitanceUF({ ...NP, connection: 'wye' as never }), /^ratedCapacitanceUF: nameplate\.connection must be one of 'delta', 'star', 'single-phase', got "wye"$/],
  ['zero frequency', () => E.rescaleKvar({ kvar: 1, fromVoltageV: 400, fromFrequencyHz: 0, toVoltageV: 400, toFrequencyHz: 50 }), /^rescaleKvar: fromFrequencyHz must be a finite number > 0, got 0$/],
  ['negative star leg', () => E.starPhasesFromLegs(T(1, 1, -1)), /^starPhasesFromLegs: legsUF\[2\] must be a finite number > 0, got -1$/],
  ['zero inductance', () => E.detuningFactor({ inductanceMH: 0, legsUF: T(1, 1, 1), frequencyHz: 50 }), /^detuningFactor: inductanceMH must be a finite number > 0, got 0$/],
  ['zero transformer', () => E.resonanceOrder({ transformerKva: 0, impedancePct: 6, kvar: 100 }), /^resonanceOrder: transformerKva must be a finite number > 0, got 0$/],
  ['negative utility S_sc', () => E.resonanceOrder({ transformerKva: 1000, impedancePct: 6, kvar: 100, utilityShortCircuitKva: -5 }), /^resonanceOrder: utilityShortCircuitKva must be a finite number > 0, got -5$/],
  ['zero bank kvar', () => E.resonanceOrder({ transformerKva: 1000, impedancePct: 6, kvar: 0 }), /^resonanceOrder: kvar must be a finite number > 0, got 0$/],
  ['zero seconds', () => E.maxDischargeResistanceOhm({ capacitanceUF: 100, voltageV: 400, seconds: 0, residualV: 75 }), /^maxDischargeResistanceOhm: seconds must be a finite number > 0, got 0$/],
  ['residual above peak', () => E.maxDischargeResistanceOhm({ capacitanceUF: 100, voltageV: 400, seconds: 60, residualV: 600 }), /^maxDischargeResistanceOhm: residualV must be below the peak voltage √2·voltageV = 565\.7 V, got 600$/],
  ['zero kW', () => E.correctionKvar({ kw: 0, pfFrom: 0.8, pfTo: 0.95 }), /^correctionKvar: kw must be a finite number > 0, got 0$/],
  ['negative stored-energy voltage', () => E.storedEnergyJ({ capacitanceUF: 100, voltageV: -400 }), /^storedEnergyJ: voltageV must be a finite number > 0, got -400$/],
  // power factor outside (0, 1]
  ['PF above 1', () => E.correctionKvar({ kw: 100, pfFrom: 1.2, pfTo: 0.95 }), /^correctionKvar: pfFrom must be a power factor in \(0, 1\], got 1\.2$/],
  ['PF zero', () => E.correctionKvar({ kw: 100, pfFrom: 0.8, pfTo: 0 }), /^correctionKvar: pfTo must be a power factor in \(0, 1\], got 0$/],
  ['site PF target', () => E.evaluateSite({ kw: 100, loadPf: 0.8, correctionKvar: 0, pfTarget: -0.9 }), /^evaluateSite: pfTarget must be a power factor in \(0, 1\], got -0\.9$/],
  // detuning factor outside (0, 0.5)
  ['p = 0', () => E.tuningFrequencyHz({ detuningFactor: 0, frequencyHz: 50 }), /^tuningFrequencyHz: detuningFactor must be a detuning factor in \(0, 0\.5\), got 0$/],
  ['p = 7 (percent by mistake)', () => E.capacitorVoltageV({ networkVoltageV: 400, detuningFactor: 7 }), /^capacitorVoltageV: detuningFactor must be a detuning factor in \(0, 0\.5\), got 7$/],
  ['p = 0.5', () => E.detunedStepKvar({ capacitorKvar: 28, capacitorVoltageV: 440, networkVoltageV: 400, detuningFactor: 0.5 }), /^detunedStepKvar: detuningFactor must be a detuning factor in \(0, 0\.5\), got 0\.5$/],
  ['step design p', () => E.evaluateStep({ networkVoltageV: 400, networkFrequencyHz: 50, capacitors: [{ nameplate: NP }], detuning: { designFactor: 0.6 } }), /^evaluateStep: detuning\.designFactor must be a detuning factor in \(0, 0\.5\), got 0\.6$/],
  ['step reactor in µH instead of mH', () => E.evaluateStep({ networkVoltageV: 400, networkFrequencyHz: 50, capacitors: [{ nameplate: NP }], detuning: { designFactor: 0.07, reactorInductanceMH: 2000 } }), /^evaluateStep: detuning\.reactorInductanceMH 2000 mH .* outside \(0, 0\.5\): check the units/],
  // readings no real unit can produce
  ['open pairs infeasible', () => E.legsFromOpenPairs(T(40, 100, 100)), /^legsFromOpenPairs: readingsUF \[40, 100, 100\] cannot come from a real unit: back-calculated leg C12 = -\d+(\.\d+)? µF is not positive$/],
  ['shorted infeasible', () => E.legsFromShortedPairs(T(300, 100, 100)), /^legsFromShortedPairs: readingsUF \[300, 100, 100\] cannot come from a real unit: back-calculated leg C23 = -50 µF is not positive$/],
  ['line currents no triangle', () => E.legsFromLineCurrents({ currentsA: T(1, 1, 3), voltageV: 400, frequencyHz: 50 }), /^legsFromLineCurrents: currentsA \[1, 1, 3\] cannot come from a real unit/],
  ['line currents angle > 120°', () => E.legsFromLineCurrents({ currentsA: T(10, 10, 19), voltageV: 400, frequencyHz: 50 }), /^legsFromLineCurrents: currentsA \[10, 10, 19\] cannot come from a real unit: back-calculated leg/],
  // wrong-length arrays
  ['measuredUF too short for delta', () => E.assessCapacitor({ nameplate: NP, measuredUF: [331, 331] }), /^assessCapacitor: measuredUF must hold 3 values \(delta-equivalent legs in terminal order 1-2, 2-3, 3-1\), got an array of length 2$/],
  ['measuredUF too long for single-phase', () => E.assessCapacitor({ nameplate: { ...NP, connection: 'single-phase' }, measuredUF: [1, 2, 3] }), /^assessCapacitor: measuredUF must hold 1 value \(the element\), got an array of length 3$/],
  ['measuredUF not an array', () => E.assessCapacitor({ nameplate: NP, measuredUF: 331 as unknown as number[] }), /^assessCapacitor: measuredUF must hold 3 values .*, got 331$/],
  ['readings of length 2', () => E.legsFromOpenPairs([1, 2] as unknown as Triple), /^legsFromOpenPairs: readingsUF must hold 3 values \(terminal order 1-2, 2-3, 3-1\), got an array of length 2$/],
  ['measuredUF negative leg', () => E.assessCapacitor({ nameplate: NP, measuredUF: [331, -1, 331] }), /^assessCapacitor: measuredUF\[1\] must be a finite number > 0, got -1$/],
  // other checks
  ['policy order', () => E.assessCapacitor({ nameplate: NP, measuredUF: [331, 331, 331], policy: { replaceBelowPct: -3 } }), /^assessCapacitor: policy\.replaceBelowPct must be ≤ policy\.watchBelowPct \(-5\), got -3$/],
  ['policy ratio', () => E.assessCapacitor({ nameplate: NP, measuredUF: [331, 331, 331], policy: { maxUnbalanceRatio: 0.9 } }), /^assessCapacitor: policy\.maxUnbalanceRatio must be ≥ 1, got 0\.9$/],
  ['bad date', () => E.projectDrift({ points: [{ date: 'last spring', deviationPct: -1 }], replaceBelowPct: -10 }), /^projectDrift: points\[0\]\.date must be an ISO 8601 date, got "last spring"$/],
  ['counter reset', () => E.contactorLifeUsed({ counterNow: 10, counterAtInstall: 500, ratedOperations: 100_000 }), /^contactorLifeUsed: counterNow must be ≥ counterAtInstall \(500\); was the counter reset or the contactor replaced\?, got 10$/],
  ['NETA reliability', () => E.maintenanceIntervalMonths({ baseIntervalMonths: 12, reliability: 'extreme' as never, condition: 'good' }), /^maintenanceIntervalMonths: reliability must be one of 'low', 'medium', 'high', got "extreme"$/],
  ['thermography NaN', () => E.thermographySeverity(NaN), /^thermographySeverity: deltaTC must be a finite number, got NaN$/],
  ['site load missing', () => E.evaluateSite({ kw: 100, correctionKvar: 0 }), /^evaluateSite: loadKvar or loadPf must be given, got undefined$/],
  ['tariff limit missing', () => E.reactiveEnergyCharge({ kw: 100, kvar: 50, hoursPerMonth: 600, pricePerKvarh: 0.02 }), /^reactiveEnergyCharge: tanPhiLimit or pfLimit must be given, got undefined$/],
  ['bank step kvar', () => E.bankResonance({ transformerKva: 1000, impedancePct: 6, stepsKvar: [50, 0] }), /^bankResonance: stepsKvar\[1\] must be a finite number > 0, got 0$/],
  ['step nameplate', () => E.evaluateStep({ networkVoltageV: 400, networkFrequencyHz: 50, capacitors: [{ nameplate: { ...NP, voltageV: -1 } }] }), /^evaluateStep: capacitors\[0\]\.nameplate\.voltageV must be a finite number > 0, got -1$/],
  ['step with no capacitors', () => E.evaluateStep({ networkVoltageV: 400, networkFrequencyHz: 50, capacitors: [] }), /^evaluateStep: capacitors must be a non-empty array, got an array of length 0$/],
];

describe('bad input throws RangeError naming the parameter and the problem', () => {
  it.each(cases)('%s', (_label, call, message) => {
    expect(call).toThrow(RangeError);
    expect(call).toThrow(message);
  });
});
