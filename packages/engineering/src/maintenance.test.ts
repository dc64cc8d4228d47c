import { describe, expect, it } from 'vitest';
import { contactorLifeUsed } from './contactor.js';
import {
  INSULATION_RESISTANCE_TABLE,
  NETA_INTERVAL_FACTORS,
  insulationResistanceMinimum,
  insulationResistanceOk,
  maintenanceIntervalMonths,
  thermographySeverity,
} from './maintenance.js';

describe('NETA MTS Appendix B interval factors', () => {
  it('table values', () => {
    // [STD] NETA MTS Appendix B, engineering-reference.md §7
    expect(NETA_INTERVAL_FACTORS).toEqual({
      low: { poor: 1.0, average: 2.0, good: 2.5 },
      medium: { poor: 0.5, average: 1.0, good: 1.5 },
      high: { poor: 0.25, average: 0.5, good: 0.75 },
    });
  });

  it('months from a base interval', () => {
    // [STD] NETA MTS Appendix B: 12 months × 0.25 (high need, poor condition) = 3 months; × 2.5 (low, good) = 30
    expect(maintenanceIntervalMonths({ baseIntervalMonths: 12, reliability: 'high', condition: 'poor' })).toBe(3);
    expect(maintenanceIntervalMonths({ baseIntervalMonths: 12, reliability: 'low', condition: 'good' })).toBe(30);
    expect(maintenanceIntervalMonths({ baseIntervalMonths: 12, reliability: 'medium', condition: 'average' })).toBe(12);
  });
});

describe('thermography severity by ΔT over ambient', () => {
  it('bands', () => {
    // [STD-summary] NETA, engineering-reference.md §7: 1–10 °C possible, 11–20 °C probable, 21–40 °C monitor, > 40 °C repair immediately
    expect(thermographySeverity(0.5).severity).toBe('none');
    expect(thermographySeverity(1).severity).toBe('possible');
    expect(thermographySeverity(10).severity).toBe('possible');
    expect(thermographySeverity(11).severity).toBe('probable');
    expect(thermographySeverity(20).severity).toBe('probable');
    expect(thermographySeverity(21).severity).toBe('monitor');
    expect(thermographySeverity(40).severity).toBe('monitor');
    expect(thermographySeverity(41).severity).toBe('immediate');
    // Between the printed whole-degree bands: the lower band holds up to its bound.
    expect(thermographySeverity(10.5).severity).toBe('probable');
  });
});

describe('insulation resistance, terminals to case', () => {
  it('ANSI/NETA MTS Table 100.1 rows', () => {
    // [STD] ANSI/NETA MTS Table 100.1, engineering-reference.md §3: 600 V → 1000 V DC, 100 MΩ; 1000 V → 1000 V, 100 MΩ;
    // 5 kV → 2500 V, 1500 MΩ; 15 kV → 2500 V, 5000 MΩ
    expect(INSULATION_RESISTANCE_TABLE.map((r) => [r.ratingV, r.testVoltageVdc, r.minimumMOhm])).toEqual([
      [600, 1000, 100],
      [1000, 1000, 100],
      [5000, 2500, 1500],
      [15000, 2500, 5000],
    ]);
    expect(insulationResistanceMinimum(400)).toEqual({ ratingV: 600, testVoltageVdc: 1000, minimumMOhm: 100 });
    expect(insulationResistanceMinimum(690)?.ratingV).toBe(1000);
    expect(insulationResistanceMinimum(4160)?.minimumMOhm).toBe(1500);
    expect(insulationResistanceMinimum(13_800)?.minimumMOhm).toBe(5000);
    expect(insulationResistanceMinimum(34_500)).toBeNull();
    expect(insulationResistanceOk({ ratedVoltageV: 400, measuredMOhm: 99 })).toBe(false);
    expect(insulationResistanceOk({ ratedVoltageV: 400, measuredMOhm: 100 })).toBe(true);
  });
});

describe('contactor life used', () => {
  it('share of rated electrical endurance', () => {
    // [COMMON] engineering-reference.md §7: endurance per datasheet, often about 10⁵ operations; flag above 80 % (common practice)
    const r = contactorLifeUsed({ counterNow: 132_000, counterAtInstall: 50_000, ratedOperations: 100_000 });
    expect(r.operations).toBe(82_000);
    expect(r.usedPct).toBeCloseTo(82, 12);
    expect(r.remainingOperations).toBe(18_000);
    expect(r.flag).toBe(true);
    expect(contactorLifeUsed({ counterNow: 130_000, counterAtInstall: 50_000, ratedOperations: 100_000 }).flag).toBe(false);
    expect(contactorLifeUsed({ counterNow: 1000, counterAtInstall: 0, ratedOperations: 100_000, flagAbovePct: 0.5 }).flag).toBe(true);
  });
});
