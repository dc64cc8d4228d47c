import { describe, expect, it } from 'vitest';
import { MAX_TERMINAL_PAIR_RATIO, OPERATING_LIMITS, TOLERANCE_PRESETS, caseTemperatureLevel, withinTolerance } from './limits.js';

describe('tolerance presets', () => {
  it('IEC 60831-1 and IEEE 18 as data', () => {
    // [STD-memory] IEC 60831-1 −5 % … +10 %, from memory
    expect(TOLERANCE_PRESETS.find((p) => p.id === 'iec-60831-1')).toMatchObject({ minPct: -5, maxPct: 10 });
    // [STD-memory] IEEE 18 (2002 and later) 0 … +10 %, from memory
    expect(TOLERANCE_PRESETS.find((p) => p.id === 'ieee-18')).toMatchObject({ minPct: 0, maxPct: 10 });
    // [STD-summary] IEEE 18-1992 100 … 115 %
    expect(TOLERANCE_PRESETS.find((p) => p.id === 'ieee-18-1992')).toMatchObject({ minPct: 0, maxPct: 15 });
    // [STD-memory] IEC 60871-1 max/min 1.08 between terminal pairs, from memory
    expect(MAX_TERMINAL_PAIR_RATIO).toBe(1.08);
  });

  it('withinTolerance', () => {
    const iec = TOLERANCE_PRESETS[0]!;
    const ieee = TOLERANCE_PRESETS[1]!;
    expect(withinTolerance({ deviationPct: -3, preset: iec })).toBe(true);
    expect(withinTolerance({ deviationPct: -3, preset: ieee })).toBe(false);
    expect(withinTolerance({ deviationPct: 10, preset: ieee })).toBe(true);
    expect(withinTolerance({ deviationPct: 10.5, preset: iec })).toBe(false);
  });
});

describe('operating limits and case temperature', () => {
  it('IEC 60831-1 and IEEE 18 levels', () => {
    // [STD-memory] IEC 60831-1 from memory: 1.10·U_N 8 h in 24 h, 1.15 30 min, 1.20 5 min, 1.30 1 min; 1.30·I_N
    expect(OPERATING_LIMITS.iec60831.voltage.map((v) => v.factor)).toEqual([1.1, 1.15, 1.2, 1.3]);
    expect(OPERATING_LIMITS.iec60831.currentFactor).toBe(1.3);
    // [STD-summary] IEEE 18: 110 % rms voltage, 120 % peak, 135 % current, 135 % kvar
    expect(OPERATING_LIMITS.ieee18).toMatchObject({ rmsVoltageFactor: 1.1, peakVoltageFactor: 1.2, currentFactor: 1.35, kvarFactor: 1.35 });
  });

  it('case temperature: investigate above 55 °C, never above 65 °C', () => {
    // [STD] a US facilities maintenance manual for capacitors, engineering-reference.md §3
    expect(caseTemperatureLevel(55)).toBe('normal');
    expect(caseTemperatureLevel(56)).toBe('investigate');
    expect(caseTemperatureLevel(65)).toBe('investigate');
    expect(caseTemperatureLevel(66)).toBe('over-limit');
  });
});
